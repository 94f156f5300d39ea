using System.Collections.Immutable;
using CompAssist.Core.Discrete;
using CompAssist.Core.Proof;

namespace CompAssist.Core.Export;

/// <summary>One sample time on the ladder and what the sampled loop does at it.</summary>
/// <param name="SampleTime">T in seconds.</param>
/// <param name="Proof">The sampled loop (plant by zero-order hold, controller as stored, the computation delay).</param>
/// <param name="PhaseMarginDeg">The sampled loop's phase margin in degrees (its frequency response on the unit circle; NaN when unstable or no crossover).</param>
/// <param name="Checks">The requirements the continuous loop meets, measured on the sampled loop.</param>
public sealed record LadderRung(double SampleTime, SampledLoopProof Proof, double PhaseMarginDeg, ImmutableArray<RequirementCheck> Checks)
{
    /// <summary>True when the sampled loop is stable and every requirement the continuous loop meets still holds.</summary>
    public bool Meets => Proof.Stable && Checks.All(c => c.Passes != false);

    /// <summary>The short name of what binds ("overshoot %", "unstable"), for tables; null when the rung meets.</summary>
    public string? BindingName => !Proof.Stable ? "unstable" : Worst()?.Row.Name;

    /// <summary>The requirement that fails by the largest fraction of its bound, and by how much; null when none fails.</summary>
    public string? Binds => !Proof.Stable
        ? "unstable"
        : Worst() is { } w
            ? $"{w.Row.Name} {Model.TransferFunctionFormatter.Number(w.Row.Measured, 4)} against {w.Row.BoundSymbol} {Model.TransferFunctionFormatter.Number(w.Row.Required!.Value, 4)} ({Model.TransferFunctionFormatter.Number(100 * w.Off, 3)} % off)"
            : null;

    private (RequirementCheck Row, double Off)? Worst() => Checks.Where(c => c.Passes == false)
        .Select(c => (Row: c, Off: Math.Abs(c.Measured - c.Required!.Value) / Math.Max(Math.Abs(c.Required.Value), 1e-12)))
        .OrderByDescending(x => x.Off)
        .Select(x => ((RequirementCheck, double)?)x)
        .FirstOrDefault();
}
