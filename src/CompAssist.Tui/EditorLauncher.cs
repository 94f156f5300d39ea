using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Pictures;
using System.Runtime.InteropServices;
using Terminal.Gui.App;

namespace CompAssist.Tui;

/// <summary>Opens the terminal editor on a case (or a new one) and returns when the user quits.</summary>
public static class EditorLauncher
{
    /// <summary>Exit code when the editor ran and the user quit.</summary>
    public const int Success = 0;

    /// <summary>Exit code when there is no terminal or the case cannot be read.</summary>
    public const int CannotStart = 2;

    /// <summary>
    /// Runs the editor. Refuses (with a message on <paramref name="stderr"/>) when standard input or output is
    /// not a terminal: the editor needs one, and without one it would wait forever.
    /// </summary>
    public static int Run(string? casePath, TextWriter stderr, HandoffWriter? handoffWriter, bool asciiPictures = false, bool noColour = false) =>
        Run(casePath, stderr, handoffWriter, asciiPictures, noColour, () => !Console.IsInputRedirected && !Console.IsOutputRedirected);

    /// <summary>As <see cref="Run(string?, TextWriter, HandoffWriter?, bool, bool)"/>, with the terminal check given.</summary>
    internal static int Run(string? casePath, TextWriter stderr, HandoffWriter? handoffWriter, bool asciiPictures, bool noColour, Func<bool> hasTerminal)
    {
        ArgumentNullException.ThrowIfNull(stderr);
        if (!hasTerminal())
        {
            stderr.WriteLine("error: the editor needs an interactive terminal (standard input and output are not one).");
            stderr.WriteLine("  Run it in a terminal or over ssh -t; for scripts use `compassist design CASE.toml` (add --json for programs).");
            return CannotStart;
        }

        var session = OpenSession(casePath, stderr);
        if (session is null)
        {
            return CannotStart;
        }

        var discarded = false;
        var palette = Palette.For(noColour || Palette.NoColourRequested(Environment.GetEnvironmentVariable));
        using (var app = Application.Create())
        {
            app.Init();
            var window = new EditorWindow(session, palette, new ThreadPoolSweepRunner(app), handoffWriter, asciiPictures ? PictureStyle.Ascii : PictureStyle.Unicode);
            app.Keyboard.KeyDown += window.OnApplicationKey;
            window.Timer = FrameTimer.Attach(app, Environment.GetEnvironmentVariable);
            window.StartAutosave(app, AutosaveInterval(Environment.GetEnvironmentVariable));
            if (AutosaveFiles.NewerThanCase(session.Path, session.WorkingDirectory) is { } autosave)
            {
                window.OfferAutosave(autosave);
            }

            // A dropped SSH session hangs up the editor: write the autosave at once (the timer may be up to a
            // second behind), then let the signal end the process as usual.
            // A terminate request from another shell quits the editor properly instead, so the terminal is restored.
            using var hangUp = PosixSignalRegistration.Create(PosixSignal.SIGHUP, _ => window.AutosaveFromSignal());
            using var terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, context =>
            {
                window.AutosaveFromSignal();
                context.Cancel = true;
                app.Invoke(() => app.RequestStop());
            });
            app.Run(window, window.ReportCrash);
            window.AutosaveNow();
            discarded = window.WorkDiscarded;
            session = window.Session;
            window.Dispose();
        }

        // Printed after the application is disposed: the alternate screen would swallow it.
        if (session.IsDirty && !discarded)
        {
            stderr.WriteLine($"unsaved work kept in {session.AutosavePath}");
        }

        return Success;
    }

    /// <summary>
    /// The autosave interval: one second, or <c>COMPASSIST_AUTOSAVE_SECONDS</c> when set (the terminal check
    /// lengthens it to show that a hang-up alone saves the work).
    /// </summary>
    internal static TimeSpan? AutosaveInterval(Func<string, string?> environment) =>
        double.TryParse(environment("COMPASSIST_AUTOSAVE_SECONDS"), System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out var seconds) && seconds > 0 && seconds < 86400
            ? TimeSpan.FromSeconds(seconds)
            : null;

    /// <summary>Reads the case (or starts a new one); null after printing why it cannot be read.</summary>
    internal static DesignSession? OpenSession(string? casePath, TextWriter stderr)
    {
        if (casePath is null)
        {
            return new DesignSession(new CaseFile { Name = "new case" }, null);
        }

        if (!File.Exists(casePath))
        {
            stderr.WriteLine($"error: {casePath} does not exist. Give an existing case file, or run `compassist edit` for a new case.");
            return null;
        }

        var (c, error) = CaseFileReader.ReadFile(casePath);
        if (c is null)
        {
            stderr.WriteLine($"error: {error}");
            return null;
        }

        // Temporaries that a killed save left beside the case are incomplete by construction: remove them, and say so.
        var removed = AtomicFile.RemoveLeftovers(casePath) + AtomicFile.RemoveLeftovers(AutosaveFiles.PathFor(casePath, Environment.CurrentDirectory));
        if (removed > 0)
        {
            stderr.WriteLine($"note: removed {removed} temporary file(s) left beside {casePath} by an interrupted save (the case itself is complete).");
        }

        return new DesignSession(c, casePath);
    }
}
