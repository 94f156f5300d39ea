using System.Numerics;
using CompAssist.Core.Editing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Editing;

public class TargetTextTests
{
    [Theory]
    [InlineData("-2, 3.5", -2.0, 3.5)]
    [InlineData("-2 + 3.5j", -2.0, 3.5)]
    [InlineData("-2 ± 3.5j", -2.0, 3.5)]
    [InlineData("-2-3.5i", -2.0, 3.5)]
    [InlineData(" -5 ", -5.0, 0.0)]
    [InlineData("-1e1, 2e0", -10.0, 2.0)]
    public void Parse_PointForms_GiveTheUpperHalfPlanePoint(string text, double re, double im)
    {
        var (point, error) = TargetText.Parse(text);
        Assert.Null(error);
        Tolerance.Close(new Complex(re, im), point!.Value, 1e-15);
    }

    [Fact]
    public void Parse_DampingAndFrequency_GivesMinusZetaWnPlusJWnSqrtOneMinusZetaSquared()
    {
        // s = −ζωn ± jωn√(1−ζ²) (common practice).
        var (point, error) = TargetText.Parse("zeta=0.5 wn=4");
        Assert.Null(error);
        Tolerance.Close(new Complex(-2.0, 4 * Math.Sqrt(0.75)), point!.Value, 1e-15);
        Assert.NotNull(TargetText.Parse("ζ=0.6, ωn=5").Point);
    }

    [Fact]
    public void Parse_Letter_PointsAtIt()
    {
        var (_, error) = TargetText.Parse("-2, 3q");
        Assert.Equal(5, error!.Index);
    }

    [Theory]
    [InlineData("")]
    [InlineData("zeta=1.5 wn=4")]
    [InlineData("-2,,3")]
    [InlineData("1e999, 1")]
    [InlineData("zeta=0.5 wn=1e400")]
    public void Parse_Invalid_GivesAnError(string text) => Assert.NotNull(TargetText.Parse(text).Error);
}
