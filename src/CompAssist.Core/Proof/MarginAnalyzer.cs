using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Proof;

/// <summary>
/// Margins on a log-spaced frequency grid evaluated in factored form (products of the factors, rescaled
/// against overflow), with every gain and phase crossover bracketed and refined by bisection.
/// </summary>
public static class MarginAnalyzer
{
    /// <summary>Number of grid points.</summary>
    public const int GridPoints = 1200;

    /// <summary>Computes the margins of the loop with the compensator (sign folded in, delay exact).</summary>
    public static StabilityMargins Analyze(Loop loop, TransferFunction compensator)
    {
        ArgumentNullException.ThrowIfNull(loop);
        var open = loop.OpenLoop(compensator).Scaled(loop.SignFactor);
        var (lo, hi) = Range(open);
        var logLo = Math.Log(lo);
        var step = (Math.Log(hi) - logLo) / (GridPoints - 1);
        var w = new double[GridPoints];
        var mag = new double[GridPoints];
        var phase = new double[GridPoints];
        for (var i = 0; i < GridPoints; i++)
        {
            w[i] = Math.Exp(logLo + (i * step));
            (mag[i], phase[i]) = LogMagnitudeAndPhase(open, w[i]);
        }

        double pm = double.PositiveInfinity, wc = double.NaN, dm = double.PositiveInfinity;
        double gm = double.PositiveInfinity, wp = double.NaN, gmDown = double.PositiveInfinity;
        for (var i = 1; i < GridPoints; i++)
        {
            if (Math.Sign(mag[i]) != Math.Sign(mag[i - 1]) && mag[i] != mag[i - 1])
            {
                var x = Bisect(u => LogMagnitudeAndPhase(open, u).LogMagnitude, w[i - 1], w[i]);
                var margin = Angles.WrapDegrees(Angles.ToDegrees(LogMagnitudeAndPhase(open, x).Phase) + 180.0);
                if (margin < pm)
                {
                    pm = margin;
                    wc = x;
                }

                if (margin > 0)
                {
                    dm = Math.Min(dm, Angles.ToRadians(margin) / x);
                }
                else
                {
                    dm = 0.0;
                }
            }

            var a = WrappedFromMinus180(phase[i - 1]);
            var b = WrappedFromMinus180(phase[i]);
            if (Math.Sign(a) != Math.Sign(b) && Math.Abs(a - b) < Math.PI)
            {
                var x = Bisect(u => WrappedFromMinus180(LogMagnitudeAndPhase(open, u).Phase), w[i - 1], w[i]);
                var logMag = LogMagnitudeAndPhase(open, x).LogMagnitude;
                var db = -20.0 * logMag / Math.Log(10);
                if (db > 0 && db < gm)
                {
                    gm = db;
                    wp = x;
                }
                else if (db <= 0)
                {
                    gmDown = Math.Min(gmDown, -db);
                }
            }
        }

        var (ms, wms) = SensitivityPeak(open, w, mag, phase);
        return new StabilityMargins(gm, wp, gmDown, pm, wc, dm, ms, wms);
    }

    private static (double Lo, double Hi) Range(TransferFunction open)
    {
        var corners = open.Zeros.Concat(open.Poles).Select(r => r.Magnitude).Where(m => m > 0).ToList();
        var lo = corners.Count > 0 ? corners.Min() / 1000.0 : 1e-3;
        var hi = corners.Count > 0 ? corners.Max() * 1000.0 : 1e3;
        if (open.Delay > 0)
        {
            hi = Math.Max(hi, 100.0 / open.Delay);
        }

        return (Math.Min(lo, 1e-3), Math.Max(hi, 1e3));
    }

