namespace CompAssist.Core.Synthesis;

/// <summary>The family a compensator or one of its stages belongs to.</summary>
public enum CompensatorKind
{
    /// <summary>Phase lead: a zero to the right of a pole, both real and negative.</summary>
    Lead,
}
