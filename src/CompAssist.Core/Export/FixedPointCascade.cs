using CompAssist.Core.Discrete;

namespace CompAssist.Core.Export;

/// <summary>
/// The bit-exact integer model of the exported fixed-point code. Signals are signed W-bit integers with
/// <see cref="SignalFractionBits"/> fractional bits; section i's coefficients carry fᵢ fractional bits (its post-shift).
/// Per section, in 64-bit integers: acc = b0·x + s1; y = sat(round(acc / 2^fᵢ)); s1 = b1·x − a1·y + s2; s2 = b2·x − a2·y.
/// Rounding is to nearest with halves away from zero; saturation clamps to the W-bit range.
/// Words up to 24 bits keep every product and sum far inside 64 bits (no overflow is possible).
/// </summary>
public sealed class FixedPointCascade
{
    /// <summary>Largest word length the exported code supports.</summary>
    public const int MaxWordBits = 24;

    private FixedPointCascade(IReadOnlyList<QuantizedSection> sections, int wordBits, int signalFractionBits)
    {
        Sections = sections;
        WordBits = wordBits;
        SignalFractionBits = signalFractionBits;
    }

    /// <summary>The stored sections (integers and post-shifts).</summary>
    public IReadOnlyList<QuantizedSection> Sections { get; }

    /// <summary>Word length W.</summary>
    public int WordBits { get; }

    /// <summary>Fractional bits of the input and output signals.</summary>
    public int SignalFractionBits { get; }

    /// <summary>Creates the model for fixed-point sections.</summary>
    /// <exception cref="ArgumentException">The sections are not fixed point, the word is too long, or the signal format does not fit.</exception>
    public static FixedPointCascade Create(IReadOnlyList<QuantizedSection> sections, int wordBits, int signalFractionBits)
    {
        ArgumentNullException.ThrowIfNull(sections);
        if (wordBits < 8 || wordBits > MaxWordBits)
        {
            throw new ArgumentException($"Fixed-point code supports 8…{MaxWordBits}-bit words.", nameof(wordBits));
        }

        if (signalFractionBits < 0 || signalFractionBits >= wordBits)
        {
            throw new ArgumentException("The signal's fractional bits must fit the word.", nameof(signalFractionBits));
        }

        if (sections.Any(q => q.Integers.Count != 5))
        {
            throw new ArgumentException("Every section needs its five stored integers.", nameof(sections));
        }

        return new FixedPointCascade(sections, wordBits, signalFractionBits);
    }

    /// <summary>A real signal value as the stored integer (rounded, saturated).</summary>
    public long ToInteger(double value) => Saturate((long)Math.Round(value * Math.Pow(2, SignalFractionBits), MidpointRounding.AwayFromZero));

    /// <summary>A stored integer as a real signal value.</summary>
    public double ToReal(long value) => value / Math.Pow(2, SignalFractionBits);

    /// <summary>Runs the cascade from rest on integer inputs.</summary>
    public long[] Run(IReadOnlyList<long> input)
    {
        ArgumentNullException.ThrowIfNull(input);
        var s1 = new long[Sections.Count];
        var s2 = new long[Sections.Count];
        var output = new long[input.Count];
        for (var k = 0; k < input.Count; k++)
        {
            var x = input[k];
            for (var i = 0; i < Sections.Count; i++)
            {
                var c = Sections[i].Integers;
                var acc = (c[0] * x) + s1[i];
                var y = Saturate(ShiftRound(acc, Sections[i].FractionalBits));
                s1[i] = (c[1] * x) - (c[3] * y) + s2[i];
                s2[i] = (c[2] * x) - (c[4] * y);
                x = y;
            }

            output[k] = x;
        }

        return output;
    }

    /// <summary>Rounds v/2^f to nearest, halves away from zero (no right shift of a negative number).</summary>
    public static long ShiftRound(long v, int f)
    {
        if (f == 0)
        {
            return v;
        }

        var half = 1L << (f - 1);
        return v >= 0 ? (v + half) >> f : -((-v + half) >> f);
    }

    private long Saturate(long v)
    {
        var max = (1L << (WordBits - 1)) - 1;
        var min = -(1L << (WordBits - 1));
        return Math.Clamp(v, min, max);
    }
}
