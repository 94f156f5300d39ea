using CompAssist.Core.Numerics;

namespace CompAssist.Core.Model;

/// <summary>
/// Padé approximants of a pure delay e^(−sT): the rational function P(−sT)/P(sT) of order n, with
/// P(x) = Σₖ cₖ xᵏ and cₖ = (2n − k)! n! / ((2n)! k! (n − k)!) (a published formula; common practice).
/// </summary>
/// <remarks>
/// It is all-pass and exact in phase only at low frequency; at frequencies beyond about n/T its phase
/// falls short of the delay's, and its right-half-plane zeros are artefacts of the approximation.
/// </remarks>
public static class PadeApproximation
{
    /// <summary>Largest supported order.</summary>
    public const int MaxOrder = 10;

    /// <summary>The order-n approximant of e^(−sT) as a transfer function (factored, verified roots).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The order is outside 1…10 or the delay not positive.</exception>
    public static TransferFunction Of(double delay, int order)
    {
        if (!double.IsFinite(delay) || delay <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(delay), delay, "The delay must be positive.");
        }

        ArgumentOutOfRangeException.ThrowIfLessThan(order, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(order, MaxOrder);
        var c = Coefficients(order);
        var den = new double[order + 1];
        var num = new double[order + 1];
        var tk = 1.0;
        for (var k = 0; k <= order; k++)
        {
            den[k] = c[k] * tk;
            num[k] = (k % 2 == 0 ? 1 : -1) * c[k] * tk;
            tk *= delay;
        }

        return TransferFunction.FromPolynomials(Polynomial.FromAscending(num), Polynomial.FromAscending(den));
    }

    /// <summary>cₖ for k = 0…n, with c₀ = 1.</summary>
    public static double[] Coefficients(int order)
    {
        var c = new double[order + 1];
        c[0] = 1.0;
        for (var k = 1; k <= order; k++)
        {
            // c_k / c_{k−1} = (n − k + 1) / (k (2n − k + 1))
            c[k] = c[k - 1] * (order - k + 1) / (k * ((2.0 * order) - k + 1));
        }

        return c;
    }
}
