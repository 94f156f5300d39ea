using System.Numerics;

namespace CompAssist.Core.Locus;

/// <summary>A break-away or break-in point: a multiple closed-loop root, and the gain where it occurs.</summary>
/// <param name="Point">Where branches meet and leave.</param>
/// <param name="Gain">The gain K &gt; 0 there.</param>
public sealed record BreakPoint(Complex Point, double Gain);
