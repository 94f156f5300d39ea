using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Simulation;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Proof;

/// <summary>
/// Proves what a compensated loop does for a reference step: exact sampled step of output and actuator
/// command, steady-state errors, error constants, margins and effort, each beside the requirement and the
/// second-order prediction where those exist.
/// </summary>
public static class LoopCheck
{
    // Relative size below which a difference of nearly equal terms (1 − T(0), the terms of T′(0)) is rounding.
    private const double RoundingLevel = 1e-10;

    /// <summary>How the warning of a loop that settles away from the reference begins (no steady-state requirement stated).</summary>
    public const string OffsetWarningStart = "The loop settles at ";

    /// <summary>Checks the loop, finding its closed-loop poles by root finding.</summary>
    /// <exception cref="RootFindingException">The closed-loop poles cannot be verified.</exception>
    public static LoopCheckReport Run(Loop loop, TransferFunction compensator, CheckOptions options, Requirements? requirements = null, TargetPole? target = null)
    {
        ArgumentNullException.ThrowIfNull(loop);
        var roots = RootFinder.Find(loop.Characteristic(compensator)).Roots;
        return Run(loop, compensator, roots, options, requirements, target);
    }

    /// <summary>Checks the loop with closed-loop poles already found (e.g. by <see cref="LoopProver"/>).</summary>
    public static LoopCheckReport Run(Loop loop, TransferFunction compensator, ImmutableArray<Complex> closedLoopPoles, CheckOptions options, Requirements? requirements = null, TargetPole? target = null)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        ArgumentNullException.ThrowIfNull(options);
        var judgement = ClosedLoopStability.Judge(loop, compensator, closedLoopPoles);
        var stable = judgement.Stable;
        var unstableRoots = judgement.UnstableRootCount;
        var transfers = ClosedLoopTransfers.Of(loop, compensator, closedLoopPoles);
        var outputSystem = CascadeRealization.Of(transfers.Output);
        var effortSystem = transfers.Effort is { } e ? CascadeRealization.Of(e) : null;
        var final = stable ? transfers.Output.DcGain : double.NaN;
        var trajectory = StepAnalysis.SimulateToSettling(outputSystem, closedLoopPoles, final, Horizon(closedLoopPoles));
        var horizon = trajectory.Horizon;
        var measured = StepAnalysis.Measure(trajectory, stable ? final : trajectory.Value(trajectory.Count - 1));
        var hasDelay = loop.Delay + compensator.Delay > 0;
        var delayed = stable && hasDelay ? DelayLoopStep.Simulate(loop, compensator, horizon) : null;
        var solution = !hasDelay ? StepSolution.Exact : delayed is not null ? StepSolution.ExactDelay : StepSolution.PadeApproximant;
        if (delayed is not null)
        {
            measured = StepMetrics.Measure(delayed.Output, final);
        }

        var window = stable ? ShownWindow(measured, horizon) : horizon;
        var h = window / options.Intervals;
        var intervals = options.Intervals;
        var output = delayed is not null ? delayed.Output.Resampled(h, intervals) : StepSimulator.Step(outputSystem, h, options.Intervals);
        var effort = new Lazy<SampledResponse?>(() => delayed is not null
            ? (delayed.Effort is { } u ? u.Resampled(h, intervals) : null)
            : effortSystem is not null ? StepSimulator.Step(effortSystem, h, intervals) : null);
        var metrics = measured with { SampleTime = h };
        var stepError = stable ? (Math.Abs(1.0 - final) <= RoundingLevel ? 0.0 : 1.0 - final) : double.NaN;
        var rampError = stable ? RampError(transfers.Output, stepError) : double.NaN;
        var constants = ErrorConstants.Of(loop, compensator);
        var margins = stable ? MarginAnalyzer.Analyze(loop, compensator) : null;
        var finalCommand = stable && transfers.Effort is { } effortTransfer ? effortTransfer.DcGain : double.NaN;
        var effortFigures = delayed?.Effort is { } exactEffort && effortSystem is not null
            ? SampledEffort(exactEffort, effortSystem.D, options, finalCommand)
            : Effort(effortSystem, closedLoopPoles, horizon, options, finalCommand);

