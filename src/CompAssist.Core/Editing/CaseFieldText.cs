using System.Collections.Immutable;
using System.Globalization;
using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Editing;

/// <summary>
/// The text form of each <see cref="CaseField"/>: what a front end shows in the field, and how typed text
/// becomes a new case or a positioned error. Numbers are invariant (a dot for decimals); an empty optional
/// field clears the value.
/// </summary>
public static class CaseFieldText
{
    /// <summary>Fields that define the requirement corner: editing one puts the target back at the corner.</summary>
    public static ImmutableArray<CaseField> CornerFields { get; } =
        [CaseField.Overshoot, CaseField.SettlingTime, CaseField.Band, CaseField.PeakTime, CaseField.Zeta, CaseField.NaturalFrequency];

    /// <summary>The text shown for a field.</summary>
    public static string Of(CaseFile c, CaseField field)
    {
        ArgumentNullException.ThrowIfNull(c);
        var r = c.Requirements;
        return field switch
        {
            CaseField.Plant => c.Plant ?? string.Empty,
            CaseField.Feedback => c.Feedback,
            CaseField.Sign => c.Sign == FeedbackSign.Negative ? "-" : "+",
            CaseField.PadeOrder => c.PadeOrder.ToString(CultureInfo.InvariantCulture),
            CaseField.Overshoot => N(r.MaxOvershootPercent),
            CaseField.SettlingTime => N(r.MaxSettlingTime),
            CaseField.Band => ((int)r.Band).ToString(CultureInfo.InvariantCulture),
            CaseField.PeakTime => N(r.MaxPeakTime),
            CaseField.Zeta => N(r.Zeta),
            CaseField.NaturalFrequency => N(r.NaturalFrequency),
            CaseField.ErrorConstant => r.Constant is { } e ? $"{e.Symbol.ToLowerInvariant()}={N(e.Value)}" : string.Empty,
            CaseField.ActuatorLimit => c.Check.OutputLimits is { } range ? $"{N(range.Low)},{N(range.High)}" : N(c.Check.ActuatorLimit),
            CaseField.Variations => string.Join(", ", c.Variations.Select(VariationText)),
            CaseField.PlacementValue => N(PlacementValue(c.Lead)),
            CaseField.RiseTime => N(r.MaxRiseTime),
            CaseField.MinPhaseMargin => N(r.MinPhaseMarginDegrees),
            CaseField.MinGainMargin => N(r.MinGainMarginDb),
            CaseField.MinDelayMargin => N(r.MinDelayMargin),
            CaseField.MaxSensitivity => N(r.MaxSensitivityPeak),
            _ => throw new ArgumentOutOfRangeException(nameof(field), field, null),
        };
    }

    /// <summary>What the placement value means for the case's placement, or null when the placement takes none.</summary>
    public static string? PlacementValueMeaning(LeadPlacement placement) => placement switch
    {
        LeadPlacement.FixedZero => "zero at",
        LeadPlacement.FixedPole => "pole at",
        LeadPlacement.Ratio => "pole/zero",
        LeadPlacement.Cancel => "cancel pole",
        _ => null,
    };

