using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Reliability;

/// <summary>
/// Every malformed or borderline input gets a positioned, readable error or a correct result — never an
/// unhandled exception. The CI run tries 5,000 expressions and 2,000 case files; the documented long run
/// (docs/reliability.md) uses the same generator through the benchmark project's --fuzz mode.
/// </summary>
public class InputFuzzTests
{
    /// <summary>Checks one expression; returns true when it parsed.</summary>
    internal static bool CheckExpression(string input)
    {
        var result = ExpressionParser.Parse(input, requireProper: false);
        if (result.IsSuccess)
        {
            var tf = result.Value;
            Assert.True(double.IsFinite(tf.Gain) && tf.Gain != 0, $"bad gain for '{input}'");
            Assert.All(tf.Zeros.Concat(tf.Poles), r => Assert.True(double.IsFinite(r.Real) && double.IsFinite(r.Imaginary), $"non-finite root for '{input}'"));
            return true;
        }

        var e = result.Error;
        Assert.False(string.IsNullOrWhiteSpace(e.Message), $"empty message for '{input}'");
        Assert.False(string.IsNullOrWhiteSpace(e.Hint), $"empty hint for '{input}'");
        Assert.InRange(e.Index, 0, input.Length);
        Assert.True(e.Length >= 1, $"zero-length span for '{input}'");
        Assert.Equal(input, e.Input);
        Assert.Contains("^", e.Render(), StringComparison.Ordinal);
        return false;
    }

    /// <summary>5,000 in CI; the long run sets COMPASSIST_FUZZ_COUNT (docs/reliability.md).</summary>
    private static int FuzzCount =>
        int.TryParse(Environment.GetEnvironmentVariable("COMPASSIST_FUZZ_COUNT"), out var n) && n > 0 ? n : 5000;

    [Fact]
    public void Parse_FuzzedExpressions_NeverThrow()
    {
        var fuzzer = new InputFuzzer(2026);
        var parsed = 0;
        var count = FuzzCount;
        for (var i = 0; i < count; i++)
        {
            if (CheckExpression(fuzzer.Next()))
            {
                parsed++;
            }
        }

        // The generator must produce both kinds, or it is not testing anything.
        Assert.InRange(parsed, count / 20, count - (count / 20));
    }

    [Fact]
    public void Design_FuzzedPlants_ProvedOrRefusedNeverThrow()
    {
        var fuzzer = new InputFuzzer(7);
        for (var i = 0; i < 500; i++)
        {
            var run = DesignWorkflow.Run(new CaseFile { Plant = fuzzer.Next(), Requirements = new CompAssist.Core.Targets.Requirements { Zeta = 0.5, NaturalFrequency = 2 } });
            Assert.True(run.IsSuccess || run.FieldError is not null || run.Problem is not null);
            if (run.IsSuccess)
            {
                Assert.True(run.Report!.Proof.TargetConfirmed || run.Report.Proof.Warnings.Any(w => w.Contains("NOT confirmed", StringComparison.Ordinal)));
            }
        }
    }

