using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// Moves a target along its constant-ζ ray to the nearest point where the compensated loop satisfies the
/// angle condition (after a lag or PI costs a few degrees there), so the gain can be re-solved exactly.
/// </summary>
public static class DampingRay
{
    /// <summary>The point on the target's ζ ray, nearest to it, that lies on the locus of <paramref name="shape"/>·G·H.</summary>
    public static Outcome<TargetPole> Solve(Loop loop, TransferFunction shape, TargetPole target)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(shape);
        ArgumentNullException.ThrowIfNull(target);
        var direction = target.Point / target.Point.Magnitude;
        var r0 = target.Point.Magnitude;
        double Residual(double r) => PointAnalysis.At(loop, direction * r, shape).AngleResidualDegrees;

        var at = Residual(r0);
        if (Math.Abs(at) < 1e-9)
        {
            return Outcome<TargetPole>.Success(target);
        }

        for (var k = 1; k <= 60; k++)
        {
            foreach (var sign in new[] { 1.0, -1.0 })
            {
                var a = r0 * (1 + (sign * 0.01 * (k - 1)));
                var b = r0 * (1 + (sign * 0.01 * k));
                if (b <= 0)
                {
                    continue;
                }

                var fa = Residual(a);
                var fb = Residual(b);
                if (Math.Sign(fa) != Math.Sign(fb) && Math.Abs(fa - fb) < 90)
                {
                    return Outcome<TargetPole>.Success(TargetPole.At(direction * Bisection.Root(Residual, a, b, fa, _ => 1e-15 * r0)));
                }
            }
        }

        return Outcome<TargetPole>.Refused(
            "No point on the target's constant-ζ ray near it lies on the compensated locus",
            "The lag or PI costs too much angle here: lower its zero fraction or its angle budget.");
    }

    /// <summary>
    /// Where the constant-ζ ray first meets the uncompensated locus of G·H (the smallest such |s|): the
    /// natural target for a lag or PI when only the damping is specified.
    /// </summary>
    public static Outcome<TargetPole> OnLocus(Loop loop, double zeta)
    {
        ArgumentNullException.ThrowIfNull(loop);
        if (!(zeta > 0 && zeta < 1))
        {
            return Outcome<TargetPole>.Refused($"ζ = {zeta} is outside 0 < ζ < 1", "Give an overshoot between 0 and 100 %.");
        }

        var direction = Complex.FromPolarCoordinates(1.0, Math.PI - Math.Acos(zeta));
        var corners = loop.PlantTimesFeedback.Poles.Concat(loop.PlantTimesFeedback.Zeros).Select(r => r.Magnitude).Where(m => m > 0).DefaultIfEmpty(1.0).ToList();
        var lo = Math.Log(corners.Min() * 1e-3);
        var hi = Math.Log(corners.Max() * 1e3);
        double Residual(double r) => PointAnalysis.At(loop, direction * r, TransferFunction.Unity).AngleResidualDegrees;
        const int steps = 600;
        var previousR = Math.Exp(lo);
        var previous = Residual(previousR);
        for (var i = 1; i <= steps; i++)
        {
            var r = Math.Exp(lo + ((hi - lo) * i / steps));
            var value = Residual(r);
            if (Math.Sign(value) != Math.Sign(previous) && Math.Abs(value - previous) < 90)
            {
                return Outcome<TargetPole>.Success(TargetPole.At(direction * Bisection.Root(Residual, previousR, r, previous, m => 1e-15 * m)));
            }

            (previousR, previous) = (r, value);
        }

        return Outcome<TargetPole>.Refused(
            $"The uncompensated locus never crosses the ζ = {zeta:G3} ray",
            "A lag or PI cannot reach this damping; use a lead-lag or PID, or relax the overshoot.");
    }
}
