using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Discrete;

/// <summary>Rounds section coefficients to a number format and reports the damage.</summary>
public static class Quantizer
{
    /// <summary>Quantizes the sections of <paramref name="original"/>.</summary>
    public static QuantizationReport Quantize(DiscreteTransferFunction original, IReadOnlyList<Section> sections, NumberFormat format)
    {
        ArgumentNullException.ThrowIfNull(original);
        ArgumentNullException.ThrowIfNull(sections);
        ArgumentNullException.ThrowIfNull(format);
        var stored = sections.Select(q => Store(q, format)).ToImmutableArray();
        var quantized = Product(stored.Select(q => q.Section).ToList(), original.SampleTime);
        var poleShift = LargestShift(original.Poles, quantized.Poles);
        var zeroShift = LargestShift(original.Zeros, quantized.Zeros);
        var dc0 = original.DcGain;
        var dc1 = quantized.DcGain;
        var dcChange = double.IsFinite(dc0) && dc0 != 0 && double.IsFinite(dc1) ? 100 * Math.Abs(dc1 - dc0) / Math.Abs(dc0) : double.NaN;

        var warnings = ImmutableArray.CreateBuilder<string>();
        var fix = "Store the coefficients in a wider word, float or double (the sections are cascaded already; slow corners at fast rates crowd their poles against z = 1, where rounding moves them most).";
        var originallyInside = original.Poles.All(p => p.Magnitude < 1);
        var unstablePoles = quantized.Poles.Where(p => p.Magnitude >= 1 - 1e-15).ToList();
        if (unstablePoles.Count > 0 && (originallyInside || unstablePoles.Any(p => p.Magnitude > 1 + 1e-12)))
        {
            var onlyIntegrators = unstablePoles.All(p => Complex.Abs(p - 1) < 1e-12) && original.Poles.Any(p => Complex.Abs(p - 1) < 1e-12);
            if (!onlyIntegrators)
            {
                warnings.Add($"QUANTIZATION MOVES A POLE ONTO OR OUTSIDE THE UNIT CIRCLE in {format}: |z| = {unstablePoles.Max(p => p.Magnitude).ToString("G8", CultureInfo.InvariantCulture)}. {fix}");
            }
        }

        if (double.IsFinite(dcChange) && dcChange > QuantizationReport.DcGainTolerancePercent)
        {
            warnings.Add($"QUANTIZATION CHANGES THE DC GAIN by {dcChange.ToString("G3", CultureInfo.InvariantCulture)} % in {format} (tolerance {QuantizationReport.DcGainTolerancePercent} %). {fix}");
        }

        return new QuantizationReport(format, stored, quantized, poleShift, zeroShift, dcChange, warnings.ToImmutable());
    }

    /// <summary>One section stored in the format.</summary>
    public static QuantizedSection Store(Section q, NumberFormat format)
    {
        double[] c = [q.B0, q.B1, q.B2, q.A1, q.A2];
        switch (format.Kind)
        {
            case NumberFormatKind.Double:
                return new QuantizedSection(q, 0, []);
            case NumberFormatKind.Float:
                return new QuantizedSection(FromArray([.. c.Select(x => (double)(float)x)]), 0, []);
            default:
            {
                // As many fractional bits as the largest coefficient leaves in a signed word.
                var largest = c.Max(Math.Abs);
                var integerBits = largest < 1 ? 0 : (int)Math.Floor(Math.Log2(largest)) + 1;
                var fractional = Math.Max(0, format.WordBits - 1 - integerBits);
                var max = (1L << (format.WordBits - 1)) - 1;
                var min = -(1L << (format.WordBits - 1));
                var integers = c.Select(x => Math.Clamp((long)Math.Round(x * Math.Pow(2, fractional), MidpointRounding.AwayFromZero), min, max)).ToArray();
                return new QuantizedSection(FromArray([.. integers.Select(i => i / Math.Pow(2, fractional))]), fractional, integers);
            }
        }
    }

    /// <summary>The compensator a cascade of sections implements (its poles and zeros from each section).</summary>
    public static DiscreteTransferFunction Product(IReadOnlyList<Section> sections, double sampleTime)
    {
        ArgumentNullException.ThrowIfNull(sections);
        var zeros = new List<Complex>();
        var poles = new List<Complex>();
        var gain = 1.0;
        foreach (var q in sections)
        {
            // (b0 + b1 z⁻¹ + b2 z⁻²)/(1 + a1 z⁻¹ + a2 z⁻²) = (b0 z² + b1 z + b2)/(z² + a1 z + a2).
            var num = Polynomial.FromDescending([q.B0, q.B1, q.B2]);
            var den = Polynomial.FromDescending([1.0, q.A1, q.A2]);
            gain *= num.IsZero ? 0.0 : num.Leading;
            if (num.Degree > 0)
            {
                zeros.AddRange(RootFinder.Find(num).Roots);
            }

            if (den.Degree > 0)
            {
                poles.AddRange(RootFinder.Find(den).Roots);
            }
        }

        // Remove pairs of zeros and poles exactly at the origin (pure bookkeeping of the z⁻² form).
        while (zeros.Contains(Complex.Zero) && poles.Contains(Complex.Zero))
        {
            zeros.Remove(Complex.Zero);
            poles.Remove(Complex.Zero);
        }

        return DiscreteTransferFunction.FromFactors(gain, zeros, poles, sampleTime);
    }

    private static Section FromArray(double[] c) => new(c[0], c[1], c[2], c[3], c[4]);

    private static double LargestShift(IReadOnlyList<Complex> original, IReadOnlyList<Complex> quantized)
    {
        if (original.Count != quantized.Count)
        {
            return double.PositiveInfinity;
        }

        var remaining = quantized.ToList();
        var largest = 0.0;
        foreach (var p in original)
        {
            var nearest = remaining.OrderBy(q => Complex.Abs(q - p)).First();
            largest = Math.Max(largest, Complex.Abs(nearest - p));
            remaining.Remove(nearest);
        }

        return largest;
    }
}
