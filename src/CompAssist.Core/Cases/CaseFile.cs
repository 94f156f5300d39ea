using System.Collections.Immutable;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Cases;

/// <summary>
/// A design case as stored on disk (TOML, see <see cref="CaseFileReader"/> for the schema): the loop as
/// typed expressions, the requirements and the compensator choice. Expressions stay text so that errors
/// can point into them.
/// </summary>
public sealed record CaseFile
{
    /// <summary>The case-file format version this program writes and reads.</summary>
    public const int CurrentFormat = 1;

    /// <summary>Short name of the scenario.</summary>
    public string Name { get; init; } = string.Empty;

    /// <summary>Free text describing the scenario.</summary>
    public string Description { get; init; } = string.Empty;

    /// <summary>Plant G(s) as an expression.</summary>
    public string? Plant { get; init; }

    /// <summary>Feedback H(s) as an expression; "1" when absent.</summary>
    public string Feedback { get; init; } = "1";

    /// <summary>Feedback sign.</summary>
    public FeedbackSign Sign { get; init; } = FeedbackSign.Negative;

    /// <summary>Padé order for delays in root finding.</summary>
    public int PadeOrder { get; init; } = 3;

    /// <summary>Requirements and/or an explicit target.</summary>
    public Requirements Requirements { get; init; } = new();

    /// <summary>Compensator family, as its command-line name (e.g. "lead").</summary>
    public string CompensatorType { get; init; } = "lead";

    /// <summary>Lead choices.</summary>
    public LeadOptions Lead { get; init; } = new();

    /// <summary>Lag, PI and PID choices: slow-zero fraction, angle budget, margin, derivative filter.</summary>
    public SlowPoleOptions Slow { get; init; } = new();

    /// <summary>True to add a reference prefilter (see <see cref="Proof.ReferencePrefilter"/>).</summary>
    public bool Prefilter { get; init; }

    /// <summary>Proof settings: reference step size, actuator limit, simulation length.</summary>
    public CheckOptions Check { get; init; } = new();

    /// <summary>Plant variations for the robustness sweep (none: no sweep).</summary>
    public ImmutableArray<PlantVariation> Variations { get; init; } = [];
}
