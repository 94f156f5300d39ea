namespace CompAssist.Core.Synthesis;

/// <summary>The command-line and case-file names of <see cref="LeadPlacement"/> values.</summary>
public static class PlacementNames
{
    private static readonly (string Name, LeadPlacement Value)[] Table =
    [
        ("beneath", LeadPlacement.Beneath),
        ("bisector", LeadPlacement.Bisector),
        ("cancel", LeadPlacement.Cancel),
        ("fixed-zero", LeadPlacement.FixedZero),
        ("fixed-pole", LeadPlacement.FixedPole),
        ("ratio", LeadPlacement.Ratio),
    ];

    /// <summary>Every name, in documentation order.</summary>
    public static IReadOnlyList<string> All { get; } = Table.Select(t => t.Name).ToArray();

    /// <summary>The placement with this name, or null.</summary>
    public static LeadPlacement? TryParse(string name)
    {
        foreach (var (n, v) in Table)
        {
            if (string.Equals(n, name, StringComparison.OrdinalIgnoreCase))
            {
                return v;
            }
        }

        return null;
    }

    /// <summary>The name of a placement.</summary>
    public static string NameOf(LeadPlacement placement) => Table.First(t => t.Value == placement).Name;
}
