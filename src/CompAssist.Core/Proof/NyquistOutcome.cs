namespace CompAssist.Core.Proof;

/// <summary>How a <see cref="NyquistCount"/> ended.</summary>
public enum NyquistOutcome
{
    /// <summary>The encirclements were counted; <see cref="NyquistResult.RightHalfPlaneRoots"/> holds.</summary>
    Counted,

    /// <summary>1 + L vanishes on the imaginary axis (to working precision): a closed-loop root sits on it.</summary>
    OnAxis,

    /// <summary>The count could not be completed (too many oscillations of the delay to follow, or a neutral loop).</summary>
    Indeterminate,
}
