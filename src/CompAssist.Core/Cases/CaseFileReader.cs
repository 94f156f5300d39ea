using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using System.Text.RegularExpressions;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using Tomlyn;
using Tomlyn.Model;

namespace CompAssist.Core.Cases;

/// <summary>
/// Reads case files. Schema (format 1), every key optional unless marked:
/// <code>
/// format = 1                       # required; the schema version
/// name = "..."                     # short scenario name
/// description = "..."
/// [loop]
/// plant = "10/(s(s+2))"            # required (here or on the command line)
/// feedback = "1"                   # sensor H(s)
/// sign = "negative"                # or "positive"
/// pade_order = 3                   # 1…10, for delays in root finding
/// [requirements]
/// overshoot_percent = 10           # percent
/// settling_time = 2.0              # seconds
/// settling_band = 2                # 2 or 5 (percent)
/// peak_time = 1.0                  # seconds
/// zeta = 0.5                       # with natural_frequency
/// natural_frequency = 4.0          # rad/s
/// target = [-2.0, 3.464]           # [re, im], overrides the region corner
/// kv = 20                          # or kp / ka, or step_error / ramp_error / parabola_error (one of them)
/// [compensator]
/// type = "lead"
/// placement = "bisector"           # beneath | bisector | cancel | fixed-zero | fixed-pole | ratio
/// zero = -3.0                      # fixed-zero location, or the plant pole to cancel
/// pole = -20.0                     # fixed-pole location
/// ratio = 10.0                     # pole/zero ratio
/// max_stage_angle_deg = 60         # per-stage lead limit
/// zero_fraction = 0.1              # lag/PI zero at this fraction of the target's real part
/// angle_budget_deg = 5             # largest angle the lag/PI may cost at the target
/// margin = 1.1                     # safety factor on the lag ratio
/// filter_ratio = 10                # PD/PID derivative filter pole at N times the zero (absent: ideal)
/// equal_factor = false             # lead-lag: gain fixed first by the error constant, one ratio for both
/// prefilter = false                # a reference prefilter cancelling the compensator zeros near the target
/// [check]
/// reference_step = 1.0             # size of the reference step for the actuator figures
/// actuator_limit = 12.0            # largest |u| the actuator delivers (or output_limits)
/// output_limits = [0.0, 100.0]     # lowest and highest absolute command (a heater: 0 … 100 %)
/// operating_point = 20.0           # the command u0 the plant model holds about (default 0)
/// vary = ["gain=20%", "pole=-5:10%"]   # robustness corners
/// </code>
/// Unknown keys are errors (a misspelt key must not be silently ignored).
/// </summary>
public static partial class CaseFileReader
{
    private static readonly Dictionary<string, string[]> KnownKeys = new()
    {
        [string.Empty] = ["format", "name", "description", "loop", "requirements", "compensator", "check"],
        ["loop"] = ["plant", "feedback", "sign", "pade_order"],
        ["requirements"] = ["overshoot_percent", "settling_time", "settling_band", "peak_time", "rise_time", "phase_margin_deg", "gain_margin_db", "delay_margin", "sensitivity_peak", "zeta", "natural_frequency", "target", "kp", "kv", "ka", "step_error", "ramp_error", "parabola_error"],
        ["compensator"] = ["type", "placement", "zero", "pole", "ratio", "max_stage_angle_deg", "zero_fraction", "angle_budget_deg", "margin", "filter_ratio", "equal_factor", "prefilter"],
        ["check"] = ["reference_step", "actuator_limit", "output_limits", "operating_point", "vary"],
    };

    /// <summary>Reads a case file from disk.</summary>
    public static (CaseFile? Case, CaseFileError? Error) ReadFile(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (string.IsNullOrWhiteSpace(path) || path.Contains('\0', StringComparison.Ordinal))
        {
            return (null, new CaseFileError(path, "The case file name is empty or not a usable path", "Give the path of a TOML case file."));
        }

        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (IOException e)
        {
            return (null, new CaseFileError(path, $"Cannot read the case file: {e.Message}", "Check the path."));
        }
        catch (UnauthorizedAccessException e)
        {
            return (null, new CaseFileError(path, $"Cannot read the case file: {e.Message}", "Check the file permissions."));
        }

        return Read(text, path);
    }

