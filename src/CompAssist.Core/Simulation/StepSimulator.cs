using System.Collections.Immutable;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Simulation;

/// <summary>
/// Unit-step responses that are exact at the sampling instants: the input is constant between samples,
/// so one matrix exponential of the augmented matrix [[A, B], [0, 0]]·h gives the exact transition
/// (Φ, Γ), and the response is the recursion x⁺ = Φx + Γ, y = Cx + D.
/// </summary>
public static class StepSimulator
{
    /// <summary>The unit-step response of <paramref name="system"/> at N + 1 samples spaced h apart.</summary>
    /// <exception cref="ArgumentOutOfRangeException">h is not positive or N is below 1.</exception>
    public static SampledResponse Step(StateSpace system, double sampleTime, int intervals)
    {
        ArgumentNullException.ThrowIfNull(system);
        if (!(sampleTime > 0) || !double.IsFinite(sampleTime))
        {
            throw new ArgumentOutOfRangeException(nameof(sampleTime), sampleTime, "The sample time must be positive.");
        }

        ArgumentOutOfRangeException.ThrowIfLessThan(intervals, 1);
        var n = system.Order;
        var (phi, gamma) = Discretize(system, sampleTime);
        var c = system.CopyC();

        // Φ of a cascade is block lower-triangular: each row keeps only its span of non-zero columns,
        // packed into one flat array for a tight inner loop.
        var start = new int[n];
        var offset = new int[n + 1];
        var packed = new List<double>(n * n);
        for (var i = 0; i < n; i++)
        {
            int first = n, last = -1;
            for (var j = 0; j < n; j++)
            {
                if (phi[i, j] != 0.0)
                {
                    first = Math.Min(first, j);
                    last = j;
                }
            }

            start[i] = first;
            offset[i] = packed.Count;
            for (var j = first; j <= last; j++)
            {
                packed.Add(phi[i, j]);
            }
        }

        offset[n] = packed.Count;
        var rows = packed.ToArray();
        var x = new double[n];
        var next = new double[n];
        var y = ImmutableArray.CreateBuilder<double>(intervals + 1);
        for (var k = 0; k <= intervals; k++)
        {
            var yk = system.D;
            for (var i = 0; i < n; i++)
            {
                yk += c[i] * x[i];
            }

            y.Add(yk);
            for (var i = 0; i < n; i++)
            {
                var row = rows.AsSpan(offset[i], offset[i + 1] - offset[i]);
                var state = x.AsSpan(start[i], row.Length);
                next[i] = gamma[i] + Dot(row, state);
            }

            (x, next) = (next, x);
        }

        return new SampledResponse(sampleTime, y.MoveToImmutable());
    }

    private static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        var sum = 0.0;
        var j = 0;
        if (System.Numerics.Vector.IsHardwareAccelerated && a.Length >= System.Numerics.Vector<double>.Count)
        {
            var acc = System.Numerics.Vector<double>.Zero;
            var width = System.Numerics.Vector<double>.Count;
            for (; j <= a.Length - width; j += width)
            {
                acc += new System.Numerics.Vector<double>(a[j..]) * new System.Numerics.Vector<double>(b[j..]);
            }

            sum = System.Numerics.Vector.Sum(acc);
        }

        for (; j < a.Length; j++)
        {
            sum += a[j] * b[j];
        }

        return sum;
    }

    /// <summary>(Φ, Γ) = (e^{Ah}, ∫₀ʰ e^{Aτ} dτ B) from one exponential of the augmented matrix.</summary>
    public static (double[,] Phi, double[] Gamma) Discretize(StateSpace system, double sampleTime)
    {
        ArgumentNullException.ThrowIfNull(system);
        var n = system.Order;
        var m = new double[n + 1, n + 1];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                m[i, j] = system.A(i, j) * sampleTime;
            }

            m[i, n] = system.B(i) * sampleTime;
        }

        var e = MatrixExponential.Of(m);
        var phi = new double[n, n];
        var gamma = new double[n];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                phi[i, j] = e[i, j];
            }

            gamma[i] = e[i, n];
        }

        return (phi, gamma);
    }
}
