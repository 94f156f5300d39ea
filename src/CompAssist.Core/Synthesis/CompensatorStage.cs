namespace CompAssist.Core.Synthesis;

/// <summary>
/// One first-order stage (s − zero)/(s − pole) of a compensator, without gain. Locations in rad/s.
/// </summary>
/// <param name="Kind">The stage's family.</param>
/// <param name="Zero">Real zero location (negative for a minimum-phase stage).</param>
/// <param name="Pole">Real pole location.</param>
/// <param name="AngleAtTargetDegrees">The angle this stage adds at the target, degrees.</param>
public sealed record CompensatorStage(CompensatorKind Kind, double Zero, double Pole, double AngleAtTargetDegrees)
{
    /// <summary>Pole/zero ratio p/z (for a lead, &gt; 1: the pole is that many times farther left).</summary>
    public double PoleZeroRatio => Pole / Zero;
}
