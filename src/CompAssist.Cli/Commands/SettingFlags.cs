using CompAssist.Core.Common;

namespace CompAssist.Cli.Commands;

/// <summary>Where each setting is given on the command line: the CLI's half of the typed-setting boundary.</summary>
internal static class SettingFlags
{
    private static readonly (Setting Setting, string Flag)[] Table =
    [
        (Setting.Plant, "--plant \"EXPR\""),
        (Setting.Compensator, "--compensator \"EXPR\""),
        (Setting.Target, "--target RE,IM"),
        (Setting.DampingAndNaturalFrequency, "--zeta Z --wn W"),
        (Setting.SteadyState, "--kp, --kv, --ka, --step-error, --ramp-error or --parabola-error"),
        (Setting.LeadZero, "--zero X"),
        (Setting.LeadPole, "--pole X"),
        (Setting.LeadRatio, "--ratio R"),
        (Setting.ZeroFraction, "--zero-fraction F"),
        (Setting.FilterRatio, "--filter-ratio N"),
        (Setting.SampleTime, "--sample-time T"),
        (Setting.PrewarpFrequency, "--prewarp-frequency W"),
        (Setting.SignalFractionBits, "--signal-fraction-bits B"),
        (Setting.ActuatorLimit, "--actuator-limit U"),
    ];

    /// <summary>The flag (with its value placeholder) that gives a setting.</summary>
    public static string Of(Setting setting) => Table.First(t => t.Setting == setting).Flag;

    /// <summary>The hint as the command line prints it: the core's words and, where a setting is named, its flag.</summary>
    public static string Hint(Problem problem) =>
        problem.About is { } about ? $"{problem.Hint} (on the command line: {Of(about)})" : problem.Hint;
}
