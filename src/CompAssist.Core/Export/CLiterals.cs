using System.Globalization;

namespace CompAssist.Core.Export;

/// <summary>What every C generator needs: identifier checks and exact numeric literals.</summary>
internal static class CLiterals
{
    /// <summary>Text safe inside a C block comment: control characters become '?', and "*/" cannot close the comment (nor "/*" open one).</summary>
    public static string CommentText(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var sb = new System.Text.StringBuilder(text.Length);
        foreach (var c in text)
        {
            sb.Append(char.IsControl(c) ? '?' : c);
        }

        // "*/" would end the comment and let the rest of the text become code; "/*" inside one draws a warning.
        return sb.ToString().Replace("*/", "* /", StringComparison.Ordinal).Replace("/*", "/ *", StringComparison.Ordinal);
    }

    /// <summary>True for a C identifier (letters, digits and underscores, not starting with a digit).</summary>
    public static bool IsIdentifier(string name) =>
        name.Length > 0 && (char.IsAsciiLetter(name[0]) || name[0] == '_') && name.All(c => char.IsAsciiLetterOrDigit(c) || c == '_');

    /// <summary>A round-trip double literal that C reads as floating point.</summary>
    public static string Double(double x) => WithPoint(x.ToString("R", CultureInfo.InvariantCulture));

    /// <summary>A round-trip float value written as a floating-point literal (without the f suffix).</summary>
    public static string Single(float x) => WithPoint(x.ToString("R", CultureInfo.InvariantCulture));

    private static string WithPoint(string text) =>
        text.Contains('.') || text.Contains('E') || text.Contains('e') ? text : text + ".0";
}
