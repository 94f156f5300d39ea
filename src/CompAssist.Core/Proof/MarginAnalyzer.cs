using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Proof;

/// <summary>
/// Margins over every crossover (Nyquist-criterion margins as in Franklin–Powell–Emami-Naeini, ch. 6; the
/// delay margin as common practice). L(jω) is evaluated in factored form (products of the factors,
/// rescaled against overflow) on a log-spaced grid that is refined where the phase or magnitude moves
/// quickly (lightly damped modes, delays) and around every lightly damped pole and zero, so no crossing
/// pair hides between two grid points. Every gain and phase crossover is bracketed and refined by bisection;
/// ω = 0 and ω = ∞ are evaluated explicitly.
/// </summary>
public static class MarginAnalyzer
{
    /// <summary>Base grid points per decade (before refinement).</summary>
    public const int PointsPerDecade = 30;

    private const double MaxPhaseStep = 0.25;
    private const double MaxLogMagnitudeStep = 0.3;
    private const int MaxRefinementDepth = 16;
    private const int MaxGridPoints = 40_000;
    private const double FlatLogMagnitude = 1e-9;

    /// <summary>Computes the margins of the loop with the compensator (sign folded in, delay exact).</summary>
    public static StabilityMargins Analyze(Loop loop, TransferFunction compensator)
    {
        ArgumentNullException.ThrowIfNull(loop);
        return Analyze(loop.OpenLoop(compensator).Scaled(loop.SignFactor));
    }

    /// <summary>Computes the margins of the open loop L for the characteristic equation 1 + L = 0.</summary>
    public static StabilityMargins Analyze(TransferFunction open)
    {
        ArgumentNullException.ThrowIfNull(open);
        var grid = Grid(open);
        var gains = ImmutableArray.CreateBuilder<GainCrossing>();
        var phases = new List<PhaseCrossing>();
        if (DcCrossing(open) is { } dc)
        {
            phases.Add(dc);
        }

        if (DcGainCrossing(open) is { } dcGain)
        {
            gains.Add(dcGain);
        }

        for (var i = 1; i < grid.Count; i++)
        {
            var (w0, m0, p0) = grid[i - 1];
            var (w1, m1, p1) = grid[i];

            // A sign change between two values of ln|L| both within rounding of zero is noise of a loop whose
            // |L| stays at 1 (L(0) = 1, say), not a crossover; one exactly at a grid point is counted once.
            var noise = Math.Abs(m0) < FlatLogMagnitude && Math.Abs(m1) < FlatLogMagnitude;
            if (Bisection.Sign(m0) != Bisection.Sign(m1) && !double.IsNaN(m0) && !double.IsNaN(m1) && !noise)
            {
                var x = Bisect(u => LogMagnitudeAndPhase(open, u).LogMagnitude, w0, w1);
                if (gains.Count == 0 || Math.Abs(x - gains[^1].Frequency) > 1e-9 * x)
                {
                    gains.Add(Gain(x, LogMagnitudeAndPhase(open, x).Phase));
                }
            }

            var a = WrappedFromMinus180(p0);
            var b = WrappedFromMinus180(p1);
            if (Bisection.Sign(a) != Bisection.Sign(b) && Math.Abs(a - b) < Math.PI)
            {
                var x = Bisect(u => WrappedFromMinus180(LogMagnitudeAndPhase(open, u).Phase), w0, w1);
                var (logMag, phase) = LogMagnitudeAndPhase(open, x);

                // A jump of the phase through a pole or zero on the imaginary axis is no crossing.
                // One exactly at a grid point is seen from both sides: count it once.
                var repeated = phases.Count > 0 && Math.Abs(x - phases[^1].Frequency) <= 1e-9 * x;
                if (Math.Abs(WrappedFromMinus180(phase)) < 1e-6 && double.IsFinite(logMag) && !repeated)
                {
                    phases.Add(new PhaseCrossing(x, Math.Exp(logMag)));
                }
            }
        }

        if (HighFrequencyCrossing(open) is { } hf)
        {
            phases.Add(hf);
        }

        var (ms, wms) = SensitivityPeak(open, grid);
        return Summarize(open, gains.ToImmutable(), [.. phases], ms, wms);
    }

