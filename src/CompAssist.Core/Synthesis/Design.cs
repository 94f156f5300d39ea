using System.Collections.Immutable;
using CompAssist.Core.Analysis;
using CompAssist.Core.Model;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Synthesis;

/// <summary>A synthesized compensator with the reasoning that produced it.</summary>
/// <param name="Loop">The loop it was designed for.</param>
/// <param name="Target">The target pole.</param>
/// <param name="Compensator">The compensator.</param>
/// <param name="Placement">The placement strategy used.</param>
/// <param name="Uncompensated">The angle and magnitude conditions of G·H at the target.</param>
/// <param name="AngleDeficiencyDegrees">Angle the compensator adds at the target (all stages).</param>
/// <param name="Notes">Plain statements about choices made (stages split, pole cancelled, ...).</param>
public sealed record Design(
    Loop Loop,
    TargetPole Target,
    Compensator Compensator,
    LeadPlacement Placement,
    PointAnalysis Uncompensated,
    double AngleDeficiencyDegrees,
    ImmutableArray<string> Notes)
{
    /// <summary>Number of identical cascaded stages.</summary>
    public int StageCount => Compensator.Stages.Length;
}
