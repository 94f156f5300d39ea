using CompAssist.Core.Common;

namespace CompAssist.Core.Targets;

/// <summary>The value rules of the requirements checked on the simulated loop (finite, and within their ranges).</summary>
public static class RequirementRanges
{
    /// <summary>The first requirement outside its range, naming the setting (not a flag or a key); null when all are usable.</summary>
    public static Problem? Check(Requirements requirements)
    {
        ArgumentNullException.ThrowIfNull(requirements);
        (double? Value, Func<double, bool> Ok, string Setting, string Rule)[] rules =
        [
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
                return new Problem($"{char.ToUpperInvariant(setting[0])}{setting[1..]} is {v}, which is not usable", $"Give {rule}.");
            }
        }

        return null;
    }
}
