namespace CompAssist.Core.Discrete;

/// <summary>
/// One second-order section (b0 + b1 z⁻¹ + b2 z⁻²)/(1 + a1 z⁻¹ + a2 z⁻²); a first-order section has b2 = a2 = 0.
/// Implemented in transposed direct form II: y = b0 x + s1; s1 = b1 x − a1 y + s2; s2 = b2 x − a2 y.
/// </summary>
public sealed record Section(double B0, double B1, double B2, double A1, double A2);
