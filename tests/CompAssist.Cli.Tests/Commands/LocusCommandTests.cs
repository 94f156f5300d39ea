using System.Text.Json;
using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class LocusCommandTests
{
    [Fact]
    public void Locus_Json_HasMachineInterfaceFields()
    {
        // K/(s(s+1)(s+2)): centroid −1, angles 60/180/300°, break-away −0.4226, crossing ω = √2 at K = 6 (Routh).
        var (code, output, error) = CliRunner.Run("locus", "--plant", "1/(s(s+1)(s+2))", "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        var branches = root.GetProperty("branches");
        Assert.Equal(3, branches.GetArrayLength());
        foreach (var branch in branches.EnumerateArray())
        {
            var ks = branch.EnumerateArray().Select(p => p.GetProperty("k").GetDouble()).ToList();
            Assert.Equal(0.0, ks[0]);
            Assert.Equal(ks.Order(), ks);
            Assert.True(branch.EnumerateArray().All(p => p.TryGetProperty("re", out _) && p.TryGetProperty("im", out _)));
        }

        Assert.Equal(-1.0, root.GetProperty("asymptotes").GetProperty("centroid").GetDouble(), 12);
        Assert.Equal([60.0, 180.0, 300.0], root.GetProperty("asymptotes").GetProperty("anglesDeg").EnumerateArray().Select(a => Math.Round(a.GetDouble(), 9)));
        var b = Assert.Single(root.GetProperty("breakPoints").EnumerateArray());
        Assert.Equal(-1 + (1 / Math.Sqrt(3)), b.GetProperty("re").GetDouble(), 12);
        var c = Assert.Single(root.GetProperty("axisCrossings").EnumerateArray());
        Assert.Equal(6.0, c.GetProperty("k").GetDouble(), 10);
        Assert.Equal(Math.Sqrt(2), c.GetProperty("omega").GetDouble(), 12);
    }

    [Fact]
    public void Locus_Text_ShowsFeaturesAndPicture()
    {
        var (code, output, _) = CliRunner.Run("locus", "--plant", "(s+2)/(s^2+2s+3)", "--ascii");
        Assert.Equal(0, code);
        Assert.Contains("break point at -3.7321, K = 5.4641", output, StringComparison.Ordinal);
        Assert.Contains("departure from pole -1 + 1.414j: 144.74°", output, StringComparison.Ordinal);
        Assert.Contains("x pole  o zero", output, StringComparison.Ordinal);
        Assert.All(output.Split('\n'), line => Assert.True(line.Length <= 80, line));
    }

    [Fact]
    public void Locus_WithCompensator_UsesWholeLoop()
    {
        var (code, output, _) = CliRunner.Run("locus", "--plant", "4/(s(s+2))", "--compensator", "(s+2)/(s+4)", "--json");
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(3, doc.RootElement.GetProperty("branches").GetArrayLength());
    }

    [Fact]
    public void Locus_WithCompensator_HeaderNamesItAndTheCancelledPoleIsNoBreakPoint()
    {
        // 4/(s(s + 2)) with C = (s + 2)/(s + 4): the locus of 4/(s(s + 4)), break-away at −2 with 4K = 4.
        var (code, output, _) = CliRunner.Run("locus", "--plant", "4/(s(s+2))", "--compensator", "(s+2)/(s+4)", "--ascii");
        Assert.Equal(0, code);
        Assert.Contains("loop C·G·H with C = (s + 2) / (s + 4), G·H = 4 / (s (s + 2))", output, StringComparison.Ordinal);
        Assert.Single(output.Split('\n'), l => l.Contains("break point", StringComparison.Ordinal));
        Assert.Contains("break point at -2, K = 1", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_Text_BreakPointGainsAreMultipliersOfTheDesignedGain()
    {
        // The factored gain of C is "K" in the synthesis; the locus features of the designed loop are
        // multipliers of that loop, and must not read as a second K.
        var (_, output, _) = CliRunner.Run("design", "--plant", "1/(s(s+1)(s+5))", "--type", "lead", "--zeta", "0.5", "--wn", "1.5", "--ascii");
        var lines = output.Split('\n').Where(l => l.Contains("break point at", StringComparison.Ordinal) || l.Contains("crosses the imaginary axis", StringComparison.Ordinal)).ToList();
        Assert.NotEmpty(lines);
        Assert.All(lines, l => Assert.True(l.Contains("× the designed gain", StringComparison.Ordinal) || l.Contains("repeated pole", StringComparison.Ordinal), l));
    }

    [Theory]
    [InlineData("--compensator", "s^2", "error: The compensated loop C·G·H has more zeros than poles")]
    [InlineData("--compensator", "(s", "error: cannot read the compensator expression:")]
    public void Locus_BadInput_NonZeroExitAndNoStdout(string flag, string value, string message)
    {
        var (code, output, error) = CliRunner.Run("locus", "--plant", "1/s", flag, value, "--json");
        Assert.NotEqual(0, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains(message, error, StringComparison.Ordinal);
    }
}
