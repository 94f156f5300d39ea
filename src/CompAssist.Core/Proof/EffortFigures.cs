namespace CompAssist.Core.Proof;

/// <summary>Actuator command for a reference step of the configured size.</summary>
/// <param name="Initial">u(0⁺); infinite when the compensator is improper (an impulse).</param>
/// <param name="Peak">Largest |u| over the simulated horizon (infinite when improper).</param>
/// <param name="PeakTime">When the peak occurs, seconds.</param>
/// <param name="ReferenceStep">The step size the figures are scaled to.</param>
/// <param name="Limit">The actuator limit, if given.</param>
public sealed record EffortFigures(double Initial, double Peak, double PeakTime, double ReferenceStep, double? Limit)
{
    /// <summary>True when a limit is given and the peak exceeds it.</summary>
    public bool Saturates => Limit is { } l && Peak > l;
}
