using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Discrete;

/// <summary>
/// An immutable sampled transfer function C(z) = k·Π(z − zᵢ)/Π(z − pⱼ) with sample time T (seconds).
/// </summary>
/// <remarks>
/// Coefficient form (<see cref="Numerator"/>, <see cref="Denominator"/>) is in <b>ascending powers of z⁻¹</b>:
/// C(z) = (b₀ + b₁z⁻¹ + … + bₙz⁻ⁿ)/(1 + a₁z⁻¹ + … + aₙz⁻ⁿ), a₀ = 1, so the difference equation is
/// u[k] = Σ bᵢ·e[k − i] − Σᵢ≥₁ aᵢ·u[k − i].
/// </remarks>
public sealed class DiscreteTransferFunction
{
    private DiscreteTransferFunction(double gain, ImmutableArray<Complex> zeros, ImmutableArray<Complex> poles, double sampleTime)
    {
        Gain = gain;
        Zeros = zeros;
        Poles = poles;
        SampleTime = sampleTime;
        var n = poles.Length;
        var num = Polynomial.FromRoots(zeros, gain).ToDescending();
        var den = Polynomial.FromRoots(poles).ToDescending();

        // Both as polynomials in z of degree n, then divided by zⁿ: coefficient k multiplies z^(−k).
        var b = new double[n + 1];
        var offset = n - (num.Length - 1);
        for (var i = 0; i < num.Length; i++)
        {
            b[offset + i] = num[i];
        }

        Numerator = [.. b];
        Denominator = [.. den];
    }

    /// <summary>Factored gain k.</summary>
    public double Gain { get; }

    /// <summary>Zeros in the z-plane.</summary>
    public ImmutableArray<Complex> Zeros { get; }

    /// <summary>Poles in the z-plane.</summary>
    public ImmutableArray<Complex> Poles { get; }

    /// <summary>Sample time T, seconds.</summary>
    public double SampleTime { get; }

    /// <summary>b₀…bₙ, ascending powers of z⁻¹.</summary>
    public ImmutableArray<double> Numerator { get; }

    /// <summary>a₀ = 1, a₁…aₙ, ascending powers of z⁻¹.</summary>
    public ImmutableArray<double> Denominator { get; }

    /// <summary>Creates k·Π(z − zᵢ)/Π(z − pⱼ); must be causal (no more zeros than poles).</summary>
    /// <exception cref="ArgumentException">Non-causal, non-finite, or T not positive.</exception>
    public static DiscreteTransferFunction FromFactors(double gain, IEnumerable<Complex> zeros, IEnumerable<Complex> poles, double sampleTime)
    {
        var z = FactoredPolynomial.Create(1.0, zeros).Roots;
        var p = FactoredPolynomial.Create(1.0, poles).Roots;
        if (z.Length > p.Length)
        {
            throw new ArgumentException("A sampled compensator must be causal (no more zeros than poles).");
        }

        if (!double.IsFinite(gain) || !(sampleTime > 0) || !double.IsFinite(sampleTime))
        {
            throw new ArgumentException("The gain must be finite and the sample time positive.");
        }

        return new DiscreteTransferFunction(gain, z, p, sampleTime);
    }

    /// <summary>C(z) at a point of the z-plane.</summary>
    public Complex Evaluate(Complex z)
    {
        Complex v = Gain;
        foreach (var r in Zeros)
        {
            v *= z - r;
        }

        foreach (var r in Poles)
        {
            v /= z - r;
        }

        return v;
    }

    /// <summary>C(1), the DC gain (infinite with a pole at z = 1).</summary>
    public double DcGain
    {
        get
        {
            var v = Evaluate(Complex.One);
            return double.IsFinite(v.Real) ? v.Real : double.PositiveInfinity;
        }
    }

    /// <summary>Runs the difference equation on an input sequence from rest.</summary>
    public double[] Filter(IReadOnlyList<double> input)
    {
        ArgumentNullException.ThrowIfNull(input);
        var b = Numerator;
        var a = Denominator;
        var y = new double[input.Count];
        for (var k = 0; k < input.Count; k++)
        {
            var acc = 0.0;
            for (var i = 0; i < b.Length && i <= k; i++)
            {
                acc += b[i] * input[k - i];
            }

            for (var i = 1; i < a.Length && i <= k; i++)
            {
                acc -= a[i] * y[k - i];
            }

            y[k] = acc;
        }

        return y;
    }
}
