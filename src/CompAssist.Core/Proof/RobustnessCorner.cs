using System.Collections.Immutable;

namespace CompAssist.Core.Proof;

/// <summary>One corner of the plant-variation box and what the loop does there.</summary>
/// <param name="Factors">The factor applied to each varied parameter (1 ± p/100), in the order given.</param>
/// <param name="Stable">Whether every closed-loop pole has a negative real part.</param>
/// <param name="OvershootPercent">Step overshoot (NaN when unstable).</param>
/// <param name="SettlingTime2Percent">2 % settling time (NaN when unstable).</param>
/// <param name="LeastDamping">Smallest ζ over the closed-loop poles.</param>
public sealed record RobustnessCorner(ImmutableArray<double> Factors, bool Stable, double OvershootPercent, double SettlingTime2Percent, double LeastDamping);
