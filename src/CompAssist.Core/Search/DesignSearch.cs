using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Search;

/// <summary>
/// Searches the admissible region for a compensator whose simulated loop meets every requirement, and picks
/// the best by a stated objective. First pass: a 25 × 40 grid of targets (σ log-spaced from 0.7 to 10 times
/// the corner's — the region is open toward faster targets —, ωd from 5 % to 130 % of the ζ boundary at that σ: the region and 30 % beyond), each with the
/// kind's given choices. Second pass: around the 20 best targets, every placement of the kind that applies
/// and each continuous free choice at five values. Then a pattern search (coordinate steps halved on failure)
/// from the five best until a step improves the objective by less than 0.5 %. A candidate that meets nominally is
/// judged at every corner of the variation box as well. Candidates are independent and evaluated in parallel; the ranking key ends with the
/// evaluation order, so the answer does not depend on the number of cores.
/// </summary>
public static class DesignSearch
{
    private const int GridSigma = 25;
    private const int GridOmega = 40;
    private const int SecondPassTargets = 20;
    private const double MaxSigmaFactor = 10.0;
    private const int PatternStarts = 5;

    /// <summary>Runs the search around the region's corner; refused when the requirements define no region to search.</summary>
    /// <exception cref="OperationCanceledException">The search was cancelled.</exception>
    public static Outcome<SearchOutcome> Run(
        Loop loop,
        Requirements requirements,
        CompensatorKind kind,
        LeadOptions lead,
        SlowPoleOptions slow,
        CheckOptions check,
        IReadOnlyList<PlantVariation> variations,
        SearchOptions options,
        IProgress<int>? progress = null,
        CancellationToken cancellation = default) =>
        Run(loop, requirements, null, kind, lead, slow, check, variations, options, progress, cancellation);

    /// <summary>
    /// Runs the search around <paramref name="reference"/> (the region's corner when null); refused when the
    /// requirements define no region to search.
    /// </summary>
    /// <exception cref="OperationCanceledException">The search was cancelled.</exception>
    public static Outcome<SearchOutcome> Run(
        Loop loop,
        Requirements requirements,
        TargetPole? reference,
        CompensatorKind kind,
        LeadOptions lead,
        SlowPoleOptions slow,
        CheckOptions check,
        IReadOnlyList<PlantVariation> variations,
        SearchOptions options,
        IProgress<int>? progress = null,
        CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(requirements);
        ArgumentNullException.ThrowIfNull(variations);
        ArgumentNullException.ThrowIfNull(options);
        TargetPole c0;
        if (reference is not null)
        {
            c0 = reference;
        }
        else
        {
            var corner = TargetSelector.Select(requirements);
            if (!corner.IsSuccess)
            {
                return Outcome<SearchOutcome>.Refused(corner.Problem);
            }

            c0 = corner.Value.Target;
        }

        var evaluator = new CandidateEvaluator(loop, requirements, kind, check, variations, options);
        var pool = new Pool(evaluator, options, progress, cancellation);

        // First pass: the grid, with the kind's given choices.
        var zetaMin = requirements.MaxOvershootPercent is { } os ? SecondOrder.DampingFromOvershoot(os) : 0.0;
        var (rows, columns) = GridSize(options.MaxCandidates);
        var grid = new List<SearchChoice>(rows * columns);
        for (var i = 0; i < rows; i++)
        {
            var sigma = c0.Sigma * 0.7 * Math.Pow(MaxSigmaFactor / 0.7, rows == 1 ? 0.0 : (double)i / (rows - 1));
            var boundary = zetaMin > 0 ? sigma * Math.Sqrt(1 - (zetaMin * zetaMin)) / zetaMin : Math.Max(c0.DampedFrequency / c0.Sigma, 1.0) * sigma;
            for (var j = 0; j < columns; j++)
            {
                var fraction = 0.05 + ((1.30 - 0.05) * (columns == 1 ? 1.0 : (double)j / (columns - 1)));
                grid.Add(new SearchChoice(TargetPole.At(new Complex(-sigma, fraction * boundary)), lead, slow));
            }
        }

        pool.EvaluateAll(grid);

        // Second pass: every placement and continuous choice around the best targets.
        var best = pool.Ranked().Select(c => c.Choice.Target).DistinctBy(t => t.Point).Take(SecondPassTargets).ToList();
        var variants = new List<SearchChoice>();
        foreach (var target in best)
        {
            variants.AddRange(Variants(loop, kind, target, lead, slow, options.Pinned));
        }

        pool.EvaluateAll(variants);

        // Pattern search from the best few.
        var starts = pool.Ranked().DistinctBy(c => (c.Choice.Target.Point, c.Choice.Lead, c.Choice.Slow)).Take(PatternStarts).ToList();
        // Each start has its own evaluation budget and order numbers, so the result does not depend on timing.
        var baseOrder = pool.Count;
        var perStart = Math.Max(0, Math.Min(80, (options.MaxCandidates - baseOrder) / Math.Max(1, starts.Count)));
        Parallel.For(0, starts.Count, Parallelism(options, cancellation), i => PatternSearch(pool, kind, options.Pinned, starts[i], baseOrder + (i * perStart), perStart));

        var ranked = pool.Ranked();
        if (ranked.Count == 0)
        {
            // Nothing could be synthesized anywhere: the refusal at the corner says why in the kind's own terms.
            var atCorner = Synthesizer.Design(loop, c0, kind, lead, slow, requirements.Constant);
            if (!atCorner.IsSuccess)
            {
                return Outcome<SearchOutcome>.Refused(new Problem(atCorner.Problem.Message + ", and no other target in the region can be reached either", atCorner.Problem.Hint));
            }

            return Outcome<SearchOutcome>.Refused(
                "No target in the region (and 30 % beyond it) can be reached by this compensator kind",
                "Try another kind (lead-lag or PID for more angle, lag or PI for less), or relax the requirements.");
        }

        // Every candidate that meets was also judged at every corner of the variation box.
        var winner = ranked[0];
        var swept = variations.Count > 0 ? ranked.Count(c => c.Stable && c.Checks.Length > 0) : 0;
        var runners = RunnerUpSelection.Pick(ranked, winner, options.RunnersUp);
        var limits = winner.Meets ? [] : PhysicalLimits.Explain(loop, requirements, check, winner);
        return Outcome<SearchOutcome>.Success(new SearchOutcome(winner, runners, pool.Count, options.Objective, options.RequirementMargin, limits, swept) { Pinned = options.Pinned });
    }

