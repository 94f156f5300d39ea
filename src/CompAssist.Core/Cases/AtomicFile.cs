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
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(content);
        var temporary = path + ".tmp";
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
}
