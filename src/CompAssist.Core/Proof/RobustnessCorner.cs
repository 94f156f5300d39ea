using System.Collections.Immutable;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Proof;

/// <summary>One corner of the plant-variation box and what the loop does there.</summary>
/// <param name="Factors">The factor applied to each varied parameter (1 ± p/100), in the order given.</param>
/// <param name="Stable">Whether every closed-loop pole has a negative real part.</param>
/// <param name="Step">The measured step at this corner (null when unstable or the roots failed).</param>
/// <param name="Checks">The requirement rows at this corner, judged as the nominal loop is.</param>
/// <param name="LeastDamping">Smallest ζ over the closed-loop poles.</param>
public sealed record RobustnessCorner(ImmutableArray<double> Factors, bool Stable, StepMetrics? Step, ImmutableArray<RequirementCheck> Checks, double LeastDamping)
{
    /// <summary>Step overshoot (NaN when unstable).</summary>
    public double OvershootPercent => Step?.OvershootPercent ?? double.NaN;

    /// <summary>2 % settling time (NaN when unstable).</summary>
    public double SettlingTime2Percent => Step?.SettlingTime2Percent ?? double.NaN;

    /// <summary>True when the corner is stable and every requirement row with a bound passes.</summary>
    public bool Meets => Stable && Checks.All(c => c.Passes != false);

    /// <summary>The rows that fail here.</summary>
    public IEnumerable<RequirementCheck> Failing => Checks.Where(c => c.Passes == false);
}
