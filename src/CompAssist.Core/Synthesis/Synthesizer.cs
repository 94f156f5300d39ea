using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
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
        return WithinRange(kind switch
        {
            CompensatorKind.Lead => WithRequirementCheck(WithAlternative(LeadDesigner.Design(loop, target, lead), loop, target, lead), loop, requirement),
            CompensatorKind.Lag => Lag(loop, target, slow, requirement),
            CompensatorKind.LeadLag => slow.EqualFactor ? EqualFactorLeadLag(loop, target, slow, requirement) : LeadLagDesigner.Design(loop, target, lead, slow, requirement),
            CompensatorKind.PD => Pd(loop, target, slow, requirement),
            CompensatorKind.PI => PiDesigner.Design(loop, target, lead.Placement == LeadPlacement.Cancel, slow, requirement, lead.Placement == LeadPlacement.Cancel ? lead.Zero : null),
            CompensatorKind.PID => Pid(loop, target, lead, slow, requirement),
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown compensator kind."),
        });
    }

    /// <summary>
    /// Refuses a compensator whose gain, zeros or poles leave the range of <see cref="NumberRange"/>: it could
    /// not be read back, and a loop with such coefficients (a gain of 1e13 on a plant in seconds) is beyond
    /// what a step or a root can be computed on faithfully — and beyond any actuator.
    /// </summary>
    private static Outcome<Design> WithinRange(Outcome<Design> outcome)
    {
        if (!outcome.IsSuccess)
        {
            return outcome;
        }

        var c = outcome.Value.Compensator.TransferFunction;
        var roots = c.Zeros.Concat(c.Poles).Select(r => r.Magnitude);
        var worst = new[] { Math.Abs(c.Gain) }.Concat(roots).Where(m => !NumberRange.Contains(m)).DefaultIfEmpty(double.NaN).Max();
        return double.IsNaN(worst)
            ? outcome
            : Outcome<Design>.Refused(
                $"The compensator would need a coefficient of {F(worst)}, outside the range this tool accepts (1e-12 … 1e12 in magnitude)",
                "Choose a slower target (a longer settling time or peak time), or rescale the time unit so the loop's numbers stay in range.",
                Setting.Target);
    }

    /// <summary>
    /// When the chosen lead placement is refused, the hint names the placements that do design at this target
    /// (bisector, beneath, cancel, ratio 10, in that order) with their zero and pole, so the user is not left
    /// with the refusal alone.
    /// </summary>
    private static Outcome<Design> WithAlternative(Outcome<Design> outcome, Loop loop, TargetPole target, LeadOptions lead)
    {
        if (outcome.IsSuccess || TargetCheck.Refusal(loop, target.Point) is not null)
        {
            return outcome;
        }

        LeadOptions[] others =
        [
            lead with { Placement = LeadPlacement.Bisector, Zero = null, Pole = null, Ratio = null },
            lead with { Placement = LeadPlacement.Beneath, Zero = null, Pole = null, Ratio = null },
            lead with { Placement = LeadPlacement.Cancel, Zero = null, Pole = null, Ratio = null },
            lead with { Placement = LeadPlacement.Ratio, Zero = null, Pole = null, Ratio = 10 },
        ];
        var working = others
            .Where(o => o.Placement != lead.Placement)
            .Select(o => (Options: o, Design: LeadDesigner.Design(loop, target, o)))
            .Where(x => x.Design.IsSuccess)
            .Select(x => $"{PlacementNames.NameOf(x.Options.Placement)} placement{(x.Options.Ratio is { } r ? $" (ratio {F(r)})" : string.Empty)} works here (first stage zero {F(x.Design.Value!.Compensator.Stages[0].Zero!.Value)}, pole {F(x.Design.Value.Compensator.Stages[0].Pole!.Value)})")
            .ToList();
        if (working.Count == 0)
        {
            return outcome;
        }

        var problem = outcome.Problem;
        return Outcome<Design>.Refused(problem with { Hint = $"{problem.Hint} The {string.Join("; the ", working)}." });
    }

    private static Outcome<Design> Lag(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement) =>
        SlowOnly(loop, target, slow, requirement, CompensatorKind.Lag,
            "a lag alone only fixes the steady state and must leave the transient (the locus) nearly unchanged",
            "Use lead-lag (lead for the transient, lag for the error), or move the target onto the uncompensated locus.");

    /// <summary>A lag on its own: valid only where the target is (nearly) on the uncompensated locus.</summary>
    private static Outcome<Design> SlowOnly(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement, CompensatorKind kind, string why, string hint)
    {
        var check = TargetCheck.Refusal(loop, target.Point);
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

    /// <summary>
    /// Lead-lag with one ratio β for both parts (common practice; Ogata, Modern Control Engineering, 5th ed.,
    /// section 6-9, the case of equal factors): the gain Kc is fixed first by the error constant (lead and lag
    /// DC factors cancel), the lead zero and pole then satisfy both the angle and the magnitude condition at the
    /// target, and the lag zero sits near the origin with its pole at the zero over β. The lag shifts the
    /// closed-loop pole slightly; the design reports the pole it really places.
    /// </summary>
    private static Outcome<Design> EqualFactorLeadLag(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        var check = TargetCheck.Refusal(loop, target.Point);
        if (check is not null)
        {
            return Outcome<Design>.Refused(check);
        }

        if (requirement is null)
        {
            return Outcome<Design>.Refused("The equal-factor lead-lag fixes its gain from the error constant", "Give a steady-state requirement: an error constant Kp, Kv or Ka, or a steady-state error.", Setting.SteadyState);
        }

        var plantConstant = Proof.ErrorConstants.Of(loop, TransferFunction.Unity).ValueOf(requirement.Kind);
        if (!(plantConstant > 0) || double.IsInfinity(plantConstant))
        {
            return Outcome<Design>.Refused(
                $"{requirement.Symbol} of G·H is {F(plantConstant)}: the gain cannot be fixed from it",
                "Use the independent lead-lag, or a PI/PID to change the system type.");
        }

        var kc = requirement.Value / plantConstant;
        var s = target.Point;
        var uncompensated = PointAnalysis.At(loop, s);
        var phi = Angles.ToRadians(uncompensated.AngleDeficiencyDegrees);
        if (!(phi > 0) || phi >= Math.PI / 2)
        {
            return Outcome<Design>.Refused(
                $"The equal-factor lead must add {F(uncompensated.AngleDeficiencyDegrees)}° in one stage, outside 0°…90°",
                "Use the independent lead-lag (it can split the lead into stages) or move the target.");
        }

        var magnitude = kc * uncompensated.Magnitude;

        // Magnitude mismatch ln(Kc|GH|·|s − z|/|s − p(z)|) along z = −e^u, with p(z) from the angle condition.
        double Mismatch(double u)
        {
            var z = -Math.Exp(u);
            var thetaP = LeadDesigner.AngleSeen(s, z) - phi;
            if (thetaP <= 0)
            {
                return double.NaN;
            }

            var pole = LeadDesigner.PointSeenUnder(s, thetaP);
            return Math.Log(magnitude * Complex.Abs(s - z) / Complex.Abs(s - pole));
        }

        var centre = Math.Log(s.Magnitude);
        double? found = null;
        var previousU = centre - 12;
        var previous = Mismatch(previousU);
        for (var i = 1; i <= 600 && found is null; i++)
        {
            var u = centre - 12 + (24.0 * i / 600);
            var value = Mismatch(u);
            if (double.IsFinite(previous) && double.IsFinite(value) && Math.Sign(previous) != Math.Sign(value))
            {
                found = -Math.Exp(Bisection.Root(Mismatch, previousU, u, previous, m => 1e-15 * Math.Max(1.0, Math.Abs(m))));
            }

            (previousU, previous) = (u, value);
        }

        if (found is not { } leadZero)
        {
            return Outcome<Design>.Refused(
                $"No lead with the gain Kc = {F(kc)} fixed by {requirement} meets both conditions at this target",
                "Use the independent lead-lag, or relax the error constant or the target.");
        }

        var leadPole = LeadDesigner.PointSeenUnder(s, LeadDesigner.AngleSeen(s, leadZero) - phi);
        var beta = leadPole / leadZero;
        var lagZero = -slow.ZeroFraction * target.Sigma;
        var lagPole = lagZero / beta;
        var stages = ImmutableArray.Create(
            new CompensatorStage(CompensatorKind.Lead, leadZero, leadPole, Angles.ToDegrees(phi)),
            new CompensatorStage(CompensatorKind.Lag, lagZero, lagPole, Angles.ToDegrees(LeadDesigner.AngleSeen(s, lagZero) - LeadDesigner.AngleSeen(s, lagPole))));

        // The factored gain is Kc itself: the lead's DC factor 1/β and the lag's β cancel.
        var compensator = Compensator.FromStages(CompensatorKind.LeadLag, kc, stages);
        var roots = Numerics.RootFinder.Find(loop.Characteristic(compensator.TransferFunction)).Roots;
        var placed = TargetPole.At(roots.OrderBy(r => Complex.Abs(r - s)).First());
        if (Complex.Abs(placed.Point - s) > 0.1 * s.Magnitude)
        {
            return Outcome<Design>.Refused(
                $"With the same ratio β = {F(leadPole / leadZero)} the lag moves the closed-loop pole from the target to {TransferFunctionFormatter.Complex(placed.Point, 4)}",
                "Lower the lag's zero fraction, or use the independent lead-lag.", Setting.ZeroFraction);
        }

        var notes = ImmutableArray.Create(
            $"Equal-factor variant: the gain Kc = {F(kc)} is fixed first by {requirement} (the lead's and the lag's DC factors cancel).",
            $"The lead zero {F(leadZero)} and pole {F(leadPole)} meet the angle ({F(uncompensated.AngleDeficiencyDegrees)}°) and the magnitude condition at the target with that gain: ratio β = {F(beta)}.",
            $"The lag uses the same ratio: zero {F(lagZero)} ({F(slow.ZeroFraction)}·σ), pole {F(lagPole)}; it shifts the closed-loop pole slightly, to {TransferFunctionFormatter.Complex(placed.Point, 5)}.");
        var achieved = Proof.ErrorConstants.Of(loop, compensator.TransferFunction).ValueOf(requirement.Kind);
        var design = new Design(loop, placed, compensator, null, uncompensated, uncompensated.AngleDeficiencyDegrees, notes)
        {
            SteadyState = new SteadyStateResult(requirement, plantConstant, achieved),
            RequestedTarget = target,
        };
        return Outcome<Design>.Success(design);
    }

    private static Outcome<Design> Pd(Loop loop, TargetPole target, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        var check = TargetCheck.Refusal(loop, target.Point);
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
            ? $"Derivative filter pole at {F(stage.Value.Pole!.Value)} (filter pole/zero ratio {F(n)}: the pole sits {F(n)} times as far out as the zero), counted in the angle sum."
            : "Ideal PD is improper: it kicks the actuator at every reference step and cannot be discretized as it is. Add a derivative filter (a filter ratio of about 10) before hand-off.");
        var design = Build(loop, target, uncompensated, CompensatorKind.PD, null, stages, gain, notes.ToImmutable(), null);
        return WithRequirementCheck(Outcome<Design>.Success(design), loop, requirement);
    }

    private static Outcome<Design> Pid(Loop loop, TargetPole target, LeadOptions lead, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        var check = TargetCheck.Refusal(loop, target.Point);
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
        var piCanGive = uncompensated.AngleDeficiencyDegrees < 0 && -uncompensated.AngleDeficiencyDegrees < Angles.ToDegrees(LeadDesigner.AngleSeen(s, 0.0));
        if (needed < 0 && !piCanGive && needed + 360 <= lead.MaxStageAngleDegrees * (LeadOptions.MaxStages + 1))
        {
            // The angle condition holds modulo 360°: a lag of x° that no PI can give is also 360° − x° of lead.
            needed += 360;
        }

        if (needed <= 0.05)
        {
            // The lag a PI gives exactly by its zero (360° less it as lead would need a derivative zero and up to
            // four lead stages: not a PID anyone ships).
            return Outcome<Design>.Refused(
                $"The target needs {F(-needed)}° of lag beyond the integral zero's; a PID's derivative zero only adds lead",
                "Use a PI: its zero from the angle condition places a target that needs lag exactly (or move the target left or up, where a derivative zero helps).");
        }

        var withPi = loop.WithPlant(loop.Plant * SlowZeroDesigner.Shape([pi]));

        // More than one derivative zero can reasonably give: the derivative supplies the usual per-stage limit
        // and identical lead stages (bisector) supply the rest, counted together.
        var extraStages = ImmutableArray<CompensatorStage>.Empty;
        var fromDerivative = needed;
        if (needed > lead.MaxStageAngleDegrees + 30)
        {
            fromDerivative = lead.MaxStageAngleDegrees;
            var remaining = needed - fromDerivative;
            var stagesNeeded = (int)Math.Ceiling(remaining / lead.MaxStageAngleDegrees);
            var perStage = remaining / stagesNeeded;
            var stage = LeadDesigner.BisectorStage(s, perStage);
            if (!stage.IsSuccess || stagesNeeded > LeadOptions.MaxStages)
            {
                return Outcome<Design>.Refused($"The PID would need {F(needed)}°, beyond a derivative zero and {LeadOptions.MaxStages} lead stages", "Move the target toward the uncompensated locus.");
            }

            extraStages = [.. Enumerable.Repeat(stage.Value, stagesNeeded)];
        }

        var derivative = DerivativeStage(withPi, target, fromDerivative, slow.FilterRatio);
        if (!derivative.IsSuccess)
        {
            return Outcome<Design>.Refused(derivative.Problem);
        }

        var stages = ImmutableArray.Create(pi, derivative.Value).AddRange(extraStages);
        var gain = PointAnalysis.At(loop, s, SlowZeroDesigner.Shape(stages)).Gain;
        var notes = ImmutableArray.CreateBuilder<string>();
        notes.Add($"Integral zero at {F(piZero)} ({F(slow.ZeroFraction)}·σ) with the integrator: {F(piAngle)}° at the target.");
        notes.Add($"Derivative zero at {F(derivative.Value.Zero!.Value)} supplies {F(fromDerivative)}° of the {F(needed)}° still needed (the integrator's angle counted).");
        if (!extraStages.IsEmpty)
        {
            notes.Add($"{extraStages.Length} identical lead stage(s) (bisector) supply the remaining {F(needed - fromDerivative)}°; the PID gain forms describe the PID part, the lead stages follow it in cascade.");
        }
        notes.Add(slow.FilterRatio is { } n
            ? $"Derivative filter pole at {F(derivative.Value.Pole!.Value)} (filter ratio {F(n)}: the pole sits {F(n)} times as far out as the PD zero; not the N of the standard form below), counted in the angle sum."
            : "Ideal PID is improper: it kicks the actuator at every reference step and cannot be discretized as it is. Add a derivative filter (a filter ratio of about 10) before hand-off.");
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
            return LeadDesigner.PlaceWithRatio(s, n, angle, CompensatorKind.PD);
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

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
