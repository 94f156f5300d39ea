using System.Diagnostics;
using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class EditCommandTests
{
    // The real executable with every standard stream redirected: it must refuse at once, not wait for a terminal.
    private static (int Code, string Err) RunRedirected(params string[] args)
    {
        var dll = Path.Combine(AppContext.BaseDirectory, "compassist.dll");
        var info = new ProcessStartInfo("dotnet") { RedirectStandardInput = true, RedirectStandardOutput = true, RedirectStandardError = true, WorkingDirectory = CliRunner.RepositoryRoot() };
        info.ArgumentList.Add(dll);
        foreach (var a in args)
        {
            info.ArgumentList.Add(a);
        }

        using var process = Process.Start(info)!;
        process.StandardInput.Close();
        var err = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(120_000))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail("the editor did not refuse without a terminal; it waited");
        }

        return (process.ExitCode, err.Result);
    }

    [Fact]
    public void Edit_WithoutATerminal_RefusesWithExitCodeTwo()
    {
        var (code, err) = RunRedirected("edit", "cases/belt-axis.toml");
        Assert.Equal(2, code);
        Assert.Contains("needs an interactive terminal", err);
    }

    [Fact]
    public void NoCommand_WithoutATerminal_RefusesToo()
    {
        var (code, err) = RunRedirected();
        Assert.Equal(2, code);
        Assert.Contains("needs an interactive terminal", err);
    }

    [Fact]
    public void EditHelp_ListsTheOptions()
    {
        var (code, output, _) = CliRunner.Run("edit", "--help");
        Assert.Equal(0, code);
        Assert.Contains("--ascii", output);
        Assert.Contains("--no-color", output);
    }
}