        var bandFraction = requirements?.Band == Targets.SettlingBand.FivePercent ? 0.05 : 0.02;
        LoadDisturbanceFigures? load = null;
        FrequencyFigures? frequency = null;
        if (stable)
        {
            var loadResponse = StepSimulator.Step(CascadeRealization.Of(transfers.Load), horizon / options.Intervals, options.Intervals);
            load = LoadDisturbanceFigures.Of(loadResponse, transfers.Load.DcGain, bandFraction);
            var scale = margins is { } m && double.IsFinite(m.GainCrossover) && m.GainCrossover > 0 ? m.GainCrossover : Math.Max(closedLoopPoles.Select(p => p.Magnitude).DefaultIfEmpty(1.0).Min(), 1e-6);
            frequency = FrequencyFigures.Of(loop, compensator, scale);
        }

        var warnings = ImmutableArray.CreateBuilder<string>();
        if (judgement.Note is { } note)
        {
            warnings.Add(note);
        }

        if (!stable)
        {
            var growth = closedLoopPoles.Any(r => r.Real >= 0)
                ? "The step grows without bound"
                : "The step shown is that of the Padé approximant, which does not show the growth";
            warnings.Add($"The closed loop is UNSTABLE: {unstableRoots} closed-loop root{(unstableRoots == 1 ? " is" : "s are")} in the right half-plane or on the imaginary axis. {growth}; no margins are claimed and no requirement passes.");
        }

        if (trajectory.Capped && delayed is null)
        {
            var slowest = closedLoopPoles.Where(p => p.Imaginary > 0 && p.Real < 0).Select(p => -p.Real).DefaultIfEmpty(double.NaN).Min();
            warnings.Add($"The loop is so lightly damped that the simulation stops at {F(horizon)} s ({StepTrajectory.MaxOscillationSamples / 2:F0} radians of its oscillation, about {StepTrajectory.MaxOscillationSamples / 4 / Math.PI:F0} periods) instead of running until it settles: its envelope needs about 4/σ = {F(4 / slowest)} s to enter the ±2 % band. Overshoot, peak and rise are measured (over so many periods rounding can grow the oscillation by about 0.2 %, which then exceeds its true decay for ζ below about 1e-7); the settling time is beyond the simulated span.");
        }

        if (stable && requirements?.Constant is null && Math.Abs(1.0 - final) > 0.02)
        {
            warnings.Add($"{OffsetWarningStart}{F(final)} for a unit reference (steady-state error {F(100 * stepError)} %): overshoot and settling are measured about that final value, not about the reference. Remedies: integral action (a PI or PID makes the loop type 1 and the step error 0), or a reference prefilter gain of {F(1 / final)} (exact on the nominal plant only; an offset from a load disturbance remains).");
        }

        if (stable && double.IsPositiveInfinity(metrics.SettlingTime2Percent))
        {
            warnings.Add($"The step has not settled within ±2 % by the end of the simulated {F(horizon)} s.");
        }

        foreach (var (grazes, band, time) in new[] { (metrics.Grazes2Percent, 2, metrics.SettlingTime2Percent), (metrics.Grazes5Percent, 5, metrics.SettlingTime5Percent) })
        {
            if (stable && grazes)
            {
                warnings.Add($"The response only grazes the ±{band} % band edge near its settling time ({F(time)} s): a tiny change of the loop moves the settling time by a whole period. Read it as uncertain by that much.");
            }
        }

        if (margins is not null && margins.SelfCheckResidual > 1e-6)
        {
            warnings.Add($"The margin self-check did not close (residual {F(margins.SelfCheckResidual)}): a reported margin does not put a root exactly on the imaginary axis. Treat the margins as approximate.");
        }

