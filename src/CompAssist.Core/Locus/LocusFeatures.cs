using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Locus;

/// <summary>
/// The exact features of a locus of D + K·g·N = 0 (common practice): asymptotes, real-axis segments,
/// break points (roots of N·D′ − N′·D with real positive gain, and repeated poles at gain 0, polished on Σ1/(s−p) − Σ1/(s−z) = 0),
/// imaginary-axis crossings (Im[D(jω)·N̄(jω)] = 0 with real positive gain), departure and arrival angles.
/// </summary>
public static class LocusFeatures
{
    // Open-loop poles this close (relative) are one repeated pole: root finding splits an exact double root of
    // an expanded polynomial by about √ε·|p| ≈ 1.5e-8·|p|.
    private const double RepeatTolerance = 1e-6;

    // A zero cancels a pole only when they agree to rounding: a dipole 1e-6 apart is a real pair of features.
    private const double CancelTolerance = 1e-10;

    internal static LocusResult Complete(
        ImmutableArray<ImmutableArray<LocusPoint>> branches,
        ImmutableArray<Complex?> ends,
        ImmutableArray<Complex> poles,
        ImmutableArray<Complex> zeros,
        double g,
        ImmutableArray<BreakPoint> breakPoints,
        bool approximate,
        int steps,
        int reseeds,
        int expansionCrossings)
    {
        var zeroDegree = g < 0;
        var excess = poles.Length - zeros.Length;
        var centroid = excess > 0 ? (poles.Sum(p => p.Real) - zeros.Sum(z => z.Real)) / excess : double.NaN;
        var angles = Enumerable.Range(0, Math.Max(excess, 0))
            .Select(l => ((zeroDegree ? 2.0 * l : (2.0 * l) + 1) * 180.0 / excess) % 360.0)
            .ToImmutableArray();
        return new LocusResult
        {
            Branches = branches,
            BranchEnds = ends,
            Poles = poles,
            Zeros = zeros,
            Centroid = centroid,
            AsymptoteAnglesDegrees = angles,
            RealAxisSegments = Segments(poles, zeros, zeroDegree),
            BreakPoints = WithRepeatedPoles(breakPoints, poles, zeros),
            AxisCrossings = AxisCrossings(poles, zeros, g),
            BranchAngles = BranchAngles(poles, zeros, zeroDegree),
            Approximate = approximate,
            ZeroDegreeLocus = zeroDegree,
            Steps = steps,
            Reseeds = reseeds,
            ExpansionCrossings = expansionCrossings,
        };
    }

    /// <summary>Real-axis parts: to the left of an odd (180° locus) or even (0° locus) count of real poles and zeros.</summary>
    public static ImmutableArray<RealAxisSegment> Segments(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, bool zeroDegree)
    {
        var marks = poles.Concat(zeros).Where(r => r.Imaginary == 0).Select(r => r.Real).Distinct().OrderByDescending(x => x).ToList();
        var edges = new List<double> { double.PositiveInfinity };
        edges.AddRange(marks);
        edges.Add(double.NegativeInfinity);
        var segments = ImmutableArray.CreateBuilder<RealAxisSegment>();
        for (var i = 0; i + 1 < edges.Count; i++)
        {
            double right = edges[i], left = edges[i + 1];
            var probe = double.IsPositiveInfinity(right) ? left + 1 : (double.IsNegativeInfinity(left) ? right - 1 : 0.5 * (left + right));
            var count = poles.Concat(zeros).Count(r => r.Imaginary == 0 && r.Real > probe);
            if ((count % 2 == 1) != zeroDegree)
            {
                segments.Add(new RealAxisSegment(left, right));
            }
        }

        // Merge touching segments (a pole/zero between two locus parts is on the locus too).
        var merged = ImmutableArray.CreateBuilder<RealAxisSegment>();
        foreach (var s in segments.OrderBy(s => s.From))
        {
            if (merged.Count > 0 && merged[^1].To == s.From)
            {
                merged[^1] = merged[^1] with { To = s.To };
            }
            else
            {
                merged.Add(s);
            }
        }

        return merged.ToImmutable();
    }

