using CompAssist.Core.Model;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Workflow;

/// <summary>Everything a design run needs, as the user gave it (expressions as text).</summary>
public sealed record DesignInput
{
    /// <summary>Plant G(s) expression.</summary>
    public required string Plant { get; init; }

    /// <summary>Feedback H(s) expression.</summary>
    public string Feedback { get; init; } = "1";

    /// <summary>Feedback sign.</summary>
    public FeedbackSign Sign { get; init; } = FeedbackSign.Negative;

    /// <summary>Padé order for delays in root finding.</summary>
    public int PadeOrder { get; init; } = 3;

    /// <summary>Requirements or an explicit target.</summary>
    public Requirements Requirements { get; init; } = new();

    /// <summary>Compensator family name ("lead").</summary>
    public string CompensatorType { get; init; } = "lead";

    /// <summary>Lead choices.</summary>
    public LeadOptions Lead { get; init; } = new();
}
