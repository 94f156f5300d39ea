using System.Collections.Immutable;
using BenchmarkDotNet.Running;
using CompAssist.Benchmarks;

if (args.Length == 2 && args[0] == "--write-cases")
{
    // Case files of the benchmark loops, for timing the real editor in a terminal (bench/editor-key-to-frame.sh).
    foreach (var order in new[] { 10, 20 })
    {
        var path = Path.Combine(args[1], $"order{order}.toml");
        CompAssist.Core.Cases.CaseFileWriter.Save(EditorFrame.CaseOf(order), path);
        Console.WriteLine(path);
    }

    return 0;
}

if (args.Contains("--check-probe"))
{
    foreach (var order in new[] { 4, 10 })
    {
        var c = BenchmarkLoop.OfOrder(order);
        var design = CompAssist.Core.Synthesis.LeadDesigner.Design(c.Loop, c.Target, c.Options).Value!;
        var comp = design.Compensator.TransferFunction;
        var proof = CompAssist.Core.Proof.LoopProver.Prove(c.Loop, comp, c.Target);
        var poles = proof.Roots.Select(r => r.Value).ToImmutableArray();
        double Time(Func<object> f) { for (var i = 0; i < 200; i++) f(); var t = System.Diagnostics.Stopwatch.StartNew(); for (var i = 0; i < 300; i++) f(); return t.Elapsed.TotalMilliseconds / 300; }
        Console.WriteLine($"order {order}: whole redesign {Time(() => RedesignWork.Run(c)):F3}");
        Console.WriteLine($"  design+prove+check {Time(() => { var d = CompAssist.Core.Synthesis.LeadDesigner.Design(c.Loop, c.Target, c.Options).Value!; var pr = CompAssist.Core.Proof.LoopProver.Prove(c.Loop, d.Compensator.TransferFunction, c.Target); return CompAssist.Core.Proof.LoopCheck.Run(c.Loop, d.Compensator.TransferFunction, pr.Roots.Select(r => r.Value).ToImmutableArray(), new CompAssist.Core.Proof.CheckOptions(), null, c.Target); }):F3}");
        Console.WriteLine($"  design+locus {Time(() => { var d = CompAssist.Core.Synthesis.LeadDesigner.Design(c.Loop, c.Target, c.Options).Value!; return CompAssist.Core.Locus.LocusEngine.Compute(c.Loop, d.Compensator.TransferFunction); }):F3}");
        Console.WriteLine($"  LoopCheck {Time(() => CompAssist.Core.Proof.LoopCheck.Run(c.Loop, comp, poles, new CompAssist.Core.Proof.CheckOptions(), null, c.Target)):F3}");
        Console.WriteLine($"  transfers {Time(() => CompAssist.Core.Proof.ClosedLoopTransfers.Of(c.Loop, comp, poles)):F3}");
        Console.WriteLine($"  error constants {Time(() => CompAssist.Core.Proof.ErrorConstants.Of(c.Loop, comp)):F3}");
        Console.WriteLine($"  margins {Time(() => CompAssist.Core.Proof.MarginAnalyzer.Analyze(c.Loop, comp)):F3}");
        Console.WriteLine($"  step {Time(() => RedesignWork.Step(c, design, proof)):F3}");
        Console.WriteLine($"  prove {Time(() => CompAssist.Core.Proof.LoopProver.Prove(c.Loop, comp, c.Target)):F3}");
        Console.WriteLine($"  design {Time(() => CompAssist.Core.Synthesis.LeadDesigner.Design(c.Loop, c.Target, c.Options)):F3}");
        Console.WriteLine($"  locus {Time(() => CompAssist.Core.Locus.LocusEngine.Compute(c.Loop, comp)):F3}");
        Console.WriteLine($"  horizon {CompAssist.Core.Proof.LoopCheck.Horizon(poles):F2} s, target {c.Target.Point}");
    }

    return 0;
}

if (args.Contains("--locus-probe"))
{
    var c = BenchmarkLoop.OfOrder(20);
    var design = CompAssist.Core.Synthesis.LeadDesigner.Design(c.Loop, c.Target, c.Options).Value!;
    var open = c.Loop.RationalOpenLoop(design.Compensator.TransferFunction);
    double Time(Func<object> f) { for (var i = 0; i < 300; i++) f(); var t = System.Diagnostics.Stopwatch.StartNew(); for (var i = 0; i < 300; i++) f(); return t.Elapsed.TotalMilliseconds / 300; }
    var r = CompAssist.Core.Locus.LocusEngine.Compute(c.Loop, design.Compensator.TransferFunction);
    Console.WriteLine($"steps {r.Steps} eigenvalue solves {r.Reseeds} break points crossed by expansion {r.ExpansionCrossings} points {r.Branches.Sum(b => b.Length)}");
    Console.WriteLine($"whole {Time(() => CompAssist.Core.Locus.LocusEngine.Compute(c.Loop, design.Compensator.TransferFunction)):F3} ms");
    Console.WriteLine($"break points {Time(() => CompAssist.Core.Locus.LocusFeatures.BreakPoints(open.Poles, open.Zeros, open.Gain)):F3} ms");
    Console.WriteLine($"axis crossings {Time(() => CompAssist.Core.Locus.LocusFeatures.AxisCrossings(open.Poles, open.Zeros, open.Gain)):F3} ms");
    Console.WriteLine($"one eigen reseed (roots) {Time(() => CompAssist.Core.Numerics.RootFinder.Find(c.Loop.Characteristic(design.Compensator.TransferFunction))):F3} ms");
    return 0;
}

if (args.Contains("--quick"))
{
    var orders = args.Where(a => int.TryParse(a, out _)).Select(int.Parse).DefaultIfEmpty(4).ToList();
    if (!args.Any(a => int.TryParse(a, out _)))
    {
        orders = [4, 10, 20];
    }

    QuickRun.Print(orders, Console.Out);
    return 0;
}

BenchmarkSwitcher.FromAssembly(typeof(RedesignBenchmarks).Assembly).Run(args);
return 0;
