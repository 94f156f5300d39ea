using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>
/// An immutable polynomial with real coefficients in the Laplace variable s (or any complex variable).
/// </summary>
/// <remarks>
/// Coefficients are stored in <b>ascending</b> powers: <c>c0 + c1·s + … + cn·sⁿ</c>.
/// Conversions to and from descending order are explicit in method names
/// (<see cref="FromDescending"/>, <see cref="ToDescending"/>). Trailing zero coefficients are trimmed,
/// so <see cref="Degree"/> is exact; the zero polynomial has degree −1 and no coefficients.
/// Expanded coefficients lose accuracy quickly with degree; roots and evaluations that matter should be
/// done on factored forms (see <see cref="FactoredPolynomial"/>).
/// </remarks>
public sealed class Polynomial : IEquatable<Polynomial>
{
    private readonly double[] _ascending;

    private Polynomial(double[] trimmedAscending) => _ascending = trimmedAscending;

    /// <summary>The zero polynomial.</summary>
    public static Polynomial Zero { get; } = new([]);

    /// <summary>The constant polynomial 1.</summary>
    public static Polynomial One { get; } = new([1.0]);

    /// <summary>Creates a polynomial from coefficients in ascending powers (c0 first).</summary>
    /// <exception cref="ArgumentException">A coefficient is NaN or infinite.</exception>
    public static Polynomial FromAscending(IEnumerable<double> ascending)
    {
        ArgumentNullException.ThrowIfNull(ascending);
        var copy = ascending.ToArray();
        foreach (var c in copy)
        {
            if (!double.IsFinite(c))
            {
                throw new ArgumentException("Polynomial coefficients must be finite.", nameof(ascending));
            }
        }

        return new Polynomial(Trim(copy));
    }

    /// <summary>Creates a polynomial from coefficients in descending powers (leading coefficient first).</summary>
    public static Polynomial FromDescending(IEnumerable<double> descending)
    {
        ArgumentNullException.ThrowIfNull(descending);
        var copy = descending.ToArray();
        Array.Reverse(copy);
        return FromAscending(copy);
    }

    /// <summary>Creates a constant polynomial.</summary>
    public static Polynomial Constant(double value) => FromAscending([value]);

    /// <summary>
    /// Expands <c>leading · Π (s − rᵢ)</c>. The roots must be closed under conjugation (within rounding),
    /// so that the result is real; the imaginary residue is discarded.
    /// </summary>
    public static Polynomial FromRoots(IReadOnlyList<Complex> roots, double leading = 1.0) =>
        TryFromRoots(roots, leading) ?? throw new ArgumentException("The expanded coefficients overflow.", nameof(roots));

    /// <summary>As <see cref="FromRoots"/>, or null when the expanded coefficients are not finite (overflow).</summary>
    public static Polynomial? TryFromRoots(IReadOnlyList<Complex> roots, double leading = 1.0)
    {
        ArgumentNullException.ThrowIfNull(roots);
        var c = new Complex[roots.Count + 1];
        c[0] = Complex.One;
        for (var i = 0; i < roots.Count; i++)
        {
            var r = roots[i];
            for (var k = i + 1; k >= 1; k--)
            {
                c[k] = c[k - 1] - r * c[k];
            }

            c[0] = -r * c[0];
        }

        var real = new double[c.Length];
        for (var k = 0; k < c.Length; k++)
        {
            real[k] = leading * c[k].Real;
            if (!double.IsFinite(real[k]))
            {
                return null;
            }
        }

        return new Polynomial(Trim(real));
    }

    /// <summary>Degree; −1 for the zero polynomial.</summary>
    public int Degree => _ascending.Length - 1;

    /// <summary>True for the zero polynomial.</summary>
    public bool IsZero => _ascending.Length == 0;

    /// <summary>Coefficients in ascending powers (c0 first).</summary>
    public IReadOnlyList<double> Ascending => _ascending;

    /// <summary>Leading coefficient (of the highest power); 0 for the zero polynomial.</summary>
    public double Leading => IsZero ? 0.0 : _ascending[^1];

    /// <summary>Coefficients in descending powers (leading coefficient first), as a new array.</summary>
    public double[] ToDescending()
    {
        var copy = (double[])_ascending.Clone();
        Array.Reverse(copy);
        return copy;
    }

    /// <summary>Evaluates at a complex point by Horner's rule.</summary>
    public Complex Evaluate(Complex s)
    {
        var acc = Complex.Zero;
        for (var k = _ascending.Length - 1; k >= 0; k--)
        {
            acc = acc * s + _ascending[k];
        }

        return acc;
    }

