using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// Lead synthesis by the angle condition: the angle deficiency of G·H at the target is supplied by one or
/// more identical stages (s − z)/(s − p) with z, p real and p &lt; z &lt; 0, placed by a strategy; the gain comes
/// from the magnitude condition with the compensator included.
/// </summary>
/// <remarks>
/// Geometry: a real point x sees the target s* = −σ + jωd under the angle θ(x) = atan2(ωd, Re s* − x) ∈ (0°, 180°).
/// A stage adds θ(z) − θ(p). Conversely the real point seen under θ is x = Re s* − ωd·cot θ.
/// </remarks>
public static class LeadDesigner
{
    /// <summary>Below this deficiency (degrees) the target is treated as already on the locus.</summary>
    public const double OnLocusDegrees = 0.05;

    /// <summary>Smallest angle (degrees) a pole may subtend at the target; nearer 0 it runs off to −∞.</summary>
    private const double MinPoleAngleDegrees = 0.5;

    /// <summary>Designs a lead for the loop at the target.</summary>
    /// <exception cref="ArgumentException">Options are inconsistent with the strategy (misuse, not user input).</exception>
    public static Outcome<Design> Design(Loop loop, TargetPole target, LeadOptions options) => Design(loop, target, options, null);

    /// <summary>
    /// Designs a lead for the loop at the target that also makes up the angle of <paramref name="alongside"/> (a
    /// lag in cascade, unit gain) there: the lead's stages add the deficiency of G·H·alongside, and the gain is
    /// solved with it, so the compensator lead·alongside places the target exactly. The placement still sees only
    /// the plant's poles (a lag's pole is never "cancelled").
    /// </summary>
    public static Outcome<Design> Design(Loop loop, TargetPole target, LeadOptions options, TransferFunction? alongside)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(target);
        ArgumentNullException.ThrowIfNull(options);
        var s = target.Point;
        var refusal = TargetCheck.Refusal(loop, s);
        if (refusal is not null)
        {
            return Outcome<Design>.Refused(refusal);
        }

        if (!(options.MaxStageAngleDegrees > 0 && options.MaxStageAngleDegrees < 90))
        {
            return Outcome<Design>.Refused(
                $"The largest angle per stage must be between 0° and 90° (got {F(options.MaxStageAngleDegrees)}°)",
                "Use a value such as 60°.");
        }

        var uncompensated = PointAnalysis.At(loop, s);
        var deficiency = alongside is null ? uncompensated.AngleDeficiencyDegrees : PointAnalysis.At(loop, s, alongside).AngleDeficiencyDegrees;
        if (Math.Abs(deficiency) < OnLocusDegrees)
        {
            return Outcome<Design>.Refused(
                $"The target is already on the uncompensated locus (angle off by {F(deficiency)}°); a pure gain K = {F(uncompensated.Gain)} places a closed-loop pole there",
                "No lead is needed: use a proportional gain, or move the target to where the response must improve.");
        }

        var maxTotal = LeadOptions.MaxStages * options.MaxStageAngleDegrees;
        if (deficiency < 0 && deficiency + 360.0 <= maxTotal)
        {
            // The angle condition holds modulo 360°: −x° of lag is also 360° − x° of lead, reachable in stages.
            deficiency += 360.0;
        }

        if (deficiency < 0)
        {
            return Outcome<Design>.Refused(
                $"The target needs {F(deficiency)}° (phase lag) and a lead can only add positive angle",
                "Move the target closer to the uncompensated locus (slower or less damped), or use a lag-type compensator.");
        }

        var stages = (int)Math.Ceiling((deficiency / options.MaxStageAngleDegrees) - 1e-12);
        if (stages > LeadOptions.MaxStages)
        {
            return Outcome<Design>.Refused(
                $"The target needs {F(deficiency)}° of lead, more than {LeadOptions.MaxStages} stages of {F(options.MaxStageAngleDegrees)}° can give",
                "Move the target toward the uncompensated locus, or raise the per-stage limit.");
        }

        var perStage = deficiency / stages;
        var notes = ImmutableArray.CreateBuilder<string>();
        var condition = loop.Sign == FeedbackSign.Negative
            ? "the 180° condition needs an odd multiple of 180°"
            : "the 0° condition needs a multiple of 360°";
        notes.Add(alongside is null
            ? $"Angle of G·H at the target: {F(uncompensated.AngleSumDegrees)}° (zero angles minus pole angles); {condition}, so the lead must add {F(deficiency)}°."
            : $"Angle of G·H at the target: {F(uncompensated.AngleSumDegrees)}° (zero angles minus pole angles); {condition}; with the lag's own angle there, the lead must add {F(deficiency)}°.");
        if (stages > 1)
        {
            notes.Add($"{F(deficiency)}° exceeds {F(options.MaxStageAngleDegrees)}° per stage: split into {stages} identical stages of {F(perStage)}° each.");
        }

