using System.Collections.Immutable;

namespace CompAssist.Core.Search;

/// <summary>What a search found.</summary>
/// <param name="Winner">The best candidate (the closest one when nothing meets).</param>
/// <param name="RunnersUp">The next best, ranked, with different targets or choices.</param>
/// <param name="Evaluated">How many candidates were synthesized and proved.</param>
/// <param name="Objective">What was minimized.</param>
/// <param name="RequirementMargin">The relative margin every requirement had to hold with.</param>
/// <param name="Limits">When nothing meets: what binds and why (physical limits with their rules), else empty.</param>
/// <param name="RobustFinalists">How many finalists were swept over the variation corners.</param>
public sealed record SearchOutcome(
    SearchCandidate Winner,
    ImmutableArray<SearchCandidate> RunnersUp,
    int Evaluated,
    SearchObjective Objective,
    double RequirementMargin,
    ImmutableArray<string> Limits,
    int RobustFinalists)
{
    /// <summary>The free choices that were kept as given instead of searched.</summary>
    public SearchPins Pinned { get; init; }

    /// <summary>True when the winner meets every requirement.</summary>
    public bool Meets => Winner.Meets;
}
