using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

/// <summary>
/// Margins over every crossover, checked by different routes: a dense frequency sweep of L(jω) evaluated by
/// Horner's rule on the expanded numerator and denominator (not the product form the analyzer uses), closed
/// forms, and closed-loop roots (a gain scaled by a reported gain margin must put a root on the imaginary
/// axis). Margin definitions from the Nyquist criterion as in Franklin, Powell and Emami-Naeini, Feedback
/// Control of Dynamic Systems, ch. 6; the delay margin as common practice (extra lag to −180° over ωc).
/// </summary>
public class MarginCrossoverTests
{
    private static TransferFunction FromText(string text) => ExpressionParser.Parse(text, false).Value!;

    /// <summary>L(jω) by Horner on expanded coefficients, sign folded in.</summary>
    private static Complex Horner(Loop loop, TransferFunction c, double w)
    {
        var open = loop.OpenLoop(c).Scaled(loop.SignFactor);
        var s = new Complex(0, w);
        return open.Numerator.Evaluate(s) / open.Denominator.Evaluate(s) * Complex.Exp(-s * open.Delay);
    }

    /// <summary>Every ω where |L| = 1, by a dense log sweep (2·10⁵ points) and bisection on the Horner value.</summary>
    private static List<double> DenseGainCrossings(Func<double, Complex> l, double lo, double hi)
    {
        const int n = 200_000;
        var found = new List<double>();
        double Log(double w) => Math.Log(Complex.Abs(l(w)));
        var prevW = lo;
        var prev = Log(lo);
        for (var i = 1; i <= n; i++)
        {
            var w = lo * Math.Pow(hi / lo, (double)i / n);
            var v = Log(w);
            if (Math.Sign(v) != Math.Sign(prev))
            {
                double a = prevW, b = w, fa = prev;
                for (var k = 0; k < 200 && b - a > 1e-15 * b; k++)
                {
                    var m = 0.5 * (a + b);
                    var fm = Log(m);
                    if (Math.Sign(fm) == Math.Sign(fa))
                    {
                        (a, fa) = (m, fm);
                    }
                    else
                    {
                        b = m;
                    }
                }

                found.Add(0.5 * (a + b));
            }

            (prevW, prev) = (w, v);
        }

        return found;
    }

    private static void AssertRootOnAxisAtGain(Loop loop, TransferFunction c, double factor, double omega)
    {
        var roots = RootFinder.Find(loop.Characteristic(c.Scaled(factor))).Roots;
        var nearest = roots.MinBy(r => Complex.Abs(r - new Complex(0, omega)));
        Assert.True(Complex.Abs(nearest - new Complex(0, omega)) <= 1e-6 * Math.Max(1.0, omega), $"gain ×{factor:G6}: nearest root {nearest} to j{omega:G6}");
    }

    [Fact]
    public void Analyze_LightlyDampedModeUnderTwoLeadStages_EveryCrossoverMatchesDenseSweep()
    {
        // A ζ = 0.02 mode at 10 rad/s lifts |L| above 1 again beside the resonance: three gain crossovers. The
        // loop is stable (closed-loop roots), so the smallest distance to −1 is the one beside the resonance.
        var loop = Loop.Create(FromText("100/(s(s+1)(s^2+0.4s+100))"));
        var c = FromText("6(s+0.5)(s+0.7)/((s+5)(s+7))");
        Assert.All(RootFinder.Find(loop.Characteristic(c)).Roots, r => Assert.True(r.Real < 0));
        var m = MarginAnalyzer.Analyze(loop, c);

        var dense = DenseGainCrossings(w => Horner(loop, c, w), 1e-3, 1e3);
        Assert.Equal(3, dense.Count);
        Assert.Equal(dense.Count, m.GainCrossings.Length);
        for (var i = 0; i < dense.Count; i++)
        {
            Tolerance.Close(dense[i], m.GainCrossings[i].Frequency, 1e-9);
            var l = Horner(loop, c, dense[i]);
            var signed = 180 + (Math.Atan2(l.Imaginary, l.Real) * 180 / Math.PI);
            signed = signed > 180 ? signed - 360 : signed;
            Tolerance.Close(signed, m.GainCrossings[i].SignedMarginDegrees, 0, 1e-6, $"crossover {i}");
            var lag = (signed < 0 ? signed + 360 : signed) * Math.PI / 180;
            Tolerance.Close(lag / dense[i], m.GainCrossings[i].DelayMargin, 1e-8, 0, $"delay {i}");
        }

        Tolerance.Close(m.GainCrossings.Min(g => Math.Abs(g.SignedMarginDegrees)), m.PhaseMarginDeg, 1e-12);
        Assert.True(m.PhaseMarginDeg < 5, $"PM {m.PhaseMarginDeg}");
        Tolerance.Close(m.GainCrossings.Min(g => g.DelayMargin), m.DelayMargin, 1e-12);
        Assert.True(m.DelayMargin > 0);

        // The delay margin with the exact delay angle puts L on −1 at its crossover.
        var atMargin = Horner(loop, c, m.DelayMarginCrossover) * Complex.Exp(new Complex(0, -m.DelayMarginCrossover * m.DelayMargin));
        Assert.True(Complex.Abs(1 + atMargin) < 1e-6, $"|1 + L e^(-jωτ)| = {Complex.Abs(1 + atMargin):G3}");

        // The upward gain margin puts a closed-loop root on the imaginary axis at its phase crossover.
        AssertRootOnAxisAtGain(loop, c, Math.Pow(10, m.GainMarginDb / 20), m.PhaseCrossover);
        Assert.True(m.SelfCheckResidual < 1e-9, $"self-check {m.SelfCheckResidual:G3}");
    }

