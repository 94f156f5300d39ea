using System.Security.Cryptography;

namespace CompAssist.Core.Cases;

/// <summary>
/// The one safe writer for every file the tool writes (case saves, autosaves, plots, hand-off files): the
/// content goes to a temporary file with a random name beside the target, created exclusively (it fails if
/// anything — a file or a planted link — is there, and never follows a link), flushed to disk, given the
/// target's permission bits, then renamed over the target. A crash at any point leaves the old file or the
/// new one, never a half-written file. A target that is not a regular file (a FIFO, a device, a socket, a
/// directory) is refused. A link at the target is replaced, not followed — except for the case file the user
/// opened (the followLink argument), which is written to the link's final target, keeping the link.
/// </summary>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="content"/> (UTF-8, no byte-order mark) to <paramref name="path"/> atomically.</summary>
    /// <param name="path">The destination.</param>
    /// <param name="content">The text.</param>
    /// <param name="beforeRename">A test hook run after the flush and before the rename (to simulate an interruption).</param>
    /// <param name="followLink">Write through a link at <paramref name="path"/> to its target (the case file the user opened).</param>
    /// <exception cref="IOException">The file cannot be written, or the target is not a regular file; the old file is untouched.</exception>
    public static void Write(string path, string content, Action? beforeRename = null, bool followLink = false)
    {
        ArgumentNullException.ThrowIfNull(content);
        Write(path, new System.Text.UTF8Encoding(false).GetBytes(content), beforeRename, followLink);
    }

    /// <summary>Writes <paramref name="bytes"/> to <paramref name="path"/> atomically (see the class remarks).</summary>
    /// <exception cref="IOException">The file cannot be written, or the target is not a regular file; the old file is untouched.</exception>
    public static void Write(string path, byte[] bytes, Action? beforeRename = null, bool followLink = false)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        ArgumentNullException.ThrowIfNull(bytes);
        var target = followLink ? FinalTarget(path) : path;
        var kind = FileKind.Of(target);
        if (kind is FileKind.Kind.Directory or FileKind.Kind.Other)
        {
            throw new IOException($"{target} is not a regular file (a folder, a FIFO, a device or a socket); it is not replaced");
        }

        UnixFileMode? mode = kind == FileKind.Kind.Regular && !OperatingSystem.IsWindows() ? File.GetUnixFileMode(target) : null;
        var temporary = $"{target}.{Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(8))}.tmp";
        try
        {
            using (var stream = new FileStream(temporary, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                stream.Write(bytes);
                stream.Flush(flushToDisk: true);
            }

            if (mode is { } bits && !OperatingSystem.IsWindows())
            {
                File.SetUnixFileMode(temporary, bits);
            }

            beforeRename?.Invoke();
            File.Move(temporary, target, overwrite: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            TryDelete(temporary);
            throw;
        }
    }

    /// <summary>The temporary files an interrupted write would leave beside <paramref name="path"/> (for clean-up at start and tests).</summary>
    public static string[] LeftoversBeside(string path)
    {
        var folder = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
        return Directory.Exists(folder) ? Directory.GetFiles(folder, Path.GetFileName(path) + ".*.tmp") : [];
    }

    /// <summary>Removes the temporaries an interrupted write left beside <paramref name="path"/>; returns how many.</summary>
    public static int RemoveLeftovers(string path)
    {
        var removed = 0;
        foreach (var file in LeftoversBeside(path).Where(f => FileKind.Of(f) == FileKind.Kind.Regular))
        {
            removed += TryDelete(file) ? 1 : 0;
        }

        return removed;
    }

    private static string FinalTarget(string path)
    {
        var info = new FileInfo(path);
        return info.LinkTarget is null ? path : info.ResolveLinkTarget(returnFinalTarget: true)?.FullName ?? path;
    }

    private static bool TryDelete(string file)
    {
        try
        {
            File.Delete(file);
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The write already failed; a stray temporary file is the lesser problem.
            return false;
        }
    }
}
