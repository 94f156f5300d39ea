using System.Collections.Immutable;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Reporting;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// A PI, K·(s − z)/s, at a target. Its two parameters meet both conditions at once when the target needs phase
/// lag that a PI can give (less than the angle ∠s* of the target seen from the origin): the zero comes from the
/// angle condition, ∠(s* − z) = ∠s* + φ, and the target is a closed-loop root. Near the uncompensated locus (that
/// zero would sit closer to the origin than the zero fraction of σ, leaving a slow integral) the zero sits at the
/// fraction and the target slides a little along its ζ ray. The pole-cancelling PI puts the zero on the slowest
/// stable real plant pole (common practice, e.g. Åström and Hägglund, Advanced PID Control, on pole cancellation
/// and its poor load-disturbance response).
/// </summary>
public static class PiDesigner
{
    /// <summary>
    /// Designs the PI; <paramref name="cancel"/> asks for the pole-cancelling placement, on
    /// <paramref name="cancelled"/> when given (a stable real plant pole), else on the slowest one.
    /// </summary>
    public static Outcome<Design> Design(Loop loop, TargetPole target, bool cancel, SlowPoleOptions slow, ErrorRequirement? requirement, double? cancelled = null)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(target);
        ArgumentNullException.ThrowIfNull(slow);
        var check = TargetCheck.Refusal(loop, target.Point) ?? SlowZeroDesigner.OptionsProblem(slow, integrator: true);
        if (check is not null)
        {
            return Outcome<Design>.Refused(check);
        }

        var s = target.Point;
        var uncompensated = PointAnalysis.At(loop, s);
        if (cancel)
        {
            return Cancelling(loop, target, uncompensated, requirement, cancelled);
        }

        var deficiency = uncompensated.AngleDeficiencyDegrees;
        var fromOrigin = Angles.ToDegrees(LeadDesigner.AngleSeen(s, 0.0));
        if (deficiency < -LeadDesigner.OnLocusDegrees && deficiency > -fromOrigin)
        {
            var zero = LeadDesigner.PointSeenUnder(s, Angles.ToRadians(fromOrigin + deficiency));
            if (zero < -slow.ZeroFraction * target.Sigma)
            {
                return Exact(loop, target, uncompensated, zero, requirement);
            }
        }

        if (Math.Abs(deficiency) > slow.AngleBudgetDegrees)
        {
            return Outcome<Design>.Refused(
                deficiency > 0
                    ? $"The target needs {F(deficiency)}° of lead; a PI only adds lag (an integrator and a zero)"
                    : $"The target needs {F(-deficiency)}° of lag, more than a PI can give there (less than the {F(fromOrigin)}° under which the target sees the origin)",
                deficiency > 0
                    ? "Use a PID (its derivative zero supplies the angle), or move the target onto the uncompensated locus."
                    : "Move the target toward the uncompensated locus (faster or better damped), or use a PID.");
        }

        var result = SlowZeroDesigner.Add(loop, [], target, requirement, slow, integrator: true);
        if (!result.IsSuccess)
        {
            return Outcome<Design>.Refused(result.Problem);
        }

