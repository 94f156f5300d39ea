using BenchmarkDotNet.Attributes;
using CompAssist.Core.Locus;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;

namespace CompAssist.Benchmarks;

/// <summary>One redesign after a key press and each of its parts, for loops of order 4, 10 and 20.</summary>
[MemoryDiagnoser]
public class RedesignBenchmarks
{
    private BenchmarkLoop _case = null!;
    private Design _design = null!;
    private LoopProof _proof = null!;

    [Params(4, 10, 20)]
    public int Order { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _case = BenchmarkLoop.OfOrder(Order);
        _design = LeadDesigner.Design(_case.Loop, _case.Target, _case.Options).Value!;
        _proof = LoopProver.Prove(_case.Loop, _design.Compensator.TransferFunction, _case.Target);
    }

    [Benchmark(Description = "whole redesign")]
    public object Redesign() => RedesignWork.Run(_case);

    [Benchmark(Description = "synthesis")]
    public object Synthesis() => LeadDesigner.Design(_case.Loop, _case.Target, _case.Options);

    [Benchmark(Description = "closed-loop roots + proof")]
    public object Roots() => LoopProver.Prove(_case.Loop, _design.Compensator.TransferFunction, _case.Target);

    [Benchmark(Description = "step (2000 samples, y and u)")]
    public object Step() => RedesignWork.Step(_case, _design, _proof);

    [Benchmark(Description = "locus")]
    public object Locus() => LocusEngine.Compute(_case.Loop, _design.Compensator.TransferFunction);

    [Benchmark(Description = "margins")]
    public object Margins() => MarginAnalyzer.Analyze(_case.Loop, _design.Compensator.TransferFunction);
}
