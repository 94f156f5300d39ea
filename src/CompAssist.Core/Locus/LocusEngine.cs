using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Locus;

/// <summary>
/// All branches of D(s) + K·g·N(s) = 0 for K from 0 to ∞ by predictor–corrector continuation in ln K:
/// an Euler predictor along the tangent dr/d(ln K) = −K·g·N/F′, Newton correction in product form, step
/// control by root movement (relative to the root's size and to its nearest neighbour, so branches neither
/// jump nor collapse onto each other), an eigenvalue re-seed with optimal assignment where steps become tiny
/// (near break points), and for K &gt; 1 evaluation of D/K + g·N (the 1/K form) toward K → ∞.
/// </summary>
public static class LocusEngine
{
    private const int MaxSteps = 20000;

    // Continuation jumps across a break point once the gain is within the window (in ln K) of its gain and two
    // roots are within this fraction of the break point's size of it, or once the gain is within the approach;
    // the jump lands this far (in ln K) past it.
    private const double BreakRadius = 0.05;
    private const double BreakGainApproach = 0.003;
    private const double BreakGainWindow = 0.3;
    private const double BreakJump = 0.01;

    /// <summary>The locus of the loop with an optional compensator (default 1), sign folded in.</summary>
    public static LocusResult Compute(Loop loop, TransferFunction? compensator = null)
    {
        ArgumentNullException.ThrowIfNull(loop);
        var c = compensator ?? TransferFunction.Unity;
        var open = loop.RationalOpenLoop(c).Scaled(loop.SignFactor);
        if (!open.IsProper)
        {
            throw new ArgumentException("The open loop must be proper for a locus.", nameof(compensator));
        }

        var approximate = loop.OpenLoop(c).Delay > 0;
        var poles = open.Poles;
        var zeros = open.Zeros;
        var g = open.Gain;
        var n = poles.Length;
        var scale = RegionScale(poles, zeros);
        var kRef = ReferenceGain(poles, zeros, g);
        var branches = new List<LocusPoint>[n];
        var roots = new Complex[n];
        for (var i = 0; i < n; i++)
        {
            roots[i] = poles[i];
            branches[i] = [new LocusPoint(0.0, poles[i])];
        }

        var breakPoints = LocusFeatures.BreakPoints(poles, zeros, g);
        var steps = 0;
        var reseeds = 0;
        var crossings = 0;
        if (n > 0)
        {
            // First point off the poles: an eigenvalue solve at a small gain, assigned to the poles.
            var k = kRef * 1e-7;
            Complex[] start;
            while (true)
            {
                try
                {
                    start = Reseed(poles, zeros, g, k, roots);
                }
                catch (RootFindingException) when (k < kRef * 1e3)
                {
                    // Right next to a multiple pole the roots are a tight cluster that cannot be verified yet;
                    // start a decade further out, where they have separated.
                    k *= 10;
                    continue;
                }

                reseeds++;
                var moved = Enumerable.Range(0, n).Max(i => Complex.Abs(start[i] - roots[i]) / Math.Max(Complex.Abs(roots[i]), 0.05 * scale));
                if (moved > 1e-4 || k > kRef * 1e3)
                {
                    break;
                }

                k *= 10;
            }

            roots = start;
            Append(branches, k, roots);
            var t = Math.Log(k);
            var dt = 0.05;
            var tEnd = Math.Log(kRef * 1e12);
            var next = new Complex[n];
            var slope = Tangents(roots, poles, zeros, g, k);
            var nextSlope = new Complex[n];
            var allowance = new double[n];

            // The roots one accepted step back (for the quadratic predictor); NaN when there is none.
            var previous = new Complex[n];
            var tPrevious = double.NaN;
            // The exact break points ahead, by gain: continuation crawls where branches meet, so once the meeting
            // roots are close to a break point (or its gain is all but reached) it jumps across with one eigenvalue
            // solve instead, and the exact break point goes on the branches that pass through it.
            var ahead = breakPoints.Where(b => double.IsFinite(b.Gain) && b.Gain > k).OrderBy(b => b.Gain).ToArray();
            var nextBreak = 0;
            while (t < tEnd && steps < MaxSteps && !Finished(roots, zeros, scale))
            {
                steps++;
                var kNow = Math.Exp(t);
                while (nextBreak < ahead.Length && ahead[nextBreak].Gain <= kNow)
                {
                    nextBreak++;
                }

                if (nextBreak < ahead.Length && CloseToBreak(roots, ahead[nextBreak], t, scale))
                {
                    var kJump = ahead[nextBreak].Gain * Math.Exp(BreakJump);
                    var before = roots;
                    Allowances(roots, scale, allowance);
                    if (TrySplitAtBreak(roots, slope, allowance, ahead[nextBreak], kNow, kJump, next, nextSlope, poles, zeros, g, scale))
                    {
                        roots = next;
                        slope = nextSlope;
                        next = new Complex[n];
                        nextSlope = new Complex[n];
                        crossings++;
                    }
                    else
                    {
                        roots = Reseed(poles, zeros, g, kJump, roots);
                        slope = Tangents(roots, poles, zeros, g, kJump);
                        reseeds++;
                    }

                    InsertBreakPoints(branches, breakPoints, before, roots, kNow, kJump, scale);
                    Append(branches, kJump, roots);
                    t = Math.Log(kJump);
                    tPrevious = double.NaN;
                    dt = BreakJump;
                    nextBreak++;
                    continue;
                }

                Allowances(roots, scale, allowance);
                dt = Math.Min(dt, PredictedStep(roots, slope, allowance, kNow));
                var kNext = Math.Exp(t + dt);
                if (TryStep(roots, slope, previous, t - tPrevious, dt, allowance, next, nextSlope, poles, zeros, g, kNow, kNext, scale))
                {
                    Array.Copy(roots, previous, n);
                    tPrevious = t;
                    (roots, next) = (next, roots);
                    (slope, nextSlope) = (nextSlope, slope);
                    t += dt;
                    Append(branches, kNext, roots);
                    dt = Math.Min(dt * 2.0, 1.0);
                }
                else if (dt > 1e-5)
                {
                    dt *= 0.35;
                }
                else
                {
                    // Near a break point: jump with the eigenvalue solver and assign by optimal matching.
                    var jump = 0.01;
                    var kJump = Math.Exp(t + jump);
                    var before = roots;
                    roots = Reseed(poles, zeros, g, kJump, roots);
                    slope = Tangents(roots, poles, zeros, g, kJump);
                    reseeds++;
                    t += jump;
                    tPrevious = double.NaN;
                    InsertBreakPoints(branches, breakPoints, before, roots, kNow, kJump, scale);
                    Append(branches, kJump, roots);
                    dt = 0.01;
                }
            }
        }

        var ends = roots.Select(r => NearestZero(r, zeros, scale)).ToImmutableArray();
        return LocusFeatures.Complete(
            branches.Select(b => b.ToImmutableArray()).ToImmutableArray(), ends, poles, zeros, g, breakPoints, approximate, steps, reseeds, crossings);
    }

