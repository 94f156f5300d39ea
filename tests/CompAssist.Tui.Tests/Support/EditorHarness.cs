using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Pictures;
using Terminal.Gui.App;
using Terminal.Gui.Input;
using Terminal.Gui.Testing;
using Terminal.Gui.Time;

namespace CompAssist.Tui.Tests.Support;

/// <summary>The editor on the ANSI driver with virtual time and no terminal: inject keys, read the screen.</summary>
internal sealed class EditorHarness : IDisposable
{
    private readonly IApplication app;

    public EditorHarness(DesignSession session, int width = 80, int height = 24, bool noColour = false, HandoffWriter? writer = null)
    {
        app = Application.Create(new VirtualTimeProvider());
        app.Init("ansi");
        app.Driver!.SetScreenSize(width, height);
        Sweeps = new InlineSweepRunner();
        Window = new EditorWindow(session, Palette.For(noColour), Sweeps, writer, PictureStyle.Unicode);
        app.Keyboard.KeyDown += Window.OnApplicationKey;
        app.Begin(Window);
        app.LayoutAndDraw(true);
    }

    public EditorWindow Window { get; }

    public InlineSweepRunner Sweeps { get; }

    public IApplication App => app;

    public DesignSession Session => Window.Session;

    public static DesignSession Demo(string folder, string name = "belt-axis.toml")
    {
        var path = Path.Combine(folder, name);
        File.Copy(Path.Combine(Repository.Root(), "cases", name), path, overwrite: true);
        var (c, error) = CaseFileReader.ReadFile(path);
        Assert.Null(error);
        return new DesignSession(c!, path, folder);
    }

    public void Press(params Key[] keys)
    {
        foreach (var k in keys)
        {
            app.InjectKey(k);
        }

        app.LayoutAndDraw(true);
    }

    public void Type(string text)
    {
        foreach (var ch in text)
        {
            app.InjectKey(new Key(ch));
        }

        app.LayoutAndDraw(true);
    }

    public string Screen()
    {
        app.LayoutAndDraw(true);
        return app.Driver!.ToString()!;
    }

    public string Ansi()
    {
        app.LayoutAndDraw(true);
        return app.Driver!.ToAnsi();
    }

    public void Dispose()
    {
        Window.Dispose();
        app.Dispose();
    }
}
