using Terminal.Gui.Drawing;
using TuiAttribute = Terminal.Gui.Drawing.Attribute;

namespace CompAssist.Tui;

/// <summary>
/// The editor's colours. With colour off (<c>NO_COLOR</c> set, or <c>--no-color</c>) every attribute uses the
/// terminal's own foreground and background, and emphasis is carried by reverse video and bold only.
/// </summary>
internal sealed class Palette
{
    private Palette(bool colour)
    {
        HasColour = colour;
        var plain = new TuiAttribute(Color.None, Color.None);
        Normal = plain;
        Bar = colour ? new TuiAttribute(ColorName16.Black, ColorName16.Cyan) : new TuiAttribute(Color.None, Color.None, TextStyle.Reverse);
        Heading = colour ? new TuiAttribute(ColorName16.Cyan, Color.None, TextStyle.Bold) : new TuiAttribute(Color.None, Color.None, TextStyle.Bold);
        Pass = colour ? new TuiAttribute(ColorName16.Green, Color.None) : plain;
        Fail = colour ? new TuiAttribute(ColorName16.BrightRed, Color.None, TextStyle.Bold) : new TuiAttribute(Color.None, Color.None, TextStyle.Bold);
        Info = colour ? new TuiAttribute(ColorName16.Gray, Color.None) : plain;
        Pole = colour ? new TuiAttribute(ColorName16.BrightRed, Color.None) : plain;
        Zero = colour ? new TuiAttribute(ColorName16.BrightBlue, Color.None) : plain;
        Target = colour ? new TuiAttribute(ColorName16.BrightYellow, Color.None, TextStyle.Bold) : new TuiAttribute(Color.None, Color.None, TextStyle.Bold);
        ClosedLoop = colour ? new TuiAttribute(ColorName16.BrightGreen, Color.None) : plain;
        Locus = colour ? new TuiAttribute(ColorName16.White, Color.None) : plain;
        Guide = colour ? new TuiAttribute(ColorName16.DarkGray, Color.None) : plain;
        var field = colour ? new TuiAttribute(ColorName16.White, ColorName16.DarkGray) : new TuiAttribute(Color.None, Color.None, TextStyle.Underline);
        var focus = colour ? new TuiAttribute(ColorName16.Black, ColorName16.BrightYellow) : new TuiAttribute(Color.None, Color.None, TextStyle.Reverse);
        Scheme = new Scheme(plain)
        {
            Normal = plain,
            Focus = focus,
            HotNormal = plain,
            HotFocus = focus,
            Editable = field,
            ReadOnly = plain,
            Active = focus,
            HotActive = focus,
            Highlight = focus,
            Disabled = colour ? new TuiAttribute(ColorName16.DarkGray, Color.None) : plain,
        };
    }

    /// <summary>False when colour is off.</summary>
    public bool HasColour { get; }

    /// <summary>Scheme for every view.</summary>
    public Scheme Scheme { get; }

    public TuiAttribute Normal { get; }

    public TuiAttribute Bar { get; }

    public TuiAttribute Heading { get; }

    public TuiAttribute Pass { get; }

    public TuiAttribute Fail { get; }

    public TuiAttribute Info { get; }

    public TuiAttribute Pole { get; }

    public TuiAttribute Zero { get; }

    public TuiAttribute Target { get; }

    public TuiAttribute ClosedLoop { get; }

    public TuiAttribute Locus { get; }

    public TuiAttribute Guide { get; }

    /// <summary>The palette for the environment: colour unless <c>NO_COLOR</c> is set to anything non-empty (no-color.org).</summary>
    public static Palette For(bool noColour) => new(!noColour);

    /// <summary>True when the <c>NO_COLOR</c> convention asks for no colour.</summary>
    public static bool NoColourRequested(Func<string, string?> environment) =>
        !string.IsNullOrEmpty(environment("NO_COLOR"));
}
