using System.Diagnostics;
using System.Globalization;
using Terminal.Gui.App;

namespace CompAssist.Tui;

/// <summary>
/// Instrumented measurement for the benchmarks: when the environment variable <c>COMPASSIST_FRAME_TIMES</c>
/// names a file, the time from each key the editor handles to the end of the next completed layout-and-draw
/// (the frame written to the terminal) is appended to it in milliseconds, one line per key.
/// </summary>
internal sealed class FrameTimer
{
    private readonly string path;
    private long pressed;

    private FrameTimer(string path) => this.path = path;

    /// <summary>The timer the environment asks for, attached to the application, or null.</summary>
    public static FrameTimer? Attach(IApplication app, Func<string, string?> environment)
    {
        if (environment("COMPASSIST_FRAME_TIMES") is not { Length: > 0 } file)
        {
            return null;
        }

        var timer = new FrameTimer(file);
        app.LayoutAndDrawComplete += (_, _) => timer.FrameDone();
        return timer;
    }

    /// <summary>Marks a key press (the first one since the last frame counts).</summary>
    public void KeyHandled()
    {
        if (pressed == 0)
        {
            pressed = Stopwatch.GetTimestamp();
        }
    }

    private void FrameDone()
    {
        if (pressed == 0)
        {
            return;
        }

        var ms = Stopwatch.GetElapsedTime(pressed).TotalMilliseconds;
        pressed = 0;
        File.AppendAllText(path, ms.ToString("0.000", CultureInfo.InvariantCulture) + "\n");
    }
}
