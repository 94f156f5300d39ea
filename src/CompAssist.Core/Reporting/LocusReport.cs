using System.Collections.Immutable;
using System.Numerics;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Locus;
using CompAssist.Core.Model;
using CompAssist.Core.Pictures;

namespace CompAssist.Core.Reporting;

/// <summary>Text and JSON for a root locus.</summary>
public static class LocusReport
{
    /// <summary>The summary for people, with the s-plane picture.</summary>
    /// <param name="locus">The locus.</param>
    /// <param name="loop">The loop it belongs to.</param>
    /// <param name="compensator">The compensator in the loop, or null for none (C = 1).</param>
    /// <param name="style">Unicode or ASCII pictures.</param>
    /// <param name="width">Picture width in characters.</param>
    /// <param name="height">Picture height in rows.</param>
    public static string RenderText(LocusResult locus, Loop loop, TransferFunction? compensator, PictureStyle style, int width = 78, int height = 22)
    {
        ArgumentNullException.ThrowIfNull(locus);
        ArgumentNullException.ThrowIfNull(loop);
        var sb = new StringBuilder();
        sb.AppendLine("CompAssist root locus");
        sb.AppendLine();
        var kind = $"({(locus.ZeroDegreeLocus ? "0°" : "180°")} locus, K from 0 to ∞)";
        sb.AppendLine(compensator is null || compensator.Equals(TransferFunction.Unity)
            ? $"  loop G·H = {loop.PlantTimesFeedback}   {kind}"
            : $"  loop C·G·H with C = {compensator}, G·H = {loop.PlantTimesFeedback}   {kind}");
        if (locus.Approximate)
        {
            TextWrap.AppendTo(sb, $"the delay is replaced by a Padé approximant of order {loop.PadeOrder}; its poles and zeros are artefacts");
        }

        AppendFeatures(sb, locus);
        sb.AppendLine();
        var scene = new SPlaneScene
        {
            Branches = Polylines(locus),
            Poles = locus.Poles,
            Zeros = locus.Zeros,
        };
        var view = PlaneView.Frame(locus.BreakPoints.Select(b => b.Point).Concat(locus.AxisCrossings.Select(c => new Complex(0, c.Frequency))), locus.Poles.Concat(locus.Zeros));
        sb.Append(SPlaneRenderer.Render(scene, view, width, height, style));
        return sb.ToString();
    }

    /// <summary>
    /// The features as indented text lines. With <paramref name="relativeToDesign"/> the gains are multipliers
    /// of a designed loop ("at 0.68 × the designed gain"), so they are not read as the compensator's factored gain.
    /// </summary>
    public static void AppendFeatures(StringBuilder sb, LocusResult locus, bool relativeToDesign = false)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(locus);
        if (locus.AsymptoteAnglesDegrees.Length > 0)
        {
            sb.AppendLine($"  asymptotes: centroid {N(locus.Centroid)}, angles {string.Join(", ", locus.AsymptoteAnglesDegrees.Select(a => N(a) + "°"))}");
        }

        sb.AppendLine($"  real axis on the locus: {(locus.RealAxisSegments.Length == 0 ? "none" : string.Join(", ", locus.RealAxisSegments.Select(s => $"[{N(s.From)}, {N(s.To)}]")))}");
        foreach (var b in locus.BreakPoints)
        {
            sb.AppendLine(b.Gain == 0
                ? $"  break point at {TransferFunctionFormatter.Complex(b.Point, 5)}, a repeated pole (branches leave it at once)"
                : $"  break point at {TransferFunctionFormatter.Complex(b.Point, 5)}, {GainText(b.Gain, relativeToDesign)}");
        }

        foreach (var c in locus.AxisCrossings)
        {
            sb.AppendLine($"  crosses the imaginary axis at ±{N(c.Frequency)}j rad/s, {GainText(c.Gain, relativeToDesign)}");
        }

