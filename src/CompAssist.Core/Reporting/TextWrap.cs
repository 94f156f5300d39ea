using System.Text;

namespace CompAssist.Core.Reporting;

/// <summary>Word wrapping for reports that must fit a terminal.</summary>
public static class TextWrap
{
    /// <summary>Wraps text at word boundaries; the first line gets <paramref name="first"/>, the rest <paramref name="rest"/>.</summary>
    public static IEnumerable<string> Lines(string text, int width, string first = "", string rest = "")
    {
        ArgumentNullException.ThrowIfNull(text);
        var line = new StringBuilder();
        var prefix = first;
        foreach (var word in text.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            if (line.Length > 0 && prefix.Length + line.Length + 1 + word.Length > width)
            {
                yield return prefix + line;
                line.Clear();
                prefix = rest;
            }

            if (line.Length > 0)
            {
                line.Append(' ');
            }

            line.Append(word);
        }

        if (line.Length > 0)
        {
            yield return prefix + line;
        }
    }

    /// <summary>Appends the wrapped lines of <paramref name="text"/> to a report (79 columns).</summary>
    public static void AppendTo(StringBuilder sb, string text, string first = "  ", string rest = "    ", int width = 79)
    {
        ArgumentNullException.ThrowIfNull(sb);
        foreach (var line in Lines(text, width, first, rest))
        {
            sb.AppendLine(line);
        }
    }
}
