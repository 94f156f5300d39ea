using System.CommandLine;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Targets;

namespace CompAssist.Cli.Commands;

/// <summary>
/// Options shared by every command that works on a loop: the case file, the loop itself, requirements and
/// proof settings. <see cref="Apply"/> lays them over the case file (flags win).
/// </summary>
internal sealed class LoopSettings
{
    public Argument<string?> Case { get; } = new("case") { Description = "Case file (TOML) to start from; flags override it.", Arity = ArgumentArity.ZeroOrOne };

    public Option<string?> Plant { get; } = new("--plant") { Description = "Plant G(s), e.g. \"10/(s(s+2)(s+10))\"." };

    public Option<string?> Feedback { get; } = new("--feedback") { Description = "Feedback path H(s) (default 1)." };

    public Option<bool> PositiveFeedback { get; } = new("--positive-feedback") { Description = "Positive feedback (0° angle condition)." };

    public WholeOption PadeOrder { get; } = new("--pade-order") { Description = "Padé order for delays in root finding (default 3)." };

    public Option<string?> Target { get; } = new("--target") { Description = "Target pole RE,IM, e.g. --target=-2,3.46." };

    public RealOption Zeta { get; } = new("--zeta") { Description = "Damping ratio ζ of the target (with --wn)." };

    public RealOption Wn { get; } = new("--wn") { Description = "Natural frequency ωn of the target, rad/s (with --zeta)." };

    public RealOption Overshoot { get; } = new("--overshoot") { Description = "Largest percent overshoot." };

    public RealOption Settling { get; } = new("--settling") { Description = "Largest settling time, s." };

    public WholeOption Band { get; } = new("--band") { Description = "Settling band in percent: 2 (default) or 5." };

    public RealOption PeakTime { get; } = new("--peak-time") { Description = "Largest peak time, s." };

    public RealOption RiseTime { get; } = new("--rise-time") { Description = "Largest 10-90 % rise time, s (checked on the simulated loop)." };

    public RealOption MinPhaseMargin { get; } = new("--min-phase-margin") { Description = "Smallest phase margin, degrees." };

    public RealOption MinGainMargin { get; } = new("--min-gain-margin") { Description = "Smallest gain margin, dB (upward, and downward where the loop has one)." };

    public RealOption MinDelayMargin { get; } = new("--min-delay-margin") { Description = "Smallest delay margin, s." };

    public RealOption MaxSensitivity { get; } = new("--max-sensitivity") { Description = "Largest sensitivity peak Ms, e.g. 2 (6 dB)." };

    public RealOption Kp { get; } = new("--kp") { Description = "Smallest acceptable position constant Kp." };

    public RealOption Kv { get; } = new("--kv") { Description = "Smallest acceptable velocity constant Kv (1/s)." };

    public RealOption Ka { get; } = new("--ka") { Description = "Smallest acceptable acceleration constant Ka (1/s²)." };

    public RealOption StepError { get; } = new("--step-error") { Description = "Largest steady-state error for a unit step (0…1)." };

    public RealOption RampError { get; } = new("--ramp-error") { Description = "Largest steady-state error for a unit ramp." };

    public RealOption ParabolaError { get; } = new("--parabola-error") { Description = "Largest steady-state error for a unit parabola." };

    public RealOption ActuatorLimit { get; } = new("--actuator-limit") { Description = "Largest actuator command |u| the hardware delivers." };

    public RangeOption OutputLimits { get; } = new("--output-limits") { Description = "Lowest and highest absolute actuator command LOW,HIGH (a heater: 0,100); instead of --actuator-limit." };

    public RealOption OperatingPoint { get; } = new("--operating-point") { Description = "The command u0 the plant model holds about, in absolute actuator units (default 0)." };

    public RealOption ReferenceStep { get; } = new("--reference-step") { Description = "Reference step size for the actuator figures (default 1)." };

    public Option<string[]> Vary { get; } = new("--vary") { Description = "Plant variation for the robustness sweep, repeatable: gain=20% or pole=-2:10%.", AllowMultipleArgumentsPerToken = false };

    public Option<bool> Json { get; } = new("--json") { Description = "Machine-readable JSON on stdout." };

    public Option<bool> Ascii { get; } = new("--ascii") { Description = "Draw pictures with plain ASCII instead of Unicode." };

    public IEnumerable<Option> Options =>
    [
        Plant, Feedback, PositiveFeedback, PadeOrder, Target, Zeta, Wn, Overshoot, Settling, Band, PeakTime,
        RiseTime, MinPhaseMargin, MinGainMargin, MinDelayMargin, MaxSensitivity,
        Kp, Kv, Ka, StepError, RampError, ParabolaError,
        ActuatorLimit, OutputLimits, OperatingPoint, ReferenceStep, Vary, Json, Ascii,
    ];

