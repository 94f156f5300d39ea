namespace CompAssist.Core.Synthesis;

/// <summary>Choices for a lead design. Locations in rad/s on the real axis (negative numbers).</summary>
public sealed record LeadOptions
{
    /// <summary>Default largest angle one stage may add, in degrees (common practice: about 60°).</summary>
    public const double DefaultMaxStageAngleDegrees = 60.0;

    /// <summary>Largest number of identical stages the designer will cascade.</summary>
    public const int MaxStages = 4;

    /// <summary>Placement strategy.</summary>
    public LeadPlacement Placement { get; init; } = LeadPlacement.Bisector;

    /// <summary>The zero for <see cref="LeadPlacement.FixedZero"/>; for <see cref="LeadPlacement.Cancel"/>, the plant pole to cancel.</summary>
    public double? Zero { get; init; }

    /// <summary>The pole for <see cref="LeadPlacement.FixedPole"/>.</summary>
    public double? Pole { get; init; }

    /// <summary>Pole/zero ratio p/z &gt; 1 for <see cref="LeadPlacement.Ratio"/>.</summary>
    public double? Ratio { get; init; }

    /// <summary>Largest angle per stage in degrees; more needs identical cascaded stages.</summary>
    public double MaxStageAngleDegrees { get; init; } = DefaultMaxStageAngleDegrees;
}
