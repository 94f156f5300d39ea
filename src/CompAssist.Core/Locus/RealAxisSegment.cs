namespace CompAssist.Core.Locus;

/// <summary>A part of the real axis that belongs to the locus, from <see cref="From"/> to <see cref="To"/> (From &lt; To; infinite ends allowed).</summary>
/// <param name="From">Left end.</param>
/// <param name="To">Right end.</param>
public sealed record RealAxisSegment(double From, double To);
