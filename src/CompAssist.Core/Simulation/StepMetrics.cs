namespace CompAssist.Core.Simulation;

/// <summary>
/// Measured step-response figures, all taken in the direction of the final value f (an inverting loop that
/// settles at −1 with a peak at −1.16 overshoots by 16 %). Definitions: overshoot = (peak − f)/|f|·100 %
/// where the peak is the largest excursion toward and beyond f (0 when the response never passes f); peak
/// time = when that peak occurs (+∞, shown as "none", when there is no overshoot); undershoot = the largest
/// excursion the wrong way, away from f (the initial dip of a right-half-plane zero), in % of |f|; rise time
/// = from the first 10 % to the first 90 % crossing of f; settling time = the last time |y − f| equals the
/// ±2 % (or ±5 %) band of |f| (+∞ when still outside at the horizon). Times in seconds.
/// </summary>
public sealed record StepMetrics
{
    /// <summary>The final value f.</summary>
    public required double FinalValue { get; init; }

    /// <summary>y at the peak (the largest excursion toward f).</summary>
    public required double PeakValue { get; init; }

    /// <summary>Overshoot in % of |f| (0 when none).</summary>
    public required double OvershootPercent { get; init; }

    /// <summary>Time of the overshoot peak; +∞ when the response does not overshoot.</summary>
    public required double PeakTime { get; init; }

    /// <summary>Undershoot (excursion away from f) in % of |f|; 0 when none.</summary>
    public required double UndershootPercent { get; init; }

    /// <summary>Time of the largest undershoot; +∞ when none.</summary>
    public required double UndershootTime { get; init; }

    /// <summary>10–90 % rise time; +∞ when 90 % is never reached.</summary>
    public required double RiseTime { get; init; }

    /// <summary>Last entry into the ±2 % band; +∞ when not settled at the horizon.</summary>
    public required double SettlingTime2Percent { get; init; }

    /// <summary>Last entry into the ±5 % band; +∞ when not settled at the horizon.</summary>
    public required double SettlingTime5Percent { get; init; }

    /// <summary>
    /// True when the response only grazes the ±2 % band edge (its last excursion out of the band, or its
    /// nearest approach after settling, is within 2 % of the band's width of the edge): the settling time then
    /// jumps by a period for a tiny change of the loop and should not be read to more than that.
    /// </summary>
    public bool Grazes2Percent { get; init; }

    /// <summary>As <see cref="Grazes2Percent"/> for the ±5 % band.</summary>
    public bool Grazes5Percent { get; init; }

    /// <summary>Simulated horizon, seconds.</summary>
    public required double Horizon { get; init; }

    /// <summary>Sample interval of the shown (uniformly sampled) response, seconds.</summary>
    public required double SampleTime { get; init; }

    /// <summary>Measures a response known only at its samples (a sampled loop) against a known final value.</summary>
    public static StepMetrics Measure(SampledResponse response, double finalValue)
    {
        ArgumentNullException.ThrowIfNull(response);
        var y = response.Values;
        var h = response.SampleTime;
        var s = finalValue < 0 ? -1.0 : 1.0;
        var f = Math.Abs(finalValue);
        int peakIndex = 0, lowIndex = 0;
        for (var k = 1; k < y.Length; k++)
        {
            if (s * y[k] > s * y[peakIndex])
            {
                peakIndex = k;
            }

            if (s * y[k] < s * y[lowIndex])
            {
                lowIndex = k;
            }
        }

        var over = f > 0 && (s * y[peakIndex]) > f ? 100.0 * ((s * y[peakIndex]) - f) / f : 0.0;
        var under = f > 0 && (s * y[lowIndex]) < 0 ? -100.0 * s * y[lowIndex] / f : 0.0;
        var rise = Crossing(response, 0.9 * finalValue) - Crossing(response, 0.1 * finalValue);
        return new StepMetrics
        {
            FinalValue = finalValue,
            PeakValue = y[peakIndex],
            OvershootPercent = over,
            PeakTime = over > 0 ? peakIndex * h : double.PositiveInfinity,
            UndershootPercent = under,
            UndershootTime = under > 0 ? lowIndex * h : double.PositiveInfinity,
            RiseTime = double.IsNaN(rise) ? double.PositiveInfinity : rise,
            SettlingTime2Percent = Settling(response, finalValue, 0.02),
            SettlingTime5Percent = Settling(response, finalValue, 0.05),
            Horizon = response.Horizon,
            SampleTime = h,
        };
    }

    private static double Crossing(SampledResponse r, double level)
    {
        var y = r.Values;
        var sign = Math.Sign(level);
        for (var k = 0; k < y.Length; k++)
        {
            if (sign * y[k] >= sign * level)
            {
                if (k == 0)
                {
                    return 0.0;
                }

                var f = (level - y[k - 1]) / (y[k] - y[k - 1]);
                return (k - 1 + f) * r.SampleTime;
            }
        }

        return double.NaN;
    }

    private static double Settling(SampledResponse r, double final, double band)
    {
        var y = r.Values;
        var tolerance = band * Math.Abs(final);
        if (Math.Abs(y[^1] - final) > tolerance)
        {
            return double.PositiveInfinity;
        }

        for (var k = y.Length - 1; k >= 1; k--)
        {
            if (Math.Abs(y[k - 1] - final) > tolerance)
            {
                // Interpolate where |y − final| returns inside the band between k−1 and k.
                var edge = y[k - 1] > final ? final + tolerance : final - tolerance;
                var f = (edge - y[k - 1]) / (y[k] - y[k - 1]);
                return (k - 1 + Math.Clamp(f, 0.0, 1.0)) * r.SampleTime;
            }
        }

        return 0.0;
    }
}
