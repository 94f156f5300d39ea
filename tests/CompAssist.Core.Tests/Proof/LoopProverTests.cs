using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Proof;

public class LoopProverTests
{
    private static TransferFunction FromText(string text) => ExpressionParser.Parse(text, requireProper: false).Value!;

    [Fact]
    public void Prove_OgataLead_HasExpectedCharacteristicPolynomialAndRoots()
    {
        // 4/(s(s+2)) with C = 4 (s+2)/(s+4): 1 + 16/(s(s+4)) → closed-loop s² + 4s + 16 and the cancelled s + 2,
        // so the characteristic polynomial is (s + 2)(s² + 4s + 16) = s³ + 6s² + 24s + 32 (hand expansion).
        var loop = Loop.Create(FromText("4/(s(s+2))"));
        var proof = LoopProver.Prove(loop, FromText("4(s+2)/(s+4)"), TargetPole.At(new Complex(-2, 2 * Math.Sqrt(3))));
        double[] expected = [1.0, 6.0, 24.0, 32.0];
        Assert.Equal(expected.Length, proof.CharacteristicDescending.Length);
        for (var k = 0; k < expected.Length; k++)
        {
            Tolerance.Close(expected[k], proof.CharacteristicDescending[k], 1e-14);
        }
        Assert.True(proof.TargetConfirmed);
        Assert.True(proof.Stable);
        var cancelled = Assert.Single(proof.Roots, r => r.Role == RootRole.Cancelled);
        Tolerance.Close(new Complex(-2, 0), cancelled.Value, 1e-12);
        Assert.Equal(2, proof.Roots.Count(r => r.Role == RootRole.Dominant));
        Tolerance.Close(0.5, proof.Roots.First(r => r.Role == RootRole.Dominant).Zeta, 1e-12);
        Assert.Contains(proof.Warnings, w => w.Contains("invisible in the reference step", StringComparison.Ordinal));
    }

    [Fact]
    public void Prove_WrongTarget_IsNotConfirmed()
    {
        var loop = Loop.Create(FromText("4/(s(s+2))"));
        var proof = LoopProver.Prove(loop, FromText("4(s+2)/(s+4)"), TargetPole.At(new Complex(-2, 3)));
        Assert.False(proof.TargetConfirmed);
        Assert.Contains(proof.Warnings, w => w.StartsWith("The target is NOT confirmed", StringComparison.Ordinal));
    }

    [Fact]
    public void Prove_UnstableLoop_IsFlagged()
    {
        // K/(s(s+1)(s+2)) is unstable for K > 6 (Routh, common practice).
        var loop = Loop.Create(FromText("1/(s(s+1)(s+2))"));
        var proof = LoopProver.Prove(loop, FromText("10"), TargetPole.At(new Complex(-1, 1)));
        Assert.False(proof.Stable);
        Assert.StartsWith("UNSTABLE", proof.Warnings[0], StringComparison.Ordinal);
    }

    [Fact]
    public void Prove_RouthBoundary_RootsOnImaginaryAxisAtSqrt2()
    {
        // K = 6 puts closed-loop roots at ±j√2 for 1/(s(s+1)(s+2)) (Routh, common practice).
        var loop = Loop.Create(FromText("1/(s(s+1)(s+2))"));
        var proof = LoopProver.Prove(loop, FromText("6"), TargetPole.At(new Complex(0, Math.Sqrt(2))));
        Tolerance.SameRoots([new Complex(0, Math.Sqrt(2)), new Complex(0, -Math.Sqrt(2)), new Complex(-3, 0)], proof.Roots.Select(r => r.Value).ToList(), 1e-12);
    }

    [Fact]
    public void Prove_PositiveFeedback_UsesMinusSign()
    {
        // 1 − K/(s+1) = 0 → s = K − 1.
        var loop = Loop.Create(FromText("1/(s+1)"), sign: FeedbackSign.Positive);
        var proof = LoopProver.Prove(loop, FromText("0.25"), TargetPole.At(new Complex(-0.75, 0)));
        Tolerance.Close(new Complex(-0.75, 0), Assert.Single(proof.Roots).Value, 1e-15);
    }

    [Fact]
    public void Prove_NonUnitySensor_PolesOfSensorAreClosedLoopZeros()
    {
        var loop = Loop.Create(FromText("1/(s(s+1))"), FromText("10/(s+10)"));
        var proof = LoopProver.Prove(loop, FromText("2"), TargetPole.At(new Complex(-0.5, 1)));
        Assert.Contains(new Complex(-10, 0), proof.ClosedLoopZeros);
        Assert.Equal(3, proof.Roots.Length);
    }

    [Fact]
    public void Prove_Delay_UsesPadeAndExactResidual()
    {
        var loop = Loop.Create(FromText("exp(-0.1s)/(s(s+1))"));
        var proof = LoopProver.Prove(loop, FromText("1"), TargetPole.At(new Complex(-0.5, 0.8)));
        Assert.True(proof.UsesPade);
        Assert.Equal(2 + 3, proof.Roots.Length);
        Assert.Contains(proof.Warnings, w => w.Contains("Padé", StringComparison.Ordinal));
    }

    public static TheoryData<string, string, double, double, bool> CancellingDesigns() => new()
    {
        // Designs whose compensator zero lands on a plant pole (invented numbers); each reported a largest relative
        // residual of order 1 for roots right to rounding before the residual was taken in product form. The PD
        // zero lands 8e-15 from the pole at −5 by itself (a near cancellation, not a shared factor).
        { "6/((s+1)(s+4))", "lead", 20, 1, true },
        { "10/(s(s+1)(s+5))", "pd", 10, 8, false },
        { "0.1/((s+0.1)(s+0.5))", "lead", 20, 3, true },
        { "10/(s(s+1)(s+5))", "lead", 15, 3, true },
    };

    [Theory]
    [MemberData(nameof(CancellingDesigns))]
    public void Prove_CancellingDesign_RootsVerifiedToRoundingAndAPerturbedRootIsNot(string plant, string type, double overshoot, double settling, bool exact)
    {
        var plantPole = ExpressionParser.ParseProper(plant).Value!.Poles.Where(p => p.Real < 0).Min(p => -p.Real);
        var run = DesignWorkflow.Run(new CaseFile
        {
            Plant = plant,
            CompensatorType = type,
            Requirements = new Requirements { MaxOvershootPercent = overshoot, MaxSettlingTime = settling },
            Lead = new LeadOptions { Placement = LeadPlacement.Cancel, Zero = -plantPole },
        });
        Assert.True(run.IsSuccess, run.Problem?.Message);
        var design = run.Report!.Design;
        var characteristic = design.Loop.Characteristic(design.Compensator.TransferFunction);
        Assert.Equal(exact, !characteristic.SharedRoots.IsEmpty);
        var proof = run.Report.Proof;
        Assert.True(proof.RootEvidence.MaxRelativeResidual <= 1e-9, $"largest residual {proof.RootEvidence.MaxRelativeResidual:G3}");
        foreach (var shared in characteristic.SharedRoots)
        {
            Assert.Contains(shared, proof.Roots.Select(r => r.Value));
        }

        // The same measure rejects a root moved by 1e-3 of its size, so this test can fail.
        foreach (var r in proof.Roots.Select(r => r.Value))
        {
            Assert.True(characteristic.RelativeResidual(r) <= 1e-9, $"root {r}: {characteristic.RelativeResidual(r):G3}");
            var moved = r * (1 + 1e-3);
            Assert.True(characteristic.RelativeResidual(moved) >= 1e-6, $"moved root {moved}: {characteristic.RelativeResidual(moved):G3}");
        }
    }
}
