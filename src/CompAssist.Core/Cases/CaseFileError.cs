namespace CompAssist.Core.Cases;

/// <summary>Why a case file could not be read, with its position when known.</summary>
/// <param name="Source">The file name or other source label.</param>
/// <param name="Message">What is wrong.</param>
/// <param name="Hint">What to change.</param>
/// <param name="Line">One-based line, when known.</param>
/// <param name="Column">One-based column, when known.</param>
public sealed record CaseFileError(string Source, string Message, string Hint, int? Line = null, int? Column = null)
{
    /// <summary>"file(line,col): message. hint".</summary>
    public override string ToString()
    {
        var where = Line is { } l ? $"{Source}({l},{Column ?? 1})" : Source;
        return $"{where}: {Message}. {Hint}";
    }
}
