using System.Collections.Immutable;
using System.Globalization;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>Every compensator family by the angle and magnitude conditions, on one entry point.</summary>
public static class Synthesizer
{
    /// <summary>Designs a compensator of the given kind for the target.</summary>
    public static Outcome<Design> Design(Loop loop, TargetPole target, CompensatorKind kind, LeadOptions lead, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(target);
        ArgumentNullException.ThrowIfNull(lead);
        ArgumentNullException.ThrowIfNull(slow);
        return kind switch
        {
            CompensatorKind.Lead => WithRequirementCheck(LeadDesigner.Design(loop, target, lead), loop, requirement),
            CompensatorKind.Lag => Lag(loop, target, slow, requirement),
            CompensatorKind.LeadLag => LeadLag(loop, target, lead, slow, requirement),
            CompensatorKind.PD => Pd(loop, target, slow, requirement),
            CompensatorKind.PI => Pi(loop, target, slow, requirement),
            CompensatorKind.PID => Pid(loop, target, slow, requirement),
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown compensator kind."),
        };
    }

    private static Outcome<Design> Lag(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement) =>
        SlowOnly(loop, target, slow, requirement, CompensatorKind.Lag,
            "a lag alone only fixes the steady state and must leave the transient (the locus) nearly unchanged",
            "Use lead-lag (lead for the transient, lag for the error), or move the target onto the uncompensated locus.");

    private static Outcome<Design> LeadLag(Loop loop, TargetPole target, LeadOptions lead, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        var leadDesign = LeadDesigner.Design(loop, target, lead);
        if (!leadDesign.IsSuccess)
        {
            return Outcome<Design>.Refused(leadDesign.Problem);
        }

        var result = SlowZeroDesigner.Add(loop, leadDesign.Value.Compensator.Stages, target, requirement, slow, integrator: false);
        return Finish(loop, target, leadDesign.Value.Uncompensated, CompensatorKind.LeadLag, lead.Placement, result, leadDesign.Value.Notes);
    }

    private static Outcome<Design> Pi(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement) =>
        SlowOnly(loop, target, slow, requirement, CompensatorKind.PI,
            "a PI only adds an integrator and must leave the locus nearly unchanged near the target",
            "Use a PID (its derivative zero supplies the angle), or move the target onto the uncompensated locus.");

    /// <summary>A lag or a PI on its own: valid only where the target is (nearly) on the uncompensated locus.</summary>
    private static Outcome<Design> SlowOnly(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement, CompensatorKind kind, string why, string hint)
    {
        var check = CheckTarget(loop, target);
        if (check is not null)
        {
            return Outcome<Design>.Refused(check);
        }

        var uncompensated = PointAnalysis.At(loop, target.Point);
        if (Math.Abs(uncompensated.AngleDeficiencyDegrees) > slow.AngleBudgetDegrees)
        {
            return Outcome<Design>.Refused($"The target needs {F(uncompensated.AngleDeficiencyDegrees)}° of angle; {why}", hint);
        }

        var integrator = kind == CompensatorKind.PI;
        return Finish(loop, target, uncompensated, kind, null, SlowZeroDesigner.Add(loop, [], target, requirement, slow, integrator), []);
    }

    private static Outcome<Design> Pd(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        var check = CheckTarget(loop, target);
        if (check is not null)
        {
            return Outcome<Design>.Refused(check);
        }

        var uncompensated = PointAnalysis.At(loop, target.Point);
        var stage = DerivativeStage(loop, target, uncompensated.AngleDeficiencyDegrees, slow.FilterRatio);
        if (!stage.IsSuccess)
        {
            return Outcome<Design>.Refused(stage.Problem);
        }

        var stages = ImmutableArray.Create(stage.Value);
        var gain = PointAnalysis.At(loop, target.Point, SlowZeroDesigner.Shape(stages)).Gain;
        var notes = ImmutableArray.CreateBuilder<string>();
        notes.Add($"The PD zero supplies the {F(uncompensated.AngleDeficiencyDegrees)}° the target needs.");
        notes.Add(slow.FilterRatio is { } n
            ? $"Derivative filter pole at {F(stage.Value.Pole!.Value)} (N = {F(n)} times the zero), counted in the angle sum."
            : "Ideal PD is improper: it kicks the actuator at every reference step and cannot be discretized as it is. Add a filter (--filter-ratio N, e.g. 10) before hand-off.");
        var design = Build(loop, target, uncompensated, CompensatorKind.PD, null, stages, gain, notes.ToImmutable(), null);
        return WithRequirementCheck(Outcome<Design>.Success(design), loop, requirement);
    }

