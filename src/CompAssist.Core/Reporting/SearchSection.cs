using System.Text;
using System.Text.Json;
using CompAssist.Core.Model;
using CompAssist.Core.Search;
using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Reporting;

/// <summary>The search's account in the design report: what was searched, the objective, the winner and the runners-up, and what binds when nothing meets.</summary>
public static class SearchSection
{
    /// <summary>The objective's figure as people read it, e.g. "|C(∞)| 1.26".</summary>
    public static string ObjectiveText(SearchObjective objective, double value) => objective switch
    {
        SearchObjective.ActuatorPeak => $"peak |u| {N(value)}",
        SearchObjective.SensitivityPeak => $"Ms {N(value)}",
        SearchObjective.SettlingTime => $"settling {N(value)} s",
        _ => $"|C(∞)| {N(value)}",
    };

    /// <summary>The free choices of a candidate in words, e.g. "ratio 10" or "zero at 0.06 σ".</summary>
    public static string ChoiceText(SearchCandidate c)
    {
        ArgumentNullException.ThrowIfNull(c);
        var kind = c.Design.Compensator.Kind;
        var parts = new List<string>();
        if (kind is CompensatorKind.Lead or CompensatorKind.LeadLag)
        {
            var lead = c.Choice.Lead;
            parts.Add(lead.Placement switch
            {
                LeadPlacement.Ratio => $"ratio {N(lead.Ratio ?? double.NaN)}",
                LeadPlacement.Cancel => $"cancel {N(lead.Zero ?? double.NaN)}",
                _ => PlacementNames.NameOf(lead.Placement),
            });
            parts.Add($"{c.Design.StageCount} stage{(c.Design.StageCount == 1 ? string.Empty : "s")}");
        }

        if (kind is CompensatorKind.Lag or CompensatorKind.LeadLag or CompensatorKind.PI or CompensatorKind.PID)
        {
            parts.Add($"slow zero at {N(c.Choice.Slow.ZeroFraction)} σ");
        }

        if (kind is CompensatorKind.PD or CompensatorKind.PID)
        {
            parts.Add(c.Choice.Slow.FilterRatio is { } n ? $"filter ratio {N(n)}" : "ideal derivative");
        }

        return string.Join(", ", parts);
    }

    /// <summary>Appends the search section.</summary>
    public static void Append(StringBuilder sb, SearchOutcome search)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(search);
        sb.AppendLine("Search (the target and the free choices were searched, not taken from the corner)");
        TextWrap.AppendTo(sb, $"{search.Evaluated} candidates, each synthesized by the angle and magnitude conditions and proved on the exact step: a grid over the region and 30 % beyond it, every placement and free choice at the best 20 targets, and a pattern search from the best 5{(search.RobustFinalists > 0 ? "; every candidate that met nominally was also judged at every variation corner" : string.Empty)}");
        if (search.Pinned != SearchPins.None)
        {
            TextWrap.AppendTo(sb, $"kept as given, not searched: {SearchPinNames.Settings(search.Pinned)}");
        }

        TextWrap.AppendTo(sb, $"objective: {SearchObjectiveNames.Meaning(search.Objective)}; a candidate meets when every requirement holds with a {N(search.RequirementMargin * 100)} % margin");
        TextWrap.AppendTo(sb, $"winner: {Line(search.Winner, search.Objective)}");
        if (search.RunnersUp.Length > 0)
        {
            sb.AppendLine("  runners-up:");
            foreach (var c in search.RunnersUp)
            {
                TextWrap.AppendTo(sb, Line(c, search.Objective), "    ", "      ");
            }
        }

        if (search.Limits.Length > 0)
        {
            sb.AppendLine("  nothing meets every requirement; what binds:");
            foreach (var note in search.Limits)
            {
                TextWrap.AppendTo(sb, "✗ " + note, "    ", "      ");
            }
        }

        sb.AppendLine();
    }

    /// <summary>Writes <c>"search": {...}</c>.</summary>
    public static void Write(Utf8JsonWriter w, SearchOutcome search)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(search);
        w.WriteStartObject("search");
        w.WriteNumber("evaluated", search.Evaluated);
        w.WriteString("objective", SearchObjectiveNames.NameOf(search.Objective));
        w.WriteNumber("requirementMargin", search.RequirementMargin);
        w.WriteBoolean("meets", search.Meets);
        w.WriteNumber("robustFinalists", search.RobustFinalists);
        w.WriteStartArray("keptAsGiven");
        foreach (var name in SearchPinNames.Names(search.Pinned))
        {
            w.WriteStringValue(name);
        }

        w.WriteEndArray();
        w.WriteStartObject("winner");
        Candidate(w, search.Winner);
        w.WriteEndObject();
        w.WriteStartArray("runnersUp");
        foreach (var c in search.RunnersUp)
        {
            w.WriteStartObject();
            Candidate(w, c);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteStartArray("limits");
        foreach (var note in search.Limits)
        {
            w.WriteStringValue(note);
        }

        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static void Candidate(Utf8JsonWriter w, SearchCandidate c)
    {
        JsonNumbers.Write(w, "re", c.Choice.Target.Point.Real);
        JsonNumbers.Write(w, "im", c.Choice.Target.Point.Imaginary);
        w.WriteString("choice", ChoiceText(c));
        JsonNumbers.Write(w, "objective", c.Objective);
        JsonNumbers.Write(w, "violation", c.Violation);
        w.WriteBoolean("meets", c.Meets);
        w.WriteBoolean("stable", c.Stable);
    }

    /// <summary>One candidate on one line: target, choices, objective, the required figures and whether it meets.</summary>
    public static string CandidateLine(SearchCandidate c, SearchObjective objective) => Line(c, objective);

    private static string Line(SearchCandidate c, SearchObjective objective)
    {
        var p = c.Choice.Target.Point;
        var figures = string.Join(", ", c.Checks.Where(r => r.Required is not null).Select(r => $"{Short(r.Name)} {N(r.Measured)}"));
        var state = c.Meets ? "meets" : c.Stable ? $"misses (shortfall {N(c.Violation)})" : "UNSTABLE";
        return $"s* = {N(p.Real)} ± {N(p.Imaginary)}j, {ChoiceText(c)}: {ObjectiveText(objective, c.Objective)}; {figures}; {state}";
    }

    private static string Short(string name)
    {
        var cut = name.IndexOf(" (", StringComparison.Ordinal);
        return cut > 0 ? name[..cut] : name;
    }

    private static string N(double x) => TransferFunctionFormatter.Number(x, 4);
}
