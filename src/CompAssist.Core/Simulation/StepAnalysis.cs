using CompAssist.Core.Numerics;
using System.Numerics;

namespace CompAssist.Core.Simulation;

/// <summary>
/// Step figures measured on the exact solution (see <see cref="StepMetrics"/> for the definitions): events
/// are located on a multi-resolution <see cref="StepTrajectory"/> (cubic Hermite between samples, from the
/// exact y and dy/dt there, so an excursion between samples is seen) and then solved on the exact solution
/// by a bracketed Newton iteration (y − level for crossings, dy/dt for extrema) to a relative 1e-12 in t.
/// Nothing depends on the sampling grid.
/// </summary>
public static class StepAnalysis
{
    /// <summary>How many times <see cref="SimulateToSettling"/> may double the horizon (64× at most).</summary>
    public const int MaxHorizonDoublings = 6;

    private const double GrazeFraction = 0.02;

    /// <summary>Measures the unit-step response of <paramref name="system"/> over <paramref name="horizon"/> seconds.</summary>
    /// <param name="system">The realization (y for a unit step of its input).</param>
    /// <param name="poles">Its poles (they size the grid).</param>
    /// <param name="finalValue">The final value to measure against (the DC gain for a stable system).</param>
    /// <param name="horizon">Simulated time, seconds.</param>
    public static StepMetrics Measure(StateSpace system, IReadOnlyCollection<Complex> poles, double finalValue, double horizon) =>
        Measure(SimulateToSettling(system, poles, finalValue, horizon), finalValue);

    /// <summary>
    /// Simulates the unit step over <paramref name="horizon"/> seconds and, while a response with a finite,
    /// non-zero final value is still outside the ±2 % band at the end (a slow pole with a large residue, which
    /// eight of its time constants do not bring inside), doubles the horizon, up to
    /// 2^<see cref="MaxHorizonDoublings"/> times, so that a settling time is measured rather than reported as
    /// "not settled" for a loop that does settle.
    /// </summary>
    internal static StepTrajectory SimulateToSettling(StateSpace system, IReadOnlyCollection<Complex> poles, double finalValue, double horizon)
    {
        var tr = StepTrajectory.Simulate(system, poles, horizon);
        if (!double.IsFinite(finalValue) || finalValue == 0)
        {
            return tr;
        }

        for (var i = 0; i < MaxHorizonDoublings && !tr.Capped && double.IsPositiveInfinity(Settling(tr, finalValue, 0.02).Time); i++)
        {
            horizon *= 2;
            tr = StepTrajectory.Simulate(system, poles, horizon);
        }

        return tr;
    }

    /// <summary>The largest |y| over the horizon and when it occurs (the actuator's peak command, say), exact.</summary>
    public static (double Peak, double Time) PeakMagnitude(StateSpace system, IReadOnlyCollection<Complex> poles, double horizon)
    {
        var (high, tHigh, low, tLow) = Extremes(system, poles, horizon);
        return high >= -low ? (Math.Abs(high), tHigh) : (Math.Abs(low), tLow);
    }

    /// <summary>The largest and the smallest y over the horizon and when they occur, exact (y(0) included).</summary>
    public static (double High, double HighTime, double Low, double LowTime) Extremes(StateSpace system, IReadOnlyCollection<Complex> poles, double horizon)
    {
        var tr = StepTrajectory.Simulate(system, poles, horizon);
        var (high, tHigh) = Extreme(tr, 1.0);
        var (low, tLow) = Extreme(tr, -1.0);
        return (high, tHigh, low, tLow);
    }

    internal static StepMetrics Measure(StepTrajectory tr, double finalValue)
    {
        var s = finalValue < 0 ? -1.0 : 1.0;
        var f = Math.Abs(finalValue);
        var (peak, peakTime) = Extreme(tr, s);
        var (low, lowTime) = Extreme(tr, -s);
        var over = f > 0 && s * peak > f ? 100.0 * ((s * peak) - f) / f : 0.0;
        var under = f > 0 && s * low < 0 ? -100.0 * s * low / f : 0.0;
        var t10 = FirstCrossing(tr, 0.1 * finalValue, s);
        var t90 = FirstCrossing(tr, 0.9 * finalValue, s);
        var (ts2, grazes2) = Settling(tr, finalValue, 0.02);
        var (ts5, grazes5) = Settling(tr, finalValue, 0.05);
        return new StepMetrics
        {
            FinalValue = finalValue,
            PeakValue = peak,
            OvershootPercent = over,
            PeakTime = over > 0 ? peakTime : double.PositiveInfinity,
            UndershootPercent = under,
            UndershootTime = under > 0 ? lowTime : double.PositiveInfinity,
            RiseTime = double.IsFinite(t90) && double.IsFinite(t10) ? t90 - t10 : double.PositiveInfinity,
            SettlingTime2Percent = ts2,
            SettlingTime5Percent = ts5,
            Grazes2Percent = grazes2,
            Grazes5Percent = grazes5,
            Horizon = tr.Horizon,
            SampleTime = double.NaN,
        };
    }

