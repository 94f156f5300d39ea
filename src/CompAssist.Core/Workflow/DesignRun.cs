using CompAssist.Core.Common;

namespace CompAssist.Core.Workflow;

/// <summary>The result of a design run: a report, a field parse error, or a problem with the request.</summary>
public sealed class DesignRun
{
    private DesignRun(DesignReport? report, FieldError? fieldError, Problem? problem)
    {
        Report = report;
        FieldError = fieldError;
        Problem = problem;
    }

    /// <summary>The proved design, on success.</summary>
    public DesignReport? Report { get; }

    /// <summary>An input expression that could not be read.</summary>
    public FieldError? FieldError { get; }

    /// <summary>A request that cannot be met (or a numerical failure), with what to change.</summary>
    public Problem? Problem { get; }

    /// <summary>True when <see cref="Report"/> is set.</summary>
    public bool IsSuccess => Report is not null;

    internal static DesignRun Success(DesignReport report) => new(report, null, null);

    internal static DesignRun Failed(FieldError error) => new(null, error, null);

    internal static DesignRun Failed(Problem problem) => new(null, null, problem);
}
