using System.Globalization;

namespace CompAssist.Core.Export;

/// <summary>What every C generator needs: identifier checks and exact numeric literals.</summary>
internal static class CLiterals
{
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
