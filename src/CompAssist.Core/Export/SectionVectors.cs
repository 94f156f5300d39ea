using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using CompAssist.Core.Discrete;

namespace CompAssist.Core.Export;

/// <summary>The section cascade's CSV test vectors: real-valued (double, float) and bit-exact integers (fixed point).</summary>
internal static class SectionVectors
{
    public static string Real(ImmutableArray<Section> sections, NumberFormat format, double sampleTime)
    {
        var random = new Random(20261201);
        var runs = new (string Name, double[] Input)[]
        {
            ("impulse", [1.0, .. Enumerable.Repeat(0.0, 99)]),
            ("step", [.. Enumerable.Repeat(1.0, 100)]),
            ("random", [.. Enumerable.Range(0, 100).Select(_ => (2 * random.NextDouble()) - 1)]),
            ("nonfinite", [.. Enumerable.Range(0, 30).Select(k => k == 10 ? double.NaN : k == 20 ? double.PositiveInfinity : 1.0)]),
        };
        static string Input(double x) => double.IsNaN(x) ? "nan" : double.IsPositiveInfinity(x) ? "inf" : double.IsNegativeInfinity(x) ? "-inf" : x.ToString("R", CultureInfo.InvariantCulture);
        var sb = new StringBuilder();
        sb.AppendLine(CultureInfo.InvariantCulture, $"# CompAssist test vectors for a {sections.Length}-section cascade (transposed direct form II), sample time {sampleTime:R} s.");
        sb.AppendLine("# Feed 'input' to <name>_step from <name>_init, one row per sample; 'expected' is the");
        sb.AppendLine($"# output of the same section cascade with the coefficients as stored ({format}; fixed point: the real-valued cascade of the rounded coefficients). Runs restart from rest. Units: input = control error,");
        sb.AppendLine("# output = actuator command. Run 'nonfinite' feeds nan and inf: the step returns the previous output,");
        sb.AppendLine("# holds its states and sets the fault flag. The controller is not a safety function; see the report's caution.");
        sb.AppendLine("run,k,input,expected");
        foreach (var (name, input) in runs)
        {
            var output = format.Kind == NumberFormatKind.Float ? SectionSplitter.FilterSingle(sections, input) : SectionSplitter.Filter(sections, input);
            for (var k = 0; k < input.Length; k++)
            {
                sb.AppendLine(CultureInfo.InvariantCulture, $"{name},{k},{Input(input[k])},{output[k]:R}");
            }
        }

        return sb.ToString();
    }

    public static string Integers(FixedPointCascade cascade, double sampleTime)
    {
        var random = new Random(20261201);
        var max = (1L << (cascade.WordBits - 1)) - 1;
        var runs = new (string Name, long[] Input)[]
        {
            ("impulse", [cascade.ToInteger(1.0), .. Enumerable.Repeat(0L, 99)]),
            ("step", [.. Enumerable.Repeat(cascade.ToInteger(1.0), 100)]),
            ("random", [.. Enumerable.Range(0, 100).Select(_ => cascade.ToInteger((random.NextDouble() - 0.5) * 0.5))]),
            ("saturating", [.. Enumerable.Repeat(max, 50), .. Enumerable.Repeat(-max - 1, 50)]),
        };
        var sb = new StringBuilder();
        sb.AppendLine(CultureInfo.InvariantCulture, $"# CompAssist fixed-point test vectors: signed {cascade.WordBits}-bit integers, signals with {cascade.SignalFractionBits} fractional bits, sample time {sampleTime:R} s.");
        sb.AppendLine("# Feed 'input' to <name>_step from <name>_init; 'expected' must match bit for bit. Runs restart from rest.");
        sb.AppendLine("# The controller is not a safety function; see the report's caution.");
        sb.AppendLine("run,k,input,expected");
        foreach (var (name, input) in runs)
        {
            var output = cascade.Run(input);
            for (var k = 0; k < input.Length; k++)
            {
                sb.AppendLine(CultureInfo.InvariantCulture, $"{name},{k},{input[k]},{output[k]}");
            }
        }

        return sb.ToString();
    }
}
