using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class PlotCommandTests
{
    [Theory]
    [InlineData("locus", ".svg")]
    [InlineData("step", ".png")]
    [InlineData("frequency", ".svg")]
    [InlineData("poles", ".png")]
    public void Plot_DemoCase_WritesFile(string kind, string extension)
    {
        var path = Path.Combine(Path.GetTempPath(), $"compassist-cli-{Guid.NewGuid():N}{extension}");
        try
        {
            var file = Path.Combine(CliRunner.RepositoryRoot(), "cases", "belt-axis.toml");
            var (code, output, error) = CliRunner.Run("plot", file, "--kind", kind, "--out", path);
            Assert.True(code == 0, error);
            Assert.StartsWith($"wrote {path}", output, StringComparison.Ordinal);
            Assert.True(new FileInfo(path).Length > 1000);
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Plot_GivenCompensator_WritesFile()
    {
        var path = Path.Combine(Path.GetTempPath(), $"compassist-cli-{Guid.NewGuid():N}.svg");
        try
        {
            var (code, _, error) = CliRunner.Run("plot", "--plant", "4/(s(s+2))", "--compensator", "4(s+2)/(s+4)", "--kind", "step", "--out", path);
            Assert.True(code == 0, error);
            Assert.True(File.Exists(path));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Theory]
    [InlineData("--kind", "bode", "error: --kind 'bode' is not a plot")]
    [InlineData("--out", "x.bmp", "error: --out FILE.svg or --out FILE.png is required")]
    [InlineData("--width", "10", "error: --width must be 200")]
    public void Plot_BadOptions_Refused(string flag, string value, string message)
    {
        string[] output = flag == "--out" ? [] : ["--out", "/tmp/compassist-never.svg"];
        string[] args = ["plot", "--plant", "1/(s(s+1))", "--zeta", "0.5", "--wn", "2", .. output, flag, value];
        var (code, _, error) = CliRunner.Run(args);
        Assert.Equal(2, code);
        Assert.Contains(message, error, StringComparison.Ordinal);
        Assert.False(File.Exists("/tmp/compassist-never.svg"));
    }
}
