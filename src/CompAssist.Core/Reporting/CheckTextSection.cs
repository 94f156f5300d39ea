using System.Globalization;
using System.Text;
using CompAssist.Core.Model;
using CompAssist.Core.Pictures;
using CompAssist.Core.Proof;

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
        sb.AppendLine($"Simulated unit step (exact at {N(m.SampleTime, 3)} s samples over {N(m.Horizon, 4)} s)");
        sb.AppendLine("  figure                     measured    required   predicted   result");
        foreach (var c in check.Checks)
        {
            var result = c.Passes switch { true => "pass", false => "FAIL", null => string.Empty };
            sb.AppendLine($"  {c.Name,-25} {N(c.Measured, 4),9}   {(c.Required is { } r ? "≤ " + N(r, 4) : "-"),9}   {(c.Predicted is { } p ? N(p, 4) : "-"),9}   {result}".TrimEnd());
        }

        sb.AppendLine($"  final value {N(m.FinalValue, 6)}; steady-state error r − y: step {N(Clean(check.StepError), 4)}, ramp {N(check.RampError, 4)}");
        var k = check.ErrorConstants;
        sb.AppendLine($"  loop type {k.SystemType}; error constants Kp = {N(k.Kp, 5)}, Kv = {N(k.Kv, 5)}, Ka = {N(k.Ka, 5)}");
        TextWrap.AppendTo(sb, "(predictions are the second-order figures of the target pole; rise time is measured 10–90 %)");
        sb.Append(StepStripRenderer.Render(check.Output, m.FinalValue, 78, 9, style));
        sb.AppendLine();

        sb.AppendLine("Margins (loop C·G·H, delays exact)");
        if (check.Margins is { } g)
        {
            sb.AppendLine($"  gain margin   {Db(g.GainMarginDb)}{(double.IsFinite(g.GainMarginDb) ? $" at {N(g.PhaseCrossover, 4)} rad/s" : string.Empty)}{(double.IsFinite(g.GainReductionMarginDb) ? $"; gain may fall {N(g.GainReductionMarginDb, 3)} dB" : string.Empty)}");
            sb.AppendLine($"  phase margin  {N(g.PhaseMarginDeg, 4)}° at {N(g.GainCrossover, 4)} rad/s; delay margin {N(g.DelayMargin, 4)} s");
            sb.AppendLine($"  sensitivity peak Ms = {N(g.SensitivityPeak, 4)} at {N(g.SensitivityPeakFrequency, 4)} rad/s");
        }
        else
        {
            sb.AppendLine("  not claimed: the closed loop is unstable");
        }

        sb.AppendLine();
        var e = check.EffortFigures;
        sb.AppendLine($"Actuator command for a reference step of {N(e.ReferenceStep, 4)}");
        sb.AppendLine($"  u(0+) = {N(e.Initial, 5)}, peak |u| = {N(e.Peak, 5)} at {N(e.PeakTime, 3)} s{(e.Limit is { } l ? $", limit {N(l, 4)}: {(e.Saturates ? "SATURATES" : "within")}" : string.Empty)}");
        sb.AppendLine();

        if (robustness is not null)
        {
            sb.AppendLine($"Robustness ({string.Join(", ", robustness.Variations)}; {robustness.Corners.Length} corners)");
            TextWrap.AppendTo(sb, $"every corner stable: {(robustness.AllStable ? "yes" : "NO")}; worst overshoot {N(robustness.WorstOvershootPercent, 4)} %, worst 2 % settling {N(robustness.WorstSettlingTime2Percent, 4)} s, least ζ {N(robustness.LeastDamping, 3)}");
            foreach (var corner in robustness.Corners.Where(c => !c.Stable))
            {
                sb.AppendLine($"  ! unstable at factors {string.Join(", ", corner.Factors.Select(f => N(f, 3)))}");
            }

            sb.AppendLine();
        }
    }

    private static double Clean(double x) => Math.Abs(x) < 1e-12 ? 0.0 : x;

    private static string Db(double x) => double.IsPositiveInfinity(x) ? "inf (no phase crossover)" : N(x, 4) + " dB";

    private static string N(double x, int digits) => double.IsNaN(x) ? "n/a" : TransferFunctionFormatter.Number(x, digits);
}