    /// <summary>Break points with real positive gain.</summary>
    public static ImmutableArray<BreakPoint> BreakPoints(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g)
    {
        // A pole cancelled by an equal zero keeps its closed-loop root for every gain: the break points are
        // those of the reduced loop (where one may lie exactly on the cancelled pole).
        (poles, zeros) = WithoutCancellations(poles, zeros);
        var d = Polynomial.FromRoots(poles);
        var n = Polynomial.FromRoots(zeros);
        var condition = (n * d.Derivative()) + (n.Derivative() * d * -1.0);
        if (condition.Degree < 1)
        {
            return [];
        }

        var result = ImmutableArray.CreateBuilder<BreakPoint>();
        foreach (var seed in RootFinder.Find(condition).Roots)
        {
            var s = Polish(seed, poles, zeros);
            if (poles.Concat(zeros).Any(r => Complex.Abs(r - s) <= 1e-9 * Math.Max(1, r.Magnitude)))
            {
                continue;
            }

            var k = -FactoredValue(poles, s) / (g * FactoredValue(zeros, s));
            if (Math.Abs(k.Imaginary) <= 1e-7 * Complex.Abs(k) && k.Real > 0 && double.IsFinite(k.Real))
            {
                if (!result.Any(b => Complex.Abs(b.Point - s) <= 1e-7 * Math.Max(1, s.Magnitude)))
                {
                    result.Add(new BreakPoint(Math.Abs(s.Imaginary) <= 1e-9 * Math.Max(1, s.Magnitude) ? new Complex(s.Real, 0) : s, k.Real));
                }
            }
        }

        return [.. result.OrderBy(b => b.Point.Real)];
    }

    /// <summary>
    /// The break points with every repeated open-loop pole added as one at gain 0 (branches leave a pole of
    /// multiplicity m at m equally spread angles): a root of N·D′ − N′·D at a pole that the gain-K test cannot
    /// see. A pole cancelled by an equal zero is not one (its closed-loop root stays put for every gain).
    /// </summary>
    internal static ImmutableArray<BreakPoint> WithRepeatedPoles(ImmutableArray<BreakPoint> breakPoints, ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros)
    {
        var result = breakPoints.ToList();
        var seen = new List<Complex>();
        foreach (var p in poles)
        {
            var radius = RepeatTolerance * Math.Max(1, p.Magnitude);
            if (seen.Any(q => Complex.Abs(q - p) <= radius))
            {
                continue;
            }

            seen.Add(p);
            var multiplicity = poles.Count(q => Complex.Abs(q - p) <= radius) - zeros.Count(z => Complex.Abs(z - p) <= CancelTolerance * Math.Max(1, p.Magnitude));
            if (multiplicity >= 2)
            {
                result.RemoveAll(b => Complex.Abs(b.Point - p) <= radius);
                result.Add(new BreakPoint(Math.Abs(p.Imaginary) <= radius ? new Complex(p.Real, 0) : p, 0));
            }
        }

        return [.. result.OrderBy(b => b.Point.Real).ThenBy(b => b.Point.Imaginary)];
    }

    private static (ImmutableArray<Complex> Poles, ImmutableArray<Complex> Zeros) WithoutCancellations(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros)
    {
        var keptPoles = poles.ToList();
        var keptZeros = new List<Complex>();
        foreach (var z in zeros)
        {
            var index = keptPoles.FindIndex(p => Complex.Abs(p - z) <= CancelTolerance * Math.Max(1, z.Magnitude));
            if (index >= 0)
            {
                keptPoles.RemoveAt(index);
            }
            else
            {
                keptZeros.Add(z);
            }
        }

        return ([.. keptPoles], [.. keptZeros]);
    }

    /// <summary>Imaginary-axis crossings with real positive gain (including ω = 0, a root at the origin).</summary>
    public static ImmutableArray<AxisCrossing> AxisCrossings(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, double g)
    {
        // D(jω)·conj(N(jω)) as a polynomial in ω: Im part = 0 where the angle condition can hold on the axis.
        var dj = JOmega(poles);
        var nj = JOmega(zeros);
        var (dr, di) = dj;
        var (nr, ni) = nj;

        // Im(D·conj N) = di·nr − dr·ni.
        var im = (di * nr) + (dr * ni * -1.0);
        var candidates = new List<double>();
        if (im.IsZero)
        {
            return [];
        }

        if (im.Degree >= 1)
        {
            candidates.AddRange(RootFinder.Find(im).Roots.Where(w => Math.Abs(w.Imaginary) <= 1e-7 * Math.Max(1, w.Magnitude) && w.Real >= -1e-12).Select(w => Math.Max(w.Real, 0.0)));
        }

        var result = ImmutableArray.CreateBuilder<AxisCrossing>();
        foreach (var w0 in candidates.Distinct())
        {
            var s = new Complex(0, w0);
            var nValue = FactoredValue(zeros, s);
            if (nValue == Complex.Zero || poles.Any(p => Complex.Abs(p - s) <= 1e-12 * Math.Max(1, w0)))
            {
                continue;
            }

            var k = -FactoredValue(poles, s) / (g * nValue);
            if (Math.Abs(k.Imaginary) <= 1e-6 * Complex.Abs(k) && k.Real > 0 && double.IsFinite(k.Real)
                && !result.Any(c => Math.Abs(c.Frequency - w0) <= 1e-9 * Math.Max(1, w0)))
            {
                result.Add(new AxisCrossing(k.Real, w0));
            }
        }

        return [.. result.OrderBy(c => c.Gain)];
    }

