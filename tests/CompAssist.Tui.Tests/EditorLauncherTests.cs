namespace CompAssist.Tui.Tests;

public class EditorLauncherTests
{
    [Fact]
    public void Run_WithoutATerminal_RefusesWithAClearMessage()
    {
        using var stderr = new StringWriter();
        var code = EditorLauncher.Run(null, stderr, null, asciiPictures: false, noColour: false, hasTerminal: () => false);
        Assert.Equal(EditorLauncher.CannotStart, code);
        Assert.Contains("needs an interactive terminal", stderr.ToString());
        Assert.Contains("compassist design", stderr.ToString());
    }

    [Fact]
    public void OpenSession_MissingFile_SaysSoAndReturnsNull()
    {
        using var stderr = new StringWriter();
        Assert.Null(EditorLauncher.OpenSession(Path.Combine(Path.GetTempPath(), "no-such-case-3f9.toml"), stderr));
        Assert.Contains("does not exist", stderr.ToString());
    }

    [Fact]
    public void OpenSession_BadCaseFile_ShowsTheReadersError()
    {
        var path = Path.GetTempFileName();
        try
        {
            File.WriteAllText(path, "format = 1\n[loop]\nplant = \"1/(s+1)\"\nbogus = 3\n");
            using var stderr = new StringWriter();
            Assert.Null(EditorLauncher.OpenSession(path, stderr));
            Assert.Contains("bogus", stderr.ToString());
        }
        finally
        {
            File.Delete(path);
        }
    }
}
