using System.Collections.Immutable;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Export;

/// <summary>
/// The hand-off's reference prefilter: F(s) discretized by the package's method at its sample time, stored in its
/// number format as its own section cascade NAME_prefilter (C code and vectors of the same kind as the
/// compensator's), with its DC gain as stored. Firmware runs it on the reference: e = F·r − y.
/// </summary>
internal static class PrefilterExport
{
    /// <summary>The prefilter's files and the note about it (empty when the design has none).</summary>
    public static (ImmutableDictionary<string, string> Files, string Note) Build(DesignReport report, HandoffOptions options, double t, string origin)
    {
        var files = ImmutableDictionary.CreateBuilder<string, string>();
        if (report.Prefilter is not { } prefilter)
        {
            return (files.ToImmutable(), string.Empty);
        }

        var discrete = Discretizer.Discretize(prefilter.Filter, t, options.Method);
        if (!discrete.IsSuccess)
        {
            return (files.ToImmutable(), $"NO PREFILTER CODE: {discrete.Problem.Message}.");
        }

        var d = discrete.Value.Discrete;
        var quantization = Quantizer.Quantize(d, SectionSplitter.Split(d), options.Format);
        var stored = quantization.Sections.Select(q => q.Section).ToImmutableArray();
        var name = options.Name + "_prefilter";
        var what = $"{origin}; reference prefilter F(s) = {prefilter.Filter} (input: the reference; output: the reference the loop follows, e = F·r − y)";
        if (options.Format.Kind != NumberFormatKind.Fixed)
        {
            var (header, source) = CCodeGenerator.Generate(name, stored, t, what, options.Format);
            files.Add($"{name}.h", header);
            files.Add($"{name}.c", source);
            files.Add($"{name}-vectors.csv", SectionVectors.Real(stored, options.Format, t));
        }
        else if (options.Format.WordBits <= FixedPointCascade.MaxWordBits)
        {
            var cascade = FixedPointCascade.Create(quantization.Sections, options.Format.WordBits, options.SignalFractionBits ?? (options.Format.WordBits / 2));
            var (header, source) = FixedPointCodeGenerator.Generate(name, cascade, t, what);
            files.Add($"{name}.h", header);
            files.Add($"{name}.c", source);
            files.Add($"{name}-vectors.csv", SectionVectors.Integers(cascade, t));
        }
        else
        {
            return (files.ToImmutable(), $"NO PREFILTER CODE for {options.Format}: fixed-point code supports words up to {FixedPointCascade.MaxWordBits} bits.");
        }

        var dc = stored.Aggregate(1.0, (g, s) => g * (s.B0 + s.B1 + s.B2) / (1 + s.A1 + s.A2));
        return (files.ToImmutable(), $"Reference prefilter F(s) = {prefilter.Filter}: exported as {name} ({stored.Length} section(s), {options.Method} at T = {TransferFunctionFormatter.Number(t, 5)} s, {options.Format}); run it on the reference (e = F·r − y); its DC gain as stored {TransferFunctionFormatter.Number(dc, 6)} against F(0) = {TransferFunctionFormatter.Number(prefilter.Filter.DcGain, 6)}.");
    }
}
