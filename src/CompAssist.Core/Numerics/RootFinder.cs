using System.Collections.Immutable;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;

namespace CompAssist.Core.Numerics;

/// <summary>
/// Root finding that never silently lies: balanced companion-matrix eigenvalues as seeds, Newton polishing
/// on the accurate (usually factored) evaluation, and every root checked by its residual.
/// </summary>
public static class RootFinder
{
    /// <summary>
    /// A root is accepted when its relative residual |f(r)|/scale(r) is at most this (a small backward error;
    /// how clustered or repeated roots pass) ...
    /// </summary>
    public const double ResidualLimit = 1e-9;

    /// <summary>... or its last relative Newton correction |f/f′|/|r| is at most this (a small forward error).</summary>
    public const double StepLimit = 1e-10;

    private const int MaxNewtonSteps = 40;

    /// <summary>Roots of an expanded polynomial, polished by Horner evaluation with backward-error scale.</summary>
    /// <exception cref="ArgumentException">The polynomial is zero.</exception>
    /// <exception cref="RootFindingException">The roots do not pass their residual check.</exception>
    public static RootReport Find(Polynomial polynomial)
    {
        ArgumentNullException.ThrowIfNull(polynomial);
        if (polynomial.IsZero)
        {
            throw new ArgumentException("The zero polynomial has no finite root set.", nameof(polynomial));
        }

        // Exact roots at the origin (vanishing low coefficients) are taken out exactly: a multiple root at 0
        // cannot be verified by its residual, and there is nothing to polish.
        var c = polynomial.Ascending;
        var atOrigin = 0;
        while (c[atOrigin] == 0.0)
        {
            atOrigin++;
        }

        if (atOrigin == 0)
        {
            return Find(new ExpandedRootFunction(polynomial));
        }

        var rest = Polynomial.FromAscending(c.Skip(atOrigin));
        var report = rest.Degree == 0 ? new RootReport([], 0.0, 0.0) : Find(new ExpandedRootFunction(rest));
        return report with { Roots = ConjugateSymmetry.Canonical([.. report.Roots, .. Enumerable.Repeat(Complex.Zero, atOrigin)]) };
    }

    /// <summary>Roots of a function given in its accurate form.</summary>
    /// <exception cref="RootFindingException">The roots do not pass their residual check.</exception>
    public static RootReport Find(IRootFunction function)
    {
        ArgumentNullException.ThrowIfNull(function);
        if (function.Degree == 0)
        {
            return new RootReport([], 0.0, 0.0);
        }

        var (exact, rest) = function.Deflate();
        if (!exact.IsEmpty)
        {
            // Shared factors are roots as they stand (the function is exactly zero there); only the rest is
            // searched, and the evidence is taken on the whole function at every root.
            var found = rest.Degree == 0 ? ImmutableArray<Complex>.Empty : Find(rest).Roots;
            return Evidence(function, ConjugateSymmetry.Canonical([.. found, .. exact]));
        }

        var seedPolynomial = function.ExpandForSeeds();
        if (seedPolynomial.Degree != function.Degree)
        {
            throw new RootFindingException(
                $"Expanded polynomial has degree {seedPolynomial.Degree}, expected {function.Degree}: the leading coefficient vanished.");
        }

        var seeds = Seeds(seedPolynomial);
        var polished = new List<Complex>(function.Degree);
        var maxResidual = 0.0;
        var maxStep = 0.0;
        var failed = false;
        foreach (var seed in seeds)
        {
            var (root, residual, step) = Polish(function, seed, seeds);
            polished.Add(root);
            if (root.Imaginary != 0.0)
            {
                polished.Add(Complex.Conjugate(root));
            }

            failed |= !(residual <= ResidualLimit || step <= StepLimit);
            maxResidual = Math.Max(maxResidual, residual);
            maxStep = Math.Max(maxStep, step);
        }

        if (polished.Count != function.Degree)
        {
            throw new RootFindingException($"Found {polished.Count} roots for a function of degree {function.Degree}.");
        }

        if (failed)
        {
            // Expanded coefficients gave seeds too poor for independent polishing (clustered or Wilkinson-like
            // roots): refine them all together by Aberth–Ehrlich iteration on the accurate evaluation.
            return Simultaneous(function, polished);
        }

        return new RootReport(ConjugateSymmetry.Canonical(polished), maxResidual, maxStep);
    }