    private static ParallelOptions Parallelism(SearchOptions options, CancellationToken cancellation) =>
        new() { CancellationToken = cancellation, MaxDegreeOfParallelism = options.MaxParallelism ?? -1 };

    private static (int Rows, int Columns) GridSize(int cap)
    {
        if (cap >= 3 * GridSigma * GridOmega)
        {
            return (GridSigma, GridOmega);
        }

        // A small cap (the fuzzer's): keep the grid's shape at about a third of the budget.
        var scale = Math.Sqrt(Math.Max(cap / 3.0, 1.0) / (GridSigma * GridOmega));
        return (Math.Max(2, (int)(GridSigma * scale)), Math.Max(2, (int)(GridOmega * scale)));
    }

    /// <summary>The kind's placements and continuous choices at a target (the given choice excluded, pinned ones kept).</summary>
    private static IEnumerable<SearchChoice> Variants(Loop loop, CompensatorKind kind, TargetPole target, LeadOptions lead, SlowPoleOptions slow, SearchPins pinned)
    {
        var free = SearchPinNames.ChoicesOf(kind) & ~pinned;
        if (kind == CompensatorKind.PI && free.HasFlag(SearchPins.Placement) && loop.Plant.Poles.Any(p => p.Imaginary == 0 && p.Real < 0))
        {
            // A PI's one placement beside its zero fraction: the pole-cancelling PI.
            yield return new SearchChoice(target, lead with { Placement = LeadPlacement.Cancel, Zero = null }, slow);
        }
        else if (free.HasFlag(SearchPins.Placement))
        {
            yield return new SearchChoice(target, lead with { Placement = LeadPlacement.Bisector }, slow);
            yield return new SearchChoice(target, lead with { Placement = LeadPlacement.Beneath }, slow);
            foreach (var ratio in (double[])[3, 5, 10, 20, 40])
            {
                yield return new SearchChoice(target, lead with { Placement = LeadPlacement.Ratio, Ratio = ratio }, slow);
            }

            foreach (var pole in loop.Plant.Poles.Where(p => p.Imaginary == 0 && p.Real < 0).Select(p => p.Real).Distinct().OrderByDescending(p => p).Take(3))
            {
                yield return new SearchChoice(target, lead with { Placement = LeadPlacement.Cancel, Zero = pole }, slow);
            }
        }

        if (free.HasFlag(SearchPins.StageAngle))
        {
            foreach (var angle in (double[])[40, 50, 70, 80])
            {
                yield return new SearchChoice(target, lead with { MaxStageAngleDegrees = angle }, slow);
            }
        }

        if (free.HasFlag(SearchPins.ZeroFraction))
        {
            foreach (var fraction in (double[])[0.03, 0.06, 0.15, 0.25, 0.4])
            {
                yield return new SearchChoice(target, lead, slow with { ZeroFraction = fraction });
            }

            // The slow zero on the slowest stable plant pole (a pole-cancelling PI): no slow closed-loop tail.
            foreach (var pole in loop.Plant.Poles.Where(p => p.Imaginary == 0 && p.Real < 0).Select(p => -p.Real).Order().Take(1))
            {
                if (pole < 0.9 * target.Sigma)
                {
                    yield return new SearchChoice(target, lead, slow with { ZeroFraction = pole / target.Sigma });
                }
            }
        }

        if (free.HasFlag(SearchPins.LagMargin))
        {
            foreach (var margin in (double[])[1.25, 1.5, 2.0])
            {
                yield return new SearchChoice(target, lead, slow with { Margin = margin });
            }
        }

        if (free.HasFlag(SearchPins.FilterRatio))
        {
            foreach (var ratio in (double[])[4, 7, 10, 15, 25])
            {
                yield return new SearchChoice(target, lead, slow with { FilterRatio = ratio });
            }
        }
    }

