using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Reporting;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Export;

/// <summary>The package's Markdown report: the design, the sampled proof, the ladder, the stored form, the PID as exported and the caution.</summary>
internal static class HandoffReport
{
    public static string Write(DesignReport report, HandoffOptions options, Discretizer.Result discrete, ImmutableArray<Section> sections, SampledLoopProof proof, QuantizationReport quantization, string origin, string note, SampleTimeLadder ladder, string caseName, IEnumerable<string> files, ExportedPidProof? pid, LadderRung sampled)
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

    private static string F(double x) => TransferFunctionFormatter.Number(x, 5);
}
