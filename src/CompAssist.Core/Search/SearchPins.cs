namespace CompAssist.Core.Search;

/// <summary>
/// Free choices the user stated for this run, which the search keeps as given instead of varying them
/// (a firmware constraint such as a fixed derivative filter, or a plant pole the user wants cancelled).
/// </summary>
[Flags]
public enum SearchPins
{
    /// <summary>Every free choice is searched.</summary>
    None = 0,

    /// <summary>The lead placement (and its zero or pole).</summary>
    Placement = 1,

    /// <summary>The lead pole/zero ratio.</summary>
    Ratio = 2,

    /// <summary>The largest angle per lead stage.</summary>
    StageAngle = 4,

    /// <summary>The lag/PI zero's fraction of σ.</summary>
    ZeroFraction = 8,

    /// <summary>The lag ratio's safety factor.</summary>
    LagMargin = 16,

    /// <summary>The PD/PID derivative filter ratio.</summary>
    FilterRatio = 32,
}
