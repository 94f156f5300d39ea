using System.Collections.Immutable;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Export;

/// <summary>The requirements the continuous loop meets, measured again on a sampled loop (the ladder's rungs, the PID as exported).</summary>
internal static class SampledChecks
{
    /// <summary>
    /// One row per step or phase-margin requirement the continuous loop meets, with the sampled figure; with none
    /// given, the sampled step held within 5 points of overshoot and 1.5× the settling time of the continuous one.
    /// </summary>
    public static ImmutableArray<RequirementCheck> Of(LoopCheckReport continuous, StepMetrics m, double phaseMarginDeg, bool stable)
    {
        var checks = ImmutableArray.CreateBuilder<RequirementCheck>();
        foreach (var row in continuous.Checks.Where(c => c.Passes == true))
        {
            double? measured = row.Name switch
            {
                RequirementChecks.Overshoot => m.OvershootPercent,
                RequirementChecks.Settling2 => m.SettlingTime2Percent,
                RequirementChecks.Settling5 => m.SettlingTime5Percent,
                RequirementChecks.PeakTime => m.PeakTime,
                RequirementChecks.RiseTime => m.RiseTime,
                RequirementChecks.PhaseMargin => phaseMarginDeg,
                _ => null,
            };
            if (measured is { } value)
            {
                checks.Add(row with { Measured = value, Predicted = null, Valid = stable && !double.IsNaN(value) });
            }
        }

        if (checks.Count == 0 && continuous.Stable)
        {
            var c = continuous.Step;
            checks.Add(new RequirementCheck("overshoot % (continuous + 5)", m.OvershootPercent, c.OvershootPercent + 5, null, Valid: stable));
            if (double.IsFinite(c.SettlingTime2Percent))
            {
                checks.Add(new RequirementCheck("settling time 2 % (1.5 × continuous)", m.SettlingTime2Percent, 1.5 * c.SettlingTime2Percent, null, Valid: stable));
            }
        }

        return checks.ToImmutable();
    }
}
