using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Search;

/// <summary>
/// Synthesizes one candidate by the angle and magnitude conditions and proves it as <c>design</c> does
/// (verified roots, step figures on the exact solution, margins and effort where a requirement or the
/// objective needs them), then judges it against the requirements with the search's margin — at every
/// corner of the variation box too, once it meets nominally. Pure: any thread may evaluate any candidate.
/// </summary>
internal sealed class CandidateEvaluator(Loop loop, Requirements requirements, CompensatorKind kind, CheckOptions check, IReadOnlyList<PlantVariation> variations, SearchOptions options)
{
    private readonly bool needsEffort = check.CommandRoom is not null || options.Objective == SearchObjective.ActuatorPeak;
    private readonly bool needsMargins = requirements.NeedsMargins || options.Objective == SearchObjective.SensitivityPeak;

    /// <summary>The candidate for these choices, or null when the kind cannot be synthesized there.</summary>
    public SearchCandidate? Evaluate(SearchChoice choice, int order)
    {
        var outcome = Synthesizer.Design(loop, choice.Target, kind, choice.Lead, choice.Slow, requirements.Constant);
        if (!outcome.IsSuccess)
        {
            return null;
        }

        var design = outcome.Value;
        var c = design.Compensator.TransferFunction;
        if (!loop.RationalOpenLoop(c).IsProper || loop.WellPosednessProblem(c) is not null)
        {
            return null; // more zeros than poles around the loop, or 1 + L(∞) = 0: no finite closed loop to prove
        }

        ImmutableArray<Complex> roots;
        try
        {
            roots = RootFinder.Find(loop.Characteristic(c)).Roots;
        }
        catch (RootFindingException)
        {
            return null;
        }

        var judgement = ClosedLoopStability.Judge(loop, c, roots);
        var unstable = judgement.UnstableRootCount;
        if (!judgement.Stable)
        {
            return new SearchCandidate(choice, design, false, false, 1000.0 + unstable, double.PositiveInfinity, [], order);
        }

        var transfers = ClosedLoopTransfers.Of(loop, c, roots);
        var metrics = StepAnalysis.Measure(CascadeRealization.Of(transfers.Output), roots, transfers.Output.DcGain, LoopCheck.Horizon(roots));
        var horizon = metrics.Horizon;
        EffortFigures? effort = null;
        if (needsEffort)
        {
            effort = transfers.Effort is { } u
                ? Effort(CascadeRealization.Of(u), roots, horizon, roots.All(r => r.Real < 0) ? u.DcGain : double.NaN)
                : EffortFigures.Impulse(check);
        }

        var margins = needsMargins ? MarginAnalyzer.Analyze(loop, c) : null;
        var checks = RequirementChecks.Of(metrics, true, requirements, null, ErrorConstants.Of(loop, c), effort, margins);
        var violation = checks.Sum(Shortfall);
        if (violation < 0.2 && variations.Count > 0)
        {
            // Meets, or nearly, nominally: every corner of the variation box must meet too (the verdict's rule).
            var sweep = RobustnessSweep.Run(loop, c, variations, requirements);
            if (sweep.IsSuccess)
            {
                violation += sweep.Value.Corners.Max(corner => corner.Stable ? corner.Checks.Sum(Shortfall) : 10.0);
            }
        }

        var objective = options.Objective switch
        {
            SearchObjective.ActuatorPeak => effort!.Peak,
            SearchObjective.SensitivityPeak => margins!.SensitivityPeak,
            SearchObjective.SettlingTime => requirements.Band == SettlingBand.FivePercent ? metrics.SettlingTime5Percent : metrics.SettlingTime2Percent,
            _ => HighFrequencyGain(c),
        };
        var band = requirements.Band == SettlingBand.FivePercent ? 0.05 : 0.02;
        var tracks = requirements.Constant is not null || Math.Abs(1 - metrics.FinalValue) <= band;
        return new SearchCandidate(choice, design, true, violation == 0, violation, objective, checks, order) { Tracks = tracks };
    }

    /// <summary>|C(∞)|: the gain of a biproper compensator at high frequency; 0 when strictly proper, +∞ when improper.</summary>
    public static double HighFrequencyGain(TransferFunction c) => c.RelativeDegree switch
    {
        0 => Math.Abs(c.Gain),
        > 0 => 0.0,
        _ => double.PositiveInfinity,
    };

    private EffortFigures Effort(StateSpace u, ImmutableArray<Complex> roots, double horizon, double finalCommand)
    {
        var (high, highTime, low, lowTime) = StepAnalysis.Extremes(u, roots, horizon);
        return EffortFigures.Of(u.D, high, highTime, low, lowTime, check, finalCommand);
    }

    /// <summary>How far a row falls short of its bound tightened by the margin, relative to the bound (0 when it holds).</summary>
    private double Shortfall(RequirementCheck row)
    {
        if (row.Required is not { } bound)
        {
            return 0.0;
        }

        var m = row.Measured;
        if (double.IsNaN(m))
        {
            return 10.0;
        }

        var scale = Math.Max(Math.Abs(bound), 1e-12);
        var excess = row.Bound == RequirementBound.AtMost
            ? (m - (bound * (1 - options.RequirementMargin))) / scale
            : ((bound * (1 + options.RequirementMargin)) - m) / scale;
        return excess > 0 ? Math.Min(excess, 10.0) : 0.0;
    }
}