    public Core.Pictures.PictureStyle Style(ParseResult parse) => parse.GetValue(Ascii) ? Core.Pictures.PictureStyle.Ascii : Core.Pictures.PictureStyle.Unicode;

    public void AddTo(Command command)
    {
        command.Arguments.Add(Case);
        foreach (var option in Options)
        {
            command.Options.Add(option);
        }
    }

    /// <summary>Loads the case (if any) and lays the flags over it; writes the error and returns null on bad input.</summary>
    public CaseFile? Apply(ParseResult parse, TextWriter stderr, out int exitCode)
    {
        exitCode = CliApplication.Success;
        var casePath = parse.GetValue(Case);
        if (casePath is not null && casePath.StartsWith('-'))
        {
            stderr.WriteLine($"error: unknown option '{casePath}'. Run with --help for the options.");
            exitCode = CliApplication.UsageError;
            return null;
        }

        var baseCase = new CaseFile();
        if (casePath is not null)
        {
            var (loaded, error) = CaseFileReader.ReadFile(casePath);
            if (error is not null)
            {
                stderr.WriteLine($"error: {error}");
                exitCode = CliApplication.InputError;
                return null;
            }

            baseCase = loaded!;
        }

        var requirements = OverlayRequirements(parse, baseCase.Requirements, stderr);
        var variations = baseCase.Variations;
        var varyTexts = parse.GetValue(Vary) ?? [];
        if (varyTexts.Length > 0)
        {
            var list = new List<PlantVariation>();
            foreach (var text in varyTexts)
            {
                var parsed = PlantVariation.Parse(text);
                if (!parsed.IsSuccess)
                {
                    stderr.WriteLine($"error: --vary {parsed.Problem.Message}. {parsed.Problem.Hint}");
                    exitCode = CliApplication.InputError;
                    return null;
                }

                list.Add(parsed.Value);
            }

            variations = [.. list];
        }

        var givenLimit = parse.GetValue(ActuatorLimit);
        var givenRange = parse.GetValue(OutputLimits);
        var actuatorLimit = givenRange is null ? givenLimit ?? baseCase.Check.ActuatorLimit : givenLimit;
        var outputLimits = givenLimit is null ? givenRange ?? baseCase.Check.OutputLimits : givenRange;
        var operatingPoint = parse.GetValue(OperatingPoint) ?? baseCase.Check.OperatingPoint;
        var referenceStep = parse.GetValue(ReferenceStep) ?? baseCase.Check.ReferenceStep;
        if (actuatorLimit is <= 0 || !(referenceStep > 0))
        {
            stderr.WriteLine("error: --actuator-limit and --reference-step must be positive.");
            requirements = null;
        }
        else if (actuatorLimit is not null && outputLimits is not null)
        {
            stderr.WriteLine("error: --actuator-limit and --output-limits both given; keep one (a limit on |u|, or LOW,HIGH).");
            requirements = null;
        }
        else if ((outputLimits ?? (actuatorLimit is { } l ? CommandRange.Symmetric(l) : null)) is { } absolute && !absolute.Contains(operatingPoint))
        {
            stderr.WriteLine($"error: --operating-point {operatingPoint.ToString(CultureInfo.InvariantCulture)} lies outside the output limits {absolute.Low.ToString(CultureInfo.InvariantCulture)} … {absolute.High.ToString(CultureInfo.InvariantCulture)}.");
            requirements = null;
        }
        else if (!Core.Common.NumberRange.Contains(operatingPoint))
        {
            stderr.WriteLine("error: --operating-point is outside ±1e12 or below 1e-12 in magnitude.");
            requirements = null;
        }

        if (requirements is null)
        {
            exitCode = CliApplication.InputError;
            return null;
        }

        return baseCase with
        {
            Plant = parse.GetValue(Plant) ?? baseCase.Plant,
            Feedback = parse.GetValue(Feedback) ?? baseCase.Feedback,
            Sign = parse.GetValue(PositiveFeedback) ? FeedbackSign.Positive : baseCase.Sign,
            PadeOrder = parse.GetValue(PadeOrder) ?? baseCase.PadeOrder,
            Requirements = requirements,
            Check = baseCase.Check with { ActuatorLimit = actuatorLimit, OutputLimits = outputLimits, OperatingPoint = operatingPoint, ReferenceStep = referenceStep },
            Variations = variations,
        };
    }

