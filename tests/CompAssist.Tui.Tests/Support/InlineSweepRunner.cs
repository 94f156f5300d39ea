using CompAssist.Core.Common;
using CompAssist.Core.Editing;
using CompAssist.Core.Proof;

namespace CompAssist.Tui.Tests.Support;

/// <summary>Holds sweeps until the test lets them run, so a test can look at the screen while one is pending.</summary>
internal sealed class InlineSweepRunner : ISweepRunner
{
    private readonly List<(SweepRequest Request, Action<int> Progress, Action<Outcome<RobustnessReport>> Done, CancellationToken Token)> pending = [];

    private readonly List<(Func<IProgress<int>, CancellationToken, Core.Workflow.DesignRun> Work, Action<int> Progress, Action<Core.Workflow.DesignRun> Done, CancellationToken Token)> searches = [];

    public int Started { get; private set; }

    public int PendingSearches => searches.Count;

    public void StartSearch(Func<IProgress<int>, CancellationToken, Core.Workflow.DesignRun> work, Action<int> progress, Action<Core.Workflow.DesignRun> done, Action<string> failed, CancellationToken cancellation) =>
        searches.Add((work, progress, done, cancellation));

    /// <summary>Runs every pending search that was not cancelled and delivers the results.</summary>
    public void RunSearches()
    {
        var now = searches.ToList();
        searches.Clear();
        foreach (var (work, progress, done, token) in now)
        {
            if (!token.IsCancellationRequested)
            {
                done(work(new Reporter(progress), token));
            }
        }
    }

    public int Pending => pending.Count;

    public void Start(SweepRequest request, Action<int> progress, Action<Outcome<RobustnessReport>> done, CancellationToken cancellation)
    {
        Started++;
        pending.Add((request, progress, done, cancellation));
    }

    /// <summary>Reports progress from every pending sweep, as the thread pool would part-way through.</summary>
    public void ReportProgress(int corners)
    {
        foreach (var (_, progress, _, token) in pending)
        {
            if (!token.IsCancellationRequested)
            {
                progress(corners);
            }
        }
    }

    /// <summary>Runs every pending sweep that was not cancelled, as the thread pool would, and delivers the results.</summary>
    public void RunAll()
    {
        var now = pending.ToList();
        pending.Clear();
        foreach (var (request, progress, done, token) in now)
        {
            if (token.IsCancellationRequested)
            {
                continue;
            }

            done(request.Run(new Reporter(progress), token));
        }
    }

    private sealed class Reporter(Action<int> report) : IProgress<int>
    {
        public void Report(int value) => report(value);
    }
}