    [Fact]
    public void Analyze_PhaseCrossingOnAGridPoint_ListedOnce()
    {
        // 10/(s(s+1)(s+5)): ∠L = −180° at ω = √5 where |L| = 1/3 (Routh: ultimate gain 30; common practice).
        // √5 can land on a grid point, where both neighbouring intervals see the sign change.
        var m = MarginAnalyzer.Analyze(Loop.Create(FromText("10/(s(s+1)(s+5))")), TransferFunction.Unity);
        var crossing = Assert.Single(m.PhaseCrossings);
        Tolerance.Close(Math.Sqrt(5), crossing.Frequency, 1e-10);
        Tolerance.Close(20 * Math.Log10(3), m.GainMarginDb, 1e-9);
    }

    [Fact]
    public void Analyze_BiproperLoopWithDelay_GainMarginNeverAboveTheHighFrequencyLimit()
    {
        // L = 0.6(s+1)/(s+3)·e^(−s): |L| rises from 0.2 to 0.6 while the delay turns the phase through −180°
        // infinitely often, so the crossings' gain factors fall towards 1/0.6 and k·L has roots in the right
        // half-plane for every k > 1/0.6 (a neutral loop; roots tend to Re s = ln(0.6k)). The margin is that limit.
        var m = MarginAnalyzer.Analyze(Loop.Create(FromText("0.6(s+1)exp(-s)/(s+3)")), TransferFunction.Unity);
        Tolerance.Close(-20 * Math.Log10(0.6), m.GainMarginDb, 1e-9);
        Assert.True(double.IsPositiveInfinity(m.PhaseCrossover));
        Assert.All(m.PhaseCrossings.Where(p => double.IsFinite(p.Frequency)), p => Assert.True(p.GainFactor > 1 / 0.6, $"factor {p.GainFactor} at {p.Frequency}"));
    }

    [Fact]
    public void Analyze_DelayLoop_EveryPhaseCrossingOverThreeDecades()
    {
        // L = 2e^(−0.5s)/(s+1): ∠L = −atan ω − 0.5ω reaches −(2k+1)π once for each k (the phase falls
        // monotonically), so the crossings are the roots of atan ω + 0.5ω = (2k+1)π, each found here by
        // bisection. A log grid alone spaced its points a whole turn of delay phase apart and skipped some.
        var m = MarginAnalyzer.Analyze(Loop.Create(FromText("2exp(-0.5s)/(s+1)")), TransferFunction.Unity);
        // Listed up to 1000 rad/s at least (three decades beyond the corner, where |L| = 0.002).
        var listed = m.PhaseCrossings.Select(p => p.Frequency).Where(w => w < 900).Order().ToList();
        var expected = new List<double>();
        for (var k = 0; ; k++)
        {
            var target = ((2 * k) + 1) * Math.PI;
            double lo = 0, hi = 2 * target / 0.5 + 10;
            for (var i = 0; i < 200; i++)
            {
                var mid = 0.5 * (lo + hi);
                (lo, hi) = Math.Atan(mid) + (0.5 * mid) < target ? (mid, hi) : (lo, mid);
            }

            if (lo > 900)
            {
                break;
            }

            expected.Add(lo);
        }

        Assert.True(expected.Count > 70, $"{expected.Count} crossings expected");
        Assert.Equal(expected.Count, listed.Count);
        for (var i = 0; i < expected.Count; i++)
        {
            Tolerance.Close(expected[i], listed[i], 1e-9, what: $"crossing {i}");
        }
    }

