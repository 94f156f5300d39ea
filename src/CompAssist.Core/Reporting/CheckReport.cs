using System.Text;
using System.Text.Json;
using CompAssist.Core.Model;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Reporting;

/// <summary>Text and JSON for a check of a given compensator.</summary>
public static class CheckReport
{
    /// <summary>The report for people.</summary>
    public static string RenderText(CheckResult result, string title = "")
    {
        ArgumentNullException.ThrowIfNull(result);
        var sb = new StringBuilder();
        sb.AppendLine(title.Length > 0 ? $"CompAssist loop check — {title}" : "CompAssist loop check");
        sb.AppendLine();
        sb.AppendLine("Loop");
        sb.AppendLine($"  plant        G(s) = {result.Loop.Plant}");
        sb.AppendLine($"  feedback     H(s) = {result.Loop.Feedback}   ({(result.Loop.Sign == FeedbackSign.Negative ? "negative" : "positive")} feedback)");
        sb.AppendLine($"  compensator  C(s) = {result.Compensator}");
        sb.AppendLine();
        sb.AppendLine("Closed-loop poles (root finding, verified)");
        foreach (var r in result.ClosedLoopPoles.Where(r => r.Imaginary >= 0))
        {
            var text = r.Imaginary > 0 ? $"{TransferFunctionFormatter.Number(r.Real, 5)} ± {TransferFunctionFormatter.Number(r.Imaginary, 5)}j" : TransferFunctionFormatter.Number(r.Real, 5);
            var zeta = r.Magnitude == 0 ? double.NaN : -r.Real / r.Magnitude;
            sb.AppendLine($"  {text,-28} ζ {TransferFunctionFormatter.Number(zeta, 3),-7} ωn {TransferFunctionFormatter.Number(r.Magnitude, 4)}");
        }

        sb.AppendLine();
        CheckTextSection.Append(sb, result.Check, result.Robustness);
        CheckTextSection.AppendVerdict(sb, result.Verdict, result.Robustness);
        if (result.Check.Warnings.Length > 0)
        {
            sb.AppendLine("Warnings");
            foreach (var w in result.Check.Warnings)
            {
                TextWrap.AppendTo(sb, w, "  ! ");
            }

            sb.AppendLine();
        }

        Cautions.AppendSection(sb);

        return sb.ToString();
    }

    /// <summary>The report for programs.</summary>
    public static string RenderJson(CheckResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteStartObject("loop");
            w.WriteString("plant", result.Loop.Plant.ToString());
            w.WriteString("feedback", result.Loop.Feedback.ToString());
            w.WriteString("sign", result.Loop.Sign == FeedbackSign.Negative ? "negative" : "positive");
            w.WriteEndObject();
            w.WriteStartObject("compensator");
            w.WriteString("expression", result.Compensator.ToString());
            JsonNumbers.Write(w, "gain", result.Compensator.Gain);
            w.WriteEndObject();
            w.WriteStartObject("closedLoop");
            w.WriteStartArray("poles");
            foreach (var r in result.ClosedLoopPoles)
            {
                w.WriteStartObject();
                w.WriteNumber("re", r.Real);
                w.WriteNumber("im", r.Imaginary);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            w.WriteEndObject();
            CheckJsonSection.Write(w, result.Check, result.Robustness);
            CheckJsonSection.WriteVerdict(w, result.Verdict);
            w.WriteString("caution", Cautions.Text);
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray());
    }
}
