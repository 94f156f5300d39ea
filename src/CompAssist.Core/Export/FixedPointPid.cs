using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Export;

/// <summary>
/// The bit-exact integer model of the exported fixed-point PID (positional form, the operations of
/// <see cref="PidImplementation"/> in integers). Reference and measurement are signed W-bit integers with
/// <see cref="InputFractionBits"/> fractional bits, the command a W-bit integer with <see cref="OutputFractionBits"/>.
/// The integral, derivative and sum are kept in 64 bits at the command's resolution refined by
/// <see cref="GuardBits"/> more bits (so that a small Ki·T·e still accumulates; common practice, e.g.
/// Franklin, Powell and Workman, Digital Control of Dynamic Systems, on integrator quantization), each term
/// saturated at 2^GuardBits times the command word's range (headroom, so that a derivative or proportional peak
/// beyond the limits is kept, not cut, while the sum is clamped). Every coefficient is a <see cref="ScaledCoefficient"/>
/// mapping its input integers to state integers; products are scaled by rounding to nearest (halves away from
/// zero) and saturated. Words up to 24 bits keep every product and sum inside 64 bits.
/// </summary>
public sealed class FixedPointPid
{
    /// <summary>Largest word length the exported code supports.</summary>
    public const int MaxWordBits = 24;

    private long _integral;
    private long _derivative;
    private long _previousSignal;
    private bool _started;

    private FixedPointPid(int wordBits, int inputFractionBits, int outputFractionBits, AntiWindup antiWindup, bool derivativeOnError, long low, long high, long operatingPoint, ScaledCoefficient[] c)
    {
        WordBits = wordBits;
        InputFractionBits = inputFractionBits;
        OutputFractionBits = outputFractionBits;
        GuardBits = GuardBitsFor(wordBits);
        AntiWindup = antiWindup;
        DerivativeOnError = derivativeOnError;
        Low = low;
        High = high;
        OperatingPoint = operatingPoint;
        Proportional = c[0];
        IntegralStep = c[1];
        FilterPole = c[2];
        DerivativeGain = c[3];
        Tracking = c[4];
    }

    /// <summary>Word length W of the signals and coefficients.</summary>
    public int WordBits { get; }

    /// <summary>Fractional bits of the reference and the measurement.</summary>
    public int InputFractionBits { get; }

    /// <summary>Fractional bits of the command (and of u0 and the limits).</summary>
    public int OutputFractionBits { get; }

    /// <summary>
    /// Extra fractional bits of the states beyond the command's, and as many bits of headroom above its range:
    /// (60 − 2W)/2, at most 16 (6 for 24-bit words), so that no product overflows 64 bits.
    /// </summary>
    public int GuardBits { get; }

    /// <summary>The anti-windup scheme.</summary>
    public AntiWindup AntiWindup { get; }

    /// <summary>True when the derivative acts on the error rather than the measurement.</summary>
    public bool DerivativeOnError { get; }

    /// <summary>Lower command limit, command integer.</summary>
    public long Low { get; }

    /// <summary>Upper command limit, command integer.</summary>
    public long High { get; }

    /// <summary>The operating-point command u0, command integer.</summary>
    public long OperatingPoint { get; }

    /// <summary>Kp from input integers to state integers.</summary>
    public ScaledCoefficient Proportional { get; }

    /// <summary>Ki·T from input integers to state integers.</summary>
    public ScaledCoefficient IntegralStep { get; }

    /// <summary>The derivative filter's a = Tf/(Tf + T) (state to state).</summary>
    public ScaledCoefficient FilterPole { get; }

    /// <summary>Kd/(Tf + T) from input integers to state integers.</summary>
    public ScaledCoefficient DerivativeGain { get; }

    /// <summary>T/Tt of the back-calculation (state to state); 0 for the other schemes.</summary>
    public ScaledCoefficient Tracking { get; }

    /// <summary>The largest state magnitude: 2^GuardBits times the command word's range, at the state resolution.</summary>
    public long StateLimit => (1L << (WordBits - 1 + (2 * GuardBits))) - 1;

    /// <summary>The guard (and headroom) bits used with <paramref name="wordBits"/>-bit words.</summary>
    public static int GuardBitsFor(int wordBits) => Math.Min(16, (60 - (2 * wordBits)) / 2);

