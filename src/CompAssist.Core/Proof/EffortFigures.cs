namespace CompAssist.Core.Proof;

/// <summary>Actuator command for a reference step of the configured size, relative to the operating point u0.</summary>
/// <param name="Initial">u(0⁺); infinite when the compensator is improper (an impulse).</param>
/// <param name="Peak">Largest |u| over the simulated horizon (infinite when improper).</param>
/// <param name="PeakTime">When the peak occurs, seconds.</param>
/// <param name="ReferenceStep">The step size the figures are scaled to.</param>
/// <param name="Limit">The symmetric actuator limit |u| ≤ L, if that is how the limit was given.</param>
public sealed record EffortFigures(double Initial, double Peak, double PeakTime, double ReferenceStep, double? Limit)
{
    /// <summary>The largest (signed) command over the horizon; NaN when not measured, +∞ when improper.</summary>
    public double Highest { get; init; } = double.NaN;

    /// <summary>The smallest (signed) command over the horizon; NaN when not measured, −∞ when improper.</summary>
    public double Lowest { get; init; } = double.NaN;

    /// <summary>The room the limits leave the command about u0 (absolute limits − u0), if limits are known.</summary>
    public CommandRange? Room { get; init; }

    /// <summary>The operating-point command u0 the figures are relative to (absolute actuator units).</summary>
    public double OperatingPoint { get; init; }

    /// <summary>The absolute output limits (the room plus u0), if limits are known.</summary>
    public CommandRange? AbsoluteLimits => Room?.RelativeTo(-OperatingPoint);

    /// <summary>True when the command leaves the room the limits give it.</summary>
    public bool Saturates => Room is { } r
        ? (double.IsNaN(Highest) || double.IsNaN(Lowest) ? Peak > Math.Min(r.High, -r.Low) : Highest > r.High || Lowest < r.Low)
        : Limit is { } l && Peak > l;

    /// <summary>
    /// The figures of a unit-step command response with extremes <paramref name="high"/> and <paramref name="low"/>
    /// over the simulated horizon, scaled to the options' step. A stable loop's final command
    /// <paramref name="finalCommand"/> (NaN when unknown) joins the extremes: a command still creeping toward it at the
    /// horizon reaches it in the end.
    /// </summary>
    public static EffortFigures Of(double initial, double high, double highTime, double low, double lowTime, CheckOptions options, double finalCommand = double.NaN)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (double.IsFinite(finalCommand))
        {
            (high, highTime) = finalCommand > high ? (finalCommand, double.PositiveInfinity) : (high, highTime);
            (low, lowTime) = finalCommand < low ? (finalCommand, double.PositiveInfinity) : (low, lowTime);
        }

        var scale = options.ReferenceStep;
        var (highest, lowest) = scale >= 0 ? (high * scale, low * scale) : (low * scale, high * scale);
        var (peak, at) = Math.Abs(high) >= Math.Abs(low) ? (Math.Abs(high), highTime) : (Math.Abs(low), lowTime);
        var room = options.CommandRoom;
        return new EffortFigures(initial * scale, peak * Math.Abs(scale), at, scale, room is { IsSymmetric: true } ? room.High : null)
        {
            Highest = highest,
            Lowest = lowest,
            Room = room,
            OperatingPoint = options.OperatingPoint,
        };
    }

    /// <summary>The figures of an improper compensator (an impulse in the command).</summary>
    public static EffortFigures Impulse(CheckOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var room = options.CommandRoom;
        return new EffortFigures(double.PositiveInfinity, double.PositiveInfinity, 0.0, options.ReferenceStep, room is { IsSymmetric: true } ? room.High : null)
        {
            Highest = double.PositiveInfinity,
            Lowest = double.NegativeInfinity,
            Room = room,
            OperatingPoint = options.OperatingPoint,
        };
    }
}
