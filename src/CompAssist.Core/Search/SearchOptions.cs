namespace CompAssist.Core.Search;

/// <summary>How the search runs.</summary>
public sealed record SearchOptions
{
    /// <summary>The relative margin every requirement must hold with for a candidate to count as meeting (1 %).</summary>
    public const double DefaultRequirementMargin = 0.01;

    /// <summary>What is minimized among the candidates that meet.</summary>
    public SearchObjective Objective { get; init; } = SearchObjective.HighFrequencyGain;

    /// <summary>Largest number of candidates evaluated (the fuzzer sets a small cap).</summary>
    public int MaxCandidates { get; init; } = 4000;

    /// <summary>Relative margin with which every requirement must hold.</summary>
    public double RequirementMargin { get; init; } = DefaultRequirementMargin;

    /// <summary>Most threads the search uses (null: one per core). The answer does not depend on it.</summary>
    public int? MaxParallelism { get; init; }

    /// <summary>Free choices kept as given (stated by the user) rather than searched.</summary>
    public SearchPins Pinned { get; init; } = SearchPins.None;

    /// <summary>Number of runners-up reported beside the winner.</summary>
    public int RunnersUp { get; init; } = 5;
}