        var placed = Place(loop, s, perStage, stages, options);
        if (!placed.IsSuccess)
        {
            return Outcome<Design>.Refused(placed.Problem);
        }

        var (zero, pole, placementNote) = placed.Value;
        if (placementNote.Length > 0)
        {
            notes.Add(placementNote);
        }

        var first = new CompensatorStage(CompensatorKind.Lead, zero, pole, Angles.ToDegrees(AngleSeen(s, zero) - AngleSeen(s, pole)));
        var stageList = Enumerable.Repeat(first, stages).ToImmutableArray();
        if (options.Placement == LeadPlacement.Cancel && stages > 1)
        {
            // One zero cancels the pole; stacking the others on it would only make a multiple zero there. The
            // other stages take the bisector rule for their equal share of the angle.
            var other = BisectorStage(s, perStage);
            if (!other.IsSuccess)
            {
                return Outcome<Design>.Refused(other.Problem);
            }

            stageList = [first, .. Enumerable.Repeat(other.Value, stages - 1)];
            notes.Add($"The other {stages - 1} stage(s) use the bisector rule (zero {F(other.Value.Zero!.Value)}, pole {F(other.Value.Pole!.Value)}), so only one zero sits on the cancelled pole.");
        }
        var unitGain = Compensator.FromStages(CompensatorKind.Lead, 1.0, stageList);
        var withUnit = PointAnalysis.At(loop, s, alongside is null ? unitGain.TransferFunction : unitGain.TransferFunction * alongside);
        var gain = withUnit.Gain;
        var compensator = Compensator.FromStages(CompensatorKind.Lead, gain, stageList);
        return Outcome<Design>.Success(new Design(loop, target, compensator, options.Placement, uncompensated, deficiency, notes.ToImmutable()));
    }

    /// <summary>A stage with the given pole/zero ratio that adds <paramref name="angleDegrees"/> at s.</summary>
    internal static Outcome<CompensatorStage> PlaceWithRatio(Complex s, double ratio, double angleDegrees, CompensatorKind kind)
    {
        var placed = Ratio(s, ratio, Angles.ToRadians(angleDegrees), angleDegrees);
        return placed.IsSuccess
            ? Outcome<CompensatorStage>.Success(new CompensatorStage(kind, placed.Value.Zero, placed.Value.Pole, angleDegrees))
            : Outcome<CompensatorStage>.Refused(placed.Problem);
    }

    /// <summary>The angle (radians, in (0, π)) under which the real point x sees s.</summary>
    public static double AngleSeen(Complex s, double x) => Math.Atan2(s.Imaginary, s.Real - x);

    /// <summary>The real point that sees s under the angle θ (radians, in (0, π)).</summary>
    public static double PointSeenUnder(Complex s, double theta) => s.Real - (s.Imaginary * Math.Cos(theta) / Math.Sin(theta));


    private static Outcome<PlacedStage> Place(Loop loop, Complex s, double perStageDegrees, int stages, LeadOptions options)
    {
        var phi = Angles.ToRadians(perStageDegrees);
        var minPole = Angles.ToRadians(MinPoleAngleDegrees);
        switch (options.Placement)
        {
            case LeadPlacement.Beneath:
            {
                var thetaP = (Math.PI / 2) - phi;
                if (thetaP < minPole)
                {
                    return Outcome<PlacedStage>.Refused(
                        $"With the zero beneath the target a stage can add less than 90°; {F(perStageDegrees)}° puts the pole at −∞",
                        "Lower the per-stage limit so the angle is split into more stages, or use the bisector placement.");
                }

                return FromAngles(s, Math.PI / 2, thetaP, "Zero beneath the target.");
            }

            case LeadPlacement.Bisector:
                return Bisector(s, phi, perStageDegrees);

            case LeadPlacement.Cancel:
                return Cancel(loop, s, phi, perStageDegrees, stages, options.Zero);

            case LeadPlacement.FixedZero:
            {
                if (options.Zero is not { } z)
                {
                    throw new ArgumentException("The fixed-zero placement needs a zero location.", nameof(options));
                }

                return FixedZero(s, z, phi, perStageDegrees, $"Zero fixed at {F(z)}.");
            }

            case LeadPlacement.FixedPole:
            {
                if (options.Pole is not { } p)
                {
                    throw new ArgumentException("The fixed-pole placement needs a pole location.", nameof(options));
                }

                return FixedPole(s, p, phi, perStageDegrees);
            }

            case LeadPlacement.Ratio:
            {
                if (options.Ratio is not { } r)
                {
                    throw new ArgumentException("The ratio placement needs a pole/zero ratio.", nameof(options));
                }

                return Ratio(s, r, phi, perStageDegrees);
            }

            default:
                throw new ArgumentOutOfRangeException(nameof(options), options.Placement, "Unknown placement.");
        }
    }

    private static Outcome<PlacedStage> Bisector(Complex s, double phi, double perStageDegrees)
    {
        var beta = Math.Atan2(s.Imaginary, s.Real);
        var thetaZ = (beta + phi) / 2;
        var thetaP = (beta - phi) / 2;
        if (thetaP < Angles.ToRadians(MinPoleAngleDegrees))
        {
            return Outcome<PlacedStage>.Refused(
                $"The bisector construction cannot add {F(perStageDegrees)}° per stage at this target (at most {F(Angles.ToDegrees(beta))}°)",
                "Lower the per-stage limit to split the angle into more stages, or choose another placement.");
        }

        return FromAngles(s, thetaZ, thetaP, $"Bisector placement: zero and pole at ±{F(perStageDegrees / 2)}° about the bisector (smallest pole/zero ratio for this angle).");
    }

    /// <summary>One bisector-placed lead stage adding <paramref name="angleDegrees"/> at s (for stages cascaded with other compensators).</summary>
    internal static Outcome<CompensatorStage> BisectorStage(Complex s, double angleDegrees)
    {
        var placed = Bisector(s, Angles.ToRadians(angleDegrees), angleDegrees);
        return placed.IsSuccess
            ? Outcome<CompensatorStage>.Success(new CompensatorStage(CompensatorKind.Lead, placed.Value.Zero, placed.Value.Pole, angleDegrees))
            : Outcome<CompensatorStage>.Refused(placed.Problem);
    }

    private static Outcome<PlacedStage> FromAngles(Complex s, double thetaZ, double thetaP, string note)
    {
        var zero = Math.Abs(thetaZ - (Math.PI / 2)) < 1e-15 ? s.Real : PointSeenUnder(s, thetaZ);
        var pole = PointSeenUnder(s, thetaP);
        if (zero >= 0)
        {
            return Outcome<PlacedStage>.Refused(
                $"The placement puts the lead zero at {F(zero)}, not in the left half-plane",
                "Choose another placement or move the target left.");
        }

        return Outcome<PlacedStage>.Success(new PlacedStage(zero, pole, note));
    }

    private static Outcome<PlacedStage> FixedZero(Complex s, double zero, double phi, double perStageDegrees, string note)
    {
        if (!(zero < 0) || !double.IsFinite(zero))
        {
            return Outcome<PlacedStage>.Refused(
                $"A lead zero at {F(zero)} is not in the left half-plane",
                "Give the fixed-zero placement a negative zero location, e.g. -3.", Setting.LeadZero);
        }

        var thetaZ = AngleSeen(s, zero);
        var thetaP = thetaZ - phi;
        if (thetaP < Angles.ToRadians(MinPoleAngleDegrees))
        {
            return Outcome<PlacedStage>.Refused(
                $"A zero at {F(zero)} sees the target under {F(Angles.ToDegrees(thetaZ))}°, too little to add {F(perStageDegrees)}° per stage",
                $"Move the zero right, toward {F(s.Real)} or beyond, or lower the per-stage limit.");
        }

        return Outcome<PlacedStage>.Success(new PlacedStage(zero, PointSeenUnder(s, thetaP), note));
    }

    private static Outcome<PlacedStage> FixedPole(Complex s, double pole, double phi, double perStageDegrees)
    {
        if (!(pole < 0) || !double.IsFinite(pole))
        {
            return Outcome<PlacedStage>.Refused(
                $"A lead pole at {F(pole)} is not in the left half-plane",
                "Give the fixed-pole placement a negative pole location, e.g. -10.", Setting.LeadPole);
        }

        var thetaP = AngleSeen(s, pole);
        var thetaZ = thetaP + phi;
        var maxZeroAngle = AngleSeen(s, 0.0);
        if (thetaZ >= maxZeroAngle)
        {
            return Outcome<PlacedStage>.Refused(
                $"A pole at {F(pole)} leaves too little room: the zero would have to be at or right of the origin to add {F(perStageDegrees)}° per stage",
                "Move the pole farther left, or lower the per-stage limit.");
        }

        return Outcome<PlacedStage>.Success(new PlacedStage(PointSeenUnder(s, thetaZ), pole, $"Pole fixed at {F(pole)}."));
    }

    private static Outcome<PlacedStage> Ratio(Complex s, double ratio, double phi, double perStageDegrees)
    {
        if (!(ratio > 1) || !double.IsFinite(ratio))
        {
            return Outcome<PlacedStage>.Refused(
                $"A pole/zero ratio of {F(ratio)} is not a lead (it must exceed 1)",
                "Give the ratio placement a pole/zero ratio greater than 1, e.g. 10 puts the pole ten times farther left than the zero.", Setting.LeadRatio);
        }

        // f(u) = θ(z) − θ(r·z) − φ with z = −e^u. Scan u over sixteen decades around |s| for brackets.
        double Excess(double u)
        {
            var z = -Math.Exp(u);
            return AngleSeen(s, z) - AngleSeen(s, ratio * z) - phi;
        }

        var center = Math.Log(Complex.Abs(s));
        const int steps = 400;
        var lo = center - 18.0;
        var hi = center + 18.0;
        var solutions = new List<double>();
        var maxAngle = double.NegativeInfinity;
        var previousU = lo;
        var previous = Excess(lo);
        for (var i = 1; i <= steps; i++)
        {
            var u = lo + ((hi - lo) * i / steps);
            var value = Excess(u);
            maxAngle = Math.Max(maxAngle, value + phi);
            if (Math.Sign(value) != Math.Sign(previous) && value != previous)
            {
                solutions.Add(-Math.Exp(Bisection.Root(Excess, previousU, u, previous, m => 1e-15 * Math.Max(1.0, Math.Abs(m)))));
            }

            previous = value;
            previousU = u;
        }

        // Prefer a zero at or left of the target's real part: a zero between the target and the origin leaves a
        // slow closed-loop pole beside it and spoils dominance.
        var left = solutions.Where(z => z <= s.Real).ToList();
        var pool = left.Count > 0 ? left : solutions;
        var best = pool.Count == 0 ? double.NaN : pool.OrderBy(z => Math.Abs(z - s.Real)).First();
        if (double.IsNaN(best))
        {
            return Outcome<PlacedStage>.Refused(
                $"A pole/zero ratio of {F(ratio)} adds at most {F(Angles.ToDegrees(maxAngle))}° at this target, short of {F(perStageDegrees)}° per stage",
                "Give a larger ratio, or lower the per-stage limit to use more stages.");
        }

        return Outcome<PlacedStage>.Success(new PlacedStage(best, ratio * best, $"Pole/zero ratio fixed at {F(ratio)}; of the placements that add the angle, the one with the zero nearest the target's real part, preferring one at or left of it."));
    }

    private static Outcome<PlacedStage> Cancel(Loop loop, Complex s, double phi, double perStageDegrees, int stages, double? chosen)
    {
        var poles = loop.Plant.Poles;
        Complex candidate;
        if (chosen is { } c)
        {
            // A real number names a real pole, or the real part of a complex pair (which is then refused).
            var match = poles.Where(p => Complex.Abs(p - c) <= 1e-6 * Math.Max(1.0, Math.Abs(c))).ToList();
            if (match.Count == 0)
            {
                match = poles.Where(p => p.Imaginary > 0 && Math.Abs(p.Real - c) <= 1e-6 * Math.Max(1.0, Math.Abs(c))).ToList();
            }

            if (match.Count == 0)
            {
                return Outcome<PlacedStage>.Refused(
                    $"The plant has no pole at {F(c)} to cancel",
                    $"Plant poles: {string.Join(", ", poles.Select(p => TransferFunctionFormatter.Complex(p, 4)))}.");
            }

            candidate = match[0];
        }
        else
        {
            var stable = poles.Where(p => p.Imaginary == 0 && p.Real < 0).ToList();
            if (stable.Count == 0)
            {
                return Outcome<PlacedStage>.Refused(
                    "The plant has no stable real pole that a lead zero could cancel",
                    "Choose another placement (bisector or beneath).");
            }

            candidate = stable.OrderBy(p => Complex.Abs(p - s)).First();
        }

        if (candidate.Imaginary != 0)
        {
            return Outcome<PlacedStage>.Refused(
                $"The pole at {TransferFunctionFormatter.Complex(candidate, 4)} is complex; a real lead zero cannot cancel it, and cancelling a lightly damped pair leaves it ringing inside the loop",
                "Cancel a real pole, or choose another placement.");
        }

        if (candidate.Real >= 0)
        {
            return Outcome<PlacedStage>.Refused(
                $"The pole at {F(candidate.Real)} is {(candidate.Real == 0 ? "at the origin" : "unstable")}; cancelling it hides it, and it still {(candidate.Real == 0 ? "drifts" : "grows")} inside the loop",
                "Never cancel an unstable or marginal pole: choose another placement and let feedback move it.");
        }

        var note = $"Zero cancels the plant pole at {F(candidate.Real)}.";
        return FixedZero(s, candidate.Real, phi, perStageDegrees, note);
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);

    private sealed record PlacedStage(double Zero, double Pole, string Note);
}
