using System.CommandLine;
using CompAssist.Cli.Commands;

namespace CompAssist.Cli;

/// <summary>
/// The <c>compassist</c> command line. All output goes through the given writers, so tests capture it.
/// Exit codes: 0 success; 1 unusable command line; 2 unreadable input (expression, case file, value);
/// 3 the design is refused as asked (the message says why and what to change); 70 internal error.
/// </summary>
public static class CliApplication
{
    public const int Success = 0;
    public const int UsageError = 1;
    public const int InputError = 2;
    public const int Refused = 3;
    public const int InternalError = 70;

    /// <summary>Runs the command line.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        ArgumentNullException.ThrowIfNull(args);
        var root = new RootCommand("CompAssist: design feedback compensators from root-locus conditions and prove the closed loop.");
        root.Subcommands.Add(DesignCommand.Create(stdout, stderr));
        root.Subcommands.Add(CheckCommand.Create(stdout, stderr));
        root.Subcommands.Add(LocusCommand.Create(stdout, stderr));
        root.Subcommands.Add(PlotCommand.Create(stdout, stderr));
        root.Subcommands.Add(DiscretizeCommand.Create(stdout, stderr));
        root.Subcommands.Add(HandoffCommand.Create(stdout, stderr));
        root.Subcommands.Add(EditCommand.Create(stderr));
        try
        {
            if (args.Length == 0)
            {
                // `compassist` alone opens the editor on a new case.
                return EditCommand.Open(null, ascii: false, noColor: false, stderr);
            }

            return root.Parse(args).Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // Last line of defence: a bug must not print a stack trace at the user or leave partial JSON.
            stderr.WriteLine($"error: internal error ({e.GetType().Name}: {e.Message}). Please report it with the command you ran.");
            return InternalError;
        }
    }
}
