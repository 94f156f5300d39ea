namespace CompAssist.Core.Discrete;

/// <summary>A section with its coefficients as the firmware stores them.</summary>
/// <param name="Section">The quantized coefficient values (as reals).</param>
/// <param name="FractionalBits">For fixed point: fractional bits of this section's coefficients (the post-shift); 0 otherwise.</param>
/// <param name="Integers">For fixed point: the stored integers b0, b1, b2, a1, a2; empty otherwise.</param>
public sealed record QuantizedSection(Section Section, int FractionalBits, IReadOnlyList<long> Integers);
