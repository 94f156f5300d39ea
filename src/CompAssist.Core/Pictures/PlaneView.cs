using System.Numerics;

namespace CompAssist.Core.Pictures;

/// <summary>The rectangle of the s-plane a picture shows: real part left…right, imaginary part −height…height.</summary>
/// <param name="Left">Smallest real part shown.</param>
/// <param name="Right">Largest real part shown.</param>
/// <param name="ImaginaryHalfHeight">The imaginary axis runs from −this to +this (pictures are symmetric).</param>
public sealed record PlaneView(double Left, double Right, double ImaginaryHalfHeight)
{
    /// <summary>
    /// Frames the interesting region: the focus points (target, dominant closed-loop poles) and every pole or
    /// zero within four times the focus size, with a margin, always including the imaginary axis.
    /// </summary>
    public static PlaneView Frame(IEnumerable<Complex> focus, IEnumerable<Complex> context)
    {
        var f = focus.Where(IsFinite).ToList();
        var c = context.Where(IsFinite).ToList();
        var size = f.Count > 0 ? f.Max(z => z.Magnitude) : (c.Count > 0 ? Median(c.Select(z => z.Magnitude)) : 1.0);
        size = Math.Max(size, 1e-6);
        var shown = f.Concat(c.Where(z => z.Magnitude <= 4 * size)).Append(Complex.Zero).ToList();
        var left = shown.Min(z => z.Real);
        var right = shown.Max(z => z.Real);
        var height = shown.Max(z => Math.Abs(z.Imaginary));
        var span = Math.Max(Math.Max(right - left, 2 * height), 0.2 * size);
        var margin = 0.12 * span;
        left -= margin;
        right += margin;
        height = Math.Max(height + margin, 0.3 * span);
        return new PlaneView(left, right, height);
    }

    /// <summary>
    /// The points a picture of a design must always show: the target pair, and every closed-loop pole that is
    /// unstable (on or right of the imaginary axis) or decays slower than the target.
    /// </summary>
    public static IEnumerable<Complex> MustShow(Complex? target, IEnumerable<Complex> closedLoopPoles)
    {
        ArgumentNullException.ThrowIfNull(closedLoopPoles);
        var poles = closedLoopPoles.Where(IsFinite).ToList();
        if (target is not { } t)
        {
            return poles.Where(p => p.Real >= 0);
        }

        return new[] { t, Complex.Conjugate(t) }.Concat(poles.Where(p => p.Real >= 0 || p.Real > t.Real));
    }

    /// <summary>The same view zoomed about its centre (factor &gt; 1 zooms in).</summary>
    public PlaneView Zoomed(double factor)
    {
        var centre = 0.5 * (Left + Right);
        var half = 0.5 * (Right - Left) / factor;
        return new PlaneView(centre - half, centre + half, ImaginaryHalfHeight / factor);
    }

    private static bool IsFinite(Complex z) => double.IsFinite(z.Real) && double.IsFinite(z.Imaginary);

    private static double Median(IEnumerable<double> xs)
    {
        var sorted = xs.Where(x => x > 0).OrderBy(x => x).ToList();
        return sorted.Count == 0 ? 1.0 : sorted[sorted.Count / 2];
    }
}
