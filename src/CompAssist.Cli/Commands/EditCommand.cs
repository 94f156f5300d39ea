using System.CommandLine;
using CompAssist.Tui;

namespace CompAssist.Cli.Commands;

/// <summary>`compassist edit [CASE.toml]`: the terminal editor (also what `compassist` alone opens).</summary>
internal static class EditCommand
{
    public static Command Create(TextWriter stderr)
    {
        var file = new Argument<string?>("case") { Description = "Case file to open (TOML); none starts a new case.", Arity = ArgumentArity.ZeroOrOne };
        var ascii = new Option<bool>("--ascii") { Description = "Plain ASCII pictures (for terminals without Unicode fonts)." };
        var noColor = new Option<bool>("--no-color") { Description = "No colour (the same as setting NO_COLOR)." };
        var command = new Command("edit", "Open the terminal editor: move the target with the arrow keys, watch the design and its proof update, save, hand off.")
        {
            file,
            ascii,
            noColor,
        };
        command.SetAction(parse => Open(parse.GetValue(file), parse.GetValue(ascii), parse.GetValue(noColor), stderr));
        return command;
    }

    /// <summary>Runs the editor, handing it the writer that puts the plots beside the package.</summary>
    public static int Open(string? path, bool ascii, bool noColor, TextWriter stderr) =>
        EditorLauncher.Run(path, stderr, HandoffFiles.Write, ascii, noColor);
}