    /// <summary>Coordinate steps in ln σ, ln ωd and the kind's continuous choice, halved when no step improves.</summary>
    private static void PatternSearch(Pool pool, CompensatorKind kind, SearchPins pinned, SearchCandidate start, int firstOrder, int budget)
    {
        var current = start;
        var step = 0.08;
        var used = 0;
        while (step > 0.004 && used < budget)
        {
            var improved = false;
            foreach (var next in Neighbours(kind, pinned, current.Choice, step))
            {
                if (used >= budget)
                {
                    break;
                }

                var c = pool.Evaluate(next, firstOrder + used++);
                if (c is not null && Better(c, current, out var gain) && gain >= 0.005)
                {
                    current = c;
                    improved = true;
                    break;
                }
            }

            if (!improved)
            {
                step /= 2;
            }
        }
    }

    private static bool Better(SearchCandidate a, SearchCandidate b, out double gain)
    {
        gain = 0;
        if (a.Meets != b.Meets)
        {
            gain = 1;
            return a.Meets;
        }

        if (a.Meets && a.Tracks != b.Tracks)
        {
            gain = 1;
            return a.Tracks;
        }

        var (x, y) = a.Meets ? (a.Objective, b.Objective) : (a.Violation, b.Violation);
        if (!(x < y))
        {
            return false;
        }

        gain = double.IsFinite(y) && y != 0 ? (y - x) / Math.Abs(y) : 1;
        return true;
    }

    private static IEnumerable<SearchChoice> Neighbours(CompensatorKind kind, SearchPins pinned, SearchChoice c, double step)
    {
        var free = SearchPinNames.ChoicesOf(kind) & ~pinned;
        var p = c.Target.Point;
        foreach (var f in (double[])[Math.Exp(step), Math.Exp(-step)])
        {
            yield return c with { Target = TargetPole.At(new Complex(p.Real * f, p.Imaginary)) };
            yield return c with { Target = TargetPole.At(new Complex(p.Real, p.Imaginary * f)) };
            if (free.HasFlag(SearchPins.Ratio) && c.Lead.Placement == LeadPlacement.Ratio && c.Lead.Ratio is { } r)
            {
                yield return c with { Lead = c.Lead with { Ratio = Math.Max(1.05, r * f) } };
            }

            if (free.HasFlag(SearchPins.ZeroFraction))
            {
                yield return c with { Slow = c.Slow with { ZeroFraction = Math.Clamp(c.Slow.ZeroFraction * f, 0.005, 0.9) } };
            }

            if (free.HasFlag(SearchPins.FilterRatio) && c.Slow.FilterRatio is { } n)
            {
                yield return c with { Slow = c.Slow with { FilterRatio = Math.Max(1.5, n * f) } };
            }
        }
    }

    /// <summary>Every candidate evaluated so far, with a budget; thread-safe.</summary>
    private sealed class Pool(CandidateEvaluator evaluator, SearchOptions options, IProgress<int>? progress, CancellationToken cancellation)
    {
        private readonly List<SearchCandidate> found = [];
        private readonly Lock gate = new();
        private int count;

        public int Count => Volatile.Read(ref count);

        public void EvaluateAll(IReadOnlyList<SearchChoice> choices)
        {
            var start = Interlocked.Add(ref count, 0);
            var take = Math.Max(0, Math.Min(choices.Count, options.MaxCandidates - start));
            var results = new SearchCandidate?[take];
            Interlocked.Add(ref count, take);
            Parallel.For(0, take, DesignSearch.Parallelism(options, cancellation), i => results[i] = evaluator.Evaluate(choices[i], start + i));
            lock (gate)
            {
                found.AddRange(results.OfType<SearchCandidate>());
            }

            progress?.Report(Count);
        }

        public SearchCandidate? Evaluate(SearchChoice choice, int order)
        {
            cancellation.ThrowIfCancellationRequested();
            Interlocked.Increment(ref count);
            var result = evaluator.Evaluate(choice, order);
            if (result is not null)
            {
                lock (gate)
                {
                    found.Add(result);
                }
            }

            return result;
        }

        public List<SearchCandidate> Ranked()
        {
            lock (gate)
            {
                return [.. found.OrderBy(c => c.Rank)];
            }
        }
    }
}
