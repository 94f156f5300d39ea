using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Simulation;

/// <summary>
/// The unit-step response of a loop with its delays exact (no Padé approximant): the delay-differential loop
/// e(t) = r − (±) q(t − θ), with q = H₀·G₀·C₀ applied to e and θ the whole loop delay, stepped by the method of
/// steps on a grid h = θ/m. Over each step the rational part is advanced exactly for an input that is linear
/// between the grid values (first-order hold: one exponential of the augmented matrix), and the delayed values
/// fall exactly on the grid, with the jumps a biproper loop passes around it kept as left and right limits. The
/// only approximation is the linear input between grid points: its error is O(h²) in y, and h is chosen a
/// hundred-thousandth of the horizon or finer (and at most a twentieth of the fastest time constant).
/// </summary>
public sealed class DelayLoopStep
{
    /// <summary>The most grid steps spent on one response; beyond it the delay is negligible beside the horizon.</summary>
    public const int MaxSteps = 1_000_000;

    private DelayLoopStep(SampledResponse output, SampledResponse? effort)
    {
        Output = output;
        Effort = effort;
    }

    /// <summary>y(t) for a unit reference step (right limits at the samples).</summary>
    public SampledResponse Output { get; }

    /// <summary>u(t), the compensator's output; null when C alone is improper.</summary>
    public SampledResponse? Effort { get; }

    /// <summary>
    /// Simulates the loop over <paramref name="horizon"/> seconds, or returns null when it has no delay, when
    /// C·G₀ is improper, or when the delay is so short beside the horizon that the grid would need more than
    /// <see cref="MaxSteps"/> steps (the Padé approximant is then excellent).
    /// </summary>
    public static DelayLoopStep? Simulate(Loop loop, TransferFunction compensator, double horizon)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        var forwardDelay = compensator.Delay + loop.Plant.Delay;
        var theta = forwardDelay + loop.Feedback.Delay;
        if (!(theta > 0) || !(horizon > 0) || !double.IsFinite(horizon))
        {
            return null;
        }

        var c0 = compensator.WithoutDelay();
        var forward = c0 * loop.Plant.WithoutDelay();
        var h0 = loop.Feedback.WithoutDelay();
        if (!forward.IsProper)
        {
            return null;
        }

        var poles = forward.Poles.Concat(h0.Poles).Concat(c0.IsProper ? c0.Poles : []).ToList();
        var fastest = poles.Count > 0 ? poles.Max(p => p.Magnitude) : 0.0;
        var wanted = Math.Min(horizon / 100_000, fastest > 0 ? 0.05 / fastest : double.PositiveInfinity);
        var m = (int)Math.Min(Math.Ceiling(theta / wanted), int.MaxValue / 2.0);
        var h = theta / m;
        var steps = (int)Math.Min(Math.Ceiling(horizon / h), MaxSteps + 1.0);
        if (steps > MaxSteps)
        {
            return null;
        }

        var path = Series.Of(CascadeRealization.Of(forward), CascadeRealization.Of(h0));
        var sign = loop.SignFactor;

        // e_k^- and e_k^+ (left and right limits at t_k), q likewise; z = (C₀G₀)e before the forward delay.
        var eMinus = new double[steps + 1];
        var ePlus = new double[steps + 1];
        var qMinus = new double[steps + 1];
        var qPlus = new double[steps + 1];
        var z = new double[steps + 1];
        double Fed(double[] q, int j) => j < 0 ? 0.0 : q[j];

        var step = Hold.Of(path.A, path.B, h);
        var x = new double[path.Order];
        eMinus[0] = 1.0 - (sign * Fed(qMinus, -m));
        ePlus[0] = 1.0 - (sign * Fed(qPlus, -m));
        for (var k = 0; ; k++)
        {
            qPlus[k] = path.Feedback(x, ePlus[k]);
            qMinus[k] = k == 0 ? 0.0 : path.Feedback(x, eMinus[k]);
            z[k] = path.Forward(x, ePlus[k]);
            if (k == steps)
            {
                break;
            }

            eMinus[k + 1] = 1.0 - (sign * Fed(qMinus, k + 1 - m));
            ePlus[k + 1] = 1.0 - (sign * Fed(qPlus, k + 1 - m));
            x = step.Advance(x, ePlus[k], eMinus[k + 1]);
        }

        var output = Delayed(z, h, forwardDelay, steps);
        SampledResponse? effort = null;
        if (c0.IsProper)
        {
            var u = CascadeRealization.Of(c0);
            var uStep = Hold.Of(Series.Matrix(u), Series.Vector(u), h);
            var xu = new double[u.Order];
            var uz = new double[steps + 1];
            for (var k = 0; ; k++)
            {
                uz[k] = Series.Output(u, xu, ePlus[k]);
                if (k == steps)
                {
                    break;
                }

                xu = uStep.Advance(xu, ePlus[k], eMinus[k + 1]);
            }

            effort = Delayed(uz, h, compensator.Delay, steps);
        }

