namespace CompAssist.Core.Export;

/// <summary>How the integral stops winding up while the actuator is saturated.</summary>
public enum AntiWindup
{
    /// <summary>Conditional integration: the integral is frozen while the output is clamped and the error would push it further.</summary>
    Clamping,

    /// <summary>Back-calculation: the integral is driven by (u_saturated − u)/Tt, Tt the tracking time.</summary>
    BackCalculation,

    /// <summary>None (for comparison only; not for hardware).</summary>
    None,
}
