namespace CompAssist.Core.Proof;

/// <summary>
/// One phase crossover of the loop L (∠L(jω) = −180° modulo 360°, L(jω) real and negative), including
/// ω = 0 and ω = ∞ when L is finite, real and negative there. Scaling the loop gain by
/// <see cref="GainFactor"/> puts a closed-loop root on the imaginary axis at ±j·<see cref="Frequency"/>.
/// </summary>
/// <param name="Frequency">ωp in rad/s (0 for DC, +∞ for the high-frequency limit of a biproper loop).</param>
/// <param name="Magnitude">|L(jωp)|.</param>
public sealed record PhaseCrossing(double Frequency, double Magnitude)
{
    /// <summary>1/|L(jωp)|: above 1 the gain may rise by this factor, below 1 it may fall to it.</summary>
    public double GainFactor => 1.0 / Magnitude;

    /// <summary>−20·log10|L(jωp)| in dB: positive for an upward margin, negative for a downward one.</summary>
    public double GainFactorDb => -20.0 * Math.Log10(Magnitude);
}
