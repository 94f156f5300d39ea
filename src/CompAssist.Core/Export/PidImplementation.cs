using System.Numerics;
using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Export;

/// <summary>
/// A sampled PID as firmware runs it (common practice, e.g. Åström and Murray, Feedback Systems, section 10.5):
/// proportional on the error, integral by forward accumulation Ki·T·e, derivative on the measurement (no kick
/// on reference steps; or, when chosen, on the error, as the designed C(s) has it) through the first-order filter
/// Tf by backward difference, the operating-point command u0
/// added to the linear output, the sum clamped to [UMin, UMax] (absolute actuator units), and anti-windup by
/// clamping or back-calculation. Positional form; the incremental form computes the same output as the clamped
/// sum of its increments, starting from u0. A non-finite reference or measurement (a failed sensor read) leaves
/// every state as it was, returns the last output (u0 before the first good sample) and sets <see cref="Fault"/>.
/// With <see cref="SinglePrecision"/> every operation is done in IEEE single precision in the order the exported
/// float C code does it, so the reference reproduces that code bit for bit. With <see cref="FixedPoint"/> the
/// controller runs the integer model of the fixed-point export (inputs rounded to its input format, the command
/// returned as the real value of its integer).
/// </summary>
public sealed class PidImplementation
{
    private double _integral;
    private double _derivative;
    private double _previousSignal;
    private double _previousError;
    private double _previousOutput;
    private bool _started;
    private double _last;

    /// <summary>Creates the controller from the parallel gains of a design.</summary>
    /// <exception cref="ArgumentException">T is not positive, the limits are inverted or u0 lies outside them.</exception>
    public PidImplementation(
        PidForms forms,
        double sampleTime,
        double uMin,
        double uMax,
        AntiWindup antiWindup,
        double? trackingTime = null,
        bool incremental = false,
        double operatingPoint = 0.0,
        bool singlePrecision = false,
        bool derivativeOnError = false)
    {
        ArgumentNullException.ThrowIfNull(forms);
        if (!(sampleTime > 0) || !(uMax > uMin))
        {
            throw new ArgumentException("The sample time must be positive and uMax > uMin.");
        }

        if (!(operatingPoint >= uMin && operatingPoint <= uMax))
        {
            throw new ArgumentException("The operating-point command must lie within the output limits.", nameof(operatingPoint));
        }

        Incremental = incremental;
        Forms = forms;
        SampleTime = sampleTime;
        UMin = uMin;
        UMax = uMax;
        AntiWindup = antiWindup;
        OperatingPoint = operatingPoint;
        SinglePrecision = singlePrecision;
        DerivativeOnError = derivativeOnError;
        TrackingTime = trackingTime ?? DefaultTrackingTime(forms, sampleTime);
        Reset();
    }

    /// <summary>True for the incremental (velocity) form u = sat(u₋₁ + Δu), which cannot wind up.</summary>
    public bool Incremental { get; }

    /// <summary>The gains.</summary>
    public PidForms Forms { get; }

    /// <summary>Sample time, seconds.</summary>
    public double SampleTime { get; }

    /// <summary>Lower output limit, absolute actuator units.</summary>
    public double UMin { get; }

    /// <summary>Upper output limit, absolute actuator units.</summary>
    public double UMax { get; }

    /// <summary>The operating-point command u0 added to the linear output before clamping (absolute actuator units).</summary>
    public double OperatingPoint { get; }

    /// <summary>True when the controller computes in IEEE single precision (the float export).</summary>
    public bool SinglePrecision { get; }

    /// <summary>
    /// True when the derivative acts on the error (the reference response of the designed C(s), with its kick on a
    /// reference step, bounded by the filter: Kd/(Tf + T) per unit step); false for the measurement (the default).
    /// </summary>
    public bool DerivativeOnError { get; }

    /// <summary>The anti-windup scheme.</summary>
    public AntiWindup AntiWindup { get; }

    /// <summary>Back-calculation tracking time Tt, seconds (common practice: √(Ti·Td), or Ti/2 without derivative).</summary>
    public double TrackingTime { get; }

    /// <summary>The integer model this controller runs, when it is exported in fixed point; null in double or float.</summary>
    public FixedPointPid? FixedPoint { get; private init; }

    /// <summary>True once a non-finite reference or measurement was given (the exported code's fault flag).</summary>
    public bool Fault { get; private set; }

    /// <summary>The tracking time the implementation uses when none is given.</summary>
    public static double DefaultTrackingTime(PidForms forms, double sampleTime)
    {
        ArgumentNullException.ThrowIfNull(forms);
        var ti = forms.Ti;
        var td = forms.Td;
        var tt = td > 0 && double.IsFinite(ti) ? Math.Sqrt(ti * td) : (double.IsFinite(ti) ? ti / 2 : 1.0);
        return Math.Max(tt, sampleTime);
    }

    /// <summary>A fresh controller with the same settings (states at rest).</summary>
    public PidImplementation Twin()
    {
        var twin = new PidImplementation(Forms, SampleTime, UMin, UMax, AntiWindup, TrackingTime, Incremental, OperatingPoint, SinglePrecision, DerivativeOnError) { FixedPoint = FixedPoint?.Twin() };
        twin.Reset();
        return twin;
    }

