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

    /// <summary>Largest acceptable 10–90 % rise time, s (a requirement on the simulated loop; it does not shape the region).</summary>
    public double? MaxRiseTime { get; init; }

    /// <summary>Smallest acceptable phase margin, degrees.</summary>
    public double? MinPhaseMarginDegrees { get; init; }

    /// <summary>Smallest acceptable gain margin in dB, upward and (where the loop has one) downward.</summary>
    public double? MinGainMarginDb { get; init; }

    /// <summary>Smallest acceptable delay margin, s.</summary>
    public double? MinDelayMargin { get; init; }

    /// <summary>Largest acceptable sensitivity peak Ms = max |1/(1 + L)| (e.g. 2 for a 6 dB peak).</summary>
    public double? MaxSensitivityPeak { get; init; }

    /// <summary>True when a requirement needs the margins of the loop.</summary>
    public bool NeedsMargins => MinPhaseMarginDegrees is not null || MinGainMarginDb is not null || MinDelayMargin is not null || MaxSensitivityPeak is not null;

    /// <summary>Damping ratio given directly.</summary>
    public double? Zeta { get; init; }

    /// <summary>Natural frequency given directly.</summary>
    public double? NaturalFrequency { get; init; }

    /// <summary>A steady-state requirement (smallest error constant), for lag, lead-lag, PI and PID designs.</summary>
    public ErrorRequirement? Constant { get; init; }

    /// <summary>An explicit target point (overrides the region corner; the region is still checked).</summary>
    public Complex? Point { get; init; }
}