    /// <summary>Departure angles at complex poles and arrival angles at complex zeros (multiplicity counted).</summary>
    public static ImmutableArray<BranchAngle> BranchAngles(ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros, bool zeroDegree)
    {
        // A point where poles and zeros coincide counts by its net multiplicity m (poles minus zeros): m > 0 is
        // a pole that m branches leave, m < 0 a zero that |m| branches reach, m = 0 a cancellation with none.
        // m·θ = base + Σ∠(s − z) − Σ∠(s − p) + 360°·k over the other poles and zeros gives the m angles.
        var result = ImmutableArray.CreateBuilder<BranchAngle>();
        var baseAngle = zeroDegree ? 0.0 : 180.0;
        foreach (var departure in new[] { true, false })
        {
            var same = departure ? poles : zeros;
            var opposite = departure ? zeros : poles;
            var seen = new List<Complex>();
            foreach (var at in same.Where(r => r.Imaginary >= 0))
            {
                var radius = RepeatTolerance * Math.Max(1, at.Magnitude);
                var cancel = CancelTolerance * Math.Max(1, at.Magnitude);
                if (seen.Any(q => Complex.Abs(q - at) <= radius))
                {
                    continue;
                }

                seen.Add(at);
                var m = same.Count(q => Complex.Abs(q - at) <= radius) - opposite.Count(q => Complex.Abs(q - at) <= cancel);
                var isReal = Math.Abs(at.Imaginary) <= radius;
                if (m <= 0 || (isReal && m < 2))
                {
                    continue;
                }

                var point = isReal ? new Complex(at.Real, 0) : at;
                var toSame = same.Where(q => Complex.Abs(q - at) > radius).Sum(q => Angle(point - q));
                var toOpposite = opposite.Where(q => Complex.Abs(q - at) > cancel).Sum(q => Angle(point - q));
                var first = (baseAngle + toOpposite - toSame) / m;
                var angles = Enumerable.Range(0, m).Select(k => Angles.WrapDegrees(first + (360.0 * k / m))).OrderBy(a => a);
                foreach (var angle in angles)
                {
                    result.Add(new BranchAngle(point, angle, departure));
                }
            }
        }

        return result.ToImmutable();
    }

    private static double Angle(Complex v) => Angles.ToDegrees(v.Phase);

    private static Complex FactoredValue(ImmutableArray<Complex> roots, Complex s)
    {
        Complex v = 1;
        foreach (var r in roots)
        {
            v *= s - r;
        }

        return v;
    }

    /// <summary>Newton on φ(s) = Σ 1/(s − p) − Σ 1/(s − z), whose zeros are the break points (product form, exact).</summary>
    private static Complex Polish(Complex s, ImmutableArray<Complex> poles, ImmutableArray<Complex> zeros)
    {
        var isReal = s.Imaginary == 0;
        for (var i = 0; i < 20; i++)
        {
            Complex phi = 0, dphi = 0;
            foreach (var p in poles)
            {
                var inv = 1.0 / (s - p);
                phi += inv;
                dphi -= inv * inv;
            }

            foreach (var z in zeros)
            {
                var inv = 1.0 / (s - z);
                phi -= inv;
                dphi += inv * inv;
            }

            if (dphi == Complex.Zero || !double.IsFinite(phi.Real))
            {
                break;
            }

            var step = phi / dphi;
            var next = s - step;
            if (isReal)
            {
                next = new Complex(next.Real, 0);
            }

            if (!double.IsFinite(next.Real) || Complex.Abs(step) > 0.1 * Math.Max(1, s.Magnitude))
            {
                break;
            }

            s = next;
            if (Complex.Abs(step) <= 1e-15 * Math.Max(1, s.Magnitude))
            {
                break;
            }
        }

        return s;
    }

    /// <summary>Real and imaginary parts of Π(jω − r) as real polynomials in ω.</summary>
    private static (Polynomial Re, Polynomial Im) JOmega(ImmutableArray<Complex> roots)
    {
        var re = Polynomial.One;
        var im = Polynomial.Zero;
        foreach (var r in roots)
        {
            // (jω − r) = (−Re r) + j(ω − Im r): multiply (re + j·im) by (a + j·b), a = −Re r, b = ω − Im r.
            var a = Polynomial.Constant(-r.Real);
            var b = Polynomial.FromAscending([-r.Imaginary, 1.0]);
            var newRe = (re * a) + (im * b * -1.0);
            var newIm = (re * b) + (im * a);
            re = newRe;
            im = newIm;
        }

        return (re, im);
    }
}
