using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Proof;

/// <summary>
/// A reference prefilter F(s) (two degrees of freedom, common practice): it cancels the compensator's closed-loop
/// zeros nearest the dominant pair — never one in the right half-plane or on the imaginary axis (F would be
/// unstable), and never the zero of a dipole (a closed-loop pole slower than the target within |z|/2 of it: a lag's
/// or PI's slow zero, whose cancellation would unmask the slow pole in the reference response) — scaled so that F(0)·T(0) = 1. The loop,
/// its margins and its disturbance response do not change; only the reference path does. Delays by Padé.
/// </summary>
/// <param name="Filter">F(s) = Π(−zᵢ)/(s − zᵢ) / T(0).</param>
/// <param name="Cancelled">The closed-loop zeros F cancels.</param>
/// <param name="Kept">The compensator zeros it keeps, each with the reason.</param>
/// <param name="Step">The reference step with F: figures toward the final value 1.</param>
/// <param name="CommandHighest">The largest actuator command for a unit reference step with F.</param>
/// <param name="CommandLowest">The lowest actuator command with F.</param>
public sealed record ReferencePrefilter(
    TransferFunction Filter,
    ImmutableArray<Complex> Cancelled,
    ImmutableArray<(Complex Zero, string Reason)> Kept,
    StepMetrics Step,
    double CommandHighest,
    double CommandLowest)
{
    /// <summary>A closed-loop pole slower than the target and this close (relative to |z|) to a zero makes it a dipole, kept.</summary>
    public const double DipoleDistance = 0.5;

    /// <summary>Zeros farther out than this multiple of |s*| barely shape the response and are kept.</summary>
    public const double ReachFactor = 5.0;

    /// <summary>The prefilter for a stable proved loop, or null with the reason when there is nothing to cancel or T(0) = 0.</summary>
    public static (ReferencePrefilter? Prefilter, string? Why) Design(Loop loop, TransferFunction compensator, ImmutableArray<Complex> closedLoopPoles, Complex target)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        var transfers = ClosedLoopTransfers.Of(loop, compensator, closedLoopPoles);
        var dc = transfers.Output.DcGain;
        if (!(Math.Abs(dc) > 1e-12) || !double.IsFinite(dc))
        {
            return (null, "T(0) is 0: the loop does not pass a constant reference, and no prefilter can scale it to 1");
        }

        var cancelled = ImmutableArray.CreateBuilder<Complex>();
        var kept = ImmutableArray.CreateBuilder<(Complex, string)>();
        foreach (var z in loop.Rational(compensator).Zeros)
        {
            if (z.Real >= -1e-12 * Math.Max(1.0, z.Magnitude))
            {
                kept.Add((z, "in the right half-plane or on the imaginary axis: F would be unstable"));
            }
            else if (closedLoopPoles.Where(p => Complex.Abs(p - z) <= DipoleDistance * Math.Max(z.Magnitude, 1e-300) && p.Real > target.Real).Select(p => (Complex?)p).FirstOrDefault() is { } beside)
            {
                kept.Add((z, $"a dipole with the closed-loop pole {TransferFunctionFormatter.Complex(beside, 5)}: cancelling the zero would unmask that pole in the reference response"));
            }
            else if (z.Magnitude > ReachFactor * target.Magnitude)
            {
                kept.Add((z, $"beyond {ReachFactor}·|s*|: it barely shapes the response"));
            }
            else
            {
                cancelled.Add(z);
            }
        }

        if (cancelled.Count == 0)
        {
            var reasons = kept.Count == 0 ? "the compensator has no zeros" : string.Join("; ", kept.Select(k => $"{TransferFunctionFormatter.Complex(k.Item1, 5)} is {k.Item2}"));
            return (null, $"no compensator zero near the dominant pair can be cancelled ({reasons})");
        }

        // F(s) = Π(−zᵢ)/(s − zᵢ) has F(0) = 1; divided by T(0), F(0)·T(0) = 1.
        var product = cancelled.Aggregate(Complex.One, (a, z) => a * -z).Real;
        var filter = TransferFunction.FromFactors(product / dc, [], cancelled.ToImmutable());
        var output = Without(transfers.Output, cancelled, product / dc);
        var horizon = LoopCheck.Horizon(closedLoopPoles);
        var step = StepAnalysis.Measure(CascadeRealization.Of(output), closedLoopPoles, 1.0, horizon);
        // The command with F: F·C/(1 ± C·G·H) — proper even for an ideal derivative when F cancels its zero.
        double high = double.NaN, low = double.NaN;
        var c = loop.Rational(compensator);
        var lead = loop.Characteristic(compensator).ExpandForSeeds().Leading;
        var effort = TransferFunction.FromFactors(c.Gain / lead, c.Zeros.AddRange(loop.Rational(loop.Plant).Poles).AddRange(loop.Rational(loop.Feedback).Poles), closedLoopPoles);
        var command = Without(effort, cancelled, product / dc);
        if (command.IsProper)
        {
            (high, _, low, _) = StepAnalysis.Extremes(CascadeRealization.Of(command), closedLoopPoles, horizon);
        }

        return (new ReferencePrefilter(filter, cancelled.ToImmutable(), kept.ToImmutable(), step, high, low), null);
    }

    // F·X in factored form: the cancelled zeros removed from X's zeros (they are F's poles), gain times F's gain.
    private static TransferFunction Without(TransferFunction x, IReadOnlyList<Complex> cancelled, double gain)
    {
        var zeros = x.Zeros.ToList();
        foreach (var z in cancelled)
        {
            var i = zeros.FindIndex(q => Complex.Abs(q - z) <= 1e-12 * Math.Max(1.0, z.Magnitude));
            zeros.RemoveAt(i);
        }

        return TransferFunction.FromFactors(x.Gain * gain, zeros, x.Poles);
    }
}
