using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Synthesis;

public class LeadDesignerTests
{
    private static Loop LoopOf(string plant, string feedback = "1", FeedbackSign sign = FeedbackSign.Negative) =>
        Loop.Create(ExpressionParser.ParseProper(plant).Value!, ExpressionParser.ParseProper(feedback).Value!, sign);

    private static Design Designed(Loop loop, Complex target, LeadOptions options)
    {
        var outcome = LeadDesigner.Design(loop, TargetPole.At(target), options);
        Assert.True(outcome.IsSuccess, outcome.Problem?.ToString());
        return outcome.Value;
    }

    /// <summary>|L(s)| of the uncompensated plant times the stage factors, computed directly (independent check).</summary>
    private static double GainByHand(Complex s, double plantGain, Complex[] plantPoles, double zero, double pole) =>
        plantPoles.Aggregate(1.0, (m, p) => m * Complex.Abs(s - p)) * Complex.Abs(s - pole) / (plantGain * Complex.Abs(s - zero));

    private static readonly Complex OgataTarget = new(-2, 2 * Math.Sqrt(3));

    [Fact]
    public void Design_Ogata5thEx6_6_Bisector_MatchesBookAndExactGeometry()
    {
        // Ogata, Modern Control Engineering, 5th ed., Example 6-6 (from memory): G = 4/(s(s+2)), desired poles
        // −2 ± j2√3, deficiency 30°; bisector construction gives zero ≈ −2.9, pole ≈ −5.4, Kc ≈ 4.68 (book's
        // graphical rounding). Exact: the bisector is at 60° from the horizontal (β/2 with β = 120°), so the zero
        // is seen under 75° and the pole under 45°.
        var d = Designed(LoopOf("4/(s(s+2))"), OgataTarget, new LeadOptions { Placement = LeadPlacement.Bisector });
        var stage = Assert.Single(d.Compensator.Stages);
        Tolerance.Close(30.0, d.AngleDeficiencyDegrees, 1e-12);
        var exactZero = -2 - (2 * Math.Sqrt(3) / Math.Tan(75 * Math.PI / 180));
        var exactPole = -2 - (2 * Math.Sqrt(3) / Math.Tan(45 * Math.PI / 180));
        Tolerance.Close(exactZero, stage.Zero, 1e-14);
        Tolerance.Close(exactPole, stage.Pole, 1e-14);
        Tolerance.Close(-2.9, stage.Zero, 0, 0.05, "book zero");
        Tolerance.Close(-5.4, stage.Pole, 0, 0.1, "book pole");
        Tolerance.Close(GainByHand(OgataTarget, 4, [0, -2], exactZero, exactPole), d.Compensator.Gain, 1e-13);
        Tolerance.Close(4.68, d.Compensator.Gain, 0.015, what: "book gain");
    }

    [Fact]
    public void Design_Ogata5thEx6_6_CancelPlantPole_GivesExactValues()
    {
        // Same loop, zero on the plant pole at −2: L = 4K/(s(s+p)); the 180° condition at −2 + j2√3 needs
        // ∠(s+p) = 60°, so p = −4, and |s||s+4|/4 = 4·4/4 gives K = 4 (hand calculation).
        var d = Designed(LoopOf("4/(s(s+2))"), OgataTarget, new LeadOptions { Placement = LeadPlacement.Cancel });
        var stage = Assert.Single(d.Compensator.Stages);
        Assert.Equal(-2.0, stage.Zero);
        Tolerance.Close(-4.0, stage.Pole, 1e-14);
        Tolerance.Close(4.0, d.Compensator.Gain, 1e-14);
    }

    [Fact]
    public void Design_DorfBishopDoubleIntegrator_Beneath_MatchesBookWithinRounding()
    {
        // Dorf & Bishop, Modern Control Systems (12th ed., lead design on a double integrator; from memory):
        // G = 1/s², target −1 ± 2j, zero beneath at −1, pole ≈ −3.6, K ≈ 8.1. Exact: deficiency
        // 2·(180° − atan 2) − 180° = 53.13°, pole seen under 36.87° → −1 − 2/0.75 = −3.667; K = |s|²|s+p|/|s+1|.
        var target = new Complex(-1, 2);
        var d = Designed(LoopOf("1/s^2"), target, new LeadOptions { Placement = LeadPlacement.Beneath });
        var stage = Assert.Single(d.Compensator.Stages);
        Tolerance.Close((2 * (180 - (Math.Atan(2) * 180 / Math.PI))) - 180, d.AngleDeficiencyDegrees, 1e-12);
        Assert.Equal(-1.0, stage.Zero);
        Tolerance.Close(-1 - (2 / 0.75), stage.Pole, 1e-13);
        Tolerance.Close(GainByHand(target, 1, [0, 0], -1, -1 - (2 / 0.75)), d.Compensator.Gain, 1e-13);
        Tolerance.Close(-3.6, stage.Pole, 0, 0.1, "book pole");
        Tolerance.Close(8.1, d.Compensator.Gain, 0.04, what: "book gain");
    }

