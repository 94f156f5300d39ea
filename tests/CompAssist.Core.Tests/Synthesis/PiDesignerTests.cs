using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Synthesis;

/// <summary>
/// The PI by the angle condition (exact at a target that needs lag), near the locus (the fraction of σ) and the
/// pole-cancelling PI, with check values computed here by complex arithmetic and by the second-order formulas.
/// </summary>
public class PiDesignerTests
{
    private static Loop LoopOf(string plant) => Loop.Create(ExpressionParser.Parse(plant, requireProper: true).Value!);

    private static Complex OpenLoop(Design d, Complex s) => d.Loop.OpenLoop(d.Compensator.TransferFunction).Evaluate(s);

    [Fact]
    public void Design_UnstableFirstOrderWithDelayAtATargetNeedingLag_PlacesTheTargetExactly()
    {
        // G = e^(−0.1s)/(s − 1) at s* = −2 + 2j: ∠G = −atan2(2, −3) − 0.2 rad = −157.78°, so the target needs
        // 22.23° of lag; a PI gives it with its zero where ∠(s* − z) = 135° − 22.23° = 112.77°, z = −2 − 2/tan(112.77°) = −1.1605
        // (computed here). The delay is taken exactly (e^(−s·0.1)), not by its Padé approximant.
        var loop = LoopOf("exp(-0.1s)/(s-1)");
        var s = new Complex(-2, 2);
        var outcome = PiDesigner.Design(loop, TargetPole.At(s), cancel: false, new SlowPoleOptions(), null);
        Assert.True(outcome.IsSuccess, outcome.Problem?.ToString());
        var d = outcome.Value;
        Assert.Equal(s, d.Target.Point);
        var lag = Math.Atan2(2, -3) * 180 / Math.PI + (0.2 * 180 / Math.PI) - 180;
        Tolerance.Close(-22.23, lag, 0, 0.01, "the lag the target needs");
        var expectedZero = s.Real - (s.Imaginary / Math.Tan((135 + lag) * Math.PI / 180));
        var stage = Assert.Single(d.Compensator.Stages);
        Tolerance.Close(expectedZero, stage.Zero, 1e-12);
        Tolerance.Close(-1.1605, stage.Zero, 0, 1e-4, "zero by hand");
        Tolerance.Close(-1.0, OpenLoop(d, s).Real, 1e-9, what: "C·G at the target, real");
        Tolerance.Close(0.0, OpenLoop(d, s).Imaginary, 0, 1e-9, "C·G at the target, imaginary");
        var check = LoopCheck.Run(loop, d.Compensator.TransferFunction, new CheckOptions());
        Assert.True(check.Stable, "the unstable plant is stabilised");
        Assert.Equal(0.0, check.StepError, 1e-9);
    }

    [Fact]
    public void Design_TargetNeedingLead_RefusedWithThePid()
    {
        var loop = LoopOf("4/(s(s+2))");
        var outcome = PiDesigner.Design(loop, TargetPole.At(new Complex(-4, 4)), cancel: false, new SlowPoleOptions(), null);
        Assert.False(outcome.IsSuccess);
        Assert.Contains("of lead; a PI only adds lag", outcome.Problem!.Message, StringComparison.Ordinal);
        Assert.Contains("PID", outcome.Problem.Hint, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_NearTheLocus_KeepsTheZeroFractionNotASlowerIntegral()
    {
        // 1/((s+1)(s+3)) has its complex branch on Re s = −2 (common practice): at −2 + 2j the exact zero would sit
        // almost at the origin; the PI keeps its zero at 0.1·σ = −0.2 and the target slides a little.
        var loop = LoopOf("1/((s+1)(s+3))");
        var d = PiDesigner.Design(loop, TargetPole.At(new Complex(-2, 2)), cancel: false, new SlowPoleOptions(), null).Value!;
        Tolerance.Close(-0.2, Assert.Single(d.Compensator.Stages).Zero, 1e-12);
        Assert.NotNull(d.RequestedTarget);
    }

    [Fact]
    public void Design_Cancelling_ZeroOnTheSlowestPoleAndTheGainOfTheSecondOrderLoop()
    {
        // 0.5/((s+0.1)(s+1)) with the zero on −0.1 leaves K·0.5/(s(s+1)): s² + s + 0.5K, σ = −0.5 for every K
        // (common practice). On the ζ = 0.7 ray: ωn = 0.5/0.7, K = 2ωn² = 1.0204.
        var loop = LoopOf("0.5/((s+0.1)(s+1))");
        var zeta = 0.7;
        var asked = TargetPole.FromDamping(zeta, 1.0);
        var outcome = PiDesigner.Design(loop, asked, cancel: true, new SlowPoleOptions(), null);
        Assert.True(outcome.IsSuccess, outcome.Problem?.ToString());
        var d = outcome.Value;
        Tolerance.Close(-0.1, Assert.Single(d.Compensator.Stages).Zero, 1e-12);
        var wn = 0.5 / zeta;
        Tolerance.Close(2 * wn * wn, d.Compensator.Gain, 1e-9, what: "K = 2ωn²");
        Tolerance.Close(-0.5, d.Target.Point.Real, 1e-9, what: "σ of the cancelled loop");
        Tolerance.Close(zeta, d.Target.Zeta, 1e-9, what: "ζ kept");
        Assert.Contains(d.Notes, n => n.Contains("load disturbance at the plant input", StringComparison.Ordinal));
    }

    [Fact]
    public void Design_CancellingOnAnIntegratingPlant_Refused()
    {
        var outcome = PiDesigner.Design(LoopOf("1/(s(s-1))"), TargetPole.At(new Complex(-1, 1)), cancel: true, new SlowPoleOptions(), null);
        Assert.False(outcome.IsSuccess);
        Assert.Contains("no stable real pole", outcome.Problem!.Message, StringComparison.Ordinal);
    }
}