    /// <summary>Reads a case file from text; <paramref name="source"/> labels errors.</summary>
    public static (CaseFile? Case, CaseFileError? Error) Read(string text, string source)
    {
        ArgumentNullException.ThrowIfNull(text);
        TomlTable root;
        try
        {
            root = TomlSerializer.Deserialize<TomlTable>(text) ?? new TomlTable();
        }
        catch (TomlException e)
        {
            var m = PositionPattern().Match(e.Message);
            int? line = m.Success ? int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture) : null;
            int? column = m.Success ? int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture) : null;
            return (null, new CaseFileError(source, "TOML syntax error: " + e.Message, "Fix the TOML syntax at that position.", line, column));
        }

        // TOML forbids a key or a table given twice; the model above quietly keeps the last one, so the
        // validating syntax parse decides, with the line of the repeat.
        var syntax = Tomlyn.Parsing.SyntaxParser.Parse(text, source, true);
        if (syntax.HasErrors && syntax.Diagnostics.FirstOrDefault() is { } diagnostic)
        {
            var said = diagnostic.ToString();
            var m = PositionPattern().Match(said);
            var detail = said.Contains(" : error : ", StringComparison.Ordinal) ? said[(said.IndexOf(" : error : ", StringComparison.Ordinal) + 11)..] : said;
            return (null, new CaseFileError(
                source,
                detail.Replace('␤', ' '),
                "TOML allows each key and each table once: remove or merge the repeated one.",
                m.Success ? int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture) : null,
                m.Success ? int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture) : null));
        }

        var reader = new TableReader(source);
        var result = reader.Build(root);
        return reader.Error is null ? (result, null) : (null, reader.Error);
    }

    [GeneratedRegex(@"\((\d+),(\d+)\)")]
    private static partial Regex PositionPattern();

    private sealed class TableReader(string source)
    {
        public CaseFileError? Error { get; private set; }

        public CaseFile? Build(TomlTable root)
        {
            foreach (var (section, keys) in KnownKeys)
            {
                var table = section.Length == 0 ? root : Table(root, section);
                if (table is null)
                {
                    continue;
                }

                foreach (var key in table.Keys)
                {
                    if (!keys.Contains(key))
                    {
                        var where = section.Length == 0 ? "at the top level" : $"in [{section}]";
                        return Fail($"Unknown key '{key}' {where}", $"Known keys there: {string.Join(", ", keys)}.");
                    }
                }
            }

            if (!root.TryGetValue("format", out var formatValue))
            {
                return Fail("The case file has no 'format' key", $"Add 'format = {CaseFile.CurrentFormat}' at the top.");
            }

            if (formatValue is not long format)
            {
                return Fail("'format' must be a whole number", $"Write 'format = {CaseFile.CurrentFormat}'.");
            }

            if (format != CaseFile.CurrentFormat)
            {
                return Fail(
                    $"Case-file format {format} is not supported by this version (it reads format {CaseFile.CurrentFormat})",
                    format > CaseFile.CurrentFormat ? "Use a newer CompAssist." : "Re-create the case with this version.");
            }

            var loop = Table(root, "loop");
            var req = Table(root, "requirements");
            var comp = Table(root, "compensator");
            var check = Table(root, "check");
            if (Error is not null)
            {
                return null;
            }

            var sign = String(loop, "loop", "sign") ?? "negative";
            if (sign is not ("negative" or "positive"))
            {
                return Fail($"[loop] sign = \"{sign}\" is not a feedback sign", "Use \"negative\" or \"positive\".");
            }

            var band = Number(req, "requirements", "settling_band") ?? 2;
            if (band is not (2 or 5))
            {
                return Fail($"[requirements] settling_band = {band} is not supported", "Use 2 or 5 (percent).");
            }

            Complex? target = null;
            if (req is not null && req.TryGetValue("target", out var t))
            {
                if (t is TomlArray { Count: 2 } arr && ToDouble(arr[0]) is { } re && ToDouble(arr[1]) is { } im)
                {
                    target = new Complex(re, im);
                }
                else
                {
                    return Fail("[requirements] target must be [re, im]", "Write for example target = [-2.0, 3.46].");
                }
            }

            var constants = new (string Key, Func<double, ErrorRequirement> Make)[]
            {
                ("kp", v => new ErrorRequirement(ErrorConstantKind.Position, v)),
                ("kv", v => new ErrorRequirement(ErrorConstantKind.Velocity, v)),
                ("ka", v => new ErrorRequirement(ErrorConstantKind.Acceleration, v)),
                ("step_error", ErrorRequirement.FromStepError),
                ("ramp_error", ErrorRequirement.FromRampError),
                ("parabola_error", ErrorRequirement.FromParabolaError),
            };
            ErrorRequirement? constant = null;
            foreach (var (key, make) in constants)
            {
                if (Number(req, "requirements", key) is { } v)
                {
                    if (constant is not null)
                    {
                        return Fail("[requirements] gives more than one steady-state requirement", "Keep one of kp, kv, ka, step_error, ramp_error, parabola_error.");
                    }

                    if (!(v > 0) || (key == "step_error" && v >= 1))
                    {
                        return Fail($"[requirements] {key} = {v} is out of range", "Constants must be positive; a step error must be between 0 and 1.");
                    }

                    constant = make(v);
                }
            }

            var placementText = String(comp, "compensator", "placement") ?? "bisector";
            var placement = PlacementNames.TryParse(placementText);
            if (placement is null)
            {
                return Fail($"[compensator] placement = \"{placementText}\" is not a placement", $"Use one of: {string.Join(", ", PlacementNames.All)}.");
            }

            var variations = ImmutableArray.CreateBuilder<PlantVariation>();
            if (check is not null && check.TryGetValue("vary", out var varyValue))
            {
                if (varyValue is not TomlArray list || list.Any(x => x is not string))
                {
                    return Fail("[check] vary must be a list of strings", "Write for example vary = [\"gain=20%\", \"pole=-5:10%\"].");
                }

                foreach (var item in list.Cast<string>())
                {
                    var parsed = PlantVariation.Parse(item);
                    if (!parsed.IsSuccess)
                    {
                        return Fail($"[check] vary: {parsed.Problem.Message}", parsed.Problem.Hint);
                    }

                    variations.Add(parsed.Value);
                }
            }

            var referenceStep = Number(check, "check", "reference_step") ?? 1.0;
            var actuatorLimit = Number(check, "check", "actuator_limit");
            if (!(referenceStep > 0) || actuatorLimit is <= 0)
            {
                return Fail("[check] reference_step and actuator_limit must be positive", "Give positive numbers in the units of the reference and of the actuator command.");
            }

            CommandRange? outputLimits = null;
            if (check is not null && check.TryGetValue("output_limits", out var limitsValue))
            {
                if (limitsValue is TomlArray { Count: 2 } pair && ToDouble(pair[0]) is { } low && ToDouble(pair[1]) is { } high
                    && NumberRange.Contains(low) && NumberRange.Contains(high) && low < high)
                {
                    outputLimits = CommandRange.Create(low, high);
                }
                else
                {
                    return Fail("[check] output_limits must be [low, high] with low < high", "Write for example output_limits = [0.0, 100.0] (absolute actuator units).");
                }
            }

            if (outputLimits is not null && actuatorLimit is not null)
            {
                return Fail("[check] gives both actuator_limit and output_limits", "Keep one: actuator_limit for a limit on |u|, output_limits for [low, high].");
            }

            var operatingPoint = Number(check, "check", "operating_point") ?? 0.0;
            if (!NumberRange.Contains(operatingPoint))
            {
                return Fail("[check] operating_point is outside ±1e12 or below 1e-12 in magnitude", "Give the operating-point command in actuator units.");
            }

            var absolute = outputLimits ?? (actuatorLimit is { } symmetric ? CommandRange.Symmetric(symmetric) : null);
            if (absolute is not null && !absolute.Contains(operatingPoint))
            {
                return Fail($"[check] operating_point = {operatingPoint.ToString(CultureInfo.InvariantCulture)} lies outside the output limits {absolute.Low.ToString(CultureInfo.InvariantCulture)} … {absolute.High.ToString(CultureInfo.InvariantCulture)}", "The operating-point command must be one the actuator can deliver.");
            }

            var padeOrder = Number(loop, "loop", "pade_order") ?? 3;
            if (Error is not null)
            {
                return null;
            }

            return new CaseFile
            {
                Name = PrintableText.Of(String(root, string.Empty, "name") ?? string.Empty),
                Description = PrintableText.Of(String(root, string.Empty, "description") ?? string.Empty),
                Plant = String(loop, "loop", "plant"),
                Feedback = String(loop, "loop", "feedback") ?? "1",
                Sign = sign == "positive" ? FeedbackSign.Positive : FeedbackSign.Negative,
                PadeOrder = (int)padeOrder,
                Requirements = new Requirements
                {
                    MaxOvershootPercent = Number(req, "requirements", "overshoot_percent"),
                    MaxSettlingTime = Number(req, "requirements", "settling_time"),
                    Band = band == 5 ? SettlingBand.FivePercent : SettlingBand.TwoPercent,
                    MaxPeakTime = Number(req, "requirements", "peak_time"),
                    MaxRiseTime = Number(req, "requirements", "rise_time"),
                    MinPhaseMarginDegrees = Number(req, "requirements", "phase_margin_deg"),
                    MinGainMarginDb = Number(req, "requirements", "gain_margin_db"),
                    MinDelayMargin = Number(req, "requirements", "delay_margin"),
                    MaxSensitivityPeak = Number(req, "requirements", "sensitivity_peak"),
                    Zeta = Number(req, "requirements", "zeta"),
                    NaturalFrequency = Number(req, "requirements", "natural_frequency"),
                    Point = target,
                    Constant = constant,
                },
                CompensatorType = String(comp, "compensator", "type") ?? "lead",
                Lead = new LeadOptions
                {
                    Placement = placement.Value,
                    Zero = Number(comp, "compensator", "zero"),
                    Pole = Number(comp, "compensator", "pole"),
                    Ratio = Number(comp, "compensator", "ratio"),
                    MaxStageAngleDegrees = Number(comp, "compensator", "max_stage_angle_deg") ?? LeadOptions.DefaultMaxStageAngleDegrees,
                },
                Slow = new SlowPoleOptions
                {
                    ZeroFraction = Number(comp, "compensator", "zero_fraction") ?? 0.1,
                    AngleBudgetDegrees = Number(comp, "compensator", "angle_budget_deg") ?? 5.0,
                    Margin = Number(comp, "compensator", "margin") ?? 1.1,
                    FilterRatio = Number(comp, "compensator", "filter_ratio"),
                    EqualFactor = comp is not null && comp.TryGetValue("equal_factor", out var ef) && ef is true,
                },
                Prefilter = comp is not null && comp.TryGetValue("prefilter", out var pf) && pf is true,
                Check = new CheckOptions { ReferenceStep = referenceStep, ActuatorLimit = actuatorLimit, OutputLimits = outputLimits, OperatingPoint = operatingPoint },
                Variations = variations.ToImmutable(),
            } is var result && Error is null ? (RequirementRanges.Check(result.Requirements) is { } bad ? Fail($"[requirements] {bad.Message}", bad.Hint) : result) : null;
        }

        private TomlTable? Table(TomlTable root, string name)
        {
            if (!root.TryGetValue(name, out var value))
            {
                return null;
            }

            if (value is TomlTable table)
            {
                return table;
            }

            Fail($"'{name}' must be a table", $"Write it as a [{name}] section.");
            return null;
        }

        private string? String(TomlTable? table, string section, string key)
        {
            if (table is null || !table.TryGetValue(key, out var value))
            {
                return null;
            }

            if (value is string s)
            {
                return s;
            }

            Fail($"{Where(section, key)} must be a string", $"Put the value in double quotes, e.g. {key} = \"...\".");
            return null;
        }

        private double? Number(TomlTable? table, string section, string key)
        {
            if (table is null || !table.TryGetValue(key, out var value))
            {
                return null;
            }

            if (ToDouble(value) is { } d)
            {
                if (!NumberRange.Usable(d))
                {
                    Fail($"{Where(section, key)} is not a usable number (NaN, an infinity or below 1e-300 in magnitude)", "Give a finite number.");
                    return null;
                }

                return d;
            }

            Fail($"{Where(section, key)} must be a number", $"Write it without quotes, e.g. {key} = 2.5.");
            return null;
        }

        private static double? ToDouble(object? value) => value switch
        {
            long l => l,
            double d => d,
            _ => null,
        };

        private static string Where(string section, string key) => section.Length == 0 ? $"'{key}'" : $"[{section}] {key}";

        private CaseFile? Fail(string message, string hint)
        {
            Error ??= new CaseFileError(source, message, hint);
            return null;
        }
    }
}
