using System.Numerics;

namespace CompAssist.Plotting.Tests;

/// <summary>The z-plane pole plot shows where the poles are, with the margin to the unit circle readable.</summary>
public class ZPlaneViewTests
{
    [Fact]
    public void ZPlaneView_FastSampling_ZoomsOnThePolesNearOneWithTheCircleInView()
    {
        // Poles of a loop sampled 200× faster than its bandwidth sit within a few hundredths of z = 1.
        Complex[] poles = [new(0.985, 0.012), new(0.985, -0.012), new(0.9, 0)];
        var (left, bottom, width) = PlotBuilder.ZPlaneView(poles, []);
        Assert.True(width < 0.3, $"width {width}");
        Assert.All(poles.Append(Complex.One), z => Assert.InRange(z.Real, left, left + width));
        Assert.All(poles, z => Assert.InRange(z.Imaginary, bottom, bottom + width));
        var model = PlotBuilder.ZPlanePoles("t", poles, [], 0.001);
        Assert.Contains("zoomed", model.Subtitle, StringComparison.Ordinal);
        Assert.Contains(model.Series, s => s.Title?.StartsWith("constant ζ", StringComparison.Ordinal) == true);
        Assert.Contains(model.Series, s => s.Title == "constant ωn·T");
    }

    [Fact]
    public void ZPlaneView_PolesSpreadOverTheDisc_ShowsTheWholeCircle()
    {
        var (left, bottom, width) = PlotBuilder.ZPlaneView([new Complex(-0.6, 0.5), new Complex(-0.6, -0.5), new Complex(0.7, 0)], []);
        Assert.Equal((-1.3, -1.3, 2.6), (left, bottom, width));
    }
}
