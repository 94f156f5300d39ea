namespace CompAssist.Core.Targets;

/// <summary>
/// What a pure second-order system with the target pole would do for a unit step — a prediction, not a
/// measurement. Times in seconds.
/// </summary>
/// <param name="OvershootPercent">Percent overshoot.</param>
/// <param name="PeakTime">Time of the first peak, π/ωd.</param>
/// <param name="SettlingTime2Percent">Envelope estimate 4/σ for the ±2 % band.</param>
/// <param name="SettlingTime5Percent">Envelope estimate 3/σ for the ±5 % band.</param>
/// <param name="RiseTimeZeroToHundred">Time to first reach the final value, (π − arccos ζ)/ωd.</param>
public sealed record SecondOrderPrediction(
    double OvershootPercent,
    double PeakTime,
    double SettlingTime2Percent,
    double SettlingTime5Percent,
    double RiseTimeZeroToHundred);