    public static TheoryData<LeadPlacement, double?, double?, double?> EveryPlacement() => new()
    {
        { LeadPlacement.Beneath, null, null, null },
        { LeadPlacement.Bisector, null, null, null },
        { LeadPlacement.Cancel, null, null, null },
        { LeadPlacement.FixedZero, -1.5, null, null },
        { LeadPlacement.FixedPole, null, -12.0, null },
        { LeadPlacement.Ratio, null, null, 6.0 },
    };

    [Theory]
    [MemberData(nameof(EveryPlacement))]
    public void Design_EveryPlacement_IsProvedByRootFinding(LeadPlacement placement, double? zero, double? pole, double? ratio)
    {
        var loop = LoopOf("10/(s(s+2)(s+10))");
        var target = new Complex(-1.5, 2.5);
        var d = Designed(loop, target, new LeadOptions { Placement = placement, Zero = zero, Pole = pole, Ratio = ratio });
        var proof = LoopProver.Prove(loop, d.Compensator.TransferFunction, d.Target);
        Assert.True(proof.TargetConfirmed, $"residual {proof.TargetResidual}");
        Assert.True(proof.TargetResidual <= 1e-9);
        foreach (var st in d.Compensator.Stages)
        {
            Assert.True(st.Pole < st.Zero && st.Zero < 0, $"zero {st.Zero}, pole {st.Pole}");
        }

        Assert.Equal(d.AngleDeficiencyDegrees, d.Compensator.Stages.Sum(st => st.AngleAtTargetDegrees), 9);
        switch (placement)
        {
            case LeadPlacement.FixedZero:
                Assert.Equal(-1.5, d.Compensator.Stages[0].Zero);
                break;
            case LeadPlacement.FixedPole:
                Assert.Equal(-12.0, d.Compensator.Stages[0].Pole);
                break;
            case LeadPlacement.Ratio:
                Tolerance.Close(6.0, d.Compensator.Stages[0].PoleZeroRatio, 1e-12);
                break;
            case LeadPlacement.Cancel:
                Assert.Equal(-2.0, d.Compensator.Stages[0].Zero);
                break;
        }
    }

    [Fact]
    public void Design_BisectorMinimisesRatio_AmongPlacements()
    {
        // The bisector construction gives the smallest pole/zero ratio for a given angle (common practice;
        // Ogata, Modern Control Engineering, 5th ed., section 6-8: it gives the largest α = z/p).
        var loop = LoopOf("10/(s(s+2)(s+10))");
        var target = new Complex(-1.5, 2.5);
        var bisector = Designed(loop, target, new LeadOptions { Placement = LeadPlacement.Bisector }).Compensator.Stages[0].PoleZeroRatio;
        foreach (var zero in new[] { -0.5, -1.0, -1.5, -2.5, -3.0 })
        {
            var other = LeadDesigner.Design(loop, TargetPole.At(target), new LeadOptions { Placement = LeadPlacement.FixedZero, Zero = zero });
            if (other.IsSuccess)
            {
                Assert.True(other.Value.Compensator.Stages[0].PoleZeroRatio >= bisector - 1e-9);
            }
        }
    }

    [Fact]
    public void Design_LargeDeficiency_SplitsIntoIdenticalStages()
    {
        // 1/(s(s+1)^2) needs about 110° at −1 + 2j: two stages of about 55°.
        var d = Designed(LoopOf("1/(s(s+1)^2)"), new Complex(-1, 2), new LeadOptions { Placement = LeadPlacement.Bisector });
        Assert.Equal(2, d.StageCount);
        Assert.Equal(d.Compensator.Stages[0], d.Compensator.Stages[1]);
        Assert.Contains(d.Notes, n => n.Contains("identical stages", StringComparison.Ordinal));
        var proof = LoopProver.Prove(d.Loop, d.Compensator.TransferFunction, d.Target);
        Assert.True(proof.TargetConfirmed);
    }

