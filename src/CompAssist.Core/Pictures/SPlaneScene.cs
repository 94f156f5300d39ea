using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Pictures;

/// <summary>What an s-plane picture shows.</summary>
public sealed record SPlaneScene
{
    /// <summary>Locus branches as polylines.</summary>
    public ImmutableArray<ImmutableArray<Complex>> Branches { get; init; } = [];

    /// <summary>Open-loop poles (×).</summary>
    public ImmutableArray<Complex> Poles { get; init; } = [];

    /// <summary>Open-loop zeros (○).</summary>
    public ImmutableArray<Complex> Zeros { get; init; } = [];

    /// <summary>Closed-loop poles of the design (■).</summary>
    public ImmutableArray<Complex> ClosedLoopPoles { get; init; } = [];

    /// <summary>The target pole (◆), drawn with its conjugate.</summary>
    public Complex? Target { get; init; }

    /// <summary>A damping-ratio guide: the rays at ζ from the origin.</summary>
    public double? ZetaGuide { get; init; }

    /// <summary>A natural-frequency guide: the arc |s| = ωn in the left half-plane.</summary>
    public double? NaturalFrequencyGuide { get; init; }
}
