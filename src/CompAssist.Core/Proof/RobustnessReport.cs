using System.Collections.Immutable;

namespace CompAssist.Core.Proof;

/// <summary>The loop over every corner of the plant-variation box.</summary>
/// <param name="Variations">What was varied.</param>
/// <param name="Corners">Every corner (2ⁿ for n variations).</param>
public sealed record RobustnessReport(ImmutableArray<PlantVariation> Variations, ImmutableArray<RobustnessCorner> Corners)
{
    /// <summary>True when every corner is stable.</summary>
    public bool AllStable => Corners.All(c => c.Stable);

    /// <summary>Largest overshoot over the stable corners.</summary>
    public double WorstOvershootPercent => Corners.Where(c => c.Stable).Select(c => c.OvershootPercent).DefaultIfEmpty(double.NaN).Max();

    /// <summary>Longest 2 % settling time over the stable corners.</summary>
    public double WorstSettlingTime2Percent => Corners.Where(c => c.Stable).Select(c => c.SettlingTime2Percent).DefaultIfEmpty(double.NaN).Max();

    /// <summary>Smallest damping ratio over all corners.</summary>
    public double LeastDamping => Corners.Select(c => c.LeastDamping).DefaultIfEmpty(double.NaN).Min();
}
