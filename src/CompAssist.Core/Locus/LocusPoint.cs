using System.Numerics;

namespace CompAssist.Core.Locus;

/// <summary>One point of a locus branch: the gain K (multiplying the whole open loop) and the root there.</summary>
/// <param name="Gain">K ≥ 0.</param>
/// <param name="Root">The closed-loop root at that gain, rad/s.</param>
public readonly record struct LocusPoint(double Gain, Complex Root);
