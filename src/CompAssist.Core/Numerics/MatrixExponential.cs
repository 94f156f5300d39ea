namespace CompAssist.Core.Numerics;

/// <summary>
/// The matrix exponential e^A by scaling and squaring with Padé approximants, as in N. J. Higham,
/// "The scaling and squaring method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26(4),
/// 2005 (Algorithm 2.3: degrees 3, 5, 7, 9, 13 chosen by the 1-norm against θₘ).
/// </summary>
public static class MatrixExponential
{
    private static readonly double[] Theta = [1.495585217958292e-2, 2.539398330063230e-1, 9.504178996162932e-1, 2.097847961257068e0];
    private static readonly int[] Degrees = [3, 5, 7, 9];
    private const double Theta13 = 5.371920351148152e0;

    private static readonly double[][] Coefficients =
    [
        [120, 60, 12, 1],
        [30240, 15120, 3360, 420, 30, 1],
        [17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1],
        [17643225600, 8821612800, 2075673600, 302702400, 30270240, 2162160, 110880, 3960, 90, 1],
    ];

    private static readonly double[] B13 =
    [
        64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000,
        10559470521600, 670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1,
    ];

    /// <summary>e^A for a square matrix (a new array).</summary>
    /// <exception cref="ArgumentException">A is not square or has non-finite entries.</exception>
    public static double[,] Of(double[,] a)
    {
        ArgumentNullException.ThrowIfNull(a);
        var n = a.GetLength(0);
        if (a.GetLength(1) != n)
        {
            throw new ArgumentException("The matrix must be square.", nameof(a));
        }

        foreach (var x in a)
        {
            if (!double.IsFinite(x))
            {
                throw new ArgumentException("The matrix must be finite.", nameof(a));
            }
        }

        if (n == 0)
        {
            return new double[0, 0];
        }

        var norm = MatrixOps.Norm1(a);
        for (var i = 0; i < Degrees.Length; i++)
        {
            if (norm <= Theta[i])
            {
                return PadeLow(a, Coefficients[i]);
            }
        }

        var s = Math.Max(0, (int)Math.Ceiling(Math.Log2(norm / Theta13)));
        var scaled = MatrixOps.Combine(n, 0.0, (Math.Pow(2, -s), a));
        var r = Pade13(scaled);
        for (var k = 0; k < s; k++)
        {
            r = MatrixOps.Multiply(r, r);
        }

        return r;
    }

    private static double[,] PadeLow(double[,] a, double[] b)
    {
        var n = a.GetLength(0);
        var a2 = MatrixOps.Multiply(a, a);
        var powers = new List<double[,]> { MatrixOps.Identity(n), a2 };
        var m = b.Length - 1;
        for (var k = 4; k <= m; k += 2)
        {
            powers.Add(MatrixOps.Multiply(powers[^1], a2));
        }

        var odd = new double[n, n];
        var even = new double[n, n];
        for (var j = 0; j <= m; j++)
        {
            var target = j % 2 == 0 ? even : odd;
            var p = powers[j / 2];
            for (var r = 0; r < n; r++)
            {
                for (var c = 0; c < n; c++)
                {
                    target[r, c] += b[j] * p[r, c];
                }
            }
        }

        var u = MatrixOps.Multiply(a, odd);
        return MatrixOps.Solve(MatrixOps.Add(even, u, -1.0), MatrixOps.Add(even, u));
    }

    private static double[,] Pade13(double[,] a)
    {
        var n = a.GetLength(0);
        var b = B13;
        var a2 = MatrixOps.Multiply(a, a);
        var a4 = MatrixOps.Multiply(a2, a2);
        var a6 = MatrixOps.Multiply(a2, a4);
        var inner = MatrixOps.Combine(n, 0.0, (b[13], a6), (b[11], a4), (b[9], a2));
        var u = MatrixOps.Multiply(a, MatrixOps.Add(MatrixOps.Multiply(a6, inner), MatrixOps.Combine(n, b[1], (b[7], a6), (b[5], a4), (b[3], a2))));
        var innerV = MatrixOps.Combine(n, 0.0, (b[12], a6), (b[10], a4), (b[8], a2));
        var v = MatrixOps.Add(MatrixOps.Multiply(a6, innerV), MatrixOps.Combine(n, b[0], (b[6], a6), (b[4], a4), (b[2], a2)));
        return MatrixOps.Solve(MatrixOps.Add(v, u, -1.0), MatrixOps.Add(v, u));
    }
}
