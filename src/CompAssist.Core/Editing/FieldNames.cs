namespace CompAssist.Core.Editing;

/// <summary>The names of <see cref="CaseField"/> values as people read them (labels and status lines).</summary>
public static class FieldNames
{
    /// <summary>A short name, e.g. "G(s)" or "overshoot %".</summary>
    public static string Of(CaseField field) => field switch
    {
        CaseField.Plant => "G(s)",
        CaseField.Feedback => "H(s)",
        CaseField.Sign => "sign",
        CaseField.PadeOrder => "Padé order",
        CaseField.Overshoot => "overshoot %",
        CaseField.SettlingTime => "settling s",
        CaseField.Band => "band %",
        CaseField.PeakTime => "peak time s",
        CaseField.Zeta => "ζ",
        CaseField.NaturalFrequency => "ωn rad/s",
        CaseField.ErrorConstant => "steady state",
        CaseField.ActuatorLimit => "|u| limit",
        CaseField.Variations => "vary",
        CaseField.PlacementValue => "placement value",
        CaseField.RiseTime => "rise time s",
        CaseField.MinPhaseMargin => "phase margin °",
        CaseField.MinGainMargin => "gain margin dB",
        CaseField.MinDelayMargin => "delay margin s",
        CaseField.MaxSensitivity => "Ms",
        _ => throw new ArgumentOutOfRangeException(nameof(field), field, null),
    };
}
