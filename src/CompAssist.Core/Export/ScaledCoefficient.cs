namespace CompAssist.Core.Export;

/// <summary>
/// A real coefficient c stored for integer arithmetic as a W-bit mantissa m and a shift s: c ≈ m·2^−s (s may be
/// negative, a left shift). A product m·x is brought to scale by <see cref="FixedPointPid.ScaleSaturate"/>.
/// </summary>
/// <param name="Mantissa">The stored signed integer, |m| ≤ 2^(W−1) − 1.</param>
/// <param name="Shift">The right shift s after the product (negative: a left shift).</param>
public readonly record struct ScaledCoefficient(long Mantissa, int Shift)
{
    /// <summary>The largest right shift kept; a coefficient needing more is below resolution and stored as 0.</summary>
    public const int MaxShift = 62;

    /// <summary>The real value the stored mantissa and shift implement.</summary>
    public double Value => Mantissa * Math.Pow(2, -Shift);

    /// <summary>The coefficient c in <paramref name="wordBits"/>-bit words with the most significant bits kept (rounded to nearest).</summary>
    /// <exception cref="ArgumentException">c is not finite or the word is outside 8…32 bits.</exception>
    public static ScaledCoefficient Of(double c, int wordBits)
    {
        if (!double.IsFinite(c) || wordBits is < 8 or > 32)
        {
            throw new ArgumentException("A finite coefficient and an 8…32-bit word are needed.", nameof(c));
        }

        if (c == 0)
        {
            return new ScaledCoefficient(0, 0);
        }

        var max = (1L << (wordBits - 1)) - 1;
        var shift = wordBits - 1 - (int)Math.Ceiling(Math.Log2(Math.Abs(c)));
        while (Math.Abs(Math.Round(c * Math.Pow(2, shift), MidpointRounding.AwayFromZero)) > max)
        {
            shift--;
        }

        if (shift > MaxShift)
        {
            shift = MaxShift;
        }

        return new ScaledCoefficient((long)Math.Round(c * Math.Pow(2, shift), MidpointRounding.AwayFromZero), shift);
    }
}
