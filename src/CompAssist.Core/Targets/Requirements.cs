using System.Numerics;

namespace CompAssist.Core.Targets;

/// <summary>
/// What the closed loop must achieve, as given by the user. Any subset may be set; <see cref="TargetSelector"/>
/// turns them into a target pole. Times in seconds, frequencies in rad/s.
/// </summary>
public sealed record Requirements
{
    /// <summary>Largest acceptable percent overshoot for a step (0 &lt; value &lt; 100).</summary>
    public double? MaxOvershootPercent { get; init; }

    /// <summary>Largest acceptable settling time, in the band <see cref="Band"/>.</summary>
    public double? MaxSettlingTime { get; init; }

    /// <summary>Band for <see cref="MaxSettlingTime"/>.</summary>
    public SettlingBand Band { get; init; } = SettlingBand.TwoPercent;

    /// <summary>Largest acceptable peak time.</summary>
    public double? MaxPeakTime { get; init; }

    /// <summary>Damping ratio given directly.</summary>
    public double? Zeta { get; init; }

    /// <summary>Natural frequency given directly.</summary>
    public double? NaturalFrequency { get; init; }

    /// <summary>A steady-state requirement (smallest error constant), for lag, lead-lag, PI and PID designs.</summary>
    public ErrorRequirement? Constant { get; init; }

    /// <summary>An explicit target point (overrides the region corner; the region is still checked).</summary>
    public Complex? Point { get; init; }
}
