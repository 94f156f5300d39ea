using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Discrete;

/// <summary>What storing the coefficients in a number format does to the compensator.</summary>
/// <param name="Format">The format.</param>
/// <param name="Sections">The stored sections.</param>
/// <param name="Quantized">The compensator the stored coefficients implement.</param>
/// <param name="LargestPoleShift">Largest |p_quantized − p| over the poles (z-plane units).</param>
/// <param name="LargestZeroShift">Largest |z_quantized − z| over the zeros.</param>
/// <param name="DcGainChangePercent">Relative change of the DC gain in percent (NaN with an integrator).</param>
/// <param name="Warnings">Loud warnings with the fix.</param>
public sealed record QuantizationReport(
    NumberFormat Format,
    ImmutableArray<QuantizedSection> Sections,
    DiscreteTransferFunction Quantized,
    double LargestPoleShift,
    double LargestZeroShift,
    double DcGainChangePercent,
    ImmutableArray<string> Warnings)
{
    /// <summary>Tolerated DC-gain change before a warning, percent.</summary>
    public const double DcGainTolerancePercent = 1.0;

    /// <summary>Poles of the quantized compensator.</summary>
    public ImmutableArray<Complex> Poles => Quantized.Poles;
}
