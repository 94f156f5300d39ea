using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Proof;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

/// <summary>
/// The exact-delay stability count, checked by different routes: for loops without delay against the
/// closed-loop roots of D + K·N found by the root finder; with a delay against closed forms of the
/// characteristic quasi-polynomial (where s = jω solves it) and against right-half-plane roots found by
/// Newton's method on the quasi-polynomial itself. The criterion Z = P + N: Franklin, Powell and
/// Emami-Naeini, Feedback Control of Dynamic Systems, ch. 6; the axis-crossing conditions for a delay loop
/// are common practice.
/// </summary>
public class NyquistCountTests
{
    [Fact]
    public void Count_RandomLoopsWithoutDelay_EqualsRootCount()
    {
        var rng = new Random(20261202);
        for (var trial = 0; trial < 300; trial++)
        {
            var poles = RandomRoots.Stable(rng, rng.Next(1, 9), 0.2, 20);
            if (rng.NextDouble() < 0.25)
            {
                poles.Add(new Complex(0.2 + (3 * rng.NextDouble()), 0)); // an open-loop unstable real pole
            }

            if (rng.NextDouble() < 0.1)
            {
                var u = new Complex(0.1 + rng.NextDouble(), 1 + (5 * rng.NextDouble()));
                poles.AddRange([u, Complex.Conjugate(u)]); // an open-loop unstable pair
            }

            poles.AddRange(Enumerable.Repeat(Complex.Zero, rng.Next(0, 3)));
            var zeros = RandomRoots.Stable(rng, rng.Next(0, poles.Count), 0.2, 20);
            if (rng.NextDouble() < 0.2)
            {
                zeros.Add(new Complex(0.5 + (5 * rng.NextDouble()), 0)); // a right-half-plane zero
            }

            if (zeros.Count >= poles.Count)
            {
                continue;
            }

            var (symmetric, symmetricZeros) = (poles, zeros);
            var gain = Math.Pow(10, (rng.NextDouble() * 4) - 1) * (rng.NextDouble() < 0.2 ? -1 : 1);
            var open = TransferFunction.FromFactors(gain, symmetricZeros, symmetric);
            var characteristic = Polynomial.FromRoots(symmetric) + Polynomial.FromRoots(symmetricZeros, gain);
            var roots = RootFinder.Find(characteristic).Roots;
            var nearAxis = roots.Min(r => Math.Abs(r.Real) / Math.Max(1.0, r.Magnitude));
            if (nearAxis < 1e-6)
            {
                continue; // a root on the axis: marginal, not a count to compare
            }

            var result = NyquistCount.Count(open);
            Assert.Equal(NyquistOutcome.Counted, result.Outcome);
            Assert.True(roots.Count(r => r.Real > 0) == result.RightHalfPlaneRoots, $"trial {trial}: {open} roots {string.Join(", ", roots)}");
        }
    }

    [Theory]
    [InlineData(1.0, 1.0)] // KT = 1 < π/2
    [InlineData(1.5, 1.0)]
    [InlineData(1.6, 1.0)] // past π/2: the first pair crosses at ω = K
    [InlineData(7.8, 1.0)] // below 5π/2 ≈ 7.854
    [InlineData(7.9, 1.0)] // past 5π/2: the second pair
    [InlineData(15.0, 1.0)] // past 9π/2 ≈ 14.14
    [InlineData(0.5, 4.0)]
    [InlineData(40.0, 0.2)]
    public void Count_IntegratorWithDelay_MatchesAxisCrossings(double gain, double delay)
    {
        // s + K e^(−sT) = 0 has s = jω only at ω = K with KT = π/2 + 2πk; each k ≥ 0 below KT moves a pair
        // into the right half-plane.
        var kt = gain * delay;
        var expected = 0;
        for (var k = 0; (Math.PI / 2) + (2 * Math.PI * k) < kt; k++)
        {
            expected += 2;
        }

        var open = TransferFunction.FromFactors(gain, [], [Complex.Zero], delay);
        var result = NyquistCount.Count(open);
        Assert.Equal(NyquistOutcome.Counted, result.Outcome);
        Assert.Equal(expected, result.RightHalfPlaneRoots);
    }

