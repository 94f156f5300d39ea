namespace CompAssist.Core.Proof;

/// <summary>Settings for <see cref="LoopCheck"/>.</summary>
public sealed record CheckOptions
{
    /// <summary>Number of sampling intervals of the simulated step (samples = intervals + 1).</summary>
    public int Intervals { get; init; } = 2000;

    /// <summary>Size of the reference step the actuator figures are scaled to (units of the reference).</summary>
    public double ReferenceStep { get; init; } = 1.0;

    /// <summary>Largest actuator command magnitude the hardware can deliver, if known (the limits −L … L).</summary>
    public double? ActuatorLimit { get; init; }

    /// <summary>The actuator's lowest and highest command in absolute units (0 … 100 % for a heater), if known; instead of <see cref="ActuatorLimit"/>.</summary>
    public CommandRange? OutputLimits { get; init; }

    /// <summary>The operating-point command u0 (absolute actuator units) the plant model holds about; the linear design's command is added to it.</summary>
    public double OperatingPoint { get; init; }

    /// <summary>The absolute limits: <see cref="OutputLimits"/>, or ±<see cref="ActuatorLimit"/>; null when neither is known.</summary>
    public CommandRange? AbsoluteLimits => OutputLimits ?? (ActuatorLimit is { } l && l > 0 && double.IsFinite(l) ? CommandRange.Symmetric(l) : null);

    /// <summary>The room the linear design's command has: the absolute limits less u0; null when no limit is known.</summary>
    public CommandRange? CommandRoom => AbsoluteLimits is { } a && a.Contains(OperatingPoint) ? a.RelativeTo(OperatingPoint) : null;
}
