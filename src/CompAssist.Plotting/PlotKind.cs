namespace CompAssist.Plotting;

/// <summary>The pictures the tool exports.</summary>
public enum PlotKind
{
    /// <summary>Root locus with ζ and ωn guides, poles, zeros, the target and the designed closed-loop poles.</summary>
    Locus,

    /// <summary>Closed-loop pole–zero map with ζ guides.</summary>
    Poles,

    /// <summary>Step response of the output and the actuator command.</summary>
    Step,

    /// <summary>Frequency response of the loop (magnitude and phase) with the margins marked.</summary>
    Frequency,
}
