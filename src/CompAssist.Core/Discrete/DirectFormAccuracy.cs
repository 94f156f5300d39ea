using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Discrete;

/// <summary>
/// What a single direct form of C(z) — the expanded numerator and denominator, stored as double or float — implements,
/// against the cascade of second-order sections (each stored the same way). Both DC gains are read from the stored
/// coefficients by exact summation (Σb/Σa), the reference is C(1) of the designed poles and zeros; the pole shift is
/// the largest distance between the designed poles and the roots of the stored denominator. Expanded polynomials of
/// high order with poles crowded near z = 1 (slow corners at a fast rate) lose their DC gain first (common practice;
/// Franklin, Powell and Workman, Digital Control of Dynamic Systems, 3rd ed., chapter 13, on coefficient sensitivity).
/// </summary>
/// <param name="Format">How the coefficients are stored (double or float).</param>
/// <param name="DesignedDcGain">C(1) from the designed factors.</param>
/// <param name="DirectDcGain">Σb/Σa of the stored direct-form coefficients.</param>
/// <param name="SectionsDcGain">The product of the sections' Σb/Σa, stored the same way.</param>
/// <param name="DirectPoleShift">Largest |designed pole − stored direct-form pole|.</param>
public sealed record DirectFormAccuracy(NumberFormat Format, double DesignedDcGain, double DirectDcGain, double SectionsDcGain, double DirectPoleShift)
{
    /// <summary>The relative DC-gain error above which the direct form is said to lose accuracy (1 %).</summary>
    public const double TolerancePercent = 1.0;

    /// <summary>|direct − designed|/|designed| in %.</summary>
    public double DirectErrorPercent => Percent(DirectDcGain);

    /// <summary>|sections − designed|/|designed| in %.</summary>
    public double SectionsErrorPercent => Percent(SectionsDcGain);

    /// <summary>
    /// True when the direct form's DC gain is off by more than the tolerance or of the other sign, or, for a design
    /// with an integrator (infinite DC gain), when the stored direct form has lost it (a finite DC gain: a leak).
    /// </summary>
    public bool DirectLosesAccuracy => double.IsInfinity(DesignedDcGain)
        ? double.IsFinite(DirectDcGain)
        : !(DirectErrorPercent <= TolerancePercent) || Math.Sign(DirectDcGain) != Math.Sign(DesignedDcGain);

    /// <summary>Analyses <paramref name="d"/> stored as <paramref name="format"/> (double or float; fixed point has its own analysis).</summary>
    public static DirectFormAccuracy Of(DiscreteTransferFunction d, NumberFormat format)
    {
        ArgumentNullException.ThrowIfNull(d);
        ArgumentNullException.ThrowIfNull(format);
        double Store(double x) => format.Kind == NumberFormatKind.Float ? (float)x : x;
        var b = d.Numerator.Select(Store).ToArray();
        var a = d.Denominator.Select(Store).ToArray();
        var direct = Gain(b, a);
        var sections = 1.0;
        foreach (var q in SectionSplitter.Split(d))
        {
            sections *= Gain([Store(q.B0), Store(q.B1), Store(q.B2)], [1.0, Store(q.A1), Store(q.A2)]);
        }

        var shift = 0.0;
        if (d.Poles.Length > 0)
        {
            var stored = RootFinder.Find(Polynomial.FromDescending(a)).Roots;
            shift = d.Poles.Max(p => stored.Length == 0 ? double.PositiveInfinity : stored.Min(r => Complex.Abs(r - p)));
        }

        return new DirectFormAccuracy(format, d.DcGain, direct, sections, shift);
    }

    private static double Gain(IReadOnlyList<double> b, IReadOnlyList<double> a) => ExactSum.Ratio(ExactSum.Of(b), ExactSum.Of(a));

    private double Percent(double value) => DesignedDcGain == 0 || !double.IsFinite(DesignedDcGain)
        ? double.NaN
        : 100 * Math.Abs(value - DesignedDcGain) / Math.Abs(DesignedDcGain);
}
