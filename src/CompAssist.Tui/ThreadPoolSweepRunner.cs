using CompAssist.Core.Common;
using CompAssist.Core.Editing;
using CompAssist.Core.Proof;
using Terminal.Gui.App;

namespace CompAssist.Tui;

/// <summary>Runs each sweep on the thread pool and posts progress and the result back through the application.</summary>
internal sealed class ThreadPoolSweepRunner(IApplication app) : ISweepRunner
{
    public void Start(SweepRequest request, Action<int> progress, Action<Outcome<RobustnessReport>> done, CancellationToken cancellation)
    {
        var reporter = new Progress(app, progress, cancellation);
        _ = Task.Run(
            () =>
            {
                try
                {
                    var result = request.Run(reporter, cancellation);
                    app.Invoke(() =>
                    {
                        if (!cancellation.IsCancellationRequested)
                        {
                            done(result);
                        }
                    });
                }
                catch (OperationCanceledException)
                {
                    // A newer design replaced this one; its own sweep is already running.
                }
                catch (Exception e) when (e is not OutOfMemoryException)
                {
                    // A failure here must reach the screen as a refusal, not vanish with the thread.
                    var failed = Outcome<RobustnessReport>.Refused($"The robustness sweep failed ({e.GetType().Name}: {e.Message})", "Please report it; the design above is unaffected.");
                    app.Invoke(() =>
                    {
                        if (!cancellation.IsCancellationRequested)
                        {
                            done(failed);
                        }
                    });
                }
            },
            CancellationToken.None);
    }

    public void StartSearch(Func<IProgress<int>, CancellationToken, Core.Workflow.DesignRun> work, Action<int> progress, Action<Core.Workflow.DesignRun> done, Action<string> failed, CancellationToken cancellation)
    {
        var reporter = new Progress(app, progress, cancellation);
        _ = Task.Run(
            () =>
            {
                try
                {
                    var result = work(reporter, cancellation);
                    app.Invoke(() =>
                    {
                        if (!cancellation.IsCancellationRequested)
                        {
                            done(result);
                        }
                    });
                }
                catch (OperationCanceledException)
                {
                    // Cancelled: the case changed or the user quit.
                }
                catch (Exception e) when (e is not OutOfMemoryException)
                {
                    app.Invoke(() =>
                    {
                        if (!cancellation.IsCancellationRequested)
                        {
                            failed($"The search failed ({e.GetType().Name}: {e.Message}); please report it. The design on screen is unaffected.");
                        }
                    });
                }
            },
            CancellationToken.None);
    }

    private sealed class Progress(IApplication app, Action<int> report, CancellationToken cancellation) : IProgress<int>
    {
        public void Report(int value) => app.Invoke(() =>
        {
            if (!cancellation.IsCancellationRequested)
            {
                report(value);
            }
        });
    }
}
