using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Proof;

/// <summary>
/// System type and static error constants of the open loop L = ±C·G·H (sign folded in so that the loop is
/// 1 + L): Kp = lim L(s), Kv = lim s·L(s), Ka = lim s²·L(s) as s → 0 (common practice). For unity feedback
/// they give the steady-state errors 1/(1+Kp), 1/Kv, 1/Ka; with H(0) ≠ 1 they describe e = r − H·y, and
/// the errors in <see cref="LoopCheck"/> are computed directly from the closed loop as r − y instead.
/// </summary>
/// <param name="SystemType">Number of integrators in L (poles at the origin minus zeros there).</param>
/// <param name="Kp">Position constant (infinite for type ≥ 1).</param>
/// <param name="Kv">Velocity constant (0 for type 0, infinite for type ≥ 2).</param>
/// <param name="Ka">Acceleration constant (0 for type ≤ 1, infinite for type ≥ 3).</param>
public sealed record ErrorConstants(int SystemType, double Kp, double Kv, double Ka)
{
    /// <summary>The constant a requirement is about.</summary>
    public double ValueOf(Targets.ErrorConstantKind kind) => kind switch
    {
        Targets.ErrorConstantKind.Position => Kp,
        Targets.ErrorConstantKind.Velocity => Kv,
        _ => Ka,
    };

    /// <summary>Computes the constants of the compensated loop (delay contributes e⁰ = 1).</summary>
    public static ErrorConstants Of(Loop loop, TransferFunction compensator)
    {
        ArgumentNullException.ThrowIfNull(loop);
        var open = loop.OpenLoop(compensator).WithoutDelay().Scaled(loop.SignFactor);
        var originPoles = open.Poles.Count(p => p == Complex.Zero);
        var originZeros = open.Zeros.Count(z => z == Complex.Zero);
        var type = originPoles - originZeros;

        // The finite non-zero limit lim s^type · L(s).
        Complex k = open.Gain;
        foreach (var z in open.Zeros.Where(z => z != Complex.Zero))
        {
            k *= -z;
        }

        foreach (var p in open.Poles.Where(p => p != Complex.Zero))
        {
            k /= -p;
        }

        var limit = k.Real;
        double Constant(int power) => power == type ? limit : (power < type ? Math.CopySign(double.PositiveInfinity, limit) : 0.0);
        return new ErrorConstants(type, Constant(0), Constant(1), Constant(2));
    }
}
