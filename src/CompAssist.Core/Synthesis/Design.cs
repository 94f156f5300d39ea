using System.Collections.Immutable;
using CompAssist.Core.Analysis;
using CompAssist.Core.Model;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>A synthesized compensator with the reasoning that produced it.</summary>
/// <param name="Loop">The loop it was designed for.</param>
/// <param name="Target">The target pole the design places (moved along its ζ ray when a lag or PI required it).</param>
/// <param name="Compensator">The compensator.</param>
/// <param name="Placement">The lead placement strategy used, when there is a lead.</param>
/// <param name="Uncompensated">The angle and magnitude conditions of G·H at the target.</param>
/// <param name="AngleDeficiencyDegrees">Angle the compensator adds at the target (all stages).</param>
/// <param name="Notes">Plain statements about choices made (stages split, pole cancelled, ...).</param>
public sealed record Design(
    Loop Loop,
    TargetPole Target,
    Compensator Compensator,
    LeadPlacement? Placement,
    PointAnalysis Uncompensated,
    double AngleDeficiencyDegrees,
    ImmutableArray<string> Notes)
{
    /// <summary>Number of cascaded stages.</summary>
    public int StageCount => Compensator.Stages.Length;

    /// <summary>The target as requested, when the design moved it.</summary>
    public TargetPole? RequestedTarget { get; init; }

    /// <summary>The steady-state requirement and what it achieved, when one was given.</summary>
    public SteadyStateResult? SteadyState { get; init; }
}
