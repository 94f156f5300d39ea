using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Search;

/// <summary>The free choices of one candidate: the target and the kind's options.</summary>
/// <param name="Target">The target pole the compensator is placed for.</param>
/// <param name="Lead">Lead choices (placement, ratio, stage angle).</param>
/// <param name="Slow">Lag, PI and PID choices (slow-zero fraction, derivative filter).</param>
public sealed record SearchChoice(TargetPole Target, LeadOptions Lead, SlowPoleOptions Slow);
