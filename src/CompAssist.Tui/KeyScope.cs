namespace CompAssist.Tui;

/// <summary>Where an <see cref="EditorKey"/> works.</summary>
internal enum KeyScope
{
    /// <summary>Everywhere on the main screen, also while typing in a field.</summary>
    Anywhere,

    /// <summary>While the s-plane picture has the focus (plain letters there cannot clash with typing).</summary>
    SPlane,

    /// <summary>On the hand-off page.</summary>
    Handoff,
}
