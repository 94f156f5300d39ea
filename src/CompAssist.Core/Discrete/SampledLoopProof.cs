using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Discrete;

/// <summary>The sampled loop: plant by zero-order hold, controller as discretized, optional computation delay.</summary>
/// <param name="ClosedLoopPoles">Closed-loop poles in the z-plane.</param>
/// <param name="LargestPoleMagnitude">max |z| over the poles (&lt; 1 for a stable loop).</param>
/// <param name="Step">The output at the sampling instants for a unit reference step.</param>
/// <param name="Metrics">Step figures measured on the samples.</param>
/// <param name="DelaySamples">Whole samples of loop delay included (plant delay rounded, plus the computation delay).</param>
/// <param name="Warnings">Plain warnings.</param>
public sealed record SampledLoopProof(
    ImmutableArray<Complex> ClosedLoopPoles,
    double LargestPoleMagnitude,
    SampledResponse Step,
    StepMetrics Metrics,
    int DelaySamples,
    ImmutableArray<string> Warnings)
{
    /// <summary>
    /// True when every closed-loop pole is inside the unit circle (decided on |z|² − 1 in the δ form, so a stable
    /// pole within rounding of the circle still counts, though |z| may print as 1).
    /// </summary>
    public bool Stable { get; init; } = LargestPoleMagnitude < 1.0;

    /// <summary>The s-plane equivalents ln(z)/T of the closed-loop poles (principal branch).</summary>
    public ImmutableArray<Complex> EquivalentSPlanePoles => [.. ClosedLoopPoles.Select(z => z == Complex.Zero ? new Complex(double.NegativeInfinity, 0) : Complex.Log(z) / Step.SampleTime)];
}