    private static StabilityMargins Summarize(TransferFunction open, ImmutableArray<GainCrossing> gains, ImmutableArray<PhaseCrossing> phases, double ms, double wms)
    {
        double pm = double.PositiveInfinity, wc = double.NaN, dm = double.PositiveInfinity, wdm = double.NaN;
        foreach (var g in gains)
        {
            if (g.DistanceDegrees < pm)
            {
                (pm, wc) = (g.DistanceDegrees, g.Frequency);
            }

            if (g.DelayMargin < dm)
            {
                (dm, wdm) = (g.DelayMargin, g.Frequency);
            }
        }

        double up = double.PositiveInfinity, wUp = double.NaN, down = double.PositiveInfinity, wDown = double.NaN;
        foreach (var p in phases)
        {
            var db = p.GainFactorDb;
            if (p.Magnitude <= 1.0 && db < up)
            {
                (up, wUp) = (db, p.Frequency);
            }
            else if (p.Magnitude > 1.0 && -db < down)
            {
                (down, wDown) = (-db, p.Frequency);
            }
        }

        return new StabilityMargins
        {
            GainCrossings = gains,
            PhaseCrossings = phases,
            GainMarginDb = up,
            PhaseCrossover = wUp,
            GainReductionMarginDb = down,
            GainReductionCrossover = wDown,
            PhaseMarginDeg = pm,
            GainCrossover = wc,
            DelayMargin = dm,
            DelayMarginCrossover = wdm,
            SensitivityPeak = ms,
            SensitivityPeakFrequency = wms,
            SelfCheckResidual = SelfCheck(open, gains, phases),
        };
    }

    private static GainCrossing Gain(double omega, double phaseRadians)
    {
        // ∠L wrapped into (−360°, 0°]; the signed figure 180° + ∠L then lies in (−180°, 180°].
        var phase = Angles.ToDegrees(phaseRadians) % 360.0;
        if (phase > 0)
        {
            phase -= 360.0;
        }

        var signed = 180.0 + phase;
        var lag = signed >= 0 ? signed : signed + 360.0;
        return new GainCrossing(omega, phase, signed, Math.Abs(signed), Angles.ToRadians(lag) / omega);
    }

    /// <summary>
    /// ω = 0 is a gain crossover when L(0) is finite with |L(0)| = 1 (to rounding): the signed figure is that of
    /// ∠L(0), and no extra delay moves L(0), so its delay margin is infinite.
    /// </summary>
    private static GainCrossing? DcGainCrossing(TransferFunction open)
    {
        var l0 = open.DcGain;
        return double.IsFinite(l0) && l0 != 0 && Math.Abs(Math.Log(Math.Abs(l0))) < FlatLogMagnitude
            ? Gain(0.0, l0 > 0 ? 0.0 : Math.PI) with { DelayMargin = double.PositiveInfinity }
            : null;
    }

    /// <summary>ω = 0 is a phase crossover when L(0) is finite, real and negative (an open-loop unstable plant, say).</summary>
    private static PhaseCrossing? DcCrossing(TransferFunction open)
    {
        var l0 = open.DcGain;
        return double.IsFinite(l0) && l0 < 0 ? new PhaseCrossing(0.0, -l0) : null;
    }

    /// <summary>
    /// ω = ∞ is a phase crossover of a biproper loop without delay whose high-frequency gain is negative; with a
    /// delay, a biproper loop crosses −180° infinitely often at magnitudes tending to |L(∞)|, beyond any grid:
    /// their limit is listed at ω = ∞ so that the gain margin is never larger than 1/|L(∞)|.
    /// </summary>
    private static PhaseCrossing? HighFrequencyCrossing(TransferFunction open) =>
        open.RelativeDegree == 0 && open.Gain != 0 && (open.Delay > 0 || open.Gain < 0)
            ? new PhaseCrossing(double.PositiveInfinity, Math.Abs(open.Gain))
            : null;

