namespace CompAssist.Core.Numerics;

/// <summary>
/// Parlett–Reinsch diagonal balancing by powers of two (the scheme of LAPACK's xGEBAL), which keeps the
/// eigenvalues exact and makes the eigenvalue solve of a companion matrix reliable at high degree.
/// </summary>
internal static class CompanionBalancer
{
    /// <summary>Balances the square matrix in place.</summary>
    public static void Balance(double[,] a)
    {
        const double radix = 2.0;
        const double radixSquared = radix * radix;
        var n = a.GetLength(0);
        var done = false;
        var sweeps = 0;
        while (!done && sweeps++ < 100)
        {
            done = true;
            for (var i = 0; i < n; i++)
            {
                double c = 0.0, r = 0.0;
                for (var j = 0; j < n; j++)
                {
                    if (j != i)
                    {
                        c += Math.Abs(a[j, i]);
                        r += Math.Abs(a[i, j]);
                    }
                }

                if (c == 0.0 || r == 0.0)
                {
                    continue;
                }

                var g = r / radix;
                var f = 1.0;
                var sum = c + r;
                while (c < g)
                {
                    f *= radix;
                    c *= radixSquared;
                }

                g = r * radix;
                while (c > g)
                {
                    f /= radix;
                    c /= radixSquared;
                }

                if ((c + r) / f < 0.95 * sum)
                {
                    done = false;
                    g = 1.0 / f;
                    for (var j = 0; j < n; j++)
                    {
                        a[i, j] *= g;
                    }

                    for (var j = 0; j < n; j++)
                    {
                        a[j, i] *= f;
                    }
                }
            }
        }
    }
}
