using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;
using CsCheck;

namespace CompAssist.Core.Tests.Simulation;

/// <summary>
/// Step figures on the exact solution, checked by a different route: partial fractions of T(s)/s scanned by
/// brute force (<see cref="PartialFractionStep"/>) and the second-order closed forms (common practice:
/// overshoot e^(−πζ/√(1−ζ²)), peak time π/ωd). Targets: times within 0.1 %, overshoot within 0.01
/// percentage points, whatever the ratio of the fastest to the slowest mode.
/// </summary>
public class StepAnalysisTests
{
    private static TransferFunction FromText(string text) => ExpressionParser.Parse(text, false).Value!;

    private static (LoopCheckReport Check, TransferFunction Output, ImmutableArray<Complex> Roots) Prove(Loop loop, TransferFunction c, Requirements? requirements = null)
    {
        var roots = RootFinder.Find(loop.Characteristic(c)).Roots;
        return (LoopCheck.Run(loop, c, roots, new CheckOptions(), requirements), ClosedLoopTransfers.Of(loop, c, roots).Output, roots);
    }

    private static void AssertMatchesPartialFractions(StepMetrics m, TransferFunction output, string what)
    {
        var pf = PartialFractionStep.Of(output);
        var (overshoot, peakTime, undershoot, rise, ts2, ts5) = pf.Figures(m.Horizon, 400_000);
        Tolerance.Close(overshoot, m.OvershootPercent, 0, 0.01, what + " overshoot");
        Tolerance.Close(undershoot, m.UndershootPercent, 0, 0.01, what + " undershoot");
        if (overshoot > 0.01 && m.OvershootPercent > 0.01)
        {
            Tolerance.Close(peakTime, m.PeakTime, 1e-3, 1e-9 * m.Horizon, what + " peak time");
        }
        else if (overshoot == 0)
        {
            Assert.True(m.OvershootPercent < 1e-6 || double.IsFinite(m.PeakTime), what + " a peak time for an overshoot");
        }

        Tolerance.Close(rise, m.RiseTime, 1e-3, 0, what + " rise time");
        Tolerance.Close(ts2, m.SettlingTime2Percent, 1e-3, 0, what + " 2 % settling");
        Tolerance.Close(ts5, m.SettlingTime5Percent, 1e-3, 0, what + " 5 % settling");
    }

    [Fact]
    public void Measure_InvertingLoopWithPositiveFeedback_OvershootTowardTheFinalValue()
    {
        // G = −4/(s(s+2)) with positive feedback: T = −4/(s² + 2s + 4), ζ = 0.5, ωn = 2, final value −1.
        // Overshoot e^(−πζ/√(1−ζ²)) = 16.303 % toward −1 (common practice), peak time π/ωd = π/√3.
        var loop = Loop.Create(FromText("-4/(s(s+2))"), null, FeedbackSign.Positive);
        var (check, _, _) = Prove(loop, TransferFunction.Unity, new Requirements { MaxOvershootPercent = 5 });
        var zeta = 0.5;
        Tolerance.Close(-1.0, check.Step.FinalValue, 1e-12);
        Tolerance.Close(100 * Math.Exp(-Math.PI * zeta / Math.Sqrt(1 - (zeta * zeta))), check.Step.OvershootPercent, 0, 1e-6);
        Tolerance.Close(Math.PI / Math.Sqrt(3), check.Step.PeakTime, 1e-9);
        Assert.Equal(0.0, check.Step.UndershootPercent);
        Assert.False(check.Checks.Single(c => c.Name == RequirementChecks.Overshoot).Passes);
    }

