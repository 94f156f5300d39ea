using System.CommandLine;
using CompAssist.Cli.Commands;

namespace CompAssist.Cli;

/// <summary>
/// The <c>compassist</c> command line. All output goes through the given writers, so tests capture it.
/// Exit codes (one scheme for every command): 0 the proof completed and every requirement holds; 1 unusable
/// command line (unknown option); 2 unusable input value or file; 3 the design is refused as asked (nothing
/// was designed; the message says why and what to change); 4 the proof completed but the loop is unstable or
/// a requirement fails, nominally or at a variation corner; 70 an internal error (a bug, never reached by
/// input). With 1–3 stdout is empty; with 0 and 4 the full report is on stdout.
/// </summary>
public static class CliApplication
{
    public const int Success = 0;
    public const int UsageError = 1;
    public const int InputError = 2;
    public const int Refused = 3;
    public const int Fails = 4;
    public const int InternalError = 70;

    /// <summary>The exit-code table, as the help text and the README print it.</summary>
    public const string ExitCodeTable = """
        Exit codes:
          0  the proof completed and every requirement holds (nominally and at every --vary corner)
          1  unusable command line (unknown option or command)
          2  unusable input value or file
          3  the design is refused as asked (nothing was designed; the message says why)
          4  the proof completed, but the loop is unstable or a requirement fails
         70  internal error (a bug: please report it)
        With 1-3 nothing is printed on stdout; with 0 and 4 the full report is (valid JSON with --json).
        """;

    /// <summary>Runs the command line.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        ArgumentNullException.ThrowIfNull(args);
        var root = new RootCommand("CompAssist: design feedback compensators from root-locus conditions and prove the closed loop.\n\n" + ExitCodeTable);
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

            var parse = root.Parse(args);
            if (parse.Errors.Count > 0)
            {
                return UsageErrors.Report(parse, stderr);
            }

            return parse.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // Last line of defence: a bug must not print a stack trace at the user or leave partial JSON.
            stderr.WriteLine($"error: internal error ({e.GetType().Name}: {e.Message}). Please report it with the command you ran.");
            return InternalError;
        }
    }
}
