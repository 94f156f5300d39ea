using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
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
                    for (var i = 0; i < 200 && Math.Abs(b - a) > 1e-15 * r0; i++)
                    {
                        var m = 0.5 * (a + b);
                        var fm = Residual(m);
                        if (Math.Sign(fm) == Math.Sign(fa))
                        {
                            (a, fa) = (m, fm);
                        }
                        else
                        {
                            b = m;
                        }
                    }

                    return Outcome<TargetPole>.Success(TargetPole.At(direction * (0.5 * (a + b))));
                }
            }
        }

        return Outcome<TargetPole>.Refused(
            "No point on the target's constant-ζ ray near it lies on the compensated locus",
            "The lag or PI costs too much angle here: lower its zero fraction or its angle budget.");
    }
}
