using System.Numerics;

namespace CompAssist.Core.Tests.Support;

/// <summary>The one place numeric comparisons are made in tests.</summary>
internal static class Tolerance
{
    /// <summary>Asserts |actual − expected| ≤ max(absolute, relative·|expected|).</summary>
    public static void Close(double expected, double actual, double relative = 1e-12, double absolute = 0.0, string what = "")
    {
        if (expected.Equals(actual))
        {
            return; // equal, infinities and NaN included
        }

        var allowed = Math.Max(absolute, relative * Math.Abs(expected));
        var error = Math.Abs(actual - expected);
        Assert.True(
            error <= allowed,
            $"{what} expected {expected:R}, got {actual:R} (error {error:G3} > allowed {allowed:G3})");
    }

    /// <summary>As <see cref="Close(double,double,double,double,string)"/> for an optional value, which must be present.</summary>
    public static void Close(double? expected, double? actual, double relative = 1e-12, double absolute = 0.0, string what = "")
    {
        Assert.True(expected.HasValue && actual.HasValue, $"{what} expected {expected}, got {actual}");
        Close(expected!.Value, actual!.Value, relative, absolute, what);
    }

    /// <summary>Complex version of <see cref="Close(double,double,double,double,string)"/>, relative to |expected|.</summary>
    public static void Close(Complex expected, Complex actual, double relative = 1e-12, double absolute = 0.0, string what = "")
    {
        var allowed = Math.Max(absolute, relative * Complex.Abs(expected));
        var error = Complex.Abs(actual - expected);
        Assert.True(error <= allowed, $"{what} expected {expected}, got {actual} (error {error:G3} > allowed {allowed:G3})");
    }

    /// <summary>
    /// Asserts that two root multisets match: each expected root is paired with a distinct actual root
    /// within the tolerance (relative to max(1, |root|)).
    /// </summary>
    public static void SameRoots(IReadOnlyList<Complex> expected, IReadOnlyList<Complex> actual, double relative)
    {
        Assert.Equal(expected.Count, actual.Count);
        var used = new bool[actual.Count];
        foreach (var e in expected)
        {
            var best = -1;
            var bestDistance = double.PositiveInfinity;
            for (var i = 0; i < actual.Count; i++)
            {
                var d = Complex.Abs(actual[i] - e);
                if (!used[i] && d < bestDistance)
                {
                    best = i;
                    bestDistance = d;
                }
            }

            Assert.True(best >= 0 && bestDistance <= relative * Math.Max(1.0, Complex.Abs(e)), $"root {e} not found (nearest {bestDistance:G3} away)");
            used[best] = true;
        }
    }
}
