namespace CompAssist.Core.Locus;

/// <summary>A gain at which closed-loop roots sit on the imaginary axis at ±jω (stability boundary).</summary>
/// <param name="Gain">K &gt; 0.</param>
/// <param name="Frequency">ω ≥ 0, rad/s.</param>
public sealed record AxisCrossing(double Gain, double Frequency);
