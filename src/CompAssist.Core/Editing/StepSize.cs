namespace CompAssist.Core.Editing;

/// <summary>The size of one target move.</summary>
public enum StepSize
{
    /// <summary>About a tenth of the target's distance from the origin, rounded to 1, 2 or 5 × 10ⁿ; ζ by 0.05.</summary>
    Coarse,

    /// <summary>A tenth of the coarse step; ζ by 0.01.</summary>
    Fine,
}
