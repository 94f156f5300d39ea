using CompAssist.Core.Discrete;

namespace CompAssist.Core.Export;

/// <summary>Choices for the hand-off to firmware.</summary>
public sealed record HandoffOptions
{
    /// <summary>Sample time in seconds; null to use the recommendation from the crossover frequency.</summary>
    public double? SampleTime { get; init; }

    /// <summary>Discretization method.</summary>
    public DiscretizationMethod Method { get; init; } = DiscretizationMethod.Tustin;

    /// <summary>Pre-warp frequency (rad/s) for <see cref="DiscretizationMethod.Prewarp"/>.</summary>
    public double? PrewarpFrequency { get; init; }

    /// <summary>Whether the firmware applies the command one sample after reading the measurement.</summary>
    public bool ComputationDelay { get; init; }

    /// <summary>How the firmware stores the coefficients (double, float, or fixed point for the analysis).</summary>
    public NumberFormat Format { get; init; } = NumberFormat.Double;

    /// <summary>Fractional bits of the fixed-point signals (default: half the word).</summary>
    public int? SignalFractionBits { get; init; }

    /// <summary>Anti-windup of the exported PID (PI, PD, PID designs); null when not chosen (clamping is used, and nothing is said when the design has no PID).</summary>
    public AntiWindup? AntiWindup { get; init; }

    /// <summary>True when the exported PID's derivative acts on the error (as the designed C(s) does) rather than on the measurement (the default: no kick on reference steps).</summary>
    public bool DerivativeOnError { get; init; }

    /// <summary>C identifier for the exported controller.</summary>
    public string Name { get; init; } = "compassist_ctrl";
}
