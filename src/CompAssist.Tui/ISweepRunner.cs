using CompAssist.Core.Common;
using CompAssist.Core.Editing;
using CompAssist.Core.Proof;

namespace CompAssist.Tui;

/// <summary>Runs robustness sweeps and design searches away from the input loop and reports back on the UI thread.</summary>
internal interface ISweepRunner
{
    /// <summary>Starts a sweep; <paramref name="progress"/> and <paramref name="done"/> are called on the UI thread.</summary>
    void Start(SweepRequest request, Action<int> progress, Action<Outcome<RobustnessReport>> done, CancellationToken cancellation);

    /// <summary>
    /// Starts a design search; <paramref name="progress"/> (candidates evaluated), <paramref name="done"/> and
    /// <paramref name="failed"/> (an unexpected error, in words) are called on the UI thread.
    /// </summary>
    void StartSearch(Func<IProgress<int>, CancellationToken, Core.Workflow.DesignRun> work, Action<int> progress, Action<Core.Workflow.DesignRun> done, Action<string> failed, CancellationToken cancellation);
}
