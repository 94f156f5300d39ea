using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Model;

public class PadeApproximationTests
{
    [Fact]
    public void Coefficients_Order3_MatchPublishedFormula()
    {
        // Third-order Padé: (1 − x/2 + x²/10 − x³/120)/(1 + x/2 + x²/10 + x³/120) (common practice).
        var c = PadeApproximation.Coefficients(3);
        Tolerance.Close(1.0, c[0], 1e-15);
        Tolerance.Close(0.5, c[1], 1e-15);
        Tolerance.Close(0.1, c[2], 1e-15);
        Tolerance.Close(1.0 / 120, c[3], 1e-15);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(6)]
    public void Of_IsAllPassAndMatchesDelayAtLowFrequency(int order)
    {
        var t = 0.2;
        var pade = PadeApproximation.Of(t, order);
        var w = 0.1 / t;
        var s = new Complex(0, w);
        Tolerance.Close(1.0, pade.MagnitudeAt(s), 1e-12, what: "all-pass magnitude");
        Tolerance.Close(Complex.Exp(-s * t), pade.Evaluate(s), Math.Pow(0.1, order + 1), what: "low-frequency match");
        Assert.All(pade.Poles, p => Assert.True(p.Real < 0));
        Assert.All(pade.Zeros, z => Assert.True(z.Real > 0));
    }

    [Fact]
    public void Of_BadOrder_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => PadeApproximation.Of(0.1, 0));
    }
}
