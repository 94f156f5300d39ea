using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Model;

public class TransferFunctionTests
{
    [Fact]
    public void FromPolynomials_RecoversFactors()
    {
        // 2(s+3)/(s^2+3s+2) = 2(s+3)/((s+1)(s+2))
        var tf = TransferFunction.FromPolynomials(Polynomial.FromDescending([2, 6]), Polynomial.FromDescending([1, 3, 2]));
        Assert.Equal(2.0, tf.Gain);
        Tolerance.SameRoots([new Complex(-3, 0)], tf.Zeros, 1e-15);
        Tolerance.SameRoots([new Complex(-1, 0), new Complex(-2, 0)], tf.Poles, 1e-15);
    }

    [Fact]
    public void DerivedPolynomials_RoundTripToFactors()
    {
        var tf = TransferFunction.FromFactors(4.5, [new Complex(-2, 1), new Complex(-2, -1)], [new Complex(0, 0), new Complex(-3, 0), new Complex(-7, 0)]);
        var back = TransferFunction.FromPolynomials(tf.Numerator, tf.Denominator);
        Tolerance.Close(tf.Gain, back.Gain, 1e-15);
        Tolerance.SameRoots(tf.Zeros, back.Zeros, 1e-14);
        Tolerance.SameRoots(tf.Poles, back.Poles, 1e-14);
    }

    [Fact]
    public void DcGain_WithIntegrator_IsInfinite()
    {
        Assert.True(double.IsPositiveInfinity(TransferFunction.FromFactors(2, [], [Complex.Zero, new Complex(-1, 0)]).DcGain));
    }

    [Fact]
    public void DcGain_Lead_IsGainTimesZeroOverPole()
    {
        // C(s) = 5 (s+2)/(s+10): C(0) = 5·2/10 = 1.
        Tolerance.Close(1.0, TransferFunction.FromFactors(5, [new Complex(-2, 0)], [new Complex(-10, 0)]).DcGain, 1e-15);
    }

    [Fact]
    public void Evaluate_WithDelay_IsExact()
    {
        var tf = TransferFunction.FromFactors(1, [], [new Complex(-1, 0)], delay: 0.5);
        var s = new Complex(-0.3, 2.0);
        Tolerance.Close(Complex.Exp(-0.5 * s) / (s + 1), tf.Evaluate(s), 1e-15);
        Tolerance.Close(Complex.Abs(tf.Evaluate(s)), tf.MagnitudeAt(s), 1e-15);
    }

    [Fact]
    public void PhaseAt_IsUnwrappedSum()
    {
        // 1/s^3 at s = j: each pole contributes −90°, sum −270° (not wrapped to +90°).
        var tf = TransferFunction.FromFactors(1, [], [Complex.Zero, Complex.Zero, Complex.Zero]);
        Tolerance.Close(-1.5 * Math.PI, tf.PhaseAt(Complex.ImaginaryOne), 1e-15);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(double.NaN)]
    public void FromFactors_BadGain_Throws(double gain)
    {
        Assert.Throws<ArgumentException>(() => TransferFunction.FromFactors(gain, [], []));
    }

    [Fact]
    public void FromFactors_NegativeDelay_Throws()
    {
        Assert.Throws<ArgumentException>(() => TransferFunction.FromFactors(1, [], [], -0.1));
    }

    [Fact]
    public void Equals_IsByValue()
    {
        var a = TransferFunction.FromFactors(2, [new Complex(-1, 0)], [new Complex(-3, 0)]);
        var b = TransferFunction.FromFactors(2, [new Complex(-1, 0)], [new Complex(-3, 0)]);
        Assert.Equal(a, b);
        Assert.Equal(a.GetHashCode(), b.GetHashCode());
    }
}
