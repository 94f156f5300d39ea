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
        var stable = closedLoopPoles.All(r => r.Real < 0);
        var transfers = ClosedLoopTransfers.Of(loop, compensator, closedLoopPoles);
        var horizon = Horizon(closedLoopPoles);
        var h = horizon / options.Intervals;
        var output = StepSimulator.Step(CascadeRealization.Of(transfers.Output), h, options.Intervals);
        SampledResponse? effort = transfers.Effort is { } e ? StepSimulator.Step(CascadeRealization.Of(e), h, options.Intervals) : null;

        var final = stable ? transfers.Output.DcGain : output.Values[^1];
        var metrics = StepMetrics.Measure(output, final);
        var stepError = stable ? 1.0 - final : double.NaN;
        var rampError = stable ? RampError(transfers.Output, stepError) : double.NaN;
        var constants = ErrorConstants.Of(loop, compensator);
        var margins = stable ? MarginAnalyzer.Analyze(loop, compensator) : null;
        var effortFigures = Effort(effort, options);

        var warnings = ImmutableArray.CreateBuilder<string>();
        if (!stable)
        {
            warnings.Add("The closed loop is unstable: the step grows without bound and no margins are claimed.");
        }

        if (stable && double.IsPositiveInfinity(metrics.SettlingTime2Percent))
        {
            warnings.Add($"The step has not settled within ±2 % by the end of the simulated {F(horizon)} s.");
        }

        if (effortFigures.Saturates)
        {
            warnings.Add($"The actuator command peaks at {F(effortFigures.Peak)} for a step of {F(options.ReferenceStep)}, beyond the limit {F(options.ActuatorLimit!.Value)}: the actuator saturates and every linear prediction here is void. Reduce the step, slow the target, or accept saturation with anti-windup.");
        }

        if (transfers.Effort is null)
        {
            warnings.Add("The compensator is improper (more zeros than poles): the actuator command contains an impulse at the step. Add a derivative filter.");
        }

        var checks = ImmutableArray.CreateBuilder<RequirementCheck>();
        var prediction = target?.Predict();
        checks.Add(new RequirementCheck("overshoot %", metrics.OvershootPercent, requirements?.MaxOvershootPercent, prediction?.OvershootPercent));
        var band2 = requirements?.Band == SettlingBand.TwoPercent ? requirements.MaxSettlingTime : null;
        var band5 = requirements?.Band == SettlingBand.FivePercent ? requirements.MaxSettlingTime : null;
        checks.Add(new RequirementCheck("settling time 2 % (s)", metrics.SettlingTime2Percent, band2, prediction?.SettlingTime2Percent));
        checks.Add(new RequirementCheck("settling time 5 % (s)", metrics.SettlingTime5Percent, band5, prediction?.SettlingTime5Percent));
        checks.Add(new RequirementCheck("peak time (s)", metrics.PeakTime, requirements?.MaxPeakTime, prediction?.PeakTime));
        checks.Add(new RequirementCheck("rise time 10-90 % (s)", metrics.RiseTime, null, null));

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
            warnings.Add($"Requirement not met: {c.Name} is {F(c.Measured)}, the bound is {F(c.Required!.Value)}.");
        }

        return new LoopCheckReport
        {
            Stable = stable,
            Output = output,
            Effort = effort,
            Step = metrics,
            StepError = stepError,
            RampError = rampError,
            ErrorConstants = constants,
            Margins = margins,
            EffortFigures = effortFigures,
            Checks = checks.ToImmutable(),
            Warnings = warnings.ToImmutable(),
        };
    }

    /// <summary>
    /// Simulation horizon in seconds: eight time constants of the slowest decaying pole, so slow tails (lag
    /// dipoles) are not cut off. For an unstable loop, long enough to show the growth without overflowing.
    /// </summary>
    public static double Horizon(ImmutableArray<Complex> poles)
    {
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
        foreach (var z in t.Zeros)
        {
            logDerivative += 1.0 / (-z);
        }

        foreach (var p in t.Poles)
        {
            logDerivative -= 1.0 / (-p);
        }

        return -(t0 * logDerivative.Real);
    }

    private static EffortFigures Effort(SampledResponse? u, CheckOptions options)
    {
        if (u is null)
        {
            return new EffortFigures(double.PositiveInfinity, double.PositiveInfinity, 0.0, options.ReferenceStep, options.ActuatorLimit);
        }

        var peakIndex = 0;
        for (var k = 1; k < u.Values.Length; k++)
        {
            if (Math.Abs(u.Values[k]) > Math.Abs(u.Values[peakIndex]))
            {
                peakIndex = k;
            }
        }

        var scale = options.ReferenceStep;
        return new EffortFigures(u.Values[0] * scale, Math.Abs(u.Values[peakIndex] * scale), u.TimeAt(peakIndex), scale, options.ActuatorLimit);
    }

    private static string F(double x) => x.ToString("G4", CultureInfo.InvariantCulture);
}
