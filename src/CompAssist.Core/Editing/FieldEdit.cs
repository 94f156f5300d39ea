using System.Diagnostics.CodeAnalysis;
using CompAssist.Core.Cases;
using CompAssist.Core.Parsing;

namespace CompAssist.Core.Editing;

/// <summary>The result of editing one field: the case with the new value, or a positioned error in the text.</summary>
public sealed class FieldEdit
{
    private FieldEdit(CaseFile? next, ParseError? error)
    {
        Case = next;
        Error = error;
    }

    /// <summary>The edited case, when the text was accepted.</summary>
    public CaseFile? Case { get; }

    /// <summary>What is wrong with the text, when it was not.</summary>
    public ParseError? Error { get; }

    /// <summary>True when <see cref="Case"/> is set.</summary>
    [MemberNotNullWhen(true, nameof(Case))]
    [MemberNotNullWhen(false, nameof(Error))]
    public bool IsSuccess => Case is not null;

    /// <summary>An accepted edit.</summary>
    public static FieldEdit Accepted(CaseFile next) => new(next ?? throw new ArgumentNullException(nameof(next)), null);

    /// <summary>A rejected edit.</summary>
    public static FieldEdit Rejected(ParseError error) => new(null, error ?? throw new ArgumentNullException(nameof(error)));
}
