using System.Text;
using CompAssist.Core.Export;
using CompAssist.Core.Model;

namespace CompAssist.Core.Reporting;

/// <summary>A hand-off package summed up for people before it is written: sampling, coefficients, the sampled proof, warnings and the caution.</summary>
public static class HandoffSummary
{
    /// <summary>The summary text (80 columns).</summary>
    public static string Render(HandoffPackage package, HandoffOptions options, TransferFunction continuous)
    {
        ArgumentNullException.ThrowIfNull(package);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(continuous);
        var sb = new StringBuilder();
        var proof = package.Proof;
        sb.AppendLine($"sample time    {package.SampleTimeNote}");
        sb.AppendLine($"method         {DiscreteReport.MethodName(options.Method)}");
        sb.AppendLine($"number format  {options.Format}");
        sb.AppendLine($"delay          {(options.ComputationDelay ? "one sample of computation delay in the sampled proof" : "none assumed (output at the sampling instant)")}");
        sb.AppendLine($"anti-windup    {PidExport.Name(options.AntiWindup ?? AntiWindup.Clamping)} (used by the PID export)");
        sb.AppendLine($"derivative     on the {(options.DerivativeOnError ? "error, as designed (kicks on a reference step)" : "measurement (no kick on reference steps)")} (used by the PID export)");
        sb.AppendLine($"sections       {package.Sections.Length} (cascaded, in the order they are applied)");
        TextWrap.AppendTo(sb, $"sampled loop   {(proof.Stable ? "stable" : "UNSTABLE")}, largest |z| = {N(proof.LargestPoleMagnitude, 6)}, overshoot {N(proof.Metrics.OvershootPercent, 4)} %, 2 % settling {N(proof.Metrics.SettlingTime2Percent, 4)} s (ZOH plant{(proof.DelaySamples switch { 0 => string.Empty, 1 => ", 1 sample of delay", var d => $", {d} samples of delay" })})", string.Empty, "               ");
        if (package.Pid is { } pid)
        {
            TextWrap.AppendTo(sb, $"PID exported   {pid.Verdict}: overshoot {N(pid.Reference.OvershootPercent, 4)} %, 2 % settling {N(pid.Reference.SettlingTime2Percent, 4)} s, u − u0 {N(pid.CommandLowest, 4)} … {N(pid.CommandHighest, 4)}, {N(100 * pid.SaturatedFraction, 3)} % on a limit{(pid.Meets ? string.Empty : $" — {ExportedPidProof.Describe(pid)}")}", string.Empty, "               ");
        }

        sb.AppendLine("ladder         each value re-proved sampled (▶ this package):");
        LadderTable.AppendText(sb, package.Ladder, package.Sampled.SampleTime, "  ");
        var warnings = package.Quantization.Warnings.Concat(proof.Warnings).ToList();
        foreach (var w in warnings)
        {
            TextWrap.AppendTo(sb, w, "! ", "  ");
        }

        sb.AppendLine($"files          {string.Join(", ", package.Files.Keys.Order(StringComparer.Ordinal))} and two SVG plots");
        sb.AppendLine();
        sb.Append(DiscreteReport.RenderText(continuous, package.Discretization));
        return sb.ToString();
    }

    private static string N(double x, int digits) => TransferFunctionFormatter.Number(x, digits);
}
