using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>
/// An immutable polynomial held in factored form <c>leading · Π (s − rᵢ)</c>, the accurate representation
/// that evaluations and root polishing use. Roots are closed under complex conjugation, so the polynomial
/// is real.
/// </summary>
public sealed class FactoredPolynomial : IEquatable<FactoredPolynomial>
{
    private FactoredPolynomial(double leading, ImmutableArray<Complex> roots)
    {
        Leading = leading;
        Roots = roots;
    }

    /// <summary>The coefficient of the highest power.</summary>
    public double Leading { get; }

    /// <summary>The roots, each repeated by its multiplicity; closed under conjugation.</summary>
    public ImmutableArray<Complex> Roots { get; }

    /// <summary>Degree (number of roots).</summary>
    public int Degree => Roots.Length;

    /// <summary>The constant polynomial 1.</summary>
    public static FactoredPolynomial One { get; } = new(1.0, []);

    /// <summary>Creates <c>leading · Π (s − rᵢ)</c>.</summary>
    /// <exception cref="ArgumentException">
    /// The leading coefficient is zero or not finite, a root is not finite, or the roots are not closed
    /// under conjugation.
    /// </exception>
    public static FactoredPolynomial Create(double leading, IEnumerable<Complex> roots)
    {
        ArgumentNullException.ThrowIfNull(roots);
        if (!double.IsFinite(leading) || leading == 0.0)
        {
            throw new ArgumentException("The leading coefficient must be finite and non-zero.", nameof(leading));
        }

        var list = roots.ToImmutableArray();
        foreach (var r in list)
        {
            if (!double.IsFinite(r.Real) || !double.IsFinite(r.Imaginary))
            {
                throw new ArgumentException("Roots must be finite.", nameof(roots));
            }
        }

        if (!ConjugateSymmetry.IsClosed(list))
        {
            throw new ArgumentException("Roots must come in conjugate pairs for a real polynomial.", nameof(roots));
        }

        return new FactoredPolynomial(leading, ConjugateSymmetry.Canonical(list));
    }

    /// <summary>Value at <paramref name="s"/>, as a product.</summary>
    public Complex Evaluate(Complex s)
    {
        Complex p = Leading;
        foreach (var r in Roots)
        {
            p *= s - r;
        }

        return p;
    }

    /// <summary>Value and derivative at <paramref name="s"/>, by the product rule (safe at a root).</summary>
    public (Complex Value, Complex Derivative) EvaluateWithDerivative(Complex s)
    {
        Complex p = 1.0;
        Complex d = 0.0;
        foreach (var r in Roots)
        {
            var f = s - r;
            d = d * f + p;
            p *= f;
        }

        return (Leading * p, Leading * d);
    }

    /// <summary>The product with another factored polynomial (roots concatenated).</summary>
    public FactoredPolynomial Times(FactoredPolynomial other)
    {
        ArgumentNullException.ThrowIfNull(other);
        return new FactoredPolynomial(Leading * other.Leading, ConjugateSymmetry.Canonical(Roots.AddRange(other.Roots)));
    }

    /// <summary>Expanded coefficients. Loses accuracy at high degree; use for seeds and display only.</summary>
    public Polynomial ToPolynomial() => Polynomial.FromRoots(Roots, Leading);

    /// <inheritdoc />
    public bool Equals(FactoredPolynomial? other) =>
        other is not null && Leading.Equals(other.Leading) && Roots.AsSpan().SequenceEqual(other.Roots.AsSpan());

    /// <inheritdoc />
    public override bool Equals(object? obj) => obj is FactoredPolynomial f && Equals(f);

    /// <inheritdoc />
    public override int GetHashCode()
    {
        var h = new HashCode();
        h.Add(Leading);
        foreach (var r in Roots)
        {
            h.Add(r);
        }

        return h.ToHashCode();
    }
}
