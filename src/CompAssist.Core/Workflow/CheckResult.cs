using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Workflow;

/// <summary>The proof of a given compensator on a given loop (no synthesis).</summary>
/// <param name="Loop">The loop.</param>
/// <param name="Compensator">The compensator checked.</param>
/// <param name="ClosedLoopPoles">Every closed-loop pole, verified by root finding.</param>
/// <param name="Selection">The target implied by the requirements, when they imply one (for predictions).</param>
/// <param name="Check">Step, errors, margins, effort.</param>
/// <param name="Robustness">The plant-variation sweep, when variations were given.</param>
public sealed record CheckResult(
    Loop Loop,
    TransferFunction Compensator,
    ImmutableArray<Complex> ClosedLoopPoles,
    TargetSelection? Selection,
    LoopCheckReport Check,
    RobustnessReport? Robustness)
{
    /// <summary>The proof's verdict: stable, and every requirement holds nominally and at every corner.</summary>
    public LoopVerdict Verdict => LoopVerdict.Of(Check, Robustness);
}
