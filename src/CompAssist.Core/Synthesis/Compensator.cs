using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// A designed compensator C(s) = K · Π (s − zᵢ)/(s − pᵢ) over its stages, with every gain form labelled.
/// </summary>
public sealed class Compensator
{
    private Compensator(CompensatorKind kind, double gain, ImmutableArray<CompensatorStage> stages, TransferFunction transferFunction, PidForms? pid)
    {
        Pid = pid;
        Kind = kind;
        Gain = gain;
        Stages = stages;
        TransferFunction = transferFunction;
    }

    /// <summary>The family of the whole compensator.</summary>
    public CompensatorKind Kind { get; }

    /// <summary>Factored gain K (multiplies Π(s − z)/Π(s − p)); the high-frequency gain when C is biproper.</summary>
    public double Gain { get; }

    /// <summary>The stages, in cascade order.</summary>
    public ImmutableArray<CompensatorStage> Stages { get; }

    /// <summary>Every gain form of a PI, PD or PID compensator (its PID part, when lead stages follow); null for the others.</summary>
    public PidForms? Pid { get; }

    /// <summary>The whole compensator as a transfer function.</summary>
    public TransferFunction TransferFunction { get; }

    /// <summary>DC gain C(0) (infinite with an integrator).</summary>
    public double DcGain => TransferFunction.DcGain;

    /// <summary>High-frequency gain, the limit of C(s) as s → ∞ for a proper stage set.</summary>
    public double HighFrequencyGain => TransferFunction.HighFrequencyGain;

    /// <summary>Creates a compensator from stages and a factored gain.</summary>
    /// <exception cref="ArgumentException">The gain is zero or not finite, or there are no stages.</exception>
    public static Compensator FromStages(CompensatorKind kind, double gain, IEnumerable<CompensatorStage> stages)
    {
        var unformed = Build(kind, gain, stages, null);
        if (kind is not (CompensatorKind.PD or CompensatorKind.PI or CompensatorKind.PID))
        {
            return unformed;
        }

        // The gain forms describe the PID part (its PI and PD stages with the whole gain); any lead stages
        // cascaded after it for extra angle are reported as stages.
        var pidPart = Build(kind, gain, unformed.Stages.Where(st => st.Kind is CompensatorKind.PI or CompensatorKind.PD), null);
        return Build(kind, gain, unformed.Stages, PidForms.FromTransferFunction(pidPart.TransferFunction));
    }

    private static Compensator Build(CompensatorKind kind, double gain, IEnumerable<CompensatorStage> stages, PidForms? pid)
    {
        ArgumentNullException.ThrowIfNull(stages);
        var list = stages.ToImmutableArray();
        if (list.IsEmpty)
        {
            throw new ArgumentException("A compensator needs at least one stage.", nameof(stages));
        }

        var tf = TransferFunction.FromFactors(
            gain,
            list.Where(st => st.Zero is not null).Select(st => new Complex(st.Zero!.Value, 0.0)),
            list.Where(st => st.Pole is not null).Select(st => new Complex(st.Pole!.Value, 0.0)));
        return new Compensator(kind, gain, list, tf, pid);
    }
}
