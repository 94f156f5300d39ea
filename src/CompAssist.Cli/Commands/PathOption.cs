using System.CommandLine;

namespace CompAssist.Cli.Commands;

/// <summary>An option that takes a file or folder path: an empty or blank value, or one with a NUL character, is refused as input.</summary>
internal sealed class PathOption : Option<string?>
{
    public PathOption(string name)
        : base(name)
    {
        CustomParser = result =>
        {
            if (result.Tokens.Count == 0)
            {
                return null;
            }

            var text = result.Tokens[^1].Value;
            if (string.IsNullOrWhiteSpace(text) || text.Contains('\0', StringComparison.Ordinal))
            {
                result.AddError($"{name} '{text}' is not a usable path.");
                return null;
            }

            return text;
        };
    }
}
