namespace CompAssist.Core.Common;

/// <summary>
/// Why a request cannot be met as asked, and what to change. Returned (not thrown) for user-level
/// problems: an impossible target, an unreachable angle, an unwise cancellation.
/// </summary>
/// <param name="Message">What is wrong.</param>
/// <param name="Hint">What to change, naming the setting (never a flag or a file key).</param>
/// <param name="About">The setting to change, when there is one: front ends say where to change it.</param>
public sealed record Problem(string Message, string Hint, Setting? About = null)
{
    /// <summary>"message. hint" on one line.</summary>
    public override string ToString() => $"{Message}. {Hint}";
}
