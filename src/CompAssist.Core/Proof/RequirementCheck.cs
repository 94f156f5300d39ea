namespace CompAssist.Core.Proof;

/// <summary>One measured figure beside its requirement and the second-order prediction.</summary>
/// <param name="Name">What is measured, e.g. "overshoot %".</param>
/// <param name="Measured">The simulated value.</param>
/// <param name="Required">The bound the user gave, if any.</param>
/// <param name="Predicted">The second-order prediction, if any.</param>
/// <param name="Bound">Which side of <paramref name="Required"/> the figure must stay on.</param>
/// <param name="Valid">False when the figure means nothing (an unstable loop): a bounded check then never passes.</param>
public sealed record RequirementCheck(string Name, double Measured, double? Required, double? Predicted, RequirementBound Bound = RequirementBound.AtMost, bool Valid = true)
{
    /// <summary>Pass/fail against the requirement; null when none was given. Never true for an invalid (unstable) figure.</summary>
    public bool? Passes => Required is { } r
        ? Valid && (Bound == RequirementBound.AtMost ? Measured <= r + (1e-9 * Math.Abs(r)) : Measured >= r - (1e-9 * Math.Abs(r)))
        : null;

    /// <summary>The bound as people write it, e.g. "≤ 10" or "≥ 4".</summary>
    public string BoundSymbol => Bound == RequirementBound.AtMost ? "≤" : "≥";
}
