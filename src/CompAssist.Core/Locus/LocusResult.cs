using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Locus;

/// <summary>
/// The root locus of 1 + K·L(s) = 0 for K from 0 to ∞, L the open loop with the feedback sign folded in
/// (for positive feedback L = −C·G·H). Delays are by Padé (then <see cref="Approximate"/> is true).
/// </summary>
public sealed record LocusResult
{
    /// <summary>Every branch, points in increasing K, starting at an open-loop pole (K = 0).</summary>
    public required ImmutableArray<ImmutableArray<LocusPoint>> Branches { get; init; }

    /// <summary>Where each branch goes as K → ∞: a finite zero, or null when it follows an asymptote.</summary>
    public required ImmutableArray<Complex?> BranchEnds { get; init; }

    /// <summary>Open-loop poles (rational loop).</summary>
    public required ImmutableArray<Complex> Poles { get; init; }

    /// <summary>Open-loop zeros (rational loop).</summary>
    public required ImmutableArray<Complex> Zeros { get; init; }

    /// <summary>Asymptote centroid (NaN when there are no asymptotes).</summary>
    public required double Centroid { get; init; }

    /// <summary>Asymptote angles in degrees, in [0°, 360°).</summary>
    public required ImmutableArray<double> AsymptoteAnglesDegrees { get; init; }

    /// <summary>Parts of the real axis on the locus.</summary>
    public required ImmutableArray<RealAxisSegment> RealAxisSegments { get; init; }

    /// <summary>Break-away and break-in points with positive real gain.</summary>
    public required ImmutableArray<BreakPoint> BreakPoints { get; init; }

    /// <summary>Imaginary-axis crossings.</summary>
    public required ImmutableArray<AxisCrossing> AxisCrossings { get; init; }

    /// <summary>Departure angles at complex poles and arrival angles at complex zeros.</summary>
    public required ImmutableArray<BranchAngle> BranchAngles { get; init; }

    /// <summary>True when a delay was replaced by its Padé approximant.</summary>
    public required bool Approximate { get; init; }

    /// <summary>True for the 0° locus (positive feedback with a positive loop gain, or the reverse).</summary>
    public required bool ZeroDegreeLocus { get; init; }

    /// <summary>Continuation steps taken and eigenvalue re-seeds used (diagnostics).</summary>
    public required int Steps { get; init; }

    /// <summary>Number of eigenvalue solves: at the start, and at break points the local expansion could not cross.</summary>
    public required int Reseeds { get; init; }

    /// <summary>Break points crossed by the local expansion, without an eigenvalue solve (diagnostics).</summary>
    public required int ExpansionCrossings { get; init; }
}
