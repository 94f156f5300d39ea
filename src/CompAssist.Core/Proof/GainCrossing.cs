namespace CompAssist.Core.Proof;

/// <summary>
/// One gain crossover of the loop L (|L(jω)| = 1). Angles in degrees, frequency in rad/s, delay in seconds.
/// </summary>
/// <param name="Frequency">ωc, where |L(jωc)| = 1.</param>
/// <param name="PhaseDegrees">∠L(jωc) wrapped into (−360°, 0°].</param>
/// <param name="SignedMarginDegrees">180° + ∠L(jωc), in (−180°, 180°]: negative when L has passed −1 in the lag direction.</param>
/// <param name="DistanceDegrees">The angular distance from L(jωc) to −1 on the unit circle, |signed figure|, in [0°, 180°].</param>
/// <param name="DelayMargin">The extra lag that brings L(jωc) onto −1 (the signed figure taken modulo 360° into [0°, 360°)) divided by ωc.</param>
public sealed record GainCrossing(double Frequency, double PhaseDegrees, double SignedMarginDegrees, double DistanceDegrees, double DelayMargin);
