namespace CompAssist.Core.Numerics;

/// <summary>Bisection on a bracket of a sign change: the one bracketing solver of the core.</summary>
internal static class Bisection
{
    /// <summary>
    /// Halves [a, b] (f(a) = <paramref name="fa"/> and f(b) of opposite signs) until f vanishes at the midpoint,
    /// the bracket is no wider than <paramref name="width"/>(midpoint), or <paramref name="maxSteps"/> halvings
    /// are done; returns the midpoint.
    /// </summary>
    public static double Root(Func<double, double> f, double a, double b, double fa, Func<double, double> width, int maxSteps = 200)
    {
        for (var i = 0; i < maxSteps; i++)
        {
            var m = 0.5 * (a + b);
            if (Math.Abs(b - a) <= width(m))
            {
                return m;
            }

            var fm = f(m);
            if (fm == 0)
            {
                return m;
            }

            if (Sign(fm) == Sign(fa))
            {
                (a, fa) = (m, fm);
            }
            else
            {
                b = m;
            }
        }

        return 0.5 * (a + b);
    }

    /// <summary>The sign of x as −1, 0 or 1, with NaN as 0 (Math.Sign throws on NaN): a failed evaluation never crashes a solver.</summary>
    public static int Sign(double x) => x > 0 ? 1 : x < 0 ? -1 : 0;
}
