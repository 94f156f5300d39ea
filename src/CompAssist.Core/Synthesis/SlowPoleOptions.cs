namespace CompAssist.Core.Synthesis;

/// <summary>Choices for the slow zero of a lag or PI and for the PID's derivative filter.</summary>
public sealed record SlowPoleOptions
{
    /// <summary>The lag/PI zero sits at this fraction of the target's real part (common practice: about 0.1).</summary>
    public double ZeroFraction { get; init; } = 0.1;

    /// <summary>Largest angle (degrees, magnitude) the lag/PI may cost at the target (common practice: a few degrees).</summary>
    public double AngleBudgetDegrees { get; init; } = 5.0;

    /// <summary>Safety factor on the lag ratio, because the re-solved gain comes out slightly lower.</summary>
    public double Margin { get; init; } = 1.1;

    /// <summary>
    /// Lead-lag only: the equal-factor variant (the gain fixed first by the error constant, lead and lag with
    /// the same ratio) instead of independent lead and lag factors.
    /// </summary>
    public bool EqualFactor { get; init; }

    /// <summary>Derivative filter: the filter pole at this multiple of the PD zero (N); null for the ideal derivative.</summary>
    public double? FilterRatio { get; init; }
}
