using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Targets;

public class SecondOrderTests
{
    /// <summary>
    /// Percent overshoot against damping ratio as tabulated in many texts (common practice; e.g. the
    /// overshoot-versus-ζ curve in Ogata, Modern Control Engineering, 5th ed., section 5-3), three significant digits.
    /// </summary>
    [Theory]
    [InlineData(0.1, 72.9)]
    [InlineData(0.2, 52.7)]
    [InlineData(0.3, 37.2)]
    [InlineData(0.4, 25.4)]
    [InlineData(0.5, 16.3)]
    [InlineData(0.6, 9.48)]
    [InlineData(0.7, 4.60)]
    [InlineData(0.8, 1.52)]
    [InlineData(0.9, 0.152)]
    public void OvershootPercent_PublishedTable_Matches(double zeta, double percent)
    {
        Tolerance.Close(percent, SecondOrder.OvershootPercent(zeta), 5e-3);
    }

    [Theory]
    [InlineData(0.1)]
    [InlineData(0.35)]
    [InlineData(0.5)]
    [InlineData(0.78)]
    [InlineData(0.99)]
    public void DampingFromOvershoot_InvertsOvershoot(double zeta)
    {
        Tolerance.Close(zeta, SecondOrder.DampingFromOvershoot(SecondOrder.OvershootPercent(zeta)), 1e-12);
    }

    [Fact]
    public void DampingFromOvershoot_TenPercent_IsAbout0591()
    {
        // 10 % overshoot ↔ ζ ≈ 0.591 (common practice).
        Tolerance.Close(0.591, SecondOrder.DampingFromOvershoot(10), 1e-3);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(100.0)]
    [InlineData(-5.0)]
    [InlineData(double.NaN)]
    public void DampingFromOvershoot_OutOfRange_Throws(double percent)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => SecondOrder.DampingFromOvershoot(percent));
    }

    [Fact]
    public void SettlingTime_Bands_UseEnvelopeFactors()
    {
        Assert.Equal(2.0, SecondOrder.SettlingTime(2.0, SettlingBand.TwoPercent));
        Assert.Equal(1.5, SecondOrder.SettlingTime(2.0, SettlingBand.FivePercent));
    }

    [Fact]
    public void RiseTime_HalfDamping_MatchesClosedForm()
    {
        // ζ = 0.5: arccos ζ = π/3, so tr = (2π/3)/ωd.
        Tolerance.Close(2 * Math.PI / 3 / 3.0, SecondOrder.RiseTimeZeroToHundred(0.5, 3.0), 1e-15);
    }
}
