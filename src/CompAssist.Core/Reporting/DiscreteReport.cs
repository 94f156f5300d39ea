using System.Text;
using System.Text.Json;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;

namespace CompAssist.Core.Reporting;

/// <summary>Text and JSON for a discretized compensator.</summary>
public static class DiscreteReport
{
    /// <summary>The method's command-line name.</summary>
    public static string MethodName(DiscretizationMethod method) => method.ToString().ToLowerInvariant();

    /// <summary>For people: the coefficients, the difference equation and its convention (the direct form, or with <paramref name="sections"/> the cascade of sections).</summary>
    public static string RenderText(TransferFunction continuous, Discretizer.Result result, bool sections = false)
    {
        ArgumentNullException.ThrowIfNull(continuous);
        ArgumentNullException.ThrowIfNull(result);
        var d = result.Discrete;
        var sb = new StringBuilder();
        sb.AppendLine($"CompAssist discretization ({MethodName(result.Method)}, T = {N(d.SampleTime)} s; {result.GainMatching})");
        sb.AppendLine();
        sb.AppendLine($"  C(s) = {continuous}");
        sb.AppendLine($"  zeros in z: {(d.Zeros.Length == 0 ? "none" : string.Join(", ", d.Zeros.Select(z => TransferFunctionFormatter.Complex(z, 8))))}");
        sb.AppendLine($"  poles in z: {(d.Poles.Length == 0 ? "none" : string.Join(", ", d.Poles.Select(z => TransferFunctionFormatter.Complex(z, 8))))}");
        sb.AppendLine($"  DC gain C(z=1) = {N(d.DcGain)}");
        sb.AppendLine();
        if (sections)
        {
            var cascade = SectionSplitter.Split(d);
            sb.AppendLine($"  {cascade.Length} cascaded section(s), each (b0 + b1 z^-1 + b2 z^-2) / (1 + a1 z^-1 + a2 z^-2), applied in this order:");
            for (var i = 0; i < cascade.Length; i++)
            {
                var q = cascade[i];
                sb.AppendLine($"    section {i + 1}: b0 = {q.B0:R}, b1 = {q.B1:R}, b2 = {q.B2:R}, a1 = {q.A1:R}, a2 = {q.A2:R}");
            }

            sb.AppendLine();
            sb.AppendLine("  each section in transposed direct form II (x in, y out; the first section's x is the control error e,");
            sb.AppendLine("  the last one's y the command u): y = b0 x + s1; s1 = b1 x - a1 y + s2; s2 = b2 x - a2 y");
        }
        else
        {
            sb.AppendLine("  C(z) = (b0 + b1 z^-1 + ... + bn z^-n) / (1 + a1 z^-1 + ... + an z^-n)");
            for (var i = 0; i < d.Numerator.Length; i++)
            {
                sb.AppendLine($"    b{i} = {d.Numerator[i]:R}");
            }

            for (var i = 1; i < d.Denominator.Length; i++)
            {
                sb.AppendLine($"    a{i} = {d.Denominator[i]:R}");
            }

            sb.AppendLine();
            sb.AppendLine("  difference equation (e the control error in, u the command out, k the sample index):");
            sb.AppendLine("    u[k] = b0 e[k] + b1 e[k-1] + ... - a1 u[k-1] - a2 u[k-2] - ...");
        }

        foreach (var w in result.Warnings.Concat(DirectFormWarnings(d)))
        {
            TextWrap.AppendTo(sb, w, "  ! ");
        }

        sb.AppendLine();
        Cautions.AppendSection(sb);

        return sb.ToString();
    }

    /// <summary>
    /// What storing C(z) as one direct form does, in double and in float, when it loses accuracy: by how much, against
    /// the cascade of sections.
    /// </summary>
    public static IEnumerable<string> DirectFormWarnings(DiscreteTransferFunction d)
    {
        ArgumentNullException.ThrowIfNull(d);
        return Accuracies(d).Select(Warning).OfType<string>();
    }