    /// <summary>Reads typed text into the case, or says where it is wrong.</summary>
    public static FieldEdit Apply(CaseFile c, CaseField field, string text)
    {
        ArgumentNullException.ThrowIfNull(c);
        ArgumentNullException.ThrowIfNull(text);
        var r = c.Requirements;
        switch (field)
        {
            case CaseField.Plant:
            case CaseField.Feedback:
                {
                    var parsed = ExpressionParser.ParseProper(text);
                    if (!parsed.IsSuccess)
                    {
                        return FieldEdit.Rejected(parsed.Error);
                    }

                    return FieldEdit.Accepted(field == CaseField.Plant ? c with { Plant = text.Trim() } : c with { Feedback = text.Trim() });
                }

            case CaseField.Sign:
                return text.Trim().ToLowerInvariant() switch
                {
                    "-" or "negative" or "neg" => FieldEdit.Accepted(c with { Sign = FeedbackSign.Negative }),
                    "+" or "positive" or "pos" => FieldEdit.Accepted(c with { Sign = FeedbackSign.Positive }),
                    _ => FieldEdit.Rejected(Whole(text, "The feedback sign must be - or +", "Type - for negative feedback (the usual case) or + for positive feedback.")),
                };

            case CaseField.PadeOrder:
                if (!int.TryParse(text.Trim(), NumberStyles.Integer, CultureInfo.InvariantCulture, out var order) || order < 1 || order > PadeApproximation.MaxOrder)
                {
                    return FieldEdit.Rejected(Whole(text, $"The Padé order must be a whole number from 1 to {PadeApproximation.MaxOrder}", "3 is usual; raise it for long delays."));
                }

                return FieldEdit.Accepted(c with { PadeOrder = order });

            case CaseField.Band:
                return text.Trim() switch
                {
                    "2" => FieldEdit.Accepted(c with { Requirements = r with { Band = SettlingBand.TwoPercent } }),
                    "5" => FieldEdit.Accepted(c with { Requirements = r with { Band = SettlingBand.FivePercent } }),
                    _ => FieldEdit.Rejected(Whole(text, "The settling band must be 2 or 5 (percent)", "Type 2 for the 2 % band or 5 for the 5 % band.")),
                };

            case CaseField.Overshoot:
                return Requirement(text, "an overshoot between 0 and 100 percent", v => r with { MaxOvershootPercent = v }, c);
            case CaseField.SettlingTime:
                return Requirement(text, "a settling time above 0 s", v => r with { MaxSettlingTime = v }, c);
            case CaseField.PeakTime:
                return Requirement(text, "a peak time above 0 s", v => r with { MaxPeakTime = v }, c);
            case CaseField.Zeta:
                return Requirement(text, "a damping ratio between 0 and 1", v => r with { Zeta = v }, c);
            case CaseField.NaturalFrequency:
                return Requirement(text, "a natural frequency above 0 rad/s", v => r with { NaturalFrequency = v }, c);
            case CaseField.RiseTime:
                return Requirement(text, "a rise time above 0 s", v => r with { MaxRiseTime = v }, c);
            case CaseField.MinPhaseMargin:
                return Requirement(text, "a phase margin between 0° and 180°", v => r with { MinPhaseMarginDegrees = v }, c);
            case CaseField.MinGainMargin:
                return Requirement(text, "a gain margin in dB above 0", v => r with { MinGainMarginDb = v }, c);
            case CaseField.MinDelayMargin:
                return Requirement(text, "a delay margin above 0 s", v => r with { MinDelayMargin = v }, c);
            case CaseField.MaxSensitivity:
                return Requirement(text, "a sensitivity peak above 1, e.g. 2 (6 dB)", v => r with { MaxSensitivityPeak = v }, c);
            case CaseField.ActuatorLimit:
                return ActuatorLimits(c, text);
            case CaseField.ErrorConstant:
                return ErrorConstant(c, text);
            case CaseField.Variations:
                return Variations(c, text);
            case CaseField.PlacementValue:
                return PlacementValueEdit(c, text);
            default:
                throw new ArgumentOutOfRangeException(nameof(field), field, null);
        }
    }

    private static double? PlacementValue(LeadOptions lead) => lead.Placement switch
    {
        LeadPlacement.FixedZero or LeadPlacement.Cancel => lead.Zero,
        LeadPlacement.FixedPole => lead.Pole,
        LeadPlacement.Ratio => lead.Ratio,
        _ => null,
    };

    private static FieldEdit PlacementValueEdit(CaseFile c, string text)
    {
        var lead = c.Lead;
        return lead.Placement switch
        {
            LeadPlacement.FixedZero or LeadPlacement.Cancel => Number(text, x => x < 0, "a zero location below 0 (left half-plane)", v => c with { Lead = lead with { Zero = v } }),
            LeadPlacement.FixedPole => Number(text, x => x < 0, "a pole location below 0 (left half-plane)", v => c with { Lead = lead with { Pole = v } }),
            LeadPlacement.Ratio => Number(text, x => x > 1, "a pole/zero ratio above 1", v => c with { Lead = lead with { Ratio = v } }),
            _ => text.Trim().Length == 0
                ? FieldEdit.Accepted(c)
                : FieldEdit.Rejected(Whole(text, $"The {PlacementNames.NameOf(lead.Placement)} placement takes no value", "Clear the field, or pick the fixed-zero, fixed-pole, ratio or cancel placement.")),
        };
    }

