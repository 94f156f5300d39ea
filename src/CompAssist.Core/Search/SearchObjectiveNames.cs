namespace CompAssist.Core.Search;

/// <summary>The one name table of <see cref="SearchObjective"/>: parsing, printing, help and completion.</summary>
public static class SearchObjectiveNames
{
    private static readonly (string Name, SearchObjective Value, string Meaning)[] Table =
    [
        ("least-hf-gain", SearchObjective.HighFrequencyGain, "least high-frequency gain of C (noise reaching the actuator)"),
        ("least-effort", SearchObjective.ActuatorPeak, "least actuator peak for the reference step"),
        ("least-sensitivity", SearchObjective.SensitivityPeak, "least sensitivity peak Ms (largest distance from −1)"),
        ("fastest-settling", SearchObjective.SettlingTime, "shortest settling time"),
    ];

    /// <summary>Every name, in documentation order.</summary>
    public static IReadOnlyList<string> All { get; } = Table.Select(t => t.Name).ToArray();

    /// <summary>The objective with this name, or null.</summary>
    public static SearchObjective? TryParse(string name) =>
        Table.Where(t => string.Equals(t.Name, name, StringComparison.OrdinalIgnoreCase)).Select(t => (SearchObjective?)t.Value).FirstOrDefault();

    /// <summary>The name of an objective.</summary>
    public static string NameOf(SearchObjective objective) => Table.First(t => t.Value == objective).Name;

    /// <summary>What an objective minimizes, in words.</summary>
    public static string Meaning(SearchObjective objective) => Table.First(t => t.Value == objective).Meaning;
}
