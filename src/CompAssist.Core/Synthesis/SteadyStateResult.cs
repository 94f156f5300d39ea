using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>The error constant a design asked for and what it achieved.</summary>
/// <param name="Requirement">The requirement.</param>
/// <param name="Before">The constant before the lag/PI was added.</param>
/// <param name="After">The constant of the final design.</param>
public sealed record SteadyStateResult(ErrorRequirement Requirement, double Before, double After)
{
    /// <summary>True when the final constant meets the requirement.</summary>
    public bool Met => After >= Requirement.Value * (1 - 1e-9);
}