        if (effortFigures.Saturates)
        {
            var room = effortFigures.Room!;
            var beyond = room.IsSymmetric
                ? $"peaks at {F(effortFigures.Peak)} for a step of {F(options.ReferenceStep)}, beyond the limit {F(room.High)}"
                : $"runs from {F(effortFigures.Lowest)} to {F(effortFigures.Highest)} about the operating point {F(options.OperatingPoint)} for a step of {F(options.ReferenceStep)}, beyond the room {F(room.Low)} … {F(room.High)} the output limits leave";
            warnings.Add($"The actuator command {beyond}: the actuator saturates and every linear prediction here is void. Reduce the step, slow the target, or accept saturation with anti-windup.");
        }

        if (transfers.Effort is null)
        {
            warnings.Add("The compensator is improper (more zeros than poles): the actuator command contains an impulse at the step. Add a derivative filter.");
        }

        if (solution == StepSolution.PadeApproximant && stable)
        {
            var theta = loop.Delay + compensator.Delay;
            warnings.Add(theta * 1e4 < horizon
                ? $"The delay ({F(theta)} s) is so short beside the simulated {F(horizon)} s that the step is that of its Padé approximant of order {loop.PadeOrder}; at this ratio the two agree closely."
                : $"The delay ({F(theta)} s) is too long beside the loop's fastest dynamics to simulate exactly within the step budget: the step and its figures are those of the Padé approximant of order {loop.PadeOrder} and may be far off. Do not rely on them; check the loop with the delay in a time-domain simulation of its own.");
        }

        if (solution == StepSolution.PadeApproximant && stable && metrics.UndershootPercent > 0
            && !loop.Plant.Zeros.Concat(compensator.Zeros).Concat(loop.Feedback.Poles).Any(z => z.Real > 0))
        {
            warnings.Add($"The undershoot of {F(metrics.UndershootPercent)} % comes from the Padé approximant of the delay (its right-half-plane zeros): the real delay holds the output still until it has passed and starts no wrong-way excursion. The other step figures are those of the approximant too.");
        }

        var prediction = target?.Predict();
        var checks = RequirementChecks.Of(metrics, stable, requirements, prediction, constants, effortFigures, margins);
        if (stable && prediction is not null && target is not null && target.Zeta < 1)
        {
            var overshootGap = Math.Abs(metrics.OvershootPercent - prediction.OvershootPercent);
            var settlingRatio = metrics.SettlingTime2Percent / prediction.SettlingTime2Percent;
            if (overshootGap > 5.0 || settlingRatio > 1.5 || settlingRatio < 0.5)
            {
                warnings.Add($"The simulated step disagrees with the second-order prediction (overshoot {F(metrics.OvershootPercent)} % vs {F(prediction.OvershootPercent)} %, 2 % settling {F(metrics.SettlingTime2Percent)} s vs {F(prediction.SettlingTime2Percent)} s): a closed-loop zero or another pole near the dominant pair shapes the response. Trust the simulation.");
            }
        }

        foreach (var c in checks.Where(c => c.Passes == false))
        {
            warnings.Add(c.Valid
                ? $"Requirement not met: {c.Name} is {F(c.Measured)}, the bound is {c.BoundSymbol} {F(c.Required!.Value)}."
                : $"Requirement not met: {c.Name} (bound {c.BoundSymbol} {F(c.Required!.Value)}) cannot hold in an unstable loop.");
        }

