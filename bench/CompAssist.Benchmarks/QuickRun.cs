using System.Diagnostics;
using System.Globalization;
using CompAssist.Core.Locus;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;

namespace CompAssist.Benchmarks;

/// <summary>
/// The quick mode: a plain timing loop (not BenchmarkDotNet) that finishes in well under a minute and prints
/// one JSON line per order with p50 and p95 in milliseconds, for comparing with numpy_baseline.py.
/// </summary>
public static class QuickRun
{
    public static void Print(IEnumerable<int> orders, TextWriter output)
    {
        // Warm every code path once across the orders so that the first order measured is not the one that
        // pays for tiered compilation.
        var warm = Stopwatch.StartNew();
        while (warm.ElapsedMilliseconds < 1500)
        {
            foreach (var o in new[] { 4, 10, 20 })
            {
                RedesignWork.Run(BenchmarkLoop.OfOrder(o));
            }
        }

        var firstEditor = true;
        foreach (var order in orders)
        {
            var c = BenchmarkLoop.OfOrder(order);
            var design = LeadDesigner.Design(c.Loop, c.Target, c.Options).Value!;
            var proof = LoopProver.Prove(c.Loop, design.Compensator.TransferFunction, c.Target);
            var parts = new (string Name, Func<object> Work)[]
            {
                ("redesign", () => RedesignWork.Run(c)),
                ("synthesis", () => LeadDesigner.Design(c.Loop, c.Target, c.Options)),
                ("roots", () => LoopProver.Prove(c.Loop, design.Compensator.TransferFunction, c.Target)),
                ("step", () => RedesignWork.Step(c, design, proof)),
                ("locus", () => LocusEngine.Compute(c.Loop, design.Compensator.TransferFunction)),
                ("margins", () => MarginAnalyzer.Analyze(c.Loop, design.Compensator.TransferFunction)),
            };
            var fields = new List<string> { $"\"order\": {order}" };
            foreach (var (name, work) in parts)
            {
                var (p50, p95) = Percentiles(work);
                fields.Add($"\"{name}_p50_ms\": {p50.ToString("0.0000", CultureInfo.InvariantCulture)}");
                fields.Add($"\"{name}_p95_ms\": {p95.ToString("0.0000", CultureInfo.InvariantCulture)}");
            }

            if (order <= 10)
            {
                // The default search (not a timed test): requirements a little beyond the benchmark target's
                // second-order figures, on one thread and on every core; the median of three runs each.
                var requirements = new CompAssist.Core.Targets.Requirements
                {
                    MaxOvershootPercent = Math.Max(5, c.Target.Predict().OvershootPercent),
                    MaxSettlingTime = 1.5 * c.Target.Predict().SettlingTime2Percent,
                };
                foreach (var (label, threads) in new (string, int?)[] { ("search_1core_ms", 1), ("search_allcores_ms", null) })
                {
                    var times = new List<double>();
                    var evaluated = 0;
                    for (var i = 0; i < 3; i++)
                    {
                        var sw = Stopwatch.StartNew();
                        var found = CompAssist.Core.Search.DesignSearch.Run(c.Loop, requirements, CompensatorKind.Lead, c.Options, new SlowPoleOptions(), new CheckOptions(), [], new CompAssist.Core.Search.SearchOptions { MaxParallelism = threads });
                        times.Add(sw.Elapsed.TotalMilliseconds);
                        evaluated = found.IsSuccess ? found.Value.Evaluated : 0;
                    }

                    times.Sort();
                    fields.Add($"\"{label}\": {times[1].ToString("0.0", CultureInfo.InvariantCulture)}");
                    fields.Add($"\"search_candidates\": {evaluated}");
                }
            }

            if (order >= 10)
            {
                // Key press to finished frame in the editor at 80×24 (budget 16 ms at order 10). One editor at a
                // time, warmed as it is measured: Terminal.Gui runs threads of its own, and on one core a second
                // application (or tiered compilation of the drawing code) would be measured with it.
                // The first application in the process needs the longest warm-up (its start-up threads settle).
                using var editor = new EditorFrame(order);
                var warmEditor = Stopwatch.StartNew();
                while (warmEditor.ElapsedMilliseconds < (firstEditor ? 5000 : 1000))
                {
                    editor.KeyToFrame();
                }

                firstEditor = false;

                var (k50, k95) = Percentiles(editor.KeyToFrame);
                fields.Add($"\"editor_key_to_frame_p50_ms\": {k50.ToString("0.0000", CultureInfo.InvariantCulture)}");
                fields.Add($"\"editor_key_to_frame_p95_ms\": {k95.ToString("0.0000", CultureInfo.InvariantCulture)}");
                var (s50, s95) = Percentiles(editor.SessionMove);
                fields.Add($"\"editor_session_p50_ms\": {s50.ToString("0.0000", CultureInfo.InvariantCulture)}");
                fields.Add($"\"editor_session_p95_ms\": {s95.ToString("0.0000", CultureInfo.InvariantCulture)}");
                var (d50, d95) = Percentiles(editor.DrawOnly);
                fields.Add($"\"editor_draw_p50_ms\": {d50.ToString("0.0000", CultureInfo.InvariantCulture)}");
                fields.Add($"\"editor_draw_p95_ms\": {d95.ToString("0.0000", CultureInfo.InvariantCulture)}");
            }

            var allocated = GC.GetAllocatedBytesForCurrentThread();
            RedesignWork.Run(c);
            fields.Add($"\"redesign_alloc_kb\": {((GC.GetAllocatedBytesForCurrentThread() - allocated) / 1024.0).ToString("0.0", CultureInfo.InvariantCulture)}");
            output.WriteLine("{" + string.Join(", ", fields) + "}");
        }

    }

    private static (double P50, double P95) Percentiles(Func<object> work)
    {
        var warm = Stopwatch.StartNew();
        while (warm.ElapsedMilliseconds < 300)
        {
            work();
        }

        var samples = new List<double>();
        var total = Stopwatch.StartNew();
        while (samples.Count < 3000 && (samples.Count < 50 || total.ElapsedMilliseconds < 1500))
        {
            var t = Stopwatch.GetTimestamp();
            work();
            samples.Add(Stopwatch.GetElapsedTime(t).TotalMilliseconds);
        }

        samples.Sort();
        return (samples[samples.Count / 2], samples[(int)(samples.Count * 0.95)]);
    }
}
