using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Model;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Analysis;

public class PointAnalysisTests
{
    private static readonly Loop TwoPoles = Loop.Create(TransferFunction.FromFactors(1, [], [Complex.Zero, new Complex(-2, 0)]));

    [Fact]
    public void At_PointOnVerticalBranch_IsOnLocusWithKnownGain()
    {
        // K/(s(s+2)): the locus above the break-away is Re s = −1; at −1 + 2j, K = |s||s+2| = 5 (hand calculation).
        var a = PointAnalysis.At(TwoPoles, new Complex(-1, 2));
        Assert.True(a.OnLocus);
        Tolerance.Close(5.0, a.Gain, 1e-14);
    }

    [Fact]
    public void At_PointOffLocus_ReportsDeficiency()
    {
        // 1/(s(s+2)) at −2 + 2√3 j: angles 120° + 90° = 210°, so ∠L = −210° and the lead deficiency is 30°.
        var a = PointAnalysis.At(TwoPoles, new Complex(-2, 2 * Math.Sqrt(3)));
        Assert.False(a.OnLocus);
        Tolerance.Close(-210.0, a.AngleSumDegrees, 1e-12);
        Tolerance.Close(30.0, a.AngleDeficiencyDegrees, 1e-12);
    }

    [Fact]
    public void At_PositiveFeedback_UsesZeroDegreeCondition()
    {
        // 1/(s(s+2)) with positive feedback: the right real axis beyond the origin is on the 0° locus.
        var loop = Loop.Create(TwoPoles.Plant, sign: FeedbackSign.Positive);
        var a = PointAnalysis.At(loop, new Complex(1, 0));
        Assert.Equal(0.0, a.RequiredAngleDegrees);
        Assert.True(a.OnLocus);
        Tolerance.Close(3.0, a.Gain, 1e-14);
    }

    [Fact]
    public void At_Pole_Throws()
    {
        Assert.Throws<ArgumentException>(() => PointAnalysis.At(TwoPoles, Complex.Zero));
    }
}
