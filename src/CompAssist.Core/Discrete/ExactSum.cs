using System.Numerics;

namespace CompAssist.Core.Discrete;

/// <summary>
/// Sums of doubles without rounding: every finite double is an integer multiple of 2⁻¹⁰⁷⁴, so the sum is an exact
/// big integer times that unit, rounded once at the end. Used to read the DC gain Σb/Σa of stored coefficients
/// exactly, so that an error in it belongs to the coefficients and not to the arithmetic that checks them.
/// </summary>
internal static class ExactSum
{
    private const int UnitExponent = 1074;

    /// <summary>Σ values as an integer multiple of 2⁻¹⁰⁷⁴.</summary>
    /// <exception cref="ArgumentException">A value is not finite.</exception>
    public static BigInteger Of(IEnumerable<double> values)
    {
        var sum = BigInteger.Zero;
        foreach (var x in values)
        {
            if (!double.IsFinite(x))
            {
                throw new ArgumentException("Only finite values have an exact sum.", nameof(values));
            }

            sum += Scaled(x);
        }

        return sum;
    }

    /// <summary>The ratio of two exact sums, rounded once (±∞ or NaN when the divisor is zero).</summary>
    public static double Ratio(BigInteger numerator, BigInteger denominator)
    {
        if (denominator.IsZero)
        {
            return numerator.IsZero ? double.NaN : numerator.Sign * double.PositiveInfinity;
        }

        // Keep 64 significant bits of the quotient: shift the numerator so the integer quotient has them.
        var shift = (int)(denominator.GetBitLength() - numerator.GetBitLength()) + 64;
        var quotient = shift >= 0 ? (numerator << shift) / denominator : numerator / (denominator << -shift);
        return Math.ScaleB((double)quotient, -shift);
    }

    private static BigInteger Scaled(double x)
    {
        if (x == 0)
        {
            return BigInteger.Zero;
        }

        var bits = BitConverter.DoubleToInt64Bits(x);
        var exponent = (int)((bits >> 52) & 0x7FF);
        var mantissa = bits & 0xFFFFFFFFFFFFFL;
        if (exponent == 0)
        {
            exponent = 1;
        }
        else
        {
            mantissa |= 1L << 52;
        }

        // x = mantissa · 2^(exponent − 1075) = (mantissa · 2^(exponent − 1)) · 2⁻¹⁰⁷⁴.
        var value = new BigInteger(mantissa) << (exponent - 1);
        return x < 0 ? -value : value;
    }
}
