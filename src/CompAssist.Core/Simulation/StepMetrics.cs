namespace CompAssist.Core.Simulation;

/// <summary>
/// Measured step-response figures. Definitions: overshoot = (peak − final)/|final|·100 % (0 when the
/// response never exceeds its final value); peak time = time of the largest value; rise time = from 10 %
/// to 90 % of the final value (first crossings, interpolated); settling time = the last time the response
/// is outside ±2 % (or ±5 %) of the final value (interpolated; infinite if still outside at the horizon).
/// Times in seconds.
/// </summary>
public sealed record StepMetrics(
    double FinalValue,
    double PeakValue,
    double OvershootPercent,
    double PeakTime,
    double RiseTime,
    double SettlingTime2Percent,
    double SettlingTime5Percent,
    double Horizon,
    double SampleTime)
{
    /// <summary>Measures a sampled step response against a known final value.</summary>
    public static StepMetrics Measure(SampledResponse response, double finalValue)
    {
        ArgumentNullException.ThrowIfNull(response);
        var y = response.Values;
        var h = response.SampleTime;
        var peakIndex = 0;
        for (var k = 1; k < y.Length; k++)
        {
            if (Math.Sign(finalValue) * y[k] > Math.Sign(finalValue) * y[peakIndex])
            {
                peakIndex = k;
            }
        }

        var peak = y[peakIndex];
        var overshoot = finalValue != 0 && (peak - finalValue) / finalValue > 0 ? 100.0 * (peak - finalValue) / Math.Abs(finalValue) : 0.0;
        var rise = Crossing(response, 0.9 * finalValue) - Crossing(response, 0.1 * finalValue);
        return new StepMetrics(
            finalValue,
            peak,
            overshoot,
            peakIndex * h,
            double.IsNaN(rise) ? double.PositiveInfinity : rise,
            Settling(response, finalValue, 0.02),
            Settling(response, finalValue, 0.05),
            response.Horizon,
            h);
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