    private static Outcome<Design> Pid(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        var check = CheckTarget(loop, target);
        if (check is not null)
        {
            return Outcome<Design>.Refused(check);
        }

        if (!(slow.ZeroFraction > 0) || slow.ZeroFraction >= 1)
        {
            return Outcome<Design>.Refused($"A PI zero at {F(slow.ZeroFraction)} of the target's real part would sit at or right of the target", "Give a zero fraction between 0 and 1 (about 0.1 is usual).");
        }

        var uncompensated = PointAnalysis.At(loop, target.Point);
        var s = target.Point;

        // The integral zero first (near the origin), then the derivative zero supplies everything else,
        // the integrator's and the integral zero's angle included (joint design).
        var piZero = -slow.ZeroFraction * target.Sigma;
        var piAngle = Angles.ToDegrees(LeadDesigner.AngleSeen(s, piZero) - LeadDesigner.AngleSeen(s, 0.0));
        var pi = new CompensatorStage(CompensatorKind.PI, piZero, 0.0, piAngle);
        var needed = uncompensated.AngleDeficiencyDegrees - piAngle;
        var withPi = loop.WithPlant(loop.Plant * SlowZeroDesigner.Shape([pi]));
        var derivative = DerivativeStage(withPi, target, needed, slow.FilterRatio);
        if (!derivative.IsSuccess)
        {
            return Outcome<Design>.Refused(derivative.Problem);
        }

        var stages = ImmutableArray.Create(pi, derivative.Value);
        var gain = PointAnalysis.At(loop, s, SlowZeroDesigner.Shape(stages)).Gain;
        var notes = ImmutableArray.CreateBuilder<string>();
        notes.Add($"Integral zero at {F(piZero)} ({F(slow.ZeroFraction)}·σ) with the integrator: {F(piAngle)}° at the target.");
        notes.Add($"Derivative zero at {F(derivative.Value.Zero!.Value)} supplies the remaining {F(needed)}° (the integrator's angle counted).");
        notes.Add(slow.FilterRatio is { } n
            ? $"Derivative filter pole at {F(derivative.Value.Pole!.Value)} (N = {F(n)}), counted in the angle sum."
            : "Ideal PID is improper: it kicks the actuator at every reference step and cannot be discretized as it is. Add a filter (--filter-ratio N) before hand-off.");
        var design = Build(loop, target, uncompensated, CompensatorKind.PID, null, stages, gain, notes.ToImmutable(), null);
        return WithRequirementCheck(Outcome<Design>.Success(design), loop, requirement);
    }