    /// <summary>
    /// Where a re-seed jumped across a break point, puts the exact break point (and its gain) on the branches
    /// that pass through it, so the drawn branches meet there instead of cutting the corner.
    /// </summary>
    private static void InsertBreakPoints(List<LocusPoint>[] branches, IReadOnlyList<BreakPoint> breakPoints, Complex[] before, Complex[] after, double kFrom, double kTo, double scale)
    {
        foreach (var b in breakPoints.Where(b => b.Gain > kFrom && b.Gain < kTo))
        {
            // The two branches that meet there: both ends close to it, or going by way of it not much longer than
            // the straight jump (at most the right-angle turn a break point makes). Never more than two.
            var radius = 0.05 * Math.Max(b.Point.Magnitude, 0.05 * scale);
            var candidates = new List<(int Branch, double Detour)>();
            for (var i = 0; i < before.Length; i++)
            {
                var viaBreak = Complex.Abs(before[i] - b.Point) + Complex.Abs(after[i] - b.Point);
                var near = Complex.Abs(before[i] - b.Point) <= radius && Complex.Abs(after[i] - b.Point) <= radius;
                if (near || viaBreak <= (1.6 * Complex.Abs(after[i] - before[i])) + radius)
                {
                    candidates.Add((i, viaBreak));
                }
            }

            foreach (var (branch, _) in candidates.OrderBy(c => c.Detour).Take(2))
            {
                branches[branch].Add(new LocusPoint(b.Gain, b.Point));
            }
        }
    }

    private static bool CloseToBreak(Complex[] roots, BreakPoint b, double t, double scale)
    {
        var gap = Math.Log(b.Gain) - t;
        if (gap < BreakGainApproach)
        {
            return true;
        }

        // Being near the break point is not enough on its own: roots can pass close to a break point long before
        // its gain (a small lag circle beside it, say), and the jump would cut that part of the locus out.
        if (gap > BreakGainWindow)
        {
            return false;
        }

        var radius = BreakRadius * Math.Max(b.Point.Magnitude, 0.05 * scale);
        var near = 0;
        foreach (var r in roots)
        {
            if (Complex.Abs(r - b.Point) <= radius && ++near == 2)
            {
                return true;
            }
        }

        return false;
    }

