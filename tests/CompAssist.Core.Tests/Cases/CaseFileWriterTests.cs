using CompAssist.Core.Cases;

namespace CompAssist.Core.Tests.Cases;

public class CaseFileWriterTests
{
    private static string Demo(string name) =>
        Path.Combine(Support.Repository.Root(), "cases", name);

    [Theory]
    [InlineData("belt-axis.toml")]
    [InlineData("gimbal-tilt.toml")]
    [InlineData("pump-pressure.toml")]
    [InlineData("turntable-tracking.toml")]
    [InlineData("heater-stage.toml")]
    public void Write_ThenRead_RoundTripsEveryDemoCase(string file)
    {
        var (original, error) = CaseFileReader.ReadFile(Demo(file));
        Assert.Null(error);
        var (again, error2) = CaseFileReader.Read(CaseFileWriter.Write(original!), "round-trip");
        Assert.Null(error2);
        Assert.Equal(original!.Plant, again!.Plant);
        Assert.Equal(original.Feedback, again.Feedback);
        Assert.Equal(original.Sign, again.Sign);
        Assert.Equal(original.Requirements, again.Requirements);
        Assert.Equal(original.Lead, again.Lead);
        Assert.Equal(original.Slow, again.Slow);
        Assert.Equal(original.Check, again.Check);
        Assert.Equal(original.Variations.ToArray(), again.Variations.ToArray());
        Assert.Equal(original.CompensatorType, again.CompensatorType);
    }

    [Fact]
    public void Save_InterruptedBeforeRename_LeavesTheOldFileIntact()
    {
        var path = Path.Combine(Path.GetTempPath(), $"compassist-save-{Guid.NewGuid():N}.toml");
        try
        {
            File.WriteAllText(path, "old content");
            Assert.Throws<IOException>(() => AtomicFile.Write(path, "new content", beforeRename: () => throw new IOException("power cut")));
            Assert.Equal("old content", File.ReadAllText(path));
            AtomicFile.Write(path, "new content");
            Assert.Equal("new content", File.ReadAllText(path));
            Assert.Empty(AtomicFile.LeftoversBeside(path));
        }
        finally
        {
            File.Delete(path);
            foreach (var leftover in AtomicFile.LeftoversBeside(path))
            {
                File.Delete(leftover);
            }
        }
    }
}