    private static double SelfCheck(TransferFunction open, ImmutableArray<GainCrossing> gains, ImmutableArray<PhaseCrossing> phases)
    {
        var worst = 0.0;
        foreach (var p in phases.Where(p => double.IsFinite(p.Frequency) && p.Frequency > 0))
        {
            worst = Math.Max(worst, Residual(open, p.Frequency, p.GainFactor, 0.0));
        }

        foreach (var g in gains.Where(g => g.Frequency > 0 && double.IsFinite(g.DelayMargin)))
        {
            worst = Math.Max(worst, Residual(open, g.Frequency, 1.0, g.DelayMargin));
        }

        return worst;
    }

    /// <summary>|1 + k·L(jω)·e^(−jωτ)| / (1 + |k·L(jω)|): zero when s = jω is a closed-loop root.</summary>
    private static double Residual(TransferFunction open, double omega, double k, double extraDelay)
    {
        var (logMag, phase) = LogMagnitudeAndPhase(open, omega);
        var z = Complex.FromPolarCoordinates(k * Math.Exp(logMag), phase - (omega * extraDelay));
        return Complex.Abs(1.0 + z) / (1.0 + z.Magnitude);
    }

    /// <summary>
    /// The frequency grid: a log-spaced base over every corner (three decades beyond each side, and beyond
    /// 1/delay), points around each lightly damped pole and zero, then intervals halved (in ln ω) wherever the
    /// phase moves more than 0.25 rad or ln|L| more than 0.3 between neighbours.
    /// </summary>
    private static List<(double W, double LogMag, double Phase)> Grid(TransferFunction open)
    {
        var (lo, hi) = Range(open);
        var decades = Math.Log10(hi / lo);
        var count = Math.Max(200, (int)Math.Ceiling(decades * PointsPerDecade));
        var points = new List<double>(count + 64);
        var logLo = Math.Log(lo);
        var step = (Math.Log(hi) - logLo) / (count - 1);
        for (var i = 0; i < count; i++)
        {
            points.Add(Math.Exp(logLo + (i * step)));
        }

        if (open.Delay > 0)
        {
            // The delay turns the phase by ω·θ: a log grid coarsens until one interval spans a whole turn, and a
            // phase difference of 2π looks like none, so −180° crossings were skipped. Add points every 0.2/θ
            // rad/s (a fifth of a radian of delay phase) up to 1000/θ, within a budget of 20,000 points.
            var top = Math.Min(hi, 1000.0 / open.Delay);
            var linear = Math.Max(0.2 / open.Delay, top / 20_000);
            for (var w = linear; w < top; w += linear)
            {
                if (w > lo)
                {
                    points.Add(w);
                }
            }
        }

        foreach (var r in open.Zeros.Concat(open.Poles).Where(r => r.Imaginary > 0))
        {
            var width = Math.Max(Math.Abs(r.Real), 1e-9 * r.Imaginary);
            if (width < 0.3 * r.Imaginary)
            {
                foreach (var k in (ReadOnlySpan<double>)[-4, -2, -1, -0.5, -0.2, 0.2, 0.5, 1, 2, 4])
                {
                    var w = r.Imaginary + (k * width);
                    if (w > lo && w < hi)
                    {
                        points.Add(w);
                    }
                }
            }
        }

        points.Sort();
        var grid = new List<(double W, double LogMag, double Phase)>(points.Count * 2);
        foreach (var w in points)
        {
            var (m, p) = LogMagnitudeAndPhase(open, w);
            grid.Add((w, m, p));
        }

        return Refine(open, grid);
    }

