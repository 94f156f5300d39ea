namespace CompAssist.Core.Parsing;

/// <summary>
/// A positioned problem in user input: what is wrong, where (a zero-based index and a length into the
/// input) and what would fix it. Both front ends render it with a caret under the span.
/// </summary>
/// <param name="Message">What is wrong, in one sentence.</param>
/// <param name="Hint">What would fix it.</param>
/// <param name="Input">The whole input as typed.</param>
/// <param name="Index">Zero-based index of the first offending character (may equal the input length).</param>
/// <param name="Length">Number of offending characters (at least 1 for the caret).</param>
public sealed record ParseError(string Message, string Hint, string Input, int Index, int Length)
{
    /// <summary>One-based column of the span start, as shown to people.</summary>
    public int Column => Index + 1;

    /// <summary>
    /// Three lines: the input, carets under the offending span, and "message (column N). hint".
    /// </summary>
    public string Render(string indent = "  ")
    {
        var caretStart = Math.Clamp(Index, 0, Input.Length);
        var caretLength = Math.Max(1, Length);
        return $"{indent}{Input}\n{indent}{new string(' ', caretStart)}{new string('^', caretLength)}\n{Message} (column {Column}). {Hint}";
    }
}
