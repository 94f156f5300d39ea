using System.Numerics;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Parsing;

/// <summary>
/// The intermediate value of a sub-expression: gain · Π(s − zᵢ)/Π(s − pⱼ) · e^(−sT), or exactly zero.
/// Products keep factors apart (exact); sums expand over the least common denominator and find the
/// numerator's roots again.
/// </summary>
internal sealed class RationalValue
{
    private RationalValue(double gain, List<Complex> zeros, List<Complex> poles, double delay)
    {
        Gain = gain;
        Zeros = zeros;
        Poles = poles;
        Delay = delay;
    }

    public double Gain { get; }

    public List<Complex> Zeros { get; }

    public List<Complex> Poles { get; }

    public double Delay { get; }

    public bool IsZero => Gain == 0.0;

    public static RationalValue Constant(double c) => new(c, [], [], 0.0);

    public static RationalValue Variable() => new(1.0, [Complex.Zero], [], 0.0);

    public static RationalValue PureDelay(double t) => new(1.0, [], [], t);

    public RationalValue Negate() => new(-Gain, Zeros, Poles, Delay);

    public RationalValue Times(RationalValue other)
    {
        if (IsZero || other.IsZero)
        {
            return Constant(0.0);
        }

        return new RationalValue(Gain * other.Gain, [.. Zeros, .. other.Zeros], [.. Poles, .. other.Poles], Delay + other.Delay);
    }

    /// <summary>Reciprocal; the caller has ruled out zero and delays.</summary>
    public RationalValue Reciprocal() => new(1.0 / Gain, [.. Poles], [.. Zeros], -Delay);

    /// <summary>Sum; the caller has checked the delays match.</summary>
    /// <exception cref="RootFindingException">The new numerator's roots cannot be verified.</exception>
    /// <exception cref="OverflowException">The expanded coefficients are not finite.</exception>
    public RationalValue Plus(RationalValue other)
    {
        if (IsZero)
        {
            return other;
        }

        if (other.IsZero)
        {
            return this;
        }

        // Least common denominator: our poles, plus the other's poles that we do not already have.
        var remaining = new List<Complex>(Poles);
        var extraForThis = new List<Complex>();
        foreach (var p in other.Poles)
        {
            var match = remaining.FindIndex(q => Same(q, p));
            if (match >= 0)
            {
                remaining.RemoveAt(match);
            }
            else
            {
                extraForThis.Add(p);
            }
        }

        var common = new List<Complex>(Poles);
        common.AddRange(extraForThis);

        // Poles of the common denominator that the other term lacks.
        var extraForOther = new List<Complex>(common);
        foreach (var p in other.Poles)
        {
            var match = extraForOther.FindIndex(q => Same(q, p));
            extraForOther.RemoveAt(match);
        }

        var left = Polynomial.TryFromRoots([.. Zeros, .. extraForThis], Gain);
        var right = Polynomial.TryFromRoots([.. other.Zeros, .. extraForOther], other.Gain);
        if (left is null || right is null || (left + right).Ascending.Any(c => !double.IsFinite(c)))
        {
            throw new OverflowException("The expanded sum overflows.");
        }

        var sum = CleanCancellation(left + right, left, right);
        if (sum.IsZero)
        {
            return Constant(0.0);
        }

        var zeros = sum.Degree == 0 ? [] : RootFinder.Find(sum).Roots.ToList();
        return Cancel(new RationalValue(sum.Leading, zeros, common, Delay));
    }

    private static Polynomial CleanCancellation(Polynomial sum, Polynomial left, Polynomial right)
    {
        // Coefficients that cancel to rounding level are exact zeros (e.g. s - s, or (s+1) - s - 1).
        var c = sum.Ascending.ToArray();
        for (var k = 0; k < c.Length; k++)
        {
            var l = k < left.Ascending.Count ? Math.Abs(left.Ascending[k]) : 0.0;
            var r = k < right.Ascending.Count ? Math.Abs(right.Ascending[k]) : 0.0;
            if (Math.Abs(c[k]) <= 1e-13 * Math.Max(l, r))
            {
                c[k] = 0.0;
            }
        }

        return Polynomial.FromAscending(c);
    }

    private static RationalValue Cancel(RationalValue v)
    {
        var zeros = new List<Complex>(v.Zeros);
        var poles = new List<Complex>();
        foreach (var p in v.Poles)
        {
            var match = zeros.FindIndex(z => Close(z, p));
            if (match >= 0)
            {
                zeros.RemoveAt(match);
            }
            else
            {
                poles.Add(p);
            }
        }

        return new RationalValue(v.Gain, zeros, poles, v.Delay);
    }

    private static bool Same(Complex a, Complex b) => Complex.Abs(a - b) <= 1e-14 * Math.Max(1.0, Complex.Abs(a));

    private static bool Close(Complex a, Complex b) => Complex.Abs(a - b) <= 1e-9 * Math.Max(1.0, Complex.Abs(a));
}
