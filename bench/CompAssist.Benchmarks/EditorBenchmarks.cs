using BenchmarkDotNet.Attributes;

namespace CompAssist.Benchmarks;

/// <summary>Key press to finished frame in the terminal editor (80×24, no terminal attached), orders 10 and 20.</summary>
[MemoryDiagnoser]
public class EditorBenchmarks
{
    private EditorFrame _editor = null!;

    [Params(10, 20)]
    public int Order { get; set; }

    [GlobalSetup]
    public void Setup() => _editor = new EditorFrame(Order);

    [GlobalCleanup]
    public void Cleanup() => _editor.Dispose();

    [Benchmark(Description = "editor: arrow key to finished frame")]
    public object KeyToFrame() => _editor.KeyToFrame();
}
