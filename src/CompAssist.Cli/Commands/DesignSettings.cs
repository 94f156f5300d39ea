using System.CommandLine;
using System.Globalization;
using System.Numerics;

namespace CompAssist.Cli.Commands;

/// <summary>The options and argument of <c>compassist design</c>.</summary>
internal sealed class DesignSettings
{
    public Argument<string?> Case { get; } = new("case") { Description = "Case file (TOML) to start from; flags override it.", Arity = ArgumentArity.ZeroOrOne };

    public Option<string?> Plant { get; } = new("--plant") { Description = "Plant G(s), e.g. \"10/(s(s+2)(s+10))\"." };

    public Option<string?> Feedback { get; } = new("--feedback") { Description = "Feedback path H(s) (default 1)." };

    public Option<bool> PositiveFeedback { get; } = new("--positive-feedback") { Description = "Positive feedback (0° angle condition)." };

    public Option<string?> Target { get; } = new("--target") { Description = "Target pole RE,IM, e.g. -2,3.46." };

    public Option<double?> Zeta { get; } = new("--zeta") { Description = "Damping ratio ζ of the target (with --wn)." };

    public Option<double?> Wn { get; } = new("--wn") { Description = "Natural frequency ωn of the target, rad/s (with --zeta)." };

    public Option<double?> Overshoot { get; } = new("--overshoot") { Description = "Largest percent overshoot." };

    public Option<double?> Settling { get; } = new("--settling") { Description = "Largest settling time, s." };

    public Option<int?> Band { get; } = new("--band") { Description = "Settling band in percent: 2 (default) or 5." };

    public Option<double?> PeakTime { get; } = new("--peak-time") { Description = "Largest peak time, s." };

    public Option<string?> Type { get; } = new("--type") { Description = "Compensator type: lead." };

    public Option<string?> Placement { get; } = new("--placement") { Description = "Lead placement: beneath, bisector, cancel, fixed-zero, fixed-pole, ratio." };

    public Option<double?> Zero { get; } = new("--zero") { Description = "Zero location for fixed-zero; the plant pole to cancel for cancel." };

    public Option<double?> Pole { get; } = new("--pole") { Description = "Pole location for fixed-pole." };

    public Option<double?> Ratio { get; } = new("--ratio") { Description = "Pole/zero ratio (> 1) for the ratio placement." };

    public Option<double?> MaxStageAngle { get; } = new("--max-stage-angle") { Description = "Largest lead angle per stage in degrees (default 60)." };

    public Option<int?> PadeOrder { get; } = new("--pade-order") { Description = "Padé order for delays in root finding (default 3)." };

    public Option<bool> Json { get; } = new("--json") { Description = "Machine-readable JSON on stdout." };

    public IEnumerable<Option> Options =>
    [
        Plant, Feedback, PositiveFeedback, Target, Zeta, Wn, Overshoot, Settling, Band, PeakTime,
        Type, Placement, Zero, Pole, Ratio, MaxStageAngle, PadeOrder, Json,
    ];

    /// <summary>Parses "RE,IM" (also "RE, IM" or "RE IM").</summary>
    public static Complex? ParsePoint(string text)
    {
        var parts = text.Split([',', ' ', ';'], StringSplitOptions.RemoveEmptyEntries);
        if (parts.Length != 2)
        {
            return null;
        }

        if (double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out var re)
            && double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var im)
            && double.IsFinite(re) && double.IsFinite(im))
        {
            return new Complex(re, im);
        }

        return null;
    }
}
