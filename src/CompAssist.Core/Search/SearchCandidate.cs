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
    /// <summary>The ranking key: meeting candidates first by objective, the others by violation, then by order.</summary>
    public (int Group, double Value, int Order) Rank => (Meets ? 0 : 1, Meets ? Objective : Violation, Order);
}