    private static void Append(List<LocusPoint>[] branches, double k, Complex[] roots)
    {
        for (var i = 0; i < roots.Length; i++)
        {
            branches[i].Add(new LocusPoint(k, roots[i]));
        }
    }

    /// <summary>The ln K step at which the tangent predicts each root to move by 80 % of its allowance.</summary>
    private static double PredictedStep(Complex[] roots, Complex[] slope, double[] allowance, double k)
    {
        var best = double.PositiveInfinity;
        for (var i = 0; i < roots.Length; i++)
        {
            var speed = k * Complex.Abs(slope[i]);
            if (speed > 0)
            {
                best = Math.Min(best, 0.8 * allowance[i] / speed);
            }
        }

        return Math.Max(best, 1e-6);
    }

    /// <summary>
    /// How far each root may move in one step: under 40 % of the distance to its nearest neighbour (no branch
    /// jumping) and 15 % of its own size (plot resolution).
    /// </summary>
    private static void Allowances(Complex[] roots, double scale, double[] allowance)
    {
        var n = roots.Length;
        for (var i = 0; i < n; i++)
        {
            allowance[i] = double.PositiveInfinity;
        }

        for (var i = 0; i < n; i++)
        {
            for (var j = i + 1; j < n; j++)
            {
                var dx = roots[i].Real - roots[j].Real;
                var dy = roots[i].Imaginary - roots[j].Imaginary;
                var d2 = (dx * dx) + (dy * dy);
                allowance[i] = Math.Min(allowance[i], d2);
                allowance[j] = Math.Min(allowance[j], d2);
            }
        }

        for (var i = 0; i < n; i++)
        {
            allowance[i] = Math.Min(0.4 * Math.Sqrt(allowance[i]), 0.15 * Math.Max(Complex.Abs(roots[i]), 0.05 * scale));
        }
    }

    /// <summary>dr/dK = −g·N(r)/(D′ + K·g·N′) for every root.</summary>
    private static Complex[] Tangents(Complex[] roots, ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g, double k)
    {
        var result = new Complex[roots.Length];
        for (var i = 0; i < roots.Length; i++)
        {
            var (_, fs, nValue) = Evaluate(poles, zeros, g, k, roots[i]);
            result[i] = Slope(fs, nValue, g, k);
        }

        return result;
    }

    private static Complex Slope(Complex fs, Complex nValue, double g, double k) =>
        fs == Complex.Zero ? Complex.Zero : -(g * nValue) / fs * (k > 1 ? 1.0 / k : 1.0);

