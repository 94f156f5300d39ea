using System.Globalization;
using System.Text;
using CompAssist.Core.Model;
using CompAssist.Core.Pictures;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Reporting;

/// <summary>The text block that shows what a loop does (shared by the design and check reports).</summary>
public static class CheckTextSection
{
    /// <summary>Appends the step, errors, margins, effort and robustness sections.</summary>
    public static void Append(StringBuilder sb, LoopCheckReport check, RobustnessReport? robustness, PictureStyle style = PictureStyle.Unicode)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(check);
        var m = check.Step;
        sb.AppendLine(check.Solution switch
        {
            StepSolution.ExactDelay => $"Simulated unit step (delays exact, by the method of steps over {N(m.Horizon, 4)} s on a grid of at least 100000 steps; figures read off the grid)",
            StepSolution.PadeApproximant => $"Simulated unit step (delay by its Padé approximant, exact solution over {N(m.Horizon, 4)} s)",
            _ => $"Simulated unit step (exact solution over {N(m.Horizon, 4)} s; every figure solved on it, not read off samples)",
        });
        sb.AppendLine("  figure                     measured    required   predicted   result");
        foreach (var c in check.Checks)
        {
            var result = c.Passes switch { true => "pass", false => c.Valid ? "FAIL" : "FAIL (unstable)", null => string.Empty };
            var measured = c.Valid ? Measured(c) : "-";
            sb.AppendLine($"  {c.Name,-25} {measured,9}   {(c.Required is { } r ? c.BoundSymbol + " " + N(r, 4) : "-"),9}   {(c.Predicted is { } p ? (c.Name == RequirementChecks.PeakTime && double.IsPositiveInfinity(p) ? "none" : N(p, 4)) : "-"),9}   {result}".TrimEnd());
        }

        sb.AppendLine(check.Stable
            ? $"  final value {N(m.FinalValue, 6)}; steady-state error r − y: step {N(Clean(check.StepError), 4)}, ramp {N(check.RampError, 4)}"
            : "  final value and steady-state errors: none (the closed loop is unstable; the step diverges)");
        var k = check.ErrorConstants;
        sb.AppendLine($"  loop type {k.SystemType}; error constants Kp = {N(k.Kp, 5)}, Kv = {N(k.Kv, 5)}, Ka = {N(k.Ka, 5)}");
        TextWrap.AppendTo(sb, "(predictions are the second-order figures of the target pole, not measurements; overshoot and undershoot are measured toward and away from the final value; rise time is 10–90 %; settling time is the last entry into the band; \"none\" means the response never overshoots)");
        sb.Append(StepStripRenderer.Render(check.Output, m.FinalValue, 78, 9, style));
        if (check.TailContinues)
        {
            TextWrap.AppendTo(sb, $"(shown: the transient, 0–{N(check.ShownWindow, 3)} s; a slow tail continues to the simulated {N(m.Horizon, 4)} s, and the figures above include it)");
        }

        sb.AppendLine();

        sb.AppendLine("Margins (loop C·G·H, delays exact, over every crossover)");
        if (check.Margins is { } g)
        {
            AppendMargins(sb, g);
        }
        else
        {
            TextWrap.AppendTo(sb, $"none claimed: the closed loop is UNSTABLE ({check.UnstableRootCount} closed-loop root{(check.UnstableRootCount == 1 ? string.Empty : "s")} in the right half-plane or on the imaginary axis)");
        }

        if (check.Frequency is { } f)
        {
            TextWrap.AppendTo(sb, $"bandwidth ωB = {N(f.Bandwidth, 4)} rad/s (−3 dB of T); peak |T| = {N(f.ComplementaryPeak, 4)} at {Frequency(f.ComplementaryPeakFrequency)}; noise to actuator peak |C·S| = {N(f.NoisePeak, 4)} at {Frequency(f.NoisePeakFrequency)}");
        }

        sb.AppendLine();
        if (check.LoadDisturbance is { } d)
        {
            sb.AppendLine("Load disturbance (a unit step at the plant input, reference 0)");
            TextWrap.AppendTo(sb, $"peak |y| = {N(d.Peak, 4)} at {N(d.PeakTime, 3)} s; offset y(∞) = {N(d.Offset, 4)}{(d.Offset == 0 ? " (integral action)" : string.Empty)}; back within the band of the peak about it at {N(d.RecoveryTime, 4)} s");
            sb.AppendLine();
        }

        var e = check.EffortFigures;
        sb.AppendLine($"Actuator command for a reference step of {N(e.ReferenceStep, 4)}");
        var verdict = e.Saturates ? "SATURATES" : "within";
        var limits = e.Room switch
        {
            null => string.Empty,
            { IsSymmetric: true } r => $", limit {N(r.High, 4)}: {verdict}",
            var r => $"; u − u0 from {N(e.Lowest, 5)} to {N(e.Highest, 5)}, room {N(r.Low, 4)} … {N(r.High, 4)}: {verdict}",
        };
        sb.AppendLine($"  u(0+) = {N(e.Initial, 5)}, peak |u| = {N(e.Peak, 5)} {(double.IsPositiveInfinity(e.PeakTime) ? "approached as t → ∞" : $"at {N(e.PeakTime, 3)} s")}{limits}");
        sb.AppendLine();

