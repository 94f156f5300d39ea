using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Export;

/// <summary>
/// A sampled PID as firmware runs it (common practice, e.g. Åström and Murray, Feedback Systems, section 10.5):
/// proportional on the error, integral by forward accumulation Ki·T·e, derivative on the measurement (no kick
/// on reference steps) through the first-order filter Tf by backward difference, output clamped to
/// [UMin, UMax], and anti-windup by clamping or back-calculation. Positional form; the incremental form computes
/// the same output as the clamped sum of its increments. A non-finite reference or measurement (a failed sensor
/// read) leaves every state as it was, returns the last output and sets <see cref="Fault"/>.
/// </summary>
public sealed class PidImplementation
{
    private double _integral;
    private double _derivative;
    private double _previousMeasurement;
    private double _previousError;
    private double _previousOutput;
    private bool _started;
    private double _last;

    /// <summary>Creates the controller from the parallel gains of a design.</summary>
    /// <exception cref="ArgumentException">T is not positive or the limits are inverted.</exception>
    public PidImplementation(PidForms forms, double sampleTime, double uMin, double uMax, AntiWindup antiWindup, double? trackingTime = null, bool incremental = false)
    {
        Incremental = incremental;
        ArgumentNullException.ThrowIfNull(forms);
        if (!(sampleTime > 0) || !(uMax > uMin))
        {
            throw new ArgumentException("The sample time must be positive and uMax > uMin.");
        }

        Forms = forms;
        SampleTime = sampleTime;
        UMin = uMin;
        UMax = uMax;
        AntiWindup = antiWindup;
        TrackingTime = trackingTime ?? DefaultTrackingTime(forms, sampleTime);
    }

    /// <summary>True for the incremental (velocity) form u = sat(u₋₁ + Δu), which cannot wind up.</summary>
    public bool Incremental { get; }

    /// <summary>The gains.</summary>
    public PidForms Forms { get; }

    /// <summary>Sample time, seconds.</summary>
    public double SampleTime { get; }

    /// <summary>Lower output limit.</summary>
    public double UMin { get; }

    /// <summary>Upper output limit.</summary>
    public double UMax { get; }

    /// <summary>The anti-windup scheme.</summary>
    public AntiWindup AntiWindup { get; }

    /// <summary>Back-calculation tracking time Tt, seconds (common practice: √(Ti·Td), or Ti/2 without derivative).</summary>
    public double TrackingTime { get; }

    /// <summary>The tracking time the implementation uses when none is given.</summary>
    public static double DefaultTrackingTime(PidForms forms, double sampleTime)
    {
        ArgumentNullException.ThrowIfNull(forms);
        var ti = forms.Ti;
        var td = forms.Td;
        var tt = td > 0 && double.IsFinite(ti) ? Math.Sqrt(ti * td) : (double.IsFinite(ti) ? ti / 2 : 1.0);
        return Math.Max(tt, sampleTime);
    }

    /// <summary>True once a non-finite reference or measurement was given (the exported code's fault flag).</summary>
    public bool Fault { get; private set; }

    /// <summary>One sample: reference r and measurement y in, clamped command out (the last one held on a non-finite input).</summary>
    public double Step(double reference, double measurement)
    {
        if (!double.IsFinite(reference) || !double.IsFinite(measurement))
        {
            Fault = true;
            return _last;
        }

        return _last = Compute(reference, measurement);
    }

    private double Compute(double reference, double measurement)
    {
        if (!_started)
        {
            _previousMeasurement = measurement;
            _previousError = 0.0;
            _started = true;
        }

        var f = Forms;
        var t = SampleTime;
        var error = reference - measurement;
        var p = f.Kp * error;

        // Filtered derivative of −y by backward difference: D = (Tf·D − Kd·(y − y₋₁))/(Tf + T).
        var previousDerivative = _derivative;
        _derivative = ((f.Tf * _derivative) - (f.Kd * (measurement - _previousMeasurement))) / (f.Tf + t);
        _previousMeasurement = measurement;
        if (Incremental)
        {
            // The integral of the positional form accumulates after the output (forward), so its increment here is
            // Ki·T·e[k−1]: both forms give the same output while unsaturated.
            var delta = (f.Kp * (error - _previousError)) + (f.Ki * t * _previousError) + (_derivative - previousDerivative);
            _previousError = error;
            _previousOutput = Math.Clamp(_previousOutput + delta, UMin, UMax);
            return _previousOutput;
        }

        var unclamped = p + _integral + _derivative;
        var u = Math.Clamp(unclamped, UMin, UMax);
        var increment = f.Ki * t * error;
        switch (AntiWindup)
        {
            case AntiWindup.Clamping:
                var pushingFurther = (unclamped > UMax && increment > 0) || (unclamped < UMin && increment < 0);
                if (!pushingFurther)
                {
                    _integral += increment;
                }

                break;
            case AntiWindup.BackCalculation:
                _integral += increment + (t / TrackingTime * (u - unclamped));
                break;
            default:
                _integral += increment;
                break;
        }

        return u;
    }
}
