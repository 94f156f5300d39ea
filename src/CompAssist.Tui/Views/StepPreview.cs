using CompAssist.Core.Pictures;
using CompAssist.Core.Simulation;
using Terminal.Gui.ViewBase;

namespace CompAssist.Tui.Views;

/// <summary>The simulated closed-loop step of the design as a text strip.</summary>
internal sealed class StepPreview : View
{
    private readonly Palette palette;
    private SampledResponse? response;
    private double finalValue;

    public StepPreview(Palette palette) => this.palette = palette;

    public PictureStyle Style { get; set; } = PictureStyle.Unicode;

    /// <summary>The last text drawn (for tests).</summary>
    public string LastPicture { get; private set; } = string.Empty;

    public void Show(SampledResponse? next, double final)
    {
        response = next;
        finalValue = final;
        SetNeedsDraw();
    }

    protected override bool OnDrawingContent(DrawContext? context)
    {
        if (response is null || Viewport.Width < 10 || Viewport.Height < 2)
        {
            LastPicture = string.Empty;
            return true;
        }

        LastPicture = StepStripRenderer.Render(response, finalValue, Viewport.Width, Viewport.Height, Style);
        var rows = LastPicture.Split('\n');
        SetAttribute(palette.Locus);
        for (var y = 0; y < Viewport.Height && y < rows.Length; y++)
        {
            Move(0, y);
            AddStr(rows[y]);
        }

        return true;
    }
}
