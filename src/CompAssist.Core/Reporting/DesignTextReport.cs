using System.Globalization;
using System.Numerics;
using System.Text;
using CompAssist.Core.Model;
using CompAssist.Core.Pictures;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Reporting;

/// <summary>The design report for people: plain text, 80 columns.</summary>
public static class DesignTextReport
{
    /// <summary>Renders a proved design.</summary>
    public static string Render(DesignReport report, string title = "", PictureStyle style = PictureStyle.Unicode)
    {
        ArgumentNullException.ThrowIfNull(report);
        var sb = new StringBuilder();
        var design = report.Design;
        var loop = design.Loop;
        var requested = report.Selection.Target;
        var target = design.Target;
        var proof = report.Proof;
        var kindName = DesignJsonReport.KindName(design.Compensator.Kind);

        sb.AppendLine(title.Length > 0 ? $"CompAssist {kindName} design — {title}" : $"CompAssist {kindName} design");
        sb.AppendLine();
        sb.AppendLine("Loop");
        sb.AppendLine($"  plant     G(s) = {loop.Plant}");
        sb.AppendLine($"  feedback  H(s) = {loop.Feedback}   ({(loop.Sign == FeedbackSign.Negative ? "negative feedback, 180° angle condition" : "positive feedback, 0° angle condition")})");
        sb.AppendLine();

        sb.AppendLine("Target (dominant closed-loop pole)");
        sb.AppendLine($"  s* = {N(requested.Point.Real)} ± {N(requested.DampedFrequency)}j");
        sb.AppendLine($"  σ = {N(requested.Sigma)} 1/s   ωd = {N(requested.DampedFrequency)} rad/s   ζ = {N(requested.Zeta, 4)}   ωn = {N(requested.NaturalFrequency)} rad/s");
        if (target.Point != requested.Point)
        {
            sb.AppendLine($"  placed at s* = {N(target.Point.Real)} ± {N(target.DampedFrequency)}j (see Synthesis)");
        }
        sb.AppendLine($"  chosen as: {report.Selection.Source}");
        foreach (var c in report.Selection.Constraints)
        {
            TextWrap.AppendTo(sb, $"region: {c.Description}; target has {N(c.Actual, 4)}, margin {Signed(Math.Abs(c.Margin) <= 1e-9 * Math.Max(1.0, Math.Abs(c.Actual)) ? 0.0 : c.Margin)}, {(c.Satisfied ? "inside" : "OUTSIDE")}", "  ", "    ");
        }

        // The predictions are those of the pole the design places (the check's "predicted" column uses it too).
        var p = target.Predict();
        sb.AppendLine(target.Point != requested.Point ? "  second-order predictions of the placed s* (not measurements):" : "  second-order predictions (not measurements):");
        sb.AppendLine(double.IsPositiveInfinity(p.PeakTime)
            ? $"    overshoot 0 % (no visible peak: ζ = {N(target.Zeta, 4)}), so no peak time and no 0–100 % rise"
            : $"    overshoot {N(p.OvershootPercent, 3)} %, peak time {N(p.PeakTime, 3)} s, rise 0–100 % {N(p.RiseTimeZeroToHundred, 3)} s");
        sb.AppendLine($"    settling {N(p.SettlingTime2Percent, 3)} s (2 % band, 4/σ) or {N(p.SettlingTime5Percent, 3)} s (5 % band, 3/σ)");
        sb.AppendLine();
        if (report.Search is { } search)
        {
            SearchSection.Append(sb, search);
        }

        KindComparisonSection.Append(sb, report.KindsCompared, kindName, report.Search?.Objective);

        sb.AppendLine(design.Placement is { } placement ? $"Synthesis ({kindName}, lead placement: {PlacementNames.NameOf(placement)})" : $"Synthesis ({kindName})");
        foreach (var note in design.Notes)
        {
            TextWrap.AppendTo(sb, note, "  ", "    ");
        }

        var i = 1;
        foreach (var st in design.Compensator.Stages)
        {
            var ratio = double.IsNaN(st.PoleZeroRatio) ? string.Empty : $"   pole/zero ratio {N(st.PoleZeroRatio, 4)}";
            TextWrap.AppendTo(sb, $"stage {i++} ({DesignJsonReport.KindName(st.Kind)}): zero {(st.Zero is { } z ? N(z) : "none")}   pole {(st.Pole is { } stagePole ? N(stagePole) : "none")}{ratio}   adds {N(st.AngleAtTargetDegrees, 5)}° at s*", "  ", "    ");
        }

        var c0 = design.Compensator;
        sb.AppendLine($"  C(s) = {c0.TransferFunction}");
        sb.AppendLine($"  gains: factored K = {N(c0.Gain)}  (multiplies Π(s−z)/Π(s−p){(c0.TransferFunction.RelativeDegree == 0 ? "; equals the" : ")")}");
        sb.AppendLine(c0.TransferFunction.RelativeDegree == 0
            ? $"         high-frequency gain)    DC gain C(0) = {N(c0.DcGain)}"
            : $"         DC gain C(0) = {N(c0.DcGain)}");
        sb.AppendLine($"  magnitude condition at s*: |C·G·H| = 1 with K = {N(c0.Gain)}");
        if (c0.Pid is { } pid)
        {
            sb.AppendLine($"  parallel form  Kp + Ki/s + Kd·s/(Tf·s + 1):  Kp = {N(pid.Kp)}, Ki = {N(pid.Ki)} 1/s, Kd = {N(pid.Kd)} s, Tf = {N(pid.Tf)} s");
            sb.AppendLine($"  standard form  Kc(1 + 1/(Ti·s) + Td·s/(1 + Td·s/N)):  Kc = {N(pid.Kc)}, Ti = {N(pid.Ti)} s, Td = {N(pid.Td)} s, N = {N(pid.N)}");
            sb.AppendLine(pid.SeriesKc is { } sk
                ? $"  series form    Kc′(1 + 1/(Ti′·s))(1 + Td′·s):  Kc′ = {N(sk)}, Ti′ = {N(pid.SeriesTi!.Value)} s, Td′ = {N(pid.SeriesTd!.Value)} s"
                : "  series form    not available (a derivative filter or complex zeros)");
        }

