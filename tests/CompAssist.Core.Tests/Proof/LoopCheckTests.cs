using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

public class LoopCheckTests
{
    private static TransferFunction FromText(string text) => ExpressionParser.Parse(text, requireProper: false).Value!;

    [Fact]
    public void Run_CancelledLead_IsExactSecondOrder()
    {
        // 4/(s(s+2)) with C = 4(s+2)/(s+4): T = 16/(s² + 4s + 16), ζ = 0.5, ωn = 4 exactly.
        var loop = Loop.Create(FromText("4/(s(s+2))"));
        var target = TargetPole.FromDamping(0.5, 4);
        var report = LoopCheck.Run(loop, FromText("4(s+2)/(s+4)"), new CheckOptions { Intervals = 20000 }, new Requirements { MaxOvershootPercent = 20 }, target);
        Assert.True(report.Stable);
        Tolerance.Close(SecondOrder.OvershootPercent(0.5), report.Step.OvershootPercent, 1e-5);
        Tolerance.Close(Math.PI / (2 * Math.Sqrt(3)), report.Step.PeakTime, 0, report.Step.SampleTime);
        Tolerance.Close(1.0, report.Step.FinalValue, 1e-12);
        Tolerance.Close(0.0, report.StepError, 0, 1e-12);
        Assert.Equal(1, report.ErrorConstants.SystemType);
        Tolerance.Close(4.0, report.ErrorConstants.Kv, 1e-12, what: "Kv = lim s·16/(s(s+4))");
        Tolerance.Close(0.25, report.RampError, 1e-9, what: "ramp error 1/Kv");
        Assert.True(report.Checks.Single(c => c.Name == "overshoot %").Passes);
    }

    [Theory]
    [InlineData("1/s^2", "2(s+1)")]
    [InlineData("(s+1)/(s^2 (s+5))", "10")]
    [InlineData("1/(s^2 (s+4))", "3(s+0.5)")]
    public void Run_TypeTwoOrHigherLoop_RampErrorIsExactlyZero(string plant, string compensator)
    {
        // Two or more integrators in L make Kv infinite and the ramp error 1/Kv zero (common practice: the
        // error-constant table of unity-feedback loops). The log-derivative terms cancel to rounding; that
        // rounding must read as 0, not as −1.4e-15.
        var report = LoopCheck.Run(Loop.Create(FromText(plant)), FromText(compensator), new CheckOptions());
        Assert.True(report.Stable);
        Assert.True(report.ErrorConstants.SystemType >= 2);
        Assert.Equal(0.0, report.StepError);
        Assert.Equal(0.0, report.RampError);
    }

    [Fact]
    public void Run_DelayLoop_StepOnTheExactDelayWithoutThePadeDip()
    {
        // e^(−θs) holds y at 0 for t < θ (common practice); the Padé approximant's right-half-plane zeros give a
        // small wrong-way start that the real loop does not have. The step is now taken on the exact delay, so
        // there is no undershoot and y stays 0 until θ. A right-half-plane zero of the plant does undershoot.
        var delayed = LoopCheck.Run(Loop.Create(FromText("exp(-0.5s)/((s+1)(s+2))")), FromText("1.5(s+0.8)/s"), new CheckOptions());
        Assert.Equal(StepSolution.ExactDelay, delayed.Solution);
        Assert.Equal(0.0, delayed.Step.UndershootPercent);
        var beforeDelay = delayed.Output.Values.Take((int)(0.5 / delayed.Output.SampleTime)).ToList();
        Assert.All(beforeDelay, y => Assert.Equal(0.0, y));
        Assert.DoesNotContain(delayed.Warnings, w => w.Contains("comes from the Padé approximant", StringComparison.Ordinal));

        var nonMinimumPhase = LoopCheck.Run(Loop.Create(FromText("(1-s)/((s+1)(s+2))")), FromText("0.5(s+0.5)/s"), new CheckOptions());
        Assert.True(nonMinimumPhase.Step.UndershootPercent > 1);
        Assert.Equal(StepSolution.Exact, nonMinimumPhase.Solution);
        Assert.DoesNotContain(nonMinimumPhase.Warnings, w => w.Contains("Padé", StringComparison.Ordinal));
    }

