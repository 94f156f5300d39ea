using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Proof;

/// <summary>
/// The closed-loop transfer functions of a compensated loop for a reference step, in factored form with
/// the closed-loop poles that root finding produced: output T = C·G/(1 ± C·G·H) and actuator command
/// U = C/(1 ± C·G·H). Delays are by Padé.
/// </summary>
/// <param name="Output">Reference to output y.</param>
/// <param name="Effort">Reference to actuator command u; null when C is improper (u has an impulse).</param>
/// <param name="Load">A load at the plant input to the output: G/(1 ± C·G·H).</param>
public sealed record ClosedLoopTransfers(TransferFunction Output, TransferFunction? Effort, TransferFunction Load)
{
    /// <summary>Builds both from the loop, the compensator and the closed-loop poles.</summary>
    public static ClosedLoopTransfers Of(Loop loop, TransferFunction compensator, ImmutableArray<Complex> closedLoopPoles)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        var g = loop.Rational(loop.Plant);
        var h = loop.Rational(loop.Feedback);
        var c = loop.Rational(compensator); // a delay in the compensator too, by the same approximant as the roots
        var characteristic = loop.Characteristic(compensator);
        var lead = characteristic.ExpandForSeeds().Leading;
        var output = TransferFunction.FromFactors(
            c.Gain * g.Gain / lead,
            c.Zeros.AddRange(g.Zeros).AddRange(h.Poles),
            closedLoopPoles);
        TransferFunction? effort = null;
        if (compensator.IsProper)
        {
            effort = TransferFunction.FromFactors(
                c.Gain / lead,
                c.Zeros.AddRange(g.Poles).AddRange(h.Poles),
                closedLoopPoles);
        }

        var load = TransferFunction.FromFactors(
            g.Gain / lead,
            g.Zeros.AddRange(c.Poles).AddRange(h.Poles),
            closedLoopPoles);
        return new ClosedLoopTransfers(output, effort, load);
    }
}
