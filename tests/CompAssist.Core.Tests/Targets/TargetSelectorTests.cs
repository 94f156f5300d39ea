using System.Numerics;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Targets;

public class TargetSelectorTests
{
    [Fact]
    public void Select_OvershootAndSettling_TakesCornerOnZetaRay()
    {
        var r = TargetSelector.Select(new Requirements { MaxOvershootPercent = 16.303, MaxSettlingTime = 2.0 });
        Assert.True(r.IsSuccess);
        var t = r.Value.Target;
        Tolerance.Close(2.0, t.Sigma, 1e-12, what: "σ = 4/ts");
        Tolerance.Close(0.5, t.Zeta, 1e-4, what: "ζ");
        Assert.True(r.Value.InsideRegion);
        Assert.All(r.Value.Constraints, c => Tolerance.Close(0.0, c.Margin, 0, 1e-9));
    }

    [Fact]
    public void Select_FiveBand_UsesThreeOverSigma()
    {
        var t = TargetSelector.Select(new Requirements { MaxOvershootPercent = 10, MaxSettlingTime = 1.5, Band = SettlingBand.FivePercent }).Value!.Target;
        Tolerance.Close(2.0, t.Sigma, 1e-12);
    }

    [Fact]
    public void Select_PeakTimeDominates_MovesUpTheRay()
    {
        // ζ ≥ 0.5 ray has ωd = σ·√3; peak time 0.5 s needs ωd ≥ 2π, more than σ = 1 gives.
        var r = TargetSelector.Select(new Requirements { MaxOvershootPercent = 16.303, MaxSettlingTime = 4.0, MaxPeakTime = 0.5 }).Value!;
        Tolerance.Close(2 * Math.PI, r.Target.DampedFrequency, 1e-9);
        Assert.True(r.InsideRegion);
        Assert.True(r.Constraints.Single(c => c.Name == "settling").Margin > 0);
    }

    [Fact]
    public void Select_ZetaAndWn_GivesExactPoint()
    {
        var t = TargetSelector.Select(new Requirements { Zeta = 0.5, NaturalFrequency = 4 }).Value!.Target;
        Tolerance.Close(new Complex(-2, 2 * Math.Sqrt(3)), t.Point, 1e-15);
    }

    [Fact]
    public void Select_PointWithRegion_ReportsMargins()
    {
        var r = TargetSelector.Select(new Requirements { Point = new Complex(-1, 3), MaxOvershootPercent = 10, MaxSettlingTime = 2 }).Value!;
        Assert.False(r.InsideRegion);
        Assert.False(r.Constraints.Single(c => c.Name == "settling").Satisfied);
    }

    [Fact]
    public void Select_LowerHalfPoint_IsReflected()
    {
        var t = TargetSelector.Select(new Requirements { Point = new Complex(-1, -3) }).Value!.Target;
        Assert.Equal(new Complex(-1, 3), t.Point);
    }

    [Theory]
    [InlineData(10.0, null, null, "An overshoot bound fixes the damping ratio but not the speed")]
    [InlineData(null, 2.0, null, "The requirements do not fix a target pole")]
    [InlineData(150.0, 2.0, null, "Overshoot 150 % is out of range")]
    [InlineData(10.0, -1.0, null, "Settling time -1 s is not positive")]
    public void Select_Insufficient_RefusesWithReason(double? overshoot, double? settling, double? peak, string message)
    {
        var r = TargetSelector.Select(new Requirements { MaxOvershootPercent = overshoot, MaxSettlingTime = settling, MaxPeakTime = peak });
        Assert.False(r.IsSuccess);
        Assert.Equal(message, r.Problem!.Message);
    }

    [Fact]
    public void Select_ZetaWithoutWn_Refuses()
    {
        Assert.False(TargetSelector.Select(new Requirements { Zeta = 0.5 }).IsSuccess);
    }
}
