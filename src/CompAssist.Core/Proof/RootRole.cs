namespace CompAssist.Core.Proof;

/// <summary>What a closed-loop pole means for the step response.</summary>
public enum RootRole
{
    /// <summary>The target pole or its conjugate.</summary>
    Dominant,

    /// <summary>Any other pole that shapes the response.</summary>
    Other,

    /// <summary>A pole sitting on a closed-loop zero (a cancelled mode: invisible in the reference step, not in disturbances).</summary>
    Cancelled,
}
