namespace CompAssist.Core.Simulation;

/// <summary>
/// A continuous system driven by an input held constant over each sampling period [jT, (j+1)T), advanced exactly
/// (one matrix exponential per distinct step length, <see cref="StepSimulator.Discretize"/>) and read at fixed
/// offsets inside every period. A reading at offset 0 is the left limit: it sees the previous period's input in the
/// feedthrough, as a measurement taken before the new command is applied.
/// </summary>
internal sealed class HeldInputTrack
{
    private readonly int _n;
    private readonly double[] _c;
    private readonly double _d;
    private readonly double[] _offsets;
    private readonly (double[,] Phi, double[] Gamma)[] _steps;
    private readonly double[] _x;
    private readonly double[] _next;
    private double _previousInput;

    /// <param name="system">The realization.</param>
    /// <param name="period">T, seconds.</param>
    /// <param name="offsets">Reading offsets in [0, T), ascending.</param>
    public HeldInputTrack(StateSpace system, double period, IReadOnlyList<double> offsets)
    {
        _n = system.Order;
        _c = system.CopyC();
        _d = system.D;
        _offsets = [.. offsets];
        _x = new double[_n];
        _next = new double[_n];
        var cache = new Dictionary<double, (double[,], double[])>();
        (double[,], double[]) For(double length)
        {
            if (!cache.TryGetValue(length, out var step))
            {
                step = length > 0 ? StepSimulator.Discretize(system, length) : (Identity(_n), new double[_n]);
                cache[length] = step;
            }

            return step;
        }

        // Lengths from one reading to the next, the last one to the end of the period.
        _steps = new (double[,], double[])[_offsets.Length + 1];
        var at = 0.0;
        for (var i = 0; i < _offsets.Length; i++)
        {
            _steps[i] = For(_offsets[i] - at);
            at = _offsets[i];
        }

        _steps[^1] = For(period - at);
    }

    /// <summary>The output now, at the start of the coming period (the left limit: the previous input in the feedthrough).</summary>
    public double ReadNow()
    {
        var y = _previousInput * _d;
        for (var c = 0; c < _n; c++)
        {
            y += _c[c] * _x[c];
        }

        return y;
    }

    /// <summary>Advances one period under <paramref name="input"/>, writing the readings at the offsets into <paramref name="readings"/>.</summary>
    public void Advance(double input, Span<double> readings)
    {
        for (var i = 0; i <= _offsets.Length; i++)
        {
            var (phi, gamma) = _steps[i];
            for (var r = 0; r < _n; r++)
            {
                var sum = gamma[r] * input;
                for (var c = 0; c < _n; c++)
                {
                    sum += phi[r, c] * _x[c];
                }

                _next[r] = sum;
            }

            Array.Copy(_next, _x, _n);
            if (i < _offsets.Length)
            {
                var y = (_offsets[i] == 0 ? _previousInput : input) * _d;
                for (var c = 0; c < _n; c++)
                {
                    y += _c[c] * _x[c];
                }

                readings[i] = y;
            }
        }

        _previousInput = input;
    }

    private static double[,] Identity(int n)
    {
        var m = new double[n, n];
        for (var i = 0; i < n; i++)
        {
            m[i, i] = 1.0;
        }

        return m;
    }
}
