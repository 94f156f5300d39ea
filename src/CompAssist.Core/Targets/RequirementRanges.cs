using CompAssist.Core.Common;

namespace CompAssist.Core.Targets;

/// <summary>
/// The value rules of the requirements (finite, and within their ranges), checked once at the input boundary so
/// that an unusable value is bad input, not a refused design.
/// </summary>
public static class RequirementRanges
{
    /// <summary>The first requirement outside its range, naming the setting (not a flag or a key); null when all are usable.</summary>
    public static Problem? Check(Requirements requirements)
    {
        ArgumentNullException.ThrowIfNull(requirements);
        (double? Value, Func<double, bool> Ok, string Setting, string Rule)[] rules =
        [
            (requirements.MaxOvershootPercent, x => x > 0 && x < 100, "the largest overshoot", "a percent overshoot between 0 and 100 (exclusive)"),
            (requirements.MaxSettlingTime, x => x > 0, "the largest settling time", "a time above 0 s"),
            (requirements.MaxPeakTime, x => x > 0, "the largest peak time", "a time above 0 s"),
            (requirements.Zeta, x => x > 0 && x < 1, "the damping ratio ζ of the target", "a ζ between 0 and 1 (exclusive): a dominant complex pair is underdamped"),
            (requirements.NaturalFrequency, x => x > 0, "the natural frequency ωn of the target", "ωn in rad/s, above 0"),
            (requirements.Point?.Real, x => x < 0, "the real part of the target pole", "a target in the left half-plane (a negative real part)"),
            (requirements.Point?.Imaginary, _ => true, "the imaginary part of the target pole", "a finite number"),
            (requirements.MaxRiseTime, x => x > 0, "the largest rise time", "a time above 0 s"),
            (requirements.MinPhaseMarginDegrees, x => x > 0 && x < 180, "the smallest phase margin", "an angle between 0° and 180°"),
            (requirements.MinGainMarginDb, x => x > 0 && x < 200, "the smallest gain margin", "a number of dB above 0"),
            (requirements.MinDelayMargin, x => x > 0, "the smallest delay margin", "a time above 0 s"),
            (requirements.MaxSensitivityPeak, x => x > 1 && x < 1e6, "the largest sensitivity peak", "a number above 1 (Ms is never below 1 for a loop that rolls off), e.g. 2 for 6 dB"),
        ];
        foreach (var (value, ok, setting, rule) in rules)
        {
            if (value is { } v && (!double.IsFinite(v) || !ok(v)))
            {
                var shown = double.IsNaN(v) ? "nan" : Model.TransferFunctionFormatter.Number(v, 6);
                return new Problem($"{char.ToUpperInvariant(setting[0])}{setting[1..]} is {shown}, which is not usable", $"Give {rule}.");
            }
        }

        return null;
    }
}
