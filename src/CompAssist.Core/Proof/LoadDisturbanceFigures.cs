using CompAssist.Core.Simulation;

namespace CompAssist.Core.Proof;

/// <summary>
/// The response of the output to a unit step of load at the plant input (actuator units; y = G/(1 ± C·G·H)·d),
/// the reference held at 0: the largest deviation and when it occurs, the offset it leaves, and the time after
/// which the output stays within the settling band (2 % or 5 %) of the largest deviation about that offset.
/// Sampled at 2,000 intervals over the step's horizon; delays by their Padé approximant.
/// </summary>
/// <param name="Peak">The largest |y|, output units per unit load.</param>
/// <param name="PeakTime">When it occurs, seconds.</param>
/// <param name="Offset">y(∞): 0 with integral action in C, else the load's steady-state effect.</param>
/// <param name="RecoveryTime">Seconds until |y − y(∞)| stays within the band times <see cref="Peak"/> (+∞ when not within the horizon).</param>
public sealed record LoadDisturbanceFigures(double Peak, double PeakTime, double Offset, double RecoveryTime)
{
    /// <summary>The figures of a sampled load response with its exact final value.</summary>
    public static LoadDisturbanceFigures Of(SampledResponse response, double offset, double band)
    {
        ArgumentNullException.ThrowIfNull(response);
        var y = response.Values;
        var peakIndex = 0;
        for (var k = 1; k < y.Length; k++)
        {
            if (Math.Abs(y[k]) > Math.Abs(y[peakIndex]))
            {
                peakIndex = k;
            }
        }

        var peak = Math.Abs(y[peakIndex]);
        var tolerance = band * peak;
        var recovery = 0.0;
        for (var k = y.Length - 1; k >= 0; k--)
        {
            if (Math.Abs(y[k] - offset) > tolerance)
            {
                recovery = k == y.Length - 1 ? double.PositiveInfinity : response.TimeAt(k + 1);
                break;
            }
        }

        return new LoadDisturbanceFigures(peak, response.TimeAt(peakIndex), offset, recovery);
    }
}