    /// <summary>The largest value of sign·y over the horizon (samples, and extrema between them), solved exactly; (y, t).</summary>
    private static (double Value, double Time) Extreme(StepTrajectory tr, double sign)
    {
        var bestValue = sign * tr.Value(0);
        var bestTime = 0.0;
        var bestInterval = -1;
        var bestTheta = 0.0;
        for (var k = 0; k < tr.Count; k++)
        {
            if (sign * tr.Value(k) > bestValue)
            {
                (bestValue, bestTime, bestInterval, bestTheta) = (sign * tr.Value(k), tr.Time(k), -1, 0.0);
            }

            if (k + 1 < tr.Count)
            {
                foreach (var theta in InteriorExtrema(tr, k))
                {
                    var v = sign * Hermite(tr, k, theta);
                    if (v > bestValue)
                    {
                        (bestValue, bestTime, bestInterval, bestTheta) = (v, tr.Time(k) + (theta * (tr.Time(k + 1) - tr.Time(k))), k, theta);
                    }
                }
            }
        }

        if (bestInterval < 0)
        {
            // The best sample: the extremum is in the interval on the side the slope points to (if it is interior).
            var k = IndexOf(tr, bestTime);
            var slope = sign * tr.Slope(k);
            if (slope > 0 && k + 1 < tr.Count && sign * tr.Slope(k + 1) < 0)
            {
                bestInterval = k;
            }
            else if (slope < 0 && k > 0 && sign * tr.Slope(k - 1) > 0)
            {
                bestInterval = k - 1;
            }
            else
            {
                return (sign * bestValue, bestTime);
            }
        }

        var t = SolveSlopeRoot(tr, bestInterval, bestTime);
        var exact = tr.At(t).Y;
        return sign * exact >= bestValue - (1e-9 * Math.Abs(bestValue)) ? (exact, t) : (sign * bestValue, bestTime);
    }

    /// <summary>The first time sign·y reaches sign·level (+∞ when never).</summary>
    private static double FirstCrossing(StepTrajectory tr, double level, double sign)
    {
        if (level == 0)
        {
            return double.PositiveInfinity;
        }

        if (sign * tr.Value(0) >= sign * level)
        {
            return 0.0;
        }

        for (var k = 0; k + 1 < tr.Count; k++)
        {
            var reaches = sign * tr.Value(k + 1) >= sign * level;
            var insideTheta = double.NaN;
            if (!reaches)
            {
                foreach (var theta in InteriorExtrema(tr, k))
                {
                    if (sign * Hermite(tr, k, theta) >= sign * level)
                    {
                        insideTheta = theta;
                        break;
                    }
                }
            }

            if (!reaches && double.IsNaN(insideTheta))
            {
                continue;
            }

            var a = tr.Time(k);
            var b = reaches ? tr.Time(k + 1) : a + (insideTheta * (tr.Time(k + 1) - a));
            if (!reaches && sign * (tr.At(b).Y - level) < 0)
            {
                // The cubic overestimated a graze between samples: the exact solution stays below; go on.
                continue;
            }

            return SolveCrossing(tr, level, a, b);
        }

        return double.PositiveInfinity;
    }

