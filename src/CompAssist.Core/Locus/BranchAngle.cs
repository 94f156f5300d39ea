using System.Numerics;

namespace CompAssist.Core.Locus;

/// <summary>The angle at which a branch leaves a complex pole (departure) or reaches a complex zero (arrival).</summary>
/// <param name="At">The pole or zero (upper half-plane member of its pair).</param>
/// <param name="AngleDegrees">The angle, degrees, wrapped to (−180°, 180°].</param>
/// <param name="IsDeparture">True at a pole, false at a zero.</param>
public sealed record BranchAngle(Complex At, double AngleDegrees, bool IsDeparture);
