using System.Text;
using System.Text.Json;
using CompAssist.Core.Model;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Reporting;

/// <summary>The reference prefilter in the text report and in JSON: F(s), what it cancels and keeps, the step with and without it.</summary>
public static class PrefilterSection
{
    /// <summary>Appends the section when the case asks for a prefilter.</summary>
    public static void Append(StringBuilder sb, DesignReport report)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(report);
        if (report.Prefilter is not { } p)
        {
            if (report.PrefilterNote is { } why)
            {
                sb.AppendLine("Reference prefilter");
                TextWrap.AppendTo(sb, $"none: {why}.");
                sb.AppendLine();
            }

            return;
        }

        var without = report.Check.Step;
        sb.AppendLine("Reference prefilter (the loop, its margins and its load response are unchanged)");
        TextWrap.AppendTo(sb, $"F(s) = {p.Filter}, F(0)·T(0) = 1; it cancels the closed-loop zero{(p.Cancelled.Length == 1 ? string.Empty : "s")} {string.Join(", ", p.Cancelled.Select(z => TransferFunctionFormatter.Complex(z, 5)))}");
        foreach (var (zero, reason) in p.Kept)
        {
            TextWrap.AppendTo(sb, $"keeps {TransferFunctionFormatter.Complex(zero, 5)}: {reason}", "  ", "    ");
        }

        TextWrap.AppendTo(sb, $"step with F: overshoot {N(p.Step.OvershootPercent)} % (without: {N(without.OvershootPercent)} %), 2 % settling {N(p.Step.SettlingTime2Percent)} s (without: {N(without.SettlingTime2Percent)} s), rise {N(p.Step.RiseTime)} s (without: {N(without.RiseTime)} s), final value 1");
        TextWrap.AppendTo(sb, $"actuator command with F for a unit reference: {N(p.CommandLowest)} … {N(p.CommandHighest)} (without: peak |u| {N(report.Check.EffortFigures.Peak / report.Check.EffortFigures.ReferenceStep)})");
        TextWrap.AppendTo(sb, "the requirements above are checked without F; a load disturbance's offset, if any, remains with F");
        sb.AppendLine();
    }

    /// <summary>Writes "prefilter" (null when none was asked for).</summary>
    public static void Write(Utf8JsonWriter w, DesignReport report)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(report);
        if (report.Prefilter is not { } p)
        {
            if (report.PrefilterNote is { } why)
            {
                w.WriteStartObject("prefilter");
                w.WriteNull("filter");
                w.WriteString("none", why);
                w.WriteEndObject();
            }

            return;
        }

        w.WriteStartObject("prefilter");
        w.WriteString("filter", p.Filter.ToString());
        JsonNumbers.Write(w, "gain", p.Filter.Gain);
        w.WriteStartArray("poles");
        foreach (var z in p.Cancelled)
        {
            w.WriteStartObject();
            JsonNumbers.Write(w, "re", z.Real);
            JsonNumbers.Write(w, "im", z.Imaginary);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        JsonNumbers.Write(w, "overshootPercent", p.Step.OvershootPercent);
        JsonNumbers.Write(w, "settlingTime2", p.Step.SettlingTime2Percent);
        JsonNumbers.Write(w, "riseTime", p.Step.RiseTime);
        JsonNumbers.Write(w, "commandHighest", p.CommandHighest);
        JsonNumbers.Write(w, "commandLowest", p.CommandLowest);
        w.WriteEndObject();
    }

    private static string N(double x) => TransferFunctionFormatter.Number(x, 4);
}
