namespace CompAssist.Core.Search;

/// <summary>What the search minimizes among the designs that meet every requirement.</summary>
public enum SearchObjective
{
    /// <summary>The compensator's high-frequency gain |C(∞)|: how much sensor noise reaches the actuator (the default).</summary>
    HighFrequencyGain,

    /// <summary>The actuator's peak command for the reference step.</summary>
    ActuatorPeak,

    /// <summary>The sensitivity peak Ms (robustness: the inverse of the distance from L to −1).</summary>
    SensitivityPeak,

    /// <summary>The settling time in the required band.</summary>
    SettlingTime,
}
