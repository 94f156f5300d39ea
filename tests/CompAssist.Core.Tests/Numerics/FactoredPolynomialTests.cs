using System.Numerics;
using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Numerics;

public class FactoredPolynomialTests
{
    [Fact]
    public void Create_UnpairedComplexRoot_Throws()
    {
        Assert.Throws<ArgumentException>(() => FactoredPolynomial.Create(1.0, [new Complex(-1, 1)]));
    }

    [Fact]
    public void Create_ZeroLeading_Throws()
    {
        Assert.Throws<ArgumentException>(() => FactoredPolynomial.Create(0.0, []));
    }

    [Fact]
    public void EvaluateWithDerivative_MatchesExpandedForm()
    {
        var roots = new[] { new Complex(-1, 0), new Complex(-2, 3), new Complex(-2, -3), new Complex(-5, 0) };
        var f = FactoredPolynomial.Create(2.0, roots);
        var p = f.ToPolynomial();
        var s = new Complex(0.7, 1.1);
        var (v, d) = f.EvaluateWithDerivative(s);
        Tolerance.Close(p.Evaluate(s), v, 1e-13);
        Tolerance.Close(p.Derivative().Evaluate(s), d, 1e-13);
    }

    [Fact]
    public void EvaluateWithDerivative_AtARoot_IsFiniteAndCorrect()
    {
        // d/ds [(s+1)(s+2)] at s = -1 is (-1+2) = 1.
        var f = FactoredPolynomial.Create(1.0, [new Complex(-1, 0), new Complex(-2, 0)]);
        var (v, d) = f.EvaluateWithDerivative(new Complex(-1, 0));
        Assert.Equal(Complex.Zero, v);
        Tolerance.Close(new Complex(1, 0), d, 1e-15);
    }
}
