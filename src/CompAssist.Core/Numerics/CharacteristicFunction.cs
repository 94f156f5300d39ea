using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>
/// The function <c>D(s) + k·N(s)</c> with <c>D</c> and <c>N</c> in factored form — the closed-loop
/// characteristic polynomial of a loop whose open-loop transfer function is <c>k·N/D</c>. It is evaluated
/// as products, so its roots are polished to full accuracy even where expanded coefficients are not.
/// </summary>
/// <remarks>
/// A factor that <c>D</c> and <c>N</c> share exactly (a pole cancelled by a zero) is a factor of the whole
/// function: its root is a closed-loop root for every <c>k</c>, known exactly, and <see cref="Deflate"/> hands it
/// over as such instead of leaving it to root finding (which could only return it to within an ulp, where the
/// relative residual of the other factor is not small).
/// </remarks>
public sealed class CharacteristicFunction : IRootFunction
{
    private readonly Lazy<CharacteristicFunction> _reduced;

    /// <summary>Creates <c>D + k·N</c>.</summary>
    /// <exception cref="ArgumentException">
    /// <c>k</c> is not finite, or <c>N</c> has a higher degree than <c>D</c> (the loop is improper).
    /// </exception>
    public CharacteristicFunction(FactoredPolynomial denominator, double gain, FactoredPolynomial numerator)
    {
        ArgumentNullException.ThrowIfNull(denominator);
        ArgumentNullException.ThrowIfNull(numerator);
        if (!double.IsFinite(gain))
        {
            throw new ArgumentException("The loop gain must be finite.", nameof(gain));
        }

        if (numerator.Degree > denominator.Degree)
        {
            throw new ArgumentException("The open loop must be proper (numerator degree ≤ denominator degree).", nameof(numerator));
        }

        Denominator = denominator;
        Numerator = numerator;
        Gain = gain;
        SharedRoots = Shared(denominator.Roots, numerator.Roots);
        _reduced = new Lazy<CharacteristicFunction>(() => new CharacteristicFunction(
            FactoredPolynomial.Create(Denominator.Leading, Without(Denominator.Roots, SharedRoots)),
            Gain,
            FactoredPolynomial.Create(Numerator.Leading, Without(Numerator.Roots, SharedRoots))));
    }

    /// <summary>D(s), the open-loop denominator.</summary>
    public FactoredPolynomial Denominator { get; }

    /// <summary>N(s), the open-loop numerator without its gain.</summary>
    public FactoredPolynomial Numerator { get; }

    /// <summary>k, the gain multiplying N(s) (its sign carries the feedback sign).</summary>
    public double Gain { get; }

    /// <summary>
    /// Roots that D and N share exactly (each as often as both have it, canonical order): closed-loop roots for
    /// every gain, such as a plant pole cancelled by a compensator zero.
    /// </summary>
    public ImmutableArray<Complex> SharedRoots { get; }

    /// <inheritdoc />
    public int Degree
    {
        get
        {
            if (Numerator.Degree < Denominator.Degree)
            {
                return Denominator.Degree;
            }

            var lead = Denominator.Leading + (Gain * Numerator.Leading);
            var size = Math.Abs(Denominator.Leading) + Math.Abs(Gain * Numerator.Leading);
            return Math.Abs(lead) <= 1e-12 * size ? ExpandForSeeds().Degree : Denominator.Degree;
        }
    }

    /// <inheritdoc />
    public Polynomial ExpandForSeeds() => Denominator.ToPolynomial() + (Numerator.ToPolynomial() * Gain);

    /// <summary>The shared roots, exact, and D/C + k·N/C with the shared factors C divided out.</summary>
    public (ImmutableArray<Complex> Exact, IRootFunction Remainder) Deflate() => SharedRoots.IsEmpty ? ([], this) : (SharedRoots, _reduced.Value);

    /// <summary>
    /// Value and derivative of D + kN at <paramref name="s"/> as products, and its rounding size
    /// |D|·(1 + Σ (|s| + |pᵢ|)/|s − pᵢ|) + |kN|·(1 + Σ (|s| + |zⱼ|)/|s − zⱼ|) (see <see cref="RelativeResidual"/>).
    /// </summary>
    public (Complex Value, Complex Derivative, double Scale) Evaluate(Complex s)
    {
        var (dv, dd) = Denominator.EvaluateWithDerivative(s);
        var (nv, nd) = Numerator.EvaluateWithDerivative(s);
        var scale = RoundingSize(Denominator, s) + (Math.Abs(Gain) * RoundingSize(Numerator, s));
        return (dv + (Gain * nv), dd + (Gain * nd), scale);
    }

    /// <summary>
    /// The relative residual |D + kN| / size at <paramref name="s"/>, everything as products: zero at a root, at
    /// most about 1. The size is what D + kN can change by when the gain, the point s and every factor's root are
    /// moved by one relative unit (first order): |D|·(1 + Σ (|s| + |pᵢ|)/|s − pᵢ|) + |kN|·(1 + Σ (|s| + |zⱼ|)/|s − zⱼ|),
    /// computed by the product rule, so it stays finite on a factor's own root. A residual ε therefore says that s
    /// is an exact root once the data and s are moved by about ε relative (a backward error); a point within
    /// rounding of a root scores at rounding level also where D and kN nearly cancel — next to a pole or a zero,
    /// between a pole and a zero that nearly cancel, at a repeated root — and on a cancelled factor's own root D + kN
    /// is exactly zero.
    /// </summary>
    public double RelativeResidual(Complex s)
    {
        var (v, _, scale) = Evaluate(s);
        return scale > 0 ? Complex.Abs(v) / scale : (v == Complex.Zero ? 0.0 : double.PositiveInfinity);
    }

    /// <summary>|P(s)| + Σᵢ (|s| + |rᵢ|)·|lead|·Πⱼ≠ᵢ |s − rⱼ| by the product rule (finite at a root).</summary>
    private static double RoundingSize(FactoredPolynomial p, Complex s)
    {
        var size = Complex.Abs(s);
        double value = 1, sensitivity = 0;
        foreach (var r in p.Roots)
        {
            var a = Complex.Abs(s - r);
            sensitivity = (sensitivity * a) + (value * (size + Complex.Abs(r)));
            value *= a;
        }

        return Math.Abs(p.Leading) * (value + sensitivity);
    }

    private static ImmutableArray<Complex> Shared(ImmutableArray<Complex> a, ImmutableArray<Complex> b)
    {
        if (a.IsEmpty || b.IsEmpty)
        {
            return [];
        }

        var left = b.ToList();
        var shared = new List<Complex>();
        foreach (var r in a)
        {
            var i = left.IndexOf(r);
            if (i >= 0)
            {
                shared.Add(r);
                left.RemoveAt(i);
            }
        }

        return shared.Count == 0 ? [] : ConjugateSymmetry.Canonical(shared);
    }

    private static List<Complex> Without(ImmutableArray<Complex> roots, ImmutableArray<Complex> remove)
    {
        var left = roots.ToList();
        foreach (var r in remove)
        {
            left.RemoveAt(left.IndexOf(r));
        }

        return left;
    }
}
