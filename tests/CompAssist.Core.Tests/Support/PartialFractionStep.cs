using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Tests.Support;

/// <summary>
/// An independent route to a step response: partial fractions of T(s)/s for distinct poles (common
/// practice), y(t) = T(0) + Σ rᵢ·e^(pᵢt)/pᵢ with rᵢ the residue of T at pᵢ, and its figures found by brute force
/// (a dense uniform scan refined by bisection and golden sections on the closed form). No matrix exponential,
/// no state space and none of the product's event logic.
/// </summary>
internal sealed class PartialFractionStep
{
    private readonly Complex[] _poles;
    private readonly Complex[] _residues;
    private readonly double _dc;

    private PartialFractionStep(Complex[] poles, Complex[] residues, double dc)
    {
        _poles = poles;
        _residues = residues;
        _dc = dc;
    }

    /// <summary>T(0), the final value of a stable T.</summary>
    public double Final => _dc;

    /// <summary>The partial fractions of a stable T with distinct, non-zero poles.</summary>
    public static PartialFractionStep Of(TransferFunction t)
    {
        var poles = t.Poles.ToArray();
        var residues = new Complex[poles.Length];
        for (var i = 0; i < poles.Length; i++)
        {
            Complex r = t.Gain;
            foreach (var z in t.Zeros)
            {
                r *= poles[i] - z;
            }

            for (var j = 0; j < poles.Length; j++)
            {
                if (j != i)
                {
                    r /= poles[i] - poles[j];
                }
            }

            residues[i] = r;
        }

        return new PartialFractionStep(poles, residues, t.DcGain);
    }

    /// <summary>y(t) for t &gt; 0.</summary>
    public double Y(double t)
    {
        Complex sum = _dc;
        for (var i = 0; i < _poles.Length; i++)
        {
            sum += _residues[i] * Complex.Exp(_poles[i] * t) / _poles[i];
        }

        return sum.Real;
    }

    /// <summary>
    /// The figures by brute force over [0, horizon]: <paramref name="samples"/> samples spaced geometrically from
    /// 1e-7·horizon (so a fast rise beside a slow tail is resolved), each event refined on the closed form.
    /// </summary>
    public (double Overshoot, double PeakTime, double Undershoot, double Rise, double Settling2, double Settling5) Figures(double horizon, int samples)
    {
        var f = _dc;
        var s = Math.Sign(f);
        var t = new double[samples + 1];
        var y = new double[samples + 1];
        var t0 = 1e-7 * horizon;
        for (var k = 0; k <= samples; k++)
        {
            t[k] = k == 0 ? 0.0 : t0 * Math.Pow(horizon / t0, (k - 1.0) / (samples - 1.0));
            y[k] = k == 0 ? Y(1e-300) : Y(t[k]);
        }

        int peak = 0, low = 0;
        for (var k = 1; k <= samples; k++)
        {
            if (s * y[k] > s * y[peak])
            {
                peak = k;
            }

            if (s * y[k] < s * y[low])
            {
                low = k;
            }
        }

        var (tPeak, yPeak) = Golden(u => s * Y(u), t[Math.Max(0, peak - 1)], t[Math.Min(samples, peak + 1)]);
        var (_, yLow) = Golden(u => -s * Y(u), t[Math.Max(0, low - 1)], t[Math.Min(samples, low + 1)]);
        var overshoot = yPeak > Math.Abs(f) ? 100 * (yPeak - Math.Abs(f)) / Math.Abs(f) : 0.0;
        var undershoot = yLow > 0 ? 100 * yLow / Math.Abs(f) : 0.0;
        var rise = First(t, y, 0.9 * f) - First(t, y, 0.1 * f);
        return (overshoot, overshoot > 0 ? tPeak : double.PositiveInfinity, undershoot, rise, Last(t, y, f, 0.02), Last(t, y, f, 0.05));
    }

    private double First(double[] t, double[] y, double level)
    {
        var s = Math.Sign(level);
        for (var k = 1; k < y.Length; k++)
        {
            if (s * y[k] >= s * level)
            {
                return Bisect(u => Y(u) - level, t[k - 1], t[k]);
            }
        }

        return double.PositiveInfinity;
    }

    private double Last(double[] t, double[] y, double f, double band)
    {
        var tol = band * Math.Abs(f);
        for (var k = y.Length - 1; k >= 1; k--)
        {
            if (Math.Abs(y[k - 1] - f) > tol)
            {
                var edge = y[k - 1] > f ? f + tol : f - tol;
                return Bisect(u => Y(u) - edge, t[k - 1], t[k]);
            }
        }

        return 0.0;
    }

    private static double Bisect(Func<double, double> g, double a, double b)
    {
        var ga = g(a);
        for (var i = 0; i < 200 && b - a > 1e-15 * Math.Max(1, b); i++)
        {
            var m = 0.5 * (a + b);
            var gm = g(m);
            if (Math.Sign(gm) == Math.Sign(ga))
            {
                (a, ga) = (m, gm);
            }
            else
            {
                b = m;
            }
        }

        return 0.5 * (a + b);
    }

    private static (double T, double Value) Golden(Func<double, double> g, double a, double b)
    {
        const double r = 0.6180339887498949;
        for (var i = 0; i < 200 && b - a > 1e-14 * Math.Max(1, b); i++)
        {
            var c = b - (r * (b - a));
            var d = a + (r * (b - a));
            if (g(c) > g(d))
            {
                b = d;
            }
            else
            {
                a = c;
            }
        }

        var t = 0.5 * (a + b);
        return (t, g(t));
    }
}
