using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Proof;

/// <summary>
/// Counts the closed-loop roots of 1 + L(s) = 0 in the open right half-plane by the argument principle on the
/// Nyquist contour, with the loop delay exact (Nyquist criterion Z = P + N, Franklin–Powell–Emami-Naeini,
/// ch. 6). The contour runs up the imaginary axis from the real axis to jR, around poles on the axis by
/// small half-circles to the right (a pole at the origin by a quarter circle from ε to jε), and closes by the
/// arc of radius R. R is chosen so that |L| &lt; 1/2 on and beyond the arc in the right half-plane (a bound
/// from the factor distances; |e^(−sT)| ≤ 1 there), so no root lies outside and 1 + L stays in the right
/// half-plane along the arc, whose contribution is then the change of the principal argument. By conjugate
/// symmetry the lower half of the contour adds as much as the upper half. The argument of 1 + L is followed
/// with steps under 0.3 rad (adaptive bisection), on a grid that resolves the delay's rotation and every
/// lightly damped pole and zero, so no full turn hides between two points.
/// </summary>
public static class NyquistCount
{
    private const double MaxArgStep = 0.3;
    private const int MaxEvaluations = 400_000;
    private const int MaxDepth = 48;
    private const double OnAxisLimit = 1e-10;
    private const int PointsPerDecade = 30;

    /// <summary>Counts the right-half-plane roots of 1 + L = 0 for the open loop L (sign folded in, delay exact).</summary>
    public static NyquistResult Count(TransferFunction open)
    {
        ArgumentNullException.ThrowIfNull(open);
        var roots = open.Poles.Concat(open.Zeros).Select(r => r.Magnitude).Where(m => m > 0).ToList();
        var largest = roots.Count > 0 ? roots.Max() : 1.0;
        var smallest = roots.Count > 0 ? roots.Min() : 1.0;
        bool IsOnAxis(Complex p) => p.Magnitude <= 1e-14 * largest || Math.Abs(p.Real) <= 1e-12 * p.Magnitude;
        var unstablePoles = open.Poles.Count(p => p.Real > 0 && !IsOnAxis(p));
        if (open.RelativeDegree < 0 || (open.RelativeDegree == 0 && open.Delay > 0 && Math.Abs(open.Gain) >= 0.999))
        {
            // Improper, or neutral: with |L(∞)| ≥ 1 and a delay, roots chain along the imaginary axis.
            return new NyquistResult(NyquistOutcome.Indeterminate, -1, unstablePoles, double.NaN, 0);
        }

        var radius = ClosingRadius(open, largest);
        var sweep = new Sweep(open);
        var originPole = open.Poles.Any(p => p.Magnitude <= 1e-14 * largest);
        var epsilon = 1e-6 * smallest;
        var axisPoles = open.Poles.Where(p => IsOnAxis(p) && p.Imaginary > 1e-14 * largest)
            .Select(p => p.Imaginary).Distinct().Order().ToList();

        var start = originPole ? epsilon : 0.0;
        if (originPole)
        {
            sweep.Run(theta => Complex.FromPolarCoordinates(epsilon, theta), Uniform(0.0, Math.PI / 2, 9), Midpoint);
        }
        else
        {
            sweep.Begin(Complex.Zero);
        }

        var grid = AxisGrid(open, start, radius, smallest);
        if (grid is null)
        {
            return sweep.Result(NyquistOutcome.Indeterminate, unstablePoles);
        }

        var from = start;
        foreach (var w0 in axisPoles.Where(w => w > start && w < radius))
        {
            var e0 = 1e-6 * w0;
            sweep.Run(w => new Complex(0.0, w), Between(grid, from, w0 - e0), AxisMidpoint);
            sweep.Run(theta => new Complex(0.0, w0) + Complex.FromPolarCoordinates(e0, theta), Uniform(-Math.PI / 2, Math.PI / 2, 9), Midpoint);
            from = w0 + e0;
        }

        sweep.Run(w => new Complex(0.0, w), Between(grid, from, radius), AxisMidpoint);
        if (open.Delay == 0)
        {
            sweep.Run(theta => Complex.FromPolarCoordinates(radius, theta), Uniform(Math.PI / 2, 0.0, 65), Midpoint);
        }
        else
        {
            // Along the arc 1 + L stays in the right half-plane: its argument returns to 0 on the real axis.
            sweep.Close();
        }

        if (sweep.Failed)
        {
            return sweep.Result(NyquistOutcome.Indeterminate, unstablePoles);
        }

        if (sweep.ClosestApproach < OnAxisLimit)
        {
            return sweep.Result(NyquistOutcome.OnAxis, unstablePoles);
        }

        var z = unstablePoles - (2.0 * sweep.Turn / (2.0 * Math.PI));
        var count = (int)Math.Round(z);
        return Math.Abs(z - count) > 0.2 || count < 0
            ? sweep.Result(NyquistOutcome.Indeterminate, unstablePoles)
            : sweep.Result(NyquistOutcome.Counted, unstablePoles, count);
    }

