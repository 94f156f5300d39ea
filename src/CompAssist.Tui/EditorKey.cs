using Terminal.Gui.Input;

namespace CompAssist.Tui;

/// <summary>
/// One key of the editor: the key, how the help screen writes it, where it works and what it does. The help
/// screen is generated from the same table the keys are dispatched from, so every key is listed.
/// </summary>
/// <param name="Keys">The keys that trigger it.</param>
/// <param name="Scope">Where the key works.</param>
/// <param name="What">What it does, in a few words.</param>
/// <param name="Label">How the help screen writes them, e.g. "Ctrl+Z"; empty for a key listed with the one before it.</param>
/// <param name="Action">What runs, given the key pressed.</param>
internal sealed record EditorKey(Key[] Keys, string Label, KeyScope Scope, string What, Action<Key> Action);
