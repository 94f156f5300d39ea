using CompAssist.Core.Cases;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Tests.Support;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Export;

/// <summary>The package's advice about the rate: one recommendation, never "faster" and "slower" side by side.</summary>
public class HandoffPackageTests
{
    private static DesignReport BeltAxis()
    {
        var (input, error) = CaseFileReader.ReadFile(Path.Combine(Repository.Root(), "cases", "belt-axis.toml"));
        Assert.Null(error);
        return DesignWorkflow.Search(input!, new CompAssist.Core.Search.SearchOptions()).Report!;
    }

    private static IEnumerable<string> Advice(HandoffPackage p) =>
        p.Discretization.Warnings.Concat(p.Quantization.Warnings).Concat(p.Proof.Warnings).Append(p.SampleTimeNote);

    [Fact]
    public void Build_FastRateInFixedPoint_OneRecommendationALongerSampleTimeOrAWiderFormat()
    {
        // 0.1 ms is far faster than the belt axis needs: the 16-bit coefficients lose the DC gain, and the ladder
        // says the loop would still meet at a longer sample time, so that is the advice (with the wider format).
        var package = HandoffPackage.Build(BeltAxis(), new HandoffOptions { SampleTime = 0.0001, Format = NumberFormat.TryParse("fixed16")!, Name = "belt" }, "belt").Value!;
        Assert.NotEmpty(package.Quantization.Warnings);
        Assert.True(package.SampledMeets, package.SampleTimeNote);
        Assert.Contains("a longer sample time eases it", package.SampleTimeNote, StringComparison.Ordinal);
        Assert.DoesNotContain(Advice(package), w => w.Contains("Sample faster", StringComparison.OrdinalIgnoreCase) || w.Contains("lower sample rate", StringComparison.Ordinal));
    }

    [Fact]
    public void Build_SlowRateThatFails_AdvisesOnlyFasterSampling()
    {
        var package = HandoffPackage.Build(BeltAxis(), new HandoffOptions { SampleTime = 0.2, Format = NumberFormat.TryParse("fixed8")!, Name = "belt" }, "belt").Value!;
        Assert.False(package.SampledMeets);
        Assert.DoesNotContain(Advice(package), w => w.Contains("longer sample time", StringComparison.Ordinal) || w.Contains("lower sample rate", StringComparison.Ordinal) || w.Contains("more slowly", StringComparison.Ordinal) && !w.Contains("rather than sampling more slowly", StringComparison.Ordinal));
    }

    [Fact]
    public void Build_DesignWithAPrefilter_ExportsItsOwnCascadeThatCompilesStrictly()
    {
        // The exact PI on e^(−0.1s)/(s − 1) at −2 ± 2j with its zero −1.1605 cancelled by F = 1.1605/(s + 1.1605).
        var text = "format = 1\n[loop]\nplant = \"exp(-0.1s)/(s-1)\"\n[requirements]\ntarget = [-2.0, 2.0]\n[compensator]\ntype = \"pi\"\nprefilter = true\n";
        var (input, error) = CaseFileReader.Read(text, "pf.toml");
        Assert.Null(error);
        var report = DesignWorkflow.Run(input!).Report!;
        Assert.NotNull(report.Prefilter);
        var package = HandoffPackage.Build(report, new HandoffOptions { Name = "unst", SampleTime = 0.01 }, "pf").Value!;
        Assert.Contains("unst_prefilter.c", package.Files.Keys);
        Assert.Contains("unst_prefilter-vectors.csv", package.Files.Keys);
        Assert.Contains("its DC gain as stored 1 against F(0) = 1", package.SampleTimeNote, StringComparison.Ordinal);
        // Tustin of 1.1605/(s + 1.1605) at 10 ms: b0 = b1 = a·T/(2 + a·T), a1 = (a·T − 2)/(a·T + 2) (by hand).
        var a = 1.1605468118678277 * 0.01;
        var row = package.Files["unst_prefilter.c"].Split('\n').SkipWhile(l => !l.Contains("_b[", StringComparison.Ordinal)).Skip(1).First();
        var b0 = double.Parse(row.Trim().TrimStart('{').Split(',')[0], System.Globalization.CultureInfo.InvariantCulture);
        Tolerance.Close(a / (2 + a), b0, 1e-12, what: "b0 by hand");
        var main = "#include \"unst_prefilter.h\"\nint main(void)\n{\n    unst_prefilter_state s;\n    unst_prefilter_init(&s);\n    return unst_prefilter_step(&s, 1.0) > 0.0 ? 0 : 1;\n}\n";
        CCompiler.BuildAndRun(new Dictionary<string, string> { ["unst_prefilter.h"] = package.Files["unst_prefilter.h"], ["unst_prefilter.c"] = package.Files["unst_prefilter.c"], ["main.c"] = main });
    }

    [Fact]
    public void Build_ShortRatesFailInTwelveBits_UsesTheLongestValueThatMeetsNotTheShortest()
    {
        // In 12-bit coefficients the heater PID's sections meet at 0.01 s but not at the shortest values (the poles
        // crowd z = 1 beyond what 12 bits resolve): the package must not ship the shortest value tried, which fails.
        var (input, error) = CaseFileReader.ReadFile(Path.Combine(Repository.Root(), "cases", "heater-stage.toml"));
        Assert.Null(error);
        var report = DesignWorkflow.Run(input!).Report!;
        var package = HandoffPackage.Build(report, new HandoffOptions { Name = "heat", Format = NumberFormat.TryParse("fixed12")! }, "heater").Value!;
        var meeting = package.Ladder.Rungs.Where(r => r.Meets).Select(r => r.SampleTime).ToList();
        Assert.NotEmpty(meeting);
        Assert.Null(package.Ladder.Recommended);
        Assert.Equal(meeting.Max(), package.Sampled.SampleTime);
        Assert.True(package.SampledMeets);
        Assert.Contains("the longest value that meets", package.SampleTimeNote, StringComparison.Ordinal);
    }
}
