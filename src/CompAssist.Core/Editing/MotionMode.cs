namespace CompAssist.Core.Editing;

/// <summary>How the arrow keys move the target pole.</summary>
public enum MotionMode
{
    /// <summary>Left/right change the real part σ, up/down the damped frequency ωd.</summary>
    RealImaginary,

    /// <summary>Left/right move along the constant-ζ ray (change ωn), up/down along the constant-ωn arc (change ζ).</summary>
    DampingFrequency,
}