    [Theory]
    [InlineData(2.2, true)]
    [InlineData(2.25, true)]
    [InlineData(2.28, false)]
    [InlineData(2.5, false)]
    public void Count_FirstOrderWithDelay_StableBelowCriticalGain(double gain, bool stable)
    {
        // K e^(−s)/(s + 1): the phase reaches −180° where tan ω = −ω (ω ≈ 2.0288), so K* = √(1 + ω²) ≈ 2.2618.
        var w = BisectTan(Math.PI / 2 + 1e-9, Math.PI - 1e-9);
        var critical = Math.Sqrt(1 + (w * w));
        Assert.Equal(stable, gain < critical);
        var result = NyquistCount.Count(TransferFunction.FromFactors(gain, [], [new Complex(-1, 0)], 1.0));
        Assert.Equal(stable, result.Stable);
        Assert.Equal(stable ? 0 : 2, result.RightHalfPlaneRoots);
    }

    [Theory]
    [InlineData(0.8, 1)] // below the lower critical gain 1: one real root in the right half-plane
    [InlineData(2.0, 0)]
    public void Count_UnstablePlantWithDelay_HasBothCriticalGains(double gain, int expected)
    {
        // K e^(−s/2)/(s − 1): stable for 1 < K < √(1 + ω²) with ω/2 = atan ω (ω ≈ 2.3311, K ≈ 2.536).
        var result = NyquistCount.Count(TransferFunction.FromFactors(gain, [], [new Complex(1, 0)], 0.5));
        Assert.Equal(1, result.OpenLoopUnstablePoles);
        Assert.Equal(expected, result.RightHalfPlaneRoots);
    }

    [Fact]
    public void Count_ResonantPlantWithDelay_FindsTheRootNewtonFinds()
    {
        // 357.21 e^(−s) / ((s + 1)(s² + 0.378 s + 357.21)): a Padé approximant of low order calls it stable.
        var poles = new[] { new Complex(-1, 0), new Complex(-0.189, Math.Sqrt(357.21 - (0.189 * 0.189))), new Complex(-0.189, -Math.Sqrt(357.21 - (0.189 * 0.189))) };
        var open = TransferFunction.FromFactors(357.21, [], poles, 1.0);
        var result = NyquistCount.Count(open);
        Assert.Equal(NyquistOutcome.Counted, result.Outcome);
        Assert.True(result.RightHalfPlaneRoots >= 2, $"count {result.RightHalfPlaneRoots}");

        // Newton on q(s) = D(s) + 357.21 e^(−s) from beside the resonance finds a root with Re s > 0.
        var d = Polynomial.FromRoots(poles);
        var dd = d.Derivative();
        var s = new Complex(0.1, 18.9);
        for (var i = 0; i < 100; i++)
        {
            var q = d.Evaluate(s) + (357.21 * Complex.Exp(-s));
            var dq = dd.Evaluate(s) - (357.21 * Complex.Exp(-s));
            s -= q / dq;
        }

        Assert.True(Complex.Abs(d.Evaluate(s) + (357.21 * Complex.Exp(-s))) < 1e-9 * Complex.Abs(d.Evaluate(s)), $"Newton did not converge: {s}");
        Assert.True(s.Real > 0, $"Newton root {s}");
    }

    [Fact]
    public void Count_RootOnTheAxis_SaysOnAxis()
    {
        // 2/(s (s + 1)(s + 2))·… with K = 6: s³ + 3s² + 2s + 6 = (s² + 2)(s + 3), roots ±j√2 (Routh, common practice).
        var open = TransferFunction.FromFactors(6, [], [Complex.Zero, new Complex(-1, 0), new Complex(-2, 0)]);
        Assert.Equal(NyquistOutcome.OnAxis, NyquistCount.Count(open).Outcome);
    }

    private static double BisectTan(double a, double b)
    {
        static double F(double w) => Math.Tan(w) + w;
        for (var i = 0; i < 200; i++)
        {
            var m = 0.5 * (a + b);
            if (Math.Sign(F(m)) == Math.Sign(F(a)))
            {
                a = m;
            }
            else
            {
                b = m;
            }
        }

        return 0.5 * (a + b);
    }
}
