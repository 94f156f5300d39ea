using Terminal.Gui.ViewBase;

namespace CompAssist.Tui.Views;

/// <summary>A full-screen page of text (help, full report, hand-off) that scrolls with the arrow and page keys.</summary>
internal sealed class TextPage : View
{
    private readonly Palette palette;
    private string[] source = [];
    private string[] lines = [];
    private int wrappedFor = -1;
    private string heading = string.Empty;
    private string footer = string.Empty;

    public TextPage(Palette palette)
    {
        this.palette = palette;
        CanFocus = true;
        Visible = false;
    }

    /// <summary>First line shown.</summary>
    public int Top { get; private set; }

    /// <summary>The page's text as given (before wrapping).</summary>
    public string Content => string.Join('\n', source);

    /// <summary>What the page is (e.g. "help").</summary>
    public string Kind { get; private set; } = string.Empty;

    public void Open(string kind, string title, string text, string keys)
    {
        Kind = kind;
        heading = title;
        footer = keys;
        source = text.Replace("\r", string.Empty, StringComparison.Ordinal).Split('\n');
        wrappedFor = -1;
        Rewrap();
        Top = 0;
        Visible = true;
        SetFocus();
        SetNeedsDraw();
    }

    /// <summary>Replaces the text and keeps the scroll position.</summary>
    public void Refresh(string text)
    {
        source = text.Replace("\r", string.Empty, StringComparison.Ordinal).Split('\n');
        wrappedFor = -1;
        Rewrap();
        Top = Math.Clamp(Top, 0, Math.Max(0, lines.Length - Body));
        SetNeedsDraw();
    }

    public void Close()
    {
        Visible = false;
        Kind = string.Empty;
    }

    public void Scroll(int delta)
    {
        Top = Math.Clamp(Top + delta, 0, Math.Max(0, lines.Length - Body));
        SetNeedsDraw();
    }

    public int Body => Math.Max(1, Viewport.Height - 2);

    // Long lines wrap at the page width, continuing under their own indentation.
    private void Rewrap()
    {
        var width = Viewport.Width > 10 ? Viewport.Width : 80;
        if (width == wrappedFor)
        {
            return;
        }

        wrappedFor = width;
        lines = [.. source.SelectMany(line =>
        {
            if (line.Length <= width)
            {
                return [line];
            }

            var indent = new string(' ', line.Length - line.TrimStart().Length + 2);
            return Core.Reporting.TextWrap.Lines(line.Trim(), width - 1, line[..(line.Length - line.TrimStart().Length)], indent);
        })];
    }

    protected override bool OnDrawingContent(DrawContext? context)
    {
        Rewrap();
        var width = Viewport.Width;
        SetAttribute(palette.Bar);
        Move(0, 0);
        AddStr(Fit($" {heading}", width));
        SetAttribute(palette.Normal);
        for (var y = 0; y < Body; y++)
        {
            Move(0, y + 1);
            var i = Top + y;
            AddStr(Fit(i < lines.Length ? lines[i] : string.Empty, width));
        }

        SetAttribute(palette.Bar);
        Move(0, Viewport.Height - 1);
        var position = lines.Length > Body ? $"  lines {Top + 1}–{Math.Min(lines.Length, Top + Body)} of {lines.Length}" : string.Empty;
        AddStr(Fit($" {footer}{position}", width));
        return true;
    }

    internal static string Fit(string text, int width) =>
        text.Length >= width ? text[..Math.Max(0, width)] : text + new string(' ', width - text.Length);
}
