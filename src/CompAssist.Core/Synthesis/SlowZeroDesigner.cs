using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// The slow zero of a lag (zero z and pole z/β near the origin) or a PI (zero z and an integrator), added to an
/// existing compensator shape. The zero sits at a fraction of the target's real part, moved closer to the
/// origin if its angle at the target would exceed the budget; the target then slides along its ζ ray onto the
/// compensated locus and the gain is re-solved by the magnitude condition.
/// </summary>
public static class SlowZeroDesigner
{
    /// <summary>The result: the stages, the gain, the target where the gain was solved and what was done.</summary>
    public sealed record Result(ImmutableArray<CompensatorStage> Stages, double Gain, TargetPole Target, ImmutableArray<string> Notes, SteadyStateResult? SteadyState);

    /// <summary>
    /// Where the slow zero goes and the lag's first ratio: the checks a lag or PI must pass, the ratio β from the
    /// requirement and the error constant before it (with the margin), and the zero at the fraction of σ, moved
    /// nearer the origin when its angle at the target would exceed the budget.
    /// </summary>
    /// <param name="Zero">The slow zero.</param>
    /// <param name="Fraction">The zero as a fraction of the target's real part.</param>
    /// <param name="Beta">The lag's zero/pole ratio (∞ for a PI).</param>
    /// <param name="Before">The error constant with the base stages alone (NaN without a requirement).</param>
    /// <param name="Notes">What was done.</param>
    public sealed record Plan(double Zero, double Fraction, double Beta, double Before, ImmutableArray<string> Notes);

    /// <summary>The checks and the starting zero and ratio of a lag (<paramref name="integrator"/> false) or a PI on <paramref name="baseShape"/>.</summary>
    public static Outcome<Plan> Prepare(Loop loop, TransferFunction baseShape, TargetPole target, ErrorRequirement? requirement, SlowPoleOptions options, bool integrator)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(baseShape);
        ArgumentNullException.ThrowIfNull(target);
        ArgumentNullException.ThrowIfNull(options);
        if (OptionsProblem(options, integrator) is { } problem)
        {
            return Outcome<Plan>.Refused(problem);
        }

        var s = target.Point;
        var sigma = target.Sigma;
        var baseGain = PointAnalysis.At(loop, s, baseShape).Gain;
        var before = requirement is null ? double.NaN : ErrorConstants.Of(loop, baseShape.Scaled(baseGain)).ValueOf(requirement.Kind);
        var notes = ImmutableArray.CreateBuilder<string>();
        double beta;
        if (integrator)
        {
            beta = double.PositiveInfinity;
        }
        else
        {
            if (requirement is null)
            {
                return Outcome<Plan>.Refused("A lag needs a steady-state requirement to size it", "Give a steady-state requirement: an error constant Kp, Kv or Ka, or a steady-state error.", Setting.SteadyState);
            }

            if (before == 0)
            {
                return Outcome<Plan>.Refused(
                    $"{requirement.Symbol} is 0 for this loop (type {ErrorConstants.Of(loop, baseShape).SystemType}); a lag scales an error constant but cannot raise the system type",
                    "Use a PI (or PID) to add an integrator.");
            }

            if (double.IsPositiveInfinity(before))
            {
                return Outcome<Plan>.Refused($"{requirement.Symbol} is already infinite for this loop", "No lag is needed for this requirement.");
            }

            if (before >= requirement.Value)
            {
                return Outcome<Plan>.Refused(
                    $"{requirement.Symbol} is already {F(before)} ≥ {F(requirement.Value)} without a lag",
                    "No lag is needed: use the design without it.");
            }

            beta = options.Margin * requirement.Value / before;
        }

        var fraction = options.ZeroFraction;
        if (Math.Abs(Cost(s, sigma, fraction, beta, integrator)) > options.AngleBudgetDegrees)
        {
            double lo = 0, hi = fraction;
            for (var i = 0; i < 100; i++)
            {
                var mid = 0.5 * (lo + hi);
                if (Math.Abs(Cost(s, sigma, mid, beta, integrator)) > 0.9 * options.AngleBudgetDegrees)
                {
                    hi = mid;
                }
                else
                {
                    lo = mid;
                }
            }

            notes.Add($"A zero at {F(fraction)}·σ would cost {F(Cost(s, sigma, fraction, beta, integrator))}° at the target, beyond the {F(options.AngleBudgetDegrees)}° budget: moved to {F(lo)}·σ.");
            fraction = lo;
        }

