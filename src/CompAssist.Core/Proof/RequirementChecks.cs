using System.Collections.Immutable;
using CompAssist.Core.Simulation;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Proof;

/// <summary>
/// The one place that turns measured figures into the requirement table: the nominal loop and every
/// robustness corner are judged by the same rows and the same rule (an unstable loop passes nothing).
/// </summary>
public static class RequirementChecks
{
    /// <summary>Row name of the overshoot.</summary>
    public const string Overshoot = "overshoot %";

    /// <summary>Row name of the 2 % settling time.</summary>
    public const string Settling2 = "settling time 2 % (s)";

    /// <summary>Row name of the 5 % settling time.</summary>
    public const string Settling5 = "settling time 5 % (s)";

    /// <summary>Row name of the peak time.</summary>
    public const string PeakTime = "peak time (s)";

    /// <summary>Row name of the rise time.</summary>
    public const string RiseTime = "rise time 10-90 % (s)";

    /// <summary>Row name of the phase margin.</summary>
    public const string PhaseMargin = "phase margin (°)";

    /// <summary>Row name of the gain margin (the smaller of upward and downward).</summary>
    public const string GainMargin = "gain margin (dB)";

    /// <summary>Row name of the delay margin.</summary>
    public const string DelayMargin = "delay margin (s)";

    /// <summary>Row name of the sensitivity peak.</summary>
    public const string SensitivityPeak = "sensitivity peak Ms";

    /// <summary>Row name of the actuator peak.</summary>
    public const string ActuatorPeak = "peak |u| (actuator)";

    /// <summary>Row name of the highest command about the operating point (asymmetric output limits).</summary>
    public const string CommandHighest = "highest u − u0 (actuator)";

    /// <summary>Row name of the lowest command about the operating point (asymmetric output limits).</summary>
    public const string CommandLowest = "lowest u − u0 (actuator)";

    /// <summary>The rows for a measured step (and, where known, error constants and effort).</summary>
    public static ImmutableArray<RequirementCheck> Of(
        StepMetrics metrics,
        bool stable,
        Requirements? requirements,
        SecondOrderPrediction? prediction = null,
        ErrorConstants? constants = null,
        EffortFigures? effort = null,
        StabilityMargins? margins = null)
    {
        ArgumentNullException.ThrowIfNull(metrics);
        var rows = ImmutableArray.CreateBuilder<RequirementCheck>();
        rows.Add(new RequirementCheck(Overshoot, metrics.OvershootPercent, requirements?.MaxOvershootPercent, prediction?.OvershootPercent, Valid: stable));
        var band2 = requirements?.Band == SettlingBand.TwoPercent ? requirements.MaxSettlingTime : null;
        var band5 = requirements?.Band == SettlingBand.FivePercent ? requirements.MaxSettlingTime : null;
        rows.Add(new RequirementCheck(Settling2, metrics.SettlingTime2Percent, band2, prediction?.SettlingTime2Percent, Valid: stable));
        rows.Add(new RequirementCheck(Settling5, metrics.SettlingTime5Percent, band5, prediction?.SettlingTime5Percent, Valid: stable));
        rows.Add(new RequirementCheck(PeakTime, metrics.PeakTime, requirements?.MaxPeakTime, prediction?.PeakTime, Valid: stable));
        rows.Add(new RequirementCheck(RiseTime, metrics.RiseTime, requirements?.MaxRiseTime, null, Valid: stable));
        if (metrics.UndershootPercent > 0)
        {
            rows.Add(new RequirementCheck("undershoot %", metrics.UndershootPercent, null, null, Valid: stable));
        }

        if (constants is not null && requirements?.Constant is { } needed)
        {
            var measured = needed.Kind switch
            {
                ErrorConstantKind.Position => constants.Kp,
                ErrorConstantKind.Velocity => constants.Kv,
                _ => constants.Ka,
            };
            rows.Add(new RequirementCheck($"error constant {needed.Symbol}", measured, needed.Value, null, RequirementBound.AtLeast, stable));
        }

        if (effort?.Room is { IsSymmetric: true } symmetric)
        {
            rows.Add(new RequirementCheck(ActuatorPeak, effort.Peak, symmetric.High, null, Valid: stable));
        }
        else if (effort?.Room is { } room)
        {
            rows.Add(new RequirementCheck(CommandHighest, effort.Highest, room.High, null, Valid: stable));
            rows.Add(new RequirementCheck(CommandLowest, effort.Lowest, room.Low, null, RequirementBound.AtLeast, stable));
        }

        if (requirements is { NeedsMargins: true })
        {
            var valid = stable && margins is not null;
            var gain = margins is null ? double.NaN : Math.Min(margins.GainMarginDb, margins.GainReductionMarginDb);
            AddIfGiven(rows, PhaseMargin, margins?.PhaseMarginDeg, requirements.MinPhaseMarginDegrees, RequirementBound.AtLeast, valid);
            AddIfGiven(rows, GainMargin, gain, requirements.MinGainMarginDb, RequirementBound.AtLeast, valid);
            AddIfGiven(rows, DelayMargin, margins?.DelayMargin, requirements.MinDelayMargin, RequirementBound.AtLeast, valid);
            AddIfGiven(rows, SensitivityPeak, margins?.SensitivityPeak, requirements.MaxSensitivityPeak, RequirementBound.AtMost, valid);
        }

        return rows.ToImmutable();
    }

    private static void AddIfGiven(ImmutableArray<RequirementCheck>.Builder rows, string name, double? measured, double? bound, RequirementBound side, bool valid)
    {
        if (bound is not null)
        {
            rows.Add(new RequirementCheck(name, measured ?? double.NaN, bound, null, side, valid));
        }
    }
}
