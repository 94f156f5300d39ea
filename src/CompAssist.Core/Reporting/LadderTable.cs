using System.Globalization;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Export;
using CompAssist.Core.Model;

namespace CompAssist.Core.Reporting;

/// <summary>The sample-time ladder as people and programs read it: a short table in text, Markdown and JSON.</summary>
public static class LadderTable
{
    /// <summary>Plain-text rows (80 columns), the package's value marked with ▶ (or &gt; in ASCII).</summary>
    public static void AppendText(StringBuilder sb, SampleTimeLadder ladder, double chosen, string indent = "  ")
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(ladder);
        sb.AppendLine(CultureInfo.InvariantCulture, $"{indent}  T (s)      ωs/ωB  overshoot %  settling (s)  PM (°)  sampled loop");
        foreach (var r in ladder.Rungs)
        {
            var mark = r.SampleTime == chosen ? "▶" : " ";
            var ratio = double.IsFinite(ladder.Bandwidth) ? N(2 * Math.PI / r.SampleTime / ladder.Bandwidth, 3) : "-";
            var state = r.Meets ? "meets" : "FAILS " + r.BindingName;
            sb.AppendLine(CultureInfo.InvariantCulture, $"{indent}{mark} {N(r.SampleTime, 3),-9} {ratio,7} {N(r.Proof.Metrics.OvershootPercent, 4),12} {N(r.Proof.Metrics.SettlingTime2Percent, 4),13} {N(r.PhaseMarginDeg, 3),7}  {state}");
        }
    }

    /// <summary>The Markdown table.</summary>
    public static void AppendMarkdown(StringBuilder sb, SampleTimeLadder ladder, double chosen)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(ladder);
        sb.AppendLine("| T (s) | ωs/ωB | overshoot % | 2 % settling (s) | phase margin (°) | sampled loop |");
        sb.AppendLine("|---|---|---|---|---|---|");
        foreach (var r in ladder.Rungs)
        {
            var t = r.SampleTime == chosen ? $"**{N(r.SampleTime, 3)}** (this package)" : N(r.SampleTime, 3);
            var ratio = double.IsFinite(ladder.Bandwidth) ? N(2 * Math.PI / r.SampleTime / ladder.Bandwidth, 3) : "-";
            sb.AppendLine(CultureInfo.InvariantCulture, $"| {t} | {ratio} | {N(r.Proof.Metrics.OvershootPercent, 4)} | {N(r.Proof.Metrics.SettlingTime2Percent, 4)} | {N(r.PhaseMarginDeg, 3)} | {(r.Meets ? "meets" : "FAILS: " + r.Binds)} |");
        }
    }

    /// <summary>Writes <c>"sampleTimeLadder": {...}</c>.</summary>
    public static void WriteJson(Utf8JsonWriter w, SampleTimeLadder ladder)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(ladder);
        w.WriteStartObject("sampleTimeLadder");
        JsonNumbers.Write(w, "bandwidth", ladder.Bandwidth);
        w.WriteNumber("start", ladder.Start);
        JsonNumbers.Write(w, "recommended", ladder.Recommended ?? double.NaN);
        JsonNumbers.Write(w, "limit", ladder.Limit ?? double.NaN);
        w.WriteStartArray("rungs");
        foreach (var r in ladder.Rungs)
        {
            w.WriteStartObject();
            w.WriteNumber("sampleTime", r.SampleTime);
            w.WriteBoolean("stable", r.Proof.Stable);
            w.WriteBoolean("meets", r.Meets);
            JsonNumbers.Write(w, "overshootPercent", r.Proof.Metrics.OvershootPercent);
            JsonNumbers.Write(w, "settlingTime2", r.Proof.Metrics.SettlingTime2Percent);
            JsonNumbers.Write(w, "phaseMarginDeg", r.PhaseMarginDeg);
            if (r.Binds is { } binds)
            {
                w.WriteString("binds", binds);
            }

            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static string N(double x, int digits) => TransferFunctionFormatter.Number(x, digits);
}
