using System.Text.Json;
using CompAssist.Core.Proof;

namespace CompAssist.Core.Reporting;

/// <summary>The JSON <c>check</c> object (shared by the design and check reports).</summary>
public static class CheckJsonSection
{
    /// <summary>Writes <c>"check": {...}</c>.</summary>
    public static void Write(Utf8JsonWriter w, LoopCheckReport check, RobustnessReport? robustness)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(check);
        var n = JsonNumbers.Write;
        w.WriteStartObject("check");
        w.WriteBoolean("stable", check.Stable);
        var m = check.Step;
        w.WriteStartObject("step");
        n(w, "overshootPercent", m.OvershootPercent);
        n(w, "peakTime", m.PeakTime);
        n(w, "riseTime", m.RiseTime);
        n(w, "settlingTime2", m.SettlingTime2Percent);
        n(w, "settlingTime5", m.SettlingTime5Percent);
        n(w, "finalValue", m.FinalValue);
        n(w, "peakValue", m.PeakValue);
        n(w, "stepError", check.StepError);
        n(w, "rampError", check.RampError);
        n(w, "sampleTime", m.SampleTime);
        n(w, "horizon", m.Horizon);
        w.WriteString("definitions", "overshoot (peak-final)/|final|; rise 10-90 %; settling: last exit from the ±2 %/±5 % band; errors r - y");
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
            w.WriteEndObject();
        }
        else
        {
            w.WriteNull("margins");
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
            }

            w.WriteEndObject();
        }

        w.WriteEndArray();

        if (robustness is not null)
        {
            w.WriteStartObject("robustness");
            w.WriteBoolean("allStable", robustness.AllStable);
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
