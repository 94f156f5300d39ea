using System.Collections.Immutable;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Search;

/// <summary>One evaluated candidate: its choices, its design and how it fares against the requirements.</summary>
/// <param name="Choice">The free choices.</param>
/// <param name="Design">The compensator synthesized for them by the angle and magnitude conditions.</param>
/// <param name="Stable">Whether the closed loop is stable.</param>
/// <param name="Meets">Whether every requirement holds with the search's margin.</param>
/// <param name="Violation">Sum of the relative shortfalls against the requirements (0 when it meets).</param>
/// <param name="Objective">The objective's value (lower is better).</param>
/// <param name="Checks">The requirement rows, measured on the exact solution.</param>
/// <param name="Order">The order of evaluation: the fixed tie-break key.</param>
public sealed record SearchCandidate(SearchChoice Choice, Design Design, bool Stable, bool Meets, double Violation, double Objective, ImmutableArray<RequirementCheck> Checks, int Order)
{
    /// <summary>
    /// False when no steady-state requirement is stated and the unit step does not settle within the settling
    /// band of the reference (a type-0 or unstable plant under a lead settles at 0.03 or 2.3): such a loop can meet
    /// overshoot and settling, both measured about its own final value, while not following the reference.
    /// </summary>
    public bool Tracks { get; init; } = true;

    /// <summary>
    /// The ranking key: meeting candidates that track first, then meeting ones that do not (both by objective),
    /// the others by violation; then by order.
    /// </summary>
    public (int Group, double Value, int Order) Rank => (Meets ? (Tracks ? 0 : 1) : 2, Meets ? Objective : Violation, Order);
}