    [Fact]
    public void Run_AsymmetricOutputLimits_ChecksHighestAndLowestCommandAboutTheOperatingPoint()
    {
        // By hand: 1/(s+1) under the static gain 2 gives y = (2/3)(1 − e^{−3t}) and u = 2(1 − y), from 2 at t = 0⁺
        // down to 2/3. With limits 0 … 1.7 about u0 = 0.2 the room is −0.2 … 1.5: the highest command 2 leaves it.
        var loop = Loop.Create(ExpressionParser.Parse("1/(s+1)", false).Value!);
        var options = new CheckOptions { OutputLimits = CommandRange.Create(0.0, 1.7), OperatingPoint = 0.2 };
        var check = LoopCheck.Run(loop, ExpressionParser.Parse("2", false).Value!, options);
        Tolerance.Close(2.0, check.EffortFigures.Highest, 1e-9);
        Tolerance.Close(2.0 / 3.0, check.EffortFigures.Lowest, 1e-12, what: "the final command joins the extremes");
        Assert.True(check.EffortFigures.Saturates);
        var highest = Assert.Single(check.Checks, c => c.Name == RequirementChecks.CommandHighest);
        Assert.False(highest.Passes);
        Assert.True(Assert.Single(check.Checks, c => c.Name == RequirementChecks.CommandLowest).Passes);
        var roomy = LoopCheck.Run(loop, ExpressionParser.Parse("2", false).Value!, options with { OutputLimits = CommandRange.Create(0.0, 2.5) });
        Assert.False(roomy.EffortFigures.Saturates);
        Assert.All(roomy.Checks.Where(c => c.Name.Contains("u − u0", StringComparison.Ordinal)), c => Assert.True(c.Passes));
    }

    [Fact]
    public void Run_StrictlyProperPlant_InitialEffortIsHighFrequencyGain()
    {
        // u(0+) equals the compensator's high-frequency gain when C·G·H is strictly proper (common practice).
        var loop = Loop.Create(FromText("10/(s(s+2)(s+10))"));
        var c = FromText("7.5(s+1.2)/(s+9)");
        var report = LoopCheck.Run(loop, c, new CheckOptions { ReferenceStep = 2.0, ActuatorLimit = 10 });
        Tolerance.Close(7.5 * 2.0, report.EffortFigures.Initial, 1e-12);
        Assert.True(report.EffortFigures.Saturates);
        Assert.Contains(report.Warnings, w => w.Contains("saturates", StringComparison.Ordinal));
    }

    [Fact]
    public void Run_TypeZeroLoop_HasStepErrorOneOverOnePlusKp()
    {
        // 3/((s+1)(s+2)): Kp = 1.5, unity feedback step error 1/(1 + Kp) = 0.4; ramp error infinite.
        var report = LoopCheck.Run(Loop.Create(FromText("3/((s+1)(s+2))")), FromText("1"), new CheckOptions());
        Tolerance.Close(1.5, report.ErrorConstants.Kp, 1e-14);
        Tolerance.Close(0.4, report.StepError, 1e-12);
        Assert.True(double.IsPositiveInfinity(report.RampError));
        Tolerance.Close(0.6, report.Step.FinalValue, 1e-12);
    }

    [Fact]
    public void Run_Unstable_ClaimsNoMargins()
    {
        var report = LoopCheck.Run(Loop.Create(FromText("1/(s(s+1)(s+2))")), FromText("10"), new CheckOptions());
        Assert.False(report.Stable);
        Assert.Null(report.Margins);
        Assert.Contains(report.Warnings, w => w.StartsWith("The closed loop is UNSTABLE: 2 closed-loop roots", StringComparison.Ordinal));
        Assert.Equal(2, report.UnstableRootCount);
    }

    [Fact]
    public void Run_SlowPoleFromCancellationMiss_HorizonCoversTail()
    {
        // A near pole–zero pair at −0.05/−0.055 leaves a slow tail; the horizon must follow the slowest pole.
        var loop = Loop.Create(FromText("4/(s(s+2))"));
        var report = LoopCheck.Run(loop, FromText("4(s+0.055)/(s+0.05)"), new CheckOptions());
        var slowest = report.Step.Horizon;
        Assert.True(slowest > 8.0 / 0.06, $"horizon {slowest}");
    }

    [Fact]
    public void Run_DelayLoopUnstableOnlyWithExactDelay_IsUnstableAndSaysWhy()
    {
        // K e^(−s)/(s + 1) is unstable above K* = √(1 + ω²) ≈ 2.262 (tan ω = −ω, common practice); the Padé
        // approximant of order 1 keeps its roots in the left half-plane up to K = 3.
        var loop = Loop.Create(FromText("exp(-1s)/(s+1)"), padeOrder: 1);
        var c = TransferFunction.Constant(2.5);
        var roots = Core.Numerics.RootFinder.Find(loop.Characteristic(c)).Roots;
        Assert.All(roots, r => Assert.True(r.Real < 0));
        var report = LoopCheck.Run(loop, c, roots, new CheckOptions(), new Requirements { MaxOvershootPercent = 50 });
        Assert.False(report.Stable);
        Assert.Equal(2, report.UnstableRootCount);
        Assert.Null(report.Margins);
        Assert.Contains(report.Warnings, w => w.Contains("exact delay", StringComparison.Ordinal) && w.Contains("Padé", StringComparison.Ordinal));
        Assert.DoesNotContain(report.Checks, k => k.Passes == true);
    }
}