    [Theory]
    [InlineData("3/(s-1)", 1.0)]
    [InlineData("-0.5(s-1)/(s+2)", 2.0)]
    public void Analyze_SensitivityApproachingItsSupremumAtInfinity_ThatSupremum(string open, double supremum)
    {
        // 3/(s − 1): |S| = |s − 1|/|s + 2| rises to 1 as ω → ∞. −0.5(s − 1)/(s + 2): S = (s + 2)/(0.5s + 3),
        // |S| rises to 1/0.5 = 2. Neither reaches its supremum at a finite frequency (closed forms).
        var m = MarginAnalyzer.Analyze(Loop.Create(FromText(open)), TransferFunction.Unity);
        Tolerance.Close(supremum, m.SensitivityPeak, 1e-12);
    }

    [Fact]
    public void Analyze_OpenLoopUnstablePlant_DownwardMarginAtDc()
    {
        // L = 4/(s − 1): stable closed loop (root −3); L(0) = −4 is real and negative, so ω = 0 is a phase
        // crossover and the gain may fall by 20·log10 4 before the root reaches s = 0. The gain crossover is
        // at √15 with 180° + ∠L = atan √15 (closed forms).
        var loop = Loop.Create(FromText("4/(s-1)"));
        var m = MarginAnalyzer.Analyze(loop, TransferFunction.Unity);
        Tolerance.Close(20 * Math.Log10(4), m.GainReductionMarginDb, 1e-12);
        Assert.Equal(0.0, m.GainReductionCrossover);
        Assert.True(double.IsPositiveInfinity(m.GainMarginDb));
        Tolerance.Close(Math.Sqrt(15), m.GainCrossover, 1e-10);
        Tolerance.Close(Math.Atan(Math.Sqrt(15)) * 180 / Math.PI, m.PhaseMarginDeg, 1e-9);
        Tolerance.Close(Math.Atan(Math.Sqrt(15)) / Math.Sqrt(15), m.DelayMargin, 1e-9);
        AssertRootOnAxisAtGain(loop, TransferFunction.Unity, Math.Pow(10, -m.GainReductionMarginDb / 20), 0.0);
    }

    [Theory]
    [InlineData("1/(s+1)")]
    [InlineData("2/(s+2)")]
    [InlineData("(s+3)/(3(s+1))")]
    public void Analyze_UnitDcGainFallingAway_OneCrossoverAtDcWithNoDelayLimit(string plant)
    {
        // |L(0)| = 1 and |L(jω)| < 1 for every ω > 0: the only gain crossover is ω = 0, where 180° + ∠L = 180°;
        // no extra delay moves L(0), and by the small-gain argument (common practice) the loop stays stable
        // for any delay, so the delay margin is infinite. Rounding noise of ln|L| ≈ 0 near ω = 0 must not be
        // listed as crossovers.
        var loop = Loop.Create(FromText(plant));
        var m = MarginAnalyzer.Analyze(loop, TransferFunction.Unity);
        var crossing = Assert.Single(m.GainCrossings);
        Assert.Equal(0.0, crossing.Frequency);
        Tolerance.Close(180.0, crossing.SignedMarginDegrees, 1e-12);
        Tolerance.Close(180.0, m.PhaseMarginDeg, 1e-12);
        Assert.True(double.IsPositiveInfinity(m.DelayMargin), $"delay margin {m.DelayMargin}");
        Assert.True(m.SelfCheckResidual < 1e-9, $"self check {m.SelfCheckResidual}");
    }

    [Fact]
    public void Analyze_UnitDcGainRisingFirst_CrossoversAtDcAndWhereTheModeFallsBack()
    {
        // L = 1/(s² + s + 1): |L(jω)|² = 1/(1 − ω² + ω⁴) is 1 at ω = 0 and ω = 1 and above 1 between (closed
        // form). At ω = 1, ∠L = −90°: phase margin 90°, delay margin (π/2)/1 s.
        var loop = Loop.Create(FromText("1/(s^2+s+1)"));
        var m = MarginAnalyzer.Analyze(loop, TransferFunction.Unity);
        Assert.Equal(2, m.GainCrossings.Length);
        Assert.Equal(0.0, m.GainCrossings[0].Frequency);
        Tolerance.Close(1.0, m.GainCrossings[1].Frequency, 1e-9);
        Tolerance.Close(90.0, m.PhaseMarginDeg, 1e-7);
        Tolerance.Close(Math.PI / 2, m.DelayMargin, 1e-8);
    }

