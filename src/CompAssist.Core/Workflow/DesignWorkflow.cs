using System.Collections.Immutable;
using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Locus;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Search;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Workflow;

/// <summary>
/// The main job end to end, shared by both front ends: read the loop, choose the target, synthesize,
/// prove. Every failure comes back as a value; nothing here writes to a console.
/// </summary>
public static class DesignWorkflow
{
    /// <summary>Compensator families this build can synthesize.</summary>
    public static IReadOnlyList<string> SupportedTypes => CompensatorKindNames.All;

    /// <summary>The kind for a type name, or null.</summary>
    public static CompensatorKind? KindOf(string name) => CompensatorKindNames.TryParse(name);

    /// <summary>Runs the design a case describes.</summary>
    public static DesignRun Run(CaseFile input)
    {
        ArgumentNullException.ThrowIfNull(input);
        var (loop, kind, failure) = Prepare(input);
        if (failure is not null)
        {
            return failure;
        }

        var selection = TargetSelector.Select(input.Requirements);
        if (!selection.IsSuccess && kind is CompensatorKind.Lag or CompensatorKind.PI && OnlyDamping(input.Requirements) is { } zeta)
        {
            // Only the damping is given: a lag or PI keeps the transient, so the target is where the ζ ray meets
            // the uncompensated locus.
            var onLocus = DampingRay.OnLocus(loop, zeta);
            if (!onLocus.IsSuccess)
            {
                return DesignRun.Failed(onLocus.Problem);
            }

            selection = Outcome<TargetSelection>.Success(TargetSelector.Select(input.Requirements with { Point = onLocus.Value.Point }).Value! with
            {
                Source = "where the ζ ray meets the uncompensated locus (a lag/PI keeps the transient)",
            });
        }

        if (!selection.IsSuccess)
        {
            return DesignRun.Failed(selection.Problem);
        }

        var design = Synthesizer.Design(loop, selection.Value.Target, kind, input.Lead, input.Slow, input.Requirements.Constant);
        if (!design.IsSuccess)
        {
            return DesignRun.Failed(design.Problem);
        }

        return Prove(input, loop, selection.Value, design.Value, null);
    }

    /// <summary>True when the case asks for a target to be searched (requirements, no explicit target or ζ/ωn pair).</summary>
    public static bool Searches(CaseFile input)
    {
        ArgumentNullException.ThrowIfNull(input);
        var r = input.Requirements;
        return r.Point is null && r.Zeta is null && r.NaturalFrequency is null
            && (r.MaxSettlingTime is not null || r.MaxPeakTime is not null || r.MaxOvershootPercent is not null);
    }

    /// <summary>
    /// Searches the region for a design whose simulated loop meets every requirement (see
    /// <see cref="DesignSearch"/>) and proves the winner in full. A case with an explicit target, or without a
    /// speed requirement to span a region, is designed as <see cref="Run"/> designs it.
    /// </summary>
    /// <exception cref="OperationCanceledException">The search was cancelled.</exception>
    public static DesignRun Search(CaseFile input, SearchOptions options, IProgress<int>? progress = null, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(options);
        if (!Searches(input))
        {
            return Run(input);
        }

        var (loop, kind, failure) = Prepare(input);
        if (failure is not null)
        {
            return failure;
        }

        // Only an overshoot bound: the region is the ζ wedge; its reference speed is where the ζ ray meets
        // the uncompensated locus (where a lag or PI, which keep the transient, would put the target).
        TargetPole? reference = null;
        if (!TargetSelector.Select(input.Requirements).IsSuccess && OnlyDamping(input.Requirements) is { } zeta)
        {
            var onLocus = DampingRay.OnLocus(loop, zeta);
            if (!onLocus.IsSuccess)
            {
                return Run(input);
            }

            reference = TargetPole.At(onLocus.Value.Point);
        }

        var found = DesignSearch.Run(loop, input.Requirements, reference, kind, input.Lead, input.Slow, input.Check, input.Variations, options, progress, cancellation);
        if (!found.IsSuccess)
        {
            return DesignRun.Failed(found.Problem);
        }

        var outcome = found.Value;
        var winner = outcome.Winner;
        var selection = TargetSelector.Select(input.Requirements with { Point = winner.Choice.Target.Point });
        if (!selection.IsSuccess)
        {
            return DesignRun.Failed(selection.Problem);
        }

        var source = $"searched: the best of {outcome.Evaluated} candidates over the region and 30 % beyond ({SearchObjectiveNames.Meaning(outcome.Objective)}){(outcome.Meets ? string.Empty : "; none meets every requirement, this is the closest")}";
        var searched = input with { Lead = winner.Choice.Lead, Slow = winner.Choice.Slow };
        return Prove(searched, loop, selection.Value with { Source = source }, winner.Design, outcome);
    }

