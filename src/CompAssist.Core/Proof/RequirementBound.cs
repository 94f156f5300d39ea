namespace CompAssist.Core.Proof;

/// <summary>Which side of its bound a requirement keeps the measured figure.</summary>
public enum RequirementBound
{
    /// <summary>The figure must not exceed the bound (overshoot, settling time, peak time, effort).</summary>
    AtMost,

    /// <summary>The figure must reach at least the bound (an error constant).</summary>
    AtLeast,
}
