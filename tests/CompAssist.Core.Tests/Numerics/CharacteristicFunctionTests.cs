using System.Numerics;
using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Numerics;

public class CharacteristicFunctionTests
{
    // 10/(s(s+1)(s+5)) with C = 3(s+1)/(s+4): the compensator zero cancels the plant pole at −1 exactly, so
    // D + kN = (s+1)·(s(s+5)(s+4) + 30) and −1 is a closed-loop root for every gain (invented numbers).
    private static CharacteristicFunction Cancelling() => new(
        FactoredPolynomial.Create(1.0, [new Complex(0, 0), new Complex(-1, 0), new Complex(-5, 0), new Complex(-4, 0)]),
        30.0,
        FactoredPolynomial.Create(1.0, [new Complex(-1, 0)]));

    [Fact]
    public void SharedRoots_ExactCancellation_AreTheCancelledFactors()
    {
        var f = Cancelling();
        Assert.Equal([new Complex(-1, 0)], f.SharedRoots.ToArray());
        var (exact, rest) = f.Deflate();
        Assert.Equal([new Complex(-1, 0)], exact.ToArray());
        Assert.Equal(3, rest.Degree);
    }

    [Fact]
    public void SharedRoots_NearCancellation_AreNone()
    {
        // A zero 1e-9 away from the pole is not a shared factor: the two closed-loop roots there are distinct.
        var f = new CharacteristicFunction(
            FactoredPolynomial.Create(1.0, [new Complex(0, 0), new Complex(-1, 0)]),
            2.0,
            FactoredPolynomial.Create(1.0, [new Complex(-1 - 1e-9, 0)]));
        Assert.Empty(f.SharedRoots);
    }

    [Fact]
    public void RelativeResidual_NextToACancelledRoot_IsRoundingLevel()
    {
        // One ulp beside the cancelled root the sum-of-terms ratio |D + kN| / (|D| + |kN|) is the other factor's own
        // relative size (order 1: it is what "largest relative residual 0.44" was), while the point is within
        // rounding of a root. The product-form size also counts what moving s and the factors by an ulp does.
        var f = Cancelling();
        var s = new Complex(Math.BitDecrement(-1.0), 0);
        var d = f.Denominator.Evaluate(s);
        var kn = f.Gain * f.Numerator.Evaluate(s);
        var sumOfTerms = Complex.Abs(d + kn) / (Complex.Abs(d) + Complex.Abs(kn));
        Assert.True(sumOfTerms > 0.1, $"sum-of-terms ratio {sumOfTerms:G3}");
        Assert.True(f.RelativeResidual(s) <= 1e-15, $"product-form residual {f.RelativeResidual(s):G3}");
        Assert.Equal(0.0, f.RelativeResidual(new Complex(-1, 0)));
    }

    [Fact]
    public void RelativeResidual_PointMovedByOnePerMille_IsLarge()
    {
        // The measure must still tell a root from a point beside it: 1e-3 relative off any root of the cancelling
        // function gives a residual far above the 1e-9 limit.
        var f = Cancelling();
        var report = RootFinder.Find(f);
        Assert.Equal(4, report.Roots.Length);
        foreach (var r in report.Roots)
        {
            Assert.True(f.RelativeResidual(r) <= 1e-15, $"root {r}: {f.RelativeResidual(r):G3}");
            var moved = r * (1 + 1e-3);
            Assert.True(f.RelativeResidual(moved) >= 1e-5, $"moved root {moved}: {f.RelativeResidual(moved):G3}");
        }
    }

    [Fact]
    public void RelativeResidual_DoubleRoot_SmallAtTheFoundRootsAndLargeBeside()
    {
        // 1/(s(s+2)) at k = 1: s² + 2s + 1 = (s+1)², a double root that root finding resolves only to about
        // √ε ≈ 1e-8; the residual there is still at rounding level (a backward error), and 1e-3 off it is (1e-3)²
        // over the size of the terms, far above rounding.
        var f = new CharacteristicFunction(FactoredPolynomial.Create(1.0, [new Complex(0, 0), new Complex(-2, 0)]), 1.0, FactoredPolynomial.One);
        var report = RootFinder.Find(f);
        Tolerance.SameRoots([new Complex(-1, 0), new Complex(-1, 0)], report.Roots, 1e-7);
        Assert.True(report.MaxRelativeResidual <= 1e-15, $"residual {report.MaxRelativeResidual:G3}");
        Assert.True(f.RelativeResidual(new Complex(-1.001, 0)) >= 1e-8, $"beside: {f.RelativeResidual(new Complex(-1.001, 0)):G3}");
    }

    [Fact]
    public void RelativeResidual_NearCancellation_RoundingLevelAtTheRoots()
    {
        // Pole at −1, zero at −1 − 1e-9 (1e-9 relative): a closed-loop root sits within a few 1e-9 of both, so an ulp
        // of its position is about 1e-7 of its distance to them; the residual must not mistake that for an error.
        var f = new CharacteristicFunction(
            FactoredPolynomial.Create(1.0, [new Complex(0, 0), new Complex(-1, 0), new Complex(-5, 0)]),
            7.0,
            FactoredPolynomial.Create(1.0, [new Complex(-1 - 1e-9, 0)]));
        var report = RootFinder.Find(f);
        Assert.True(report.MaxRelativeResidual <= 1e-12, $"residual {report.MaxRelativeResidual:G3}");
        // The branch from the pole leaves to the right (the gap is off the locus); the root next to the dipole is the
        // one arriving at the zero from the left.
        var beside = Assert.Single(report.Roots, r => Math.Abs(r.Real + 1) < 1e-8);
        Assert.True(beside.Real < -1 - 1e-9, $"{beside.Real:R}");
    }
}
