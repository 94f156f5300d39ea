using System.Diagnostics.CodeAnalysis;

namespace CompAssist.Core.Parsing;

/// <summary>Either a parsed value or a positioned error; never both.</summary>
/// <typeparam name="T">The parsed value's type.</typeparam>
public sealed class ParseResult<T>
    where T : class
{
    private ParseResult(T? value, ParseError? error)
    {
        Value = value;
        Error = error;
    }

    /// <summary>The value, when parsing succeeded.</summary>
    public T? Value { get; }

    /// <summary>The error, when parsing failed.</summary>
    public ParseError? Error { get; }

    /// <summary>True when <see cref="Value"/> is set.</summary>
    [MemberNotNullWhen(true, nameof(Value))]
    [MemberNotNullWhen(false, nameof(Error))]
    public bool IsSuccess => Value is not null;

    /// <summary>A success.</summary>
    public static ParseResult<T> Success(T value) => new(value ?? throw new ArgumentNullException(nameof(value)), null);

    /// <summary>A failure.</summary>
    public static ParseResult<T> Failure(ParseError error) => new(null, error ?? throw new ArgumentNullException(nameof(error)));
}
