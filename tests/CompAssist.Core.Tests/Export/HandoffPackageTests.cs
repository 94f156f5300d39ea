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
}
