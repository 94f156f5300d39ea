namespace CompAssist.Core.Proof;

/// <summary>What the proof concludes about a loop and its requirements.</summary>
public enum VerdictKind
{
    /// <summary>The loop is stable and every requirement holds, nominally and at every variation corner.</summary>
    Meets,

    /// <summary>The nominal closed loop is unstable.</summary>
    Unstable,

    /// <summary>The nominal loop is stable but a requirement fails.</summary>
    RequirementFails,

    /// <summary>The nominal loop meets everything, but a variation corner is unstable.</summary>
    UnstableAtCorner,

    /// <summary>The nominal loop meets everything and every corner is stable, but a requirement fails at a corner.</summary>
    FailsAtCorner,
}