    /// <summary>
    /// ln|L(jω)| and the phase of L(jω) in (−π, π], from the factor products Π(jω − z) and Π(jω − p)
    /// accumulated separately with periodic rescaling: one logarithm and one arctangent per frequency.
    /// Crossover detection works on the phase modulo 2π, so no unwrapping is needed.
    /// </summary>
    internal static (double LogMagnitude, double Phase) LogMagnitudeAndPhase(TransferFunction open, double omega)
    {
        var (nr, ni, ne) = Product(open.Zeros, omega);
        var (dr, di, de) = Product(open.Poles, omega);
        var logMag = Math.Log(Math.Abs(open.Gain))
            + (0.5 * Math.Log(((nr * nr) + (ni * ni)) / ((dr * dr) + (di * di))))
            + ((ne - de) * Math.Log(2.0));

        // ∠(N/D) = ∠(N·conj(D)).
        var phase = Math.Atan2((ni * dr) - (nr * di), (nr * dr) + (ni * di));
        if (open.Gain < 0)
        {
            phase += Math.PI;
        }

        return (logMag, phase - (omega * open.Delay));
    }

    private static (double Re, double Im, int Exponent) Product(System.Collections.Immutable.ImmutableArray<Complex> roots, double omega)
    {
        double re = 1.0, im = 0.0;
        var exponent = 0;
        foreach (var r in roots)
        {
            // (re + j·im)·(−Re r + j(ω − Im r))
            var fr = -r.Real;
            var fi = omega - r.Imaginary;
            var nre = (re * fr) - (im * fi);
            im = (re * fi) + (im * fr);
            re = nre;
            var size = Math.Abs(re) + Math.Abs(im);
            if (size > 1e100 || size < 1e-100)
            {
                var e = Math.ILogB(size);
                re = Math.ScaleB(re, -e);
                im = Math.ScaleB(im, -e);
                exponent += e;
            }
        }

        return (re, im, exponent);
    }

    /// <summary>The phase measured from −180°, wrapped to (−π, π].</summary>
    private static double WrappedFromMinus180(double phase)
    {
        var x = Math.IEEERemainder(phase + Math.PI, 2 * Math.PI);
        return x <= -Math.PI ? x + (2 * Math.PI) : x;
    }

    private static (double Peak, double Frequency) SensitivityPeak(TransferFunction open, double[] w, double[] logMag, double[] phase)
    {
        static double FromPolar(double logMagnitude, double angle)
        {
            var m = Math.Exp(logMagnitude);
            var re = 1.0 + (m * Math.Cos(angle));
            var im = m * Math.Sin(angle);
            return 1.0 / Math.Sqrt((re * re) + (im * im));
        }

        double Sensitivity(double omega)
        {
            var (lm, ph) = LogMagnitudeAndPhase(open, omega);
            return FromPolar(lm, ph);
        }

        var best = 0;
        var bestValue = FromPolar(logMag[0], phase[0]);
        for (var i = 1; i < w.Length; i++)
        {
            var v = FromPolar(logMag[i], phase[i]);
            if (v > bestValue)
            {
                bestValue = v;
                best = i;
            }
        }

        // Golden-section refinement between the neighbours of the best grid point.
        double a = w[Math.Max(best - 1, 0)], b = w[Math.Min(best + 1, w.Length - 1)];
        const double g = 0.6180339887498949;
        for (var k = 0; k < 60 && b - a > 1e-12 * b; k++)
        {
            var c = b - (g * (b - a));
            var d = a + (g * (b - a));
            if (Sensitivity(c) > Sensitivity(d))
            {
                b = d;
            }
            else
            {
                a = c;
            }
        }

        var x = 0.5 * (a + b);
        var refined = Sensitivity(x);
        return refined > bestValue ? (refined, x) : (bestValue, w[best]);
    }

    // The bracket is halved geometrically (ω spans decades): bisection in ln ω, to a relative width of 1e-14.
    private static double Bisect(Func<double, double> f, double a, double b)
    {
        double InLog(double u) => f(Math.Exp(u));
        var (ua, ub) = (Math.Log(a), Math.Log(b));
        return Math.Exp(Bisection.Root(InLog, ua, ub, InLog(ua), _ => 1e-14, maxSteps: 100));
    }
}
