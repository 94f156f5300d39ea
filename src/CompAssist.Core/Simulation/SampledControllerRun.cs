using System.Collections.Immutable;

namespace CompAssist.Core.Simulation;

/// <summary>What <see cref="SampledControllerLoop.Run"/> recorded.</summary>
/// <param name="Output">The plant output y, h = T/s apart from t = 0 to NT.</param>
/// <param name="Commands">The command the law returned at each sampling instant kT (absolute actuator units).</param>
/// <param name="Measurements">The measurement the law was given at each sampling instant.</param>
public sealed record SampledControllerRun(SampledResponse Output, ImmutableArray<double> Commands, ImmutableArray<double> Measurements);