    /// <summary>The last entry into the band |y − f| ≤ band·|f|, and whether that is a graze of the edge.</summary>
    private static (double Time, bool Grazes) Settling(StepTrajectory tr, double final, double band)
    {
        var tolerance = band * Math.Abs(final);
        if (!(tolerance > 0))
        {
            return (double.PositiveInfinity, false);
        }

        double Excess(double y) => Math.Abs(y - final) - tolerance;
        var last = tr.Count - 1;
        if (Excess(tr.Value(last)) > 0)
        {
            return (double.PositiveInfinity, false);
        }

        // Nearest approach after the last exit, to flag a near miss that a small change would turn into an exit.
        var closest = double.NegativeInfinity;
        for (var k = last - 1; k >= 0; k--)
        {
            // The largest excursion in [t_k, t_k+1]: an end point or an extremum of the cubic between them.
            var (worst, worstTheta) = (Excess(tr.Value(k)), 0.0);
            foreach (var theta in InteriorExtrema(tr, k))
            {
                var e = Excess(Hermite(tr, k, theta));
                if (e > worst)
                {
                    (worst, worstTheta) = (e, theta);
                }
            }

            var worstTime = tr.Time(k) + (worstTheta * (tr.Time(k + 1) - tr.Time(k)));
            if (worstTheta > 0)
            {
                // Solve the extremum exactly: the cubic may be off by a little between coarse samples.
                var t = SolveSlopeRoot(tr, k, worstTime);
                (worst, worstTime) = (Excess(tr.At(t).Y), t);
            }

            if (worst <= 0)
            {
                closest = Math.Max(closest, worst);
                continue;
            }

            // The exit: where |y − f| comes back to the band edge, between the excursion and t_k+1.
            var yWorst = worstTheta > 0 ? tr.At(worstTime).Y : tr.Value(k);
            var edge = yWorst > final ? final + tolerance : final - tolerance;
            var exit = SolveCrossing(tr, edge, worstTime, tr.Time(k + 1));
            var lobe = LobeExcess(tr, k, worst, Excess);
            var grazes = lobe < GrazeFraction * tolerance || closest > -GrazeFraction * tolerance;
            return (exit, grazes);
        }

        return (0.0, closest > -GrazeFraction * tolerance);
    }

    /// <summary>The largest excursion beyond the band over the samples of the lobe that ends in interval k.</summary>
    private static double LobeExcess(StepTrajectory tr, int k, double excess, Func<double, double> excessOf)
    {
        var best = excess;
        for (var j = k; j >= 0 && excessOf(tr.Value(j)) > 0; j--)
        {
            best = Math.Max(best, excessOf(tr.Value(j)));
        }

        return best;
    }

    /// <summary>Solves y(t) = level on [a, b] (a sign change of y − level) by bracketed Newton on the exact solution.</summary>
    private static double SolveCrossing(StepTrajectory tr, double level, double a, double b)
    {
        var fa = tr.At(a).Y - level;
        if (fa == 0)
        {
            return a;
        }

        return Newton(t => { var (y, dy, _) = tr.At(t); return (y - level, dy); }, a, b, fa, HermiteGuess(tr, level, a, b));
    }

    /// <summary>Where the cubic Hermite interpolant crosses <paramref name="level"/> in [a, b] (a few bisections on the cubic): a start for Newton.</summary>
    private static double HermiteGuess(StepTrajectory tr, double level, double a, double b)
    {
        var k = Math.Min(IndexAtOrBefore(tr, a), tr.Count - 2);
        if (tr.Time(k + 1) < b * (1 - 1e-15))
        {
            return 0.5 * (a + b);
        }

        var t0 = tr.Time(k);
        var h = tr.Time(k + 1) - t0;
        double lo = (a - t0) / h, hi = (b - t0) / h;
        var flo = Hermite(tr, k, lo) - level;
        for (var i = 0; i < 40; i++)
        {
            var mid = 0.5 * (lo + hi);
            var fm = Hermite(tr, k, mid) - level;
            if (Bisection.Sign(fm) == Bisection.Sign(flo))
            {
                (lo, flo) = (mid, fm);
            }
            else
            {
                hi = mid;
            }
        }

        return Math.Clamp(t0 + (0.5 * (lo + hi) * h), a, b);
    }

    private static int IndexAtOrBefore(StepTrajectory tr, double t)
    {
        var k = IndexOf(tr, t);
        return k > 0 && tr.Time(k) > t ? k - 1 : k;
    }

