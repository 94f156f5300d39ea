namespace CompAssist.Core.Proof;

/// <summary>One measured figure beside its requirement and the second-order prediction.</summary>
/// <param name="Name">What is measured, e.g. "overshoot %".</param>
/// <param name="Measured">The simulated value.</param>
/// <param name="Required">The bound the user gave (upper bound), if any.</param>
/// <param name="Predicted">The second-order prediction, if any.</param>
public sealed record RequirementCheck(string Name, double Measured, double? Required, double? Predicted)
{
    /// <summary>Pass/fail against the requirement; null when none was given.</summary>
    public bool? Passes => Required is { } r ? Measured <= r * (1 + 1e-9) : null;
}
