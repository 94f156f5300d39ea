using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Synthesis;

public class SynthesizerTests
{
    private static Loop LoopOf(string plant) => Loop.Create(ExpressionParser.ParseProper(plant).Value!);

    private static Design Designed(Loop loop, Complex target, CompensatorKind kind, ErrorRequirement? requirement = null, SlowPoleOptions? slow = null, LeadOptions? lead = null)
    {
        var outcome = Synthesizer.Design(loop, TargetPole.At(target), kind, lead ?? new LeadOptions(), slow ?? new SlowPoleOptions(), requirement);
        Assert.True(outcome.IsSuccess, outcome.Problem?.ToString());
        var proof = LoopProver.Prove(loop, outcome.Value.Compensator.TransferFunction, outcome.Value.Target);
        Assert.True(proof.TargetConfirmed, $"target not a closed-loop root (residual {proof.TargetResidual})");
        return outcome.Value;
    }

    [Fact]
    public void Design_GainBeyondTheAcceptedRange_RefusedNamingTheTarget()
    {
        // Two lead stages of pole/zero ratio 36.74 on 1/(s(s+1)) for a target near 1.2e5 rad/s need a factored gain
        // near 3.5e13: beyond what the parser accepts, so the design could not be read back, and beyond any actuator.
        var loop = LoopOf("1/(s(s+1))");
        var lead = new LeadOptions { Placement = LeadPlacement.Ratio, Ratio = 36.74 };
        var outcome = Synthesizer.Design(loop, TargetPole.At(new Complex(-81470, 84249)), CompensatorKind.Lead, lead, new SlowPoleOptions(), null);
        Assert.False(outcome.IsSuccess);
        Assert.Equal(Common.Setting.Target, outcome.Problem!.About);
        Assert.Contains("outside the range", outcome.Problem.Message, StringComparison.Ordinal);

        // The same placement for a target 1000 times slower stays in range and is designed.
        Assert.True(Synthesizer.Design(loop, TargetPole.At(new Complex(-81.47, 84.249)), CompensatorKind.Lead, lead, new SlowPoleOptions(), null).IsSuccess);
    }

    [Fact]
    public void Lag_Ogata5thEx6_8_MatchesBook()
    {
        // Ogata, Modern Control Engineering, 5th ed., Example 6-8 (from memory): G = 1.06/(s(s+1)(s+2)) with
        // dominant poles −0.3307 ± j0.5864 and Kv = 0.53; a lag (s + 0.05)/(s + 0.005) with K̂c = 0.9656 raises
        // Kv to about 5.12 and moves the dominant poles to about −0.31 ± j0.55 (same ζ).
        var loop = LoopOf("1.06/(s(s+1)(s+2))");
        var target = new Complex(-0.3307, 0.5864);
        var slow = new SlowPoleOptions { ZeroFraction = 0.05 / 0.3307, Margin = 10.0 * 0.53 / 5.0 * (1.06 / 1.06), AngleBudgetDegrees = 5 };
        var d = Designed(loop, target, CompensatorKind.Lag, new ErrorRequirement(ErrorConstantKind.Velocity, 5.0), slow);
        var lag = Assert.Single(d.Compensator.Stages);
        Tolerance.Close(-0.05, lag.Zero, 1e-9);
        Tolerance.Close(-0.005, lag.Pole, 0.05, what: "lag pole (ratio grown if the re-solved gain fell short)");
        Tolerance.Close(0.9656, d.Compensator.Gain, 0.01, what: "book K̂c");
        Assert.NotNull(d.SteadyState);
        Tolerance.Close(0.53, d.SteadyState!.Before, 2e-3, what: "Kv before (book 0.53)");
        Assert.True(d.SteadyState.Met);
        Tolerance.Close(5.12, d.SteadyState.After, 0.03, what: "book Kv after");
        Tolerance.Close(-0.31, d.Target.Point.Real, 0, 0.01, "book dominant real part");
        Tolerance.Close(0.55, d.Target.Point.Imaginary, 0, 0.01, "book dominant imaginary part");
        Tolerance.Close(TargetPole.At(target).Zeta, d.Target.Zeta, 1e-9, what: "same ζ");
    }

