using BenchmarkDotNet.Running;
using CompAssist.Benchmarks;

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
