namespace CompAssist.Core.Targets;

/// <summary>Which static error constant a steady-state requirement is about.</summary>
public enum ErrorConstantKind
{
    /// <summary>Kp = lim L(s): step tracking, error 1/(1 + Kp) for unity feedback.</summary>
    Position,

    /// <summary>Kv = lim s·L(s): ramp tracking, error 1/Kv.</summary>
    Velocity,

    /// <summary>Ka = lim s²·L(s): parabola tracking, error 1/Ka.</summary>
    Acceleration,
}
