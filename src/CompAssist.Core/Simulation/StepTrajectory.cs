using System.Numerics;

namespace CompAssist.Core.Simulation;

/// <summary>
/// The unit-step response of a realization, exact at every instant: the state is stepped by the exact
/// transition (Φ, Γ) of the augmented-matrix exponential on a multi-resolution grid — fine at the start
/// (a twentieth of the fastest pole's time constant), growing with t, never coarser than half a
/// radian of any oscillation that is still alive — and any instant between samples is reached by one more
/// exact transition from the sample before it. So the figures measured on it do not depend on a grid:
/// a fast rise beside a slow tail is resolved as well as either alone.
/// </summary>
internal sealed class StepTrajectory
{
    private const int SamplesPerDoubling = 32;

    /// <summary>
    /// The most samples a lightly damped oscillation may take at half a radian each (about 32,000 periods):
    /// beyond it the horizon is cut short (<see cref="Capped"/>) rather than the grid coarsened, which would
    /// alias the oscillation — a ζ of 1e-10 settles only after 4e10 s.
    /// </summary>
    public const int MaxOscillationSamples = 400_000;
    private readonly StateSpace _system;
    private readonly double[,] _a;
    private readonly double[] _b;
    private readonly double[] _c;
    private readonly double[] _ca;
    private readonly double _cb;
    private readonly List<double> _times = [];
    private readonly List<double[]> _states = [];
    private readonly List<double> _y = [];
    private readonly List<double> _dy = [];
    private List<(double[,] Phi, double[] Gamma, double H)> _levels = [];

    private StepTrajectory(StateSpace system)
    {
        _system = system;
        _a = system.CopyA();
        _b = system.CopyB();
        _c = system.CopyC();
        var n = system.Order;
        _ca = new double[n];
        for (var j = 0; j < n; j++)
        {
            var sum = 0.0;
            for (var i = 0; i < n; i++)
            {
                sum += _c[i] * _a[i, j];
            }

            _ca[j] = sum;
        }

        _cb = Dot(_c, _b);
    }

    /// <summary>Number of samples.</summary>
    public int Count => _times.Count;

    /// <summary>The last sample time (at or just beyond the asked horizon, or where <see cref="Capped"/> cut it).</summary>
    public double Horizon => _times[^1];

    /// <summary>True when the asked horizon was cut short to keep a lightly damped oscillation resolved.</summary>
    public bool Capped { get; private set; }

    /// <summary>Sample time k.</summary>
    public double Time(int k) => _times[k];

    /// <summary>y at sample k.</summary>
    public double Value(int k) => _y[k];

    /// <summary>dy/dt at sample k.</summary>
    public double Slope(int k) => _dy[k];

    /// <summary>Simulates the unit step from rest up to <paramref name="horizon"/> seconds.</summary>
    /// <param name="system">The realization.</param>
    /// <param name="poles">Its poles (they size the grid).</param>
    /// <param name="horizon">Simulated time, seconds (positive, finite).</param>
    public static StepTrajectory Simulate(StateSpace system, IReadOnlyCollection<Complex> poles, double horizon)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(poles);
        if (!(horizon > 0) || !double.IsFinite(horizon))
        {
            throw new ArgumentOutOfRangeException(nameof(horizon), horizon, "The horizon must be positive and finite.");
        }

        var trajectory = new StepTrajectory(system);
        var oscillations = poles.Where(p => p.Imaginary > 0).Select(p => (Decay: -p.Real, Frequency: p.Imaginary)).ToArray();
        foreach (var (decay, frequency) in oscillations)
        {
            // Alive (decay·t < 18) over the whole horizon and needing more than the sample budget: cut the horizon.
            var limit = MaxOscillationSamples * 0.5 / frequency;
            if (horizon > limit && decay * limit < 18.0)
            {
                horizon = limit;
                trajectory.Capped = true;
            }
        }

        var fastest = poles.Count > 0 ? poles.Max(p => p.Magnitude) : 0.0;
        var coarsest = horizon / 256.0;
        var h0 = fastest > 0 ? Math.Min(0.05 / fastest, coarsest) : coarsest;
        h0 = Math.Max(h0, horizon * Math.Pow(2, -26));
        var levels = new List<(double[,] Phi, double[] Gamma, double H)>();
        var (phi0, gamma0) = StepSimulator.Discretize(system, h0);
        levels.Add((phi0, gamma0, h0));

        var n = system.Order;
        var x = new double[n];
        var t = 0.0;
        trajectory.Record(t, x);
        while (t < horizon)
        {
            var wanted = Math.Min(Math.Max(h0, t / SamplesPerDoubling), coarsest);
            foreach (var (decay, frequency) in oscillations)
            {
                if (decay * t < 18.0)
                {
                    wanted = Math.Min(wanted, 0.5 / frequency);
                }
            }

            var level = 0;
            while (levels[level].H * 2 <= wanted * (1 + 1e-12))
            {
                if (level + 1 == levels.Count)
                {
                    levels.Add(Doubled(levels[level]));
                }

                level++;
            }

            var (phi, gamma, h) = levels[level];
            x = Apply(phi, gamma, x);
            t += h;
            trajectory.Record(t, x);
        }

