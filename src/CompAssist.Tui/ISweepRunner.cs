using CompAssist.Core.Common;
using CompAssist.Core.Editing;
using CompAssist.Core.Proof;

namespace CompAssist.Tui;

/// <summary>Runs robustness sweeps away from the input loop and reports back on the UI thread.</summary>
internal interface ISweepRunner
{
    /// <summary>Starts a sweep; <paramref name="progress"/> and <paramref name="done"/> are called on the UI thread.</summary>
    void Start(SweepRequest request, Action<int> progress, Action<Outcome<RobustnessReport>> done, CancellationToken cancellation);
}