    /// <summary>R with |K|·Π(R + |z|)/Π(R − |p|) below 1/2 (or below (1 + |K|)/2 for a biproper loop): a bound on |L| for |s| ≥ R, Re s ≥ 0.</summary>
    private static double ClosingRadius(TransferFunction open, double largest)
    {
        var limit = open.RelativeDegree == 0 ? Math.Log((1.0 + Math.Abs(open.Gain)) / 2.0) : Math.Log(0.5);
        double LogBound(double r) =>
            Math.Log(Math.Abs(open.Gain)) + open.Zeros.Sum(z => Math.Log(r + z.Magnitude)) - open.Poles.Sum(p => Math.Log(r - p.Magnitude));

        var radius = 2.0 * largest;
        for (var i = 0; i < 400 && LogBound(radius) >= limit; i++)
        {
            radius *= 2.0;
        }

        return open.Delay == 0 ? Math.Max(radius, 1000.0 * largest) : radius;
    }

    /// <summary>ω from the start to R: log-spaced, linear at a quarter radian of delay rotation, dense around lightly damped roots.</summary>
    private static List<double>? AxisGrid(TransferFunction open, double start, double radius, double smallest)
    {
        var points = new List<double> { start, radius };
        var lo = Math.Max(start, 1e-6 * smallest);
        var count = Math.Max(50, (int)Math.Ceiling(Math.Log10(radius / lo) * PointsPerDecade));
        for (var i = 0; i <= count; i++)
        {
            points.Add(lo * Math.Pow(radius / lo, (double)i / count));
        }

        if (open.Delay > 0)
        {
            var step = 0.25 / open.Delay;
            var linear = radius / step;
            if (linear > MaxEvaluations / 2)
            {
                return null;
            }

            for (var i = 1; i < linear; i++)
            {
                points.Add(i * step);
            }
        }

        foreach (var r in open.Zeros.Concat(open.Poles).Where(r => r.Imaginary > 0))
        {
            var width = Math.Abs(r.Real);
            if (width < 0.3 * r.Imaginary && width > 0)
            {
                foreach (var k in (ReadOnlySpan<double>)[-8, -4, -2, -1, -0.5, -0.2, 0, 0.2, 0.5, 1, 2, 4, 8])
                {
                    points.Add(r.Imaginary + (k * width));
                }
            }
        }

        return [.. points.Where(w => w >= start && w <= radius).Distinct().Order()];
    }

    private static List<double> Between(List<double> grid, double from, double to)
    {
        var inside = grid.Where(w => w > from && w < to).ToList();
        inside.Insert(0, from);
        inside.Add(to);
        return inside;
    }

    private static List<double> Uniform(double from, double to, int count) =>
        [.. Enumerable.Range(0, count).Select(i => from + ((to - from) * i / (count - 1)))];

    private static double Midpoint(double a, double b) => 0.5 * (a + b);

    private static double AxisMidpoint(double a, double b) => a > 0 && b > 2 * a ? Math.Sqrt(a * b) : 0.5 * (a + b);

    /// <summary>Follows arg(1 + L) along the contour, accumulating its change.</summary>
    private sealed class Sweep(TransferFunction open)
    {
        private double lastArg;
        private bool started;

        public double Turn { get; private set; }

        public double ClosestApproach { get; private set; } = double.PositiveInfinity;

        public bool Failed { get; private set; }

        public int Evaluations { get; private set; }

