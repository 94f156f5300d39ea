using CompAssist.Core.Model;
using System.Collections.Immutable;
using System.Globalization;
using CompAssist.Core.Common;

namespace CompAssist.Core.Targets;

/// <summary>
/// Turns requirements into a target pole. Overshoot bounds ζ from below (a wedge about the negative real
/// axis), settling time bounds σ from below (a vertical line), peak time bounds ωd from below (a horizontal
/// line). The corner taken is the point on the ζ boundary with the smallest natural frequency that meets
/// the other bounds — the least aggressive pole that meets everything — or, without an overshoot bound, the
/// corner of the σ and ωd lines.
/// </summary>
public static class TargetSelector
{
    /// <summary>Chooses the target and reports the region.</summary>
    public static Outcome<TargetSelection> Select(Requirements requirements)
    {
        ArgumentNullException.ThrowIfNull(requirements);
        var check = Validate(requirements);
        if (check is not null)
        {
            return Outcome<TargetSelection>.Refused(check);
        }

        double? zetaMin = requirements.MaxOvershootPercent is { } os ? SecondOrder.DampingFromOvershoot(os) : null;
        double? sigmaMin = requirements.MaxSettlingTime is { } ts ? SecondOrder.SigmaFromSettlingTime(ts, requirements.Band) : null;
        double? omegaDMin = requirements.MaxPeakTime is { } tp ? SecondOrder.DampedFrequencyFromPeakTime(tp) : null;

        TargetPole target;
        string source;
        if (requirements.Point is { } point)
        {
            target = TargetPole.At(point);
            source = "given point";
        }
        else if (requirements.Zeta is { } zeta && requirements.NaturalFrequency is { } wn)
        {
            target = TargetPole.FromDamping(zeta, wn);
            source = "given ζ and ωn";
        }
        else if (requirements.Zeta is not null || requirements.NaturalFrequency is not null)
        {
            return Outcome<TargetSelection>.Refused("ζ and ωn must be given together", "Give both the damping ratio and the natural frequency, or use overshoot and settling time.", Setting.DampingAndNaturalFrequency);
        }
        else if (zetaMin is { } z)
        {
            if (sigmaMin is null && omegaDMin is null)
            {
                return Outcome<TargetSelection>.Refused(
                    "An overshoot bound fixes the damping ratio but not the speed",
                    "Add a settling time or a peak time, or give ζ with ωn.", Setting.DampingAndNaturalFrequency);
            }

            var tanTheta = Math.Sqrt(1.0 - (z * z)) / z;
            var sigma = Math.Max(sigmaMin ?? 0.0, (omegaDMin ?? 0.0) / tanTheta);
            target = TargetPole.At(new System.Numerics.Complex(-sigma, sigma * tanTheta));
            source = "corner of the region on the ζ boundary";
        }
        else if (sigmaMin is { } sg && omegaDMin is { } wd)
        {
            target = TargetPole.At(new System.Numerics.Complex(-sg, wd));
            source = "corner of the settling-time and peak-time bounds";
        }
        else
        {
            return Outcome<TargetSelection>.Refused(
                "The requirements do not fix a target pole",
                "Give an overshoot with a settling or peak time, ζ and ωn, or a target point.", Setting.Target);
        }

        var constraints = ImmutableArray.CreateBuilder<RegionConstraint>();
        if (zetaMin is { } zm)
        {
            constraints.Add(new RegionConstraint(
                "overshoot",
                $"ζ ≥ {F(zm)} (overshoot ≤ {F(requirements.MaxOvershootPercent!.Value)} %)",
                zm,
                target.Zeta,
                target.Zeta - zm));
        }

        if (sigmaMin is { } sm)
        {
            constraints.Add(new RegionConstraint(
                "settling",
                $"σ ≥ {F(sm)} 1/s (settling ≤ {F(requirements.MaxSettlingTime!.Value)} s, {(int)requirements.Band} % band, envelope estimate)",
                sm,
                target.Sigma,
                target.Sigma - sm));
        }

        if (omegaDMin is { } om)
        {
            constraints.Add(new RegionConstraint(
                "peak time",
                $"ωd ≥ {F(om)} rad/s (peak time ≤ {F(requirements.MaxPeakTime!.Value)} s)",
                om,
                target.DampedFrequency,
                target.DampedFrequency - om));
        }

        return Outcome<TargetSelection>.Success(new TargetSelection(target, source, constraints.ToImmutable()));
    }

    private static Problem? Validate(Requirements r)
    {
        if (r.MaxOvershootPercent is { } os && !(os > 0.0 && os < 100.0))
        {
            return new Problem($"Overshoot {F(os)} % is out of range", "Give a percent overshoot between 0 and 100 (exclusive).");
        }

        if (r.MaxSettlingTime is { } ts && !(ts > 0.0 && double.IsFinite(ts)))
        {
            return new Problem($"Settling time {F(ts)} s is not positive", "Give a settling time in seconds, greater than 0.");
        }

        if (r.MaxPeakTime is { } tp && !(tp > 0.0 && double.IsFinite(tp)))
        {
            return new Problem($"Peak time {F(tp)} s is not positive", "Give a peak time in seconds, greater than 0.");
        }

        if (r.Zeta is { } z && !(z > 0.0 && z < 1.0))
        {
            return new Problem($"ζ = {F(z)} is outside 0 < ζ < 1", "A dominant complex pair needs an underdamped ζ; give 0 < ζ < 1.");
        }

        if (r.NaturalFrequency is { } wn && !(wn > 0.0 && double.IsFinite(wn)))
        {
            return new Problem($"ωn = {F(wn)} is not positive", "Give ωn in rad/s, greater than 0.");
        }

        if (r.Point is { } p && (!double.IsFinite(p.Real) || !double.IsFinite(p.Imaginary)))
        {
            return new Problem("The target point is not finite", "Give the target as RE,IM with finite numbers, e.g. -2,3.46.");
        }

        return null;
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
