namespace CompAssist.Core.Reporting;

/// <summary>The safety caution shown wherever a design leaves the tool.</summary>
public static class Cautions
{
    /// <summary>The caution as one paragraph.</summary>
    public const string Text =
        "The output is a design aid computed from a model. Real plants differ (gain, friction, backlash, " +
        "resonances, delays, saturation). The controller is not a safety function: independent protection — " +
        "a hard-wired emergency stop, limit switches, current limits, over-temperature cut-outs, watchdogs — " +
        "must exist and must not depend on this tool. First hardware tests run at reduced gain and limits, " +
        "with the feedback sign and units checked first. Designs for products or production equipment must be " +
        "reviewed by qualified engineers and meet the machine-safety and functional-safety standards that apply " +
        "where the equipment is used (for example the ISO 12100 / ISO 13849 / IEC 62061 / IEC 61508 families).";

    /// <summary>The caution wrapped to a width, each line prefixed.</summary>
    public static IEnumerable<string> Wrapped(int width, string prefix = "") => TextWrap.Lines(Text, width, prefix, prefix);

    /// <summary>Appends the caution under a heading, indented two spaces, 78 columns wide (the text reports).</summary>
    public static void AppendSection(System.Text.StringBuilder sb, string heading = "Caution")
    {
        ArgumentNullException.ThrowIfNull(sb);
        sb.AppendLine(heading);
        foreach (var line in Wrapped(78, "  "))
        {
            sb.AppendLine(line);
        }
    }
}