    private static FieldEdit ErrorConstant(CaseFile c, string text)
    {
        var r = c.Requirements;
        var trimmed = text.Trim();
        if (trimmed.Length == 0)
        {
            return FieldEdit.Accepted(c with { Requirements = r with { Constant = null } });
        }

        const string hint = "Write kp=…, kv=… or ka=… (smallest error constant), or step_error=…, ramp_error=…, parabola_error=….";
        var eq = text.IndexOf('=', StringComparison.Ordinal);
        if (eq < 0)
        {
            return FieldEdit.Rejected(Whole(text, "A steady-state requirement needs a name and a value", hint));
        }

        var name = text[..eq].Trim().ToLowerInvariant();
        Func<double, ErrorRequirement>? make = name switch
        {
            "kp" => v => new ErrorRequirement(ErrorConstantKind.Position, v),
            "kv" => v => new ErrorRequirement(ErrorConstantKind.Velocity, v),
            "ka" => v => new ErrorRequirement(ErrorConstantKind.Acceleration, v),
            "step_error" => ErrorRequirement.FromStepError,
            "ramp_error" => ErrorRequirement.FromRampError,
            "parabola_error" => ErrorRequirement.FromParabolaError,
            _ => null,
        };
        if (make is null)
        {
            var start = text.Length - text.TrimStart().Length;
            return FieldEdit.Rejected(new ParseError($"'{text[..eq].Trim()}' is not a steady-state requirement", hint, text, start, Math.Max(1, eq - start)));
        }

        var valueText = text[(eq + 1)..];
        var valueStart = eq + 1 + (valueText.Length - valueText.TrimStart().Length);
        var stepError = name == "step_error";
        if (!double.TryParse(valueText.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var value) || !NumberRange.Usable(value) || value <= 0 || (stepError && value >= 1))
        {
            var what = stepError ? "a step error between 0 and 1" : "a value above 0";
            return FieldEdit.Rejected(new ParseError($"'{valueText.Trim()}' is not {what}", hint, text, Math.Min(valueStart, text.Length), Math.Max(1, valueText.Trim().Length)));
        }

        return FieldEdit.Accepted(c with { Requirements = r with { Constant = make(value) } });
    }

    private static FieldEdit Variations(CaseFile c, string text)
    {
        var list = ImmutableArray.CreateBuilder<PlantVariation>();
        var position = 0;
        foreach (var part in text.Split(','))
        {
            var item = part.Trim();
            var start = position + (part.Length - part.TrimStart().Length);
            position += part.Length + 1;
            if (item.Length == 0)
            {
                if (text.Trim().Length == 0)
                {
                    continue;
                }

                return FieldEdit.Rejected(new ParseError("An empty entry in the list of variations", "Separate variations by single commas.", text, Math.Min(start, text.Length), 1));
            }

            var parsed = PlantVariation.Parse(item);
            if (!parsed.IsSuccess)
            {
                return FieldEdit.Rejected(new ParseError(parsed.Problem.Message, parsed.Problem.Hint, text, start, item.Length));
            }

            list.Add(parsed.Value);
        }

        if (list.Count > RobustnessSweep.MaxVariations)
        {
            return FieldEdit.Rejected(Whole(text, $"{list.Count} variations make too many corners", $"Vary at most {RobustnessSweep.MaxVariations} parameters at once."));
        }

        return FieldEdit.Accepted(c with { Variations = list.ToImmutable() });
    }

    // A requirement field: the number is read here, its range is the one rule of RequirementRanges.
    private static FieldEdit Requirement(string text, string what, Func<double?, Requirements> with, CaseFile c) =>
        Number(text, x => RequirementRanges.Check(with(x)) is null, what, v => c with { Requirements = with(v) });

