using System.Globalization;
using System.Text;

namespace CompAssist.Core.Common;

/// <summary>
/// Free text from a file (a case's name or description) made safe to print: every control character is
/// written as a visible \u escape, so an escape sequence in a case file cannot drive the terminal or a report.
/// </summary>
public static class PrintableText
{
    /// <summary>The text with control characters (C0, DEL, C1) as \uXXXX.</summary>
    public static string Of(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!text.Any(char.IsControl))
        {
            return text;
        }

        var sb = new StringBuilder(text.Length + 8);
        foreach (var c in text)
        {
            if (char.IsControl(c))
            {
                sb.Append(CultureInfo.InvariantCulture, $"\\u{(int)c:X4}");
            }
            else
            {
                sb.Append(c);
            }
        }

        return sb.ToString();
    }
}
