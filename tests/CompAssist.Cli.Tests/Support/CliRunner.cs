namespace CompAssist.Cli.Tests.Support;

/// <summary>Runs the command line in-process with captured output.</summary>
internal static class CliRunner
{
    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var code = CliApplication.Run(args, stdout, stderr);
        return (code, stdout.ToString(), stderr.ToString());
    }

    /// <summary>
    /// Asserts the exit-code scheme for a completed proof: 0 exactly when the JSON verdict says the loop meets
    /// every requirement, 4 otherwise, and the verdict agrees with the per-row results and the robustness corners.
    /// </summary>
    public static void AssertProvedExitCode(int code, System.Text.Json.JsonElement root, string error = "")
    {
        var verdict = root.GetProperty("verdict");
        var meets = verdict.GetProperty("meets").GetBoolean();
        Xunit.Assert.True(code == (meets ? 0 : 4), $"exit {code} with verdict {verdict}; stderr: {error}");
        var check = root.GetProperty("check");
        var rowsPass = check.GetProperty("requirements").EnumerateArray()
            .All(r => !r.TryGetProperty("passes", out var p) || p.GetBoolean());
        var cornersMeet = !check.TryGetProperty("robustness", out var rob) || rob.GetProperty("allMeet").GetBoolean();
        Xunit.Assert.Equal(check.GetProperty("stable").GetBoolean() && rowsPass && cornersMeet, meets);
    }

    /// <summary>The repository root (the folder holding CompAssist.sln).</summary>
    public static string RepositoryRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "CompAssist.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("CompAssist.sln not found above the test folder.");
    }
}
