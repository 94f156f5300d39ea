namespace CompAssist.Core.Editing;

/// <summary>An arrow-key direction on the s-plane picture (left is toward the left half-plane).</summary>
public enum MoveDirection
{
    /// <summary>Toward more negative real part (or larger ωn).</summary>
    Left,

    /// <summary>Toward the imaginary axis (or smaller ωn).</summary>
    Right,

    /// <summary>Upward: larger ωd (or smaller ζ).</summary>
    Up,

    /// <summary>Downward: smaller ωd (or larger ζ).</summary>
    Down,
}
