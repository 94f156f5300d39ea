using System.Collections.Immutable;
using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Search;

/// <summary>The one name table of <see cref="SearchPins"/>: a machine name and the setting it keeps, for reports.</summary>
public static class SearchPinNames
{
    private static readonly ImmutableArray<(SearchPins Pin, string Name, string Setting)> Table =
    [
        (SearchPins.Placement, "placement", "the lead placement"),
        (SearchPins.Ratio, "ratio", "the lead pole/zero ratio"),
        (SearchPins.StageAngle, "stage-angle", "the largest angle per lead stage"),
        (SearchPins.ZeroFraction, "zero-fraction", "the slow zero's fraction of σ"),
        (SearchPins.LagMargin, "lag-margin", "the lag ratio's safety factor"),
        (SearchPins.FilterRatio, "filter-ratio", "the derivative filter ratio"),
    ];

    /// <summary>
    /// The free choices a kind has at all: what the search varies for it, and what a stated choice outside
    /// them is (unused by that kind).
    /// </summary>
    public static SearchPins ChoicesOf(CompensatorKind kind) => kind switch
    {
        CompensatorKind.Lead => SearchPins.Placement | SearchPins.Ratio | SearchPins.StageAngle,
        CompensatorKind.LeadLag => SearchPins.Placement | SearchPins.Ratio | SearchPins.StageAngle | SearchPins.ZeroFraction | SearchPins.LagMargin,
        CompensatorKind.Lag => SearchPins.ZeroFraction | SearchPins.LagMargin,
        CompensatorKind.PI => SearchPins.ZeroFraction | SearchPins.Placement,
        CompensatorKind.PD => SearchPins.FilterRatio,
        CompensatorKind.PID => SearchPins.ZeroFraction | SearchPins.FilterRatio,
        _ => SearchPins.None,
    };

    /// <summary>The machine names of the pins set in <paramref name="pins"/>, in table order.</summary>
    public static ImmutableArray<string> Names(SearchPins pins) => [.. Table.Where(t => pins.HasFlag(t.Pin)).Select(t => t.Name)];

    /// <summary>The settings kept, for people ("the lead placement, the derivative filter ratio").</summary>
    public static string Settings(SearchPins pins) => string.Join(", ", Table.Where(t => pins.HasFlag(t.Pin)).Select(t => t.Setting));
}
