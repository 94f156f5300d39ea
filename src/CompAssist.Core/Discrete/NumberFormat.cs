using System.Globalization;

namespace CompAssist.Core.Discrete;

/// <summary>
/// How coefficients are stored in the firmware: IEEE double, IEEE float, or signed fixed point with a word
/// length and, per section, as many fractional bits as the largest coefficient allows (the rest is the
/// section's post-shift). Fixed-point values round to nearest and saturate at the word's range.
/// </summary>
/// <param name="Kind">Double, float or fixed.</param>
/// <param name="WordBits">Word length for fixed point (8…32); 0 otherwise.</param>
public sealed record NumberFormat(NumberFormatKind Kind, int WordBits)
{
    /// <summary>IEEE 754 double.</summary>
    public static NumberFormat Double { get; } = new(NumberFormatKind.Double, 0);

    /// <summary>IEEE 754 single.</summary>
    public static NumberFormat Float { get; } = new(NumberFormatKind.Float, 0);

    /// <summary>Signed fixed point in words of <paramref name="bits"/> bits.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The word length is outside 8…32.</exception>
    public static NumberFormat Fixed(int bits)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(bits, 8);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(bits, 32);
        return new NumberFormat(NumberFormatKind.Fixed, bits);
    }

    /// <summary>Reads "double", "float", or "fixedN" / "qN" for an N-bit word.</summary>
    public static NumberFormat? TryParse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var t = text.Trim().ToLowerInvariant();
        if (t == "double")
        {
            return Double;
        }

        if (t == "float")
        {
            return Float;
        }

        var digits = t.StartsWith("fixed", StringComparison.Ordinal) ? t[5..] : t.StartsWith('q') ? t[1..] : null;
        return digits is not null && int.TryParse(digits, NumberStyles.None, CultureInfo.InvariantCulture, out var bits) && bits is >= 8 and <= 32 ? Fixed(bits) : null;
    }

    /// <summary>"double", "float" or "fixed16".</summary>
    public override string ToString() => Kind switch
    {
        NumberFormatKind.Double => "double",
        NumberFormatKind.Float => "float",
        _ => $"fixed{WordBits}",
    };
}