    /// <summary>
    /// Searches each kind in <paramref name="kinds"/> and returns the best one's full report, with every kind's
    /// best beside it: a kind that meets beats one that does not, then the lower objective, then the smaller
    /// shortfall, then the order given. Refused when no kind can be designed at all. With
    /// <paramref name="atCorner"/> (or an explicit target in the case) each kind is designed at the one target
    /// instead of searched, and the kinds are compared on their verdicts.
    /// </summary>
    /// <exception cref="OperationCanceledException">The search was cancelled.</exception>
    public static DesignRun SearchKinds(CaseFile input, IReadOnlyList<CompensatorKind> kinds, SearchOptions options, bool atCorner = false, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(kinds);
        ArgumentNullException.ThrowIfNull(options);
        if (kinds.Count == 0)
        {
            throw new ArgumentException("At least one kind is needed.", nameof(kinds));
        }

        var runs = new List<(CompensatorKind Kind, DesignRun Run)>();
        foreach (var kind in kinds.Distinct())
        {
            var asKind = input with { CompensatorType = CompensatorKindNames.NameOf(kind) };
            var run = atCorner
                ? Run(asKind)
                : Search(asKind, options with { Pinned = options.Pinned & SearchPinNames.ChoicesOf(kind) }, null, cancellation);
            runs.Add((kind, run));
            if (run.FieldError is not null)
            {
                return run;
            }
        }

        var rows = runs.Select(r => Row(r.Kind, r.Run, options.Pinned & ~SearchPinNames.ChoicesOf(r.Kind))).ToImmutableArray();
        var designed = runs.Where(r => r.Run.IsSuccess).ToList();
        if (designed.Count == 0)
        {
            var first = runs[0].Run.Problem!;
            return DesignRun.Failed(new Problem(
                $"No kind asked for can be designed here ({string.Join("; ", rows.Select(r => $"{r.Kind}: {r.Refusal}"))})",
                first.Hint));
        }

        var best = designed
            .Select((r, i) => (r.Run, Score: Score(r.Run.Report!), Order: i))
            .OrderBy(x => x.Score.Group).ThenBy(x => x.Score.Value).ThenBy(x => x.Order)
            .First().Run;
        return DesignRun.Success(best.Report! with { KindsCompared = rows });
    }

    // Meeting and following the reference first, meeting about an offset final value next (see SearchCandidate.Tracks).
    private static (int Group, double Value) Score(DesignReport report) =>
        report.Search is { } s
            ? (s.Meets ? (s.Winner.Tracks ? 0 : 1) : 2, s.Meets ? s.Winner.Objective : s.Winner.Violation)
            : (report.Verdict.Meets ? (report.Check.Warnings.Any(w => w.StartsWith(Proof.LoopCheck.OffsetWarningStart, StringComparison.Ordinal)) ? 1 : 0) : 2, 0.0);

    private static KindResult Row(CompensatorKind kind, DesignRun run, SearchPins unused)
    {
        var unusedText = SearchPinNames.Settings(unused);
        if (!run.IsSuccess)
        {
            return new KindResult(CompensatorKindNames.NameOf(kind), false, double.NaN, double.NaN, run.Problem?.Message ?? "the input could not be read", unusedText);
        }

        var report = run.Report!;
        return report.Search is { } s
            ? new KindResult(CompensatorKindNames.NameOf(kind), s.Meets, s.Winner.Objective, s.Winner.Violation, null, unusedText)
            : new KindResult(CompensatorKindNames.NameOf(kind), report.Verdict.Meets, double.NaN, double.NaN, null, unusedText);
    }

    /// <summary>The loop, the kind and the kind's options checked: what both the corner design and the search need first.</summary>
    private static (Loop Loop, CompensatorKind Kind, DesignRun? Failure) Prepare(CaseFile input)
    {
        if (input.Plant is null)
        {
            return (null!, default, DesignRun.Failed(new Problem("No plant is given", "Give the plant G(s), e.g. 10/(s(s+2)).", Setting.Plant)));
        }

        var loopResult = BuildLoop(input.Plant, input.Feedback, input.Sign, input.PadeOrder);
        if (loopResult.FieldError is { } fe)
        {
            return (null!, default, DesignRun.Failed(fe));
        }

        if (loopResult.Problem is { } lp)
        {
            return (null!, default, DesignRun.Failed(lp));
        }

        if (KindOf(input.CompensatorType) is not { } kind)
        {
            return (null!, default, DesignRun.Failed(new Problem(
                $"Compensator type '{input.CompensatorType}' is not available in this version",
                $"Use one of: {string.Join(", ", SupportedTypes)}.")));
        }

        var optionsProblem = kind is CompensatorKind.Lead or CompensatorKind.LeadLag ? CheckLeadOptions(input.Lead) : null;
        return optionsProblem is not null ? (null!, kind, DesignRun.Failed(optionsProblem)) : (loopResult.Loop!, kind, null);
    }