        trajectory._levels = levels;
        return trajectory;
    }

    /// <summary>y, dy/dt and d²y/dt² at any instant in [0, horizon], exact (one transition from the sample before t).</summary>
    public (double Y, double Slope, double Curvature) At(double t)
    {
        var k = _times.BinarySearch(t);
        if (k < 0)
        {
            k = Math.Max(~k - 1, 0);
        }

        var x = Advance(_states[k], t - _times[k]);

        // ẋ = A x + B (unit input), y = C x + D, ẏ = C ẋ, ÿ = C A ẋ.
        var n = x.Length;
        var xdot = new double[n];
        for (var i = 0; i < n; i++)
        {
            var sum = _b[i];
            for (var j = 0; j < n; j++)
            {
                sum += _a[i, j] * x[j];
            }

            xdot[i] = sum;
        }

        return (Dot(_c, x) + _system.D, Dot(_c, xdot), Dot(_ca, xdot));
    }

    /// <summary>
    /// The state τ seconds after x, exactly: τ = Σ bⱼ·h₀·2ʲ + r with r &lt; h₀; the binary part by the stored
    /// level transitions (the steps commute: constant input), the remainder by the Taylor series of the
    /// transition, which converges fast because ‖A‖·r is small, summed until the terms vanish against the sum.
    /// </summary>
    private double[] Advance(double[] x, double tau)
    {
        if (!(tau > 0))
        {
            return x;
        }

        var h0 = _levels[0].H;
        var units = Math.Floor(tau / h0);
        var r = tau - (units * h0);
        for (var j = 0; units > 0 && j < 62; j++)
        {
            var bit = Math.IEEERemainder(units, 2.0) != 0;
            units = Math.Floor(units / 2.0);
            if (bit)
            {
                while (j >= _levels.Count)
                {
                    _levels.Add(Doubled(_levels[^1]));
                }

                x = Apply(_levels[j].Phi, _levels[j].Gamma, x);
            }
        }

        return r > 0 ? Taylor(x, r) : x;
    }

    private double[] Taylor(double[] x, double r)
    {
        // x(r) = x + Σₖ≥1 rᵏ/k!·Aᵏ⁻¹·(A x + B).
        var n = x.Length;
        var term = new double[n];
        var next = new double[n];
        var sum = (double[])x.Clone();
        for (var i = 0; i < n; i++)
        {
            var v = _b[i];
            for (var j = 0; j < n; j++)
            {
                v += _a[i, j] * x[j];
            }

            term[i] = r * v;
            sum[i] += term[i];
        }

        for (var k = 2; k < 60; k++)
        {
            double size = 0, scale = 0;
            for (var i = 0; i < n; i++)
            {
                var v = 0.0;
                for (var j = 0; j < n; j++)
                {
                    v += _a[i, j] * term[j];
                }

                next[i] = v * r / k;
                sum[i] += next[i];
                size += Math.Abs(next[i]);
                scale += Math.Abs(sum[i]);
            }

            (term, next) = (next, term);
            if (size <= 1e-17 * scale || size == 0)
            {
                break;
            }
        }

        return sum;
    }

    private void Record(double t, double[] x)
    {
        _times.Add(t);
        _states.Add(x);
        _y.Add(Dot(_c, x) + _system.D);
        _dy.Add(Dot(_ca, x) + _cb);
    }

    private static (double[,] Phi, double[] Gamma, double H) Doubled((double[,] Phi, double[] Gamma, double H) level)
    {
        // Φ(2h) = Φ(h)², Γ(2h) = Φ(h)·Γ(h) + Γ(h).
        var (phi, gamma, h) = level;
        var n = gamma.Length;
        var phi2 = new double[n, n];
        for (var i = 0; i < n; i++)
        {
            for (var k = 0; k < n; k++)
            {
                var pik = phi[i, k];
                if (pik == 0.0)
                {
                    continue;
                }

                for (var j = 0; j < n; j++)
                {
                    phi2[i, j] += pik * phi[k, j];
                }
            }
        }

        return (phi2, Apply(phi, gamma, gamma), 2 * h);
    }

    private static double[] Apply(double[,] phi, double[] gamma, double[] x)
    {
        // Φ of a cascade is block lower-triangular: stop each row at its last non-zero column.
        var n = x.Length;
        var next = new double[n];
        for (var i = 0; i < n; i++)
        {
            var sum = gamma[i];
            var last = n - 1;
            while (last > i && phi[i, last] == 0.0)
            {
                last--;
            }

            for (var j = 0; j <= last; j++)
            {
                sum += phi[i, j] * x[j];
            }

            next[i] = sum;
        }

        return next;
    }

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
