using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Model;

/// <summary>
/// An immutable transfer function of the Laplace variable s, held in factored form
/// <c>G(s) = k · Π(s − zᵢ) / Π(s − pⱼ) · e^(−sT)</c>, which is the source of truth for accuracy.
/// </summary>
/// <remarks>
/// <para><b>Gain forms.</b> <see cref="Gain"/> is the <i>factored gain</i> k (the coefficient ratio of the
/// highest powers). <see cref="DcGain"/> is G(0) and <see cref="HighFrequencyGain"/> the limit of
/// G(s)·s^(relative degree) — they differ from k whenever zeros or poles are not at the origin.</para>
/// <para><b>Units.</b> Zeros and poles in rad/s, the delay T in seconds.</para>
/// <para><b>Polynomial form.</b> <see cref="Numerator"/> and <see cref="Denominator"/> are derived, with
/// the gain in the numerator and a monic denominator; their coefficients follow <see cref="Polynomial"/>
/// (ascending powers).</para>
/// </remarks>
public sealed class TransferFunction : IEquatable<TransferFunction>
{
    private TransferFunction(double gain, FactoredPolynomial zeros, FactoredPolynomial poles, double delay)
    {
        Gain = gain;
        ZeroFactors = zeros;
        PoleFactors = poles;
        Delay = delay;
    }

    /// <summary>The transfer function 1.</summary>
    public static TransferFunction Unity { get; } = new(1.0, FactoredPolynomial.One, FactoredPolynomial.One, 0.0);

    /// <summary>Factored gain k.</summary>
    public double Gain { get; }

    /// <summary>Zeros (rad/s), closed under conjugation, canonical order.</summary>
    public ImmutableArray<Complex> Zeros => ZeroFactors.Roots;

    /// <summary>Poles (rad/s), closed under conjugation, canonical order.</summary>
    public ImmutableArray<Complex> Poles => PoleFactors.Roots;

    /// <summary>Pure delay T ≥ 0 in seconds (the factor e^(−sT)).</summary>
    public double Delay { get; }

    /// <summary>Monic Π(s − zᵢ).</summary>
    public FactoredPolynomial ZeroFactors { get; }

    /// <summary>Monic Π(s − pⱼ).</summary>
    public FactoredPolynomial PoleFactors { get; }

    /// <summary>Number of poles minus number of zeros.</summary>
    public int RelativeDegree => Poles.Length - Zeros.Length;

    /// <summary>True when the numerator degree does not exceed the denominator degree.</summary>
    public bool IsProper => RelativeDegree >= 0;

    /// <summary>Derived numerator polynomial k·Π(s − zᵢ) (ascending coefficients).</summary>
    public Polynomial Numerator => Polynomial.FromRoots(Zeros, Gain);

    /// <summary>Derived denominator polynomial Π(s − pⱼ), monic (ascending coefficients).</summary>
    public Polynomial Denominator => PoleFactors.ToPolynomial();

    /// <summary>Creates k·Π(s − zᵢ)/Π(s − pⱼ)·e^(−sT).</summary>
    /// <exception cref="ArgumentException">
    /// The gain is zero or not finite, the delay is negative or not finite, or a root set is not finite and
    /// conjugate-closed.
    /// </exception>
    public static TransferFunction FromFactors(double gain, IEnumerable<Complex> zeros, IEnumerable<Complex> poles, double delay = 0.0)
    {
        if (!double.IsFinite(delay) || delay < 0.0)
        {
            throw new ArgumentException("The delay must be finite and non-negative.", nameof(delay));
        }

        var z = FactoredPolynomial.Create(1.0, zeros);
        var p = FactoredPolynomial.Create(1.0, poles);
        if (!double.IsFinite(gain) || gain == 0.0)
        {
            throw new ArgumentException("The gain must be finite and non-zero.", nameof(gain));
        }

        return new TransferFunction(gain, z, p, delay);
    }

    /// <summary>A constant gain.</summary>
    public static TransferFunction Constant(double gain) => FromFactors(gain, [], []);

    /// <summary>
    /// Creates N(s)/D(s) from polynomials (roots found and verified), times e^(−sT).
    /// </summary>
    /// <exception cref="ArgumentException">A polynomial is zero.</exception>
    /// <exception cref="RootFindingException">The roots could not be verified.</exception>
    public static TransferFunction FromPolynomials(Polynomial numerator, Polynomial denominator, double delay = 0.0)
    {
        ArgumentNullException.ThrowIfNull(numerator);
        ArgumentNullException.ThrowIfNull(denominator);
        if (numerator.IsZero || denominator.IsZero)
        {
            throw new ArgumentException("Numerator and denominator must be non-zero polynomials.");
        }

        var zeros = RootFinder.Find(numerator).Roots;
        var poles = RootFinder.Find(denominator).Roots;
        return FromFactors(numerator.Leading / denominator.Leading, zeros, poles, delay);
    }