        var r = result.Value;
        var compensator = Compensator.FromStages(CompensatorKind.PI, r.Gain, r.Stages);
        var design = new Design(loop, r.Target, compensator, null, uncompensated, uncompensated.AngleDeficiencyDegrees, r.Notes) { SteadyState = r.SteadyState };
        return Outcome<Design>.Success(r.Target.Point == s ? design : design with { RequestedTarget = target });
    }

    private static Outcome<Design> Exact(Loop loop, TargetPole target, PointAnalysis uncompensated, double zero, ErrorRequirement? requirement)
    {
        var s = target.Point;
        var angle = Angles.ToDegrees(LeadDesigner.AngleSeen(s, zero) - LeadDesigner.AngleSeen(s, 0.0));
        var stage = new CompensatorStage(CompensatorKind.PI, zero, 0.0, angle);
        var gain = PointAnalysis.At(loop, s, SlowZeroDesigner.Shape([stage])).Gain;
        var notes = ImmutableArray.Create(
            $"The target needs {F(-uncompensated.AngleDeficiencyDegrees)}° of lag: the PI zero at {F(zero)} gives it exactly with the integrator (angle condition), and the gain {F(gain)} the magnitude condition, so the target is a closed-loop root.",
            $"The integral zero at {F(zero)} ({F(zero / -target.Sigma)}·σ): integral time Ti = {F(1 / Math.Abs(zero))} s.");
        return Finish(loop, target, uncompensated, stage, gain, notes, requirement);
    }

    private static Outcome<Design> Cancelling(Loop loop, TargetPole target, PointAnalysis uncompensated, ErrorRequirement? requirement, double? cancelled)
    {
        var stable = loop.Plant.Poles.Where(p => p.Imaginary == 0 && p.Real < 0).OrderByDescending(p => p.Real).ToList();
        if (cancelled is { } chosen)
        {
            stable = [.. stable.Where(p => Math.Abs(p.Real - chosen) <= 1e-6 * Math.Max(1.0, Math.Abs(chosen)))];
            if (stable.Count == 0)
            {
                return Outcome<Design>.Refused(
                    $"The plant has no stable real pole at {F(chosen)} for the PI zero to cancel",
                    $"Plant poles: {string.Join(", ", loop.Plant.Poles.Select(p => TransferFunctionFormatter.Complex(p, 4)))}; a PI cancels only a stable real one.",
                    Setting.LeadZero);
            }
        }

        if (stable.Count == 0)
        {
            return Outcome<Design>.Refused(
                "The plant has no stable real pole for the PI zero to cancel",
                "Use the PI without cancellation (the default placement): an unstable or marginal pole must never be cancelled.");
        }

        var zero = stable[0].Real;
        var stage = new CompensatorStage(CompensatorKind.PI, zero, 0.0, 0.0);
        var shape = SlowZeroDesigner.Shape([stage]);
        var moved = DampingRay.Solve(loop, shape, target);
        if (!moved.IsSuccess)
        {
            return Outcome<Design>.Refused(
                $"With its zero on the plant pole {F(zero)}, the PI's only free parameter is the gain, and its locus does not cross the target's ζ ray near the target",
                "Use the PI without cancellation (the default placement), or a PID.");
        }

        var placed = moved.Value;
        var gain = PointAnalysis.At(loop, placed.Point, shape).Gain;
        var notes = ImmutableArray.CreateBuilder<string>();
        notes.Add($"Pole-cancelling PI: the zero cancels the slowest plant pole {F(zero)} (integral time Ti = {F(1 / Math.Abs(zero))} s, the plant's time constant).");
        if (placed.Point != target.Point)
        {
            notes.Add($"Its only free parameter is the gain: the target moved along its ζ ray to {TransferFunctionFormatter.Complex(placed.Point, 5)}, where the locus crosses it.");
        }

        notes.Add($"Caution: the cancelled pole stays in the response to a load disturbance at the plant input, which recovers with its time constant, about {F(1 / Math.Abs(zero))} s (the reference response does not show it).");
        var design = Finish(loop, placed, uncompensated, stage with { AngleAtTargetDegrees = Angles.ToDegrees(LeadDesigner.AngleSeen(placed.Point, zero) - LeadDesigner.AngleSeen(placed.Point, 0.0)) }, gain, notes.ToImmutable(), requirement);
        return design.IsSuccess && placed.Point != target.Point ? Outcome<Design>.Success(design.Value with { RequestedTarget = target }) : design;
    }

    private static Outcome<Design> Finish(Loop loop, TargetPole target, PointAnalysis uncompensated, CompensatorStage stage, double gain, ImmutableArray<string> notes, ErrorRequirement? requirement)
    {
        var compensator = Compensator.FromStages(CompensatorKind.PI, gain, [stage]);
        var design = new Design(loop, target, compensator, null, uncompensated, uncompensated.AngleDeficiencyDegrees, notes);
        if (requirement is not null)
        {
            var value = Proof.ErrorConstants.Of(loop, compensator.TransferFunction).ValueOf(requirement.Kind);
            var before = Proof.ErrorConstants.Of(loop, TransferFunction.Unity.Scaled(gain)).ValueOf(requirement.Kind);
            design = design with { SteadyState = new SteadyStateResult(requirement, before, value) };
        }

        return Outcome<Design>.Success(design);
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
