using System.Numerics;
using CompAssist.Core.Pictures;

namespace CompAssist.Core.Tests.Pictures;

public class SPlaneRendererTests
{
    [Fact]
    public void Render_AsciiPolesZeroAndTarget_ExactText()
    {
        var scene = new SPlaneScene
        {
            Poles = [new Complex(-2, 0), new Complex(0, 0)],
            Zeros = [new Complex(-1, 0)],
            Target = new Complex(-1, 1),
        };
        var text = SPlaneRenderer.Render(scene, new PlaneView(-3, 1, 2), 28, 7, PictureStyle.Ascii);
        // 20 plot columns over −3…1 (5 per unit, the imaginary axis in column 15); 5 rows over −2…2.
        var expected = string.Join('\n',
            "     2 |               |",
            "       |          *    |",
            "     0 |-----x----o----x----",
            "       |          *    |",
            "    -2 |               |",
            "        -3                 1",
            "        x pole  o zero  # closed-loop pole  * target  . locus",
            string.Empty);
        Assert.Equal(expected, text);
    }

    [Fact]
    public void Render_AsciiBranchOverAxis_DrawsOverTheAxis()
    {
        var scene = new SPlaneScene { Branches = [[new Complex(-2.5, 0), new Complex(-0.5, 0)]] };
        var text = SPlaneRenderer.Render(scene, new PlaneView(-3, 1, 2), 28, 7, PictureStyle.Ascii);
        var axis = text.Split('\n')[2];
        Assert.Contains("=====", axis, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_Unicode_UsesBrailleAndMarkers()
    {
        var scene = new SPlaneScene
        {
            Branches = [[new Complex(-2, 1), new Complex(-1, 1.5)]],
            Poles = [new Complex(-2, 0)],
            ClosedLoopPoles = [new Complex(-1, 0.5)],
            ZetaGuide = 0.5,
        };
        var text = SPlaneRenderer.Render(scene, new PlaneView(-3, 1, 2), 40, 12, PictureStyle.Unicode);
        Assert.Contains('×', text);
        Assert.Contains('■', text);
        Assert.Contains(text, ch => ch >= '\u2801' && ch <= '\u28FF');
        Assert.Contains("ζ=0.5", text, StringComparison.Ordinal);
        Assert.All(text.Split('\n'), line => Assert.True(line.Length <= 80, line));
    }

    [Fact]
    public void Frame_IncludesTargetAndNearbyPolesAndTheImaginaryAxis()
    {
        var view = PlaneView.Frame([new Complex(-2, 3)], [new Complex(-1, 0), new Complex(-500, 0)]);
        Assert.True(view.Left < -2 && view.Right > 0 && view.ImaginaryHalfHeight > 3);
        Assert.True(view.Left > -100, "a far pole does not squash the picture");
    }
}
