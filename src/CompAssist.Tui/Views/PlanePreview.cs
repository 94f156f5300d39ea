using System.Numerics;
using CompAssist.Core.Pictures;
using Terminal.Gui.ViewBase;

namespace CompAssist.Tui.Views;

/// <summary>
/// The s-plane picture: locus of the compensated loop, open-loop poles × and zeros ○, the designed closed-loop
/// poles, the target and its ζ/ωn guides. Focus it (F2) and the arrow keys move the target.
/// </summary>
internal sealed class PlanePreview : View
{
    private readonly Palette palette;
    private SPlaneScene scene = new();
    private PlaneView? frame;

    public PlanePreview(Palette palette)
    {
        this.palette = palette;
        CanFocus = true;
    }

    /// <summary>The part of the plane shown, or null before the first design.</summary>
    public PlaneView? Framing => frame;

    /// <summary>Characters or Unicode with braille locus.</summary>
    public PictureStyle Style { get; set; } = PictureStyle.Unicode;

    /// <summary>The last text drawn, row by row (for tests and the tmux check).</summary>
    public string LastPicture { get; private set; } = string.Empty;

    /// <summary>Shows a new scene; keeps the framing unless the target leaves it or <paramref name="reframe"/> is set.</summary>
    public void Show(SPlaneScene next, IEnumerable<Complex> context, bool reframe)
    {
        scene = next;
        // Always framed: the target and every unstable or slower-than-target closed-loop pole.
        var focus = PlaneView.MustShow(next.Target, next.ClosedLoopPoles).ToList();
        if (reframe || frame is null || !focus.All(z => Inside(frame, z)))
        {
            frame = PlaneView.Frame(focus, context);
        }

        SetNeedsDraw();
    }

    /// <summary>Zooms the framing about its centre (factor &gt; 1 zooms in).</summary>
    public void Zoom(double factor)
    {
        if (frame is not null)
        {
            frame = frame.Zoomed(factor);
            SetNeedsDraw();
        }
    }

    protected override bool OnDrawingContent(DrawContext? context)
    {
        var width = Viewport.Width;
        var height = Viewport.Height;
        if (frame is null || width < 8 || height < 3)
        {
            Move(0, 0);
            SetAttribute(palette.Info);
            AddStr("no design yet");
            LastPicture = string.Empty;
            return true;
        }

        LastPicture = SPlaneRenderer.Render(scene, frame, width, height, Style);
        var rows = LastPicture.Split('\n');
        for (var y = 0; y < height && y < rows.Length; y++)
        {
            Move(0, y);
            foreach (var rune in rows[y].EnumerateRunes())
            {
                SetAttribute(AttributeOf(rune.Value));
                AddRune(rune);
            }
        }

        return true;
    }

    private Terminal.Gui.Drawing.Attribute AttributeOf(int ch) => ch switch
    {
        '×' or 'x' => palette.Pole,
        '○' or 'o' => palette.Zero,
        '◆' or '*' => palette.Target,
        '■' or '#' => palette.ClosedLoop,
        >= 0x2800 and <= 0x28FF or '.' => palette.Locus,
        _ => palette.Guide,
    };

    private static bool Inside(PlaneView view, Complex z)
    {
        var marginX = 0.05 * (view.Right - view.Left);
        var marginY = 0.05 * 2 * view.ImaginaryHalfHeight;
        return z.Real > view.Left + marginX && z.Real < view.Right - marginX && Math.Abs(z.Imaginary) < view.ImaginaryHalfHeight - marginY;
    }
}
