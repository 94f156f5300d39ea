using System.Collections.Immutable;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Proof;

/// <summary>What the compensated loop actually does: the simulated step, errors, margins and effort.</summary>
public sealed record LoopCheckReport
{
    /// <summary>True when every closed-loop pole has a negative real part.</summary>
    public required bool Stable { get; init; }

    /// <summary>Number of closed-loop roots with a non-negative real part (0 when stable).</summary>
    public required int UnstableRootCount { get; init; }

    /// <summary>The window of <see cref="Output"/> and <see cref="Effort"/> in seconds (the transient; see <see cref="LoopCheck.ShownWindow"/>).</summary>
    public required double ShownWindow { get; init; }

    /// <summary>True when the simulated horizon (a slow tail) goes on beyond the shown window.</summary>
    public required bool TailContinues { get; init; }

    /// <summary>The output step response y(t) over the shown window, uniformly sampled for pictures.</summary>
    public required SampledResponse Output { get; init; }

    /// <summary>The actuator command u(t) for a unit step over the shown window, computed when first asked for (null when the compensator is improper).</summary>
    public SampledResponse? Effort => EffortResponse.Value;

    /// <summary>The lazily simulated actuator command behind <see cref="Effort"/> (pictures only; the figures come from the exact solution).</summary>
    public required Lazy<SampledResponse?> EffortResponse { get; init; }

    /// <summary>Measured step figures on the exact solution over the whole horizon (final value from the closed-loop DC gain when stable).</summary>
    public required StepMetrics Step { get; init; }

    /// <summary>How <see cref="Step"/> was obtained: the exact solution, the exact-delay method of steps, or the Padé approximant.</summary>
    public required StepSolution Solution { get; init; }

    /// <summary>Steady-state error r − y for a unit step (stable loops).</summary>
    public required double StepError { get; init; }

    /// <summary>Steady-state error r − y for a unit ramp (infinite when the step error is not zero).</summary>
    public required double RampError { get; init; }

    /// <summary>System type and error constants of ±C·G·H.</summary>
    public required ErrorConstants ErrorConstants { get; init; }

    /// <summary>Margins; null when the closed loop is unstable (they are not claimed then).</summary>
    public required StabilityMargins? Margins { get; init; }

    /// <summary>Actuator figures.</summary>
    public required EffortFigures EffortFigures { get; init; }

    /// <summary>Measured figures beside requirements and predictions.</summary>
    public required ImmutableArray<RequirementCheck> Checks { get; init; }

    /// <summary>Plain warnings for the engineer.</summary>
    public required ImmutableArray<string> Warnings { get; init; }

    /// <summary>The response to a unit load step at the plant input; null when the loop is unstable.</summary>
    public LoadDisturbanceFigures? LoadDisturbance { get; init; }

    /// <summary>Bandwidth and the peaks of |T| and |C·S|; null when the loop is unstable.</summary>
    public FrequencyFigures? Frequency { get; init; }
}