        if (robustness is not null)
        {
            sb.AppendLine($"Robustness ({string.Join(", ", robustness.Variations)}; {robustness.Corners.Length} corners)");
            TextWrap.AppendTo(sb, $"every corner stable: {(robustness.AllStable ? "yes" : "NO")}; every corner meets the requirements: {(robustness.AllMeet ? "yes" : "NO")}; worst overshoot {N(robustness.WorstOvershootPercent, 4)} %, worst 2 % settling {N(robustness.WorstSettlingTime2Percent, 4)} s, least ζ {N(robustness.LeastDamping, 3)}");
            foreach (var corner in robustness.Corners.Where(c => !c.Stable))
            {
                sb.AppendLine($"  ✗ unstable at {robustness.Describe(corner)}");
            }

            foreach (var (corner, row) in robustness.WorstFailures())
            {
                TextWrap.AppendTo(sb, $"✗ {row.Name} {N(row.Measured, 4)} against {row.BoundSymbol} {N(row.Required!.Value, 4)} at {robustness.Describe(corner)}");
            }

            sb.AppendLine();
        }
    }

    private static void AppendMargins(StringBuilder sb, StabilityMargins g)
    {
        var up = double.IsFinite(g.GainMarginDb) ? $"{N(g.GainMarginDb, 4)} dB (×{N(Math.Pow(10, g.GainMarginDb / 20), 4)}) at {Frequency(g.PhaseCrossover)}" : "inf (no phase crossover with |L| < 1)";
        sb.AppendLine($"  gain may rise  {up}");
        if (double.IsFinite(g.GainReductionMarginDb))
        {
            TextWrap.AppendTo(sb, $"gain may fall  {N(g.GainReductionMarginDb, 4)} dB (×{N(Math.Pow(10, -g.GainReductionMarginDb / 20), 4)}) at {Frequency(g.GainReductionCrossover)}: with less gain the loop is unstable");
        }

        if (g.GainCrossings.Length == 0)
        {
            sb.AppendLine("  phase margin   inf (|L| never crosses 1); delay margin inf");
        }
        else
        {
            TextWrap.AppendTo(sb, $"phase margin   {N(g.PhaseMarginDeg, 4)}° at {N(g.GainCrossover, 4)} rad/s (the smallest angular distance from L to −1 over {g.GainCrossings.Length} gain crossover{(g.GainCrossings.Length == 1 ? string.Empty : "s")})");
            TextWrap.AppendTo(sb, $"delay margin   {N(g.DelayMargin, 4)} s at {N(g.DelayMarginCrossover, 4)} rad/s (the smallest extra lag that reaches −180°, divided by ωc)");
        }

        if (g.GainCrossings.Length > 1)
        {
            foreach (var c in g.GainCrossings)
            {
                TextWrap.AppendTo(sb, $"crossover {N(c.Frequency, 4)} rad/s: ∠L {N(c.PhaseDegrees, 4)}°, 180° + ∠L = {N(c.SignedMarginDegrees, 4)}°, delay {N(c.DelayMargin, 4)} s", "    ", "      ");
            }
        }

        sb.AppendLine(double.IsPositiveInfinity(g.SensitivityPeakFrequency)
            ? $"  sensitivity peak Ms = {N(g.SensitivityPeak, 4)}, approached as ω → ∞ (|S| never exceeds its high-frequency limit)"
            : $"  sensitivity peak Ms = {N(g.SensitivityPeak, 4)} at {N(g.SensitivityPeakFrequency, 4)} rad/s");
    }

    private static string Frequency(double w) => w == 0 ? "ω = 0 (DC)" : double.IsPositiveInfinity(w) ? "ω → inf" : $"{N(w, 4)} rad/s";

    /// <summary>The verdict block: one status line and the reasons.</summary>
    public static void AppendVerdict(StringBuilder sb, LoopVerdict verdict, RobustnessReport? robustness)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(verdict);
        sb.AppendLine($"Verdict: {verdict.Status(robustness?.Corners.Length ?? 0)}");
        foreach (var reason in verdict.Reasons)
        {
            TextWrap.AppendTo(sb, "✗ " + reason);
        }

        sb.AppendLine();
    }

    private static string Measured(RequirementCheck c) =>
        c.Name == RequirementChecks.PeakTime && double.IsPositiveInfinity(c.Measured) ? "none" : N(c.Measured, 4);

    private static double Clean(double x) => Math.Abs(x) < 1e-12 ? 0.0 : x;

    private static string Db(double x) => double.IsPositiveInfinity(x) ? "inf (no phase crossover)" : N(x, 4) + " dB";

    private static string N(double x, int digits) => TransferFunctionFormatter.Number(x, digits);
}
