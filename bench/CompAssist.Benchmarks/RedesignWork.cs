using System.Collections.Immutable;
using CompAssist.Core.Locus;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;
using CompAssist.Core.Synthesis;

namespace CompAssist.Benchmarks;

/// <summary>The work one key press triggers, as the front ends run it.</summary>
public static class RedesignWork
{
    public static object Run(BenchmarkLoop c)
    {
        var design = LeadDesigner.Design(c.Loop, c.Target, c.Options).Value!;
        var compensator = design.Compensator.TransferFunction;
        var proof = LoopProver.Prove(c.Loop, compensator, c.Target);
        var check = LoopCheck.Run(c.Loop, compensator, Poles(proof), new CheckOptions(), null, c.Target);
        return (check, LocusEngine.Compute(c.Loop, compensator));
    }

    public static object Step(BenchmarkLoop c, Design design, LoopProof proof)
    {
        var compensator = design.Compensator.TransferFunction;
        var poles = Poles(proof);
        var transfers = ClosedLoopTransfers.Of(c.Loop, compensator, poles);
        var h = LoopCheck.Horizon(poles) / 2000;
        var y = StepSimulator.Step(CascadeRealization.Of(transfers.Output), h, 2000);
        var u = StepSimulator.Step(CascadeRealization.Of(transfers.Effort!), h, 2000);
        return (y, u);
    }

    private static ImmutableArray<System.Numerics.Complex> Poles(LoopProof proof) => [.. proof.Roots.Select(r => r.Value)];
}
