using System.Numerics;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Reporting;

/// <summary>
/// The design report for programs (the stable machine interface). Polynomial coefficients are in
/// descending powers of s; complex numbers are <c>{re, im}</c>; infinities are the strings "inf"/"-inf".
/// </summary>
public static class DesignJsonReport
{
    /// <summary>Renders a proved design as indented JSON.</summary>
    public static string Render(DesignReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            Write(w, report);
        }

        return Encoding.UTF8.GetString(stream.ToArray());
    }

    private static void Write(Utf8JsonWriter w, DesignReport report)
    {
        var design = report.Design;
        var target = design.Target;
        var proof = report.Proof;
        var c = design.Compensator;
        w.WriteStartObject();

        w.WriteStartObject("loop");
        w.WriteString("plant", design.Loop.Plant.ToString());
        w.WriteString("feedback", design.Loop.Feedback.ToString());
        w.WriteString("sign", design.Loop.Sign == Model.FeedbackSign.Negative ? "negative" : "positive");
        Number(w, "delay", design.Loop.Delay);
        w.WriteEndObject();

        w.WriteStartObject("target");
        Number(w, "re", target.Point.Real);
        Number(w, "im", target.Point.Imaginary);
        Number(w, "sigma", target.Sigma);
        Number(w, "omegaD", target.DampedFrequency);
        Number(w, "zeta", target.Zeta);
        Number(w, "wn", target.NaturalFrequency);
        w.WriteString("source", report.Selection.Source);
        w.WriteBoolean("insideRegion", report.Selection.InsideRegion);
        w.WriteStartArray("region");
        foreach (var rc in report.Selection.Constraints)
        {
            w.WriteStartObject();
            w.WriteString("name", rc.Name);
            w.WriteString("description", rc.Description);
            Number(w, "required", rc.Required);
            Number(w, "actual", rc.Actual);
            Number(w, "margin", rc.Margin);
            w.WriteBoolean("satisfied", rc.Satisfied);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        var p = target.Predict();
        w.WriteStartObject("prediction");
        Number(w, "overshootPercent", p.OvershootPercent);
        Number(w, "peakTime", p.PeakTime);
        Number(w, "settlingTime2", p.SettlingTime2Percent);
        Number(w, "settlingTime5", p.SettlingTime5Percent);
        Number(w, "riseTime0To100", p.RiseTimeZeroToHundred);
        w.WriteEndObject();
        w.WriteEndObject();

        w.WriteStartObject("compensator");
        w.WriteString("type", KindName(c.Kind));
        if (design.Placement is { } placement)
        {
            w.WriteString("placement", PlacementNames.NameOf(placement));
        }
        Number(w, "gain", c.Gain);
        w.WriteString("gainForm", "factored: C(s) = gain · Π(s − zeros) / Π(s − poles)");
        w.WriteStartObject("gains");
        Number(w, "factored", c.Gain);
        Number(w, "dc", c.DcGain);
        Number(w, "highFrequency", c.HighFrequencyGain);
        w.WriteEndObject();
        JsonNumbers.WriteComplexArray(w, "zeros", c.TransferFunction.Zeros);
        JsonNumbers.WriteComplexArray(w, "poles", c.TransferFunction.Poles);
        JsonNumbers.WriteArray(w, "numerator", c.TransferFunction.Numerator.ToDescending());
        JsonNumbers.WriteArray(w, "denominator", c.TransferFunction.Denominator.ToDescending());
        w.WriteString("expression", c.TransferFunction.ToString());
        Number(w, "angleDeficiencyDeg", design.AngleDeficiencyDegrees);
        w.WriteStartArray("stages");
        foreach (var st in c.Stages)
        {
            w.WriteStartObject();
            w.WriteString("kind", KindName(st.Kind));
            JsonNumbers.WriteComplexArray(w, "zeros", st.Zero is { } z ? [new Complex(z, 0)] : []);
            JsonNumbers.WriteComplexArray(w, "poles", st.Pole is { } stagePole ? [new Complex(stagePole, 0)] : []);
            Number(w, "angleDeg", st.AngleAtTargetDegrees);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteStartArray("notes");
        foreach (var n in design.Notes)
        {
            w.WriteStringValue(n);
        }

        w.WriteEndArray();

        if (c.Pid is { } pid)
        {
            w.WriteStartObject("pid");
            w.WriteStartObject("parallel");
            w.WriteString("form", "Kp + Ki/s + Kd*s/(Tf*s + 1)");
            Number(w, "kp", pid.Kp);
            Number(w, "ki", pid.Ki);
            Number(w, "kd", pid.Kd);
            Number(w, "tf", pid.Tf);
            w.WriteEndObject();
            w.WriteStartObject("standard");
            w.WriteString("form", "Kc*(1 + 1/(Ti*s) + Td*s/(1 + Td*s/N))");
            Number(w, "kc", pid.Kc);
            Number(w, "ti", pid.Ti);
            Number(w, "td", pid.Td);
            Number(w, "n", pid.N);
            w.WriteEndObject();
            if (pid.SeriesKc is { } sk)
            {
                w.WriteStartObject("series");
                w.WriteString("form", "Kc*(1 + 1/(Ti*s))*(1 + Td*s)");
                Number(w, "kc", sk);
                Number(w, "ti", pid.SeriesTi!.Value);
                Number(w, "td", pid.SeriesTd!.Value);
                w.WriteEndObject();
            }
            else
            {
                w.WriteNull("series");
            }

            w.WriteEndObject();
        }

        w.WriteEndObject();

        var constants = report.Check.ErrorConstants;
        w.WriteStartObject("errorConstants");
        w.WriteNumber("type", constants.SystemType);
        Number(w, "kp", constants.Kp);
        Number(w, "kv", constants.Kv);
        Number(w, "ka", constants.Ka);
        if (design.SteadyState is { } steady)
        {
            w.WriteString("required", steady.Requirement.ToString());
            Number(w, "before", steady.Before);
            Number(w, "after", steady.After);
            w.WriteBoolean("met", steady.Met);
        }

        w.WriteEndObject();

        if (design.RequestedTarget is { } requested)
        {
            w.WriteStartObject("requestedTarget");
            Number(w, "re", requested.Point.Real);
            Number(w, "im", requested.Point.Imaginary);
            w.WriteEndObject();
        }

        w.WriteStartObject("closedLoop");
        JsonNumbers.WriteArray(w, "characteristic", proof.CharacteristicDescending);
        w.WriteStartArray("poles");
        foreach (var r in proof.Roots)
        {
            w.WriteStartObject();
            Number(w, "re", r.Value.Real);
            Number(w, "im", r.Value.Imaginary);
            Number(w, "zeta", r.Zeta);
            Number(w, "wn", r.NaturalFrequency);
            w.WriteString("role", r.Role switch { RootRole.Dominant => "dominant", RootRole.Cancelled => "cancelled", _ => "other" });
            w.WriteEndObject();
        }

        w.WriteEndArray();
        JsonNumbers.WriteComplexArray(w, "zeros", proof.ClosedLoopZeros);
        w.WriteBoolean("targetConfirmed", proof.TargetConfirmed);
        Number(w, "targetResidual", proof.UsesPade ? proof.TargetResidualExactDelay : proof.TargetResidual);
        Number(w, "targetRootDistance", proof.TargetRootDistance);
        Number(w, "maxRootResidual", proof.RootEvidence.MaxRelativeResidual);
        Number(w, "dominanceRatio", proof.DominanceRatio);
        w.WriteBoolean("stable", proof.Stable);
        w.WriteBoolean("usesPade", proof.UsesPade);
        w.WriteStartArray("warnings");
        foreach (var warning in proof.Warnings)
        {
            w.WriteStringValue(warning);
        }

        w.WriteEndArray();
        w.WriteEndObject();

        CheckJsonSection.Write(w, report.Check, report.Robustness);
        PrefilterSection.Write(w, report);
        CheckJsonSection.WriteVerdict(w, report.Verdict);
        if (report.Search is { } search)
        {
            SearchSection.Write(w, search);
        }

        KindComparisonSection.Write(w, report.KindsCompared);
        w.WriteStartObject("locus");
        LocusReport.WriteFeatures(w, report.Locus);
        w.WriteEndObject();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
    }

    private static void Number(Utf8JsonWriter w, string name, double x) => JsonNumbers.Write(w, name, x);

    /// <summary>The command-line name of a compensator kind.</summary>
    public static string KindName(CompensatorKind kind) => CompensatorKindNames.NameOf(kind);
}
