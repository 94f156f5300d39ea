namespace CompAssist.Core.Tests.Support;

/// <summary>Locates the repository from the test binaries.</summary>
internal static class Repository
{
    public static string Root()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "CompAssist.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("CompAssist.sln not found above the test folder.");
    }
}
