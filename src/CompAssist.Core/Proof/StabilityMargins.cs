using System.Collections.Immutable;

namespace CompAssist.Core.Proof;

/// <summary>
/// Classical margins of a stable loop L = ±C·G·H (delays exact), over every crossover. An infinite value
/// means "no crossover of that kind exists". Frequencies in rad/s, angles in degrees, delays in seconds,
/// gain margins in dB (always as a positive number of dB, upward and downward apart).
/// </summary>
public sealed record StabilityMargins
{
    /// <summary>Every gain crossover (|L| = 1), in increasing frequency.</summary>
    public required ImmutableArray<GainCrossing> GainCrossings { get; init; }

    /// <summary>Every phase crossover (L real and negative), in increasing frequency, ω = 0 and ω = ∞ included when they are ones.</summary>
    public required ImmutableArray<PhaseCrossing> PhaseCrossings { get; init; }

    /// <summary>
    /// The factor (dB) by which the loop gain may rise before a closed-loop root reaches the imaginary axis:
    /// the smallest 1/|L| over phase crossovers with |L| &lt; 1; +∞ when there is none.
    /// </summary>
    public required double GainMarginDb { get; init; }

    /// <summary>Frequency of the phase crossover that sets <see cref="GainMarginDb"/> (NaN when none).</summary>
    public required double PhaseCrossover { get; init; }

    /// <summary>
    /// The factor (dB) by which the loop gain may fall before a closed-loop root reaches the imaginary axis:
    /// the smallest |L| over phase crossovers with |L| &gt; 1 (ω = 0 included); +∞ when there is none.
    /// </summary>
    public required double GainReductionMarginDb { get; init; }

    /// <summary>Frequency of the phase crossover that sets <see cref="GainReductionMarginDb"/> (NaN when none).</summary>
    public required double GainReductionCrossover { get; init; }

    /// <summary>The phase margin: the smallest angular distance from L(jωc) to −1 over every gain crossover; +∞ when |L| never crosses 1.</summary>
    public required double PhaseMarginDeg { get; init; }

    /// <summary>The gain crossover of <see cref="PhaseMarginDeg"/> (NaN when none).</summary>
    public required double GainCrossover { get; init; }

    /// <summary>The smallest extra loop delay that puts a closed-loop root on the imaginary axis, over every gain crossover; +∞ when none.</summary>
    public required double DelayMargin { get; init; }

    /// <summary>The gain crossover of <see cref="DelayMargin"/> (NaN when none).</summary>
    public required double DelayMarginCrossover { get; init; }

    /// <summary>Ms = max |1/(1 + L(jω))|.</summary>
    public required double SensitivityPeak { get; init; }

    /// <summary>Where Ms occurs.</summary>
    public required double SensitivityPeakFrequency { get; init; }

    /// <summary>
    /// The largest self-check residual: for each phase crossover, |1 + k·L(jωp)| / (1 + |k·L(jωp)|) with k its
    /// gain factor, and for each gain crossover the same with the delay margin's extra lag applied. Small
    /// (≤ 1e-6) when every reported margin really puts a closed-loop root on the imaginary axis.
    /// </summary>
    public required double SelfCheckResidual { get; init; }
}
