using System.Collections.Immutable;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Reporting;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// The independent lead-lag placed exactly at the target: the lag (zero near the origin at a fraction of σ, ratio β
/// from the error constant) is chosen first, the lead then supplies the angle the target needs together with the
/// lag's own angle there, and the gain comes from the magnitude condition with both — so the target is a
/// closed-loop root (no slide along the ζ ray). β grows until the requirement holds with the re-solved gain.
/// Common practice (e.g. Ogata, Modern Control Engineering, 5th ed., section 6-9, where the lag's small angle
/// is accepted as a small error instead).
/// </summary>
public static class LeadLagDesigner
{
    private const int MaxRounds = 40;

    /// <summary>Designs the lead-lag at the target for the requirement.</summary>
    public static Outcome<Design> Design(Loop loop, TargetPole target, LeadOptions lead, SlowPoleOptions slow, ErrorRequirement? requirement)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(target);
        ArgumentNullException.ThrowIfNull(lead);
        ArgumentNullException.ThrowIfNull(slow);
        var leadOnly = LeadDesigner.Design(loop, target, lead);
        if (!leadOnly.IsSuccess)
        {
            return leadOnly;
        }

        var plan = SlowZeroDesigner.Prepare(loop, SlowZeroDesigner.Shape(leadOnly.Value.Compensator.Stages), target, requirement, slow, integrator: false);
        if (!plan.IsSuccess)
        {
            return Outcome<Design>.Refused(plan.Problem);
        }

        var s = target.Point;
        var (zero, fraction, beta, before, planNotes) = plan.Value;
        for (var round = 0; ; round++)
        {
            var pole = zero / beta;
            var lag = new CompensatorStage(CompensatorKind.Lag, zero, pole, Angles.ToDegrees(LeadDesigner.AngleSeen(s, zero) - LeadDesigner.AngleSeen(s, pole)));
            var withLag = LeadDesigner.Design(loop, target, lead, SlowZeroDesigner.Shape([lag]));
            if (!withLag.IsSuccess)
            {
                return Outcome<Design>.Refused(withLag.Problem);
            }

            var stages = withLag.Value.Compensator.Stages.Add(lag);
            var compensator = Compensator.FromStages(CompensatorKind.LeadLag, withLag.Value.Compensator.Gain, stages);
            var after = ErrorConstants.Of(loop, compensator.TransferFunction).ValueOf(requirement!.Kind);
            if (after >= requirement.Value || round == MaxRounds - 1)
            {
                var notes = withLag.Value.Notes.AddRange(planNotes).Add(
                    $"Lag zero at {F(zero)} ({F(fraction)}·σ), pole at {F(pole)}: ratio {F(beta)} (the required {F(requirement.Value / before)} with a margin, grown until {requirement.Symbol} holds with the re-solved gain); its {F(lag.AngleAtTargetDegrees)}° at the target is made up by the lead, so the target stays a closed-loop root.")
                    .Add($"The lag leaves a slow closed-loop pole near {F(zero)} (time constant about {F(1 / Math.Abs(zero))} s): a small, slow tail in the step that the simulation shows.");
                var design = new Design(loop, target, compensator, lead.Placement, leadOnly.Value.Uncompensated, leadOnly.Value.AngleDeficiencyDegrees, notes)
                {
                    SteadyState = new SteadyStateResult(requirement, before, after),
                };
                return Outcome<Design>.Success(design);
            }

            beta *= 1.02 * requirement.Value / after;
        }
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