    /// <summary>
    /// This controller in fixed point: <paramref name="wordBits"/>-bit words, the reference and measurement with
    /// <paramref name="inputFractionBits"/> fractional bits, the command with <paramref name="outputFractionBits"/>
    /// (its limits and u0 rounded to that resolution).
    /// </summary>
    /// <exception cref="ArgumentException">The formats do not fit the word (see <see cref="FixedPointPid.Create"/>).</exception>
    public PidImplementation InFixedPoint(int wordBits, int inputFractionBits, int outputFractionBits)
    {
        var engine = FixedPointPid.Create(this, wordBits, inputFractionBits, outputFractionBits);
        var pid = new PidImplementation(Forms, SampleTime, engine.ToReal(engine.Low), engine.ToReal(engine.High), AntiWindup, TrackingTime, Incremental, engine.ToReal(engine.OperatingPoint), singlePrecision: false, DerivativeOnError) { FixedPoint = engine };
        pid.Reset();
        return pid;
    }

    /// <summary>
    /// The coefficients as the exported code stores them, in real units: Kp, Ki·T, the derivative filter's
    /// a = Tf/(Tf + T) and b = Kd/(Tf + T) (each rounded to float in single precision; in fixed point, the value of
    /// its mantissa and shift).
    /// </summary>
    public (double Kp, double IntegralStep, double FilterPole, double DerivativeStep) StoredCoefficients()
    {
        var f = Forms;
        var t = SampleTime;
        if (FixedPoint is { } x)
        {
            var toState = Math.Pow(2, x.OutputFractionBits + x.GuardBits - x.InputFractionBits);
            return (x.Proportional.Value / toState, x.IntegralStep.Value / toState, x.FilterPole.Value, x.DerivativeGain.Value / toState);
        }

        if (SinglePrecision)
        {
            float kp = (float)f.Kp, ki = (float)f.Ki, kd = (float)f.Kd, tf = (float)f.Tf, ts = (float)t;
            return (kp, ki * ts, tf / (tf + ts), kd / (tf + ts));
        }

        return (f.Kp, f.Ki * t, f.Tf / (f.Tf + t), f.Kd / (f.Tf + t));
    }

    /// <summary>Back to rest, fault cleared (the exported reset).</summary>
    public void Reset()
    {
        _integral = 0.0;
        _derivative = 0.0;
        _previousSignal = 0.0;
        _previousError = 0.0;
        _previousOutput = Round(OperatingPoint);
        _last = Round(OperatingPoint);
        _started = false;
        Fault = false;
        FixedPoint?.Reset();
    }

    /// <summary>One sample: reference r and measurement y in, clamped command out (the last one held on a non-finite input).</summary>
    public double Step(double reference, double measurement)
    {
        if (!double.IsFinite(reference) || !double.IsFinite(measurement))
        {
            Fault = true;
            return _last;
        }

        if (FixedPoint is { } engine)
        {
            return _last = engine.ToReal(engine.Step(engine.ToInput(reference), engine.ToInput(measurement)));
        }

        return _last = SinglePrecision ? Compute<float>(reference, measurement) : Compute<double>(reference, measurement);
    }

    private double Round(double x) => SinglePrecision ? (float)x : x;

    // Every operation in T, in the order of the generated C; the states are kept as doubles (exact for floats).
    private double Compute<T>(double referenceValue, double measurementValue)
        where T : IFloatingPointIeee754<T>
    {
        static T V(double x) => T.CreateTruncating(x);
        static double D(T x) => double.CreateTruncating(x);
        var f = Forms;
        T kp = V(f.Kp), ki = V(f.Ki), kd = V(f.Kd), tf = V(f.Tf), t = V(SampleTime), low = V(UMin), high = V(UMax);
        var reference = V(referenceValue);
        var measurement = V(measurementValue);
        static T Clamp(T u, T low, T high) => u < low ? low : (u > high ? high : u);
        var error = reference - measurement;
        var signal = DerivativeOnError ? error : -measurement;
        if (!_started)
        {
            // The signal is taken as constant before the first sample: no derivative spike at power-on.
            _previousSignal = D(signal);
            _previousError = 0.0;
            _started = true;
        }

        // Filtered derivative of the signal (−y, or e) by backward difference: D = (Tf·D + Kd·(v − v₋₁))/(Tf + T).
        var previousDerivative = V(_derivative);
        var derivative = ((tf * previousDerivative) + (kd * (signal - V(_previousSignal)))) / (tf + t);
        _derivative = D(derivative);
        _previousSignal = D(signal);
        if (Incremental)
        {
            // The integral of the positional form accumulates after the output (forward), so its increment here is
            // Ki·T·e[k−1]: both forms give the same output while unsaturated.
            var previousError = V(_previousError);
            var delta = (kp * (error - previousError)) + (ki * t * previousError) + (derivative - previousDerivative);
            _previousError = D(error);
            var output = Clamp(V(_previousOutput) + delta, low, high);
            _previousOutput = D(output);
            return D(output);
        }

        var integral = V(_integral);
        var unclamped = V(OperatingPoint) + (kp * error) + integral + derivative;
        var u = Clamp(unclamped, low, high);
        var increment = ki * t * error;
        switch (AntiWindup)
        {
            case AntiWindup.Clamping:
                var pushingFurther = (unclamped > high && increment > T.Zero) || (unclamped < low && increment < T.Zero);
                if (!pushingFurther)
                {
                    integral += increment;
                }

                break;
            case AntiWindup.BackCalculation:
                integral += increment + (t / V(TrackingTime) * (u - unclamped));
                break;
            default:
                integral += increment;
                break;
        }

        _integral = D(integral);
        return D(u);
    }
}
