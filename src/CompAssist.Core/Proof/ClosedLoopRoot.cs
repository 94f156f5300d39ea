using System.Numerics;

namespace CompAssist.Core.Proof;

/// <summary>One closed-loop pole with its descriptors.</summary>
/// <param name="Value">The root, rad/s.</param>
/// <param name="Role">Its role in the response.</param>
public sealed record ClosedLoopRoot(Complex Value, RootRole Role)
{
    /// <summary>Natural frequency |s|, rad/s.</summary>
    public double NaturalFrequency => Complex.Abs(Value);

    /// <summary>Damping ratio −Re(s)/|s| (1 for a root at the origin by convention... reported as NaN there).</summary>
    public double Zeta => NaturalFrequency == 0 ? double.NaN : -Value.Real / NaturalFrequency;
}
