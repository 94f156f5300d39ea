using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>Helpers for root sets of real polynomials, which are closed under complex conjugation.</summary>
internal static class ConjugateSymmetry
{
    /// <summary>Relative size of an imaginary part below which a root counts as real.</summary>
    public const double RealTolerance = 1e-12;

    /// <summary>True when every non-real root has a conjugate partner (within rounding).</summary>
    public static bool IsClosed(IReadOnlyList<Complex> roots)
    {
        var used = new bool[roots.Count];
        for (var i = 0; i < roots.Count; i++)
        {
            if (used[i] || IsReal(roots[i]))
            {
                continue;
            }

            var partner = -1;
            var best = double.PositiveInfinity;
            for (var j = 0; j < roots.Count; j++)
            {
                if (j == i || used[j] || IsReal(roots[j]))
                {
                    continue;
                }

                var d = Complex.Abs(roots[j] - Complex.Conjugate(roots[i]));
                if (d < best)
                {
                    best = d;
                    partner = j;
                }
            }

            var scale = Math.Max(Complex.Abs(roots[i]), 1e-300);
            if (partner < 0 || best > 1e-9 * scale)
            {
                return false;
            }

            used[i] = used[partner] = true;
        }

        return true;
    }

    /// <summary>
    /// Canonical order and exact symmetry: real roots (imaginary part set to 0) ascending by real part, then
    /// each pair as (upper, lower) by ascending real part, the lower being the exact conjugate of the upper.
    /// </summary>
    public static ImmutableArray<Complex> Canonical(IReadOnlyList<Complex> roots)
    {
        var reals = new List<double>();
        var uppers = new List<Complex>();
        foreach (var r in roots)
        {
            if (IsReal(r))
            {
                reals.Add(r.Real);
            }
            else if (r.Imaginary > 0)
            {
                uppers.Add(r);
            }
        }

        reals.Sort();
        uppers.Sort((a, b) => a.Real != b.Real ? a.Real.CompareTo(b.Real) : a.Imaginary.CompareTo(b.Imaginary));
        var builder = ImmutableArray.CreateBuilder<Complex>(reals.Count + (2 * uppers.Count));
        foreach (var x in reals)
        {
            builder.Add(new Complex(x, 0.0));
        }

        foreach (var u in uppers)
        {
            builder.Add(u);
            builder.Add(Complex.Conjugate(u));
        }

        return builder.MoveToImmutable();
    }

    /// <summary>True when the imaginary part is negligible against the modulus.</summary>
    public static bool IsReal(Complex r) => Math.Abs(r.Imaginary) <= RealTolerance * Math.Max(Complex.Abs(r), 1e-300);
}
