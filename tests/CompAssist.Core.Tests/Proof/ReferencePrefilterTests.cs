using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

/// <summary>
/// The reference prefilter against the second-order closed forms (common practice: overshoot
/// e^(−πζ/√(1 − ζ²))) and its refusals: a dipole's zero, a loop with T(0) = 0.
/// </summary>
public class ReferencePrefilterTests
{
    private static TransferFunction Expression(string text) => ExpressionParser.Parse(text, requireProper: false).Value!;

    [Fact]
    public void Design_PiOnAFirstOrderPlant_LeavesThePureSecondOrderStep()
    {
        // 1/(s+1) with 3(s+2)/s: T = 3(s+2)/(s² + 4s + 6). F = 2/(s+2) leaves 6/(s² + 4s + 6): ωn = √6,
        // ζ = 4/(2√6) = 0.8165, overshoot e^(−πζ/√(1 − ζ²)) = 1.18 % (by hand), final value 1.
        var loop = Loop.Create(Expression("1/(s+1)"));
        var c = Expression("3(s+2)/s");
        var roots = RootFinder.Find(loop.Characteristic(c)).Roots;
        var (prefilter, why) = ReferencePrefilter.Design(loop, c, roots, new Complex(-2, Math.Sqrt(2)));
        Assert.True(prefilter is not null, why);
        var cancelled = Assert.Single(prefilter.Cancelled);
        Tolerance.Close(-2.0, cancelled.Real, 1e-12);
        Tolerance.Close(1.0, prefilter.Filter.DcGain, 1e-12, what: "F(0) = 1/T(0) = 1 (T is type 1)");
        Tolerance.Close(2.0, prefilter.Filter.Gain, 1e-12, what: "F = 2/(s + 2)");
        var zeta = 4 / (2 * Math.Sqrt(6));
        Tolerance.Close(100 * Math.Exp(-Math.PI * zeta / Math.Sqrt(1 - (zeta * zeta))), prefilter.Step.OvershootPercent, 1e-6, what: "overshoot with F");
        Tolerance.Close(1.0, prefilter.Step.FinalValue, 1e-12);
        var without = LoopCheck.Run(loop, c, new CheckOptions());
        Assert.True(without.Step.OvershootPercent > prefilter.Step.OvershootPercent + 1, "the zero adds overshoot without F");
        // The command with F starts at 0 (F is strictly proper) instead of Kp = 3.
        Assert.Equal(0.0, prefilter.CommandLowest, 9);
        Assert.True(prefilter.CommandHighest < 3.0);
    }

    [Fact]
    public void Design_LagDipole_KeptWithItsReason()
    {
        // A lag zero at −0.1 with its pole at −0.01 on 1/(s(s+1)) under gain 0.5: s³ + 1.01s² + 0.51s + 0.05 has a
        // real root near −0.125 (by hand: the cubic changes sign between −0.125 and −0.13), beside the zero; cancelling
        // the zero would leave that slow pole in the reference step (the step with F would settle in about 33 s).
        var loop = Loop.Create(Expression("1/(s(s+1))"));
        var c = Expression("0.5(s+0.1)/(s+0.01)");
        var roots = RootFinder.Find(loop.Characteristic(c)).Roots;
        var (prefilter, why) = ReferencePrefilter.Design(loop, c, roots, new Complex(-0.45, 0.5));
        Assert.Null(prefilter);
        Assert.Contains("dipole", why, StringComparison.Ordinal);
    }

    [Fact]
    public void CaseFile_PrefilterKey_ReadAndWrittenBack()
    {
        var (input, error) = CaseFileReader.Read("format = 1\n[loop]\nplant = \"1/(s+1)\"\n[compensator]\ntype = \"pi\"\nprefilter = true\n", "p.toml");
        Assert.Null(error);
        Assert.True(input!.Prefilter);
        var (again, error2) = CaseFileReader.Read(CaseFileWriter.Write(input), "p.toml");
        Assert.Null(error2);
        Assert.True(again!.Prefilter);
    }

    [Fact]
    public void Design_IdealPd_CommandWithTheFilterIsFinite()
    {
        // C = 3(s + 2.6667) on 1/(s(s+1)) (an ideal PD): F = 2.6667/(s + 2.6667) makes C·F = 8, so u(0+) = 8 (by hand).
        var loop = Loop.Create(Expression("1/(s(s+1))"));
        var c = Expression("3(s+2.6666666666666665)");
        var roots = RootFinder.Find(loop.Characteristic(c)).Roots;
        var (prefilter, why) = ReferencePrefilter.Design(loop, c, roots, new Complex(-2, 2));
        Assert.True(prefilter is not null, why);
        Tolerance.Close(8.0, prefilter.CommandHighest, 1e-9, what: "u(0+) = C·F = 8");
    }
}