    /// <summary>
    /// One predictor–corrector step from K to K′ (Euler predictor on dr/dK, Newton corrector); also returns the
    /// tangents at the new roots from the last Newton evaluation. False when it must be retried smaller.
    /// </summary>
    private static bool TryStep(Complex[] roots, Complex[] slope, Complex[] previous, double back, double dt, double[] allowance, Complex[] next, Complex[] nextSlope, ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g, double k, double kNext, double scale)
    {
        if (double.IsFinite(back) && back > 0)
        {
            // Quadratic predictor in t = ln K through the previous root, the current root and its tangent
            // (dr/dt = K·dr/dK): Newton then starts closer and needs fewer evaluations.
            for (var i = 0; i < roots.Length; i++)
            {
                var v = k * slope[i];
                var c = (previous[i] - roots[i] + (v * back)) / (back * back);
                next[i] = roots[i] + (v * dt) + (c * dt * dt);
            }
        }
        else
        {
            var growth = kNext - k;
            for (var i = 0; i < roots.Length; i++)
            {
                next[i] = roots[i] + (growth * slope[i]);
            }
        }

        if (!Correct(roots, next, nextSlope, poles, zeros, g, kNext, scale))
        {
            return false;
        }

        for (var i = 0; i < roots.Length; i++)
        {
            if (Complex.Abs(next[i] - roots[i]) > allowance[i])
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>
    /// Crosses a break point without an eigenvalue solve: the two roots that meet there leave it as
    /// s = b ± √(−2·g·N(b)·(K − K_b) / F″(b)) (the local expansion of D + K·g·N, with F = F′ = 0 at the break point),
    /// the others follow their tangents; then every root is corrected by Newton at the new gain. False when the
    /// break point is not a simple meeting of two roots or the correction fails (the caller then re-seeds).
    /// </summary>
    private static bool TrySplitAtBreak(Complex[] roots, Complex[] slope, double[] allowance, BreakPoint b, double k, double kJump, Complex[] next, Complex[] nextSlope, ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g, double scale)
    {
        var n = roots.Length;
        int first = -1, second = -1;
        for (var i = 0; i < n; i++)
        {
            var d = Complex.Abs(roots[i] - b.Point);
            if (first < 0 || d < Complex.Abs(roots[first] - b.Point))
            {
                second = first;
                first = i;
            }
            else if (second < 0 || d < Complex.Abs(roots[second] - b.Point))
            {
                second = i;
            }
        }

        if (second < 0)
        {
            return false;
        }

        var (_, _, dd2, nv, _, nd2) = SecondDerivatives(poles, zeros, b.Point);
        var fss = dd2 + (b.Gain * g * nd2);
        var size = Math.Max(b.Point.Magnitude, 0.05 * scale);
        if (!(fss.Magnitude > 0) || !double.IsFinite(fss.Magnitude))
        {
            return false;
        }

        var delta = Complex.Sqrt(-2.0 * g * nv * (kJump - b.Gain) / fss);
        if (!double.IsFinite(delta.Real) || !double.IsFinite(delta.Imaginary) || delta.Magnitude > 0.2 * size)
        {
            return false;
        }

        var growth = kJump - k;
        for (var i = 0; i < n; i++)
        {
            next[i] = roots[i] + (growth * slope[i]);
        }

        // Keep each of the two on the side it came from (either assignment draws correctly; this one avoids a kink).
        var a = b.Point + delta;
        var c = b.Point - delta;
        var keep = Complex.Abs(roots[first] - a) + Complex.Abs(roots[second] - c) <= Complex.Abs(roots[first] - c) + Complex.Abs(roots[second] - a);
        next[first] = keep ? a : c;
        next[second] = keep ? c : a;
        if (!Correct(roots, next, nextSlope, poles, zeros, g, kJump, scale))
        {
            return false;
        }

        // The pair must have stayed near the break point, and every other root near its prediction and within
        // its step allowance (under 40 % of the distance to its nearest neighbour: no swapping).
        for (var i = 0; i < n; i++)
        {
            var moved = i == first || i == second
                ? Complex.Abs(next[i] - b.Point) > 0.5 * size
                : Complex.Abs(next[i] - (roots[i] + (growth * slope[i]))) > 0.1 * Math.Max(Complex.Abs(roots[i]), 0.05 * scale)
                    || Complex.Abs(next[i] - roots[i]) > allowance[i];
            if (moved)
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>
    /// Newton correction of every guess at gain <paramref name="k"/> (in product form), with the tangents at the
    /// corrected roots; false when a root does not converge or two roots land on the same one.
    /// </summary>
    private static bool Correct(Complex[] previous, Complex[] next, Complex[] nextSlope, ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g, double k, double scale)
    {
        var n = next.Length;
        for (var i = 0; i < n; i++)
        {
            var x = next[i];
            var converged = false;
            var previousStep = 0.0;
            for (var it = 0; it < 6; it++)
            {
                var (f, d, nValue) = Evaluate(poles, zeros, g, k, x);
                if (d == Complex.Zero)
                {
                    break;
                }

                var step = f / d;
                x -= step;
                nextSlope[i] = Slope(d, nValue, g, k);
                var size = Complex.Abs(step);
                var tolerance = 1e-10 * Math.Max(Complex.Abs(x), 1e-3 * scale);

                // Converged when the step is below the tolerance, or when Newton is plainly in its quadratic regime
                // and the error left after this step (about |s_k|³/|s_k−1|²) is: that saves the confirming step.
                if (size <= tolerance || (previousStep > 0 && size < 0.1 * previousStep && size * size * size <= tolerance * previousStep * previousStep))
                {
                    converged = true;
                    break;
                }

                previousStep = size;
            }

            if (!converged || !double.IsFinite(x.Real) || !double.IsFinite(x.Imaginary))
            {
                return false;
            }

            if (previous[i].Imaginary == 0 && Math.Abs(x.Imaginary) <= 1e-12 * Math.Max(Complex.Abs(x), scale))
            {
                x = new Complex(x.Real, 0);
            }

            next[i] = x;
        }

        // No two branches may have converged onto the same root: with every move under 40 % of the
        // nearest-neighbour distance, two roots can only meet if one of them jumped.
        for (var i = 0; i < n; i++)
        {
            for (var j = i + 1; j < n; j++)
            {
                var dx = next[i].Real - next[j].Real;
                var dy = next[i].Imaginary - next[j].Imaginary;
                var tiny = 1e-6 * Math.Max(scale, Complex.Abs(next[i]));
                if ((dx * dx) + (dy * dy) < tiny * tiny)
                {
                    return false;
                }
            }
        }

        return true;
    }

    /// <summary>D, D′, D″ and N, N′, N″ at s, in product form.</summary>
    private static (Complex D, Complex D1, Complex D2, Complex N, Complex N1, Complex N2) SecondDerivatives(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, Complex s)
    {
        static (Complex, Complex, Complex) Of(ImmutableArray<Complex> roots, Complex s)
        {
            Complex v = 1, d1 = 0, d2 = 0;
            foreach (var r in roots)
            {
                var f = s - r;
                d2 = (d2 * f) + (2 * d1);
                d1 = (d1 * f) + v;
                v *= f;
            }

            return (v, d1, d2);
        }

        var (d, dd1, dd2) = Of(poles, s);
        var (nv, nd1, nd2) = Of(zeros, s);
        return (d, dd1, dd2, nv, nd1, nd2);
    }

    /// <summary>
    /// F(s) = D + K·g·N for K ≤ 1, or D/K + g·N for K &gt; 1 (same roots, no overflow), its s-derivative, and N(s).
    /// </summary>
    private static (Complex F, Complex Fs, Complex N) Evaluate(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g, double k, Complex s)
    {
        Complex d = 1, dd = 0, nv = 1, nd = 0;
        foreach (var p in poles)
        {
            var f = s - p;
            dd = (dd * f) + d;
            d *= f;
        }

        foreach (var z in zeros)
        {
            var f = s - z;
            nd = (nd * f) + nv;
            nv *= f;
        }

        return k > 1
            ? ((d / k) + (g * nv), (dd / k) + (g * nd), nv)
            : (d + (k * g * nv), dd + (k * g * nd), nv);
    }

    private static Complex[] Reseed(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g, double k, Complex[] previous)
    {
        var f = new CharacteristicFunction(FactoredPolynomial.Create(1.0, poles), k * g, FactoredPolynomial.Create(1.0, zeros));
        var found = RootFinder.Find(f).Roots;
        var n = previous.Length;
        var cost = new double[n, n];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                cost[i, j] = Complex.Abs(found[j] - previous[i]);
            }
        }

        var assignment = Assignment.Solve(cost);
        return [.. Enumerable.Range(0, n).Select(i => found[assignment[i]])];
    }

    private static bool Finished(Complex[] roots, ImmutableArray<Complex> zeros, double scale)
    {
        foreach (var r in roots)
        {
            if (Complex.Abs(r) > 20 * scale)
            {
                continue;
            }

            if (NearestZero(r, zeros, scale) is null)
            {
                return false;
            }
        }

        return true;
    }

    private static Complex? NearestZero(Complex r, ImmutableArray<Complex> zeros, double scale)
    {
        foreach (var z in zeros)
        {
            if (Complex.Abs(r - z) <= 1e-4 * Math.Max(Complex.Abs(z), 0.02 * scale))
            {
                return z;
            }
        }

        return null;
    }

    /// <summary>The size of the interesting region: the largest pole/zero magnitude (at least 1e-3).</summary>
    internal static double RegionScale(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros)
    {
        var sizes = poles.Concat(zeros).Select(r => r.Magnitude).ToList();
        return Math.Max(sizes.Count == 0 ? 1.0 : sizes.Max(), 1e-3);
    }

    /// <summary>A gain that moves roots by about their own size: |D/(g·N)| at jω₀, ω₀ the geometric mean of the corners.</summary>
    private static double ReferenceGain(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g)
    {
        var corners = poles.Concat(zeros).Select(r => r.Magnitude).Where(m => m > 0).ToList();
        var w0 = corners.Count == 0 ? 1.0 : Math.Exp(corners.Average(Math.Log));
        var s = new Complex(0, w0);
        Complex d = 1, nv = 1;
        foreach (var p in poles)
        {
            d *= s - p;
        }

        foreach (var z in zeros)
        {
            nv *= s - z;
        }

        var kRef = Complex.Abs(d) / (Math.Abs(g) * Complex.Abs(nv));
        return double.IsFinite(kRef) && kRef > 0 ? kRef : 1.0;
    }
}
