namespace CompAssist.Core.Synthesis;

/// <summary>The family a compensator or one of its stages belongs to.</summary>
public enum CompensatorKind
{
    /// <summary>Phase lead: a zero to the right of a pole, both real and negative.</summary>
    Lead,

    /// <summary>Phase lag: a zero and a smaller pole near the origin; raises an error constant by their ratio.</summary>
    Lag,

    /// <summary>A lead for the transient followed by a lag for the steady state.</summary>
    LeadLag,

    /// <summary>Proportional-derivative: one zero (ideal, improper) or a zero with a filter pole.</summary>
    PD,

    /// <summary>Proportional-integral: a zero near the origin and an integrator.</summary>
    PI,

    /// <summary>Proportional-integral-derivative: PD × PI, with an optional derivative filter pole.</summary>
    PID,
}
