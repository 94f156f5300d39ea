using System.Globalization;
using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Pictures;
using CompAssist.Core.Targets;
using CompAssist.Tui;
using Terminal.Gui.App;
using Terminal.Gui.Input;
using Terminal.Gui.Time;

namespace CompAssist.Benchmarks;

/// <summary>
/// The editor at 80×24 on the ANSI driver with no terminal attached, holding a benchmark loop. One
/// <see cref="KeyToFrame"/> is what a key press costs from the application's key event on: the editor's key
/// table, the redesign and re-proof, the views updated, and the layout and draw the main loop then does (every
/// view that changed, which after a move is nearly the whole screen). Parsing the terminal's input bytes and
/// writing the frame out to the terminal are not included.
/// </summary>
public sealed class EditorFrame : IDisposable
{
    private readonly IApplication app;
    private readonly EditorWindow window;
    private bool left;

    public EditorFrame(int order)
    {
        Environment.SetEnvironmentVariable("DisableRealDriverIO", "1");
        var c = CaseOf(order);
        app = Application.Create(new VirtualTimeProvider());
        app.Init("ansi");
        app.Driver!.SetScreenSize(80, 24);
        window = new EditorWindow(new DesignSession(c, null, Path.GetTempPath()), Palette.For(noColour: false), null, null, PictureStyle.Unicode);
        app.Keyboard.KeyDown += window.OnApplicationKey;
        app.Begin(window);
        window.FocusStart();
        app.LayoutAndDraw(true);
        var revision = window.Session.Revision;
        KeyToFrame();
        if (!window.Session.Latest.IsSuccess || window.Session.Revision == revision || !Screen().Contains("C(s) = ", StringComparison.Ordinal))
        {
            throw new InvalidOperationException("The benchmark key press did not redesign: " + window.Session.Status);
        }
    }

    /// <summary>One arrow key (alternating left and right, so the target stays put on average) and the finished frame.</summary>
    public object KeyToFrame()
    {
        left = !left;
        app.Keyboard.RaiseKeyDownEvent(left ? Key.CursorLeft : Key.CursorRight);
        app.LayoutAndDraw(false);
        return window.Session.Revision;
    }

    /// <summary>The session's part of a key press alone (redesign and re-proof through the workflow), without drawing.</summary>
    public object SessionMove()
    {
        left = !left;
        window.Session.MoveTarget(left ? MoveDirection.Left : MoveDirection.Right);
        return window.Session.Revision;
    }

    /// <summary>Drawing alone: a forced layout and draw of the whole screen with nothing changed.</summary>
    public object DrawOnly()
    {
        app.LayoutAndDraw(true);
        return window;
    }

    /// <summary>The screen as text (to check the frame is the editor's).</summary>
    public string Screen() => app.Driver!.ToString()!;

    public void Dispose()
    {
        window.Dispose();
        app.Dispose();
    }

    /// <summary>The benchmark loop of this order as a case, the target given as a point.</summary>
    public static CaseFile CaseOf(int order)
    {
        var loop = BenchmarkLoop.OfOrder(order);
        return new CaseFile
        {
            Name = $"benchmark loop of order {order}",
            Plant = PlantText(loop),
            Requirements = new Requirements { Point = loop.Target.Point },
        };
    }

    private static string PlantText(BenchmarkLoop loop)
    {
        var g = loop.Loop.Plant;
        string R(double x) => x.ToString("R", CultureInfo.InvariantCulture);
        var num = string.Concat(g.Zeros.Select(z => $"(s+{R(-z.Real)})"));
        var den = new List<string>();
        foreach (var p in g.Poles.Where(p => p.Imaginary >= 0))
        {
            den.Add(p.Imaginary == 0 ? $"(s+{R(-p.Real)})" : $"(s^2+{R(-2 * p.Real)}*s+{R((p * Complex.Conjugate(p)).Real)})");
        }

        return $"{R(g.Gain)}*{num}/({string.Join(string.Empty, den)})";
    }
}
