namespace CompAssist.Cli;

/// <summary>Writes a file so that a crash never leaves it half-written: temporary file, flush, rename.</summary>
internal static class AtomicFile
{
    public static void Write(string path, string content)
    {
        var temporary = path + ".tmp";
        using (var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None))
        using (var writer = new StreamWriter(stream))
        {
            writer.Write(content);
            writer.Flush();
            stream.Flush(flushToDisk: true);
        }

        File.Move(temporary, path, overwrite: true);
    }
}