    private static DesignRun Prove(CaseFile input, Loop loop, TargetSelection selection, Design design, SearchOutcome? search)
    {
        if (!loop.RationalOpenLoop(design.Compensator.TransferFunction).IsProper)
        {
            return DesignRun.Failed(new Problem(
                "The compensated loop C·G·H has more zeros than poles, so its closed loop has roots at infinity",
                "Add a derivative filter (a filter ratio of about 10), or use a lead instead of an ideal PD or PID.",
                Setting.FilterRatio));
        }

        if (loop.WellPosednessProblem(design.Compensator.TransferFunction) is { } illPosed)
        {
            return DesignRun.Failed(new Problem(
                "The designed compensator leaves no usable closed loop. " + illPosed.Message,
                "Choose another target or compensator kind; a strictly proper compensator (a lag, or a PD or PID with its derivative filter) keeps C·G·H falling off at high frequency."));
        }

        try
        {
            var compensator = design.Compensator.TransferFunction;
            var proof = LoopProver.Prove(loop, compensator, design.Target);
            var check = LoopCheck.Run(loop, compensator, proof.Roots.Select(r => r.Value).ToImmutableArray(), input.Check, input.Requirements, design.Target);
            RobustnessReport? robustness = null;
            if (!input.Variations.IsEmpty)
            {
                var sweep = RobustnessSweep.Run(loop, compensator, input.Variations, input.Requirements);
                if (!sweep.IsSuccess)
                {
                    return DesignRun.Failed(sweep.Problem);
                }

                robustness = sweep.Value;
            }

            var locus = LocusEngine.Compute(loop, compensator);
            var (prefilter, why) = input.Prefilter && check.Stable
                ? ReferencePrefilter.Design(loop, compensator, proof.Roots.Select(r => r.Value).ToImmutableArray(), design.Target.Point)
                : (null, input.Prefilter ? "the closed loop is unstable" : null);
            return DesignRun.Success(new DesignReport(selection, design, proof, check, robustness, locus) { Search = search, Prefilter = prefilter, PrefilterNote = why });
        }
        catch (RootFindingException e)
        {
            return DesignRun.Failed(new Problem(
                "The closed-loop roots could not be verified: " + e.Message.TrimEnd('.'),
                "The loop is numerically ill-conditioned; enter the plant in factored form or reduce its order."));
        }
    }

    /// <summary>Parses the loop's expressions and builds it.</summary>
    public static (Loop? Loop, FieldError? FieldError, Problem? Problem) BuildLoop(string plant, string feedback, FeedbackSign sign, int padeOrder)
    {
        ArgumentNullException.ThrowIfNull(plant);
        ArgumentNullException.ThrowIfNull(feedback);
        var g = ExpressionParser.ParseProper(plant);
        if (!g.IsSuccess)
        {
            return (null, new FieldError("plant", g.Error), null);
        }

        var h = ExpressionParser.ParseProper(feedback);
        if (!h.IsSuccess)
        {
            return (null, new FieldError("feedback", h.Error), null);
        }

        if (padeOrder < 1 || padeOrder > PadeApproximation.MaxOrder)
        {
            return (null, null, new Problem($"Padé order {padeOrder} is out of range", $"Use 1 to {PadeApproximation.MaxOrder}."));
        }

        return (Loop.Create(g.Value, h.Value, sign, padeOrder), null, null);
    }

    private static double? OnlyDamping(Requirements r) =>
        r.Point is null && r.NaturalFrequency is null && r.MaxSettlingTime is null && r.MaxPeakTime is null
            ? r.Zeta ?? (r.MaxOvershootPercent is { } os && os > 0 && os < 100 ? SecondOrder.DampingFromOvershoot(os) : null)
            : null;

    private static Problem? CheckLeadOptions(LeadOptions lead) => lead.Placement switch
    {
        LeadPlacement.FixedZero when lead.Zero is null => new Problem("The fixed-zero placement needs a zero location", "Give the zero of the fixed-zero placement (a negative number).", Setting.LeadZero),
        LeadPlacement.FixedPole when lead.Pole is null => new Problem("The fixed-pole placement needs a pole location", "Give the pole of the fixed-pole placement (a negative number).", Setting.LeadPole),
        LeadPlacement.Ratio when lead.Ratio is null => new Problem("The ratio placement needs a pole/zero ratio", "Give the pole/zero ratio of the ratio placement (greater than 1).", Setting.LeadRatio),
        _ when lead.Ratio is { } r && !(r > 1 && r <= NumberRange.Largest) => new Problem($"The pole/zero ratio {TransferFunctionFormatter.Number(r, 4)} is outside 1 … 1e12", "Give the pole/zero ratio of the ratio placement as a number above 1 (a lead's is rarely above 100).", Setting.LeadRatio),
        _ when lead.Zero is { } z && !(NumberRange.Contains(z) && z != 0) => new Problem($"The zero {TransferFunctionFormatter.Number(z, 4)} is outside the range this tool accepts (1e-12 … 1e12 in magnitude)", "Give the zero of the fixed-zero placement (a negative number).", Setting.LeadZero),
        _ when lead.Pole is { } p && !(NumberRange.Contains(p) && p != 0) => new Problem($"The pole {TransferFunctionFormatter.Number(p, 4)} is outside the range this tool accepts (1e-12 … 1e12 in magnitude)", "Give the pole of the fixed-pole placement (a negative number).", Setting.LeadPole),
        _ => null,
    };
}