    /// <summary>The fixed-point form of a PID with the settings of <paramref name="reference"/>.</summary>
    /// <param name="reference">The controller in real arithmetic: gains, sample time, limits, u0, scheme, tracking time, derivative placement.</param>
    /// <param name="wordBits">Word length, 8…<see cref="MaxWordBits"/>.</param>
    /// <param name="inputFractionBits">Fractional bits of the reference and measurement.</param>
    /// <param name="outputFractionBits">Fractional bits of the command.</param>
    /// <exception cref="ArgumentException">The word is unsupported, the formats do not fit it, the reference is incremental, or u0 or a limit is outside the command word.</exception>
    public static FixedPointPid Create(PidImplementation reference, int wordBits, int inputFractionBits, int outputFractionBits)
    {
        ArgumentNullException.ThrowIfNull(reference);
        if (wordBits < 8 || wordBits > MaxWordBits)
        {
            throw new ArgumentException($"The fixed-point PID supports 8…{MaxWordBits}-bit words.", nameof(wordBits));
        }

        if (inputFractionBits < 0 || inputFractionBits >= wordBits || outputFractionBits < 0 || outputFractionBits >= wordBits)
        {
            throw new ArgumentException("The fractional bits must fit the word.", nameof(inputFractionBits));
        }

        if (reference.Incremental)
        {
            throw new ArgumentException("The fixed-point PID is positional.", nameof(reference));
        }

        var max = (1L << (wordBits - 1)) - 1;
        long Command(double u) => (long)Math.Round(u * Math.Pow(2, outputFractionBits), MidpointRounding.AwayFromZero);
        var low = Math.Max(Command(reference.UMin), -max - 1);
        var high = Math.Min(Command(reference.UMax), max);
        var u0 = Command(reference.OperatingPoint);
        if (!(u0 >= low && u0 <= high && high > low))
        {
            throw new ArgumentException("The operating point must lie between the limits in the command word.", nameof(reference));
        }

        var f = reference.Forms;
        var t = reference.SampleTime;
        var toState = Math.Pow(2, outputFractionBits + GuardBitsFor(wordBits) - inputFractionBits);
        var tracking = reference.AntiWindup == AntiWindup.BackCalculation ? t / reference.TrackingTime : 0.0;
        ScaledCoefficient[] c =
        [
            ScaledCoefficient.Of(f.Kp * toState, wordBits),
            ScaledCoefficient.Of(f.Ki * t * toState, wordBits),
            ScaledCoefficient.Of(f.Tf / (f.Tf + t), wordBits),
            ScaledCoefficient.Of(f.Kd / (f.Tf + t) * toState, wordBits),
            ScaledCoefficient.Of(tracking, wordBits),
        ];
        return new FixedPointPid(wordBits, inputFractionBits, outputFractionBits, reference.AntiWindup, reference.DerivativeOnError, low, high, u0, c);
    }

    /// <summary>A fresh controller with the same settings (states at rest).</summary>
    public FixedPointPid Twin() =>
        new(WordBits, InputFractionBits, OutputFractionBits, AntiWindup, DerivativeOnError, Low, High, OperatingPoint, [Proportional, IntegralStep, FilterPole, DerivativeGain, Tracking]);

    /// <summary>Back to rest.</summary>
    public void Reset()
    {
        _integral = 0;
        _derivative = 0;
        _previousSignal = 0;
        _started = false;
    }

    /// <summary>A real reference or measurement as its input integer (rounded to nearest, saturated to the word).</summary>
    public long ToInput(double value) => Saturate(Math.Round(value * Math.Pow(2, InputFractionBits), MidpointRounding.AwayFromZero));

    /// <summary>A command integer as its real value.</summary>
    public double ToReal(long command) => command / Math.Pow(2, OutputFractionBits);

    /// <summary>One sample: reference and measurement integers in, command integer out.</summary>
    public long Step(long reference, long measurement)
    {
        var m = StateLimit;
        var error = reference - measurement;
        var signal = DerivativeOnError ? error : -measurement;
        if (!_started)
        {
            _previousSignal = signal;
            _started = true;
        }

        _derivative = Clamp(ScaleSaturate(FilterPole.Mantissa * _derivative, FilterPole.Shift, m) + ScaleSaturate(DerivativeGain.Mantissa * (signal - _previousSignal), DerivativeGain.Shift, m), m);
        _previousSignal = signal;
        var guard = GuardBits;
        var proportional = ScaleSaturate(Proportional.Mantissa * error, Proportional.Shift, m);
        var unclamped = (OperatingPoint << guard) + proportional + _integral + _derivative;
        var low = Low << guard;
        var high = High << guard;
        var u = unclamped < low ? low : (unclamped > high ? high : unclamped);
        var increment = ScaleSaturate(IntegralStep.Mantissa * error, IntegralStep.Shift, m);
        switch (AntiWindup)
        {
            case AntiWindup.Clamping:
                if (!((unclamped > high && increment > 0) || (unclamped < low && increment < 0)))
                {
                    _integral = Clamp(_integral + increment, m);
                }

                break;
            case AntiWindup.BackCalculation:
                _integral = Clamp(_integral + increment + ScaleSaturate(Tracking.Mantissa * (u - unclamped), Tracking.Shift, m), m);
                break;
            default:
                _integral = Clamp(_integral + increment, m);
                break;
        }

        return FixedPointCascade.ShiftRound(u, guard);
    }

    /// <summary>
    /// p·2^−s rounded to nearest (halves away from zero) and saturated to ±limit; a negative s is a left shift,
    /// saturated before it is made so that nothing overflows.
    /// </summary>
    public static long ScaleSaturate(long product, int shift, long limit)
    {
        if (shift >= 0)
        {
            return Clamp(FixedPointCascade.ShiftRound(product, shift), limit);
        }

        var room = limit >> -shift;
        return product > room ? limit : (product < -room ? -limit : product << -shift);
    }

    private static long Clamp(long v, long limit) => v < -limit ? -limit : (v > limit ? limit : v);

    private long Saturate(double v)
    {
        var max = (1L << (WordBits - 1)) - 1;
        return (long)Math.Clamp(v, -max - 1, max);
    }
}
