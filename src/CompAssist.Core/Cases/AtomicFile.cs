namespace CompAssist.Core.Cases;

/// <summary>
/// Writes a file so that a crash or an error at any point leaves either the old file or the new one, never a
/// half-written file: the content goes to a temporary file beside it, is flushed to disk, then renamed over.
/// </summary>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="content"/> to <paramref name="path"/> atomically.</summary>
    /// <param name="path">The destination.</param>
    /// <param name="content">The text (UTF-8, no byte-order mark).</param>
    /// <param name="beforeRename">A test hook run after the flush and before the rename (to simulate an interruption).</param>
    /// <exception cref="IOException">The file cannot be written; the old file is untouched.</exception>
    public static void Write(string path, string content, Action? beforeRename = null)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        ArgumentNullException.ThrowIfNull(content);

        // A name of its own for every write, so that two writers (a timer and a signal handler, say) never share
        // a temporary file.
        var temporary = $"{path}.{Environment.ProcessId}-{Interlocked.Increment(ref writes)}.tmp";
        try
        {
            using (var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None))
            using (var writer = new StreamWriter(stream, new System.Text.UTF8Encoding(false)))
            {
                writer.Write(content);
                writer.Flush();
                stream.Flush(flushToDisk: true);
            }

            beforeRename?.Invoke();
            File.Move(temporary, path, overwrite: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            TryDelete(temporary);
            throw;
        }
    }

    /// <summary>The temporary files this class would leave beside <paramref name="path"/> if interrupted (for tests and clean-up).</summary>
    public static string[] LeftoversBeside(string path)
    {
        var folder = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
        return Directory.GetFiles(folder, Path.GetFileName(path) + ".*.tmp");
    }

    private static long writes;

    private static void TryDelete(string file)
    {
        try
        {
            File.Delete(file);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The write already failed; a stray temporary file is the lesser problem.
        }
    }
}
