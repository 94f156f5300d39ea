using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;
using CompAssist.Core.Tests.Support;
using CsCheck;

namespace CompAssist.Core.Tests.Simulation;

/// <summary>
/// The step of a loop with its delay exact, checked by different routes: the method of steps done by hand
/// (the delay-differential equation solved interval by interval in closed form; common practice, e.g. Bellman
/// and Cooke, Differential-Difference Equations) and the limit of ever higher Padé orders.
/// </summary>
public class DelayLoopStepTests
{
    private static TransferFunction Parsed(string text) => ExpressionParser.Parse(text, false).Value!;

    private static LoopCheckReport Check(Loop loop, TransferFunction c) =>
        LoopCheck.Run(loop, c, RootFinder.Find(loop.Characteristic(c)).Roots, new CheckOptions());

    [Fact]
    public void Run_FirstOrderPlantWithDelayUnderProportionalControl_MatchesTheMethodOfStepsByHand()
    {
        // G = 2e^(−0.5s)/(s+1), C = 0.8, so y' = −y + 1.6(1 − y(t − 0.5)) with y = 0 up to 0.5 s.
        // On [0.5, 1]: y = 1.6(1 − e^(−(t−0.5))). On [1, 1.5]: y = −0.96 + (A + 2.56(t−1))e^(−(t−1)) with
        // A = 1.6(1 − e^(−0.5)) + 0.96; its peak is at t − 1 = (2.56 − A)/2.56. Final value 1.6/2.6.
        var loop = Loop.Create(Parsed("2exp(-0.5s)/(s+1)"));
        var check = Check(loop, Parsed("0.8"));
        Assert.Equal(StepSolution.ExactDelay, check.Solution);
        var final = 1.6 / 2.6;
        var t10 = 0.5 - Math.Log(1 - (0.1 * final / 1.6));
        var t90 = 0.5 - Math.Log(1 - (0.9 * final / 1.6));
        var a = (1.6 * (1 - Math.Exp(-0.5))) + 0.96;
        var tau = (2.56 - a) / 2.56;
        var peak = -0.96 + ((a + (2.56 * tau)) * Math.Exp(-tau));
        Tolerance.Close(final, check.Step.FinalValue, 1e-12);
        Tolerance.Close(t90 - t10, check.Step.RiseTime, 1e-5, what: "rise time");
        Tolerance.Close(1 + tau, check.Step.PeakTime, 1e-4, what: "peak time");
        Tolerance.Close(100 * (peak - final) / final, check.Step.OvershootPercent, 0, 1e-3, "overshoot");
        Assert.Equal(0.0, check.Step.UndershootPercent);
        Assert.DoesNotContain(check.Warnings, w => w.Contains("Padé approximant of the delay (its", StringComparison.Ordinal));
    }

    [Fact]
    public void Run_RandomDelayLoops_TheHighestPadeOrderConvergesToTheExactDelayFigures()
    {
        // A first- or second-order plant with a delay of 0.05…0.6 of its time constant under a stabilising PI:
        // Padé order 10 is within a small fraction of a percent of the exact delay there, order 1 often is not.
        var gen = Gen.Select(Gen.Double[0.05, 0.6], Gen.Double[0.2, 0.6], Gen.Double[0.05, 0.3], Gen.Bool);
        var compared = 0;
        gen.Sample(
            (theta, kc, zeroFraction, secondOrder) =>
            {
                var plant = TransferFunction.FromFactors(1.0, [], secondOrder ? [new Complex(-1, 0), new Complex(-4, 0)] : [new Complex(-1, 0)], theta).Scaled(secondOrder ? 4.0 : 1.0);
                var c = TransferFunction.FromFactors(kc, [new Complex(-zeroFraction, 0)], [Complex.Zero]);
                var exact = Check(Loop.Create(plant, null, FeedbackSign.Negative, 3), c);
                var pade = Check(Loop.Create(plant, null, FeedbackSign.Negative, 10), c);
                if (!exact.Stable || !pade.Stable || !double.IsFinite(exact.Step.SettlingTime2Percent) || exact.Step.Grazes2Percent || pade.Step.Grazes2Percent)
                {
                    return;
                }

                var what = $"θ {theta:F3}, Kc {kc:F3}, zero {zeroFraction:F3}, second order {secondOrder}";
                Assert.Equal(StepSolution.ExactDelay, exact.Solution);
                Tolerance.Close(pade.Step.OvershootPercent, exact.Step.OvershootPercent, 0, 0.05, what + " overshoot");
                Tolerance.Close(pade.Step.RiseTime, exact.Step.RiseTime, 2e-3, what: what + " rise");
                Tolerance.Close(pade.Step.SettlingTime2Percent, exact.Step.SettlingTime2Percent, 2e-3, what: what + " settling");
                compared++;
            },
            iter: 30);
        Assert.True(compared > 15, $"only {compared} loops compared");
    }

    [Fact]
    public void Run_DelayInTheCompensator_SameStepAsTheDelayInThePlant()
    {
        // A single-loop delay commutes around the loop: C·e^(−θs) with G gives the same output as C with
        // G·e^(−θs). An independent RK4 integration of this loop gave 30.4934 % overshoot, 0.604012 s rise
        // and 4.94583 s (2 %) settling; the final value is 1 (an integrating plant).
        var inCompensator = Check(Loop.Create(Parsed("3/(s(s+3))")), Parsed("2exp(-0.2s)"));
        var inPlant = Check(Loop.Create(Parsed("3exp(-0.2s)/(s(s+3))")), Parsed("2"));
        Tolerance.Close(1.0, inCompensator.Step.FinalValue, 1e-9);
        Tolerance.Close(inPlant.Step.OvershootPercent, inCompensator.Step.OvershootPercent, 1e-9);
        Tolerance.Close(inPlant.Step.SettlingTime2Percent, inCompensator.Step.SettlingTime2Percent, 1e-9);
        Tolerance.Close(30.4934, inCompensator.Step.OvershootPercent, 0, 1e-3);
        Tolerance.Close(0.604012, inCompensator.Step.RiseTime, 1e-5);
        Tolerance.Close(4.94583, inCompensator.Step.SettlingTime2Percent, 1e-5);
    }

    [Fact]
    public void Simulate_NoDelay_Null()
    {
        Assert.Null(DelayLoopStep.Simulate(Loop.Create(Parsed("1/(s+1)")), Parsed("1"), 10));
    }
}