    /// <summary>Solves dy/dt = 0 in interval k (or its neighbours when the slope does not change sign inside), near a guess.</summary>
    private static double SolveSlopeRoot(StepTrajectory tr, int k, double guess)
    {
        var a = tr.Time(k);
        var b = tr.Time(k + 1);
        var fa = tr.Slope(k);
        var fb = tr.Slope(k + 1);
        if (Bisection.Sign(fa) == Bisection.Sign(fb))
        {
            // Two turns inside the interval: split at the guess, where the slope has the other sign.
            var fg = tr.At(guess).Slope;
            if (Bisection.Sign(fg) == Bisection.Sign(fa))
            {
                return guess;
            }

            var left = Newton(t => { var (_, dy, ddy) = tr.At(t); return (dy, ddy); }, a, guess, fa, 0.5 * (a + guess));
            var right = Newton(t => { var (_, dy, ddy) = tr.At(t); return (dy, ddy); }, guess, b, fg, 0.5 * (guess + b));
            return Math.Abs(left - guess) < Math.Abs(right - guess) ? left : right;
        }

        return Newton(t => { var (_, dy, ddy) = tr.At(t); return (dy, ddy); }, a, b, fa, Math.Clamp(guess, a, b));
    }

    /// <summary>Newton's method kept inside a bracket [a, b] of a sign change (bisection when a step leaves it).</summary>
    private static double Newton(Func<double, (double F, double Derivative)> f, double a, double b, double fa, double guess)
    {
        var t = guess;
        for (var i = 0; i < 60; i++)
        {
            var (ft, dft) = f(t);
            if (ft == 0)
            {
                return t;
            }

            if (Bisection.Sign(ft) == Bisection.Sign(fa))
            {
                (a, fa) = (t, ft);
            }
            else
            {
                b = t;
            }

            var next = t - (ft / dft);
            if (!(next > a && next < b))
            {
                next = 0.5 * (a + b);
            }

            var scale = Math.Max(Math.Abs(next), Math.Abs(b - a));
            if (Math.Abs(next - t) <= 1e-13 * scale || b - a <= 1e-14 * Math.Max(Math.Abs(a), Math.Abs(b)))
            {
                return next;
            }

            t = next;
        }

        return t;
    }

    /// <summary>The cubic Hermite interpolant of y on interval k at θ ∈ [0, 1].</summary>
    private static double Hermite(StepTrajectory tr, int k, double theta)
    {
        var (h, y0, y1, d0, d1) = Interval(tr, k);
        var delta = y1 - y0;
        var c2 = (3 * delta) - (2 * h * d0) - (h * d1);
        var c3 = (-2 * delta) + (h * d0) + (h * d1);
        return y0 + (theta * ((h * d0) + (theta * (c2 + (theta * c3)))));
    }

    /// <summary>Where the cubic Hermite interpolant of interval k has a turning point strictly inside (θ in (0, 1)), in increasing order.</summary>
    private static double[] InteriorExtrema(StepTrajectory tr, int k)
    {
        var (h, y0, y1, d0, d1) = Interval(tr, k);
        var delta = y1 - y0;
        var a = 3 * ((-2 * delta) + (h * d0) + (h * d1));
        var b = 2 * ((3 * delta) - (2 * h * d0) - (h * d1));
        var c = h * d0;
        if (Math.Abs(a) <= 1e-14 * (Math.Abs(b) + Math.Abs(c)))
        {
            return b != 0 && -c / b is var root && root > 0 && root < 1 ? [root] : [];
        }

        var disc = (b * b) - (4 * a * c);
        if (disc < 0)
        {
            return [];
        }

        var q = -0.5 * (b + ((b < 0 ? -1 : 1) * Math.Sqrt(disc)));
        var r1 = q / a;
        var r2 = q != 0 ? c / q : double.NaN;
        var (lo, hi) = (Math.Min(r1, r2), Math.Max(r1, r2));
        var inLo = lo > 0 && lo < 1;
        var inHi = hi > 0 && hi < 1 && hi != lo;
        return (inLo, inHi) switch
        {
            (true, true) => [lo, hi],
            (true, false) => [lo],
            (false, true) => [hi],
            _ => [],
        };
    }

    private static (double H, double Y0, double Y1, double D0, double D1) Interval(StepTrajectory tr, int k) =>
        (tr.Time(k + 1) - tr.Time(k), tr.Value(k), tr.Value(k + 1), tr.Slope(k), tr.Slope(k + 1));

    private static int IndexOf(StepTrajectory tr, double t)
    {
        var lo = 0;
        var hi = tr.Count - 1;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            if (tr.Time(mid) < t)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }
}
