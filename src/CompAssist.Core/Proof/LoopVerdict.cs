using System.Collections.Immutable;

namespace CompAssist.Core.Proof;

/// <summary>
/// The one verdict of a proof, used by every front end for its status line, its JSON and its exit code:
/// the loop must be stable and every requirement must hold nominally and, when variations are given, at
/// every corner of the variation box.
/// </summary>
/// <param name="Kind">What was concluded.</param>
/// <param name="Reasons">Why it is not <see cref="VerdictKind.Meets"/> (empty when it is), each a plain sentence.</param>
public sealed record LoopVerdict(VerdictKind Kind, ImmutableArray<string> Reasons)
{
    /// <summary>True when the loop is stable and every requirement holds everywhere it was asked to.</summary>
    public bool Meets => Kind == VerdictKind.Meets;

    /// <summary>Our lower-case name of the verdict, as JSON prints it.</summary>
    public string Name => Kind switch
    {
        VerdictKind.Meets => "meets",
        VerdictKind.Unstable => "unstable",
        VerdictKind.RequirementFails => "requirement-fails",
        VerdictKind.UnstableAtCorner => "unstable-at-corner",
        _ => "fails-at-corner",
    };

    /// <summary>One status line for people.</summary>
    public string Status(int corners) => Kind switch
    {
        VerdictKind.Meets when corners > 0 => $"MEETS every requirement, nominally and at all {corners} variation corners",
        VerdictKind.Meets => "MEETS every requirement (nominal loop; no variations given)",
        VerdictKind.Unstable => "FAILS: the closed loop is unstable",
        VerdictKind.RequirementFails => "FAILS: a requirement does not hold on the nominal loop",
        VerdictKind.UnstableAtCorner => "FAILS: the loop is unstable at a variation corner",
        _ => "FAILS: a requirement does not hold at a variation corner",
    };

    /// <summary>Judges a proved loop.</summary>
    public static LoopVerdict Of(LoopCheckReport check, RobustnessReport? robustness)
    {
        ArgumentNullException.ThrowIfNull(check);
        var reasons = ImmutableArray.CreateBuilder<string>();
        if (!check.Stable)
        {
            reasons.Add($"{check.UnstableRootCount} closed-loop root{(check.UnstableRootCount == 1 ? " is" : "s are")} in the right half-plane or on the imaginary axis");
            return new LoopVerdict(VerdictKind.Unstable, reasons.ToImmutable());
        }

        foreach (var c in check.Checks.Where(c => c.Passes == false))
        {
            reasons.Add($"{c.Name} is {F(c.Measured)} against {c.BoundSymbol} {F(c.Required!.Value)}");
        }

        if (reasons.Count > 0)
        {
            return new LoopVerdict(VerdictKind.RequirementFails, reasons.ToImmutable());
        }

        if (robustness is null)
        {
            return new LoopVerdict(VerdictKind.Meets, []);
        }

        var unstable = robustness.Corners.Where(c => !c.Stable).ToList();
        foreach (var corner in unstable)
        {
            reasons.Add($"unstable at the corner {robustness.Describe(corner)}");
        }

        if (reasons.Count > 0)
        {
            return new LoopVerdict(VerdictKind.UnstableAtCorner, reasons.ToImmutable());
        }

        foreach (var (corner, row) in robustness.WorstFailures())
        {
            reasons.Add($"{row.Name} is {F(row.Measured)} against {row.BoundSymbol} {F(row.Required!.Value)} at the corner {robustness.Describe(corner)}");
        }

        return reasons.Count > 0 ? new LoopVerdict(VerdictKind.FailsAtCorner, reasons.ToImmutable()) : new LoopVerdict(VerdictKind.Meets, []);
    }

    private static string F(double x) => Model.TransferFunctionFormatter.Number(x, 4);
}
