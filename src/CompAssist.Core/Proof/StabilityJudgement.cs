namespace CompAssist.Core.Proof;

/// <summary>Whether a closed loop is stable, and on what evidence.</summary>
/// <param name="Stable">True when every closed-loop root lies in the open left half-plane by every route used.</param>
/// <param name="UnstableRootCount">Closed-loop roots in the closed right half-plane (the exact-delay count when there is one and it finds any).</param>
/// <param name="ExactDelay">The exact-delay Nyquist count, for a loop with a delay; else null.</param>
/// <param name="Note">Why the routes disagree, or why the exact count is missing; else null.</param>
public sealed record StabilityJudgement(bool Stable, int UnstableRootCount, NyquistResult? ExactDelay, string? Note);
