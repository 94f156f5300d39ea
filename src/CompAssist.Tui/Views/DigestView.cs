using CompAssist.Core.Reporting;
using Terminal.Gui.ViewBase;

namespace CompAssist.Tui.Views;

/// <summary>The proof digest: short items, ✓ passes and ✗ fails, wrapped over the view's rows.</summary>
internal sealed class DigestView : View
{
    private readonly Palette palette;
    private IReadOnlyList<DigestItem> items = [];
    private string? note;

    public DigestView(Palette palette) => this.palette = palette;

    /// <summary>The last text drawn, rows joined by newlines (for tests).</summary>
    public string LastText { get; private set; } = string.Empty;

    public void Show(IReadOnlyList<DigestItem> next, string? leading = null)
    {
        items = next;
        note = leading;
        SetNeedsDraw();
    }

    protected override bool OnDrawingContent(DrawContext? context)
    {
        var width = Viewport.Width;
        var rows = new List<string>();
        var x = 0;
        var y = 0;
        var line = new System.Text.StringBuilder();
        Move(0, 0);
        if (note is not null)
        {
            SetAttribute(palette.Fail);
            AddStr(TextPage.Fit(note, width));
            rows.Add(note);
            y = 1;
            Move(0, y);
        }

        foreach (var item in items)
        {
            var mark = item.Passes switch { true => " ✓", false => " ✗", null => string.Empty };
            var text = item.Text.Length + mark.Length > width ? item.Text[..Math.Max(0, width - mark.Length - 1)] + "…" + mark : item.Text + mark;
            if (x > 0 && x + 2 + text.Length > width)
            {
                rows.Add(line.ToString());
                line.Clear();
                y++;
                x = 0;
                if (y >= Viewport.Height)
                {
                    break;
                }

                Move(0, y);
            }

            if (x > 0)
            {
                SetAttribute(palette.Normal);
                AddStr("  ");
                line.Append("  ");
                x += 2;
            }

            SetAttribute(item.Passes switch { true => palette.Pass, false => palette.Fail, null => palette.Normal });
            AddStr(text);
            line.Append(text);
            x += text.Length;
        }

        rows.Add(line.ToString());
        LastText = string.Join('\n', rows);
        return true;
    }
}
