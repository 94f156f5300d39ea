using System.Text.Json;
using CompAssist.Core.Proof;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Reporting;

/// <summary>The JSON <c>check</c> object (shared by the design and check reports).</summary>
public static class CheckJsonSection
{
    /// <summary>Writes <c>"verdict": {meets, status, reasons}</c>.</summary>
    public static void WriteVerdict(Utf8JsonWriter w, LoopVerdict verdict)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(verdict);
        w.WriteStartObject("verdict");
        w.WriteBoolean("meets", verdict.Meets);
        w.WriteString("status", verdict.Name);
        w.WriteStartArray("reasons");
        foreach (var r in verdict.Reasons)
        {
            w.WriteStringValue(r);
        }

        w.WriteEndArray();
        w.WriteEndObject();
    }

    /// <summary>Writes <c>"check": {...}</c>.</summary>
    public static void Write(Utf8JsonWriter w, LoopCheckReport check, RobustnessReport? robustness)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(check);
        var n = JsonNumbers.Write;
        w.WriteStartObject("check");
        w.WriteBoolean("stable", check.Stable);
        var m = check.Step;

        // A diverging step has no final value, overshoot or settling: its figures are "nan", not numbers read
        // off the divergence.
        double V(double x) => check.Stable ? x : double.NaN;
        w.WriteStartObject("step");
        n(w, "overshootPercent", V(m.OvershootPercent));
        n(w, "peakTime", V(m.PeakTime));
        n(w, "riseTime", V(m.RiseTime));
        n(w, "settlingTime2", V(m.SettlingTime2Percent));
        n(w, "settlingTime5", V(m.SettlingTime5Percent));
        n(w, "finalValue", V(m.FinalValue));
        n(w, "peakValue", V(m.PeakValue));
        n(w, "undershootPercent", V(m.UndershootPercent));
        n(w, "undershootTime", V(m.UndershootTime));
        w.WriteBoolean("grazes2", m.Grazes2Percent);
        w.WriteBoolean("grazes5", m.Grazes5Percent);
        n(w, "shownWindow", check.ShownWindow);
        w.WriteBoolean("tailContinues", check.TailContinues);
        n(w, "stepError", check.StepError);
        n(w, "rampError", check.RampError);
        n(w, "sampleTime", m.SampleTime);
        n(w, "horizon", m.Horizon);
        w.WriteString("solution", check.Solution switch { StepSolution.ExactDelay => "exact-delay", StepSolution.PadeApproximant => "pade", _ => "exact" });
        w.WriteString("definitions", "measured on the response that solution names (exact: the exact solution of the delay-free loop; exact-delay: the loop with its delays exact, by the method of steps on a fine grid; pade: the delay replaced by its Padé approximant) toward the final value f: overshoot (peak - f)/|f| in %, 0 when the response never passes f; peakTime \"inf\" when there is no overshoot; undershoot: largest excursion away from f in % of |f|; rise 10-90 %; settling: last entry into the ±2 %/±5 % band, \"inf\" when not settled at the horizon; grazes: the response only touches the band edge, so the settling time is uncertain by a period; errors r - y");
        w.WriteEndObject();

        w.WriteStartObject("errorConstants");
        w.WriteNumber("type", check.ErrorConstants.SystemType);
        n(w, "kp", check.ErrorConstants.Kp);
        n(w, "kv", check.ErrorConstants.Kv);
        n(w, "ka", check.ErrorConstants.Ka);
        w.WriteEndObject();

        if (check.Margins is { } g)
        {
            w.WriteStartObject("margins");
            n(w, "gainMarginDb", g.GainMarginDb);
            n(w, "phaseMarginDeg", g.PhaseMarginDeg);
            n(w, "gainCrossover", g.GainCrossover);
            n(w, "phaseCrossover", g.PhaseCrossover);
            n(w, "delayMargin", g.DelayMargin);
            n(w, "gainReductionMarginDb", g.GainReductionMarginDb);
            n(w, "sensitivityPeak", g.SensitivityPeak);
            n(w, "sensitivityPeakFrequency", g.SensitivityPeakFrequency);
            n(w, "gainReductionCrossover", g.GainReductionCrossover);
            n(w, "delayMarginCrossover", g.DelayMarginCrossover);
            w.WriteStartArray("gainCrossings");
            foreach (var c in g.GainCrossings)
            {
                w.WriteStartObject();
                n(w, "frequency", c.Frequency);
                n(w, "phaseDeg", c.PhaseDegrees);
                n(w, "signedMarginDeg", c.SignedMarginDegrees);
                n(w, "distanceDeg", c.DistanceDegrees);
                n(w, "delayMargin", c.DelayMargin);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            w.WriteStartArray("phaseCrossings");
            foreach (var c in g.PhaseCrossings)
            {
                w.WriteStartObject();
                n(w, "frequency", c.Frequency);
                n(w, "magnitude", c.Magnitude);
                n(w, "gainFactorDb", c.GainFactorDb);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            n(w, "selfCheckResidual", g.SelfCheckResidual);
            w.WriteEndObject();
        }
        else
        {
            w.WriteNull("margins");
            w.WriteNumber("unstableRoots", check.UnstableRootCount);
        }

        if (check.Frequency is { } q)
        {
            w.WriteStartObject("frequency");
            n(w, "bandwidth", q.Bandwidth);
            n(w, "complementaryPeak", q.ComplementaryPeak);
            n(w, "complementaryPeakFrequency", q.ComplementaryPeakFrequency);
            n(w, "noisePeak", q.NoisePeak);
            n(w, "noisePeakFrequency", q.NoisePeakFrequency);
            w.WriteEndObject();
        }

        if (check.LoadDisturbance is { } d)
        {
            w.WriteStartObject("loadDisturbance");
            w.WriteString("definition", "output for a unit step of load at the plant input (actuator units), reference 0: largest |y|, its time, y(inf), and the time after which |y - y(inf)| stays within the settling band times the peak; sampled at 2000 intervals over the step's horizon");
            n(w, "peak", d.Peak);
            n(w, "peakTime", d.PeakTime);
            n(w, "offset", d.Offset);
            n(w, "recoveryTime", d.RecoveryTime);
            w.WriteEndObject();
        }

        var e = check.EffortFigures;
        w.WriteStartObject("effort");
        n(w, "initial", e.Initial);
        n(w, "peak", e.Peak);
        n(w, "peakTime", e.PeakTime);
        n(w, "referenceStep", e.ReferenceStep);
        if (e.Limit is { } limit)
        {
            n(w, "limit", limit);
        }

        if (e.Room is { IsSymmetric: false } room)
        {
            n(w, "highest", e.Highest);
            n(w, "lowest", e.Lowest);
            n(w, "roomLow", room.Low);
            n(w, "roomHigh", room.High);
        }

        w.WriteBoolean("saturates", e.Saturates);
        w.WriteEndObject();

        w.WriteStartArray("requirements");
        foreach (var c in check.Checks)
        {
            w.WriteStartObject();
            w.WriteString("name", c.Name);
            n(w, "measured", c.Measured);
            if (c.Required is { } r)
            {
                n(w, "required", r);
            }

            if (c.Predicted is { } p)
            {
                n(w, "predicted", p);
            }

            if (c.Passes is { } pass)
            {
                w.WriteBoolean("passes", pass);
                w.WriteString("bound", c.Bound == RequirementBound.AtMost ? "at-most" : "at-least");
            }

            w.WriteEndObject();
        }

        w.WriteEndArray();

        if (robustness is not null)
        {
            w.WriteStartObject("robustness");
            w.WriteBoolean("allStable", robustness.AllStable);
            w.WriteBoolean("allMeet", robustness.AllMeet);
            n(w, "worstOvershootPercent", robustness.WorstOvershootPercent);
            n(w, "worstSettlingTime2", robustness.WorstSettlingTime2Percent);
            n(w, "leastDamping", robustness.LeastDamping);
            w.WriteStartArray("variations");
            foreach (var v in robustness.Variations)
            {
                w.WriteStringValue(v.ToString());
            }

            w.WriteEndArray();
            w.WriteStartArray("corners");
            foreach (var corner in robustness.Corners)
            {
                w.WriteStartObject();
                w.WriteStartArray("factors");
                foreach (var f in corner.Factors)
                {
                    w.WriteNumberValue(f);
                }

                w.WriteEndArray();
                w.WriteBoolean("stable", corner.Stable);
                n(w, "overshootPercent", corner.OvershootPercent);
                n(w, "settlingTime2", corner.SettlingTime2Percent);
                n(w, "leastDamping", corner.LeastDamping);
                w.WriteBoolean("meets", corner.Meets);
                w.WriteStartArray("failing");
                foreach (var row in corner.Failing)
                {
                    w.WriteStringValue(row.Name);
                }

                w.WriteEndArray();
                w.WriteEndObject();
            }

            w.WriteEndArray();
            w.WriteEndObject();
        }

        w.WriteStartArray("warnings");
        foreach (var warning in check.Warnings)
        {
            w.WriteStringValue(warning);
        }

        w.WriteEndArray();
        w.WriteEndObject();
    }
}
