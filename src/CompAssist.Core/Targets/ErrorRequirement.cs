using System.Globalization;

namespace CompAssist.Core.Targets;

/// <summary>
/// A steady-state requirement as the smallest acceptable error constant (common practice, unity-feedback
/// relations: step error 1/(1 + Kp), ramp error 1/Kv, parabola error 1/Ka). With H(0) ≠ 1 the constants of
/// ±C·G·H govern e = r − H·y; the loop check reports r − y separately.
/// </summary>
/// <param name="Kind">Kp, Kv or Ka.</param>
/// <param name="Value">The smallest acceptable constant (&gt; 0).</param>
public sealed record ErrorRequirement(ErrorConstantKind Kind, double Value)
{
    /// <summary>The requirement that makes the unit-step error at most <paramref name="error"/> (0 &lt; e &lt; 1).</summary>
    public static ErrorRequirement FromStepError(double error) => new(ErrorConstantKind.Position, (1.0 / error) - 1.0);

    /// <summary>The requirement that makes the unit-ramp error at most <paramref name="error"/>.</summary>
    public static ErrorRequirement FromRampError(double error) => new(ErrorConstantKind.Velocity, 1.0 / error);

    /// <summary>The requirement that makes the unit-parabola error at most <paramref name="error"/>.</summary>
    public static ErrorRequirement FromParabolaError(double error) => new(ErrorConstantKind.Acceleration, 1.0 / error);

    /// <summary>"Kv ≥ 20" and the like.</summary>
    public override string ToString() => $"{Symbol} ≥ {Value.ToString("G4", CultureInfo.InvariantCulture)}";

    /// <summary>"Kp", "Kv" or "Ka".</summary>
    public string Symbol => Kind switch
    {
        ErrorConstantKind.Position => "Kp",
        ErrorConstantKind.Velocity => "Kv",
        _ => "Ka",
    };

    /// <summary>The system type needed for this constant to be finite and non-zero.</summary>
    public int TypeNeeded => (int)Kind;
}
