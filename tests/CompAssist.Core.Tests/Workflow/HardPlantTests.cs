using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Search;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Workflow;

/// <summary>
/// Plants a lab has (unstable, delayed, non-minimum-phase, triple integrator, delay-dominant thermal) designed
/// through the whole workflow over every kind: the chosen design is stable, meets, follows the reference (or the
/// offset is said), and its closed-loop poles — found here again by the roots of the Padé-free characteristic
/// where there is no delay — include the target. Check values computed here, not by the product's routines.
/// </summary>
public class HardPlantTests
{
    private static DesignReport Best(string plant, double overshoot, double settling)
    {
        var text = $"format = 1\n[loop]\nplant = \"{plant}\"\n[requirements]\novershoot_percent = {overshoot}\nsettling_time = {settling}\n";
        var (input, error) = CaseFileReader.Read(text, "hard.toml");
        Assert.Null(error);
        CompensatorKind[] kinds = [CompensatorKind.Lead, CompensatorKind.Lag, CompensatorKind.LeadLag, CompensatorKind.PD, CompensatorKind.PI, CompensatorKind.PID];
        var run = DesignWorkflow.SearchKinds(input!, kinds, new SearchOptions(), atCorner: false);
        Assert.True(run.IsSuccess, run.Problem?.ToString());
        return run.Report!;
    }

    [Theory]
    [InlineData("1/(s-1)", 20, 3, "pi")]                       // unstable first order
    [InlineData("1/((s-1)(s+5))", 20, 3, "pid")]               // unstable second order (a levitated mass, roughly)
    [InlineData("exp(-5s)/(20s+1)", 10, 60, "pi")]             // delay-dominant thermal process
    [InlineData("(2-s)/(s(s+3))", 15, 6, null)]                // non-minimum phase
    [InlineData("1/s^3", 30, 10, null)]                        // triple integrator
    public void SearchKinds_HardPlant_StableMeetingAndFollowingTheReference(string plant, double overshoot, double settling, string? kind)
    {
        var report = Best(plant, overshoot, settling);
        Assert.True(report.Check.Stable);
        Assert.True(report.Verdict.Meets, string.Join("; ", report.Check.Checks.Where(c => c.Passes == false).Select(c => c.Name)));
        if (kind is not null)
        {
            Assert.Equal(kind, CompensatorKindNames.NameOf(report.Design.Compensator.Kind));
        }

        // Following the reference: the final value of the unit step within the 2 % band (a type-0 plant under a
        // lead settles at 0.03 or 2.3 and would "meet" overshoot and settling about that value).
        Assert.InRange(report.Check.Step.FinalValue, 0.98, 1.02);
        Assert.DoesNotContain(report.Check.Warnings, w => w.StartsWith(LoopCheck.OffsetWarningStart, StringComparison.Ordinal));

        // The target is a closed-loop root of 1 + C·G (exact delay: |1 + C·G| at the target ≈ 0 relative to its terms).
        var s = report.Design.Target.Point;
        var open = report.Design.Loop.OpenLoop(report.Design.Compensator.TransferFunction).Evaluate(s);
        Assert.True(Complex.Abs(open + 1) <= 1e-9, $"|1 + C·G| at the target = {Complex.Abs(open + 1):G3}");
    }

    [Fact]
    public void Design_DelayedTargetBeyondThePadeRange_RefusedNotPlacedByATinyGain()
    {
        // e^(−5s)/(20s+1) at −5.78 + 0.04j: |s|·τ = 29, where |e^(−sτ)| = e^28.9 ≈ 3.5e12 and an order-3 Padé
        // approximant is nothing like it (computed here); a lead "placed" there had gain 1.1e-12 and no root at the target.
        var text = "format = 1\n[loop]\nplant = \"exp(-5s)/(20s+1)\"\n[requirements]\ntarget = [-5.78, 0.04]\n[compensator]\ntype = \"lead\"\n";
        var (input, error) = CaseFileReader.Read(text, "delay.toml");
        Assert.Null(error);
        var s = new Complex(-5.78, 0.04);
        Assert.True(Complex.Exp(-5 * s).Magnitude > 1e12);
        var run = DesignWorkflow.Run(input!);
        Assert.False(run.IsSuccess);
        Assert.Contains("Padé approximant differs", run.Problem!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_TypeZeroLoopSettlingAwayFromTheReference_SaysSoWithTheRemedies()
    {
        // 1/((s+1)(s+2)) under K = 4: T(0) = 4/(2 + 4) = 2/3 (by hand), a 33 % step error.
        var loop = Loop.Create(ExpressionParser.Parse("1/((s+1)(s+2))", requireProper: true).Value!);
        var report = LoopCheck.Run(loop, TransferFunction.Constant(4), new CheckOptions());
        var warning = Assert.Single(report.Warnings, w => w.StartsWith(LoopCheck.OffsetWarningStart, StringComparison.Ordinal));
        Assert.Contains("settles at 0.6667", warning, StringComparison.Ordinal);
        Assert.Contains("prefilter gain of 1.5", warning, StringComparison.Ordinal);
        Assert.Contains("integral action", warning, StringComparison.Ordinal);
    }
}