        public NyquistResult Result(NyquistOutcome outcome, int unstablePoles, int count = -1) =>
            new(outcome, outcome == NyquistOutcome.Counted ? count : -1, unstablePoles, ClosestApproach, Evaluations);

        public void Begin(Complex s)
        {
            lastArg = Evaluate(s).Arg;
            started = true;
        }

        /// <summary>Adds the change of the principal argument from the last point back to the positive real axis.</summary>
        public void Close()
        {
            var principal = Math.IEEERemainder(lastArg, 2 * Math.PI);
            if (Math.Abs(principal) >= Math.PI / 2)
            {
                Failed = true; // the bound did not hold: 1 + L left the right half-plane at the closing radius
            }

            Turn -= principal;
        }

        public void Run(Func<double, Complex> at, List<double> parameters, Func<double, double, double> midpoint)
        {
            if (Failed || parameters.Count == 0)
            {
                return;
            }

            var previous = (T: parameters[0], Arg: Evaluate(at(parameters[0])).Arg);
            if (started)
            {
                Turn += Math.IEEERemainder(previous.Arg - lastArg, 2 * Math.PI);
            }

            started = true;
            var pending = new Stack<(double T, double Arg, int Depth)>();
            for (var i = parameters.Count - 1; i >= 1; i--)
            {
                var t = parameters[i];
                pending.Push((t, double.NaN, 0));
            }

            while (pending.Count > 0 && !Failed)
            {
                var (t, arg, depth) = pending.Pop();
                if (double.IsNaN(arg))
                {
                    arg = Evaluate(at(t)).Arg;
                }

                var step = Math.IEEERemainder(arg - previous.Arg, 2 * Math.PI);
                if (Math.Abs(step) > MaxArgStep && depth < MaxDepth)
                {
                    var m = midpoint(previous.T, t);
                    if (m > Math.Min(previous.T, t) && m < Math.Max(previous.T, t))
                    {
                        pending.Push((t, arg, depth + 1));
                        pending.Push((m, double.NaN, depth + 1));
                        continue;
                    }
                }

                if (Math.Abs(step) > 2.5)
                {
                    Failed = true; // a turn of about π that cannot be resolved: a root on or next to the contour
                }

                Turn += step;
                previous = (t, arg);
                if (Evaluations > MaxEvaluations)
                {
                    Failed = true;
                }
            }

            lastArg = previous.Arg;
        }

        /// <summary>arg(1 + L(s)) (not wrapped) from the factor products, rescaled against overflow.</summary>
        private (double Arg, double Relative) Evaluate(Complex s)
        {
            Evaluations++;
            var (nr, ni, ne) = Product(open.Zeros, s);
            var (dr, di, de) = Product(open.Poles, s);
            var logMag = Math.Log(Math.Abs(open.Gain))
                + (0.5 * Math.Log(((nr * nr) + (ni * ni)) / ((dr * dr) + (di * di))))
                + ((ne - de) * Math.Log(2.0))
                - (open.Delay * s.Real);
            var phase = Math.Atan2((ni * dr) - (nr * di), (nr * dr) + (ni * di)) + (open.Gain < 0 ? Math.PI : 0.0) - (open.Delay * s.Imaginary);
            double arg, relative;
            if (double.IsNaN(logMag))
            {
                Failed = true;
                return (0.0, double.NaN);
            }

            if (logMag < 0)
            {
                var l = Complex.FromPolarCoordinates(Math.Exp(logMag), phase);
                var v = 1.0 + l;
                (arg, relative) = (v.Phase, v.Magnitude / (1.0 + l.Magnitude));
            }
            else
            {
                // 1 + L = L·(1 + 1/L)
                var inverse = Complex.FromPolarCoordinates(Math.Exp(-logMag), -phase);
                var v = 1.0 + inverse;
                (arg, relative) = (phase + v.Phase, v.Magnitude / (1.0 + inverse.Magnitude));
            }

            ClosestApproach = Math.Min(ClosestApproach, relative);
            return (arg, relative);
        }

        private static (double Re, double Im, int Exponent) Product(System.Collections.Immutable.ImmutableArray<Complex> roots, Complex s)
        {
            double re = 1.0, im = 0.0;
            var exponent = 0;
            foreach (var r in roots)
            {
                var fr = s.Real - r.Real;
                var fi = s.Imaginary - r.Imaginary;
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
    }
}
