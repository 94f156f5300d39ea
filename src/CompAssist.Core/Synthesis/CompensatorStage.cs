namespace CompAssist.Core.Synthesis;

/// <summary>
/// One first-order stage (s − zero)/(s − pole) of a compensator, without gain; either part may be absent
/// (an ideal derivative has no pole, a filter has no zero). Locations in rad/s.
/// </summary>
/// <param name="Kind">The stage's family.</param>
/// <param name="Zero">Real zero location, or null.</param>
/// <param name="Pole">Real pole location (0 for an integrator), or null.</param>
/// <param name="AngleAtTargetDegrees">The angle this stage adds at the target, degrees.</param>
public sealed record CompensatorStage(CompensatorKind Kind, double? Zero, double? Pole, double AngleAtTargetDegrees)
{
    /// <summary>Pole/zero ratio p/z (for a lead, &gt; 1; for a lag, &lt; 1); NaN when either is absent or zero.</summary>
    public double PoleZeroRatio => Zero is { } z && Pole is { } p && z != 0 ? p / z : double.NaN;
}