    /// <summary>
    /// Flags that choose a target replace the case's way of choosing one: --target replaces the point,
    /// --zeta/--wn replace the point, requirement flags replace the point and ζ/ωn.
    /// </summary>
    private Requirements? OverlayRequirements(ParseResult parse, Requirements baseline, TextWriter stderr)
    {
        var result = baseline;
        var band = parse.GetValue(Band);
        if (band is not null && band is not (2 or 5))
        {
            stderr.WriteLine($"error: --band {band} is not supported. Use 2 or 5 (percent).");
            return null;
        }

        if (band is { } b)
        {
            result = result with { Band = b == 5 ? SettlingBand.FivePercent : SettlingBand.TwoPercent };
        }

        var overshoot = parse.GetValue(Overshoot);
        var settling = parse.GetValue(Settling);
        var peak = parse.GetValue(PeakTime);
        if (overshoot is not null || settling is not null || peak is not null)
        {
            result = result with
            {
                Point = null,
                Zeta = null,
                NaturalFrequency = null,
                MaxOvershootPercent = overshoot ?? result.MaxOvershootPercent,
                MaxSettlingTime = settling ?? result.MaxSettlingTime,
                MaxPeakTime = peak ?? result.MaxPeakTime,
            };
        }

        result = result with
        {
            MaxRiseTime = parse.GetValue(RiseTime) ?? result.MaxRiseTime,
            MinPhaseMarginDegrees = parse.GetValue(MinPhaseMargin) ?? result.MinPhaseMarginDegrees,
            MinGainMarginDb = parse.GetValue(MinGainMargin) ?? result.MinGainMarginDb,
            MinDelayMargin = parse.GetValue(MinDelayMargin) ?? result.MinDelayMargin,
            MaxSensitivityPeak = parse.GetValue(MaxSensitivity) ?? result.MaxSensitivityPeak,
        };

        var zeta = parse.GetValue(Zeta);
        var wn = parse.GetValue(Wn);
        if (zeta is not null || wn is not null)
        {
            result = result with { Point = null, Zeta = zeta ?? result.Zeta, NaturalFrequency = wn ?? result.NaturalFrequency };
        }

        var constants = new (double? Value, string Flag, Func<double, ErrorRequirement> Make)[]
        {
            (parse.GetValue(Kp), "--kp", v => new ErrorRequirement(ErrorConstantKind.Position, v)),
            (parse.GetValue(Kv), "--kv", v => new ErrorRequirement(ErrorConstantKind.Velocity, v)),
            (parse.GetValue(Ka), "--ka", v => new ErrorRequirement(ErrorConstantKind.Acceleration, v)),
            (parse.GetValue(StepError), "--step-error", ErrorRequirement.FromStepError),
            (parse.GetValue(RampError), "--ramp-error", ErrorRequirement.FromRampError),
            (parse.GetValue(ParabolaError), "--parabola-error", ErrorRequirement.FromParabolaError),
        };
        var given = constants.Where(c => c.Value is not null).ToList();
        if (given.Count > 1)
        {
            stderr.WriteLine($"error: {string.Join(" and ", given.Select(g => g.Flag))} both set a steady-state requirement. Give one.");
            return null;
        }

        if (given.Count == 1)
        {
            var (value, flag, make) = given[0];
            if (!(value > 0) || (flag == "--step-error" && value >= 1))
            {
                stderr.WriteLine($"error: {flag} {value} is out of range. Constants must be positive; a step error must be between 0 and 1.");
                return null;
            }

            result = result with { Constant = make(value!.Value) };
        }

        if (parse.GetValue(Target) is { } targetText)
        {
            if (ParsePoint(targetText) is not { } point)
            {
                stderr.WriteLine($"error: --target '{targetText}' is not a point. Write RE,IM, for example --target=-2,3.46.");
                return null;
            }

            result = result with { Point = point };
        }

        if (RequirementRanges.Check(result) is { } outOfRange)
        {
            stderr.WriteLine($"error: {outOfRange.Message}.");
            stderr.WriteLine($"hint: {outOfRange.Hint}");
            return null;
        }

        return result;
    }

    /// <summary>Parses "RE,IM" (also "RE, IM" or "RE IM").</summary>
    public static Complex? ParsePoint(string text)
    {
        var parts = text.Split([',', ' ', ';'], StringSplitOptions.RemoveEmptyEntries);
        if (parts.Length != 2)
        {
            return null;
        }

        if (double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out var re)
            && double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var im)
            && double.IsFinite(re) && double.IsFinite(im))
        {
            return new Complex(re, im);
        }

        return null;
    }
}
