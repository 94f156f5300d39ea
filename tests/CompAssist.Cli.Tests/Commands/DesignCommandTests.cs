using System.Text.Json;
using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class DesignCommandTests
{
    private static readonly string Ogata = "4/(s(s+2))";

    [Fact]
    public void Design_SearchWithAPlacementFlag_KeepsItAndSaysSo()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "25/(s(s+5))", "--overshoot", "10", "--settling", "1.2", "--placement", "cancel", "--zero", "-5", "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var search = doc.RootElement.GetProperty("search");
        Assert.Equal(["placement"], search.GetProperty("keptAsGiven").EnumerateArray().Select(e => e.GetString()));
        Assert.StartsWith("cancel -5", search.GetProperty("winner").GetProperty("choice").GetString(), StringComparison.Ordinal);
        var (_, text, _) = CliRunner.Run("design", "--plant", "25/(s(s+5))", "--overshoot", "10", "--settling", "1.2", "--placement", "cancel", "--zero", "-5");
        Assert.Contains("kept as given, not searched: the lead placement", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--overshoot", "0", "The largest overshoot is 0")]
    [InlineData("--overshoot", "150", "The largest overshoot is 150")]
    [InlineData("--overshoot", "nan", "--overshoot 'nan' is not a usable number")]
    [InlineData("--settling", "-1", "The largest settling time is -1")]
    [InlineData("--peak-time", "0", "The largest peak time is 0")]
    [InlineData("--zeta", "1.5", "The damping ratio ζ of the target is 1.5")]
    [InlineData("--wn", "0", "The natural frequency ωn of the target is 0")]
    [InlineData("--target", "1,2", "The real part of the target pole is 1")]
    public void Design_RequirementOutOfRange_InputErrorNotARefusal(string flag, string value, string message)
    {
        // An unusable value is bad input (exit 2), not a design refused as asked (exit 3).
        string[] rest = flag switch
        {
            "--zeta" => ["--wn", "2"],
            "--wn" => ["--zeta", "0.5"],
            "--overshoot" => ["--settling", "2"],
            "--target" => [],
            _ => ["--overshoot", "10"],
        };
        var (code, output, error) = CliRunner.Run(["design", "--plant", Ogata, $"{flag}={value}", .. rest]);
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains(message, error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--output-limits", "5", "is not LOW,HIGH")]
    [InlineData("--output-limits", "100,0", "needs LOW below HIGH")]
    [InlineData("--output-limits", "0,nan", "needs LOW below HIGH")]
    public void Design_BadOutputLimits_ValueErrorNamingTheFlag(string flag, string value, string message)
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "4/(s(s+2))", "--overshoot", "10", "--settling", "2", "--corner", flag, value);
        Assert.Equal(2, code);
        Assert.Empty(output);
        Assert.Contains(message, error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new[] { "--actuator-limit", "5", "--output-limits", "0,5" }, "both given")]
    [InlineData(new[] { "--output-limits", "0,100", "--operating-point", "120" }, "lies outside the output limits")]
    public void Design_ConflictingLimits_InputError(string[] flags, string message)
    {
        var (code, _, error) = CliRunner.Run(["design", "--plant", "4/(s(s+2))", "--overshoot", "10", "--settling", "2", "--corner", .. flags]);
        Assert.Equal(2, code);
        Assert.Contains(message, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_OutputLimitsAboutAnOperatingPoint_JsonGivesTheRoomAndTheCommandRange()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "4/(s(s+2))", "--overshoot", "10", "--settling", "2", "--corner", "--output-limits", "0,100", "--operating-point", "40", "--json");
        using var json = System.Text.Json.JsonDocument.Parse(output);
        CliRunner.AssertProvedExitCode(code, json.RootElement, error);
        var effort = json.RootElement.GetProperty("check").GetProperty("effort");
        Assert.Equal(-40.0, effort.GetProperty("roomLow").GetDouble());
        Assert.Equal(60.0, effort.GetProperty("roomHigh").GetDouble());
        Assert.True(effort.GetProperty("highest").GetDouble() >= effort.GetProperty("lowest").GetDouble());
    }

    [Fact]
    public void Design_Kinds_ComparesEachAndKeepsTheBest()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "25/(s(s+5))", "--overshoot", "10", "--settling", "1.2", "--kinds", "lead,pi", "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var rows = doc.RootElement.GetProperty("kindsCompared").EnumerateArray().ToList();
        Assert.Equal(["lead", "pi"], rows.Select(r => r.GetProperty("kind").GetString()));
        Assert.Equal("lead", doc.RootElement.GetProperty("compensator").GetProperty("type").GetString());

        var (bad, stdout, stderr) = CliRunner.Run("design", "--plant", "25/(s(s+5))", "--overshoot", "10", "--settling", "1.2", "--kinds", "lead,bogus");
        Assert.Equal(2, bad);
        Assert.Equal(string.Empty, stdout);
        Assert.Contains("--kinds 'lead,bogus' is not a list of compensator types", stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_KindsAtTheCorner_ComparedAtTheOneTargetNotIgnored()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "25/(s(s+5))", "--overshoot", "10", "--settling", "1.2", "--kinds", "pi,lead", "--corner");
        Assert.True(code == 0, error);
        Assert.Contains("Kinds compared (each designed at the same target", output, StringComparison.Ordinal);
        Assert.Contains("lead (chosen): meets", output, StringComparison.Ordinal);
        Assert.Contains("pi: refused", output, StringComparison.Ordinal);
        Assert.DoesNotContain("Search (", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_Text_ShowsCompensatorProofAndCaution()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", Ogata, "--zeta", "0.5", "--wn", "4");
        Assert.Equal(0, code);
        Assert.Equal(string.Empty, error);
        Assert.Contains("C(s) = 4.73205 (s + 2.9282) / (s + 5.4641)", output, StringComparison.Ordinal);
        Assert.Contains("target confirmed as a closed-loop root", output, StringComparison.Ordinal);
        Assert.Contains("-2 ± 3.4641j", output, StringComparison.Ordinal);
        Assert.Contains("\nCaution\n", output, StringComparison.Ordinal);
        Assert.Contains("ISO 13849", output, StringComparison.Ordinal);
        Assert.Contains("second-order predictions (not measurements):", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_Json_HasMachineInterfaceFields()
    {
        var (code, output, _) = CliRunner.Run("design", "--plant", Ogata, "--target=-2,3.4641016151377544", "--placement", "cancel", "--json");
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        Assert.Equal(-2.0, root.GetProperty("target").GetProperty("re").GetDouble());
        Assert.Equal(3.4641016151377544, root.GetProperty("target").GetProperty("im").GetDouble());
        var c = root.GetProperty("compensator");
        Assert.Equal("lead", c.GetProperty("type").GetString());
        Assert.Equal(4.0, c.GetProperty("gain").GetDouble(), 12);
        Assert.Equal(-2.0, c.GetProperty("zeros")[0].GetProperty("re").GetDouble());
        Assert.Equal(-4.0, c.GetProperty("poles")[0].GetProperty("re").GetDouble(), 12);
        var num = c.GetProperty("numerator").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        var den = c.GetProperty("denominator").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        Assert.Equal(2, num.Length);
        Assert.Equal(4.0, num[0], 12);
        Assert.Equal(8.0, num[1], 12);
        Assert.Equal(1.0, den[0]);
        Assert.Equal(4.0, den[1], 12);
        var poles = root.GetProperty("closedLoop").GetProperty("poles").EnumerateArray().ToList();
        Assert.Equal(3, poles.Count);
        Assert.All(poles, p => Assert.True(p.GetProperty("re").GetDouble() < 0));
        Assert.True(root.GetProperty("closedLoop").GetProperty("targetConfirmed").GetBoolean());
        Assert.Contains("not a safety function", root.GetProperty("caution").GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("beneath")]
    [InlineData("bisector")]
    [InlineData("cancel")]
    [InlineData("fixed-zero", "--zero", "-1.5")]
    [InlineData("fixed-pole", "--pole", "-12")]
    [InlineData("ratio", "--ratio", "6")]
    public void Design_EveryPlacement_ExitsZeroWithConfirmedTarget(string placement, params string[] extra)
    {
        string[] args = ["design", "--plant", "10/(s(s+2)(s+10))", "--target=-1.5,2.5", "--placement", placement, "--json", .. extra];
        var (code, output, error) = CliRunner.Run(args);
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        Assert.True(doc.RootElement.GetProperty("closedLoop").GetProperty("targetConfirmed").GetBoolean());
        Assert.Equal(placement, doc.RootElement.GetProperty("compensator").GetProperty("placement").GetString());
    }

    [Fact]
    public void Design_BadExpression_ShowsCaretOnStderrAndNoStdout()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "4/(s(s+2", "--zeta", "0.5", "--wn", "4", "--json");
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        var lines = error.Split('\n');
        Assert.Equal("error: cannot read the plant expression:", lines[0]);
        Assert.Equal("  4/(s(s+2", lines[1]);
        Assert.Equal("      ^", lines[2]);
        Assert.StartsWith("This '(' is never closed (column 5).", lines[3], StringComparison.Ordinal);
    }

    [Fact]
    public void Design_Refused_ExitsThreeWithReasonAndHint()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", Ogata, "--target=-1,3", "--json");
        Assert.Equal(3, code);
        Assert.Equal(string.Empty, output);
        Assert.StartsWith("error: The target is already on the uncompensated locus", error, StringComparison.Ordinal);
        Assert.Contains("hint: No lead is needed", error, StringComparison.Ordinal);
    }

    public static TheoryData<string[], int, string> BadCommandLines() => new()
    {
        { ["design", "--zeta", "0.5", "--wn", "4"], 2, "error: No plant is given" },
        { ["design", "--plant", "1/s^2", "--target", "abc"], 2, "error: --target 'abc' is not a point" },
        { ["design", "--plant", "1/s^2", "--zeta", "0.5", "--wn", "4", "--placement", "middle"], 2, "error: --placement 'middle' is not a placement" },
        { ["design", "--plant", "1/s^2", "--overshoot", "10", "--settling", "2", "--band", "3"], 2, "error: --band 3 is not supported" },
        { ["design", "--plant", "1/s^2", "--zeta", "0.5", "--wn", "4", "--type", "notch"], 2, "error: --type 'notch' is not a compensator type" },
        { ["design", "--plant", "1/s^2", "--zeta", "0.5"], 3, "error: ζ and ωn must be given together" },
        { ["design", "--plant", "1/s^2", "--zeta", "0.5", "--wn", "4", "--placement", "fixed-zero"], 3, "error: The fixed-zero placement needs a zero location" },
        { ["design", "/nonexistent/case.toml"], 2, "error: /nonexistent/case.toml: Cannot read the case file" },
        { ["design", "--plant", "1/s^2", "--zeta", "zero"], 2, "'zero' is not a number" },
        { ["design", ""], 2, "not a usable path" },
        { ["design", "--plant", "1/s", "--save", " "], 2, "not a usable path" },
        { ["design", "--no-such-flag"], 1, "--no-such-flag" },
    };

    [Theory]
    [MemberData(nameof(BadCommandLines))]
    public void Design_BadCommandLine_NonZeroExitMessageOnStderrNoStdoutJson(string[] args, int expectedCode, string expectedError)
    {
        var (code, output, error) = CliRunner.Run([.. args, "--json"]);
        Assert.Equal(expectedCode, code);
        Assert.Contains(expectedError, error, StringComparison.Ordinal);
        Assert.DoesNotContain("{", output, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_FlagsOverrideCaseFile()
    {
        var path = Path.Combine(CliRunner.RepositoryRoot(), "cases", "belt-axis.toml");
        var (code, output, _) = CliRunner.Run("design", path, "--target=-4,5", "--json");
        using var doc = JsonDocument.Parse(output);
        CliRunner.AssertProvedExitCode(code, doc.RootElement);
        Assert.Equal(-4.0, doc.RootElement.GetProperty("target").GetProperty("re").GetDouble());
        Assert.Equal("bisector", doc.RootElement.GetProperty("compensator").GetProperty("placement").GetString());
    }

    public static TheoryData<string> DemoCases()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(Path.Combine(CliRunner.RepositoryRoot(), "cases"), "*.toml").Order())
        {
            data.Add(Path.GetFileName(file));
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(DemoCases))]
    public void Design_DemoCase_IsDesignedAndProved(string file)
    {
        var path = Path.Combine(CliRunner.RepositoryRoot(), "cases", file);
        var (code, output, error) = CliRunner.Run("design", path, "--json");
        using var doc = JsonDocument.Parse(output);
        CliRunner.AssertProvedExitCode(code, doc.RootElement, error);

        // Every demo case meets its own requirements (nominally and at every variation corner) through the search.
        Assert.True(code == 0, $"{file}: {doc.RootElement.GetProperty("verdict")}");
        Assert.True(doc.RootElement.GetProperty("search").GetProperty("meets").GetBoolean());
        var closed = doc.RootElement.GetProperty("closedLoop");
        Assert.True(closed.GetProperty("targetConfirmed").GetBoolean());
        Assert.True(closed.GetProperty("stable").GetBoolean());
        var check = doc.RootElement.GetProperty("check");
        Assert.True(check.GetProperty("stable").GetBoolean());
        Assert.Equal(JsonValueKind.Object, check.GetProperty("margins").ValueKind);
        Assert.True(check.GetProperty("step").GetProperty("finalValue").GetDouble() > 0);
    }

    [Theory]
    [InlineData("lag", "--kv", "10", "lag")]
    [InlineData("lead-lag", "--kv", "40", "lead")]
    [InlineData("pd", "--filter-ratio", "10", "pd")]
    [InlineData("pi", "--zero-fraction", "0.1", "pi")]
    [InlineData("pid", "--filter-ratio", "20", "pd")]
    public void Design_EveryType_ProvedWithStagesAndConstants(string type, string flag, string value, string firstStageKind)
    {
        // Lag and PI keep the transient: with only the damping given, the target is where ζ meets the locus.
        string[] target = type is "lag" or "pi" ? ["--overshoot", "20"] : ["--zeta", "0.5", "--wn", "3"];
        string[] args = ["design", "--plant", "5/(s(s+1)(s+5))", "--type", type, flag, value, "--json", .. target];
        var (code, output, error) = CliRunner.Run(args);
        Assert.True(code is 0 or 4, error);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        CliRunner.AssertProvedExitCode(code, root, error);
        Assert.True(root.GetProperty("closedLoop").GetProperty("targetConfirmed").GetBoolean());
        Assert.Equal(type, root.GetProperty("compensator").GetProperty("type").GetString());
        var stages = root.GetProperty("compensator").GetProperty("stages");
        Assert.Contains(stages.EnumerateArray(), st => st.GetProperty("kind").GetString() == firstStageKind);
        var constants = root.GetProperty("errorConstants");
        Assert.True(constants.TryGetProperty("type", out _) && constants.TryGetProperty("kv", out _));
        if (type is "pd" or "pi" or "pid")
        {
            var pid = root.GetProperty("compensator").GetProperty("pid");
            Assert.True(pid.GetProperty("parallel").GetProperty("kp").GetDouble() > 0);
            Assert.True(pid.TryGetProperty("standard", out _));
        }

        if (flag == "--kv")
        {
            Assert.True(constants.GetProperty("met").GetBoolean());
        }
    }

    [Theory]
    [InlineData("lag", "--kv", "0.1", "without a lag")]
    [InlineData("lag", "--kp", "3", "already infinite")]
    [InlineData("pi", "--zero-fraction", "2", "at or right of the target")]
    public void Design_TypeRefusals_ExitThree(string type, string flag, string value, string reason)
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "5/(s(s+1)(s+5))", "--type", type, "--overshoot", "20", flag, value, "--json");
        Assert.Equal(3, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains(reason, error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("lead", "--zero-fraction 0.2", "--zero-fraction does not apply to a lead design")]
    [InlineData("lead", "--equal-factor", "--equal-factor does not apply to a lead design")]
    [InlineData("pd", "--angle-budget 3", "--angle-budget does not apply to a pd design")]
    [InlineData("pi", "--placement bisector", "--placement does not apply to a pi design")]
    [InlineData("pi", "--ratio 5", "--ratio does not apply to a pi design")]
    [InlineData("lag", "--filter-ratio 10", "--filter-ratio does not apply to a lag design")]
    [InlineData("lead", "--ratio 5", "--ratio (the bisector placement has no use for it)")]
    [InlineData("lead", "--placement fixed-zero --zero=-1 --pole=-20", "--pole (the fixed-zero placement has no use for it)")]
    [InlineData("lead-lag", "--ratio 10", "--ratio (the bisector placement has no use for it)")]
    public void Design_FlagForNoneOfTheKinds_ExitTwoWithTheReason(string type, string flags, string reason)
    {
        string[] args = ["design", "--plant", "5/(s(s+1)(s+5))", "--type", type, "--overshoot", "20", "--kv", "2", .. flags.Split(' ')];
        var (code, output, error) = CliRunner.Run(args);
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains(reason, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_PiWithPlacementCancel_ZeroOnTheNamedPlantPole()
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "0.5/((s+0.1)(s+1))", "--type", "pi", "--placement", "cancel", "--zero", "-1", "--zeta", "0.7", "--wn", "0.07", "--json");
        Assert.True(code is 0 or 4, error);
        using var json = System.Text.Json.JsonDocument.Parse(output);
        var zeros = json.RootElement.GetProperty("compensator").GetProperty("zeros");
        Assert.Equal(-1.0, zeros[0].GetProperty("re").GetDouble(), 12);
    }

    [Fact]
    public void Design_Prefilter_CancelsThePiZeroAndReportsTheStepWithIt()
    {
        // The exact PI on exp(-0.1s)/(s-1) at −2 ± 2j has its zero at −1.1605 beside the target: F = 1.1605/(s + 1.1605)
        // (F(0)·T(0) = 1 with T(0) = 1) takes the zero's overshoot out of the reference step.
        var (code, output, error) = CliRunner.Run("design", "--plant", "exp(-0.1s)/(s-1)", "--type", "pi", "--target=-2,2", "--prefilter", "--json");
        Assert.True(code is 0 or 4, error);
        using var json = System.Text.Json.JsonDocument.Parse(output);
        var prefilter = json.RootElement.GetProperty("prefilter");
        Assert.InRange(prefilter.GetProperty("poles")[0].GetProperty("re").GetDouble(), -1.1606, -1.1605);
        var with = prefilter.GetProperty("overshootPercent").GetDouble();
        Assert.InRange(with, 0.0, 10.0);
        Assert.True(json.RootElement.GetProperty("check").GetProperty("step").GetProperty("overshootPercent").GetDouble() > 40, "the zero's overshoot without F");
    }

    [Fact]
    public void Design_TargetMovedByTheDesign_PredictionsAreThoseOfThePlacedPole()
    {
        // The pole-cancelling PI keeps ζ = 0.7 but moves to σ = 0.5: the prediction is that of the placed pole,
        // overshoot e^(−πζ/√(1 − ζ²)) = 4.6 % and 4/σ = 8 s (common practice), not those of ωn = 1.
        var (code, output, error) = CliRunner.Run("design", "--plant", "0.5/((s+0.1)(s+1))", "--type", "pi", "--placement", "cancel", "--zeta", "0.7", "--wn", "1");
        Assert.True(code is 0 or 4, error);
        Assert.Contains("second-order predictions of the placed s*", output, StringComparison.Ordinal);
        Assert.Contains("settling 8 s (2 % band, 4/σ)", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_TwoSteadyStateRequirements_Refused()
    {
        var (code, _, error) = CliRunner.Run("design", "--plant", "1/(s(s+1))", "--type", "lag", "--kv", "5", "--ramp-error", "0.1");
        Assert.Equal(2, code);
        Assert.Contains("both set a steady-state requirement", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Design_Save_WritesACaseThatReproducesTheDesign()
    {
        var path = Path.Combine(Path.GetTempPath(), $"compassist-saved-{Guid.NewGuid():N}.toml");
        try
        {
            var (code, first, error) = CliRunner.Run("design", "--plant", "4/(s(s+2))", "--zeta", "0.5", "--wn", "4", "--placement", "cancel", "--save", path, "--json");
            Assert.True(code == 0, error);
            var (code2, second, error2) = CliRunner.Run("design", path, "--json");
            Assert.True(code2 == 0, error2);
            using var a = JsonDocument.Parse(first);
            using var b = JsonDocument.Parse(second);
            Assert.Equal(a.RootElement.GetProperty("compensator").GetProperty("gain").GetDouble(), b.RootElement.GetProperty("compensator").GetProperty("gain").GetDouble());
        }
        finally
        {
            File.Delete(path);
        }
    }
}
