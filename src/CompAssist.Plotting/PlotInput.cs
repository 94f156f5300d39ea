using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Locus;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;

namespace CompAssist.Plotting;

/// <summary>Everything a plot may draw, taken from a design or a check.</summary>
/// <param name="Title">Plot title prefix (the case name, or empty).</param>
/// <param name="Loop">The loop.</param>
/// <param name="Compensator">The compensator.</param>
/// <param name="ClosedLoopPoles">Verified closed-loop poles.</param>
/// <param name="ClosedLoopZeros">Closed-loop zeros.</param>
/// <param name="Target">The target pole, when there is one.</param>
/// <param name="Check">Step, margins, effort.</param>
/// <param name="Locus">The locus of the compensated loop.</param>
public sealed record PlotInput(
    string Title,
    Loop Loop,
    TransferFunction Compensator,
    ImmutableArray<Complex> ClosedLoopPoles,
    ImmutableArray<Complex> ClosedLoopZeros,
    Complex? Target,
    LoopCheckReport Check,
    LocusResult Locus);
