using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Proof;

/// <summary>
/// The evidence that a compensated loop does what the design claims: the closed-loop characteristic
/// polynomial, all of its roots by root finding, the target confirmed as one of them, and the warnings that
/// decide whether the second-order prediction can be trusted.
/// </summary>
public sealed record LoopProof
{
    /// <summary>Relative residual below which the target counts as a closed-loop root.</summary>
    public const double TargetResidualLimit = 1e-9;

    /// <summary>Dominance ratio (other poles' decay over the target's) below which the prediction is doubtful (common practice: 5).</summary>
    public const double DominanceRule = 5.0;

    /// <summary>Characteristic polynomial coefficients, descending powers of s, monic.</summary>
    public required ImmutableArray<double> CharacteristicDescending { get; init; }

    /// <summary>Every closed-loop pole.</summary>
    public required ImmutableArray<ClosedLoopRoot> Roots { get; init; }

    /// <summary>Closed-loop zeros: zeros of C·G and poles of H.</summary>
    public required ImmutableArray<Complex> ClosedLoopZeros { get; init; }

    /// <summary>The relative residual of D + kN at the target in product form (CharacteristicFunction.RelativeResidual), delay by Padé.</summary>
    public required double TargetResidual { get; init; }

    /// <summary>|1 ± L(s*)| / (1 + |L(s*)|) with the delay exact (equal to <see cref="TargetResidual"/> without delay).</summary>
    public required double TargetResidualExactDelay { get; init; }

    /// <summary>Distance from the target to the nearest computed root, relative to |s*|.</summary>
    public required double TargetRootDistance { get; init; }

    /// <summary>Root-finding evidence: largest relative residual and Newton correction over all roots.</summary>
    public required RootReport RootEvidence { get; init; }

    /// <summary>
    /// Smallest decay rate of the non-dominant, non-cancelled poles over the target's decay rate
    /// (infinite when there are none).
    /// </summary>
    public required double DominanceRatio { get; init; }

    /// <summary>True when every closed-loop pole has a negative real part.</summary>
    public required bool Stable { get; init; }

    /// <summary>True when a delay was replaced by a Padé approximant for the roots.</summary>
    public required bool UsesPade { get; init; }

    /// <summary>Plain warnings for the engineer, most important first.</summary>
    public required ImmutableArray<string> Warnings { get; init; }

    /// <summary>True when the target is a closed-loop root to <see cref="TargetResidualLimit"/>.</summary>
    public bool TargetConfirmed => (UsesPade ? TargetResidualExactDelay : TargetResidual) <= TargetResidualLimit && TargetRootDistance <= 1e-6;
}
