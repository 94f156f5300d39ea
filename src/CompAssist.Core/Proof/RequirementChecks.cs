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

    /// <summary>Row name of the actuator peak.</summary>
    public const string ActuatorPeak = "peak |u| (actuator)";

    /// <summary>The rows for a measured step (and, where known, error constants and effort).</summary>
    public static ImmutableArray<RequirementCheck> Of(
        StepMetrics metrics,
        bool stable,
        Requirements? requirements,
        SecondOrderPrediction? prediction = null,
        ErrorConstants? constants = null,
        EffortFigures? effort = null)
    {
        ArgumentNullException.ThrowIfNull(metrics);
        var rows = ImmutableArray.CreateBuilder<RequirementCheck>();
        rows.Add(new RequirementCheck(Overshoot, metrics.OvershootPercent, requirements?.MaxOvershootPercent, prediction?.OvershootPercent, Valid: stable));
        var band2 = requirements?.Band == SettlingBand.TwoPercent ? requirements.MaxSettlingTime : null;
        var band5 = requirements?.Band == SettlingBand.FivePercent ? requirements.MaxSettlingTime : null;
        rows.Add(new RequirementCheck(Settling2, metrics.SettlingTime2Percent, band2, prediction?.SettlingTime2Percent, Valid: stable));
        rows.Add(new RequirementCheck(Settling5, metrics.SettlingTime5Percent, band5, prediction?.SettlingTime5Percent, Valid: stable));
        rows.Add(new RequirementCheck(PeakTime, metrics.PeakTime, requirements?.MaxPeakTime, prediction?.PeakTime, Valid: stable));
        rows.Add(new RequirementCheck("rise time 10-90 % (s)", metrics.RiseTime, null, null, Valid: stable));
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

        if (effort?.Limit is { } limit)
        {
            rows.Add(new RequirementCheck(ActuatorPeak, effort.Peak, limit, null, Valid: stable));
        }

        return rows.ToImmutable();
    }
}