    private static List<(double W, double LogMag, double Phase)> Refine(TransferFunction open, List<(double W, double LogMag, double Phase)> coarse)
    {
        var fine = new List<(double W, double LogMag, double Phase)>(coarse.Count * 2) { coarse[0] };
        var pending = new Stack<((double W, double LogMag, double Phase) Point, int Depth)>();
        for (var i = 1; i < coarse.Count; i++)
        {
            pending.Push((coarse[i], 0));
            while (pending.Count > 0)
            {
                var (next, depth) = pending.Peek();
                var last = fine[^1];
                var jump = Math.Abs(Math.IEEERemainder(next.Phase - last.Phase, 2 * Math.PI));
                var rise = Math.Abs(next.LogMag - last.LogMag);
                var needs = jump > MaxPhaseStep || (rise > MaxLogMagnitudeStep && double.IsFinite(rise));
                if (needs && depth < MaxRefinementDepth && fine.Count + pending.Count < MaxGridPoints)
                {
                    var w = Math.Sqrt(last.W * next.W);
                    if (w > last.W && w < next.W)
                    {
                        var (m, p) = LogMagnitudeAndPhase(open, w);
                        pending.Pop();
                        pending.Push((next, depth + 1));
                        pending.Push(((w, m, p), depth + 1));
                        continue;
                    }
                }

                fine.Add(next);
                pending.Pop();
            }
        }

        return fine;
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

        // |L| at the ends: extend until the loop is far from 1 (a high-gain or low-gain loop can cross outside).
        for (var i = 0; i < 12 && Math.Abs(LogMagnitudeAndPhase(open, lo).LogMagnitude) < 2.5; i++)
        {
            lo /= 10.0;
        }

        for (var i = 0; i < 12 && Math.Abs(LogMagnitudeAndPhase(open, hi).LogMagnitude) < 2.5 && open.RelativeDegree > 0; i++)
        {
            hi *= 10.0;
        }

        return (Math.Min(lo, 1e-3), Math.Max(hi, 1e3));
    }

    /// <summary>
    /// ln|L(jω)| and the phase of L(jω) in (−π, π] (less ωT for a delay), from the factor products Π(jω − z)
    /// and Π(jω − p) accumulated separately with periodic rescaling: one logarithm and one arctangent per
    /// frequency. Crossover detection works on the phase modulo 2π, so no unwrapping is needed.
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

    private static (double Re, double Im, int Exponent) Product(ImmutableArray<Complex> roots, double omega)
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
            if ((size > 1e100 || size < 1e-100) && size > 0)
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

    private static (double Peak, double Frequency) SensitivityPeak(TransferFunction open, List<(double W, double LogMag, double Phase)> grid)
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
        var bestValue = FromPolar(grid[0].LogMag, grid[0].Phase);
        for (var i = 1; i < grid.Count; i++)
        {
            var v = FromPolar(grid[i].LogMag, grid[i].Phase);
            if (v > bestValue)
            {
                bestValue = v;
                best = i;
            }
        }

        // Golden-section refinement between the neighbours of the best grid point.
        double a = grid[Math.Max(best - 1, 0)].W, b = grid[Math.Min(best + 1, grid.Count - 1)].W;
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
        var (peak, at) = refined > bestValue ? (refined, x) : (bestValue, grid[best].W);

        // |S| tends to 1 for a strictly proper loop and to 1/|1 + L(∞)| for a biproper one (with a delay its
        // supremum 1/(1 − |L(∞)|) is approached at ever higher frequencies): when that limit is the largest, it
        // is the peak, at ω = ∞.
        if (open.RelativeDegree >= 0)
        {
            var atInfinity = open.RelativeDegree > 0 || open.Gain == 0 ? 1.0
                : open.Delay > 0 ? (Math.Abs(open.Gain) < 1 ? 1.0 / (1.0 - Math.Abs(open.Gain)) : double.PositiveInfinity)
                : 1.0 / Math.Abs(1.0 + open.Gain);
            if (atInfinity > peak)
            {
                return (atInfinity, double.PositiveInfinity);
            }
        }

        return (peak, at);
    }

    // The bracket is halved geometrically (ω spans decades): bisection in ln ω, to a relative width of 1e-14.
    private static double Bisect(Func<double, double> f, double a, double b)
    {
        double InLog(double u) => f(Math.Exp(u));
        var (ua, ub) = (Math.Log(a), Math.Log(b));
        return Math.Exp(Bisection.Root(InLog, ua, ub, InLog(ua), _ => 1e-14, maxSteps: 100));
    }
}
