using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class DiscretizeCommandTests
{
    private const string FifthOrder = "3 (s+0.15)(s+0.3)(s+0.7)(s+1.5)/((s+0.1)(s+0.2)(s+0.5)(s+1)(s+2))";

    [Fact]
    public void Discretize_HighOrderAtAFastRate_SaysTheDirectFormLosesTheDcGainAndOffersSections()
    {
        var (code, output, error) = CliRunner.Run("discretize", "--compensator", FifthOrder, "--sample-time", "0.0005");
        Assert.True(code == 0, error);
        Assert.Contains("ONE DIRECT FORM IN DOUBLE", output, StringComparison.Ordinal);
        Assert.Contains("--sections", output, StringComparison.Ordinal);
        var (code2, sections, _) = CliRunner.Run("discretize", "--compensator", FifthOrder, "--sample-time", "0.0005", "--sections");
        Assert.Equal(0, code2);
        Assert.Equal(3, sections.Split('\n').Count(l => l.TrimStart().StartsWith("section ", StringComparison.Ordinal)));
    }

    [Fact]
    public void Discretize_Json_SectionsMultiplyToTheDesignedDcGain()
    {
        var (code, output, _) = CliRunner.Run("discretize", "--compensator", FifthOrder, "--sample-time", "0.0005", "--method", "zoh", "--json");
        Assert.Equal(0, code);
        using var json = System.Text.Json.JsonDocument.Parse(output);
        var root = json.RootElement;
        var product = 1.0;
        foreach (var q in root.GetProperty("sections").EnumerateArray())
        {
            double V(string k) => q.GetProperty(k).GetDouble();
            product *= (V("b0") + V("b1") + V("b2")) / (1 + V("a1") + V("a2"));
        }

        // C(s = 0) = 3·0.15·0.3·0.7·1.5 / (0.1·0.2·0.5·1·2) = 7.0875, kept by the zero-order hold (step invariance).
        Assert.Equal(7.0875, root.GetProperty("dcGain").GetDouble(), 6);
        Assert.Equal(7.0875, product, 3);
        Assert.True(root.GetProperty("directForm").GetProperty("double").GetProperty("losesAccuracy").GetBoolean());
    }
}