    /// <summary>Evaluates at a real point by Horner's rule.</summary>
    public double Evaluate(double s)
    {
        var acc = 0.0;
        for (var k = _ascending.Length - 1; k >= 0; k--)
        {
            acc = acc * s + _ascending[k];
        }

        return acc;
    }

    /// <summary>
    /// Evaluates Σ|cₖ|·|s|ᵏ, the scale against which a rounding-level residual of <see cref="Evaluate(Complex)"/>
    /// is judged (the backward-error denominator).
    /// </summary>
    public double EvaluateAbsolute(double modulus)
    {
        var acc = 0.0;
        for (var k = _ascending.Length - 1; k >= 0; k--)
        {
            acc = acc * modulus + Math.Abs(_ascending[k]);
        }

        return acc;
    }

    /// <summary>The derivative d/ds.</summary>
    public Polynomial Derivative()
    {
        if (_ascending.Length <= 1)
        {
            return Zero;
        }

        var d = new double[_ascending.Length - 1];
        for (var k = 1; k < _ascending.Length; k++)
        {
            d[k - 1] = k * _ascending[k];
        }

        return new Polynomial(Trim(d));
    }

    /// <summary>Sum of two polynomials.</summary>
    public Polynomial Plus(Polynomial other)
    {
        ArgumentNullException.ThrowIfNull(other);
        var n = Math.Max(_ascending.Length, other._ascending.Length);
        var r = new double[n];
        for (var k = 0; k < n; k++)
        {
            r[k] = (k < _ascending.Length ? _ascending[k] : 0.0) + (k < other._ascending.Length ? other._ascending[k] : 0.0);
        }

        return new Polynomial(Trim(r));
    }

    /// <summary>Product of two polynomials.</summary>
    public Polynomial Times(Polynomial other)
    {
        ArgumentNullException.ThrowIfNull(other);
        if (IsZero || other.IsZero)
        {
            return Zero;
        }

        var r = new double[_ascending.Length + other._ascending.Length - 1];
        for (var i = 0; i < _ascending.Length; i++)
        {
            for (var j = 0; j < other._ascending.Length; j++)
            {
                r[i + j] += _ascending[i] * other._ascending[j];
            }
        }

        return new Polynomial(Trim(r));
    }

    /// <summary>The polynomial scaled by a real factor.</summary>
    public Polynomial Times(double factor)
    {
        if (!double.IsFinite(factor))
        {
            throw new ArgumentException("Scale factor must be finite.", nameof(factor));
        }

        var r = new double[_ascending.Length];
        for (var k = 0; k < r.Length; k++)
        {
            r[k] = _ascending[k] * factor;
        }

        return new Polynomial(Trim(r));
    }

    public static Polynomial operator +(Polynomial a, Polynomial b) => a.Plus(b);

    public static Polynomial operator *(Polynomial a, Polynomial b) => a.Times(b);

    public static Polynomial operator *(Polynomial a, double b) => a.Times(b);

    /// <inheritdoc />
    public bool Equals(Polynomial? other) =>
        other is not null && _ascending.AsSpan().SequenceEqual(other._ascending);

    /// <inheritdoc />
    public override bool Equals(object? obj) => obj is Polynomial p && Equals(p);

    /// <inheritdoc />
    public override int GetHashCode()
    {
        var h = new HashCode();
        foreach (var c in _ascending)
        {
            h.Add(c);
        }

        return h.ToHashCode();
    }

    /// <summary>Descending-power text such as <c>s^2 + 2s + 5</c>, for messages.</summary>
    public override string ToString()
    {
        if (IsZero)
        {
            return "0";
        }

        var parts = new List<string>();
        for (var k = _ascending.Length - 1; k >= 0; k--)
        {
            var c = _ascending[k];
            if (c == 0.0)
            {
                continue;
            }

            var mag = Math.Abs(c);
            var coef = k > 0 && mag == 1.0 ? string.Empty : mag.ToString("G6", System.Globalization.CultureInfo.InvariantCulture);
            var power = k switch { 0 => string.Empty, 1 => "s", _ => "s^" + k };
            var term = coef + power;
            parts.Add(parts.Count == 0 ? (c < 0 ? "-" + term : term) : (c < 0 ? "- " + term : "+ " + term));
        }

        return string.Join(" ", parts);
    }

    private static double[] Trim(double[] ascending)
    {
        var n = ascending.Length;
        while (n > 0 && ascending[n - 1] == 0.0)
        {
            n--;
        }

        return n == ascending.Length ? ascending : ascending[..n];
    }
}
