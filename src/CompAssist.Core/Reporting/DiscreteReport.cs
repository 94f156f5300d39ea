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

    /// <summary>For people: the coefficients, the difference equation and its convention.</summary>
    public static string RenderText(TransferFunction continuous, Discretizer.Result result)
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
        foreach (var w in result.Warnings)
        {
            TextWrap.AppendTo(sb, w, "  ! ");
        }

        sb.AppendLine();
        Cautions.AppendSection(sb);

        return sb.ToString();
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
            w.WriteStartArray("warnings");
            foreach (var warning in result.Warnings)
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
