namespace CompAssist.Core.Search;

/// <summary>One compensator kind's best result when several kinds are searched (a row of the comparison).</summary>
/// <param name="Kind">The kind's name as the case file writes it (lead, lag, lead-lag, pd, pi, pid).</param>
/// <param name="Meets">Whether its best candidate meets every requirement.</param>
/// <param name="Objective">The objective of its best candidate (lower is better), NaN when it was refused.</param>
/// <param name="Violation">The summed relative shortfall of its best candidate (0 when it meets), NaN when refused.</param>
/// <param name="Refusal">Why nothing of this kind could be designed, or null.</param>
/// <param name="UnusedChoices">Stated free choices that do not apply to this kind (setting names).</param>
public sealed record KindResult(string Kind, bool Meets, double Objective, double Violation, string? Refusal, string UnusedChoices);
