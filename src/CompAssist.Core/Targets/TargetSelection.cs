using System.Collections.Immutable;

namespace CompAssist.Core.Targets;

/// <summary>The chosen target pole, how it was chosen, and the region it was chosen from.</summary>
/// <param name="Target">The target pole.</param>
/// <param name="Source">How it was chosen, in words.</param>
/// <param name="Constraints">The region's boundaries with the target's margin against each.</param>
public sealed record TargetSelection(TargetPole Target, string Source, ImmutableArray<RegionConstraint> Constraints)
{
    /// <summary>True when every constraint holds at the target.</summary>
    public bool InsideRegion => Constraints.All(c => c.Satisfied);
}
