namespace CompAssist.Core.Editing;

/// <summary>
/// Where autosaves live: beside the case as <c>NAME.autosave.toml</c> (a case file itself, so
/// <c>compassist design NAME.autosave.toml</c> reads it), or <c>untitled.autosave.toml</c> in the working
/// directory for a case never saved.
/// </summary>
public static class AutosaveFiles
{
    /// <summary>The suffix that marks an autosave.</summary>
    public const string Suffix = ".autosave.toml";

    /// <summary>The autosave path for a case path (null: a new case in <paramref name="workingDirectory"/>).</summary>
    public static string PathFor(string? casePath, string workingDirectory)
    {
        ArgumentNullException.ThrowIfNull(workingDirectory);
        if (casePath is null)
        {
            return Path.Combine(workingDirectory, "untitled" + Suffix);
        }

        var full = Path.GetFullPath(casePath);
        var name = Path.GetFileName(full);
        var stem = name.EndsWith(".toml", StringComparison.OrdinalIgnoreCase) ? name[..^5] : name;
        return Path.Combine(Path.GetDirectoryName(full) ?? workingDirectory, stem + Suffix);
    }

    /// <summary>An autosave newer than the case it belongs to (or any, for a new case), or null.</summary>
    public static string? NewerThanCase(string? casePath, string workingDirectory)
    {
        var autosave = PathFor(casePath, workingDirectory);
        if (!File.Exists(autosave))
        {
            return null;
        }

        return casePath is null || !File.Exists(casePath) || File.GetLastWriteTimeUtc(autosave) >= File.GetLastWriteTimeUtc(casePath) ? autosave : null;
    }

    /// <summary>Removes an autosave if it exists; false (with the file left) when it cannot be removed.</summary>
    public static bool Delete(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        try
        {
            File.Delete(path);
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return false;
        }
    }

    /// <summary>
    /// Moves an autosave aside as NAME.autosave-YYYYMMDD-HHMMSS.toml so that a new session's autosave cannot
    /// overwrite it; returns the new path, or null when it cannot be moved.
    /// </summary>
    public static string? KeepAside(string path, DateTime now)
    {
        ArgumentNullException.ThrowIfNull(path);
        var stem = path.EndsWith(Suffix, StringComparison.Ordinal) ? path[..^Suffix.Length] : path;
        var aside = stem + ".autosave-" + now.ToString("yyyyMMdd-HHmmss", System.Globalization.CultureInfo.InvariantCulture) + ".toml";
        try
        {
            File.Move(path, aside, overwrite: false);
            return aside;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }
}
