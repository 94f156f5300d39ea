using System.CommandLine;

namespace CompAssist.Cli.Commands;

/// <summary>The options of <c>compassist design</c>: the shared loop options plus the compensator choice.</summary>
internal sealed class DesignSettings
{
    public LoopSettings Loop { get; } = new();

    public Option<string?> Type { get; } = new("--type") { Description = "Compensator type: lead, lag, lead-lag, pd, pi, pid." };

    public RealOption ZeroFraction { get; } = new("--zero-fraction") { Description = "Lag/PI zero at this fraction of the target's real part (default 0.1)." };

    public RealOption AngleBudget { get; } = new("--angle-budget") { Description = "Largest angle in degrees the lag/PI may cost at the target (default 5)." };

    public RealOption Margin { get; } = new("--lag-margin") { Description = "Safety factor on the lag ratio (default 1.1)." };

    public RealOption FilterRatio { get; } = new("--filter-ratio") { Description = "PD/PID derivative filter pole at this multiple of the PD zero (default: ideal derivative)." };

    public Option<string?> Placement { get; } = new("--placement") { Description = "Lead placement: beneath, bisector, cancel, fixed-zero, fixed-pole, ratio; a PI takes cancel (its zero on the slowest stable plant pole, or on --zero)." };

    public RealOption Zero { get; } = new("--zero") { Description = "Zero location for fixed-zero; the plant pole to cancel for cancel." };

    public RealOption Pole { get; } = new("--pole") { Description = "Pole location for fixed-pole." };

    public RealOption Ratio { get; } = new("--ratio") { Description = "Pole/zero ratio (> 1) for the ratio placement." };

    public RealOption MaxStageAngle { get; } = new("--max-stage-angle") { Description = "Largest lead angle per stage in degrees (default 60)." };

    public Option<bool> Prefilter { get; } = new("--prefilter") { Description = "Add a reference prefilter F(s) that cancels the compensator's closed-loop zeros near the target (F(0)·T(0) = 1); the loop itself is unchanged." };

    public Option<bool> EqualFactor { get; } = new("--equal-factor") { Description = "Lead-lag: fix the gain from the error constant first and use one ratio for lead and lag." };

    public Option<string?> Kinds { get; } = new("--kinds") { Description = "Search several compensator types and keep the best, e.g. lead,lead-lag,pid (choices that do not apply to a type are reported as unused by it)." };

    public Option<bool> Corner { get; } = new("--corner") { Description = "Design at the corner of the region (no search): the least aggressive target the second-order figures allow." };

    public Option<string?> Objective { get; } = new("--objective") { Description = "What the search minimizes among the designs that meet: " + string.Join(", ", Core.Search.SearchObjectiveNames.All) + " (default least-hf-gain)." };

    public PathOption Save { get; } = new("--save") { Description = "Also save the case as used (flags included) to this TOML file, atomically." };

    /// <summary>
    /// The design the flags ask for: the search over the region (the default when the requirements span one),
    /// or the corner design with <c>--corner</c>, an explicit target or ζ/ωn pair.
    /// </summary>
    public Core.Workflow.DesignRun Run(ParseResult parse, Core.Cases.CaseFile input)
    {
        var atCorner = parse.GetValue(Corner) || !Core.Workflow.DesignWorkflow.Searches(input);
        var objective = parse.GetValue(Objective) is { } name ? Core.Search.SearchObjectiveNames.TryParse(name)!.Value : Core.Search.SearchObjective.HighFrequencyGain;
        var options = new Core.Search.SearchOptions { Objective = objective, Pinned = Pinned(parse) };
        if (parse.GetValue(Kinds) is { } kinds)
        {
            return Core.Workflow.DesignWorkflow.SearchKinds(input, ParseKinds(kinds)!, options, atCorner);
        }

        return atCorner ? Core.Workflow.DesignWorkflow.Run(input) : Core.Workflow.DesignWorkflow.Search(input, options);
    }

    /// <summary>The kinds of a comma-separated list ("lead,pid"), or null when a name is not a kind.</summary>
    public static IReadOnlyList<Core.Synthesis.CompensatorKind>? ParseKinds(string text)
    {
        var kinds = new List<Core.Synthesis.CompensatorKind>();
        foreach (var name in text.Split(',', StringSplitOptions.TrimEntries))
        {
            if (Core.Synthesis.CompensatorKindNames.TryParse(name) is not { } kind)
            {
                return null;
            }

            kinds.Add(kind);
        }

        return kinds.Count > 0 ? kinds : null;
    }

