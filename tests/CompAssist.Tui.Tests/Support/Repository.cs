namespace CompAssist.Tui.Tests.Support;

internal static class Repository
{
    public static string Root()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "CompAssist.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("The repository root (CompAssist.sln) was not found above the test binaries.");
    }
}
