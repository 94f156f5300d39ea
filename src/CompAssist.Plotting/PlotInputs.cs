using System.Collections.Immutable;
using CompAssist.Core.Locus;
using CompAssist.Core.Workflow;

namespace CompAssist.Plotting;

/// <summary>Builds <see cref="PlotInput"/> from the results of the workflows.</summary>
public static class PlotInputs
{
    /// <summary>From a proved design.</summary>
    public static PlotInput FromDesign(DesignReport report, string title)
    {
        ArgumentNullException.ThrowIfNull(report);
        return new PlotInput(
            title,
            report.Design.Loop,
            report.Design.Compensator.TransferFunction,
            [.. report.Proof.Roots.Select(r => r.Value)],
            report.Proof.ClosedLoopZeros,
            report.Selection.Target.Point,
            report.Check,
            report.Locus);
    }

    /// <summary>From a check of a given compensator (the locus is computed here).</summary>
    public static PlotInput FromCheck(CheckResult result, string title)
    {
        ArgumentNullException.ThrowIfNull(result);
        var forward = result.Loop.Rational(result.Compensator * result.Loop.Plant);
        var zeros = forward.Zeros.AddRange(result.Loop.Rational(result.Loop.Feedback).Poles);
        return new PlotInput(
            title,
            result.Loop,
            result.Compensator,
            result.ClosedLoopPoles,
            zeros,
            result.Selection?.Target.Point,
            result.Check,
            LocusEngine.Compute(result.Loop, result.Compensator));
    }
}
