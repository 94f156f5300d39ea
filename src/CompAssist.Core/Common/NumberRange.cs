namespace CompAssist.Core.Common;

/// <summary>
/// The magnitudes this tool accepts for a number in an expression, and so the magnitudes a design may
/// produce: anything it prints must read back. 1e-12 … 1e12 keeps every coefficient of the loops a lab
/// writes in seconds, milliseconds or hours inside the range where the root finding and the matrix
/// exponential keep their digits.
/// </summary>
public static class NumberRange
{
    /// <summary>The largest accepted magnitude.</summary>
    public const double Largest = 1e12;

    /// <summary>The smallest accepted non-zero magnitude.</summary>
    public const double Smallest = 1e-12;

    /// <summary>Below this magnitude a non-zero value is subnormal or nearly so, and no setting means it.</summary>
    public const double SmallestUsable = 1e-300;

    /// <summary>
    /// True when a value typed for a setting is a usable number at all: finite, and zero or at least
    /// <see cref="SmallestUsable"/> in magnitude (NaN, infinities and subnormals are unusable input; each
    /// setting's own range is checked after this).
    /// </summary>
    public static bool Usable(double x) => double.IsFinite(x) && (x == 0 || Math.Abs(x) >= SmallestUsable);

    /// <summary>True when x is finite and zero or of a magnitude within [<see cref="Smallest"/>, <see cref="Largest"/>].</summary>
    public static bool Contains(double x)
    {
        var m = Math.Abs(x);
        return double.IsFinite(x) && (m == 0.0 || (m >= Smallest && m <= Largest));
    }
}
