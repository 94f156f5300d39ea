namespace CompAssist.Core.Numerics;

/// <summary>Small dense real matrix kernels (row-major double[,]) for the exponential and simulation.</summary>
internal static class MatrixOps
{
    public static double[,] Identity(int n)
    {
        var m = new double[n, n];
        for (var i = 0; i < n; i++)
        {
            m[i, i] = 1.0;
        }

        return m;
    }

    public static double[,] Multiply(double[,] a, double[,] b)
    {
        var n = a.GetLength(0);
        var k = a.GetLength(1);
        var m = b.GetLength(1);
        var r = new double[n, m];
        for (var i = 0; i < n; i++)
        {
            for (var p = 0; p < k; p++)
            {
                var aip = a[i, p];
                if (aip == 0.0)
                {
                    continue;
                }

                for (var j = 0; j < m; j++)
                {
                    r[i, j] += aip * b[p, j];
                }
            }
        }

        return r;
    }

    /// <summary>Σ cᵢ·Mᵢ over same-sized matrices (null entries skipped), plus <paramref name="identityCoefficient"/>·I.</summary>
    public static double[,] Combine(int n, double identityCoefficient, params (double C, double[,] M)[] terms)
    {
        var r = new double[n, n];
        for (var i = 0; i < n; i++)
        {
            r[i, i] = identityCoefficient;
        }

        foreach (var (c, m) in terms)
        {
            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    r[i, j] += c * m[i, j];
                }
            }
        }

        return r;
    }

    public static double[,] Add(double[,] a, double[,] b, double sign = 1.0)
    {
        var n = a.GetLength(0);
        var m = a.GetLength(1);
        var r = new double[n, m];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < m; j++)
            {
                r[i, j] = a[i, j] + (sign * b[i, j]);
            }
        }

        return r;
    }

    /// <summary>Largest absolute column sum.</summary>
    public static double Norm1(double[,] a)
    {
        var n = a.GetLength(0);
        var m = a.GetLength(1);
        var best = 0.0;
        for (var j = 0; j < m; j++)
        {
            var sum = 0.0;
            for (var i = 0; i < n; i++)
            {
                sum += Math.Abs(a[i, j]);
            }

            best = Math.Max(best, sum);
        }

        return best;
    }

    /// <summary>Solves A·X = B by LU with partial pivoting.</summary>
    /// <exception cref="ArithmeticException">A is singular to working precision.</exception>
    public static double[,] Solve(double[,] a, double[,] b)
    {
        var n = a.GetLength(0);
        var m = b.GetLength(1);
        var lu = (double[,])a.Clone();
        var x = (double[,])b.Clone();
        for (var col = 0; col < n; col++)
        {
            var pivot = col;
            var max = Math.Abs(lu[col, col]);
            for (var i = col + 1; i < n; i++)
            {
                if (Math.Abs(lu[i, col]) > max)
                {
                    max = Math.Abs(lu[i, col]);
                    pivot = i;
                }
            }

            if (max == 0.0)
            {
                throw new ArithmeticException("Singular matrix in the Padé solve.");
            }

            if (pivot != col)
            {
                for (var j = 0; j < n; j++)
                {
                    (lu[col, j], lu[pivot, j]) = (lu[pivot, j], lu[col, j]);
                }

                for (var j = 0; j < m; j++)
                {
                    (x[col, j], x[pivot, j]) = (x[pivot, j], x[col, j]);
                }
            }

            for (var i = col + 1; i < n; i++)
            {
                var f = lu[i, col] / lu[col, col];
                if (f == 0.0)
                {
                    continue;
                }

                for (var j = col; j < n; j++)
                {
                    lu[i, j] -= f * lu[col, j];
                }

                for (var j = 0; j < m; j++)
                {
                    x[i, j] -= f * x[col, j];
                }
            }
        }

        for (var i = n - 1; i >= 0; i--)
        {
            for (var j = 0; j < m; j++)
            {
                var sum = x[i, j];
                for (var k = i + 1; k < n; k++)
                {
                    sum -= lu[i, k] * x[k, j];
                }

                x[i, j] = sum / lu[i, i];
            }
        }

        return x;
    }
}
