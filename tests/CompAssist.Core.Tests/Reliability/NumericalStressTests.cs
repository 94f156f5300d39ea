using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Locus;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Reliability;

/// <summary>Hard loops: every answer is either verified or refused with a reason, never silently wrong.</summary>
public class NumericalStressTests
{
    public static TheoryData<string, double, double> HardLoops() => new()
    {
        // Order 30 with repeated poles.
        { "1/((s+1)^10 (s+2)^10 (s+5)^10)", -0.3, 0.4 },
        // Near pole–zero cancellations.
        { "(s+1.000001)(s+3.00001)/(s (s+1) (s+3) (s+10))", -1.5, 2 },
        // Poles over eight decades.
        { "1/((s+0.001)(s+0.1)(s+10)(s+1000)(s+100000))", -0.05, 0.05 },
        // Target very close to an open-loop pole.
        { "1/(s (s+2) (s^2+2s+5))", -1.0000001, 2.0000001 },
        // A delay.
        { "exp(-0.2s)/(s (s+1))", -0.4, 0.6 },
    };

    [Theory]
    [MemberData(nameof(HardLoops))]
    public void Design_HardLoop_VerifiedOrRefused(string plant, double re, double im)
    {
        foreach (var kind in new[] { "lead", "pd", "pid" })
        {
            var run = DesignWorkflow.Run(new CaseFile { Plant = plant, CompensatorType = kind, Requirements = new Requirements { Point = new Complex(re, im) } });
            if (run.IsSuccess)
            {
                var proof = run.Report!.Proof;
                Assert.True(proof.TargetConfirmed, $"{kind} on {plant}: target not confirmed ({proof.TargetResidual})");
                Assert.True(proof.RootEvidence.MaxRelativeResidual <= 1e-9 || proof.RootEvidence.MaxRelativeStep <= 1e-10);
            }
            else
            {
                Assert.True(run.Problem is not null || run.FieldError is not null);
            }
        }
    }

    public static TheoryData<string> HardPlants()
    {
        var data = new TheoryData<string>();
        foreach (var row in HardLoops())
        {
            data.Add((string)row[0]);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(HardPlants))]
    public void Locus_HardLoop_PointsOnLocus(string plant)
    {
        var loop = Loop.Create(ExpressionParser.ParseProper(plant).Value!);
        var locus = LocusEngine.Compute(loop);
        var open = loop.RationalOpenLoop(TransferFunction.Unity).Scaled(loop.SignFactor);
        foreach (var p in locus.Branches.SelectMany(b => b).Where(p => p.Gain > 0))
        {
            var f = new CompAssist.Core.Numerics.CharacteristicFunction(open.PoleFactors, p.Gain * open.Gain, open.ZeroFactors);
            Assert.True(f.RelativeResidual(p.Root) <= 1e-9, $"{plant}: residual {f.RelativeResidual(p.Root)} at K={p.Gain}");
        }
    }

    [Fact]
    public void Check_PositiveFeedbackOrderThirtyWithFifteenFoldPoles_AnsweredOrFlagged()
    {
        // Fifteen-fold poles make the closed-loop roots a tight cluster that expanded coefficients cannot
        // resolve: the tool must either verify its roots or say that it cannot — never print unverified poles.
        var run = CheckWorkflow.Run(new CaseFile { Plant = "1/((s+1)^15 (s+3)^15)", Sign = FeedbackSign.Positive }, "0.5");
        if (run.Result is { } result)
        {
            Assert.Equal(result.Check.Stable, result.Check.Margins is not null);
        }
        else
        {
            Assert.Contains("could not be verified", run.Problem!.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Check_OrderThirtyDistinctPoles_Verified()
    {
        var poles = string.Concat(Enumerable.Range(1, 30).Select(k => $"(s+{(0.3 * k).ToString(System.Globalization.CultureInfo.InvariantCulture)})"));
        var run = CheckWorkflow.Run(new CaseFile { Plant = "1/" + poles }, "1e6");
        Assert.NotNull(run.Result);
        Assert.Equal(30, run.Result!.ClosedLoopPoles.Length);
    }
}
