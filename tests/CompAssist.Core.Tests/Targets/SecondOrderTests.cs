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

    [Fact]
    public void Predict_AllButCriticallyDamped_NoPeakTimeAndNoFullRise()
    {
        // ζ = 0.9971: exp(−πζ/√(1 − ζ²)) ≈ 1e-18, far below anything visible; a "peak time" of π/ωd = 6 s
        // would describe a peak that is not there (common practice: the overshoot formula).
        var near = TargetPole.At(new System.Numerics.Complex(-6.8737, 0.52538)).Predict();
        Assert.Equal(0.0, near.OvershootPercent);
        Assert.True(double.IsPositiveInfinity(near.PeakTime));
        Assert.True(double.IsPositiveInfinity(near.RiseTimeZeroToHundred));
        Tolerance.Close(4 / 6.8737, near.SettlingTime2Percent, 1e-12);

        var half = TargetPole.FromDamping(0.5, 4).Predict();
        Tolerance.Close(16.3, half.OvershootPercent, 0, 0.05, "published table");
        Tolerance.Close(Math.PI / (4 * Math.Sqrt(0.75)), half.PeakTime, 1e-12);
    }
}
