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
