using System.Collections.Immutable;
using CompAssist.Core.Common;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Export;

/// <summary>
/// Everything a firmware engineer receives for one design: the C header and source, a JSON coefficient file,
/// CSV test vectors and a Markdown report — each stating sample time, form, conventions, units, the source
/// design and the caution.
/// </summary>
/// <param name="Files">File name → content.</param>
/// <param name="Discretization">The discretization used.</param>
/// <param name="Sections">The implemented sections.</param>
/// <param name="Proof">The sampled loop's proof, with the coefficients as stored.</param>
/// <param name="Quantization">What storing the coefficients in the chosen format does.</param>
/// <param name="SampleTimeNote">How the sample time was chosen.</param>
/// <param name="Ladder">The sample times re-proved, and the recommendation they give.</param>
/// <param name="Sampled">The sampled loop at the package's sample time against the requirements the continuous loop meets.</param>
/// <param name="Pid">The PID as exported, run in closed loop (PI, PD and PID designs in double or float); null otherwise.</param>
public sealed record HandoffPackage(
    ImmutableDictionary<string, string> Files,
    Discretizer.Result Discretization,
    ImmutableArray<Section> Sections,
    SampledLoopProof Proof,
    QuantizationReport Quantization,
    string SampleTimeNote,
    SampleTimeLadder Ladder,
    LadderRung Sampled,
    ExportedPidProof? Pid)
{
    /// <summary>True when the sampled loop at the package's sample time meets every requirement the continuous loop meets.</summary>
    public bool SampledMeets => Sampled.Meets;

    /// <summary>True unless an exported PID fails a requirement the continuous loop meets.</summary>
    public bool PidMeets => Pid?.Meets ?? true;

    /// <summary>Builds the package for a proved design.</summary>
    public static Outcome<HandoffPackage> Build(DesignReport report, HandoffOptions options, string caseName)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(options);
        var c = report.Design.Compensator.TransferFunction;
        var loop = report.Design.Loop;
        var margins = report.Check.Margins;
        if (margins is null)
        {
            return Outcome<HandoffPackage>.Refused("The continuous design is unstable", "Fix the design before handing it off.");
        }

        if (options.SampleTime is { } asked && !(asked > 0 && asked <= NumberRange.Largest))
        {
            return Outcome<HandoffPackage>.Refused($"The sample time {F(asked)} s is outside 0 … 1e12 s", "Give a sample time above 0 s (a few hundredths of the loop's fastest time constant, say).", Setting.SampleTime);
        }

        string note;
        double t;
        var wc = margins.GainCrossover;
        var ladder = SampleTimeLadder.Build(loop, c, report.Check, options);
        if (options.SampleTime is { } given)
        {
            t = given;
            note = $"given: T = {F(t)} s";
        }
        else if (ladder.Recommended is { } recommended)
        {
            t = recommended;
            note = $"recommended: T = {F(t)} s, the longest value on the 1-2-5 ladder (from ωs ≥ 25·ωB, ωB = {F(ladder.Bandwidth)} rad/s the closed-loop bandwidth, and ωs ≥ 10× the compensator's fastest corner) at which the sampled loop, re-proved, meets every requirement the continuous loop meets, and so do the shorter values tried";
            if (ladder.Limit is { } limit && limit > t)
            {
                note += $"; {F(limit)} s still meets (a limit, not advice: it leaves no margin for what the model omits)";
            }
        }
        else if (ladder.Rungs.Where(r => r.Meets).Select(r => (double?)r.SampleTime).Max() is { } meets)
        {
            // Some values meet, but a shorter one fails (coefficient quantization grows as the poles near z = 1):
            // the longest value that meets, said as such, not the shortest value tried.
            t = meets;
            note = $"no value on the ladder meets with every shorter value meeting too (a shorter one fails, as stored in {options.Format}); the package uses T = {F(t)} s, the longest value that meets — do not sample faster with these coefficients";
        }
        else
        {
            t = ladder.Rungs.Length > 0 ? ladder.Rungs[^1].SampleTime : ladder.Start;
            note = $"no value on the ladder from {F(ladder.Start)} s down to {F(t)} s meets every requirement the continuous loop meets when sampled; the package uses T = {F(t)} s and FAILS there";
        }

        var discrete = Discretizer.Discretize(c, t, options.Method, options.PrewarpFrequency);
        if (!discrete.IsSuccess)
        {
            return Outcome<HandoffPackage>.Refused(discrete.Problem);
        }

        var sampled = ladder.Rungs.FirstOrDefault(r => r.SampleTime == t) ?? SampleTimeLadder.RungOf(loop, report.Check, options, discrete.Value.Discrete);
        if (!sampled.Meets)
        {
            var better = ladder.Recommended is { } ok && ok != t ? $"; T = {F(ok)} s meets" : string.Empty;
            note += $". At T = {F(t)} s the sampled loop FAILS: {sampled.Binds}{better}";
        }

        if (double.IsFinite(wc))
        {
            var hold = wc * t / 2 * 180 / Math.PI;
            note += $". Phase margin {F(sampled.PhaseMarginDeg)}° sampled against {F(margins.PhaseMarginDeg)}° continuous (the hold alone costs about ωc·T/2 = {F(hold)}°{(options.ComputationDelay ? $", the one-sample computation delay about {F(wc * t * 180 / Math.PI)}°" : string.Empty)}).";
        }

        var d = discrete.Value.Discrete;
        var sections = SectionSplitter.Split(d);
        var quantization = Quantizer.Quantize(d, sections, options.Format);
        var proof = sampled.Proof;
        var origin = $"{(caseName.Length > 0 ? caseName + ": " : string.Empty)}C(s) = {c} for G(s) = {loop.Plant}, H(s) = {loop.Feedback}";
        var files = ImmutableDictionary.CreateBuilder<string, string>();
        if (!CLiterals.IsIdentifier(options.Name))
        {
            return Outcome<HandoffPackage>.Refused($"'{options.Name}' is not a C identifier", "Use letters, digits and underscores, starting with a letter.");
        }

        var stored = quantization.Sections.Select(q => q.Section).ToImmutableArray();
        if (options.Format.Kind != NumberFormatKind.Fixed)
        {
            var (header, source) = CCodeGenerator.Generate(options.Name, stored, t, origin, options.Format);
            files.Add($"{options.Name}.h", header);
            files.Add($"{options.Name}.c", source);
        }

        var vectors = SectionVectors.Real(stored, options.Format, t);
        var fixedNote = string.Empty;
        if (options.Format.Kind == NumberFormatKind.Fixed)
        {
            if (options.Format.WordBits <= FixedPointCascade.MaxWordBits)
            {
                var signalBits = options.SignalFractionBits ?? (options.Format.WordBits / 2);
                FixedPointCascade cascade;
                try
                {
                    cascade = FixedPointCascade.Create(quantization.Sections, options.Format.WordBits, signalBits);
                }
                catch (ArgumentException e)
                {
                    return Outcome<HandoffPackage>.Refused(e.Message.Split(" (Parameter", 2)[0], "Give the fractional bits of the signals between 0 and the word length − 1.", Setting.SignalFractionBits);
                }

                var (fixedHeader, fixedSource) = FixedPointCodeGenerator.Generate(options.Name, cascade, t, origin);
                files.Add($"{options.Name}.h", fixedHeader);
                files.Add($"{options.Name}.c", fixedSource);
                vectors = SectionVectors.Integers(cascade, t);
                fixedNote = $"Fixed point: {options.Format.WordBits}-bit words, signals with {signalBits} fractional bits, coefficient post-shifts {string.Join(", ", quantization.Sections.Select(q => q.FractionalBits))}; the vectors are bit-exact integers.";
            }
            else
            {
                fixedNote = $"No C code for {options.Format}: the fixed-point export supports words up to {FixedPointCascade.MaxWordBits} bits (64-bit accumulators without overflow); the quantization analysis still applies.";
            }
        }

        note += RateAdvice(quantization, discrete.Value, sampled, ladder, t, options.Format);
        var pidPart = PidExport.Build(report, options, t, origin);
        files.AddRange(pidPart.Files);
        var pidNote = pidPart.Note;
        var (prefilterFiles, prefilterNote) = PrefilterExport.Build(report, options, t, origin);
        files.AddRange(prefilterFiles);
        foreach (var extra in new[] { pidNote, fixedNote, prefilterNote }.Where(x => x.Length > 0))
        {
            note += " " + extra;
        }

        files.Add($"{options.Name}.json", HandoffJson.Write(options, discrete.Value, stored, proof, quantization, origin, note, ladder, pidPart.Proof));
        files.Add($"{options.Name}-vectors.csv", vectors);
        files.Add($"{options.Name}-report.md", HandoffReport.Write(report, options, discrete.Value, stored, proof, quantization, origin, note, ladder, caseName, [.. files.Keys, $"{options.Name}-report.md"], pidPart.Proof, sampled));
        return Outcome<HandoffPackage>.Success(new HandoffPackage(files.ToImmutable(), discrete.Value, stored, proof, quantization, note, ladder, sampled, pidPart.Proof));
    }

    /// <summary>
    /// One recommendation about the rate when the coefficients lose accuracy: a longer sample time eases them only
    /// when the loop allows it (a longer value on the ladder still meets and nothing asks for faster sampling);
    /// otherwise the loop's need wins and the remedy is the number format.
    /// </summary>
    private static string RateAdvice(QuantizationReport quantization, Discretizer.Result discrete, LadderRung sampled, SampleTimeLadder ladder, double t, NumberFormat format)
    {
        if (quantization.Warnings.IsEmpty)
        {
            return string.Empty;
        }

        // The loop asks for faster sampling when a corner is beyond a quarter of the sampling frequency, or when it
        // fails here and only a shorter value (or none) on the ladder meets.
        var failsHere = !sampled.Meets && !(ladder.Recommended is { } ok && ok > t);
        var loopWantsFaster = failsHere || discrete.Warnings.Any(w => w.Contains("Sample faster", StringComparison.Ordinal));
        var longest = new[] { ladder.Limit, ladder.Recommended }.Where(x => x is not null).Select(x => x!.Value).DefaultIfEmpty(0).Max();
        return !loopWantsFaster && longest > t
            ? $" Rounding to {format} moves the coefficients at this rate: a longer sample time eases it (up to {F(longest)} s the sampled loop still meets), or store them in a wider format."
            : $" Rounding to {format} moves the coefficients at this rate, and the loop needs this rate or a faster one: store them in a wider format rather than sampling more slowly.";
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 5);
}