    [Fact]
    public void LeadLag_Ogata5thEx6_9_MatchesBookAndPlacesTheTargetExactly()
    {
        // Ogata, 5th ed., Example 6-9 (from memory): G = 4/(s(s+0.5)), target −2.5 ± j4.33, Kv = 80. Lead zero
        // on the plant pole −0.5, pole −5.02, Kc = 6.26 (graphical); lag (s + 0.2)/(s + 0.01247). The book accepts
        // the lag's small angle as a small error; here the lead makes it up, so the target is exact.
        var loop = LoopOf("4/(s(s+0.5))");
        var target = new Complex(-2.5, 2.5 * Math.Sqrt(3));
        var slow = new SlowPoleOptions { ZeroFraction = 0.2 / 2.5, Margin = 16.04 / 16.0 };
        var d = Designed(loop, target, CompensatorKind.LeadLag, new ErrorRequirement(ErrorConstantKind.Velocity, 80), slow, new LeadOptions { Placement = LeadPlacement.Cancel, Zero = -0.5 });
        Assert.Equal(CompensatorKind.LeadLag, d.Compensator.Kind);
        Assert.Equal(target, d.Target.Point);
        Assert.Null(d.RequestedTarget);
        var lead = d.Compensator.Stages[0];
        var lag = d.Compensator.Stages[1];
        Assert.Equal(-0.5, lead.Zero);
        // The book's −5.02 adds 60° for the lead alone; making up the lag's −1.7° puts the pole further out (−5.195).
        Tolerance.Close(-5.02, lead.Pole, 0.04, what: "book lead pole");
        Assert.True(lead.Pole < -5.0);
        Tolerance.Close(5.0, d.SteadyState!.Before, 1e-9, what: "Kv with the lead alone (exact: Kc = |s||s+5|/4 = 6.25)");
        Tolerance.Close(-0.2, lag.Zero, 1e-12);
        Tolerance.Close(-0.01247, lag.Pole, 0.07, what: "book lag pole");
        // The same reason raises the gain by 4 % (|s + 5.195|/|s + 5| and the lag's 0.98 magnitude at the target).
        Tolerance.Close(6.26, d.Compensator.Gain, 0.045, what: "book Kc");
        Assert.True(d.SteadyState.After >= 80);

        // A different route: the angle and magnitude of 1 + C·G at the target, by complex arithmetic here.
        Complex open = d.Compensator.Gain * 4 / (target * (target + 0.5));
        foreach (var stage in d.Compensator.Stages)
        {
            open *= (target - stage.Zero!.Value) / (target - stage.Pole!.Value);
        }

        Tolerance.Close(-1.0, open.Real, 1e-9, what: "C·G at the target, real part");
        Tolerance.Close(0.0, open.Imaginary, 0, 1e-9, "C·G at the target, imaginary part");
    }

    [Fact]
    public void Pi_RaisesTypeWithinAngleBudget()
    {
        // K/((s+1)(s+3)) has its complex branch on Re s = −2 (common practice): −2 + 2j is on the locus; a PI
        // zero at 0.1·σ costs under 5° there and makes the loop type 1.
        var loop = LoopOf("1/((s+1)(s+3))");
        var d = Designed(loop, new Complex(-2, 2), CompensatorKind.PI);
        var pi = Assert.Single(d.Compensator.Stages);
        Assert.Equal(0.0, pi.Pole);
        Tolerance.Close(-0.2, pi.Zero, 1e-12);
        Assert.True(Math.Abs(pi.AngleAtTargetDegrees) <= 5.0);
        var constants = ErrorConstants.Of(loop, d.Compensator.TransferFunction);
        Assert.Equal(1, constants.SystemType);
        Assert.NotNull(d.Compensator.Pid);
        Tolerance.Close(0.0, d.Compensator.Pid!.Kd, 0, 1e-15);
    }

    [Fact]
    public void Pd_IdealZeroFromDeficiency_AndWarnsImproper()
    {
        // 4/(s(s+2)) at −2 + j2√3 needs 30° (Ogata's Example 6-6 target): one zero seen under 30° there sits at
        // −2 − 2√3·cot 30° = −8; K = |s||s+2|/(4|s+8|) by the magnitude condition.
        var loop = LoopOf("4/(s(s+2))");
        var target = new Complex(-2, 2 * Math.Sqrt(3));
        var d = Designed(loop, target, CompensatorKind.PD);
        var pd = Assert.Single(d.Compensator.Stages);
        Tolerance.Close(-8.0, pd.Zero, 1e-12);
        Assert.Null(pd.Pole);
        Tolerance.Close(4 * 2 * Math.Sqrt(3) / (4 * Complex.Abs(target + 8)), d.Compensator.Gain, 1e-12);
        Assert.Contains(d.Notes, n => n.Contains("improper", StringComparison.Ordinal));
        Tolerance.Close(8.0 * d.Compensator.Gain, d.Compensator.Pid!.Kp, 1e-12, what: "Kp = K·8");
        Tolerance.Close(d.Compensator.Gain, d.Compensator.Pid.Kd, 1e-12, what: "Kd = K");
    }