        if (design.SteadyState is { } steady)
        {
            sb.AppendLine($"  steady state: {steady.Requirement} required; {steady.Requirement.Symbol} = {N(steady.Before)} before, {N(steady.After)} after: {(steady.Met ? "met" : "NOT MET")}");
        }
        sb.AppendLine();

        sb.AppendLine("Proof (closed loop, all roots by root finding)");
        TextWrap.AppendTo(sb, $"characteristic polynomial (descending powers): {string.Join("  ", proof.CharacteristicDescending.Select(x => N(x)))}", "  ", "    ");
        sb.AppendLine("  closed-loop poles:");
        foreach (var r in proof.Roots.Where(r => r.Value.Imaginary >= 0))
        {
            var pair = r.Value.Imaginary > 0 ? $"{N(r.Value.Real)} ± {N(r.Value.Imaginary)}j" : N(r.Value.Real);
            var role = r.Role switch
            {
                RootRole.Dominant => "target (dominant)",
                RootRole.Cancelled => "on a closed-loop zero",
                _ => string.Empty,
            };
            sb.AppendLine($"    {pair,-28} ζ {N(r.Zeta, 3),-7} ωn {N(r.NaturalFrequency, 4),-9} {role}".TrimEnd());
        }

        var residual = proof.UsesPade ? proof.TargetResidualExactDelay : proof.TargetResidual;
        TextWrap.AppendTo(sb, proof.TargetConfirmed
            ? $"target confirmed as a closed-loop root: relative residual {E(residual)}, nearest computed root {E(proof.TargetRootDistance)}·|s*| away"
            : $"TARGET NOT CONFIRMED: relative residual {E(residual)}, nearest computed root {E(proof.TargetRootDistance)}·|s*| away", "  ", "    ");
        TextWrap.AppendTo(sb, $"roots verified: largest relative residual {E(proof.RootEvidence.MaxRelativeResidual)}, largest last Newton step {E(proof.RootEvidence.MaxRelativeStep)}", "  ", "    ");
        sb.AppendLine($"  dominance ratio (slowest other pole's σ / target σ): {Dominance(proof.DominanceRatio)}");
        var zeros = proof.ClosedLoopZeros.Where(z => z.Imaginary >= 0).Select(Pair).ToList();
        sb.AppendLine($"  closed-loop zeros: {(zeros.Count == 0 ? "none" : string.Join(", ", zeros))}");
        sb.AppendLine($"  stable: {(proof.Stable ? "yes" : "NO")}");
        sb.AppendLine();

        sb.AppendLine("s-plane (locus of the compensated loop; ■ the designed closed-loop poles)");
        LocusReport.AppendFeatures(sb, report.Locus, relativeToDesign: true);
        var scene = new SPlaneScene
        {
            Branches = LocusReport.Polylines(report.Locus),
            Poles = report.Locus.Poles,
            Zeros = report.Locus.Zeros,
            ClosedLoopPoles = [.. proof.Roots.Select(r => r.Value)],
            Target = target.Point,
            ZetaGuide = target.Zeta,
            NaturalFrequencyGuide = target.NaturalFrequency,
        };
        // Always framed: the target, and every closed-loop pole that is unstable or slower than the target.
        var mustShow = PlaneView.MustShow(target.Point, proof.Roots.Select(r => r.Value));
        var view = PlaneView.Frame(mustShow, report.Locus.Poles.Concat(report.Locus.Zeros).Concat(proof.Roots.Select(r => r.Value)));
        sb.Append(SPlaneRenderer.Render(scene, view, 78, 20, style));
        sb.AppendLine();
        CheckTextSection.Append(sb, report.Check, report.Robustness, style);
        PrefilterSection.Append(sb, report);
        CheckTextSection.AppendVerdict(sb, report.Verdict, report.Robustness);
        var warnings = proof.Warnings.AddRange(report.Check.Warnings);
        if (warnings.Length > 0)
        {
            sb.AppendLine("Warnings");
            foreach (var w in warnings)
            {
                TextWrap.AppendTo(sb, w, "  ! ", "    ");
            }

            sb.AppendLine();
        }

        Cautions.AppendSection(sb);

        return sb.ToString();
    }

    private static string Pair(Complex z) => z.Imaginary > 0 ? $"{N(z.Real)} ± {N(z.Imaginary)}j" : N(z.Real);

    private static string N(double x, int digits = 5) => TransferFunctionFormatter.Number(x, digits);

    private static string E(double x) => x.ToString("0.0E+0", CultureInfo.InvariantCulture);

    private static string Dominance(double ratio) => ratio switch
    {
        double.PositiveInfinity => "no other poles",
        <= 0 => "none: another closed-loop pole is unstable",
        < 1 => $"{N(ratio, 3)} (another pole is slower than the target: the target pair does not dominate)",
        _ => N(ratio, 3),
    };

    private static string Signed(double x) => (x >= 0 ? "+" : string.Empty) + N(x, 3);
}
