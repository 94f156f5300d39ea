namespace CompAssist.Core.Discrete;

/// <summary>The storage kinds of <see cref="NumberFormat"/>.</summary>
public enum NumberFormatKind
{
    /// <summary>IEEE 754 double.</summary>
    Double,

    /// <summary>IEEE 754 single.</summary>
    Float,

    /// <summary>Signed fixed point.</summary>
    Fixed,
}