    [Fact]
    public void Pd_WithFilter_CountsFilterPole()
    {
        var loop = LoopOf("4/(s(s+2))");
        var d = Designed(loop, new Complex(-2, 2 * Math.Sqrt(3)), CompensatorKind.PD, slow: new SlowPoleOptions { FilterRatio = 10 });
        var pd = Assert.Single(d.Compensator.Stages);
        Tolerance.Close(10.0, pd.PoleZeroRatio, 1e-12);
        Assert.True(d.Compensator.Pid!.Tf > 0);
    }

    [Theory]
    [InlineData(null)]
    [InlineData(8.0)]
    public void Pid_JointDesign_PlacesTargetAndHasEveryForm(double? filter)
    {
        var loop = LoopOf("10/((s+1)(s+5))");
        var d = Designed(loop, new Complex(-3, 4), CompensatorKind.PID, slow: new SlowPoleOptions { FilterRatio = filter });
        Assert.Equal(2, d.Compensator.Stages.Length);
        var pid = d.Compensator.Pid!;
        Assert.True(pid.Kp > 0 && pid.Ki > 0 && pid.Kd > 0);
        Assert.Equal(filter is null, pid.SeriesKc is not null);
        var back = pid.ToTransferFunction();
        var c = d.Compensator.TransferFunction;
        foreach (var s in new[] { new Complex(0.3, 1.1), new Complex(-2, 5) })
        {
            Tolerance.Close(c.Evaluate(s), back.Evaluate(s), 1e-10, what: "forms reproduce C(s)");
        }

        Assert.Equal(1, ErrorConstants.Of(loop, c).SystemType);
    }

    public static TheoryData<string, double, double, CompensatorKind, ErrorRequirement?, SlowPoleOptions, string> Refusals() => new()
    {
        { "4/(s(s+2))", -2, 3.4641016151377544, CompensatorKind.Lag, new ErrorRequirement(ErrorConstantKind.Velocity, 20), new SlowPoleOptions(), "a lag alone only fixes the steady state" },
        { "4/(s(s+2))", -1, 3, CompensatorKind.Lag, null, new SlowPoleOptions(), "A lag needs a steady-state requirement" },
        { "4/((s+1)(s+3))", -2, 2, CompensatorKind.Lag, new ErrorRequirement(ErrorConstantKind.Velocity, 5), new SlowPoleOptions(), "cannot raise the system type" },
        { "4/(s(s+2))", -1, 3, CompensatorKind.Lag, new ErrorRequirement(ErrorConstantKind.Velocity, 0.1), new SlowPoleOptions(), "without a lag" },
        { "4/(s(s+2))", -1, 3, CompensatorKind.Lag, new ErrorRequirement(ErrorConstantKind.Position, 5), new SlowPoleOptions(), "already infinite" },
        { "4/((s+1)(s+3))", -2, 2, CompensatorKind.PI, null, new SlowPoleOptions { ZeroFraction = 1.5 }, "at or right of the target" },
        { "4/(s(s+2))", -2, 3.4641016151377544, CompensatorKind.PI, null, new SlowPoleOptions(), "Use a PID" },
        { "4/(s(s+2))", -0.5, 0.5, CompensatorKind.PD, null, new SlowPoleOptions(), "a derivative zero can only add positive angle" },
    };

    [Theory]
    [MemberData(nameof(Refusals))]
    public void Design_Unwise_RefusedWithReasonAndHint(string plant, double re, double im, CompensatorKind kind, ErrorRequirement? requirement, SlowPoleOptions slow, string reason)
    {
        var outcome = Synthesizer.Design(LoopOf(plant), TargetPole.At(new Complex(re, im)), kind, new LeadOptions(), slow, requirement);
        Assert.False(outcome.IsSuccess);
        Assert.Contains(reason, outcome.Problem!.Message + " " + outcome.Problem.Hint, StringComparison.Ordinal);
        Assert.False(string.IsNullOrWhiteSpace(outcome.Problem.Hint));
    }

