using CompAssist.Core.Cases;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Proof;
using CompAssist.Core.Tests.Support;
using CompAssist.Core.Workflow;
using CsCheck;

namespace CompAssist.Core.Tests.Export;

/// <summary>
/// The sample time chosen by re-proof. Checked by another route: the sampled loop re-simulated in the test
/// (the plant integrated by classical Runge–Kutta on 200 sub-steps per period with the command held, the
/// controller run as its difference equation), and the sampled phase margin against the continuous one less
/// the hold's half-sample lag ωc·T/2 (common practice: Franklin, Powell and Workman, Digital Control of Dynamic
/// Systems, 3rd ed., ch. 6 and 11).
/// </summary>
public class SampleTimeLadderTests
{
    private static DesignReport BeltAxis()
    {
        var (input, error) = CaseFileReader.ReadFile(Path.Combine(Repository.Root(), "cases", "belt-axis.toml"));
        Assert.Null(error);
        var run = DesignWorkflow.Run(input!);
        Assert.True(run.IsSuccess, run.Problem?.ToString());
        return run.Report!;
    }

    [Fact]
    public void Floor125_AnyPositiveTime_TheLargestLadderValueNotAbove()
    {
        Gen.Double[-6.0, 3.0].Sample(logT =>
        {
            var t = Math.Pow(10, logT);
            var f = SampleTimeLadder.Floor125(t);
            Assert.True(f <= t * (1 + 1e-12), $"{f} above {t}");
            Assert.True(SampleTimeLadder.Longer(f) > t * (1 - 1e-12), $"{SampleTimeLadder.Longer(f)} is not above {t}");
            var mantissa = f / Math.Pow(10, Math.Floor(Math.Log10(f) + 1e-12));
            Assert.Contains(Math.Round(mantissa, 9), new[] { 1.0, 2.0, 5.0 });
            Assert.Equal(f, SampleTimeLadder.Shorter(SampleTimeLadder.Longer(f)), 12);
        });
    }

    [Fact]
    public void Build_BeltAxisDemo_RecommendedValueAndTheShorterOnesMeetOnAnIndependentSimulation()
    {
        // 25/(s(s+5)) with the demo's lead, 10 % overshoot and 1.2 s (2 %): the round-one rule (ωs ≥ 20·ωc)
        // gave a sample time with 14.8 % overshoot sampled. The ladder's choice must meet, and so must the
        // next two shorter values, on a simulation the tool does not share.
        var report = BeltAxis();
        var c = report.Design.Compensator.TransferFunction;
        var ladder = SampleTimeLadder.Build(report.Design.Loop, c, report.Check, new HandoffOptions());
        Assert.NotNull(ladder.Recommended);
        var t = ladder.Recommended!.Value;
        Assert.True(2 * Math.PI / t >= 25 * ladder.Bandwidth * (1 - 1e-9), $"ωs {2 * Math.PI / t} against 25·ωB {25 * ladder.Bandwidth}");
        foreach (var sample in new[] { t, SampleTimeLadder.Shorter(t), SampleTimeLadder.Shorter(SampleTimeLadder.Shorter(t)) })
        {
            var controller = Discretizer.Discretize(c, sample, DiscretizationMethod.Tustin).Value!.Discrete;
            var (overshoot, settling) = HeldInputSimulation(controller, sample, 6.0);
            Assert.True(overshoot <= 10, $"T = {sample}: overshoot {overshoot} %");
            Assert.True(settling <= 1.2, $"T = {sample}: settling {settling} s");
            var rung = ladder.Rungs.Single(r => r.SampleTime == sample);
            Assert.True(rung.Meets, rung.Binds);
            Tolerance.Close(overshoot, rung.Proof.Metrics.OvershootPercent, 0, 1e-4, $"T = {sample} overshoot, tool vs test");
        }

        // A value longer than the limit fails, and says what binds.
        var failing = ladder.Rungs.Where(r => !r.Meets).ToList();
        Assert.All(failing, r => Assert.True(r.SampleTime > (ladder.Limit ?? t), $"{r.SampleTime} fails below the limit"));
        Assert.All(failing, r => Assert.False(string.IsNullOrEmpty(r.Binds)));
    }

    [Fact]
    public void PhaseMargin_FastSampling_ContinuousLessHalfASampleOfLag()
    {
        var report = BeltAxis();
        var loop = report.Design.Loop;
        var c = report.Design.Compensator.TransferFunction;
        var margins = report.Check.Margins!;
        foreach (var t in new[] { 0.01, 0.005, 0.002 })
        {
            var controller = Discretizer.Discretize(c, t, DiscretizationMethod.Tustin).Value!.Discrete;
            var sampled = SampleTimeLadder.PhaseMargin(loop, controller, 0);
            var expected = margins.PhaseMarginDeg - (margins.GainCrossover * t / 2 * 180 / Math.PI);
            Assert.True(Math.Abs(sampled - expected) < 0.15 * margins.GainCrossover * t * 180 / Math.PI + 0.05, $"T = {t}: sampled {sampled}°, expected about {expected}°");
        }
    }

    /// <summary>
    /// y at the sampling instants for a unit reference: e_k = 1 − y(kT), u from the difference equation
    /// Σ aᵢ u_{k−i} = Σ bᵢ e_{k−i}, held over the period; the plant ẋ1 = x2, ẋ2 = −5 x2 + 25 u integrated by RK4.
    /// </summary>
    private static (double OvershootPercent, double Settling2) HeldInputSimulation(DiscreteTransferFunction controller, double t, double horizon)
    {
        var b = controller.Numerator;
        var a = controller.Denominator;
        var n = (int)Math.Ceiling(horizon / t);
        var e = new double[n + 1];
        var u = new double[n + 1];
        var y = new double[n + 1];
        double x1 = 0, x2 = 0;
        const int sub = 200;
        var h = t / sub;
        for (var k = 0; k <= n; k++)
        {
            y[k] = x1;
            e[k] = 1.0 - x1;
            var sum = 0.0;
            for (var i = 0; i < b.Length && i <= k; i++)
            {
                sum += b[i] * e[k - i];
            }

            for (var i = 1; i < a.Length && i <= k; i++)
            {
                sum -= a[i] * u[k - i];
            }

            u[k] = sum / a[0];
            for (var j = 0; j < sub; j++)
            {
                (double, double) F(double p, double v) => (v, (-5 * v) + (25 * u[k]));
                var k1 = F(x1, x2);
                var k2 = F(x1 + (h / 2 * k1.Item1), x2 + (h / 2 * k1.Item2));
                var k3 = F(x1 + (h / 2 * k2.Item1), x2 + (h / 2 * k2.Item2));
                var k4 = F(x1 + (h * k3.Item1), x2 + (h * k3.Item2));
                x1 += h / 6 * (k1.Item1 + (2 * k2.Item1) + (2 * k3.Item1) + k4.Item1);
                x2 += h / 6 * (k1.Item2 + (2 * k2.Item2) + (2 * k3.Item2) + k4.Item2);
            }
        }

        var overshoot = Math.Max(0, (y.Max() - 1) * 100);
        var last = Array.FindLastIndex(y, v => Math.Abs(v - 1) > 0.02);
        var settling = last < 0 ? 0 : last == n ? double.PositiveInfinity : (last + ((Math.Abs(y[last] - 1) - 0.02) / (Math.Abs(y[last] - 1) - Math.Abs(y[last + 1] - 1)))) * t;
        return (overshoot, settling);
    }
}
