using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>
/// The function <c>D(s) + k·N(s)</c> with <c>D</c> and <c>N</c> in factored form — the closed-loop
/// characteristic polynomial of a loop whose open-loop transfer function is <c>k·N/D</c>. It is evaluated
/// as products, so its roots are polished to full accuracy even where expanded coefficients are not.
/// </summary>
public sealed class CharacteristicFunction : IRootFunction
{
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
    }

    /// <summary>D(s), the open-loop denominator.</summary>
    public FactoredPolynomial Denominator { get; }

    /// <summary>N(s), the open-loop numerator without its gain.</summary>
    public FactoredPolynomial Numerator { get; }

    /// <summary>k, the gain multiplying N(s) (its sign carries the feedback sign).</summary>
    public double Gain { get; }

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

    /// <inheritdoc />
    public (Complex Value, Complex Derivative, double Scale) Evaluate(Complex s)
    {
        var (dv, dd) = Denominator.EvaluateWithDerivative(s);
        var (nv, nd) = Numerator.EvaluateWithDerivative(s);
        var scale = Complex.Abs(dv) + Math.Abs(Gain) * Complex.Abs(nv);
        return (dv + (Gain * nv), dd + (Gain * nd), scale);
    }

    /// <summary>
    /// The mixed relative residual |D + kN| / (|D| + |k||N| + |F′(s)|·|s|) at <paramref name="s"/>: zero at a
    /// root, at most 1. The last term is what moving s by its own size changes F by, so a point within rounding
    /// of a root scores at rounding level even where D and kN nearly cancel (next to a pole or a zero).
    /// </summary>
    public double RelativeResidual(Complex s)
    {
        var (v, d, scale) = Evaluate(s);
        var denominator = scale + (Complex.Abs(d) * Complex.Abs(s));
        return denominator > 0 ? Complex.Abs(v) / denominator : 0.0;
    }
}
