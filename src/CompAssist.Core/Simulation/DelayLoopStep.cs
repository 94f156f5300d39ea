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

        // One realization from e: C₀G₀ (output z, before the forward delay), then H₀ (output q, fed back after θ).
        var forwardSystem = CascadeRealization.Of(forward);
        var whole = forwardSystem.Then(CascadeRealization.Of(h0));
        var zRow = Row.Of(forwardSystem, whole.Order);
        var qRow = Row.Of(whole, whole.Order);
        var uSystem = c0.IsProper ? CascadeRealization.Of(c0) : null;
        var uRow = uSystem is null ? null : Row.Of(uSystem, uSystem.Order);
        var sign = loop.SignFactor;

        // Left and right limits at t_k of q (a biproper loop passes its jumps around), and z and u after them.
        var qMinus = new double[steps + 1];
        var qPlus = new double[steps + 1];
        var z = new double[steps + 1];
        var u = uSystem is null ? null : new double[steps + 1];
        var loopHold = new Hold(whole, h);
        var uHold = uSystem is null ? null : new Hold(uSystem, h);
        var x = new double[whole.Order];
        var xu = new double[uSystem?.Order ?? 0];
        var ePlus = 1.0; // e(0⁺): the reference has stepped, nothing has come back yet
        for (var k = 0; ; k++)
        {
            var eMinus = k == 0 ? 0.0 : 1.0 - (sign * (k - m >= 0 ? qMinus[k - m] : 0.0));
            if (k > 0)
            {
                ePlus = 1.0 - (sign * (k - m >= 0 ? qPlus[k - m] : 0.0));
            }

            qPlus[k] = qRow.Value(x, ePlus);
            qMinus[k] = k == 0 ? 0.0 : qRow.Value(x, eMinus);
            z[k] = zRow.Value(x, ePlus);
            if (u is not null)
            {
                u[k] = uRow!.Value(xu, ePlus);
            }

            if (k == steps)
            {
                break;
            }

            // The input over [t_k, t_{k+1}] runs from e(t_k⁺) to e(t_{k+1}⁻), which is known: θ ≥ h.
            var next = 1.0 - (sign * (k + 1 - m >= 0 ? qMinus[k + 1 - m] : 0.0));
            loopHold.Advance(x, ePlus, next);
            uHold?.Advance(xu, ePlus, next);
        }

        var output = new SampledResponse(h, [.. z]).Delayed(forwardDelay);
        var effort = u is null ? null : new SampledResponse(h, [.. u]).Delayed(compensator.Delay);
        return new DelayLoopStep(output, effort);
    }

    /// <summary>One output row of a realization, y = C x + D e, over a state of a given length.</summary>
    private sealed class Row(double[] c, double d)
    {
        public static Row Of(StateSpace system, int length)
        {
            var c = new double[length];
            for (var i = 0; i < system.Order; i++)
            {
                c[i] = system.C(i);
            }

            return new Row(c, system.D);
        }

        public double Value(double[] x, double e)
        {
            var sum = d * e;
            for (var i = 0; i < x.Length; i++)
            {
                sum += c[i] * x[i];
            }

            return sum;
        }
    }

    /// <summary>The exact transition over h for an input linear between its values at the ends, applied in place.</summary>
    private sealed class Hold
    {
        private readonly double[,] _phi;
        private readonly double[] _start;
        private readonly double[] _ramp;
        private readonly double[] _scratch;

        public Hold(StateSpace system, double h)
        {
            // exp([[A h, B h, 0], [0, 0, 1], [0, 0, 0]]): Φ, Γ₀ = ∫₀ʰ e^{Aσ}B dσ and Γ₁ = (1/h)∫₀ʰ e^{A(h−τ)}B τ dτ.
            var n = system.Order;
            var m = new double[n + 2, n + 2];
            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    m[i, j] = system.A(i, j) * h;
                }

                m[i, n] = system.B(i) * h;
            }

            m[n, n + 1] = 1.0;
            var e = MatrixExponential.Of(m);
            _phi = new double[n, n];
            _start = new double[n];
            _ramp = new double[n];
            _scratch = new double[n];
            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    _phi[i, j] = e[i, j];
                }

                _start[i] = e[i, n];
                _ramp[i] = e[i, n + 1];
            }
        }

        /// <summary>x ← x(t + h) for the input going linearly from <paramref name="from"/> to <paramref name="to"/>.</summary>
        public void Advance(double[] x, double from, double to)
        {
            var n = x.Length;
            var slope = to - from;
            for (var i = 0; i < n; i++)
            {
                var sum = (_start[i] * from) + (_ramp[i] * slope);
                for (var j = 0; j < n; j++)
                {
                    sum += _phi[i, j] * x[j];
                }

                _scratch[i] = sum;
            }

            Array.Copy(_scratch, x, n);
        }
    }
}
