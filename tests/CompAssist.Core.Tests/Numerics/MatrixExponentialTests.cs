using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Numerics;

/// <summary>e^A against closed forms (common practice).</summary>
public class MatrixExponentialTests
{
    private static void Same(double[,] expected, double[,] actual, double relative)
    {
        var scale = 0.0;
        foreach (var x in expected)
        {
            scale = Math.Max(scale, Math.Abs(x));
        }

        for (var i = 0; i < expected.GetLength(0); i++)
        {
            for (var j = 0; j < expected.GetLength(1); j++)
            {
                Tolerance.Close(expected[i, j], actual[i, j], 0, relative * scale, $"[{i},{j}]");
            }
        }
    }

    [Fact]
    public void Of_Nilpotent_IsIPlusN()
    {
        Same(new double[,] { { 1, 3 }, { 0, 1 } }, MatrixExponential.Of(new double[,] { { 0, 3 }, { 0, 0 } }), 1e-15);
    }

    [Theory]
    [InlineData(0.001)]
    [InlineData(0.7)]
    [InlineData(3.0)]
    [InlineData(60.0)]
    public void Of_Rotation_IsCosSin(double angle)
    {
        var e = MatrixExponential.Of(new double[,] { { 0, -angle }, { angle, 0 } });
        Same(new double[,] { { Math.Cos(angle), -Math.Sin(angle) }, { Math.Sin(angle), Math.Cos(angle) } }, e, 1e-12);
    }

    [Fact]
    public void Of_Diagonal_IsElementwise()
    {
        var e = MatrixExponential.Of(new double[,] { { -1, 0, 0 }, { 0, 0.5, 0 }, { 0, 0, -30 } });
        Same(new double[,] { { Math.Exp(-1), 0, 0 }, { 0, Math.Exp(0.5), 0 }, { 0, 0, Math.Exp(-30) } }, e, 1e-14);
    }

    [Theory]
    [InlineData(-2.0)]
    [InlineData(0.3)]
    [InlineData(-25.0)]
    public void Of_JordanBlock_HasPolynomialTerms(double lambda)
    {
        // exp(λI + N) for the 3×3 nilpotent N = e^λ (I + N + N²/2).
        var e = MatrixExponential.Of(new double[,] { { lambda, 1, 0 }, { 0, lambda, 1 }, { 0, 0, lambda } });
        var x = Math.Exp(lambda);
        Same(new double[,] { { x, x, x / 2 }, { 0, x, x }, { 0, 0, x } }, e, 1e-13);
    }

    [Fact]
    public void Of_Diagonalizable_MatchesVExpDVInverse()
    {
        // A = V diag(-1, -4) V⁻¹ with V = [[1, 1], [1, 2]], V⁻¹ = [[2, -1], [-1, 1]].
        var a = new double[,] { { 2, -3 }, { 6, -7 } };
        double e1 = Math.Exp(-1), e4 = Math.Exp(-4);
        var expected = new double[,] { { (2 * e1) - e4, -e1 + e4 }, { (2 * e1) - (2 * e4), -e1 + (2 * e4) } };
        Same(expected, MatrixExponential.Of(a), 1e-14);
    }
}
