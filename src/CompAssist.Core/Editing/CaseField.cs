namespace CompAssist.Core.Editing;

/// <summary>The case values a front end edits as text, one field each (see <see cref="CaseFieldText"/>).</summary>
public enum CaseField
{
    /// <summary>Plant G(s), an expression (delays as exp(-T*s)).</summary>
    Plant,

    /// <summary>Sensor H(s), an expression.</summary>
    Feedback,

    /// <summary>Feedback sign: "-" (negative) or "+" (positive).</summary>
    Sign,

    /// <summary>Padé order used for delays in root finding (1…10).</summary>
    PadeOrder,

    /// <summary>Largest step overshoot, percent.</summary>
    Overshoot,

    /// <summary>Largest settling time, seconds.</summary>
    SettlingTime,

    /// <summary>Settling band, 2 or 5 percent.</summary>
    Band,

    /// <summary>Largest peak time, seconds.</summary>
    PeakTime,

    /// <summary>Damping ratio ζ.</summary>
    Zeta,

    /// <summary>Natural frequency ωn, rad/s.</summary>
    NaturalFrequency,

    /// <summary>Steady-state requirement, e.g. "kv=20" or "ramp_error=0.05".</summary>
    ErrorConstant,

    /// <summary>Largest actuator command magnitude.</summary>
    ActuatorLimit,

    /// <summary>Plant variations for the robustness sweep, comma-separated (e.g. "gain=20%, pole=-5:15%").</summary>
    Variations,

    /// <summary>The placement's own number: the fixed zero, the fixed pole, the pole/zero ratio, or the pole to cancel.</summary>
    PlacementValue,

    /// <summary>Largest 10–90 % rise time, s (checked on the simulated loop).</summary>
    RiseTime,

    /// <summary>Smallest phase margin, degrees.</summary>
    MinPhaseMargin,

    /// <summary>Smallest gain margin, dB (upward, and downward where the loop has one).</summary>
    MinGainMargin,

    /// <summary>Smallest delay margin, s.</summary>
    MinDelayMargin,

    /// <summary>Largest sensitivity peak Ms.</summary>
    MaxSensitivity,
}