    public static TheoryData<string, double, double, LeadOptions, string> Refusals() => new()
    {
        { "4/(s(s+2))", -1, 3, new LeadOptions(), "The target is already on the uncompensated locus" },
        { "4/(s(s+2))", -0.5, 0.5, new LeadOptions(), "The target needs" },
        { "4/(s(s+2))", 1, 2, new LeadOptions(), "is not in the left half-plane" },
        { "4/(s(s+2))", -2, 0, new LeadOptions(), "The target is on the real axis" },
        { "4/((s+2)(s^2+2s+5))", -1, 2, new LeadOptions(), "The target coincides with an open-loop pole" },
        { "4/(s(s-1))", -2, 3, new LeadOptions { Placement = LeadPlacement.Cancel, Zero = 1 }, "is unstable" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.Cancel, Zero = 0 }, "is at the origin" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.Cancel, Zero = -7 }, "The plant has no pole at -7 to cancel" },
        { "1/((s+1)(s^2+0.2s+4))", -2, 3, new LeadOptions { Placement = LeadPlacement.Cancel, Zero = -0.1 }, "is complex" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.FixedZero, Zero = 0.5 }, "is not in the left half-plane" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.FixedZero, Zero = -20 }, "too little to add" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.FixedPole, Pole = -1.9 }, "leaves too little room" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.Ratio, Ratio = 1.2 }, "adds at most" },
        { "4/(s(s+2))", -2, 3.4641016151377544, new LeadOptions { Placement = LeadPlacement.Ratio, Ratio = 0.5 }, "is not a lead" },
        { "1/s^2", -1, 2, new LeadOptions { MaxStageAngleDegrees = 10 }, "more than 4 stages" },
    };

    [Theory]
    [MemberData(nameof(Refusals))]
    public void Design_ImpossibleOrUnwise_RefusesWithReasonAndHint(string plant, double re, double im, LeadOptions options, string reason)
    {
        var outcome = LeadDesigner.Design(LoopOf(plant), TargetPole.At(new Complex(re, im)), options);
        Assert.False(outcome.IsSuccess);
        Assert.Contains(reason, outcome.Problem!.Message, StringComparison.Ordinal);
        Assert.False(string.IsNullOrWhiteSpace(outcome.Problem.Hint));
    }

    [Fact]
    public void Design_PositiveFeedbackAndSensor_UsesWholeLoopAngle()
    {
        // Positive feedback around a plant with negative gain is the same loop as negative feedback around
        // the positive plant: the two designs must coincide.
        var target = new Complex(-2, 3);
        var a = Designed(LoopOf("-5/(s(s+1))", "10/(s+10)", FeedbackSign.Positive), target, new LeadOptions());
        var b = Designed(LoopOf("5/(s(s+1))", "10/(s+10)"), target, new LeadOptions());
        Tolerance.Close(b.Compensator.Stages[0].Zero, a.Compensator.Stages[0].Zero, 1e-12);
        Tolerance.Close(b.Compensator.Gain, a.Compensator.Gain, 1e-12);
    }

    [Fact]
    public void Design_CancelWithTwoStages_OneZeroOnThePoleTheOtherByTheBisector()
    {
        // 10/(s(s+1)(s+5)) at −3 + 4j needs 126.87° (180° − 53.13°, by hand): three stages of 42.29°. One zero
        // cancels −1, the other stages are placed by the bisector rule, not stacked on −1 (a multiple zero there
        // would cancel nothing more).
        var loop = LoopOf("10/(s(s+1)(s+5))");
        var target = new Complex(-3, 4);
        var d = Designed(loop, target, new LeadOptions { Placement = LeadPlacement.Cancel, Zero = -1 });
        Tolerance.Close(126.87, d.AngleDeficiencyDegrees, 0, 0.01, "deficiency by hand");
        Assert.Equal(3, d.Compensator.Stages.Length);
        Assert.Equal(-1.0, d.Compensator.Stages[0].Zero);
        var bisector = LeadDesigner.Design(loop, TargetPole.At(target), new LeadOptions { Placement = LeadPlacement.Bisector }).Value!;
        foreach (var stage in d.Compensator.Stages.Skip(1))
        {
            Assert.NotEqual(-1.0, stage.Zero!.Value, 6);
            Tolerance.Close(bisector.Compensator.Stages[0].Zero, stage.Zero, 1e-9, what: "the other stages are the bisector's stage");
        }
        Tolerance.Close(d.AngleDeficiencyDegrees, d.Compensator.Stages.Sum(st => st.AngleAtTargetDegrees), 1e-9, what: "the stages together add the deficiency");
        Assert.True(LoopProver.Prove(loop, d.Compensator.TransferFunction, d.Target).TargetResidual <= 1e-9);
    }
}
