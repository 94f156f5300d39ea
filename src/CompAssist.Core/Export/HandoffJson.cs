using System.Collections.Immutable;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Reporting;

namespace CompAssist.Core.Export;

/// <summary>The package's JSON coefficient file: format, sections, sampled proof, ladder, quantization and the PID as exported.</summary>
internal static class HandoffJson
{
    public static string Write(HandoffOptions options, Discretizer.Result discrete, ImmutableArray<Section> sections, SampledLoopProof proof, QuantizationReport quantization, string origin, string note, SampleTimeLadder ladder, ExportedPidProof? pid)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            var d = discrete.Discrete;
            w.WriteStartObject();
            w.WriteString("name", options.Name);
            w.WriteString("source", origin);
            w.WriteNumber("sampleTime", d.SampleTime);
            w.WriteString("sampleTimeNote", note);
            LadderTable.WriteJson(w, ladder);
            w.WriteString("method", DiscreteReport.MethodName(discrete.Method));
            w.WriteString("units", "input: control error in the measurement's units; output: actuator command in the compensator's output units");
            w.WriteString("convention", "C(z) = (b0 + b1 z^-1 + ...)/(1 + a1 z^-1 + ...); sections in transposed direct form II: y = b0 x + s1; s1 = b1 x - a1 y + s2; s2 = b2 x - a2 y");
            w.WriteBoolean("computationDelay", options.ComputationDelay);
            w.WriteString("format", options.Format.ToString());
            w.WriteStartObject("quantization");
            w.WriteNumber("largestPoleShift", quantization.LargestPoleShift);
            w.WriteNumber("largestZeroShift", quantization.LargestZeroShift);
            JsonNumbers.Write(w, "dcGainChangePercent", quantization.DcGainChangePercent);
            w.WriteStartArray("fractionalBits");
            foreach (var q in quantization.Sections)
            {
                w.WriteNumberValue(q.FractionalBits);
            }

            w.WriteEndArray();
            w.WriteStartArray("warnings");
            foreach (var warning in quantization.Warnings)
            {
                w.WriteStringValue(warning);
            }

            w.WriteEndArray();
            w.WriteEndObject();
            JsonNumbers.WriteArray(w, "numerator", d.Numerator);
            JsonNumbers.WriteArray(w, "denominator", d.Denominator);
            DiscreteReport.WriteSections(w, "sections", sections);
            w.WriteStartObject("sampledLoop");
            w.WriteBoolean("stable", proof.Stable);
            w.WriteNumber("largestPoleMagnitude", proof.LargestPoleMagnitude);
            JsonNumbers.Write(w, "overshootPercent", proof.Metrics.OvershootPercent);
            JsonNumbers.Write(w, "settlingTime2", proof.Metrics.SettlingTime2Percent);
            w.WriteEndObject();
            if (pid is not null)
            {
                PidExport.WriteJson(w, pid);
            }

            w.WriteString("caution", Cautions.Text);
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray());
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 5);
}
