namespace CompAssist.Core.Pictures;

/// <summary>Character sets for text pictures.</summary>
public enum PictureStyle
{
    /// <summary>Plain 7-bit ASCII: x poles, o zeros, # closed-loop poles, * target, . locus.</summary>
    Ascii,

    /// <summary>Unicode: × poles, ○ zeros, ■ closed-loop poles, ◆ target, braille dots for the locus (2×4 per cell).</summary>
    Unicode,
}