        return new LoopCheckReport
        {
            Stable = stable,
            UnstableRootCount = unstableRoots,
            Output = output,
            EffortResponse = effort,
            Step = metrics,
            Solution = solution,
            ShownWindow = window,
            TailContinues = window < horizon,
            StepError = stepError,
            RampError = rampError,
            ErrorConstants = constants,
            Margins = margins,
            EffortFigures = effortFigures,
            Checks = checks,
            Warnings = warnings.ToImmutable(),
            LoadDisturbance = load,
            Frequency = frequency,
        };
    }

    /// <summary>
    /// The window people are shown: the transient (three times the later of the peak and the 90 % crossing,
    /// or 1.25 × the 2 % settling time when that is not much longer), never beyond the horizon. A slow tail
    /// that sets a long horizon is then not allowed to squeeze the rise into a column of the picture.
    /// </summary>
    public static double ShownWindow(StepMetrics metrics, double horizon)
    {
        ArgumentNullException.ThrowIfNull(metrics);
        var times = new[] { metrics.PeakTime, metrics.UndershootTime, metrics.RiseTime * 1.5 }.Where(double.IsFinite).ToList();
        if (times.Count == 0)
        {
            return horizon;
        }

        var transient = 3.0 * times.Max();
        var settle = metrics.SettlingTime2Percent;
        var window = double.IsFinite(settle) && settle <= 4.0 * transient ? Math.Max(transient, 1.25 * settle) : transient;
        // Only a window well short of the horizon is worth a "the tail continues" note; otherwise show it all.
        return window > 0 && window < 0.6 * horizon ? window : horizon;
    }

    /// <summary>
    /// Simulation horizon in seconds: eight time constants of the slowest decaying pole, so slow tails (lag
    /// dipoles) are not cut off. For an unstable loop, long enough to show the growth without overflowing.
    /// </summary>
    public static double Horizon(ImmutableArray<Complex> poles)
    {
        if (poles.IsDefaultOrEmpty)
        {
            return 1.0; // a static loop (gains only): nothing moves after the step
        }

        var decays = poles.Where(p => p.Real < 0).Select(p => -p.Real).ToList();
        if (poles.Any(p => p.Real >= 0))
        {
            var growth = poles.Max(p => p.Real);
            var scale = decays.Count > 0 ? 8.0 / decays.Max() : 10.0;
            return growth > 0 ? Math.Min(scale * 10, 20.0 / growth) : Math.Max(scale, 10.0);
        }

        return 8.0 / decays.Min();
    }

    /// <summary>Ramp error lim (1 − T(s))/s: infinite with a non-zero step error, else −T′(0).</summary>
    private static double RampError(TransferFunction t, double stepError)
    {
        if (Math.Abs(stepError) > 1e-9)
        {
            return double.PositiveInfinity;
        }

        // T′(0)/T(0) = Σ 1/(0 − z) − Σ 1/(0 − p) for T(0) ≠ 0.
        var t0 = t.DcGain;
        Complex logDerivative = 0;
        var size = 0.0;
        foreach (var z in t.Zeros)
        {
            logDerivative += 1.0 / (-z);
            size += 1.0 / z.Magnitude;
        }

        foreach (var p in t.Poles)
        {
            logDerivative -= 1.0 / (-p);
            size += 1.0 / p.Magnitude;
        }

        // A type-2 loop has T′(0) = 0: the terms cancel to rounding, which is zero, not a tiny error.
        var error = -(t0 * logDerivative.Real);
        return Math.Abs(error) <= RoundingLevel * Math.Abs(t0) * size ? 0.0 : error;
    }

    private static EffortFigures SampledEffort(SampledResponse u, double initial, CheckOptions options, double finalCommand)
    {
        var (high, highTime, low, lowTime) = (u.Values[0], 0.0, u.Values[0], 0.0);
        for (var k = 1; k < u.Values.Length; k++)
        {
            if (u.Values[k] > high)
            {
                (high, highTime) = (u.Values[k], u.TimeAt(k));
            }

            if (u.Values[k] < low)
            {
                (low, lowTime) = (u.Values[k], u.TimeAt(k));
            }
        }

        return EffortFigures.Of(initial, high, highTime, low, lowTime, options, finalCommand);
    }

    private static EffortFigures Effort(StateSpace? u, ImmutableArray<Complex> poles, double horizon, CheckOptions options, double finalCommand)
    {
        if (u is null)
        {
            return EffortFigures.Impulse(options);
        }

        var (high, highTime, low, lowTime) = StepAnalysis.Extremes(u, poles, horizon);
        return EffortFigures.Of(u.D, high, highTime, low, lowTime, options, finalCommand);
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
