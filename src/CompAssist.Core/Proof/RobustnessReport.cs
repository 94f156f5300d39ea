using System.Collections.Immutable;
using System.Globalization;

namespace CompAssist.Core.Proof;

/// <summary>The loop over every corner of the plant-variation box.</summary>
/// <param name="Variations">What was varied.</param>
/// <param name="Corners">Every corner (2ⁿ for n variations).</param>
public sealed record RobustnessReport(ImmutableArray<PlantVariation> Variations, ImmutableArray<RobustnessCorner> Corners)
{
    /// <summary>True when every corner is stable.</summary>
    public bool AllStable => Corners.All(c => c.Stable);

    /// <summary>True when every corner is stable and meets every requirement.</summary>
    public bool AllMeet => Corners.All(c => c.Meets);

    /// <summary>Largest overshoot over the stable corners.</summary>
    public double WorstOvershootPercent => Corners.Where(c => c.Stable).Select(c => c.OvershootPercent).DefaultIfEmpty(double.NaN).Max();

    /// <summary>Longest 2 % settling time over the stable corners.</summary>
    public double WorstSettlingTime2Percent => Corners.Where(c => c.Stable).Select(c => c.SettlingTime2Percent).DefaultIfEmpty(double.NaN).Max();

    /// <summary>Smallest damping ratio over all corners.</summary>
    public double LeastDamping => Corners.Select(c => c.LeastDamping).DefaultIfEmpty(double.NaN).Min();

    /// <summary>For each failing requirement, the corner where it fails worst (stable corners only).</summary>
    public IEnumerable<(RobustnessCorner Corner, RequirementCheck Row)> WorstFailures()
    {
        var failing = Corners.Where(c => c.Stable).SelectMany(c => c.Failing.Select(row => (Corner: c, Row: row)));
        foreach (var group in failing.GroupBy(f => f.Row.Name))
        {
            yield return group.First().Row.Bound == RequirementBound.AtMost
                ? group.MaxBy(f => f.Row.Measured)
                : group.MinBy(f => f.Row.Measured);
        }
    }

    /// <summary>A corner as people read it, e.g. "gain ×1.2, pole -5 ×0.85".</summary>
    public string Describe(RobustnessCorner corner)
    {
        ArgumentNullException.ThrowIfNull(corner);
        return string.Join(", ", Variations.Select((v, i) => $"{v.Subject} ×{corner.Factors[i].ToString("G4", CultureInfo.InvariantCulture)}"));
    }
}