    [Fact]
    public void Measure_LagWithA300SecondTail_MatchesPartialFractions()
    {
        // A lag dipole at −1/300 beside a rise of about a second: the horizon is thousands of seconds,
        // the peak and rise must still come out to 0.1 %.
        var loop = Loop.Create(FromText("4/(s(s+2))"));
        var (check, output, _) = Prove(loop, FromText("1.2(s+0.00333)/(s+0.000333)"));
        Assert.True(check.Step.Horizon > 2000, $"horizon {check.Step.Horizon}");
        AssertMatchesPartialFractions(check.Step, output, "lag tail");
        Assert.True(check.TailContinues);
        Assert.True(check.ShownWindow < 0.1 * check.Step.Horizon, $"window {check.ShownWindow}");
    }

    [Fact]
    public void Measure_NonMinimumPhasePlant_ReportsUndershootAndMatchesPartialFractions()
    {
        // A right-half-plane zero at +1 dips the step the wrong way first.
        var loop = Loop.Create(FromText("(1 - s)/((s+1)(s+3))"));
        var (check, output, _) = Prove(loop, FromText("1.5"));
        Assert.True(check.Step.UndershootPercent > 1, $"undershoot {check.Step.UndershootPercent}");
        AssertMatchesPartialFractions(check.Step, output, "right-half-plane zero");
    }

    [Fact]
    public void Measure_LongerHorizon_SameFigures()
    {
        // The figures belong to the solution, not to the grid: three times the horizon changes nothing.
        var output = FromText("(s+0.5)/((s+0.05)(s^2+1.2s+9))");
        var system = CascadeRealization.Of(output);
        var a = StepAnalysis.Measure(system, output.Poles, output.DcGain, 200);
        var b = StepAnalysis.Measure(system, output.Poles, output.DcGain, 600);
        Tolerance.Close(a.OvershootPercent, b.OvershootPercent, 1e-9, 1e-9);
        Tolerance.Close(a.PeakTime, b.PeakTime, 1e-9);
        Tolerance.Close(a.RiseTime, b.RiseTime, 1e-9);
        Tolerance.Close(a.SettlingTime2Percent, b.SettlingTime2Percent, 1e-9);
    }

    [Fact]
    public void Measure_ResponseGrazingTheBand_SaysSo()
    {
        // ζ chosen so that the only overshoot is 2.0005 %: a hair over the 2 % band; the settling time is then
        // the exit of that one lobe and would jump to the first entry for a hair more damping.
        var zeta = ZetaForOvershoot(2.0005);
        var output = TransferFunction.FromFactors(1.0, [], [new Complex(-zeta, Math.Sqrt(1 - (zeta * zeta))), new Complex(-zeta, -Math.Sqrt(1 - (zeta * zeta)))]);
        var m = StepAnalysis.Measure(CascadeRealization.Of(output), output.Poles, 1.0, 40);
        Assert.True(m.Grazes2Percent);
        Assert.False(m.Grazes5Percent);

        var clear = ZetaForOvershoot(6.0);
        var other = TransferFunction.FromFactors(1.0, [], [new Complex(-clear, Math.Sqrt(1 - (clear * clear))), new Complex(-clear, -Math.Sqrt(1 - (clear * clear)))]);
        var n = StepAnalysis.Measure(CascadeRealization.Of(other), other.Poles, 1.0, 40);
        Assert.False(n.Grazes2Percent);
    }

    [Fact]
    public void Measure_NoOvershoot_PeakTimeIsNone()
    {
        var output = FromText("6/((s+1)(s+2)(s+3))");
        var m = StepAnalysis.Measure(CascadeRealization.Of(output), output.Poles, 1.0, 20);
        Assert.Equal(0.0, m.OvershootPercent);
        Assert.True(double.IsPositiveInfinity(m.PeakTime));
    }

