using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Common;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Reporting;
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

        var vectors = Vectors(stored, options.Format, t);
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
                vectors = FixedVectors(cascade, t);
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
        foreach (var extra in new[] { pidNote, fixedNote }.Where(x => x.Length > 0))
        {
            note += " " + extra;
        }

        files.Add($"{options.Name}.json", Json(options, discrete.Value, stored, proof, quantization, origin, note, ladder, pidPart.Proof));
        files.Add($"{options.Name}-vectors.csv", vectors);
        files.Add($"{options.Name}-report.md", Markdown(report, options, discrete.Value, stored, proof, quantization, origin, note, ladder, caseName, [.. files.Keys, $"{options.Name}-report.md"], pidPart.Proof, sampled));
        return Outcome<HandoffPackage>.Success(new HandoffPackage(files.ToImmutable(), discrete.Value, stored, proof, quantization, note, ladder, sampled, pidPart.Proof));
    }

    private static string Vectors(ImmutableArray<Section> sections, NumberFormat format, double sampleTime)
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

    private static string FixedVectors(FixedPointCascade cascade, double sampleTime)
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

    private static string Json(HandoffOptions options, Discretizer.Result discrete, ImmutableArray<Section> sections, SampledLoopProof proof, QuantizationReport quantization, string origin, string note, SampleTimeLadder ladder, ExportedPidProof? pid)
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

    private static string Markdown(DesignReport report, HandoffOptions options, Discretizer.Result discrete, ImmutableArray<Section> sections, SampledLoopProof proof, QuantizationReport quantization, string origin, string note, SampleTimeLadder ladder, string caseName, IEnumerable<string> files, ExportedPidProof? pid, LadderRung sampled)
    {
        var d = discrete.Discrete;
        var m = report.Check.Step;
        var s = proof.Metrics;
        var sb = new StringBuilder();
        sb.AppendLine(CultureInfo.InvariantCulture, $"# Hand-off: {options.Name}");
        sb.AppendLine();
        sb.AppendLine("> **Caution.** " + Cautions.Text);
        sb.AppendLine();
        var verdict = report.Verdict;
        sb.AppendLine(CultureInfo.InvariantCulture, $"**Verdict of the continuous proof:** {verdict.Status(report.Robustness?.Corners.Length ?? 0)}.");
        foreach (var reason in verdict.Reasons)
        {
            sb.AppendLine(CultureInfo.InvariantCulture, $"- ✗ {reason}");
        }

        sb.AppendLine();
        sb.AppendLine(CultureInfo.InvariantCulture, $"- Source design: {origin}");
        sb.AppendLine(CultureInfo.InvariantCulture, $"- Sample time: {F(d.SampleTime)} s ({note})");
        sb.AppendLine(CultureInfo.InvariantCulture, $"- Method: {DiscreteReport.MethodName(discrete.Method)} ({discrete.GainMatching}); computation delay {(options.ComputationDelay ? "one sample" : "none")}");
        sb.AppendLine(CultureInfo.InvariantCulture, $"- Form: cascaded sections in transposed direct form II; coefficients stored as {options.Format}{(options.Format.Kind == NumberFormatKind.Fixed ? $" (fractional bits per section: {string.Join(", ", quantization.Sections.Select(q => q.FractionalBits))}; round to nearest, saturate)" : string.Empty)}; actuator saturation and anti-windup are not included in the section cascade (see the PID export for PID designs)");
        sb.AppendLine(CultureInfo.InvariantCulture, $"- Quantization: largest pole shift {F(quantization.LargestPoleShift)}, largest zero shift {F(quantization.LargestZeroShift)}, DC gain change {F(quantization.DcGainChangePercent)} %; the sampled loop below uses the stored coefficients");
        if (options.Format.Kind != NumberFormatKind.Fixed && DirectFormAccuracy.Of(d, options.Format) is { DirectLosesAccuracy: true } direct)
        {
            sb.AppendLine(CultureInfo.InvariantCulture, $"- Why sections: one direct form in {options.Format} would implement a DC gain of {F(direct.DirectDcGain)} instead of {F(direct.DesignedDcGain)}; the cascaded sections stored the same way implement {F(direct.SectionsDcGain)}. Do not recombine them into one difference equation.");
        }

        sb.AppendLine("- Units: input = control error (measurement units), output = actuator command");
        sb.AppendLine();
        sb.AppendLine("## Sample time: the ladder re-proved");
        sb.AppendLine();
        sb.AppendLine("Each value re-proved sampled against the requirements the continuous loop meets (step figures and phase margin; with none given, the sampled step within 5 points of overshoot and 1.5× the settling time of the continuous one):");
        sb.AppendLine();
        LadderTable.AppendMarkdown(sb, ladder, d.SampleTime);
        sb.AppendLine();
        sb.AppendLine("## Sampled loop (plant by zero-order hold)");
        sb.AppendLine();
        sb.AppendLine("| | continuous | sampled |");
        sb.AppendLine("|---|---|---|");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| overshoot % | {F(m.OvershootPercent)} | {F(s.OvershootPercent)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| 2 % settling (s) | {F(m.SettlingTime2Percent)} | {F(s.SettlingTime2Percent)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| peak time (s) | {F(m.PeakTime)} | {F(s.PeakTime)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| stable | {(report.Check.Stable ? "yes" : "no")} | {(proof.Stable ? "yes" : "NO")} (largest \\|z\\| = {F(proof.LargestPoleMagnitude)}) |");
        sb.AppendLine();
        sb.AppendLine("Closed-loop poles in z (and their s-plane equivalents ln z / T):");
        sb.AppendLine();
        foreach (var (z, e) in proof.ClosedLoopPoles.Zip(proof.EquivalentSPlanePoles))
        {
            sb.AppendLine(CultureInfo.InvariantCulture, $"- {TransferFunctionFormatter.Complex(z, 8)}  →  {TransferFunctionFormatter.Complex(e, 5)}");
        }

        foreach (var w in discrete.Warnings.Concat(quantization.Warnings).Concat(proof.Warnings))
        {
            sb.AppendLine();
            sb.AppendLine("> **Warning.** " + w);
        }

        sb.AppendLine();
        if (pid is not null)
        {
            PidExport.AppendMarkdown(sb, report, pid, sampled);
        }

        sb.AppendLine("## Coefficients");
        sb.AppendLine();
        sb.AppendLine("C(z) = (b0 + b1 z⁻¹ + …)/(1 + a1 z⁻¹ + …); u[k] = Σ bᵢ e[k−i] − Σᵢ≥₁ aᵢ u[k−i].");
        sb.AppendLine();
        sb.AppendLine("| section | b0 | b1 | b2 | a1 | a2 |");
        sb.AppendLine("|---|---|---|---|---|---|");
        for (var i = 0; i < sections.Length; i++)
        {
            var q = sections[i];
            sb.AppendLine(CultureInfo.InvariantCulture, $"| {i + 1} | {q.B0:R} | {q.B1:R} | {q.B2:R} | {q.A1:R} | {q.A2:R} |");
        }

        sb.AppendLine();
        sb.AppendLine(CultureInfo.InvariantCulture, $"Files: {string.Join(", ", files.Order().Select(k => $"`{k}`"))}, `{options.Name}-step.svg` (continuous and sampled step), `{options.Name}-poles.svg` (sampled closed-loop poles in the z-plane).");
        sb.AppendLine();
        sb.AppendLine(CultureInfo.InvariantCulture, $"![continuous and sampled step]({options.Name}-step.svg)");
        sb.AppendLine();
        sb.AppendLine(CultureInfo.InvariantCulture, $"![sampled closed-loop poles]({options.Name}-poles.svg)");
        sb.AppendLine();
        sb.AppendLine("## The continuous design and its proof");
        sb.AppendLine();
        sb.AppendLine("```text");
        sb.Append(DesignTextReport.Render(report, caseName, Pictures.PictureStyle.Ascii));
        sb.AppendLine("```");
        return sb.ToString();
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
