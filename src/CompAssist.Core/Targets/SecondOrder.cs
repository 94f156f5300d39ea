namespace CompAssist.Core.Targets;

/// <summary>
/// Standard relations of the underdamped second-order step response ωn²/(s² + 2ζωn s + ωn²) (common practice;
/// e.g. Ogata, Modern Control Engineering, 5th ed., section 5-3). σ = ζωn is the decay rate, ωd = ωn√(1−ζ²)
/// the damped frequency; times in seconds, frequencies in rad/s.
/// </summary>
public static class SecondOrder
{
    /// <summary>Percent overshoot 100·exp(−ζπ/√(1−ζ²)); 0 for ζ ≥ 1.</summary>
    public static double OvershootPercent(double zeta)
    {
        if (zeta >= 1.0)
        {
            return 0.0;
        }

        return 100.0 * Math.Exp(-zeta * Math.PI / Math.Sqrt(1.0 - (zeta * zeta)));
    }

    /// <summary>
    /// Damping ratio for a percent overshoot: ζ = −ln(OS)/√(π² + ln²(OS)), OS as a fraction, 0 &lt; OS &lt; 100 %.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The overshoot is not in (0, 100).</exception>
    public static double DampingFromOvershoot(double overshootPercent)
    {
        if (!(overshootPercent > 0.0 && overshootPercent < 100.0))
        {
            throw new ArgumentOutOfRangeException(nameof(overshootPercent), overshootPercent, "Overshoot must be between 0 and 100 percent.");
        }

        var l = Math.Log(overshootPercent / 100.0);
        return -l / Math.Sqrt((Math.PI * Math.PI) + (l * l));
    }

    /// <summary>Envelope settling-time estimate: 4/σ (2 % band) or 3/σ (5 % band).</summary>
    public static double SettlingTime(double sigma, SettlingBand band) => BandFactor(band) / sigma;

    /// <summary>σ = ζωn that meets a settling time: 4/ts (2 %) or 3/ts (5 %).</summary>
    public static double SigmaFromSettlingTime(double settlingTime, SettlingBand band) => BandFactor(band) / settlingTime;

    /// <summary>Peak time π/ωd.</summary>
    public static double PeakTime(double dampedFrequency) => Math.PI / dampedFrequency;

    /// <summary>ωd that gives a peak time: π/tp.</summary>
    public static double DampedFrequencyFromPeakTime(double peakTime) => Math.PI / peakTime;

    /// <summary>Rise time from 0 to 100 % of the final value: (π − arccos ζ)/ωd (underdamped only).</summary>
    public static double RiseTimeZeroToHundred(double zeta, double dampedFrequency) => (Math.PI - Math.Acos(zeta)) / dampedFrequency;

    /// <summary>The numerator of the envelope settling estimate: ln(1/0.02) ≈ 4 rounded, or ln(1/0.05) ≈ 3.</summary>
    public static double BandFactor(SettlingBand band) => band switch
    {
        SettlingBand.TwoPercent => 4.0,
        SettlingBand.FivePercent => 3.0,
        _ => throw new ArgumentOutOfRangeException(nameof(band), band, "Unknown settling band."),
    };
}
