using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Export;

/// <summary>
/// The PID as exported — derivative on the measurement, its filter, the operating point, the output limits and the
/// anti-windup, in the chosen arithmetic — run in closed loop with the continuous plant
/// (<see cref="SampledControllerLoop"/>) on a reference step of the check's size and on a load-disturbance step at
/// the plant input, and checked against the requirements the continuous loop meets. Its stability and phase margin
/// come from its linear feedback path C_y(z) = Kp + Ki·T/(z − 1) + Kd·(z − 1)/((Tf + T)·z − Tf) (the transfer from
/// the measurement to the command while unsaturated; derivative on the measurement does not change the loop, only the
/// reference path).
/// </summary>
/// <param name="Controller">The exported controller's settings (a fresh twin is run).</param>
/// <param name="FeedbackPath">C_y(z), the measurement-to-command transfer while unsaturated.</param>
/// <param name="Linear">The sampled loop with C_y(z): closed-loop poles and stability.</param>
/// <param name="PhaseMarginDeg">The phase margin of the sampled loop with C_y(z), degrees (NaN when unstable or none).</param>
/// <param name="Reference">Step figures of the reference response as exported, normalized to the step size.</param>
/// <param name="ReferenceRun">The reference run (output between the samples, commands at the samples).</param>
/// <param name="ReferenceStep">The reference step size.</param>
/// <param name="Disturbance">The load step at the plant input, actuator units.</param>
/// <param name="DisturbanceRun">The load-disturbance run (reference 0).</param>
/// <param name="Checks">The requirements the continuous loop meets, measured on the exported PID.</param>
public sealed record ExportedPidProof(
    PidImplementation Controller,
    DiscreteTransferFunction FeedbackPath,
    SampledLoopProof Linear,
    double PhaseMarginDeg,
    StepMetrics Reference,
    SampledControllerRun ReferenceRun,
    double ReferenceStep,
    double Disturbance,
    SampledControllerRun DisturbanceRun,
    ImmutableArray<RequirementCheck> Checks)
{
    /// <summary>The most sampling periods one run simulates (as many as the sampled proof's longest record).</summary>
    public const int MaxPeriods = 4_000_000;

    /// <summary>The same controller with the derivative on the other signal, when this one fails and that one meets (the recommendation).</summary>
    public ExportedPidProof? Alternative { get; init; }

    /// <summary>How many requirements the continuous loop itself fails (those are not re-checked on the exported PID).</summary>
    public int ContinuousFailures { get; init; }

    /// <summary>"meets", "meets what the continuous loop meets (the continuous loop fails N)" or "FAILS".</summary>
    public string Verdict => !Meets ? "FAILS" : ContinuousFailures == 0 ? "meets" : $"meets what the continuous loop meets (the continuous loop fails {ContinuousFailures} requirement{(ContinuousFailures == 1 ? string.Empty : "s")})";

    /// <summary>True when the linear loop is stable and every requirement the continuous loop meets holds for the PID as exported.</summary>
    public bool Meets => Linear.Stable && Checks.All(c => c.Passes != false);

    /// <summary>The largest command of the reference run above u0 (actuator units, relative to the operating point).</summary>
    public double CommandHighest => ReferenceRun.Commands.Max() - Controller.OperatingPoint;

    /// <summary>The lowest command of the reference run relative to u0.</summary>
    public double CommandLowest => ReferenceRun.Commands.Min() - Controller.OperatingPoint;

    /// <summary>The fraction of the reference run's samples at which the command sits on a limit.</summary>
    public double SaturatedFraction => ReferenceRun.Commands.Count(u => u <= Controller.UMin || u >= Controller.UMax) / (double)ReferenceRun.Commands.Length;

    /// <summary>The largest |y| the load step causes, output units.</summary>
    public double DisturbancePeak => DisturbanceRun.Output.Values.Max(Math.Abs);

    /// <summary>When the load step's largest deviation occurs, seconds.</summary>
    public double DisturbancePeakTime => DisturbanceRun.Output.TimeAt(DisturbanceRun.Output.Values.Select(Math.Abs).ToList().IndexOf(DisturbancePeak));

    /// <summary>
    /// The time after which the output stays within ±2 % of the reference step size around 0 after the load step
    /// (0 when it never leaves that band; +∞ when it has not recovered at the end of the run).
    /// </summary>
    public double DisturbanceRecoveryTime
    {
        get
        {
            var band = 0.02 * Math.Abs(ReferenceStep);
            var y = DisturbanceRun.Output.Values;
            for (var k = y.Length - 1; k >= 0; k--)
            {
                if (Math.Abs(y[k]) > band)
                {
                    return k == y.Length - 1 ? double.PositiveInfinity : DisturbanceRun.Output.TimeAt(k + 1);
                }
            }

            return 0.0;
        }
    }

    /// <summary>The requirement the exported PID fails by the largest fraction of its bound, "unstable", or null when it meets.</summary>
    public static string? Describe(ExportedPidProof proof)
    {
        ArgumentNullException.ThrowIfNull(proof);
        return new LadderRung(proof.Controller.SampleTime, proof.Linear, proof.PhaseMarginDeg, proof.Checks).Binds;
    }

    /// <summary>Runs the exported PID on the loop and checks it.</summary>
    /// <param name="loop">The loop.</param>
    /// <param name="continuous">The continuous proof (its requirements, reference step and command figures).</param>
    /// <param name="controller">The controller as exported.</param>
    /// <param name="computationDelay">True when the firmware applies the command one sample late.</param>
    public static ExportedPidProof Run(Loop loop, LoopCheckReport continuous, PidImplementation controller, bool computationDelay)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(continuous);
        ArgumentNullException.ThrowIfNull(controller);
        var path = FeedbackPathOf(controller);
        var linear = SampledLoop.Prove(loop, path, computationDelay);
        var pm = linear.Stable ? SampleTimeLadder.PhaseMargin(loop, path, linear.DelaySamples) : double.NaN;
        var periods = Math.Clamp(2 * (linear.Step.Values.Length - 1), 200, MaxPeriods);
        var subSteps = Math.Clamp(2_000_000 / periods, 1, 10);
        var r = continuous.EffortFigures.ReferenceStep;
        var reference = Simulate(loop, controller, periods, subSteps, computationDelay, r, 0.0);
        var final = linear.Stable ? linear.Metrics.FinalValue : 1.0;
        var normalized = new SampledResponse(reference.Output.SampleTime, [.. reference.Output.Values.Select(v => v / r)]);
        var metrics = StepMetrics.Measure(normalized, final);
        var d = LoadStep(controller, continuous.EffortFigures);
        var disturbance = Simulate(loop, controller, periods, subSteps, computationDelay, 0.0, d);
        var stable = linear.Stable && reference.Output.Values.All(double.IsFinite);
        var checks = SampledChecks.Of(continuous, metrics, pm, stable);
        return new ExportedPidProof(controller, path, linear, pm, metrics, reference, r, d, disturbance, checks) { ContinuousFailures = continuous.Checks.Count(c => c.Passes == false) };
    }

    /// <summary>
    /// C_y(z) = Kp + Ki·T/(z − 1) + b·(z − 1)/(z − a), a = Tf/(Tf + T), b = Kd/(Tf + T), from the coefficients as the
    /// exported code stores them (<see cref="PidImplementation.StoredCoefficients"/>).
    /// </summary>
    public static DiscreteTransferFunction FeedbackPathOf(PidImplementation controller)
    {
        ArgumentNullException.ThrowIfNull(controller);
        var (kp, integralStep, a, b) = controller.StoredCoefficients();
        var t = controller.SampleTime;
        var zMinusOne = Polynomial.FromAscending([-1.0, 1.0]);
        var numerator = Polynomial.Constant(kp);
        var denominator = Polynomial.One;
        if (integralStep != 0)
        {
            // Kp + Ki·T/(z − 1) = (Kp·(z − 1) + Ki·T)/(z − 1).
            numerator = (numerator * zMinusOne) + Polynomial.Constant(integralStep);
            denominator = zMinusOne;
        }

        if (b != 0)
        {
            var filter = Polynomial.FromAscending([-a, 1.0]);
            numerator = (numerator * filter) + (denominator * zMinusOne * b);
            denominator *= filter;
        }

        var zeros = numerator.Degree > 0 ? RootFinder.Find(numerator).Roots : ImmutableArray<Complex>.Empty;
        var poles = denominator.Degree > 0 ? RootFinder.Find(denominator).Roots : ImmutableArray<Complex>.Empty;
        return DiscreteTransferFunction.FromFactors(numerator.Leading, zeros, poles, t);
    }

    // A load of a tenth of half the span between the limits, or (no limits) of the linear design's command peak,
    // in the direction the actuator can oppose from u0 (a heater at 0 % cannot cool: its load is a cooling one).
    private static double LoadStep(PidImplementation controller, EffortFigures effort)
    {
        if (controller.UMax - controller.UMin < 1e8)
        {
            var size = 0.1 * (controller.UMax - controller.UMin) / 2;
            return controller.UMax - controller.OperatingPoint >= controller.OperatingPoint - controller.UMin ? -size : size;
        }

        return double.IsFinite(effort.Peak) && effort.Peak > 0 ? 0.1 * effort.Peak : 1.0;
    }

    private static SampledControllerRun Simulate(Loop loop, PidImplementation controller, int periods, int subSteps, bool computationDelay, double reference, double disturbance)
    {
        // The controller has been running at rest when the step comes (so a derivative on the error sees the step).
        var twin = controller.Twin();
        twin.Step(0.0, 0.0);
        return SampledControllerLoop.Run(loop, twin.Step, controller.SampleTime, periods, subSteps, computationDelay, reference, disturbance, controller.OperatingPoint);
    }
}
