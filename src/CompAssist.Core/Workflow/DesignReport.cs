using CompAssist.Core.Locus;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Workflow;

/// <summary>A complete, proved design: how the target was chosen, the design and its proof.</summary>
/// <param name="Selection">Target and region.</param>
/// <param name="Design">The synthesized compensator and its reasoning.</param>
/// <param name="Proof">The closed-loop roots and the target check.</param>
/// <param name="Check">What the loop does: simulated step, errors, margins, effort.</param>
/// <param name="Robustness">The plant-variation sweep, when variations were given.</param>
/// <param name="Locus">The root locus of the compensated loop C·G·H (its gain factor K = 1 is the design).</param>
public sealed record DesignReport(TargetSelection Selection, Design Design, LoopProof Proof, LoopCheckReport Check, RobustnessReport? Robustness, LocusResult Locus)
{
    /// <summary>The search that chose this design's target and choices, when one ran.</summary>
    public Search.SearchOutcome? Search { get; init; }

    /// <summary>The reference prefilter, when the case asks for one and it exists.</summary>
    public Proof.ReferencePrefilter? Prefilter { get; init; }

    /// <summary>Why no prefilter was made although the case asks for one (null otherwise).</summary>
    public string? PrefilterNote { get; init; }

    /// <summary>When several kinds were searched: each kind's best, in the order asked (the winner's kind is this report's).</summary>
    public System.Collections.Immutable.ImmutableArray<Search.KindResult> KindsCompared { get; init; } = [];

    /// <summary>The proof's verdict: stable, and every requirement holds nominally and at every corner.</summary>
    public LoopVerdict Verdict => LoopVerdict.Of(Check, Robustness);
}
