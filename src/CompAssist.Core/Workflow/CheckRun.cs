using CompAssist.Core.Common;

namespace CompAssist.Core.Workflow;

/// <summary>The result of a check run: a result, a field parse error, or a problem.</summary>
public sealed class CheckRun
{
    private CheckRun(CheckResult? result, FieldError? fieldError, Problem? problem)
    {
        Result = result;
        FieldError = fieldError;
        Problem = problem;
    }

    /// <summary>The proof, on success.</summary>
    public CheckResult? Result { get; }

    /// <summary>An input expression that could not be read.</summary>
    public FieldError? FieldError { get; }

    /// <summary>A request that cannot be met, with what to change.</summary>
    public Problem? Problem { get; }

    internal static CheckRun Success(CheckResult result) => new(result, null, null);

    internal static CheckRun Failed(FieldError error) => new(null, error, null);

    internal static CheckRun Failed(Problem problem) => new(null, null, problem);
}
