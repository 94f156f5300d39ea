namespace CompAssist.Core.Targets;

/// <summary>
/// One boundary of the admissible s-plane region and where the chosen target sits against it.
/// </summary>
/// <param name="Name">Short name: "overshoot", "settling", "peak time".</param>
/// <param name="Description">The boundary in words and symbols, e.g. "ζ ≥ 0.591 (overshoot ≤ 10 %)".</param>
/// <param name="Required">The bound on the pole quantity (ζ, σ or ωd).</param>
/// <param name="Actual">The target's value of that quantity.</param>
/// <param name="Margin">Actual − Required (≥ 0 inside the region), in the quantity's units.</param>
public sealed record RegionConstraint(string Name, string Description, double Required, double Actual, double Margin)
{
    /// <summary>True when the target meets this bound (to rounding).</summary>
    public bool Satisfied => Margin >= -1e-9 * Math.Max(1.0, Math.Abs(Required));
}