    // One number is a limit on |u|; LOW,HIGH are absolute output limits (either replaces the other). The operating
    // point must stay within them.
    private static FieldEdit ActuatorLimits(CaseFile c, string text)
    {
        const string what = "a limit on |u| above 0, or the output limits LOW,HIGH (0,100 for a heater)";
        var comma = text.IndexOf(',', StringComparison.Ordinal);
        FieldEdit edit;
        if (comma < 0)
        {
            edit = Number(text, x => x > 0 && x <= NumberRange.Largest, what, v => c with { Check = c.Check with { ActuatorLimit = v, OutputLimits = null } });
        }
        else
        {
            var parts = new[] { text[..comma], text[(comma + 1)..] };
            var values = new double[2];
            for (var i = 0; i < 2; i++)
            {
                var offset = i == 0 ? 0 : comma + 1;
                if (!double.TryParse(parts[i].Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out values[i]) || !NumberRange.Contains(values[i]))
                {
                    var bad = FirstNonNumeric(parts[i]);
                    return FieldEdit.Rejected(bad >= 0
                        ? new ParseError($"'{parts[i][bad]}' does not belong in a number", $"Type {what}, with a dot for decimals.", text, offset + bad, 1)
                        : new ParseError($"'{parts[i].Trim()}' is not a usable {(i == 0 ? "LOW" : "HIGH")}", $"Type {what}, both within ±1e12.", text, Math.Min(offset, text.Length - 1), Math.Max(1, parts[i].Length)));
                }
            }

            var (l, h) = (values[0], values[1]);
            if (!(l < h))
            {
                return FieldEdit.Rejected(Whole(text, "LOW must be below HIGH", $"Type {what}."));
            }

            edit = FieldEdit.Accepted(c with { Check = c.Check with { ActuatorLimit = null, OutputLimits = CommandRange.Create(l, h) } });
        }

        if (edit.IsSuccess && edit.Case.Check.AbsoluteLimits is { } limits && !limits.Contains(c.Check.OperatingPoint))
        {
            return FieldEdit.Rejected(Whole(text, $"the operating point {N(c.Check.OperatingPoint)} lies outside these limits", "Give limits that contain the operating-point command."));
        }

        return edit;
    }

    private static FieldEdit Number(string text, Func<double, bool> valid, string what, Func<double?, CaseFile> apply)
    {
        var trimmed = text.Trim();
        if (trimmed.Length == 0)
        {
            return FieldEdit.Accepted(apply(null));
        }

        if (!double.TryParse(trimmed, NumberStyles.Float, CultureInfo.InvariantCulture, out var x) || !NumberRange.Usable(x))
        {
            var bad = FirstNonNumeric(text);
            return FieldEdit.Rejected(bad >= 0
                ? new ParseError($"'{text[bad]}' does not belong in a number", $"Type {what}, with a dot for decimals; leave the field empty for none.", text, bad, 1)
                : Whole(text, $"'{trimmed}' is not a number", $"Type {what}, with a dot for decimals; leave the field empty for none."));
        }

        return valid(x)
            ? FieldEdit.Accepted(apply(x))
            : FieldEdit.Rejected(Whole(text, $"{trimmed} is out of range", $"Type {what}; leave the field empty for none."));
    }

    private static int FirstNonNumeric(string text)
    {
        for (var i = 0; i < text.Length; i++)
        {
            var ch = text[i];
            if (!(char.IsAsciiDigit(ch) || ch is '.' or 'e' or 'E' or '+' or '-' or ' '))
            {
                return i;
            }
        }

        return -1;
    }

    private static ParseError Whole(string text, string message, string hint)
    {
        var start = text.Length - text.TrimStart().Length;
        return new ParseError(message, hint, text, Math.Min(start, text.Length), Math.Max(1, text.Trim().Length));
    }

    private static string VariationText(PlantVariation v) =>
        v.Pole is { } p ? $"pole={N(p.Real)}:{N(v.Percent)}%" : $"gain={N(v.Percent)}%";

    private static string N(double? x) => x is { } v ? v.ToString(CultureInfo.InvariantCulture) : string.Empty;
}