    /// <summary>
    /// The flags given that the one compensator kind asked for has no use for (a flag that applies to none of
    /// the chosen kinds is refused, never silently ignored), with the reason; null when every flag applies.
    /// </summary>
    public string? StrayFlags(ParseResult parse, Core.Synthesis.CompensatorKind kind, Core.Synthesis.LeadPlacement placement)
    {
        var choices = Core.Search.SearchPinNames.ChoicesOf(kind);
        var pi = kind == Core.Synthesis.CompensatorKind.PI;
        var stray = new List<string>();
        foreach (var (option, pin) in PinnedOptions())
        {
            var given = parse.GetResult(option) is { Implicit: false };
            var applies = (pin & ~choices) == Core.Search.SearchPins.None
                && !(pi && (option == Pole || option == Ratio || option == MaxStageAngle))
                && !(pi && option == Placement && placement != Core.Synthesis.LeadPlacement.Cancel)
                && !(pi && option == Zero && placement != Core.Synthesis.LeadPlacement.Cancel);
            if (given && !applies)
            {
                stray.Add(option.Name);
            }
        }

        // A lead's placement uses only its own value: --zero (fixed-zero, cancel), --pole (fixed-pole), --ratio (ratio).
        var lead = kind is Core.Synthesis.CompensatorKind.Lead or Core.Synthesis.CompensatorKind.LeadLag;
        if (lead)
        {
            foreach (var (option, used) in new (Option Option, bool Used)[]
            {
                (Zero, placement is Core.Synthesis.LeadPlacement.FixedZero or Core.Synthesis.LeadPlacement.Cancel),
                (Pole, placement == Core.Synthesis.LeadPlacement.FixedPole),
                (Ratio, placement == Core.Synthesis.LeadPlacement.Ratio),
            })
            {
                if (parse.GetResult(option) is { Implicit: false } && !used && !stray.Contains(option.Name))
                {
                    stray.Add($"{option.Name} (the {Core.Synthesis.PlacementNames.NameOf(placement)} placement has no use for it)");
                }
            }
        }

        var slowZero = kind is Core.Synthesis.CompensatorKind.Lag or Core.Synthesis.CompensatorKind.LeadLag or Core.Synthesis.CompensatorKind.PI or Core.Synthesis.CompensatorKind.PID;
        if (parse.GetResult(AngleBudget) is { Implicit: false } && !slowZero)
        {
            stray.Add(AngleBudget.Name);
        }

        if (parse.GetValue(EqualFactor) && kind != Core.Synthesis.CompensatorKind.LeadLag)
        {
            stray.Add(EqualFactor.Name);
        }

        if (stray.Count == 0)
        {
            return null;
        }

        var name = Core.Synthesis.CompensatorKindNames.NameOf(kind);
        var uses = pi
            ? "the slow zero's fraction of σ, and the placement cancel: its zero on a stable plant pole, --zero to name it"
            : Core.Search.SearchPinNames.Settings(choices);
        return $"error: {string.Join(", ", stray)} {(stray.Count == 1 ? "does" : "do")} not apply to a {name} design (its choices: {(uses.Length == 0 ? "none" : uses)}).\nhint: remove {(stray.Count == 1 ? "it" : "them")}, or choose a --type that uses {(stray.Count == 1 ? "it" : "them")} (--kinds compares several types and reports what each leaves unused).";
    }

    /// <summary>The free choices given on the command line: the search keeps them as given.</summary>
    private Core.Search.SearchPins Pinned(ParseResult parse)
    {
        var pins = Core.Search.SearchPins.None;
        void Pin(Option option, Core.Search.SearchPins pin)
        {
            if (parse.GetResult(option) is { Implicit: false })
            {
                pins |= pin;
            }
        }

        foreach (var (option, pin) in PinnedOptions())
        {
            Pin(option, pin);
        }

        return pins;
    }

    private IEnumerable<(Option Option, Core.Search.SearchPins Pin)> PinnedOptions() =>
    [
        (Placement, Core.Search.SearchPins.Placement),
        (Zero, Core.Search.SearchPins.Placement),
        (Pole, Core.Search.SearchPins.Placement),
        (Ratio, Core.Search.SearchPins.Placement | Core.Search.SearchPins.Ratio),
        (MaxStageAngle, Core.Search.SearchPins.StageAngle),
        (ZeroFraction, Core.Search.SearchPins.ZeroFraction),
        (Margin, Core.Search.SearchPins.LagMargin),
        (FilterRatio, Core.Search.SearchPins.FilterRatio),
    ];

    public void AddTo(Command command)
    {
        Loop.AddTo(command);
        foreach (var option in new Option[] { Type, Kinds, Placement, Zero, Pole, Ratio, MaxStageAngle, ZeroFraction, AngleBudget, Margin, FilterRatio, EqualFactor, Prefilter, Corner, Objective, Save })
        {
            command.Options.Add(option);
        }
    }
}
