using System.Collections.Immutable;

namespace CompAssist.Core.Synthesis;

/// <summary>The one name table of <see cref="CompensatorKind"/>: parse, print, help and completion all use it.</summary>
public static class CompensatorKindNames
{
    private static readonly ImmutableArray<(CompensatorKind Kind, string Name)> Table =
    [
        (CompensatorKind.Lead, "lead"),
        (CompensatorKind.Lag, "lag"),
        (CompensatorKind.LeadLag, "lead-lag"),
        (CompensatorKind.PD, "pd"),
        (CompensatorKind.PI, "pi"),
        (CompensatorKind.PID, "pid"),
    ];

    /// <summary>Every name, in table order.</summary>
    public static ImmutableArray<string> All { get; } = [.. Table.Select(t => t.Name)];

    /// <summary>The kind of a name (case-insensitive), or null.</summary>
    public static CompensatorKind? TryParse(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        foreach (var (kind, text) in Table)
        {
            if (string.Equals(text, name.Trim(), StringComparison.OrdinalIgnoreCase))
            {
                return kind;
            }
        }

        return null;
    }

    /// <summary>The name of a kind.</summary>
    public static string NameOf(CompensatorKind kind)
    {
        foreach (var (k, text) in Table)
        {
            if (k == kind)
            {
                return text;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(kind), kind, "Not a compensator kind.");
    }
}
