using System.Globalization;
using System.Text;
using CompAssist.Core.Model;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Cases;

/// <summary>Writes a case in the format <see cref="CaseFileReader"/> reads (format 1), human-editable.</summary>
public static class CaseFileWriter
{
    /// <summary>The TOML text of a case.</summary>
    public static string Write(CaseFile c)
    {
        ArgumentNullException.ThrowIfNull(c);
        var sb = new StringBuilder();
        sb.AppendLine("# CompAssist case file (format 1). See DEVELOPERS.md for every key.");
        sb.AppendLine($"format = {CaseFile.CurrentFormat}");
        sb.AppendLine($"name = {Quote(c.Name)}");
        sb.AppendLine($"description = {Quote(c.Description)}");
        sb.AppendLine();
        sb.AppendLine("[loop]");
        if (c.Plant is not null)
        {
            sb.AppendLine($"plant = {Quote(c.Plant)}");
        }

        sb.AppendLine($"feedback = {Quote(c.Feedback)}");
        sb.AppendLine($"sign = {Quote(c.Sign == FeedbackSign.Positive ? "positive" : "negative")}");
        sb.AppendLine($"pade_order = {c.PadeOrder}");
        sb.AppendLine();
        sb.AppendLine("[requirements]");
        var r = c.Requirements;
        Optional(sb, "overshoot_percent", r.MaxOvershootPercent);
        Optional(sb, "settling_time", r.MaxSettlingTime);
        sb.AppendLine($"settling_band = {(r.Band == SettlingBand.FivePercent ? 5 : 2)}");
        Optional(sb, "peak_time", r.MaxPeakTime);
        Optional(sb, "rise_time", r.MaxRiseTime);
        Optional(sb, "phase_margin_deg", r.MinPhaseMarginDegrees);
        Optional(sb, "gain_margin_db", r.MinGainMarginDb);
        Optional(sb, "delay_margin", r.MinDelayMargin);
        Optional(sb, "sensitivity_peak", r.MaxSensitivityPeak);
        Optional(sb, "zeta", r.Zeta);
        Optional(sb, "natural_frequency", r.NaturalFrequency);
        if (r.Point is { } p)
        {
            sb.AppendLine($"target = [{N(p.Real)}, {N(p.Imaginary)}]");
        }

        if (r.Constant is { } k)
        {
            sb.AppendLine($"{k.Symbol.ToLowerInvariant()} = {N(k.Value)}");
        }

        sb.AppendLine();
        sb.AppendLine("[compensator]");
        sb.AppendLine($"type = {Quote(c.CompensatorType)}");
        sb.AppendLine($"placement = {Quote(PlacementNames.NameOf(c.Lead.Placement))}");
        Optional(sb, "zero", c.Lead.Zero);
        Optional(sb, "pole", c.Lead.Pole);
        Optional(sb, "ratio", c.Lead.Ratio);
        sb.AppendLine($"max_stage_angle_deg = {N(c.Lead.MaxStageAngleDegrees)}");
        sb.AppendLine($"zero_fraction = {N(c.Slow.ZeroFraction)}");
        sb.AppendLine($"angle_budget_deg = {N(c.Slow.AngleBudgetDegrees)}");
        sb.AppendLine($"margin = {N(c.Slow.Margin)}");
        Optional(sb, "filter_ratio", c.Slow.FilterRatio);
        sb.AppendLine($"equal_factor = {(c.Slow.EqualFactor ? "true" : "false")}");
        sb.AppendLine($"prefilter = {(c.Prefilter ? "true" : "false")}");
        sb.AppendLine();
        sb.AppendLine("[check]");
        sb.AppendLine($"reference_step = {N(c.Check.ReferenceStep)}");
        Optional(sb, "actuator_limit", c.Check.ActuatorLimit);
        if (c.Check.OutputLimits is { } limits)
        {
            sb.AppendLine($"output_limits = [{N(limits.Low)}, {N(limits.High)}]");
        }

        if (c.Check.OperatingPoint != 0)
        {
            sb.AppendLine($"operating_point = {N(c.Check.OperatingPoint)}");
        }
        if (!c.Variations.IsEmpty)
        {
            sb.AppendLine($"vary = [{string.Join(", ", c.Variations.Select(v => Quote(v.Pole is { } pole ? $"pole={N(pole.Real)}:{N(v.Percent)}%" : $"gain={N(v.Percent)}%")))}]");
        }

        return sb.ToString();
    }

    /// <summary>Writes the case to disk atomically.</summary>
    public static void Save(CaseFile c, string path) => AtomicFile.Write(path, Write(c));

    private static void Optional(StringBuilder sb, string key, double? value)
    {
        if (value is { } v)
        {
            sb.AppendLine($"{key} = {N(v)}");
        }
    }

    private static string N(double x)
    {
        var text = x.ToString("R", CultureInfo.InvariantCulture);
        return text.Contains('.') || text.Contains('E') || text.Contains('e') ? text : text + ".0";
    }

    private static string Quote(string s) => "\"" + s.Replace("\\", "\\\\", StringComparison.Ordinal).Replace("\"", "\\\"", StringComparison.Ordinal) + "\"";
}