        foreach (var group in locus.BranchAngles.GroupBy(a => (a.At, a.IsDeparture)))
        {
            var where = group.Key.IsDeparture ? "departure from pole" : "arrival at zero";
            sb.AppendLine($"  {where} {TransferFunctionFormatter.Complex(group.Key.At, 4)}: {string.Join(", ", group.Select(a => N(a.AngleDegrees) + "°"))}");
        }
    }

    private static string GainText(double gain, bool relativeToDesign) =>
        relativeToDesign ? $"at {N(gain)} × the designed gain" : $"K = {N(gain)}";

    /// <summary>The machine interface: branches of {k, re, im}, asymptotes, break points, axis crossings, angles.</summary>
    public static string RenderJson(LocusResult locus)
    {
        ArgumentNullException.ThrowIfNull(locus);
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = false, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteStartArray("branches");
            foreach (var branch in locus.Branches)
            {
                w.WriteStartArray();
                foreach (var p in branch)
                {
                    w.WriteStartObject();
                    w.WriteNumber("k", p.Gain);
                    w.WriteNumber("re", p.Root.Real);
                    w.WriteNumber("im", p.Root.Imaginary);
                    w.WriteEndObject();
                }

                w.WriteEndArray();
            }

            w.WriteEndArray();
            w.WriteStartArray("branchEnds");
            foreach (var end in locus.BranchEnds)
            {
                w.WriteStartObject();
                w.WriteString("kind", end is null ? "asymptote" : "zero");
                if (end is { } z)
                {
                    w.WriteNumber("re", z.Real);
                    w.WriteNumber("im", z.Imaginary);
                }

                w.WriteEndObject();
            }

            w.WriteEndArray();
            WriteFeatures(w, locus);
            w.WriteBoolean("approximate", locus.Approximate);
            w.WriteString("kind", locus.ZeroDegreeLocus ? "0deg" : "180deg");
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray());
    }

    /// <summary>Writes asymptotes, segments, break points, crossings and angles (no branches).</summary>
    public static void WriteFeatures(Utf8JsonWriter w, LocusResult locus)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(locus);
        w.WriteStartObject("asymptotes");
        JsonNumbers.Write(w, "centroid", locus.Centroid);
        w.WriteStartArray("anglesDeg");
        foreach (var a in locus.AsymptoteAnglesDegrees)
        {
            w.WriteNumberValue(a);
        }

        w.WriteEndArray();
        w.WriteEndObject();
        w.WriteStartArray("realAxisSegments");
        foreach (var s in locus.RealAxisSegments)
        {
            w.WriteStartObject();
            JsonNumbers.Write(w, "from", s.From);
            JsonNumbers.Write(w, "to", s.To);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteStartArray("breakPoints");
        foreach (var b in locus.BreakPoints)
        {
            w.WriteStartObject();
            w.WriteNumber("re", b.Point.Real);
            w.WriteNumber("im", b.Point.Imaginary);
            w.WriteNumber("k", b.Gain);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteStartArray("axisCrossings");
        foreach (var c in locus.AxisCrossings)
        {
            w.WriteStartObject();
            w.WriteNumber("k", c.Gain);
            w.WriteNumber("omega", c.Frequency);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteStartArray("branchAngles");
        foreach (var a in locus.BranchAngles)
        {
            w.WriteStartObject();
            w.WriteString("kind", a.IsDeparture ? "departure" : "arrival");
            w.WriteNumber("re", a.At.Real);
            w.WriteNumber("im", a.At.Imaginary);
            w.WriteNumber("angleDeg", a.AngleDegrees);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    /// <summary>The branches as polylines, each closed off at its finite zero when it ends at one.</summary>
    public static ImmutableArray<ImmutableArray<Complex>> Polylines(LocusResult locus)
    {
        ArgumentNullException.ThrowIfNull(locus);
        return [.. locus.Branches.Select((b, i) =>
        {
            var points = b.Select(p => p.Root).ToList();
            if (locus.BranchEnds[i] is { } z)
            {
                points.Add(z);
            }

            return points.ToImmutableArray();
        })];
    }

    private static string N(double x) => TransferFunctionFormatter.Number(x, 5);
}
