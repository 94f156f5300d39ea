using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Proof;

/// <summary>
/// Closed-loop frequency figures, delays exact: the −3 dB bandwidth of T = C·G/(1 ± C·G·H), the peak of |T| and
/// the peak of |C·S| = |C/(1 ± C·G·H)| (how much sensor noise reaches the actuator). Found on a dense logarithmic
/// sweep (200 points a decade over 10 decades about the loop's scale), peaks refined by golden-section search
/// and the bandwidth by bisection.
/// </summary>
/// <param name="Bandwidth">ωB, rad/s: the first ω where |T(jω)| = |T(0)|/√2 (NaN when it never falls that far in the sweep).</param>
/// <param name="ComplementaryPeak">max |T(jω)| (Mt).</param>
/// <param name="ComplementaryPeakFrequency">Where it occurs, rad/s (0 when the largest value is at DC).</param>
/// <param name="NoisePeak">max |C·S(jω)|, actuator units per measurement unit (+∞ for an improper C).</param>
/// <param name="NoisePeakFrequency">Where it occurs, rad/s.</param>
public sealed record FrequencyFigures(double Bandwidth, double ComplementaryPeak, double ComplementaryPeakFrequency, double NoisePeak, double NoisePeakFrequency)
{
    private const int PointsPerDecade = 200;
    private const int Decades = 10;

    /// <summary>The figures of the loop with compensator C; <paramref name="scale"/> centres the sweep (the crossover, say).</summary>
    public static FrequencyFigures Of(Loop loop, TransferFunction compensator, double scale)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        var forward = compensator * loop.Plant;
        var open = loop.OpenLoop(compensator);
        double T(double w)
        {
            var s = new Complex(0, w);
            return Complex.Abs(forward.Evaluate(s) / (1.0 + (loop.SignFactor * open.Evaluate(s))));
        }

        double Cs(double w)
        {
            var s = new Complex(0, w);
            return Complex.Abs(compensator.Evaluate(s) / (1.0 + (loop.SignFactor * open.Evaluate(s))));
        }

        var start = scale * Math.Pow(10, -Decades / 2.0);
        var grid = Enumerable.Range(0, (Decades * PointsPerDecade) + 1).Select(i => start * Math.Pow(10, i / (double)PointsPerDecade)).ToArray();
        var (tPeak, tAt) = Peak(T, grid);
        // An improper C (an ideal derivative) makes |C·S| grow without bound: no finite peak to find on a sweep.
        var (nPeak, nAt) = compensator.RelativeDegree < 0 ? (double.PositiveInfinity, double.PositiveInfinity) : Peak(Cs, grid);
        return new FrequencyFigures(FirstBelowHalfPower(T, grid), tPeak, tAt, nPeak, nAt);
    }

    private static double FirstBelowHalfPower(Func<double, double> magnitude, double[] grid)
    {
        var reference = magnitude(grid[0]);
        if (!(reference > 0) || !double.IsFinite(reference))
        {
            return double.NaN;
        }

        var level = reference / Math.Sqrt(2);
        for (var i = 1; i < grid.Length; i++)
        {
            if (magnitude(grid[i]) < level)
            {
                double lo = grid[i - 1], hi = grid[i];
                for (var k = 0; k < 60; k++)
                {
                    var mid = Math.Sqrt(lo * hi);
                    (lo, hi) = magnitude(mid) < level ? (lo, mid) : (mid, hi);
                }

                return Math.Sqrt(lo * hi);
            }
        }

        return double.NaN;
    }

    // The largest value on the grid, refined by golden-section search in ln ω between its neighbours.
    private static (double Value, double Frequency) Peak(Func<double, double> magnitude, double[] grid)
    {
        var values = grid.Select(magnitude).ToArray();
        var best = 0;
        for (var i = 1; i < values.Length; i++)
        {
            if (values[i] > values[best])
            {
                best = i;
            }
        }

        if (best == 0)
        {
            return (values[0], 0.0);
        }

        if (best == grid.Length - 1)
        {
            return (values[best], grid[best]);
        }

        double a = Math.Log(grid[best - 1]), b = Math.Log(grid[best + 1]);
        var ratio = (Math.Sqrt(5) - 1) / 2;
        for (var k = 0; k < 80; k++)
        {
            var x1 = b - (ratio * (b - a));
            var x2 = a + (ratio * (b - a));
            (a, b) = magnitude(Math.Exp(x1)) > magnitude(Math.Exp(x2)) ? (a, x2) : (x1, b);
        }

        var w = Math.Exp(0.5 * (a + b));
        var v = magnitude(w);
        return v >= values[best] ? (v, w) : (values[best], grid[best]);
    }
}
