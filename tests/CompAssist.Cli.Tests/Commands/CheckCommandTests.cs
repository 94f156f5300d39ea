using System.Text.Json;
using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class CheckCommandTests
{
    [Fact]
    public void Check_Json_HasMachineInterfaceFields()
    {
        var (code, output, error) = CliRunner.Run("check", "--plant", "4/(s(s+2))", "--compensator", "4(s+2)/(s+4)", "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var check = doc.RootElement.GetProperty("check");
        Assert.True(check.GetProperty("stable").GetBoolean());
        var step = check.GetProperty("step");
        // The loop is exactly 16/(s² + 4s + 16): ζ = 0.5 → 16.3 % overshoot (common practice).
        Assert.Equal(16.3, step.GetProperty("overshootPercent").GetDouble(), 1);
        Assert.Equal(1.0, step.GetProperty("finalValue").GetDouble(), 12);
        foreach (var name in new[] { "peakTime", "riseTime", "settlingTime2", "settlingTime5" })
        {
            Assert.True(step.GetProperty(name).GetDouble() > 0, name);
        }

        var margins = check.GetProperty("margins");
        Assert.Equal("inf", margins.GetProperty("gainMarginDb").GetString());
        Assert.True(margins.GetProperty("phaseMarginDeg").GetDouble() > 0);
        foreach (var name in new[] { "gainCrossover", "delayMargin", "sensitivityPeak" })
        {
            Assert.True(margins.GetProperty(name).GetDouble() > 0, name);
        }

        Assert.Equal(JsonValueKind.String, margins.GetProperty("phaseCrossover").ValueKind);
        Assert.Equal(4.0, check.GetProperty("effort").GetProperty("initial").GetDouble(), 12);
        Assert.True(check.GetProperty("effort").GetProperty("peak").GetDouble() >= 4.0);
    }

    [Theory]
    [InlineData("check", "(s+1)/(s+2)", "-1", false, "not well posed")]
    [InlineData("check", "(s+1)/(s+2)", "1", true, "not well posed")]
    [InlineData("check", "exp(-s)", "1", false, "imaginary axis")]
    [InlineData("check", "-exp(-0.2s)", "1", true, "imaginary axis")]
    [InlineData("plot", "(s+1)/(s+2)", "-1", false, "not well posed")]
    [InlineData("plot", "exp(-s)", "1", false, "imaginary axis")]
    public void Check_LoopWithUnitGainAtInfinity_RefusedAsInputNotAnInternalError(string command, string plant, string compensator, bool positive, string expected)
    {
        // 1 + L(∞) = 0: the characteristic polynomial loses its leading term (a closed-loop pole at infinity);
        // with a delay and |L(∞)| = 1 the roots of 1 + L0·e^(−θs) form a chain towards the imaginary axis.
        var args = new List<string> { command, "--plant", plant, "--compensator", compensator };
        if (positive)
        {
            args.Add("--positive-feedback");
        }

        if (command == "plot")
        {
            args.AddRange(["--out", Path.Combine(Path.GetTempPath(), $"ca-illposed-{Guid.NewGuid():N}.svg")]);
        }

        var (code, output, error) = CliRunner.Run([.. args]);
        Assert.Equal(3, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains(expected, error, StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_DelayLoopWithGainAboveOneAtInfinity_Unstable()
    {
        // 1 + a·e^(−θs) = 0 has the roots s = (ln a + j(2k+1)π)/θ exactly: for a = 1.5 and θ = 1 all sit at
        // Re s = ln 1.5 = 0.405, so the loop is unstable whatever a Padé approximant says.
        var (code, output, _) = CliRunner.Run("check", "--plant", "exp(-s)", "--compensator", "1.5");
        Assert.Equal(4, code);
        Assert.Contains("UNSTABLE", output, StringComparison.Ordinal);
        Assert.Contains("0.4055", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_StaticLoop_ProvedNotAnInternalError()
    {
        // Gains only: T = 0.5/(1 + 0.5) = 1/3 at once, no closed-loop pole (common practice).
        var (code, output, error) = CliRunner.Run("check", "--plant", "1", "--compensator", "0.5", "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(1.0 / 3.0, doc.RootElement.GetProperty("check").GetProperty("step").GetProperty("finalValue").GetDouble(), 12);
        var (plotCode, _, plotError) = CliRunner.Run("plot", "--plant", "1", "--compensator", "1", "--out", Path.Combine(Path.GetTempPath(), $"ca-static-{Guid.NewGuid():N}.svg"));
        Assert.True(plotCode == 0, plotError);
    }

    [Fact]
    public void Check_NearlyUndampedLoop_FirstPeakExactAndTheSpanCutShortWithAWarning()
    {
        // 1/(s² + 2e-6 s + 1) under unit feedback: ζ = 1e-6/√2, ωn = √2; overshoot e^(−πζ/√(1−ζ²)) and peak
        // time π/ωd (common practice). Its envelope settles after 4/σ = 4e6 s: the simulation stops earlier,
        // says so, and does not coarsen its grid into aliasing the oscillation.
        var (code, output, error) = CliRunner.Run("check", "--plant", "1/(s^2+2e-6s+1)", "--compensator", "1", "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var check = doc.RootElement.GetProperty("check");
        var step = check.GetProperty("step");
        var zeta = 1e-6 / Math.Sqrt(2);
        Assert.Equal(100 * Math.Exp(-Math.PI * zeta / Math.Sqrt(1 - (zeta * zeta))), step.GetProperty("overshootPercent").GetDouble(), 6);
        Assert.Equal(Math.PI / (Math.Sqrt(2) * Math.Sqrt(1 - (zeta * zeta))), step.GetProperty("peakTime").GetDouble(), 6);
        Assert.Equal("inf", step.GetProperty("settlingTime2").GetString());
        Assert.Contains(check.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("so lightly damped", StringComparison.Ordinal));
    }

    [Fact]
    public void Check_Text_ShowsStepMarginsAndCaution()
    {
        var (code, output, _) = CliRunner.Run("check", "--plant", "4/(s(s+2))", "--compensator", "4.7(s+2.93)/(s+5.46)", "--overshoot", "20", "--settling", "2");
        Assert.Equal(4, code);
        Assert.Contains("Verdict: FAILS", output, StringComparison.Ordinal);
        Assert.Contains("Simulated unit step", output, StringComparison.Ordinal);
        Assert.Contains("phase margin", output, StringComparison.Ordinal);
        Assert.Contains("FAIL", output, StringComparison.Ordinal);
        Assert.Contains("ISO 13849", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_Robustness_ReportsUnstableCorner()
    {
        // K/(s(s+1)(s+2)) with K = 5 ± 30 %: the upper corner exceeds the Routh limit K = 6.
        var (code, output, _) = CliRunner.Run("check", "--plant", "5/(s(s+1)(s+2))", "--compensator", "1", "--vary", "gain=30%", "--json");
        Assert.Equal(4, code);
        using var doc = JsonDocument.Parse(output);
        var robustness = doc.RootElement.GetProperty("check").GetProperty("robustness");
        Assert.False(robustness.GetProperty("allStable").GetBoolean());
        Assert.Equal(2, robustness.GetProperty("corners").GetArrayLength());
    }

    [Fact]
    public void Check_UnstableLoop_MarginsNull()
    {
        var (code, output, _) = CliRunner.Run("check", "--plant", "1/(s(s+1)(s+2))", "--compensator", "10", "--json");
        Assert.Equal(4, code);
        using var doc = JsonDocument.Parse(output);
        Assert.False(doc.RootElement.GetProperty("check").GetProperty("stable").GetBoolean());
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("check").GetProperty("margins").ValueKind);
        Assert.Equal(2, doc.RootElement.GetProperty("check").GetProperty("unstableRoots").GetInt32());
        Assert.Equal("unstable", doc.RootElement.GetProperty("verdict").GetProperty("status").GetString());
        Assert.All(doc.RootElement.GetProperty("check").GetProperty("requirements").EnumerateArray(), r => Assert.False(r.TryGetProperty("passes", out var p) && p.GetBoolean()));

        // A diverging step has no final value or overshoot: "nan", not the last sample of the divergence.
        var step = doc.RootElement.GetProperty("check").GetProperty("step");
        foreach (var figure in (string[])["finalValue", "overshootPercent", "settlingTime2", "peakValue"])
        {
            Assert.Equal("nan", step.GetProperty(figure).GetString());
        }

        var (_, text, _) = CliRunner.Run("check", "--plant", "1/(s(s+1)(s+2))", "--compensator", "10");
        Assert.Contains("final value and steady-state errors: none (the closed loop is unstable", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("357.21 exp(-1s)/((s+1)(s^2+0.378s+357.21))", "1", "3", false)]
    [InlineData("exp(-1s)/(s+1)", "2.5", "1", false)] // above the critical gain √(1 + ω²) ≈ 2.262, tan ω = −ω
    [InlineData("exp(-1s)/(s+1)", "2.2", "1", true)]
    public void Check_DelayLoop_StabilityJudgedWithTheExactDelay(string plant, string compensator, string pade, bool stable)
    {
        // The low-order Padé approximants of these loops have only left-half-plane roots; the exact delay decides.
        var (code, output, error) = CliRunner.Run("check", "--plant", plant, "--compensator", compensator, "--pade-order", pade, "--json");
        using var doc = JsonDocument.Parse(output);
        CliRunner.AssertProvedExitCode(code, doc.RootElement, error);
        Assert.Equal(stable, doc.RootElement.GetProperty("check").GetProperty("stable").GetBoolean());
        Assert.Equal(stable ? 0 : 4, code);
        if (!stable)
        {
            Assert.Equal(2, doc.RootElement.GetProperty("check").GetProperty("unstableRoots").GetInt32());
            Assert.Equal("unstable", doc.RootElement.GetProperty("verdict").GetProperty("status").GetString());
        }
    }

    public static TheoryData<string[], int, string> BadCommandLines() => new()
    {
        { ["check", "--plant", "1/s"], 2, "error: no compensator given" },
        { ["check", "--plant", "1/s", "--compensator", "s^3"], 3, "error: The compensated loop C·G·H has more zeros than poles" },
        { ["check", "--plant", "1/s", "--compensator", "(s+"], 2, "error: cannot read the compensator expression:" },
        { ["check", "--plant", "1/s", "--compensator", "1", "--vary", "mass=3%"], 2, "error: --vary 'mass' cannot be varied" },
        { ["check", "--plant", "1/(s+1)", "--compensator", "1", "--vary", "pole=-3:10%"], 3, "error: The plant has no pole at -3 to vary" },
        { ["check", "--plant", "1/s", "--compensator", "1", "--actuator-limit", "-1"], 2, "must be positive" },
    };

    [Theory]
    [MemberData(nameof(BadCommandLines))]
    public void Check_BadCommandLine_NonZeroExitMessageOnStderrNoStdout(string[] args, int expectedCode, string expectedError)
    {
        var (code, output, error) = CliRunner.Run([.. args, "--json"]);
        Assert.Equal(expectedCode, code);
        Assert.Contains(expectedError, error, StringComparison.Ordinal);
        Assert.Equal(string.Empty, output);
    }
}
