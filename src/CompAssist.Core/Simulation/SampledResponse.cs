using System.Collections.Immutable;

namespace CompAssist.Core.Simulation;

/// <summary>A response sampled at t = k·h, k = 0…N (t₀ = 0⁺, just after the step).</summary>
/// <param name="SampleTime">h in seconds.</param>
/// <param name="Values">Values at the samples.</param>
public sealed record SampledResponse(double SampleTime, ImmutableArray<double> Values)
{
    /// <summary>Time of sample k, seconds.</summary>
    public double TimeAt(int k) => k * SampleTime;

    /// <summary>The last sample time.</summary>
    public double Horizon => (Values.Length - 1) * SampleTime;
}
