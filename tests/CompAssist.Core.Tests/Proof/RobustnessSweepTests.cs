using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

public class RobustnessSweepTests
{
    private static Loop LoopOf(string plant) => Loop.Create(ExpressionParser.ParseProper(plant).Value!);

    [Fact]
    public void Run_GainBeyondRouthLimit_HasAnUnstableCorner()
    {
        // K/(s(s+1)(s+2)) is stable for K < 6 (Routh): K = 5 ± 30 % has the upper corner at 6.5, unstable.
        var report = RobustnessSweep.Run(LoopOf("5/(s(s+1)(s+2))"), TransferFunction.Unity, [PlantVariation.Parse("gain=30%").Value!]).Value!;
        Assert.Equal(2, report.Corners.Length);
        Assert.False(report.AllStable);
        Assert.False(report.Corners.Single(c => c.Factors[0] > 1).Stable);
        Assert.True(report.Corners.Single(c => c.Factors[0] < 1).Stable);
    }

    [Fact]
    public void Run_WithinRouthLimit_AllCornersStable()
    {
        var report = RobustnessSweep.Run(LoopOf("2/(s(s+1)(s+2))"), TransferFunction.Unity, [PlantVariation.Parse("gain=20%").Value!, PlantVariation.Parse("pole=-2:10%").Value!]).Value!;
        Assert.Equal(4, report.Corners.Length);
        Assert.True(report.AllStable);
        Assert.True(report.WorstOvershootPercent > 0);
    }

    [Fact]
    public void Run_PoleVariation_FirstOrderStaysFirstOrder()
    {
        // A first-order loop stays first-order at every corner: both corners stable with ζ = 1.
        var report = RobustnessSweep.Run(LoopOf("1/(s+1)"), TransferFunction.Unity, [PlantVariation.Parse("pole=-1:10%").Value!]).Value!;
        Assert.True(report.AllStable);
        Assert.All(report.Corners, c => Tolerance.Close(1.0, c.LeastDamping, 1e-12));
    }

    [Theory]
    [InlineData("gain", "'gain' is not a variation")]
    [InlineData("speed=10%", "'speed' cannot be varied")]
    [InlineData("gain=150%", "'150%' is not a percentage between 0 and 100")]
    [InlineData("pole=abc:10%", "'pole=abc:10%' does not name a pole")]
    public void Parse_Bad_Refuses(string text, string message)
    {
        var outcome = PlantVariation.Parse(text);
        Assert.False(outcome.IsSuccess);
        Assert.Equal(message, outcome.Problem!.Message);
    }

    [Fact]
    public void Run_UnknownPole_Refuses()
    {
        var outcome = RobustnessSweep.Run(LoopOf("1/(s+1)"), TransferFunction.Unity, [PlantVariation.Parse("pole=-3:10%").Value!]);
        Assert.False(outcome.IsSuccess);
        Assert.StartsWith("The plant has no pole at -3", outcome.Problem!.Message, StringComparison.Ordinal);
    }
}