    /// <summary>Value at s, with the delay included exactly.</summary>
    public Complex Evaluate(Complex s)
    {
        var value = Gain * ZeroFactors.Evaluate(s) / PoleFactors.Evaluate(s);
        return Delay == 0.0 ? value : value * Complex.Exp(-s * Delay);
    }

    /// <summary>
    /// Phase in radians at s as a sum of factor angles (continuous, not wrapped), delay included.
    /// </summary>
    public double PhaseAt(Complex s)
    {
        var phase = Gain < 0 ? Math.PI : 0.0;
        foreach (var z in Zeros)
        {
            phase += (s - z).Phase;
        }

        foreach (var p in Poles)
        {
            phase -= (s - p).Phase;
        }

        return phase - (s.Imaginary * Delay);
    }

    /// <summary>|G(s)|, computed as a product of factor distances, delay included.</summary>
    public double MagnitudeAt(Complex s)
    {
        var m = Math.Abs(Gain);
        foreach (var z in Zeros)
        {
            m *= Complex.Abs(s - z);
        }

        foreach (var p in Poles)
        {
            m /= Complex.Abs(s - p);
        }

        return Delay == 0.0 ? m : m * Math.Exp(-s.Real * Delay);
    }

    /// <summary>G(0); infinite (signed) when G has more poles than zeros at the origin, 0 when fewer.</summary>
    public double DcGain
    {
        get
        {
            var originPoles = Poles.Count(p => p == Complex.Zero);
            var originZeros = Zeros.Count(z => z == Complex.Zero);
            var value = Gain * NonOriginProduct(Zeros) / NonOriginProduct(Poles);
            if (originPoles > originZeros)
            {
                return value > 0 ? double.PositiveInfinity : double.NegativeInfinity;
            }

            return originZeros > originPoles ? 0.0 : value;
        }
    }

    /// <summary>The high-frequency gain: the factored gain k (the limit of G(s)·s^(relative degree)).</summary>
    public double HighFrequencyGain => Gain;

    /// <summary>The product of two transfer functions (factors concatenated, delays added).</summary>
    public TransferFunction Times(TransferFunction other)
    {
        ArgumentNullException.ThrowIfNull(other);
        return new TransferFunction(Gain * other.Gain, ZeroFactors.Times(other.ZeroFactors), PoleFactors.Times(other.PoleFactors), Delay + other.Delay);
    }

    public static TransferFunction operator *(TransferFunction a, TransferFunction b) => a.Times(b);

    /// <summary>The same transfer function scaled by a real non-zero factor.</summary>
    public TransferFunction Scaled(double factor)
    {
        if (!double.IsFinite(factor) || factor == 0.0)
        {
            throw new ArgumentException("The factor must be finite and non-zero.", nameof(factor));
        }

        return new TransferFunction(Gain * factor, ZeroFactors, PoleFactors, Delay);
    }

    /// <summary>The same rational part without the delay.</summary>
    public TransferFunction WithoutDelay() => Delay == 0.0 ? this : new TransferFunction(Gain, ZeroFactors, PoleFactors, 0.0);

    /// <inheritdoc />
    public bool Equals(TransferFunction? other) =>
        other is not null && Gain.Equals(other.Gain) && Delay.Equals(other.Delay)
        && ZeroFactors.Equals(other.ZeroFactors) && PoleFactors.Equals(other.PoleFactors);

    /// <inheritdoc />
    public override bool Equals(object? obj) => obj is TransferFunction t && Equals(t);

    /// <inheritdoc />
    public override int GetHashCode() => HashCode.Combine(Gain, Delay, ZeroFactors, PoleFactors);

    /// <summary>Factored text such as <c>4 (s + 2) / (s (s + 1))</c>.</summary>
    public override string ToString() => TransferFunctionFormatter.Factored(this);

    private static double NonOriginProduct(ImmutableArray<Complex> roots)
    {
        Complex product = 1.0;
        foreach (var r in roots)
        {
            if (r != Complex.Zero)
            {
                product *= -r;
            }
        }

        return product.Real;
    }
}
