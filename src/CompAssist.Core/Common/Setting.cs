namespace CompAssist.Core.Common;

/// <summary>
/// A setting a problem is about, typed, so that each front end can say where to change it (a command-line
/// flag, a case-file key, an editor field) while the core's messages name only the setting itself.
/// </summary>
public enum Setting
{
    /// <summary>The plant G(s).</summary>
    Plant,

    /// <summary>A compensator given to be proved (rather than designed).</summary>
    Compensator,

    /// <summary>An explicit target point.</summary>
    Target,

    /// <summary>The damping ratio and natural frequency of the target, given together.</summary>
    DampingAndNaturalFrequency,

    /// <summary>A steady-state requirement (error constant or steady-state error).</summary>
    SteadyState,

    /// <summary>The zero of the fixed-zero placement (or the plant pole to cancel).</summary>
    LeadZero,

    /// <summary>The pole of the fixed-pole placement.</summary>
    LeadPole,

    /// <summary>The pole/zero ratio of the ratio placement.</summary>
    LeadRatio,

    /// <summary>The lag/PI zero as a fraction of the target's real part.</summary>
    ZeroFraction,

    /// <summary>The derivative filter ratio of PD/PID.</summary>
    FilterRatio,

    /// <summary>The hand-off sample time.</summary>
    SampleTime,

    /// <summary>The pre-warping frequency of the Tustin method.</summary>
    PrewarpFrequency,

    /// <summary>The fractional bits of fixed-point signals.</summary>
    SignalFractionBits,

    /// <summary>The actuator limit.</summary>
    ActuatorLimit,
}
