using System.CommandLine;

namespace CompAssist.Cli.Commands;

/// <summary>The options of <c>compassist design</c>: the shared loop options plus the compensator choice.</summary>
internal sealed class DesignSettings
{
    public LoopSettings Loop { get; } = new();

    public Option<string?> Type { get; } = new("--type") { Description = "Compensator type: lead." };

    public Option<string?> Placement { get; } = new("--placement") { Description = "Lead placement: beneath, bisector, cancel, fixed-zero, fixed-pole, ratio." };

    public Option<double?> Zero { get; } = new("--zero") { Description = "Zero location for fixed-zero; the plant pole to cancel for cancel." };

    public Option<double?> Pole { get; } = new("--pole") { Description = "Pole location for fixed-pole." };

    public Option<double?> Ratio { get; } = new("--ratio") { Description = "Pole/zero ratio (> 1) for the ratio placement." };

    public Option<double?> MaxStageAngle { get; } = new("--max-stage-angle") { Description = "Largest lead angle per stage in degrees (default 60)." };

    public void AddTo(Command command)
    {
        Loop.AddTo(command);
        foreach (var option in new Option[] { Type, Placement, Zero, Pole, Ratio, MaxStageAngle })
        {
            command.Options.Add(option);
        }
    }
}
