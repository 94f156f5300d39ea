using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Simulation;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Simulation;

public class StepSimulatorTests
{
    /// <summary>Closed form of the underdamped second-order unit step (common practice).</summary>
    private static double SecondOrderStep(double zeta, double wn, double t)
    {
        var sigma = zeta * wn;
        var wd = wn * Math.Sqrt(1 - (zeta * zeta));
        return 1 - (Math.Exp(-sigma * t) * (Math.Cos(wd * t) + (sigma / wd * Math.Sin(wd * t))));
    }

    [Theory]
    [InlineData(0.3, 2.0)]
    [InlineData(0.5, 4.0)]
    [InlineData(0.7, 10.0)]
    public void Step_SecondOrder_MatchesClosedFormAtSamples(double zeta, double wn)
    {
        var pole = TargetPole.FromDamping(zeta, wn).Point;
        var tf = TransferFunction.FromFactors(wn * wn, [], [pole, Complex.Conjugate(pole)]);
        var h = 0.01;
        var y = StepSimulator.Step(CascadeRealization.Of(tf), h, 800);
        for (var k = 0; k <= 800; k += 7)
        {
            Tolerance.Close(SecondOrderStep(zeta, wn, k * h), y.Values[k], 0, 1e-12, $"k={k}");
        }
    }

    [Theory]
    [InlineData(0.3)]
    [InlineData(0.5)]
    [InlineData(0.8)]
    public void Measure_SecondOrder_MatchesPublishedFormulas(double zeta)
    {
        // Overshoot e^{−ζπ/√(1−ζ²)} and peak time π/ωd (common practice; Ogata 5th ed. section 5-3).
        var wn = 3.0;
        var target = TargetPole.FromDamping(zeta, wn);
        var tf = TransferFunction.FromFactors(wn * wn, [], [target.Point, Complex.Conjugate(target.Point)]);
        var horizon = 8.0 / target.Sigma;
        var y = StepSimulator.Step(CascadeRealization.Of(tf), horizon / 20000, 20000);
        var m = StepMetrics.Measure(y, 1.0);
        Tolerance.Close(SecondOrder.OvershootPercent(zeta), m.OvershootPercent, 1e-6);
        Tolerance.Close(Math.PI / target.DampedFrequency, m.PeakTime, 0, horizon / 20000);

        // Rise and settling times against a dense scan of the closed form (independent computation).
        double FirstAbove(double level)
        {
            double lo = 0, hi = Math.PI / target.DampedFrequency;
            for (var i = 0; i < 200; i++)
            {
                var mid = 0.5 * (lo + hi);
                if (SecondOrderStep(zeta, wn, mid) >= level) { hi = mid; } else { lo = mid; }
            }

            return hi;
        }

        Tolerance.Close(FirstAbove(0.9) - FirstAbove(0.1), m.RiseTime, 1e-5);
        var lastOutside = 0.0;
        for (var t = 0.0; t < horizon; t += 1e-5)
        {
            if (Math.Abs(SecondOrderStep(zeta, wn, t) - 1) > 0.02)
            {
                lastOutside = t;
            }
        }

        Tolerance.Close(lastOutside, m.SettlingTime2Percent, 0, 2e-4);
    }

    [Fact]
    public void Step_ThirdOrderWithZero_MatchesPartialFractions()
    {
        // T(s) = 12(s + 1)/((s + 2)(s + 3)(s + 2)…) with distinct poles −2, −3, −4:
        // y(t) = T(0) + Σ Rᵢ/pᵢ e^{pᵢ t}, Rᵢ the residues of T (partial fractions, an independent method).
        var zeros = new[] { new Complex(-1, 0) };
        var poles = new[] { new Complex(-2, 0), new Complex(-3, 0), new Complex(-4, 0) };
        var tf = TransferFunction.FromFactors(12, zeros, poles);
        var y = StepSimulator.Step(CascadeRealization.Of(tf), 0.005, 1000);
        for (var k = 0; k <= 1000; k += 13)
        {
            var t = k * 0.005;
            var expected = tf.DcGain;
            foreach (var p in poles)
            {
                var residue = 12 * (p - zeros[0]);
                foreach (var q in poles.Where(q => q != p))
                {
                    residue /= p - q;
                }

                expected += (residue / p * Complex.Exp(p * t)).Real;
            }

            Tolerance.Close(expected, y.Values[k], 0, 1e-12, $"t={t}");
        }
    }

    [Fact]
    public void Step_RepeatedPoles_MatchesClosedForm()
    {
        // 1/(s+1)^3: y = 1 − e^{−t}(1 + t + t²/2).
        var tf = TransferFunction.FromFactors(1, [], Enumerable.Repeat(new Complex(-1, 0), 3));
        var y = StepSimulator.Step(CascadeRealization.Of(tf), 0.01, 1500);
        for (var k = 0; k <= 1500; k += 11)
        {
            var t = k * 0.01;
            Tolerance.Close(1 - (Math.Exp(-t) * (1 + t + (t * t / 2))), y.Values[k], 0, 1e-12);
        }
    }

    [Fact]
    public void Step_Biproper_StartsAtHighFrequencyGain()
    {
        // 5(s+2)/(s+10): y(0+) = 5, final 1.
        var tf = TransferFunction.FromFactors(5, [new Complex(-2, 0)], [new Complex(-10, 0)]);
        var y = StepSimulator.Step(CascadeRealization.Of(tf), 0.01, 300);
        Tolerance.Close(5.0, y.Values[0], 1e-14);
        Tolerance.Close(1.0, y.Values[^1], 1e-9);
    }

    [Fact]
    public void Realization_HighOrder_DcGainMatchesFactoredForm()
    {
        var roots = RandomRoots.Stable(new Random(3), 20);
        var unit = TransferFunction.FromFactors(1.0, [new Complex(-1.5, 0), new Complex(-7, 0)], roots);
        var tf = unit.Scaled(1.0 / unit.DcGain);
        var ss = CascadeRealization.Of(tf);
        var y = StepSimulator.Step(ss, 40.0 / roots.Min(r => -r.Real) / 2000, 2000);
        Tolerance.Close(1.0, y.Values[^1], 1e-9);
    }
}
