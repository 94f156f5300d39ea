namespace CompAssist.Core.Targets;

/// <summary>The tolerance band for settling time.</summary>
public enum SettlingBand
{
    /// <summary>Within ±2 % of the final value; ts ≈ 4/(ζωn) for the second-order envelope.</summary>
    TwoPercent = 2,

    /// <summary>Within ±5 % of the final value; ts ≈ 3/(ζωn) for the second-order envelope.</summary>
    FivePercent = 5,
}
