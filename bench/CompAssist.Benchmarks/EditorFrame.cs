using System.Globalization;
using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Pictures;
using CompAssist.Core.Targets;
using CompAssist.Tui;
using Terminal.Gui.App;
using Terminal.Gui.Input;
using Terminal.Gui.Testing;
using Terminal.Gui.Time;

namespace CompAssist.Benchmarks;

/// <summary>
/// The editor at 80×24 on the ANSI driver with no terminal attached, holding a benchmark loop. One
/// <see cref="KeyToFrame"/> is what a key press costs: the arrow key through the editor's key table, the
/// redesign and re-proof, and a complete layout and draw of every view into the screen buffer (forced, so an
/// upper bound on a real frame). Writing the frame to a terminal is not included.
/// </summary>
public sealed class EditorFrame : IDisposable
{
    private readonly IApplication app;
    private readonly EditorWindow window;
    private bool left;

    public EditorFrame(int order)
    {
        Environment.SetEnvironmentVariable("DisableRealDriverIO", "1");
        var loop = BenchmarkLoop.OfOrder(order);
        var c = new CaseFile
        {
            Name = $"benchmark order {order}",
            Plant = PlantText(loop),
            Requirements = new Requirements { Point = loop.Target.Point },
        };
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
        app.InjectKey(left ? Key.CursorLeft : Key.CursorRight);
        app.LayoutAndDraw(true);
        return window.Session.Revision;
    }

    /// <summary>The screen as text (to check the frame is the editor's).</summary>
    public string Screen() => app.Driver!.ToString()!;

    public void Dispose()
    {
        window.Dispose();
        app.Dispose();
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
