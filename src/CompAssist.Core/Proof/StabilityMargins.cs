namespace CompAssist.Core.Proof;

/// <summary>
/// Classical margins of the loop L = ±C·G·H (delays exact). Infinite values mean "no such crossover".
/// Frequencies in rad/s, delay margin in seconds.
/// </summary>
/// <param name="GainMarginDb">Smallest factor (dB) by which the loop gain may rise before instability, over every phase crossover with |L| &lt; 1.</param>
/// <param name="PhaseCrossover">Frequency of that phase crossover (∠L = −180°).</param>
/// <param name="GainReductionMarginDb">Smallest factor (dB) by which the gain may fall before instability (conditionally stable loops), over phase crossovers with |L| &gt; 1.</param>
/// <param name="PhaseMarginDeg">Smallest phase margin over every gain crossover (|L| = 1), degrees.</param>
/// <param name="GainCrossover">Frequency of that gain crossover.</param>
/// <param name="DelayMargin">Smallest extra loop delay that destabilizes, PM/ωc over the gain crossovers.</param>
/// <param name="SensitivityPeak">Ms = max |1/(1 + L(jω))|.</param>
/// <param name="SensitivityPeakFrequency">Where Ms occurs.</param>
public sealed record StabilityMargins(
    double GainMarginDb,
    double PhaseCrossover,
    double GainReductionMarginDb,
    double PhaseMarginDeg,
    double GainCrossover,
    double DelayMargin,
    double SensitivityPeak,
    double SensitivityPeakFrequency);