    /// <summary>Sections as a JSON array of {b0, b1, b2, a1, a2} objects.</summary>
    public static void WriteSections(Utf8JsonWriter w, string name, IEnumerable<Section> sections)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(sections);
        w.WriteStartArray(name);
        foreach (var q in sections)
        {
            w.WriteStartObject();
            w.WriteNumber("b0", q.B0);
            w.WriteNumber("b1", q.B1);
            w.WriteNumber("b2", q.B2);
            w.WriteNumber("a1", q.A1);
            w.WriteNumber("a2", q.A2);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static DirectFormAccuracy[] Accuracies(DiscreteTransferFunction d) =>
        [DirectFormAccuracy.Of(d, NumberFormat.Double), DirectFormAccuracy.Of(d, NumberFormat.Float)];

    private static string? Warning(DirectFormAccuracy a)
    {
        if (!a.DirectLosesAccuracy)
        {
            return null;
        }

        var format = a.Format;
        var what = double.IsInfinity(a.DesignedDcGain)
            ? $"loses the integrator: its DC gain is {N(a.DirectDcGain)} instead of infinite"
            : $"implements a DC gain of {N(a.DirectDcGain)} instead of {N(a.DesignedDcGain)} ({(Math.Sign(a.DirectDcGain) != Math.Sign(a.DesignedDcGain) ? "the wrong sign" : $"{N(a.DirectErrorPercent)} % off")})";
        return a.SectionsErrorPercent <= DirectFormAccuracy.TolerancePercent
            ? $"ONE DIRECT FORM IN {format.ToString().ToUpperInvariant()} {what}, its poles moved by up to {N(a.DirectPoleShift)}; cascaded second-order sections stored the same way keep the DC gain within {N(a.SectionsErrorPercent)} %. Implement the sections, not the single difference equation."
            : $"ONE DIRECT FORM IN {format.ToString().ToUpperInvariant()} {what}, its poles moved by up to {N(a.DirectPoleShift)}; even cascaded second-order sections in {format} implement a DC gain of {N(a.SectionsDcGain)}. Implement the sections in a wider format, or sample more slowly if the loop allows it.";
    }

    /// <summary>The machine interface: numerator/denominator ascending in z⁻¹ (a0 = 1), method, sampleTime.</summary>
    public static string RenderJson(Discretizer.Result result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var d = result.Discrete;
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteString("method", MethodName(result.Method));
            w.WriteNumber("sampleTime", d.SampleTime);
            w.WriteString("convention", "C(z) = (b0 + b1 z^-1 + ...)/(1 + a1 z^-1 + ...); u[k] = sum b_i e[k-i] - sum_{i>=1} a_i u[k-i]");
            JsonNumbers.WriteArray(w, "numerator", d.Numerator);
            JsonNumbers.WriteArray(w, "denominator", d.Denominator);
            JsonNumbers.WriteComplexArray(w, "zeros", d.Zeros);
            JsonNumbers.WriteComplexArray(w, "poles", d.Poles);
            JsonNumbers.Write(w, "dcGain", d.DcGain);
            w.WriteString("gainMatching", result.GainMatching);
            WriteSections(w, "sections", SectionSplitter.Split(d));
            var accuracies = Accuracies(d);
            w.WriteStartObject("directForm");
            foreach (var a in accuracies)
            {
                w.WriteStartObject(a.Format.ToString());
                JsonNumbers.Write(w, "dcGain", a.DirectDcGain);
                JsonNumbers.Write(w, "sectionsDcGain", a.SectionsDcGain);
                JsonNumbers.Write(w, "dcGainErrorPercent", a.DirectErrorPercent);
                JsonNumbers.Write(w, "poleShift", a.DirectPoleShift);
                w.WriteBoolean("losesAccuracy", a.DirectLosesAccuracy);
                w.WriteEndObject();
            }

            w.WriteEndObject();
            w.WriteStartArray("warnings");
            foreach (var warning in result.Warnings.Concat(accuracies.Select(Warning).OfType<string>()))
            {
                w.WriteStringValue(warning);
            }

            w.WriteEndArray();
            w.WriteString("caution", Cautions.Text);
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray());
    }

    private static string N(double x) => TransferFunctionFormatter.Number(x, 8);
}
