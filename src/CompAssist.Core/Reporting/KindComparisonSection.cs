using System.Collections.Immutable;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Model;
using CompAssist.Core.Search;

namespace CompAssist.Core.Reporting;

/// <summary>The comparison of several searched compensator kinds, in text and JSON.</summary>
public static class KindComparisonSection
{
    /// <summary>
    /// Appends "Kinds compared" with each kind's best, the chosen one marked; <paramref name="objective"/> is
    /// null when each kind was designed at one target (the corner or a given point) rather than searched.
    /// </summary>
    public static void Append(StringBuilder sb, ImmutableArray<KindResult> rows, string chosen, SearchObjective? objective)
    {
        ArgumentNullException.ThrowIfNull(sb);
        ArgumentNullException.ThrowIfNull(chosen);
        if (rows.IsDefaultOrEmpty)
        {
            return;
        }

        sb.AppendLine(objective is null
            ? "Kinds compared (each designed at the same target; a kind that meets every requirement is kept first)"
            : "Kinds compared (each searched in full; the best of each, by the same objective)");
        foreach (var row in rows)
        {
            var mark = row.Kind == chosen ? " (chosen)" : string.Empty;
            var state = row.Refusal is { } why
                ? $"refused: {why}"
                : (row.Meets ? "meets" : double.IsFinite(row.Violation) ? $"misses (shortfall {TransferFunctionFormatter.Number(row.Violation, 4)})" : "fails a requirement")
                  + (objective is { } o && double.IsFinite(row.Objective) ? $", {SearchSection.ObjectiveText(o, row.Objective)}" : string.Empty);
            var unused = row.UnusedChoices.Length > 0 ? $"; not used by this kind: {row.UnusedChoices}" : string.Empty;
            TextWrap.AppendTo(sb, $"{row.Kind}{mark}: {state}{unused}", "  ", "    ");
        }

        sb.AppendLine();
    }

    /// <summary>Writes <c>"kindsCompared": [...]</c> (nothing when a single kind was designed).</summary>
    public static void Write(Utf8JsonWriter w, ImmutableArray<KindResult> rows)
    {
        ArgumentNullException.ThrowIfNull(w);
        if (rows.IsDefaultOrEmpty)
        {
            return;
        }

        w.WriteStartArray("kindsCompared");
        foreach (var row in rows)
        {
            w.WriteStartObject();
            w.WriteString("kind", row.Kind);
            w.WriteBoolean("meets", row.Meets);
            JsonNumbers.Write(w, "objective", row.Objective);
            JsonNumbers.Write(w, "violation", row.Violation);
            if (row.Refusal is { } why)
            {
                w.WriteString("refused", why);
            }

            w.WriteString("unusedChoices", row.UnusedChoices);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }
}
