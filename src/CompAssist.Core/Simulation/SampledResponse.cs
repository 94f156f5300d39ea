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

    /// <summary>The value at any t ≥ 0, linear between samples (the last value held beyond the horizon).</summary>
    public double ValueAt(double t)
    {
        var j = Math.Max(t, 0.0) / SampleTime;
        var i = (int)Math.Floor(j + 1e-9);
        if (i >= Values.Length - 1)
        {
            return Values[^1];
        }

        var f = j - i;
        return f <= 1e-9 ? Values[i] : Values[i] + (f * (Values[i + 1] - Values[i]));
    }

    /// <summary>The same response on another grid, t = k·h for k = 0…<paramref name="intervals"/>.</summary>
    public SampledResponse Resampled(double h, int intervals) =>
        new(h, [.. Enumerable.Range(0, intervals + 1).Select(k => ValueAt(k * h))]);

    /// <summary>The response delayed by <paramref name="delay"/> seconds on the same grid (zero before it).</summary>
    public SampledResponse Delayed(double delay) => delay == 0
        ? this
        : new(SampleTime, [.. Enumerable.Range(0, Values.Length).Select(k => (k * SampleTime) - delay < -1e-12 * SampleTime ? 0.0 : ValueAt((k * SampleTime) - delay))]);
}
