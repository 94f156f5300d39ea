using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Workflow;

/// <summary>A complete, proved design: how the target was chosen, the design and its proof.</summary>
/// <param name="Selection">Target and region.</param>
/// <param name="Design">The synthesized compensator and its reasoning.</param>
/// <param name="Proof">The closed-loop evidence.</param>
public sealed record DesignReport(TargetSelection Selection, Design Design, LoopProof Proof);
