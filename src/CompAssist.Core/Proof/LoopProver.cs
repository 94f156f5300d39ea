using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Proof;

/// <summary>Builds the <see cref="LoopProof"/> of a compensator on a loop.</summary>
public static class LoopProver
{
    /// <summary>Proves the compensated loop against a target.</summary>
    /// <exception cref="RootFindingException">The closed-loop roots cannot be verified.</exception>
    /// <exception cref="ArgumentException">The compensated loop is improper.</exception>
    public static LoopProof Prove(Loop loop, TransferFunction compensator, TargetPole target)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        ArgumentNullException.ThrowIfNull(target);
        var characteristic = loop.Characteristic(compensator);
        var evidence = RootFinder.Find(characteristic);
        var s = target.Point;

        var usesPade = loop.OpenLoop(compensator).Delay > 0;
        var residual = characteristic.RelativeResidual(s);
        var exact = ExactResidual(loop, compensator, s);

        var forward = loop.Rational(compensator * loop.Plant);
        var zeros = forward.Zeros.AddRange(loop.Rational(loop.Feedback).Poles);
        zeros = ConjugateSymmetry.Canonical(zeros);
        var scale = Math.Max(Complex.Abs(s), 1e-12);
        var nearest = evidence.Roots.Length == 0 ? double.PositiveInfinity : evidence.Roots.Min(r => Complex.Abs(r - s)) / scale;

        var roots = ImmutableArray.CreateBuilder<ClosedLoopRoot>(evidence.Roots.Length);
        var unmatchedZeros = zeros.ToList();
        var dominantTaken = 0;
        foreach (var r in evidence.Roots)
        {
            var role = RootRole.Other;
            if (dominantTaken < 2 && (Complex.Abs(r - s) <= 1e-6 * scale || Complex.Abs(r - Complex.Conjugate(s)) <= 1e-6 * scale))
            {
                role = RootRole.Dominant;
                dominantTaken++;
            }
            else
            {
                var z = unmatchedZeros.FindIndex(q => Complex.Abs(q - r) <= 1e-6 * Math.Max(1.0, Complex.Abs(r)));
                if (z >= 0)
                {
                    role = RootRole.Cancelled;
                    unmatchedZeros.RemoveAt(z);
                }
            }

            roots.Add(new ClosedLoopRoot(r, role));
        }

        var others = roots.Where(r => r.Role == RootRole.Other).ToList();
        var dominance = others.Count == 0 ? double.PositiveInfinity : others.Min(r => -r.Value.Real) / target.Sigma;
        var judgement = ClosedLoopStability.Judge(loop, compensator, evidence.Roots);
        var stable = judgement.Stable;

        var warnings = ImmutableArray.CreateBuilder<string>();
        if (judgement.Note is { } note)
        {
            warnings.Add(note);
        }

        if (evidence.Roots.Any(r => r.Real >= 0))
        {
            var bad = evidence.Roots.Where(r => r.Real >= 0).Select(r => TransferFunctionFormatter.Complex(r, 4));
            warnings.Add($"UNSTABLE: closed-loop pole(s) at {string.Join(", ", bad)} have non-negative real part. Do not use this design.");
        }

        var confirmed = (usesPade ? exact : residual) <= LoopProof.TargetResidualLimit && nearest <= 1e-6;
        if (!confirmed)
        {
            warnings.Add($"The target is NOT confirmed as a closed-loop root (relative residual {F(usesPade ? exact : residual)}, nearest root {F(nearest)}·|s*| away).");
        }

        foreach (var r in others.Where(r => -r.Value.Real < target.Sigma && r.Value.Real < 0))
        {
            warnings.Add($"A closed-loop pole at {TransferFunctionFormatter.Complex(r.Value, 4)} decays slower than the target; the response is not dominated by the target pair.");
        }

        if (double.IsFinite(dominance) && dominance >= 1 && dominance < LoopProof.DominanceRule)
        {
            warnings.Add($"Dominance ratio {F(dominance)} < {F(LoopProof.DominanceRule)}: the nearest other pole is close enough to change the response; trust the simulated step, not the second-order prediction.");
        }

        foreach (var z in unmatchedZeros.Where(z => z.Imaginary >= 0 && Math.Abs(z.Real) < LoopProof.DominanceRule * target.Sigma).Distinct())
        {
            warnings.Add(z.Real >= 0
                ? $"A right-half-plane closed-loop zero at {TransferFunctionFormatter.Complex(z, 4)} makes the step start the wrong way (undershoot)."
                : $"A closed-loop zero at {TransferFunctionFormatter.Complex(z, 4)} lies within {F(LoopProof.DominanceRule)}× the target's decay rate; expect more overshoot and a faster rise than predicted.");
        }

        foreach (var r in roots.Where(r => r.Role == RootRole.Cancelled && r.Value.Imaginary >= 0))
        {
            warnings.Add($"The closed-loop pole at {TransferFunctionFormatter.Complex(r.Value, 4)} sits on a closed-loop zero: it is invisible in the reference step but still answers load disturbances.");
        }

        if (usesPade)
        {
            warnings.Add($"The loop delay is replaced by a Padé approximant of order {loop.PadeOrder} for the roots; its extra poles and zeros are artefacts, and the exact-delay angle condition is used for the target.");
        }

        return new LoopProof
        {
            CharacteristicDescending = Monic(characteristic.ExpandForSeeds()),
            Roots = roots.ToImmutable(),
            ClosedLoopZeros = zeros,
            TargetResidual = residual,
            TargetResidualExactDelay = exact,
            TargetRootDistance = nearest,
            RootEvidence = evidence,
            DominanceRatio = dominance,
            Stable = stable,
            UsesPade = usesPade,
            Warnings = warnings.ToImmutable(),
        };
    }

    private static double ExactResidual(Loop loop, TransferFunction compensator, Complex s)
    {
        var l = loop.OpenLoop(compensator).Evaluate(s);
        var value = 1.0 + (loop.SignFactor * l);
        return Complex.Abs(value) / (1.0 + Complex.Abs(l));
    }

    private static ImmutableArray<double> Monic(Polynomial p)
    {
        var d = p.ToDescending();
        var lead = d[0];
        return [.. d.Select(c => c / lead)];
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 3);
}
