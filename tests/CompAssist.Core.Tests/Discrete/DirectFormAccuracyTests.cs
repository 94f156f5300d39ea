using CompAssist.Core.Discrete;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;
using CsCheck;

namespace CompAssist.Core.Tests.Discrete;

/// <summary>
/// A single direct form against cascaded sections: high order with slow corners at a fast rate crowds the poles
/// against z = 1, where the expanded coefficients lose the DC gain (Franklin, Powell and Workman, Digital Control of
/// Dynamic Systems, 3rd ed., chapter 13). DC gains are read by exact summation of the stored coefficients.
/// </summary>
public class DirectFormAccuracyTests
{
    private const string FifthOrder = "3 (s+0.15)(s+0.3)(s+0.7)(s+1.5)/((s+0.1)(s+0.2)(s+0.5)(s+1)(s+2))";

    [Theory]
    [InlineData(DiscretizationMethod.Tustin)]
    [InlineData(DiscretizationMethod.Zoh)]
    public void Of_FifthOrderAtHalfAMillisecond_DirectFormLosesTheDcGainSectionsKeepIt(DiscretizationMethod method)
    {
        var c = ExpressionParser.Parse(FifthOrder, false).Value!;
        var d = Discretizer.Discretize(c, 0.0005, method).Value!.Discrete;
        var accuracy = DirectFormAccuracy.Of(d, NumberFormat.Double);
        Tolerance.Close(c.DcGain, accuracy.DesignedDcGain, 1e-6, what: "C(z = 1) = C(s = 0) for both methods");
        Assert.True(accuracy.DirectLosesAccuracy, $"direct {accuracy.DirectDcGain} against {accuracy.DesignedDcGain}");
        Assert.True(accuracy.SectionsErrorPercent < 1e-4, $"sections {accuracy.SectionsErrorPercent} %");
    }

    [Fact]
    public void Of_LowOrderAtAModestRate_DirectFormIsFine()
    {
        var d = Discretizer.Discretize(ExpressionParser.Parse("4.7(s+2.93)/(s+5.46)", false).Value!, 0.01, DiscretizationMethod.Tustin).Value!.Discrete;
        var accuracy = DirectFormAccuracy.Of(d, NumberFormat.Float);
        Assert.False(accuracy.DirectLosesAccuracy);
        Assert.True(accuracy.DirectErrorPercent < 1e-4);
    }

    [Fact]
    public void ExactSum_AnyDoubles_EqualsTheSumOfTheirDecimalExpansions()
    {
        // 1e16 + 1 − 1e16 is 0 in floating point but 1 exactly; the exact sum is checked against decimal arithmetic
        // on values decimal holds exactly.
        Assert.Equal(1.0, ExactSum.Ratio(ExactSum.Of([1e16, 1.0, -1e16]), ExactSum.Of([1.0])));
        Gen.Int[-1_000_000, 1_000_000].Array[1, 20].Sample(ints =>
        {
            var values = ints.Select(i => i / 1024.0).ToArray();
            var expected = ints.Sum(i => (decimal)i) / 1024m;
            Assert.Equal((double)expected, ExactSum.Ratio(ExactSum.Of(values), ExactSum.Of([1.0])));
        });
    }
}