    [Fact]
    public void Measure_RandomStableLoops_MatchPartialFractionsWhateverTheModeRatio()
    {
        // Distinct poles spread over up to four decades (fast rise beside slow tails), real or lightly damped.
        var gen = Gen.Select(Gen.Double[-2.0, 2.0].Array[1, 3], Gen.Double[0.15, 0.9].Array[0, 2], Gen.Double[-1.0, 1.5], Gen.Double[0.3, 3.0]);
        var checkedCases = 0;
        gen.Sample(
            (logReal, zetas, logScale, zeroScale) =>
            {
                var poles = new List<Complex>();
                poles.AddRange(logReal.Select(x => new Complex(-Math.Pow(10, x), 0)));
                foreach (var z in zetas)
                {
                    var wn = Math.Pow(10, logScale);
                    poles.Add(new Complex(-z * wn, wn * Math.Sqrt(1 - (z * z))));
                    poles.Add(new Complex(-z * wn, -wn * Math.Sqrt(1 - (z * z))));
                    logScale += 0.37;
                }

                // Partial fractions need well-separated poles: skip near-repeated ones (their residues cancel).
                if (poles.Where((p, i) => poles.Where((q, j) => j != i && Complex.Abs(p - q) < 0.02 * Math.Max(p.Magnitude, q.Magnitude)).Any()).Any())
                {
                    return;
                }

                var zero = new Complex(-zeroScale * poles.Min(p => p.Magnitude), 0);
                var raw = TransferFunction.FromFactors(1.0, [zero], poles);
                var output = raw.Scaled(1.0 / raw.DcGain);
                var m = StepAnalysis.Measure(CascadeRealization.Of(output), output.Poles, output.DcGain, LoopCheck.Horizon([.. output.Poles]));
                AssertMatchesPartialFractions(m, output, $"poles {string.Join(" ", poles)}");
                checkedCases++;
            },
            iter: 60);
        Assert.True(checkedCases > 30, $"only {checkedCases} cases checked");
    }

    [Fact]
    public void Measure_RandomLoopsAtAnyTimeScale_MatchPartialFractions()
    {
        // The same shapes in any time unit: T(s/a) steps as y(a·t), so the figures must hold whether the poles
        // sit near 1 rad/s or near 1e7 rad/s. Double zeros near the slow pair and a fast pair far out are the
        // shapes a fast lead design gives; an unscaled companion form lost every digit there.
        var gen = Gen.Select(Gen.Double[-1.0, 1.0].Array[0, 2], Gen.Double[0.2, 0.9].Array[1, 2], Gen.Double[-3.0, 7.0], Gen.Double[0.5, 3.0].Array[0, 2]);
        var checkedCases = 0;
        gen.Sample(
            (logReal, zetas, logScale, zeroScales) =>
            {
                var a = Math.Pow(10, logScale);
                var poles = new List<Complex>();
                poles.AddRange(logReal.Select(x => new Complex(-Math.Pow(10, x) * a, 0)));
                var wn = a;
                foreach (var z in zetas)
                {
                    poles.Add(new Complex(-z * wn, wn * Math.Sqrt(1 - (z * z))));
                    poles.Add(new Complex(-z * wn, -wn * Math.Sqrt(1 - (z * z))));
                    wn *= 70;
                }

                if (poles.Where((p, i) => poles.Where((q, j) => j != i && Complex.Abs(p - q) < 0.02 * Math.Max(p.Magnitude, q.Magnitude)).Any()).Any())
                {
                    return;
                }

                var zeros = zeroScales.Select(k => new Complex(-k * a, 0)).ToList();
                if (zeros.Count == 1)
                {
                    zeros.Add(zeros[0]); // a double zero, as two identical lead stages give
                }

                var raw = TransferFunction.FromFactors(1.0, zeros, poles);
                var output = raw.Scaled(1.0 / raw.DcGain);
                var m = StepAnalysis.Measure(CascadeRealization.Of(output), output.Poles, output.DcGain, LoopCheck.Horizon([.. output.Poles]));
                AssertMatchesPartialFractions(m, output, $"scale {a:G3}, zeros {string.Join(" ", zeros)}, poles {string.Join(" ", poles)}");
                checkedCases++;
            },
            iter: 80);
        Assert.True(checkedCases > 40, $"only {checkedCases} cases checked");
    }

