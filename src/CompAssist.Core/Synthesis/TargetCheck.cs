using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;

namespace CompAssist.Core.Synthesis;

/// <summary>The one check of a target before any synthesis: left half-plane, complex, not on a loop pole or zero, and a magnitude in range.</summary>
internal static class TargetCheck
{
    /// <summary>Why no compensator can be placed for s, or null when it can.</summary>
    public static Problem? Refusal(Loop loop, Complex s)
    {
        if (s.Real >= 0)
        {
            return new Problem(
                $"The target {TransferFunctionFormatter.Complex(s, 4)} is not in the left half-plane; a closed-loop pole there is unstable or undamped",
                "Choose a target with a negative real part (e.g. from overshoot and settling-time requirements).");
        }

        if (s.Imaginary <= 0)
        {
            return new Problem(
                "The target is on the real axis; the lead angle construction needs a complex target",
                "Give a target with ωd > 0, or requirements that imply overshoot.");
        }

        var open = loop.PlantTimesFeedback;
        foreach (var (root, what) in open.Poles.Select(p => (p, "pole")).Concat(open.Zeros.Select(z => (z, "zero"))))
        {
            if (Complex.Abs(root - s) <= 1e-9 * Math.Max(1.0, Complex.Abs(s)))
            {
                return new Problem(
                    $"The target coincides with an open-loop {what} at {TransferFunctionFormatter.Complex(root, 4)}; the angle condition is undefined there",
                    "Move the target slightly, or change the requirements.");
            }
        }

        // Products of many factors can leave the range of doubles (absurd magnitudes): no angle to read there.
        var magnitude = loop.OpenLoop(TransferFunction.Unity).MagnitudeAt(s);
        if (!(magnitude > 0.0) || !double.IsFinite(magnitude))
        {
            return new Problem(
                "The loop's magnitude at the target is beyond the range of numbers this tool computes with",
                "Scale the plant (its gain or time units) or move the target.");
        }

        return DelayModelRefusal(loop, s);
    }

    /// <summary>Largest relative gap between e^(−sτ) and its Padé approximant at the target for which both agree.</summary>
    public const double DelayModelTolerance = 0.01;

    /// <summary>
    /// The conditions are met with the exact delay, the closed-loop roots are found on its Padé approximant: far
    /// from the origin (|s|·τ beyond about the order) the two differ, a target met on e^(−sτ) (whose magnitude
    /// grows without bound to the left) is no root of the proved loop, and a gain of 1e-12 can "place" it. Refused
    /// when the approximant differs from e^(−sτ) at s by more than 1 % (common practice: the Padé approximant of
    /// order n is accurate for |s·τ| well below n).
    /// </summary>
    private static Problem? DelayModelRefusal(Loop loop, Complex s)
    {
        var tau = loop.PlantTimesFeedback.Delay;
        if (tau == 0.0)
        {
            return null;
        }

        var exact = Complex.Exp(-s * tau);
        var approximant = PadeApproximation.Of(tau, loop.PadeOrder).Evaluate(s);
        var gap = Complex.Abs((approximant / exact) - Complex.One);
        return gap <= DelayModelTolerance
            ? null
            : new Problem(
                $"At the target the delay's order-{loop.PadeOrder} Padé approximant differs from e^(−s·{TransferFunctionFormatter.Number(tau, 4)}) by {TransferFunctionFormatter.Number(100 * gap, 3)} % (|s*|·τ = {TransferFunctionFormatter.Number(s.Magnitude * tau, 3)}): the closed loop, proved on the approximant, would not have this target as a root",
                $"Choose a target nearer the origin (|s*|·τ below about {Math.Max(1, loop.PadeOrder / 2)}) or raise the Padé order (up to {PadeApproximation.MaxOrder}).",
                Setting.Target);
    }
}