    [Fact]
    public void Analyze_UnstablePoleWithLead_BothDirectionsCloseOnTheAxis()
    {
        // An unstable plant with a lead: the gain may rise (phase crossover at high frequency) and may fall
        // (at DC); each factor puts a closed-loop root on the imaginary axis where the margin says.
        var loop = Loop.Create(FromText("1/((s-1)(s+4))"));
        var c = FromText("30(s+2)/(s+12)");
        Assert.All(RootFinder.Find(loop.Characteristic(c)).Roots, r => Assert.True(r.Real < 0));
        var m = MarginAnalyzer.Analyze(loop, c);
        Assert.True(double.IsFinite(m.GainReductionMarginDb), "downward margin");
        AssertRootOnAxisAtGain(loop, c, Math.Pow(10, -m.GainReductionMarginDb / 20), m.GainReductionCrossover);
        if (double.IsFinite(m.GainMarginDb))
        {
            AssertRootOnAxisAtGain(loop, c, Math.Pow(10, m.GainMarginDb / 20), m.PhaseCrossover);
        }
    }

    [Fact]
    public void Analyze_InvertingPlantWithPositiveFeedback_ClosedFormPhaseMargin()
    {
        // G = −4/(s(s+2)) with positive feedback is the loop L = 4/(s(s+2)): ωc² = −2 + √20 and
        // 180° + ∠L = 90° − atan(ωc/2) (closed form).
        var loop = Loop.Create(FromText("-4/(s(s+2))"), null, FeedbackSign.Positive);
        var m = MarginAnalyzer.Analyze(loop, TransferFunction.Unity);
        var wc = Math.Sqrt(-2 + Math.Sqrt(20));
        Tolerance.Close(wc, m.GainCrossover, 1e-10);
        Tolerance.Close(90 - (Math.Atan(wc / 2) * 180 / Math.PI), m.PhaseMarginDeg, 1e-9);
        Assert.Single(m.GainCrossings);
    }

    [Fact]
    public void Analyze_RandomStableLoops_GainAndDelayMarginsCloseOnTheAxis()
    {
        // Property: for random stable loops of order 2–12, each finite gain margin (either direction) puts a
        // closed-loop root on the imaginary axis at its phase crossover (by root finding), and the delay margin
        // with the exact delay angle puts L on −1 at its crossover (by Horner evaluation).
        var rng = new Random(20261202);
        var proved = 0;
        for (var trial = 0; trial < 400 && proved < 150; trial++)
        {
            var order = rng.Next(2, 13);
            var poles = RandomRoots.Stable(rng, order, 0.2, 40, 0.05);
            if (rng.NextDouble() < 0.4)
            {
                poles.Add(Complex.Zero);
            }

            var zeros = RandomRoots.Stable(rng, rng.Next(0, order), 0.3, 30, 0.05);
            var plant = TransferFunction.FromFactors(1.0, zeros, poles);
            var loop = Loop.Create(plant);
            var gain = Math.Pow(10, (rng.NextDouble() * 4) - 2) / Complex.Abs(plant.Evaluate(new Complex(0, poles.Where(p => p != Complex.Zero).DefaultIfEmpty(Complex.One).Min(p => p.Magnitude))));
            var c = TransferFunction.Constant(gain);
            var roots = RootFinder.Find(loop.Characteristic(c)).Roots;
            if (roots.Any(r => r.Real >= 0))
            {
                continue;
            }

            var m = MarginAnalyzer.Analyze(loop, c);
            if (double.IsFinite(m.GainMarginDb) && m.PhaseCrossover is > 0 and < 1e6)
            {
                AssertRootOnAxisAtGain(loop, c, Math.Pow(10, m.GainMarginDb / 20), m.PhaseCrossover);
            }

            if (double.IsFinite(m.GainReductionMarginDb) && m.GainReductionCrossover < 1e6)
            {
                AssertRootOnAxisAtGain(loop, c, Math.Pow(10, -m.GainReductionMarginDb / 20), m.GainReductionCrossover);
            }

            if (double.IsFinite(m.DelayMargin))
            {
                var l = Horner(loop, c, m.DelayMarginCrossover) * Complex.Exp(new Complex(0, -m.DelayMarginCrossover * m.DelayMargin));
                Assert.True(Complex.Abs(1 + l) < 1e-6, $"order {order}: |1 + L e^(-jωτ)| = {Complex.Abs(1 + l):G3}");
            }

            Assert.True(m.SelfCheckResidual < 1e-6, $"self-check {m.SelfCheckResidual:G3}");
            proved++;
        }

        Assert.True(proved >= 100, $"only {proved} stable loops checked");
    }
}
