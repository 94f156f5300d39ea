using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;

namespace CompAssist.Cli;

/// <summary>
/// The command line's own parse errors in our words: a value that is not a number is unusable input (exit 2)
/// and named with its option and a hint; a missing value, an unknown option or command is a usage error
/// (exit 1). Either way the message goes to stderr and nothing to stdout (no help text, no .NET type names).
/// </summary>
internal static class UsageErrors
{
    /// <summary>Reports the parse errors and returns the exit code.</summary>
    public static int Report(ParseResult parse, TextWriter stderr)
    {
        var code = CliApplication.UsageError;
        // An unknown "--name" lands either among the unmatched tokens or as the command's own positional
        // argument (the case file); both are named as unknown options.
        var unknown = parse.UnmatchedTokens.Where(t => t.StartsWith('-'))
            .Concat(parse.CommandResult.Tokens.Select(t => t.Value).Where(v => v.StartsWith("--", StringComparison.Ordinal)))
            .Distinct(StringComparer.Ordinal)
            .ToList();
        foreach (var token in unknown)
        {
            stderr.WriteLine($"error: unknown option '{token}'.");
        }

        foreach (var error in parse.Errors)
        {
            if (unknown.Count > 0 && error.Message.StartsWith("Unrecognized command or argument", StringComparison.Ordinal))
            {
                continue; // the value of an unknown option, already named above
            }

            var (message, isValue) = Describe(error);
            if (isValue)
            {
                code = CliApplication.InputError;
            }

            stderr.WriteLine("error: " + message);
        }

        var command = parse.CommandResult.Command;
        var name = command is RootCommand ? "compassist" : $"compassist {command.Name}";
        stderr.WriteLine($"hint: run '{name} --help' for the options.");
        return code;
    }

    private static (string Message, bool IsValue) Describe(ParseError error)
    {
        var option = error.SymbolResult switch
        {
            OptionResult o => o,
            ArgumentResult { Parent: OptionResult o } => o,
            _ => null,
        };
        if (option is not null && option.Tokens.Count > 0 && error.Message.StartsWith(option.Option.Name + " '", StringComparison.Ordinal))
        {
            return (error.Message, true); // our own number parsers' words
        }

        if (option is not null && option.Tokens.Count > 0 && error.Message.StartsWith("Cannot parse argument", StringComparison.Ordinal))
        {
            var value = option.Tokens[^1].Value;
            var type = Nullable.GetUnderlyingType(option.Option.ValueType) ?? option.Option.ValueType;
            var wanted = type == typeof(int) ? "a whole number, for example 3" : "a number, for example 2.5 or 1e-3";
            var comma = value.Contains(',', StringComparison.Ordinal) && type != typeof(int)
                ? " (write the decimal point as '.', not ',')"
                : string.Empty;
            return (string.Create(CultureInfo.InvariantCulture, $"{option.Option.Name} '{value}' is not {wanted}{comma}."), true);
        }

        if (option is not null && option.Tokens.Count == 0)
        {
            return ($"{option.Option.Name} needs a value.", false);
        }

        return (error.Message.Replace("System.Nullable`1[System.Double]", "number", StringComparison.Ordinal)
            .Replace("System.Nullable`1[System.Int32]", "whole number", StringComparison.Ordinal)
            .Replace("System.Double", "number", StringComparison.Ordinal)
            .Replace("System.Int32", "whole number", StringComparison.Ordinal), false);
    }
}