    /// <summary>
    /// Aberth–Ehrlich simultaneous iteration z ← z − N/(1 − N·Σⱼ 1/(z − zⱼ)), N = f/f′, on the accurate evaluation,
    /// then every root is checked as usual and the set made exactly conjugate-closed.
    /// </summary>
    private static RootReport Simultaneous(IRootFunction f, List<Complex> start)
    {
        var z = start.ToArray();
        var n = z.Length;

        // Separate exact duplicates so the correction terms stay finite.
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < i; j++)
            {
                if (z[i] == z[j])
                {
                    z[i] += new Complex(1e-7 * Math.Max(1, z[i].Magnitude), 1e-7 * Math.Max(1, z[i].Magnitude) * (i + 1));
                }
            }
        }

        for (var iteration = 0; iteration < 200; iteration++)
        {
            var largest = 0.0;
            for (var i = 0; i < n; i++)
            {
                var (v, d, _) = f.Evaluate(z[i]);
                if (v == Complex.Zero)
                {
                    continue;
                }

                var ratio = v / d;
                Complex sum = 0;
                for (var j = 0; j < n; j++)
                {
                    if (j != i)
                    {
                        sum += 1.0 / (z[i] - z[j]);
                    }
                }

                var w = ratio / (1.0 - (ratio * sum));
                if (double.IsFinite(w.Real) && double.IsFinite(w.Imaginary))
                {
                    z[i] -= w;
                    largest = Math.Max(largest, w.Magnitude / Math.Max(z[i].Magnitude, double.Epsilon));
                }
            }

            if (largest <= 1e-15)
            {
                break;
            }
        }

        // Pair each root with its nearest conjugate partner and symmetrize; real roots lose their tiny imaginary part.
        var used = new bool[n];
        var result = new List<Complex>(n);
        var order = Enumerable.Range(0, n).OrderBy(i => Math.Abs(z[i].Imaginary)).ToList();
        foreach (var i in order)
        {
            if (used[i])
            {
                continue;
            }

            used[i] = true;
            if (Math.Abs(z[i].Imaginary) <= 1e-9 * Math.Max(1, z[i].Magnitude))
            {
                result.Add(new Complex(z[i].Real, 0));
                continue;
            }

            var partner = -1;
            var best = double.PositiveInfinity;
            for (var j = 0; j < n; j++)
            {
                if (!used[j] && Complex.Abs(z[j] - Complex.Conjugate(z[i])) < best)
                {
                    best = Complex.Abs(z[j] - Complex.Conjugate(z[i]));
                    partner = j;
                }
            }

            if (partner < 0)
            {
                throw new RootFindingException("Simultaneous refinement left a complex root without its conjugate.");
            }

            used[partner] = true;
            var upper = 0.5 * (z[i] + Complex.Conjugate(z[partner]));
            upper = upper.Imaginary < 0 ? Complex.Conjugate(upper) : upper;
            result.Add(upper);
            result.Add(Complex.Conjugate(upper));
        }

        return Evidence(f, ConjugateSymmetry.Canonical(result));
    }

    /// <summary>Checks every root on the function itself and reports the largest relative residual and Newton step.</summary>
    private static RootReport Evidence(IRootFunction f, ImmutableArray<Complex> roots)
    {
        var maxResidual = 0.0;
        var maxStep = 0.0;
        foreach (var r in roots)
        {
            var (v, d, scale) = f.Evaluate(r);
            var residual = Relative(v, scale);
            var step = d == Complex.Zero ? (v == Complex.Zero ? 0.0 : double.PositiveInfinity) : Complex.Abs(v / d) / Math.Max(r.Magnitude, double.Epsilon);
            if (!(residual <= ResidualLimit || step <= StepLimit))
            {
                throw new RootFindingException(
                    $"A root near {r} failed its check (relative residual {residual:G3}, relative Newton step {step:G3}); the problem is too ill-conditioned.");
            }

            maxResidual = Math.Max(maxResidual, residual);
            maxStep = Math.Max(maxStep, step);
        }

        return new RootReport(roots, maxResidual, maxStep);
    }

    /// <summary>
    /// Seeds from the eigenvalues of the balanced companion matrix: the real ones and the upper half of
    /// the conjugate pairs (the lower half is implied).
    /// </summary>
    internal static List<Complex> Seeds(Polynomial p)
    {
        var n = p.Degree;
        var result = new List<Complex>(n);
        var c = p.Ascending;
        var lead = c[n];
        if (n == 1)
        {
            result.Add(new Complex(-c[0] / lead, 0.0));
            return result;
        }

        if (n == 2)
        {
            var b = c[1] / lead;
            var q = c[0] / lead;
            var disc = (b * b) - (4 * q);
            if (disc >= 0)
            {
                var t = -0.5 * (b + (Math.Sign(b == 0 ? 1.0 : b) * Math.Sqrt(disc)));
                var r1 = t;
                var r2 = t != 0.0 ? q / t : 0.0;
                result.Add(new Complex(r1, 0.0));
                result.Add(new Complex(r2, 0.0));
            }
            else
            {
                result.Add(new Complex(-b / 2, Math.Sqrt(-disc) / 2));
            }

            return result;
        }

        var a = new double[n, n];
        for (var j = 0; j < n; j++)
        {
            a[0, j] = -c[n - 1 - j] / lead;
            if (!double.IsFinite(a[0, j]) || Math.Abs(a[0, j]) > 1e150)
            {
                // The eigen-solver does not return on such matrices; no root of a real loop is this far out.
                throw new RootFindingException("The polynomial's coefficients span too many orders of magnitude to find its roots.");
            }
        }

        for (var i = 1; i < n; i++)
        {
            a[i, i - 1] = 1.0;
        }

        CompanionBalancer.Balance(a);
        var eig = Matrix<double>.Build.DenseOfArray(a).Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Asymmetric).EigenValues;
        if (eig.Any(e => !double.IsFinite(e.Real) || !double.IsFinite(e.Imaginary)))
        {
            throw new RootFindingException("The eigenvalue solve of the companion matrix did not converge.");
        }

        var uppers = new List<Complex>();
        var lowers = new List<Complex>();
        foreach (var e in eig)
        {
            if (e.Imaginary == 0.0)
            {
                result.Add(e);
            }
            else if (e.Imaginary > 0)
            {
                uppers.Add(e);
            }
            else
            {
                lowers.Add(e);
            }
        }

        // The eigen-solver returns exact conjugate pairs for a real matrix; if it did not, unmatched
        // members are taken as real seeds so that the count stays right.
        if (uppers.Count != lowers.Count)
        {
            uppers.Sort((x, y) => x.Imaginary.CompareTo(y.Imaginary));
            lowers.Sort((x, y) => y.Imaginary.CompareTo(x.Imaginary));
            while (uppers.Count > lowers.Count)
            {
                result.Add(new Complex(uppers[0].Real, 0.0));
                uppers.RemoveAt(0);
            }

            while (lowers.Count > uppers.Count)
            {
                result.Add(new Complex(lowers[0].Real, 0.0));
                lowers.RemoveAt(0);
            }
        }

        result.AddRange(uppers);
        return result;
    }

    /// <summary>
    /// Newton polishing of one seed on the accurate evaluation. Iterates while the steps shrink and keeps
    /// the best point by a rounding-aware measure |f| / (ε·(scale + |f′|·|x|)) (≤ 1 means the value is at rounding
    /// level: the point is within about an ulp of the root); a root that wanders more than half-way to another seed is taken back (it was converging onto
    /// a neighbour).
    /// </summary>
    private static (Complex Root, double Residual, double Step) Polish(IRootFunction f, Complex seed, List<Complex> seeds)
    {
        var isReal = seed.Imaginary == 0.0;
        var x = seed;
        var (v, d, scale) = f.Evaluate(x);
        var best = x;
        var bestMeasure = Measure(x, v, d, scale);
        var bestValue = (v, d, scale);
        var neighbour = NearestOtherSeed(seed, seeds);
        var previousStep = double.PositiveInfinity;
        for (var i = 0; i < MaxNewtonSteps && bestMeasure > 1.0; i++)
        {
            if (d == Complex.Zero)
            {
                break;
            }

            var step = v / d;
            var stepSize = Complex.Abs(step);
            if (!(stepSize < previousStep) && i > 2)
            {
                break;
            }

            previousStep = stepSize;
            var next = x - step;
            if (isReal)
            {
                next = new Complex(next.Real, 0.0);
            }

            if (Complex.Abs(next - seed) > 0.5 * neighbour || !double.IsFinite(next.Real) || !double.IsFinite(next.Imaginary))
            {
                break;
            }

            x = next;
            (v, d, scale) = f.Evaluate(x);
            var measure = Measure(x, v, d, scale);
            if (measure < bestMeasure)
            {
                best = x;
                bestMeasure = measure;
                bestValue = (v, d, scale);
            }
        }

        if (!isReal && Math.Abs(best.Imaginary) <= ConjugateSymmetry.RealTolerance * Complex.Abs(best))
        {
            // A pair that polished onto the real axis (a double real root): keep it a pair, marginally off.
            best = new Complex(best.Real, Math.Max(Math.Abs(best.Imaginary), double.Epsilon));
        }

        var (bv, bd, bs) = bestValue;
        var magnitude = Math.Max(Complex.Abs(best), double.Epsilon);
        var relativeStep = bd == Complex.Zero ? (bv == Complex.Zero ? 0.0 : double.PositiveInfinity) : Complex.Abs(bv / bd) / magnitude;
        return (best, Relative(bv, bs), relativeStep);
    }

    private static double Measure(Complex x, Complex value, Complex derivative, double scale) =>
        Complex.Abs(value) / ((2.2e-16 * (scale + (Complex.Abs(derivative) * Complex.Abs(x)))) + double.Epsilon);

    private static double NearestOtherSeed(Complex seed, List<Complex> seeds)
    {
        var nearest = double.PositiveInfinity;
        foreach (var other in seeds)
        {
            if (other == seed)
            {
                continue;
            }

            nearest = Math.Min(nearest, Complex.Abs(other - seed));
            if (other.Imaginary != 0.0)
            {
                nearest = Math.Min(nearest, Complex.Abs(Complex.Conjugate(other) - seed));
            }
        }

        if (seed.Imaginary != 0.0)
        {
            nearest = Math.Min(nearest, 2 * Math.Abs(seed.Imaginary));
        }

        return double.IsPositiveInfinity(nearest) ? Math.Max(Complex.Abs(seed), 1.0) : nearest;
    }

    private static double Relative(Complex value, double scale) =>
        scale > 0.0 ? Complex.Abs(value) / scale : (value == Complex.Zero ? 0.0 : double.PositiveInfinity);

    private sealed class ExpandedRootFunction(Polynomial p) : IRootFunction
    {
        private readonly Polynomial _derivative = p.Derivative();

        public int Degree => p.Degree;

        public Polynomial ExpandForSeeds() => p;

        public (Complex Value, Complex Derivative, double Scale) Evaluate(Complex s) =>
            (p.Evaluate(s), _derivative.Evaluate(s), p.EvaluateAbsolute(Complex.Abs(s)));
    }
}
