using System.Collections.Immutable;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;

namespace CompAssist.Core.Editing;

/// <summary>A robustness sweep a session still needs, with the revision it belongs to.</summary>
/// <param name="Revision">The session revision the sweep was asked at (see <see cref="DesignSession.AcceptSweep"/>).</param>
/// <param name="Loop">The nominal loop.</param>
/// <param name="Compensator">The designed compensator.</param>
/// <param name="Variations">The plant variations.</param>
/// <param name="Requirements">The requirements every corner is judged by.</param>
public sealed record SweepRequest(int Revision, Loop Loop, TransferFunction Compensator, ImmutableArray<PlantVariation> Variations, Targets.Requirements Requirements)
{
    /// <summary>Number of corners the sweep visits.</summary>
    public int Corners => RobustnessSweep.CornerCount(Variations.Length);

    /// <summary>Runs the sweep (on any thread: the inputs are immutable).</summary>
    /// <exception cref="OperationCanceledException">The sweep was cancelled.</exception>
    public Common.Outcome<RobustnessReport> Run(IProgress<int>? progress, CancellationToken cancellation) =>
        RobustnessSweep.Run(Loop, Compensator, Variations, Requirements, progress, cancellation);
}
