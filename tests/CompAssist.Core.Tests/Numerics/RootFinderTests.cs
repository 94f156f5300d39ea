using System.Numerics;
using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Numerics;

public class RootFinderTests
{
    [Fact]
    public void Find_Quadratic_ReturnsConjugatePair()
    {
        var report = RootFinder.Find(Polynomial.FromDescending([1.0, 2.0, 5.0]));
        Tolerance.SameRoots([new Complex(-1, 2), new Complex(-1, -2)], report.Roots, 1e-15);
    }

    [Fact]
    public void Find_ZeroPolynomial_Throws()
    {
        Assert.Throws<ArgumentException>(() => RootFinder.Find(Polynomial.Zero));
    }

    [Theory]
    [InlineData(18, 1)]
    [InlineData(19, 2)]
    [InlineData(20, 3)]
    [InlineData(20, 4)]
    [InlineData(20, 5)]
    public void Find_ExpandedDegree18To20_RecoversKnownRoots(int degree, int seed)
    {
        // Expanded coefficients of degree 20 carry only ~8 significant digits of the roots (TOOLCHAIN.md);
        // the balanced companion seeds plus polishing must still recover every root to that level.
        var rng = new Random(seed);
        var roots = RandomRoots.Stable(rng, degree);
        var p = Polynomial.FromRoots(roots);
        var report = RootFinder.Find(p);
        Assert.Equal(degree, report.Roots.Length);
        Tolerance.SameRoots(roots, report.Roots, 1e-5);
        Assert.True(report.MaxRelativeResidual <= 1e-12, $"backward error {report.MaxRelativeResidual}");
    }

    [Fact]
    public void Find_ManyRandomDegree20_NeverLosesARoot()
    {
        // The plain unbalanced eigenvalue route fails on ~10 % of such cases (TOOLCHAIN.md); this must not.
        for (var seed = 100; seed < 160; seed++)
        {
            var roots = RandomRoots.Stable(new Random(seed), 20);
            var report = RootFinder.Find(Polynomial.FromRoots(roots));
            Tolerance.SameRoots(roots, report.Roots, 1e-4);
        }
    }

    [Fact]
    public void Find_FactoredDegree20_RootsOfSPower20PlusK_AreExact()
    {
        // s^20 + K = 0 has roots K^(1/20)·e^{jπ(2m+1)/20}, m = 0…19 (closed form).
        var k = 3.0e6;
        var f = new CharacteristicFunction(FactoredPolynomial.Create(1.0, Enumerable.Repeat(Complex.Zero, 20)), k, FactoredPolynomial.One);
        var report = RootFinder.Find(f);
        var radius = Math.Pow(k, 1.0 / 20);
        var expected = Enumerable.Range(0, 20).Select(m => Complex.FromPolarCoordinates(radius, Math.PI * ((2 * m) + 1) / 20)).ToList();
        Tolerance.SameRoots(expected, report.Roots, 1e-13);
    }

    [Theory]
    [InlineData(11)]
    [InlineData(12)]
    [InlineData(13)]
    public void Find_FactoredCharacteristicDegree20_PolishedToFullAccuracy(int seed)
    {
        // D + kN with D, N in factored form: the product-form Newton step (a first-order forward-error
        // estimate for simple roots) must be at rounding level, which expanded coefficients cannot give.
        var rng = new Random(seed);
        var d = FactoredPolynomial.Create(1.0, RandomRoots.Stable(rng, 20));
        var n = FactoredPolynomial.Create(1.0, RandomRoots.Stable(rng, 6));
        var f = new CharacteristicFunction(d, 50.0, n);
        var report = RootFinder.Find(f);
        Assert.Equal(20, report.Roots.Length);
        Assert.True(report.MaxRelativeStep <= 1e-12, $"relative Newton step {report.MaxRelativeStep}");
    }

    [Fact]
    public void Find_RepeatedRoot_SplitsWithinMultiplicityTolerance()
    {
        // (s + 1)^4: a 4-fold root splits by about eps^(1/4) ≈ 1e-4 (TOOLCHAIN.md).
        var report = RootFinder.Find(Polynomial.FromRoots(Enumerable.Repeat(new Complex(-1, 0), 4).ToList()));
        Tolerance.SameRoots(Enumerable.Repeat(new Complex(-1, 0), 4).ToList(), report.Roots, 1e-3);
    }

    [Fact]
    public void Find_Result_IsConjugateClosed()
    {
        var roots = RandomRoots.Stable(new Random(7), 12);
        var report = RootFinder.Find(Polynomial.FromRoots(roots));
        foreach (var r in report.Roots.Where(r => r.Imaginary != 0))
        {
            Assert.Contains(Complex.Conjugate(r), report.Roots);
        }
    }
}
