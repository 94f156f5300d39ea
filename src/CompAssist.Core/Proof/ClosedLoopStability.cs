using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Proof;

/// <summary>
/// Judges closed-loop stability. Without a delay the closed-loop roots decide. With a delay the roots come
/// from a Padé approximant, which can miss a root (a lightly damped mode that the delay's lag destabilises)
/// or add one; the exact-delay Nyquist count (<see cref="NyquistCount"/>) is then taken beside them, and the
/// loop is stable only when both say so.
/// </summary>
public static class ClosedLoopStability
{
    /// <summary>Judges the loop with the compensator, given its closed-loop roots (Padé for a delay).</summary>
    public static StabilityJudgement Judge(Loop loop, TransferFunction compensator, IReadOnlyCollection<Complex> roots)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        ArgumentNullException.ThrowIfNull(roots);
        var approximate = roots.Count(r => r.Real >= 0);
        if (loop.Delay == 0)
        {
            return new StabilityJudgement(approximate == 0, approximate, null, null);
        }

        var atInfinity = Math.Abs(loop.SignedGainAtInfinity(compensator));
        if (atInfinity > 1.0)
        {
            // A neutral loop: 1 + L0(s)·e^(−θs) = 0 has a chain of roots with Re s → ln|L0(∞)|/θ > 0.
            return new StabilityJudgement(
                false,
                Math.Max(1, approximate),
                null,
                $"With the exact delay and |C·G·H| = {atInfinity:G4} > 1 at high frequency, the closed loop has infinitely many roots in the right half-plane (their real parts tend to ln|L(∞)|/θ = {Math.Log(atInfinity) / loop.Delay:G4} 1/s): UNSTABLE whatever the Padé roots say. Do not use this design.");
        }

        var exact = NyquistCount.Count(loop.OpenLoop(compensator).Scaled(loop.SignFactor));
        var order = loop.PadeOrder;
        return exact.Outcome switch
        {
            NyquistOutcome.Counted when exact.RightHalfPlaneRoots > 0 && approximate == 0 => new StabilityJudgement(
                false,
                exact.RightHalfPlaneRoots,
                exact,
                $"With the exact delay the closed loop is UNSTABLE: the Nyquist count finds {Roots(exact.RightHalfPlaneRoots)} in the right half-plane, which the Padé approximant of order {order} misses. Do not use this design."),
            NyquistOutcome.Counted when exact.RightHalfPlaneRoots == 0 && approximate > 0 => new StabilityJudgement(
                false,
                approximate,
                exact,
                $"The exact-delay Nyquist count finds no closed-loop root in the right half-plane, but the Padé approximant of order {order} has {Roots(approximate)} there: an artefact of the approximant. Raise the Padé order; until the two agree the loop is judged unstable and its step is not trusted."),
            NyquistOutcome.Counted => new StabilityJudgement(approximate == 0, Math.Max(exact.RightHalfPlaneRoots, approximate), exact, null),
            NyquistOutcome.OnAxis => new StabilityJudgement(
                false,
                Math.Max(1, approximate),
                exact,
                "With the exact delay a closed-loop root sits on the imaginary axis: the loop is marginal (sustained oscillation). Do not use this design."),
            _ => new StabilityJudgement(
                approximate == 0,
                approximate,
                exact,
                "The exact-delay stability count could not be completed (the delay turns L(jω) too many times to follow, or |L| does not fall below 1 at high frequency); stability rests on the Padé roots alone."),
        };
    }

    private static string Roots(int n) => n == 1 ? "1 root" : $"{n} roots";
}