        return new DelayLoopStep(output, effort);
    }

    /// <summary>v(t − d) on the same grid (zero before d), linear between samples.</summary>
    private static SampledResponse Delayed(double[] v, double h, double d, int steps)
    {
        var values = ImmutableArray.CreateBuilder<double>(steps + 1);
        for (var k = 0; k <= steps; k++)
        {
            var t = (k * h) - d;
            if (t < -1e-12 * h)
            {
                values.Add(0.0);
                continue;
            }

            var j = t / h;
            var i = (int)Math.Floor(j + 1e-9);
            var f = j - i;
            values.Add(i >= steps ? v[steps] : f <= 1e-9 ? v[i] : ((1 - f) * v[i]) + (f * v[i + 1]));
        }

        return new SampledResponse(h, values.MoveToImmutable());
    }

    /// <summary>The exact transition over h for an input linear between its values at the ends.</summary>
    private sealed class Hold(double[,] phi, double[] start, double[] ramp)
    {
        public static Hold Of(double[,] a, double[] b, double h)
        {
            // exp([[A h, B h, 0], [0, 0, 1], [0, 0, 0]]): Φ, Γ₀ = ∫₀ʰ e^{Aσ}B dσ and Γ₁ = (1/h)∫₀ʰ e^{A(h−τ)}B τ dτ.
            var n = b.Length;
            var m = new double[n + 2, n + 2];
            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    m[i, j] = a[i, j] * h;
                }

                m[i, n] = b[i] * h;
            }

            m[n, n + 1] = 1.0;
            var e = MatrixExponential.Of(m);
            var phi = new double[n, n];
            var g0 = new double[n];
            var g1 = new double[n];
            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    phi[i, j] = e[i, j];
                }

                g0[i] = e[i, n];
                g1[i] = e[i, n + 1];
            }

            return new Hold(phi, g0, g1);
        }

        /// <summary>x(t + h) for the input going linearly from <paramref name="from"/> to <paramref name="to"/>.</summary>
        public double[] Advance(double[] x, double from, double to)
        {
            var n = x.Length;
            var next = new double[n];
            var slope = to - from;
            for (var i = 0; i < n; i++)
            {
                var sum = (start[i] * from) + (ramp[i] * slope);
                for (var j = 0; j < n; j++)
                {
                    sum += phi[i, j] * x[j];
                }

                next[i] = sum;
            }

            return next;
        }
    }

    /// <summary>C₀G₀ followed by H₀, with both outputs: z (before H₀) and q (after it).</summary>
    private sealed class Series
    {
        private double[] _cz = [];
        private double _dz;
        private double[] _cq = [];
        private double _dq;

        public double[,] A { get; private init; } = new double[0, 0];

        public double[] B { get; private init; } = [];

        public int Order => B.Length;

        public static Series Of(StateSpace forward, StateSpace feedback)
        {
            var whole = forward.Then(feedback);
            var n1 = forward.Order;
            var n = whole.Order;
            var cz = new double[n];
            for (var i = 0; i < n1; i++)
            {
                cz[i] = forward.C(i);
            }

            var cq = new double[n];
            for (var i = 0; i < n; i++)
            {
                cq[i] = whole.C(i);
            }

            return new Series { A = Matrix(whole), B = Vector(whole), _cz = cz, _dz = forward.D, _cq = cq, _dq = whole.D };
        }

        public static double[,] Matrix(StateSpace s)
        {
            var a = new double[s.Order, s.Order];
            for (var i = 0; i < s.Order; i++)
            {
                for (var j = 0; j < s.Order; j++)
                {
                    a[i, j] = s.A(i, j);
                }
            }

            return a;
        }

        public static double[] Vector(StateSpace s) => [.. Enumerable.Range(0, s.Order).Select(s.B)];

        public static double Output(StateSpace s, double[] x, double input)
        {
            var sum = s.D * input;
            for (var i = 0; i < x.Length; i++)
            {
                sum += s.C(i) * x[i];
            }

            return sum;
        }

        public double Forward(double[] x, double e) => Dot(_cz, x) + (_dz * e);

        public double Feedback(double[] x, double e) => Dot(_cq, x) + (_dq * e);

        private static double Dot(double[] a, double[] b)
        {
            var sum = 0.0;
            for (var i = 0; i < a.Length; i++)
            {
                sum += a[i] * b[i];
            }

            return sum;
        }
    }
}