    [Fact]
    public void Measure_FastLeadOnADoubleIntegratorLikePlant_MatchesPartialFractions()
    {
        // 1/(s(s+1)) under two identical lead stages placed for a target near −8.1e4 ± 8.4e4j: the closed loop
        // has a pair near 8.4e6 rad/s beside the target pair and a double zero at −1.66e5. Partial fractions
        // (here and, independently, in plain Python complex arithmetic) give 11.26 % overshoot at 1.89e-5 s.
        var loop = Loop.Create(FromText("1/(s(s+1))"));
        var c = TransferFunction.FromFactors(34926846847749.793, [new Complex(-166189.63197853643, 0), new Complex(-166189.63197853643, 0)], [new Complex(-6105888.7404977195, 0), new Complex(-6105888.7404977195, 0)]);
        var (check, output, _) = Prove(loop, c);
        Tolerance.Close(11.2551, check.Step.OvershootPercent, 0, 0.01);
        AssertMatchesPartialFractions(check.Step, output, "fast lead");
    }

    [Fact]
    public void Measure_SlowPoleWithLargeResidue_HorizonExtendedUntilSettled()
    {
        // (s+0.001)/((s+1)(s+2)) under a gain of 10: closed-loop poles about −0.156 and −12.84, final value
        // 0.01/2.01, and the slow pole's residue about 150 times that. Eight of its time constants (51 s) leave
        // the step outside the ±2 % band; the exact settling time (partial fractions) is about 57 s.
        var loop = Loop.Create(FromText("(s+0.001)/((s+1)(s+2))"));
        var (check, output, roots) = Prove(loop, FromText("10"));
        Assert.True(LoopCheck.Horizon(roots) < 55, $"base horizon {LoopCheck.Horizon(roots)}");
        Assert.True(double.IsFinite(check.Step.SettlingTime2Percent), "settled");
        Assert.InRange(check.Step.SettlingTime2Percent, 55.0, 60.0);
        Assert.DoesNotContain(check.Warnings, w => w.Contains("not settled", StringComparison.Ordinal));
        AssertMatchesPartialFractions(check.Step, output, "slow pole, large residue");
    }

    [Fact]
    public void Measure_RandomLoopsWithAZeroNearTheOrigin_SettleAndMatchPartialFractions()
    {
        // A zero close to the origin makes the final value small beside the transient, so the slow pole's
        // residue is many band widths: the class behind the example above.
        var gen = Gen.Select(Gen.Double[-3.5, -1.5], Gen.Double[-0.5, 1.5].Array[2, 3], Gen.Double[0.5, 30.0]);
        gen.Sample(
            (logZero, logPoles, gain) =>
            {
                var plant = TransferFunction.FromFactors(1.0, [new Complex(-Math.Pow(10, logZero), 0)], [.. logPoles.Select((x, i) => new Complex(-Math.Pow(10, x) * (1 + (0.07 * i)), 0))]);
                var loop = Loop.Create(plant);
                var (check, output, roots) = Prove(loop, TransferFunction.FromFactors(gain, [], []));
                if (!check.Stable || roots.Any(r => roots.Count(q => Complex.Abs(q - r) < 0.02 * Math.Max(r.Magnitude, 1e-9)) > 1))
                {
                    return;
                }

                var what = $"zero 10^{logZero:F2}, poles {string.Join(" ", plant.Poles)}, gain {gain:F2}";
                Assert.True(double.IsFinite(check.Step.SettlingTime2Percent), what + " settled");
                AssertMatchesPartialFractions(check.Step, output, what);
            },
            iter: 40);
    }

    private static double ZetaForOvershoot(double percent)
    {
        var l = Math.Log(percent / 100);
        return -l / Math.Sqrt((Math.PI * Math.PI) + (l * l));
    }
}
