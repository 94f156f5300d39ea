using System.Diagnostics.CodeAnalysis;

namespace CompAssist.Core.Common;

/// <summary>Either a value or a <see cref="Problem"/> explaining why there is none.</summary>
/// <typeparam name="T">The value's type.</typeparam>
public sealed class Outcome<T>
    where T : class
{
    private Outcome(T? value, Problem? problem)
    {
        Value = value;
        Problem = problem;
    }

    /// <summary>The value, when the request could be met.</summary>
    public T? Value { get; }

    /// <summary>The reason, when it could not.</summary>
    public Problem? Problem { get; }

    /// <summary>True when <see cref="Value"/> is set.</summary>
    [MemberNotNullWhen(true, nameof(Value))]
    [MemberNotNullWhen(false, nameof(Problem))]
    public bool IsSuccess => Value is not null;

    /// <summary>A success.</summary>
    public static Outcome<T> Success(T value) => new(value ?? throw new ArgumentNullException(nameof(value)), null);

    /// <summary>A refusal with its reason.</summary>
    public static Outcome<T> Refused(string message, string hint, Setting? about = null) => new(null, new Problem(message, hint, about));

    /// <summary>A refusal with its reason.</summary>
    public static Outcome<T> Refused(Problem problem) => new(null, problem ?? throw new ArgumentNullException(nameof(problem)));
}