    [Fact]
    public void Search_FuzzedPlantsAndRequirements_ReportOrProblemNeverThrow()
    {
        // The search capped at 50 candidates (so that it stays fast) over fuzzed plants and requirements,
        // contradictory and extreme ones included; a verdict must agree with its own rows.
        var fuzzer = new InputFuzzer(int.Parse(Environment.GetEnvironmentVariable("COMPASSIST_FUZZ_SEED") ?? "11", System.Globalization.CultureInfo.InvariantCulture));
        var random = new Random(5);
        double[] overshoots = [0.001, 1, 10, 40, 99.9];
        double[] times = [1e-6, 0.01, 1, 30, 1e6];
        int designed = 0, answered = 0;
        for (var i = 0; i < 150; i++)
        {
            var requirements = new CompAssist.Core.Targets.Requirements
            {
                MaxOvershootPercent = overshoots[random.Next(overshoots.Length)],
                MaxSettlingTime = times[random.Next(times.Length)],
                MinPhaseMarginDegrees = random.NextDouble() < 0.3 ? 45 : null,
            };
            var input = new CaseFile { Plant = i % 3 == 0 ? "4/(s(s+2))" : fuzzer.Next(), Requirements = requirements, CompensatorType = DesignWorkflow.SupportedTypes[random.Next(DesignWorkflow.SupportedTypes.Count)] };
            var run = DesignWorkflow.Search(input, new CompAssist.Core.Search.SearchOptions { MaxCandidates = 50 });
            if (run.IsSuccess)
            {
                designed++;
                var verdict = run.Report!.Verdict;
                Assert.Equal(run.Report.Check.Stable && run.Report.Check.Checks.All(c => c.Passes != false), verdict.Meets);
            }
            else
            {
                answered++;
                Assert.True(run.FieldError is not null || !string.IsNullOrWhiteSpace(run.Problem?.Hint));
            }
        }

        // Both outcomes must occur, or the generator is not testing the search.
        Assert.True(designed > 10 && answered > 10, $"designed {designed}, answered {answered}");
    }

    [Fact]
    public void Read_TwoThousandMutatedCaseFiles_NeverThrow()
    {
        const string valid = "format = 1\nname = \"x\"\n[loop]\nplant = \"4/(s(s+2))\"\nfeedback = \"1\"\nsign = \"negative\"\n[requirements]\novershoot_percent = 10\nsettling_time = 2\n[compensator]\ntype = \"lead\"\nplacement = \"bisector\"\n[check]\nvary = [\"gain=20%\"]\n";
        var random = new Random(99);
        var noise = "=[]\"\n#.,-1234567890abcxyz \u00E9\u2212{}".ToCharArray();
        for (var i = 0; i < 2000; i++)
        {
            var chars = valid.ToCharArray().ToList();
            for (var m = random.Next(1, 6); m > 0; m--)
            {
                var at = random.Next(chars.Count);
                switch (random.Next(3))
                {
                    case 0:
                        chars.Insert(at, noise[random.Next(noise.Length)]);
                        break;
                    case 1:
                        chars.RemoveAt(at);
                        break;
                    default:
                        chars[at] = noise[random.Next(noise.Length)];
                        break;
                }
            }

            var (c, error) = CaseFileReader.Read(new string([.. chars]), "fuzz.toml");
            Assert.True((c is null) != (error is null));
            if (error is not null)
            {
                Assert.False(string.IsNullOrWhiteSpace(error.Message));
            }
        }
    }

    public static TheoryData<string> Borderline() => new()
    {
        "1e12/(s+1e-12)", "1/(s+1e8)", "1/s^40", "(s+1)^40/(s+2)^40", "s^40/s^40", "1/(s-s+1)", "0*s+1",
        "exp(-0*s)", "exp(0)", "exp(-1e12 s)", "1/(1e-12 s + 1)", "\u22121/(s+1)", "((((((((((s))))))))))",
        new string('s', 5000), "1/" + string.Concat(Enumerable.Repeat("(s+1)", 41)),
    };

    [Theory]
    [MemberData(nameof(Borderline))]
    public void Parse_Borderline_ErrorOrCorrect(string input)
    {
        if (CheckExpression(input))
        {
            var tf = ExpressionParser.Parse(input, requireProper: false).Value!;
            Assert.True(tf.Zeros.Length <= ExpressionParser.MaxOrder && tf.Poles.Length <= ExpressionParser.MaxOrder);
        }
    }

    [Fact]
    public void Loop_FromParsedBorderline_NoUnhandledException()
    {
        var tf = ExpressionParser.ParseProper("(s+1)^20/((s+1.0000001)^20 (s+3))").Value!;
        var loop = Loop.Create(tf);
        Assert.Equal(21, loop.Plant.Poles.Length);
    }
}
