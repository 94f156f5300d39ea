namespace CompAssist.Core.Model;

/// <summary>The sign with which the measured output is fed back.</summary>
public enum FeedbackSign
{
    /// <summary>e = r − H·y; characteristic equation 1 + C·G·H = 0; the 180° locus.</summary>
    Negative,

    /// <summary>e = r + H·y; characteristic equation 1 − C·G·H = 0; the 0° locus.</summary>
    Positive,
}
