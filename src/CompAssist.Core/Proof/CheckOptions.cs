namespace CompAssist.Core.Proof;

/// <summary>Settings for <see cref="LoopCheck"/>.</summary>
public sealed record CheckOptions
{
    /// <summary>Number of sampling intervals of the simulated step (samples = intervals + 1).</summary>
    public int Intervals { get; init; } = 2000;

    /// <summary>Size of the reference step the actuator figures are scaled to (units of the reference).</summary>
    public double ReferenceStep { get; init; } = 1.0;

    /// <summary>Largest actuator command magnitude the hardware can deliver, if known.</summary>
    public double? ActuatorLimit { get; init; }
}
