namespace CompAssist.Core.Proof;

/// <summary>An interval of actuator commands [Low, High] (actuator units), Low &lt; High, both finite.</summary>
public sealed record CommandRange
{
    private CommandRange(double low, double high)
    {
        Low = low;
        High = high;
    }

    /// <summary>The lowest command.</summary>
    public double Low { get; }

    /// <summary>The highest command.</summary>
    public double High { get; }

    /// <summary>True when the range is centred on zero (a limit on |u|).</summary>
    public bool IsSymmetric => Low == -High;

    /// <summary>Creates the range.</summary>
    /// <exception cref="ArgumentException">A bound is not finite or Low ≥ High.</exception>
    public static CommandRange Create(double low, double high)
    {
        if (!double.IsFinite(low) || !double.IsFinite(high) || !(low < high))
        {
            throw new ArgumentException("A command range needs finite bounds with low < high.");
        }

        return new CommandRange(low, high);
    }

    /// <summary>[−limit, limit].</summary>
    /// <exception cref="ArgumentException">The limit is not positive and finite.</exception>
    public static CommandRange Symmetric(double limit) => Create(-limit, limit);

    /// <summary>True when <paramref name="value"/> lies within the range (bounds included).</summary>
    public bool Contains(double value) => value >= Low && value <= High;

    /// <summary>The range moved by −<paramref name="origin"/> (limits relative to an operating point).</summary>
    public CommandRange RelativeTo(double origin) => Create(Low - origin, High - origin);
}
