using System.Numerics;
using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Numerics;

public class PolynomialTests
{
    [Fact]
    public void FromDescending_StoresAscendingAndTrims()
    {
        var p = Polynomial.FromDescending([0.0, 1.0, 2.0, 5.0]);
        Assert.Equal([5.0, 2.0, 1.0], p.Ascending);
        Assert.Equal(2, p.Degree);
        Assert.Equal([1.0, 2.0, 5.0], p.ToDescending());
    }

    [Fact]
    public void FromAscending_NonFinite_Throws()
    {
        Assert.Throws<ArgumentException>(() => Polynomial.FromAscending([1.0, double.NaN]));
    }

    [Fact]
    public void FromRoots_ExpandsProduct()
    {
        // (s + 1)(s + 2)(s^2 + 2s + 5) = s^4 + 5s^3 + 13s^2 + 19s + 10 (hand expansion)
        var p = Polynomial.FromRoots([new Complex(-1, 0), new Complex(-2, 0), new Complex(-1, 2), new Complex(-1, -2)]);
        Assert.Equal([1.0, 5.0, 13.0, 19.0, 10.0], p.ToDescending());
    }

    [Fact]
    public void Times_MatchesFromRootsOfUnion()
    {
        var a = Polynomial.FromRoots([new Complex(-3, 0)], 2.0);
        var b = Polynomial.FromRoots([new Complex(-1, 1), new Complex(-1, -1)]);
        Assert.Equal(Polynomial.FromRoots([new Complex(-3, 0), new Complex(-1, 1), new Complex(-1, -1)], 2.0), a * b);
    }

    [Fact]
    public void Evaluate_Horner_MatchesDirectSum()
    {
        var p = Polynomial.FromAscending([1.0, -2.0, 0.5, 3.0]);
        var s = new Complex(0.3, -1.7);
        var direct = 1.0 - (2.0 * s) + (0.5 * s * s) + (3.0 * s * s * s);
        Tolerance.Close(direct, p.Evaluate(s), 1e-14);
    }

    [Fact]
    public void Derivative_OfCubic_IsQuadratic()
    {
        var p = Polynomial.FromDescending([2.0, 3.0, 4.0, 5.0]);
        Assert.Equal([6.0, 6.0, 4.0], p.Derivative().ToDescending());
    }

    [Fact]
    public void Equals_ComparesValuesNotReferences()
    {
        Assert.Equal(Polynomial.FromDescending([1.0, 2.0]), Polynomial.FromDescending([1.0, 2.0]));
        Assert.NotEqual(Polynomial.FromDescending([1.0, 2.0]), Polynomial.FromDescending([1.0, 3.0]));
    }
}
