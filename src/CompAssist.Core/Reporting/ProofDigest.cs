using System.Collections.Immutable;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Reporting;

/// <summary>
/// The proof of a design in a few short items, for a compact front end (a status area of two lines):
/// stability, target confirmation, each requirement against its measurement, margins, actuator effort,
/// steady state and robustness. Each item says whether it passes, fails or is information only.
/// </summary>
public static class ProofDigest
{
    /// <summary>The digest of a proved design; <paramref name="robustness"/> and <paramref name="sweepNote"/> describe the sweep (done, or its progress).</summary>
    public static ImmutableArray<DigestItem> Of(DesignReport report, RobustnessReport? robustness, string? sweepNote = null)
    {
        ArgumentNullException.ThrowIfNull(report);
        var items = ImmutableArray.CreateBuilder<DigestItem>();
        var proof = report.Proof;
        var check = report.Check;
        var verdict = LoopVerdict.Of(check, robustness);
        items.Add(new DigestItem(verdict.Meets ? "meets all" : "FAILS", verdict.Meets));
        items.Add(new DigestItem(proof.Stable ? "stable" : $"UNSTABLE ({check.UnstableRootCount} RHP)", proof.Stable));
        items.Add(new DigestItem(proof.TargetConfirmed ? "s* is a root" : "s* NOT a root", proof.TargetConfirmed));
        foreach (var c in check.Checks.Where(c => c.Required is not null))
        {
            var measured = c.Valid ? (c.Name == RequirementChecks.PeakTime && double.IsPositiveInfinity(c.Measured) ? "none" : N(c.Measured, 3)) : "-";
            items.Add(new DigestItem($"{Short(c.Name)} {measured} {c.BoundSymbol} {N(c.Required!.Value, 3)}", c.Passes));
        }

        if (check.Checks.FirstOrDefault(c => c.Name == RequirementChecks.Overshoot) is { Required: null } os && check.Stable)
        {
            items.Add(new DigestItem($"OS {N(os.Measured, 3)}%", null));
        }

        if (check.Margins is { } m)
        {
            items.Add(new DigestItem($"PM {N(m.PhaseMarginDeg, 3)}°", m.PhaseMarginDeg >= 30 ? null : false));
            items.Add(new DigestItem(double.IsPositiveInfinity(m.GainMarginDb) ? "GM inf" : $"GM {N(m.GainMarginDb, 3)} dB", null));
        }

        var e = check.EffortFigures;
        if (e.Room is null)
        {
            items.Add(new DigestItem($"|u| peak {N(e.Peak, 3)}", null));
        }

        if (report.Design.SteadyState is { } steady && !check.Checks.Any(c => c.Name.StartsWith("error constant", StringComparison.Ordinal)))
        {
            items.Add(new DigestItem($"{steady.Requirement.Symbol} {N(steady.After, 3)} ≥ {N(steady.Requirement.Value, 3)}", steady.Met));
        }

        if (robustness is not null)
        {
            var stable = robustness.Corners.Count(c => c.Stable);
            var meet = robustness.Corners.Count(c => c.Meets);
            items.Add(new DigestItem($"robust {stable}/{robustness.Corners.Length} stable, {meet}/{robustness.Corners.Length} meet, worst OS {N(robustness.WorstOvershootPercent, 3)}%", robustness.AllMeet));
        }
        else if (sweepNote is not null)
        {
            items.Add(new DigestItem(sweepNote, null));
        }

        if (report.Prefilter is { } prefilter)
        {
            items.Add(new DigestItem($"with F: OS {N(prefilter.Step.OvershootPercent, 3)}% ts2% {N(prefilter.Step.SettlingTime2Percent, 3)}", null));
        }

        // Information last: a two-line status area shows the verdict, the requirements and the sweep first.
        if (check.Stable && report.Design.SteadyState is null && Math.Abs(1 - check.Step.FinalValue) > 0.02)
        {
            items.Add(new DigestItem($"y(∞) {N(check.Step.FinalValue, 3)} ≠ 1", null));
        }

        if (check.LoadDisturbance is { } load)
        {
            items.Add(new DigestItem($"load peak {N(load.Peak, 3)}{(load.Offset == 0 ? string.Empty : $", offset {N(load.Offset, 3)}")}", null));
        }

        if (check.Frequency is { Bandwidth: var bandwidth } && double.IsFinite(bandwidth))
        {
            items.Add(new DigestItem($"ωB {N(bandwidth, 3)}", null));
        }

        return items.ToImmutable();
    }

    private static string Short(string name) => name switch
    {
        _ when name.StartsWith("overshoot", StringComparison.Ordinal) => "OS%",
        _ when name.StartsWith("settling time 2", StringComparison.Ordinal) => "ts2%",
        _ when name.StartsWith("settling time 5", StringComparison.Ordinal) => "ts5%",
        _ when name.StartsWith("peak time", StringComparison.Ordinal) => "tp",
        RequirementChecks.ActuatorPeak => "|u|",
        RequirementChecks.CommandHighest => "u max",
        RequirementChecks.CommandLowest => "u min",
        _ when name.StartsWith("error constant ", StringComparison.Ordinal) => name["error constant ".Length..],
        _ => name,
    };

    private static string N(double x, int digits) => TransferFunctionFormatter.Number(x, digits);
}
