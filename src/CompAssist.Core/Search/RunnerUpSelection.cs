using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Search;

/// <summary>
/// Picks runners-up that show a trade-off: a candidate whose target and compensator are both within 15
/// per cent of the winner's or of a runner-up already taken (a pattern-search neighbour, or another choice
/// that synthesizes the same compensator) says nothing new and is passed over.
/// </summary>
internal static class RunnerUpSelection
{
    // Relative distance below which two targets, or two compensators' poles, zeros and gain, count as the same.
    private const double Resolution = 0.15;

    /// <summary>The first <paramref name="count"/> ranked candidates (after the winner) that differ from every one taken.</summary>
    public static ImmutableArray<SearchCandidate> Pick(IReadOnlyList<SearchCandidate> ranked, SearchCandidate winner, int count)
    {
        var taken = new List<SearchCandidate> { winner };
        var result = ImmutableArray.CreateBuilder<SearchCandidate>();
        foreach (var candidate in ranked)
        {
            if (result.Count >= count)
            {
                break;
            }

            if (taken.TrueForAll(t => !SameDesign(t, candidate)))
            {
                taken.Add(candidate);
                result.Add(candidate);
            }
        }

        return result.ToImmutable();
    }

    /// <summary>Whether two candidates have nearly the same target and nearly the same compensator.</summary>
    internal static bool SameDesign(SearchCandidate a, SearchCandidate b)
    {
        var ta = a.Choice.Target.Point;
        var tb = b.Choice.Target.Point;
        if (Complex.Abs(ta - tb) > Resolution * Math.Max(ta.Magnitude, tb.Magnitude))
        {
            return false;
        }

        var ca = a.Design.Compensator.TransferFunction;
        var cb = b.Design.Compensator.TransferFunction;
        return Close(ca.Gain, cb.Gain) && SameRoots(ca.Zeros, cb.Zeros) && SameRoots(ca.Poles, cb.Poles);
    }

    private static bool Close(double x, double y) => Math.Abs(x - y) <= Resolution * Math.Max(Math.Abs(x), Math.Abs(y));

    private static bool SameRoots(ImmutableArray<Complex> x, ImmutableArray<Complex> y)
    {
        if (x.Length != y.Length)
        {
            return false;
        }

        var scale = Math.Max(1e-12, x.Concat(y).Select(r => r.Magnitude).DefaultIfEmpty(0).Max());
        var left = y.ToList();
        foreach (var r in x)
        {
            var nearest = left.MinBy(q => Complex.Abs(q - r));
            if (Complex.Abs(nearest - r) > Resolution * Math.Max(r.Magnitude, 0.01 * scale))
            {
                return false;
            }

            left.Remove(nearest);
        }

        return true;
    }
}
