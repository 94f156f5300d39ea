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
                var sum = gamma[i];
                for (var j = 0; j < n; j++)
                {
                    sum += phi[i, j] * x[j];
                }

                next[i] = sum;
            }

            (x, next) = (next, x);
        }

        return new SampledResponse(sampleTime, y.MoveToImmutable());
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
