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