        return Outcome<Plan>.Success(new Plan(-fraction * sigma, fraction, beta, before, notes.ToImmutable()));
    }

    /// <summary>Adds a lag (<paramref name="integrator"/> false) or a PI zero and integrator (true) to <paramref name="baseStages"/>.</summary>
    public static Outcome<Result> Add(Loop loop, ImmutableArray<CompensatorStage> baseStages, TargetPole target, ErrorRequirement? requirement, SlowPoleOptions options, bool integrator)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(target);
        ArgumentNullException.ThrowIfNull(options);
        var what = integrator ? "PI" : "lag";
        var plan = Prepare(loop, Shape(baseStages), target, requirement, options, integrator);
        if (!plan.IsSuccess)
        {
            return Outcome<Result>.Refused(plan.Problem);
        }

        var s = target.Point;
        var sigma = target.Sigma;
        var (zero, fraction, beta, before, planNotes) = plan.Value;
        var notes = ImmutableArray.CreateBuilder<string>();
        notes.AddRange(planNotes);
        double Cost(double f) => SlowZeroDesigner.Cost(s, sigma, f, beta, integrator);
        for (var attempt = 0; ; attempt++)
        {
            var pole = integrator ? 0.0 : zero / beta;
            var slow = new CompensatorStage(integrator ? CompensatorKind.PI : CompensatorKind.Lag, zero, pole, Cost(fraction));
            var shape = Shape(baseStages.Add(slow));
            var moved = DampingRay.Solve(loop, shape, target);
            if (!moved.IsSuccess)
            {
                return Outcome<Result>.Refused(moved.Problem);
            }

            var slide = Complex.Abs(moved.Value.Point - s) / s.Magnitude;
            if (slide > 0.1)
            {
                return Outcome<Result>.Refused(
                    $"The {what} would make the target slide {F(100 * slide)} % along its ζ ray (to {TransferFunctionFormatter.Complex(moved.Value.Point, 4)}) to stay on the locus",
                    "Lower the zero fraction or the angle budget so the slow zero costs less angle, or choose a target nearer the uncompensated locus.");
            }

            var gain = PointAnalysis.At(loop, moved.Value.Point, shape).Gain;
            var after = requirement is null ? double.NaN : ErrorConstants.Of(loop, shape.Scaled(gain)).ValueOf(requirement.Kind);
            if (requirement is null || after >= requirement.Value || integrator || attempt == 7)
            {
                var movedBy = Complex.Abs(moved.Value.Point - s) / s.Magnitude;
                notes.Add(integrator
                    ? $"PI zero at {F(zero)} ({F(fraction)}·σ) with the integrator; it costs {F(Cost(fraction))}° at the target."
                    : $"Lag zero at {F(zero)} ({F(fraction)}·σ), pole at {F(pole)}: ratio {F(zero / pole)} (the required {F(requirement!.Value / before)} with a margin); it costs {F(Cost(fraction))}° at the target.");
                if (movedBy > 1e-9)
                {
                    notes.Add($"The target slid {F(100 * movedBy)} % along its ζ ray onto the compensated locus, to {TransferFunctionFormatter.Complex(moved.Value.Point, 5)}; the gain was re-solved there.");
                }

                notes.Add($"The slow zero leaves a slow closed-loop pole near {F(zero)} (time constant about {F(1 / Math.Max(Math.Abs(zero), 1e-300))} s): a small, slow tail in the step that the simulation shows.");
                var steady = requirement is null ? null : new SteadyStateResult(requirement, before, after);
                return Outcome<Result>.Success(new Result(baseStages.Add(slow with { AngleAtTargetDegrees = Angles.ToDegrees(LeadDesigner.AngleSeen(moved.Value.Point, zero) - LeadDesigner.AngleSeen(moved.Value.Point, pole)) }), gain, moved.Value, notes.ToImmutable(), steady));
            }

            // The re-solved gain came out lower than assumed: grow the ratio by the shortfall and try again.
            beta *= 1.02 * requirement.Value / after;
        }
    }

    /// <summary>Why the zero fraction or the angle budget cannot be used for a lag or a PI; null when they can.</summary>
    public static Problem? OptionsProblem(SlowPoleOptions options, bool integrator)
    {
        ArgumentNullException.ThrowIfNull(options);
        var what = integrator ? "PI" : "lag";
        if (!(options.ZeroFraction > 0) || options.ZeroFraction >= 1)
        {
            return new Problem(
                $"A {what} zero at {F(options.ZeroFraction)} of the target's real part would sit {(options.ZeroFraction >= 1 ? "at or right of the target" : "nowhere useful")}",
                "Give a zero fraction between 0 and 1 (about 0.1 is usual).");
        }

        return options.AngleBudgetDegrees is > 0 and < 30
            ? null
            : new Problem($"An angle budget of {F(options.AngleBudgetDegrees)}° is out of range", "Give a few degrees (default 5°).");
    }

    /// <summary>The angle (degrees) a slow zero at f·σ (and its pole at the zero over β, or the integrator) adds at s.</summary>
    public static double Cost(Complex s, double sigma, double f, double beta, bool integrator) =>
        Angles.ToDegrees(LeadDesigner.AngleSeen(s, -f * sigma) - LeadDesigner.AngleSeen(s, integrator ? 0.0 : -f * sigma / beta));

    /// <summary>The unit-gain transfer function of a list of stages.</summary>
    public static TransferFunction Shape(ImmutableArray<CompensatorStage> stages) =>
        stages.IsEmpty ? TransferFunction.Unity : Compensator.FromStages(CompensatorKind.Lead, 1.0, stages).TransferFunction;

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
