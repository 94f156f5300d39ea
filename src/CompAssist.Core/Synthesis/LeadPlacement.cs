namespace CompAssist.Core.Synthesis;

/// <summary>How the zero and pole of a lead stage are placed, given the angle the stage must add.</summary>
public enum LeadPlacement
{
    /// <summary>Zero directly beneath the target (on the real axis at Re s*); the pole follows from the angle.</summary>
    Beneath,

    /// <summary>
    /// Zero and pole symmetric about the bisector of the angle between the horizontal through the target and
    /// the line to the origin; this gives the smallest pole/zero ratio for the angle (the least high-frequency
    /// gain growth; common practice).
    /// </summary>
    Bisector,

    /// <summary>Zero on a chosen stable real plant pole (cancelling it); the pole follows from the angle.</summary>
    Cancel,

    /// <summary>Zero at a given location; the pole follows from the angle.</summary>
    FixedZero,

    /// <summary>Pole at a given location; the zero follows from the angle.</summary>
    FixedPole,

    /// <summary>Pole/zero ratio given; both placed to add the angle.</summary>
    Ratio,
}
