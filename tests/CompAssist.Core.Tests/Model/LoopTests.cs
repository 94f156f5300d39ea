using CompAssist.Core.Model;
using CompAssist.Core.Parsing;

namespace CompAssist.Core.Tests.Model;

public class LoopTests
{
    private static TransferFunction Parsed(string text) => ExpressionParser.Parse(text, false).Value!;

    [Theory]
    [InlineData("(s+1)/(s+2)", "-1", FeedbackSign.Negative, true)]
    [InlineData("(s+1)/(s+2)", "1", FeedbackSign.Positive, true)]
    [InlineData("(s+1)/(s+2)", "-0.999", FeedbackSign.Negative, false)]
    [InlineData("(s+1)/(s+2)", "1", FeedbackSign.Negative, false)]
    [InlineData("1/(s+2)", "-1", FeedbackSign.Negative, false)]
    [InlineData("2(s+3)/(s+1)", "-0.5", FeedbackSign.Negative, true)]
    [InlineData("exp(-s)", "1", FeedbackSign.Negative, true)]
    [InlineData("exp(-s)", "-1", FeedbackSign.Negative, true)]
    [InlineData("exp(-s)", "0.5", FeedbackSign.Negative, false)]
    [InlineData("exp(-s)/(s+1)", "10", FeedbackSign.Negative, false)]
    public void WellPosednessProblem_UnitGainAtInfinity_Named(string plant, string compensator, FeedbackSign sign, bool expected)
    {
        // Without a delay, 1 + L(∞) = 0 drops the leading term of the characteristic polynomial; with a delay,
        // |L(∞)| = 1 puts a chain of roots on the imaginary axis asymptotically (common practice: well-posedness
        // of a feedback loop; neutral delay equations).
        var loop = Loop.Create(Parsed(plant), null, sign);
        Assert.Equal(expected, loop.WellPosednessProblem(Parsed(compensator)) is not null);
    }

    [Fact]
    public void SignedGainAtInfinity_BiproperAndStrictlyProper_HighFrequencyGainWithSign()
    {
        Assert.Equal(-3.0, Loop.Create(Parsed("3(s+1)/(s+2)"), null, FeedbackSign.Positive).SignedGainAtInfinity(Parsed("1")), 12);
        Assert.Equal(0.0, Loop.Create(Parsed("3/(s+2)")).SignedGainAtInfinity(Parsed("(s+1)/(s+5)")));
    }
}