    [Fact]
    public void LeadLag_EqualFactor_Ogata5thEx6_9SecondMethod()
    {
        // Ogata, 5th ed., Example 6-9, the equal-factor variant (from memory): G = 4/(s(s+0.5)), Kv = 80 fixes
        // Kc = 80/8 = 10; the lead (s + 2.38)/(s + 8.34), β ≈ 3.5, then meets both conditions at −2.5 ± j4.33.
        var loop = LoopOf("4/(s(s+0.5))");
        var target = new Complex(-2.5, 2.5 * Math.Sqrt(3));
        var outcome = Synthesizer.Design(loop, TargetPole.At(target), CompensatorKind.LeadLag, new LeadOptions(), new SlowPoleOptions { EqualFactor = true, ZeroFraction = 0.04 }, new ErrorRequirement(ErrorConstantKind.Velocity, 80));
        Assert.True(outcome.IsSuccess, outcome.Problem?.ToString());
        var d = outcome.Value;
        Tolerance.Close(10.0, d.Compensator.Gain, 1e-12, what: "Kc = Kv/8");
        var lead = d.Compensator.Stages[0];
        var lag = d.Compensator.Stages[1];
        Tolerance.Close(lead.PoleZeroRatio, lag.Zero!.Value / lag.Pole!.Value, 1e-12, what: "same β for lead and lag");
        Tolerance.Close(-2.38, lead.Zero, 0, 0.05, "book lead zero");
        Tolerance.Close(-8.34, lead.Pole, 0, 0.05, "book lead pole");
        Tolerance.Close(3.5, lead.PoleZeroRatio, 0.02, what: "book β");

        // The exact conditions at the target with the lead alone and Kc fixed.
        var withLead = CompAssist.Core.Analysis.PointAnalysis.At(loop, target, TransferFunction.FromFactors(10.0, [new Complex(lead.Zero!.Value, 0)], [new Complex(lead.Pole!.Value, 0)]));
        Assert.True(withLead.OnLocus);
        Tolerance.Close(1.0, withLead.Magnitude, 1e-9);
        Assert.True(d.SteadyState!.Met);
        Tolerance.Close(80.0, d.SteadyState.After, 1e-9);
        Assert.True(Complex.Abs(d.Target.Point - target) < 0.1 * target.Magnitude, "the lag moves the pole only slightly");
    }

    [Fact]
    public void Pid_LargeDeficiency_AddsLeadStagesAndKeepsPidForms()
    {
        // 1/(s(s+1)³) at −1 + 2j needs about 209° of lead: the derivative zero gives 60° and identical lead
        // stages the rest; the PID gain forms still describe the PID part.
        var d = Designed(LoopOf("1/(s(s+1)^3)"), new Complex(-1, 2), CompensatorKind.PID, slow: new SlowPoleOptions { FilterRatio = 10 });
        Assert.Equal(2, d.Compensator.Stages.Count(st => st.Kind is CompensatorKind.PI or CompensatorKind.PD));
        Assert.True(d.Compensator.Stages.Count(st => st.Kind == CompensatorKind.Lead) >= 2);
        Assert.NotNull(d.Compensator.Pid);
        Tolerance.Close(d.AngleDeficiencyDegrees + 360, d.Compensator.Stages.Sum(st => st.AngleAtTargetDegrees), 1e-6, what: "all angles counted");
    }

    [Fact]
    public void Pid_TargetNeedingLagAPiGives_RefusedPointingToThePi()
    {
        // e^(−0.1s)/(s − 1) at −2 + 2j needs 22.2° of lag (computed in PiDesignerTests): a PI places it exactly;
        // 360° − 22° of lead from a derivative zero and lead stages is no PID to ship, so the PID says so.
        var loop = Loop.Create(ExpressionParser.Parse("exp(-0.1s)/(s-1)", requireProper: true).Value!);
        var outcome = Synthesizer.Design(loop, TargetPole.At(new Complex(-2, 2)), CompensatorKind.PID, new LeadOptions(), new SlowPoleOptions { FilterRatio = 10 }, null);
        Assert.False(outcome.IsSuccess);
        Assert.Contains("derivative zero only adds lead", outcome.Problem!.Message, StringComparison.Ordinal);
        Assert.Contains("Use a PI", outcome.Problem.Hint, StringComparison.Ordinal);
        Assert.True(Synthesizer.Design(loop, TargetPole.At(new Complex(-2, 2)), CompensatorKind.PI, new LeadOptions(), new SlowPoleOptions(), null).IsSuccess);
    }

    [Fact]
    public void Lead_ChosenPlacementRefused_HintNamesThePlacementsThatWork()
    {
        // A double integrator has no stable real pole to cancel. At −1 + j it needs 90° (−2·135° + 90° = −180°, by
        // hand): two stages of 45°; zero −1 sees the target under 90°, pole −2 under 45°, so each adds 45°.
        var outcome = Synthesizer.Design(LoopOf("1/s^2"), TargetPole.At(new Complex(-1, 1)), CompensatorKind.Lead, new LeadOptions { Placement = LeadPlacement.Cancel }, new SlowPoleOptions(), null);
        Assert.False(outcome.IsSuccess);
        Assert.Contains("no stable real pole", outcome.Problem!.Message, StringComparison.Ordinal);
        Assert.Contains("The bisector placement works here (first stage zero -1, pole -2)", outcome.Problem.Hint, StringComparison.Ordinal);
    }
}
