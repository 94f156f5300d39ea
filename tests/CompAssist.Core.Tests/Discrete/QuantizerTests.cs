using CompAssist.Core.Discrete;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Discrete;

public class QuantizerTests
{
    private static (DiscreteTransferFunction D, System.Collections.Immutable.ImmutableArray<Section> S) Sampled(string c, double t)
    {
        var d = Discretizer.Discretize(ExpressionParser.Parse(c, false).Value!, t, DiscretizationMethod.Tustin).Value!.Discrete;
        return (d, SectionSplitter.Split(d));
    }

    [Fact]
    public void Product_OfSections_IsTheOriginal()
    {
        var (d, s) = Sampled("50(s^2+2s+26)/((s+1)(s+20)(s^2+8s+100))", 0.005);
        var back = Quantizer.Product(s, d.SampleTime);
        Tolerance.SameRoots(d.Poles, back.Poles, 1e-10);
        Tolerance.SameRoots(d.Zeros, back.Zeros, 1e-8);
        Tolerance.Close(d.DcGain, back.DcGain, 1e-9);
    }

    [Fact]
    public void Quantize_SlowLagFastRateShortWord_Warns()
    {
        // A lag with corners at 0.01 and 0.001 rad/s sampled at 10 kHz puts its pole at z ≈ 1 − 1e-7:
        // a 16-bit word cannot tell it from 1 (the classic trap, common practice).
        var (d, s) = Sampled("(s+0.01)/(s+0.001)", 1e-4);
        var report = Quantizer.Quantize(d, s, NumberFormat.Fixed(16));
        Assert.NotEmpty(report.Warnings);
        Assert.Contains(report.Warnings, w => w.Contains("UNIT CIRCLE", StringComparison.Ordinal) || w.Contains("DC GAIN", StringComparison.Ordinal));
        Assert.Contains("wider word", report.Warnings[0], StringComparison.Ordinal);
    }

    [Fact]
    public void Quantize_BenignLeadInLongWord_DoesNotWarn()
    {
        var (d, s) = Sampled("4.7(s+2.93)/(s+5.46)", 0.01);
        var report = Quantizer.Quantize(d, s, NumberFormat.Fixed(32));
        Assert.Empty(report.Warnings);
        Assert.True(report.LargestPoleShift < 1e-8);
        Assert.True(report.DcGainChangePercent < 1e-5);
    }

    [Fact]
    public void Store_FixedPoint_IsExactMultipleOfItsResolution()
    {
        var stored = Quantizer.Store(new Section(1.2345678, -0.5, 0.25, -1.9, 0.95), NumberFormat.Fixed(16));
        Assert.Equal(14, stored.FractionalBits);
        Assert.Equal(5, stored.Integers.Count);
        Tolerance.Close(stored.Integers[0] / 16384.0, stored.Section.B0, 1e-15);
        Assert.True(Math.Abs(stored.Section.B0 - 1.2345678) <= 0.5 / 16384);
    }

    [Theory]
    [InlineData("double", NumberFormatKind.Double, 0)]
    [InlineData("float", NumberFormatKind.Float, 0)]
    [InlineData("fixed16", NumberFormatKind.Fixed, 16)]
    [InlineData("q32", NumberFormatKind.Fixed, 32)]
    public void TryParse_Names(string text, NumberFormatKind kind, int bits)
    {
        var f = NumberFormat.TryParse(text)!;
        Assert.Equal(kind, f.Kind);
        Assert.Equal(bits, f.WordBits);
    }

    [Fact]
    public void TryParse_Bad_IsNull()
    {
        Assert.Null(NumberFormat.TryParse("fixed64"));
        Assert.Null(NumberFormat.TryParse("half"));
    }
}