    /// <summary>A PD zero (ideal) or zero with filter pole at N times it, adding <paramref name="angle"/> degrees at the target.</summary>
    private static Outcome<CompensatorStage> DerivativeStage(Loop loop, TargetPole target, double angle, double? filterRatio)
    {
        var s = target.Point;
        if (!(angle > 0.05))
        {
            return Outcome<CompensatorStage>.Refused(
                $"The target needs {F(angle)}° and a derivative zero can only add positive angle",
                "Move the target left or up (faster), or use a lag-type compensator for this target.");
        }

        if (filterRatio is { } n)
        {
            var lead = LeadDesigner.Design(loop, target, new LeadOptions { Placement = LeadPlacement.Ratio, Ratio = n, MaxStageAngleDegrees = 89.99 });
            if (!lead.IsSuccess || lead.Value.StageCount != 1)
            {
                return Outcome<CompensatorStage>.Refused(
                    lead.Problem ?? new Problem($"A filtered derivative with N = {F(n)} cannot add {F(angle)}° in one stage", "Raise N or move the target."));
            }

            var st = lead.Value.Compensator.Stages[0];
            return Outcome<CompensatorStage>.Success(new CompensatorStage(CompensatorKind.PD, st.Zero, st.Pole, st.AngleAtTargetDegrees));
        }

        if (angle >= Angles.ToDegrees(LeadDesigner.AngleSeen(s, 0.0)))
        {
            return Outcome<CompensatorStage>.Refused(
                $"A single zero cannot add {F(angle)}° here without sitting in the right half-plane",
                "Move the target, or use a lead with several stages.");
        }

        var zero = LeadDesigner.PointSeenUnder(s, Angles.ToRadians(angle));
        if (zero >= -1e-9 * s.Magnitude)
        {
            return Outcome<CompensatorStage>.Refused(
                $"The derivative zero would sit at the origin or right of it to add {F(angle)}° here",
                "Move the target left, or use a lead with a separate pole.");
        }

        return Outcome<CompensatorStage>.Success(new CompensatorStage(CompensatorKind.PD, zero, null, angle));
    }

    private static Outcome<Design> Finish(Loop loop, TargetPole target, PointAnalysis uncompensated, CompensatorKind kind, LeadPlacement? placement, Outcome<SlowZeroDesigner.Result> result, ImmutableArray<string> earlierNotes)
    {
        if (!result.IsSuccess)
        {
            return Outcome<Design>.Refused(result.Problem);
        }

        var r = result.Value;
        var design = Build(loop, r.Target, uncompensated, kind, placement, r.Stages, r.Gain, earlierNotes.AddRange(r.Notes), r.SteadyState);
        return Outcome<Design>.Success(r.Target.Point == target.Point ? design : design with { RequestedTarget = target });
    }

    private static Design Build(Loop loop, TargetPole target, PointAnalysis uncompensated, CompensatorKind kind, LeadPlacement? placement, ImmutableArray<CompensatorStage> stages, double gain, ImmutableArray<string> notes, SteadyStateResult? steady)
    {
        var compensator = Compensator.FromStages(kind, gain, stages);
        return new Design(loop, target, compensator, placement, uncompensated, uncompensated.AngleDeficiencyDegrees, notes) { SteadyState = steady };
    }

    /// <summary>Reports, for designs that do not size for it, whether a given requirement is met.</summary>
    private static Outcome<Design> WithRequirementCheck(Outcome<Design> outcome, Loop loop, ErrorRequirement? requirement)
    {
        if (!outcome.IsSuccess || requirement is null)
        {
            return outcome;
        }

        var value = Proof.ErrorConstants.Of(loop, outcome.Value.Compensator.TransferFunction).ValueOf(requirement.Kind);
        return Outcome<Design>.Success(outcome.Value with { SteadyState = new SteadyStateResult(requirement, value, value) });
    }

    private static Problem? CheckTarget(Loop loop, TargetPole target)
    {
        var s = target.Point;
        if (s.Real >= 0)
        {
            return new Problem($"The target {TransferFunctionFormatter.Complex(s, 4)} is not in the left half-plane", "Choose a target with a negative real part.");
        }

        if (s.Imaginary <= 0)
        {
            return new Problem("The target is on the real axis; these constructions need a complex target", "Give a target with ωd > 0.");
        }

        var open = loop.PlantTimesFeedback;
        if (open.Poles.Concat(open.Zeros).Any(r => System.Numerics.Complex.Abs(r - s) <= 1e-9 * Math.Max(1.0, s.Magnitude)))
        {
            return new Problem("The target coincides with an open-loop pole or zero; the angle condition is undefined there", "Move the target slightly.");
        }

        return null;
    }

    private static string F(double x) => x.ToString("G4", CultureInfo.InvariantCulture);
}
