using CompAssist.Core.Common;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary>How every command reports a failed run on stderr, and with which exit code.</summary>
internal static class Errors
{
    /// <summary>Writes the failure, if any, and returns its exit code; null when there is none.</summary>
    public static int? Report(FieldError? fieldError, Problem? problem, bool inputMissing, TextWriter stderr)
    {
        if (fieldError is not null)
        {
            stderr.WriteLine($"error: cannot read the {fieldError.Field} expression:");
            stderr.WriteLine(fieldError.Error.Render());
            return CliApplication.InputError;
        }

        if (problem is not null)
        {
            stderr.WriteLine($"error: {problem.Message}.");
            stderr.WriteLine($"hint: {SettingFlags.Hint(problem)}");
            return inputMissing ? CliApplication.InputError : CliApplication.Refused;
        }

        return null;
    }
}
