namespace CompAssist.Core.Proof;

/// <summary>
/// The closed-loop roots of 1 + L(s) = 0 in the open right half-plane, counted by the Nyquist criterion
/// (Z = P + N, Franklin–Powell–Emami-Naeini, ch. 6) with the delay exact.
/// </summary>
/// <param name="Outcome">Whether the count completed.</param>
/// <param name="RightHalfPlaneRoots">Z, when <paramref name="Outcome"/> is <see cref="NyquistOutcome.Counted"/>; else −1.</param>
/// <param name="OpenLoopUnstablePoles">P, the open-loop poles with positive real part.</param>
/// <param name="ClosestApproach">The least |1 + L| / (1 + |L|) met on the contour (0 when a root sits on it).</param>
/// <param name="Evaluations">How many times L was evaluated.</param>
public sealed record NyquistResult(NyquistOutcome Outcome, int RightHalfPlaneRoots, int OpenLoopUnstablePoles, double ClosestApproach, int Evaluations)
{
    /// <summary>True when the count completed with no closed-loop root in the closed right half-plane.</summary>
    public bool Stable => Outcome == NyquistOutcome.Counted && RightHalfPlaneRoots == 0;
}
