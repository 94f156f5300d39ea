using CompAssist.Core.Cases;
using CompAssist.Core.Search;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Workflow;

public class DesignWorkflowKindsTests
{
    private static CaseFile Case(string plant, double overshoot, double settling) => new()
    {
        Plant = plant,
        Requirements = new Requirements { MaxOvershootPercent = overshoot, MaxSettlingTime = settling },
    };

    [Fact]
    public void SearchKinds_LeadAndPiOnAMotor_KeepsTheOneThatMeetsAndListsBoth()
    {
        // 25/(s(s + 5)) for 10 % and 1.2 s: a lead meets (the search tests show it); a PI adds lag to a loop
        // that already needs lead, so it cannot be the better one. Each kind's row is in the order asked.
        var input = Case("25/(s(s+5))", 10, 1.2);
        var run = DesignWorkflow.SearchKinds(input, [CompensatorKind.PI, CompensatorKind.Lead], new SearchOptions());
        Assert.True(run.IsSuccess, run.Problem?.ToString());
        var report = run.Report!;
        Assert.Equal(CompensatorKind.Lead, report.Design.Compensator.Kind);
        Assert.Equal(["pi", "lead"], report.KindsCompared.Select(k => k.Kind));
        var lead = report.KindsCompared.Single(k => k.Kind == "lead");
        Assert.True(lead.Meets);
        Assert.Equal(report.Search!.Winner.Objective, lead.Objective);
        var pi = report.KindsCompared.Single(k => k.Kind == "pi");
        Assert.True(!pi.Meets || pi.Objective >= lead.Objective);
    }

    [Fact]
    public void SearchKinds_StatedChoiceOfAnotherKind_ReportedAsUnusedByTheKindWithoutIt()
    {
        var input = Case("25/(s(s+5))", 10, 1.2) with { Slow = new SlowPoleOptions { FilterRatio = 10 } };
        var run = DesignWorkflow.SearchKinds(input, [CompensatorKind.Lead, CompensatorKind.PD], new SearchOptions { Pinned = SearchPins.FilterRatio });
        Assert.True(run.IsSuccess);
        var rows = run.Report!.KindsCompared;
        Assert.Contains("derivative filter", rows.Single(k => k.Kind == "lead").UnusedChoices, StringComparison.Ordinal);
        Assert.Equal(string.Empty, rows.Single(k => k.Kind == "pd").UnusedChoices);
    }

    [Fact]
    public void SearchKinds_AtTheCorner_EachKindDesignedAtTheCornerNotSearched()
    {
        // A lead meets 10 % / 1.2 s on 25/(s(s+5)) at the corner too (the corner target is the same for both
        // kinds); a PI needs phase lead there and is refused, so the lead is kept and the PI's row says why.
        var input = Case("25/(s(s+5))", 10, 1.2);
        var run = DesignWorkflow.SearchKinds(input, [CompensatorKind.PI, CompensatorKind.Lead], new SearchOptions(), atCorner: true);
        Assert.True(run.IsSuccess, run.Problem?.ToString());
        var report = run.Report!;
        Assert.Null(report.Search);
        Assert.Equal(CompensatorKind.Lead, report.Design.Compensator.Kind);
        Assert.Equal(DesignWorkflow.Run(input).Report!.Design.Target.Point, report.Design.Target.Point);
        Assert.Equal(["pi", "lead"], report.KindsCompared.Select(k => k.Kind));
    }

    [Fact]
    public void SearchKinds_Empty_IsMisuse()
    {
        Assert.Throws<ArgumentException>(() => DesignWorkflow.SearchKinds(Case("1/s", 10, 1), [], new SearchOptions()));
    }
}
