using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;

namespace CompAssist.Core.Export;

/// <summary>
/// The sample time chosen by re-proof rather than by rule alone. The ladder is the 1-2-5 sequence of sample
/// times; it starts at the largest value with ωs = 2π/T ≥ 25·ωB (ωB the −3 dB bandwidth of the closed loop
/// T(jω); Franklin, Powell and Workman, Digital Control of Dynamic Systems, 3rd ed., ch. 11, give 20–40× the
/// bandwidth as common practice) and with ωs ≥ 10× the compensator's fastest corner. At each value the loop
/// is re-proved sampled (plant by zero-order hold, the controller as stored, the computation delay) against
/// every requirement the continuous loop meets that a sampled proof measures (the step figures and the phase
/// margin). The recommended value is the largest that meets, with every shorter value tried meeting too
/// (at least the next two); the largest longer value that still meets is shown as a limit, not as advice.
/// </summary>
/// <param name="Bandwidth">ωB in rad/s (NaN when |T| never falls 3 dB below its DC value in the sweep).</param>
/// <param name="Start">The ladder's starting value from the bandwidth rule.</param>
/// <param name="Rungs">Every value re-proved, longest first.</param>
/// <param name="Recommended">The recommended sample time, or null when no value tried meets.</param>
/// <param name="Limit">The longest value that still meets (with every shorter one tried), or null.</param>
public sealed record SampleTimeLadder(double Bandwidth, double Start, ImmutableArray<LadderRung> Rungs, double? Recommended, double? Limit)
{
    /// <summary>How many rungs below the start are tried at most when the start does not meet.</summary>
    public const int MaxRungsBelow = 9;

    /// <summary>Builds the ladder for a continuous design and the hand-off options.</summary>
    public static SampleTimeLadder Build(Loop loop, TransferFunction compensator, LoopCheckReport continuous, HandoffOptions options)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        ArgumentNullException.ThrowIfNull(continuous);
        ArgumentNullException.ThrowIfNull(options);
        var crossover = continuous.Margins?.GainCrossover ?? double.NaN;
        var bandwidth = ClosedLoopBandwidth(loop, compensator, double.IsFinite(crossover) && crossover > 0 ? crossover : 1.0);
        var basis = double.IsFinite(bandwidth) ? bandwidth : crossover;
        var fastest = compensator.Poles.Concat(compensator.Zeros).Select(r => r.Magnitude).DefaultIfEmpty(0).Max();
        var start = Floor125(Math.Min(2 * Math.PI / (25 * basis), fastest > 0 ? 2 * Math.PI / (10 * fastest) : double.PositiveInfinity));
        var rungs = new SortedDictionary<double, LadderRung?>(Comparer<double>.Create((a, b) => b.CompareTo(a)));
        LadderRung? At(double t)
        {
            if (!rungs.TryGetValue(t, out var rung))
            {
                rung = Rung(loop, compensator, continuous, options, t);
                rungs[t] = rung;
            }

            return rung;
        }

        // Downwards from the start until a value meets and the next two shorter ones meet too.
        double? recommended = null;
        var t = start;
        for (var i = 0; i <= MaxRungsBelow && recommended is null; i++, t = Shorter(t))
        {
            if (At(t) is { Meets: true } && At(Shorter(t)) is { Meets: true } && At(Shorter(Shorter(t))) is { Meets: true })
            {
                recommended = t;
            }
        }

        // Upwards from the recommendation: the longest value that still meets with every one between.
        double? limit = recommended;
        if (recommended is { } r && r == start)
        {
            for (var (i, up) = (0, Longer(r)); i < 3 && At(up) is { Meets: true }; i++, up = Longer(up))
            {
                limit = up;
            }
        }

        return new SampleTimeLadder(bandwidth, start, [.. rungs.Values.OfType<LadderRung>()], recommended, limit);
    }

    /// <summary>The sampled loop at one sample time, or null when the controller cannot be discretized there.</summary>
    public static LadderRung? Rung(Loop loop, TransferFunction compensator, LoopCheckReport continuous, HandoffOptions options, double sampleTime)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(continuous);
        ArgumentNullException.ThrowIfNull(options);
        var discrete = Discretizer.Discretize(compensator, sampleTime, options.Method, options.PrewarpFrequency);
        return discrete.IsSuccess ? RungOf(loop, continuous, options, discrete.Value.Discrete) : null;
    }

    /// <summary>The sampled loop with the controller <paramref name="d"/> (stored in the options' number format).</summary>
    public static LadderRung RungOf(Loop loop, LoopCheckReport continuous, HandoffOptions options, DiscreteTransferFunction d)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(continuous);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(d);
        var sampleTime = d.SampleTime;
        var stored = Quantizer.Quantize(d, SectionSplitter.Split(d), options.Format).Quantized;
        var proof = SampledLoop.Prove(loop, stored, options.ComputationDelay);
        var pm = proof.Stable ? PhaseMargin(loop, stored, proof.DelaySamples) : double.NaN;
        return new LadderRung(sampleTime, proof, pm, SampledChecks.Of(continuous, proof.Metrics, pm, proof.Stable));
    }

    /// <summary>The largest 1, 2 or 5 × 10ⁿ not above t.</summary>
    public static double Floor125(double t)
    {
        var decade = Math.Pow(10, Math.Floor(Math.Log10(t)));
        var mantissa = t / decade;
        var value = decade * (mantissa >= 5 * (1 - 1e-12) ? 5 : mantissa >= 2 * (1 - 1e-12) ? 2 : 1);
        return Tidy(value);
    }

    /// <summary>The next shorter value on the ladder.</summary>
    public static double Shorter(double t) => Floor125(t * 0.99);

    /// <summary>The next longer value on the ladder.</summary>
    public static double Longer(double t)
    {
        var decade = Math.Pow(10, Math.Floor(Math.Log10(t) + 1e-12));
        var mantissa = Math.Round(t / decade);
        return Tidy(mantissa switch { 1 => 2 * decade, 2 => 5 * decade, _ => 10 * decade });
    }

    /// <summary>−3 dB bandwidth of T = C·G/(1 ± C·G·H) with delays exact (<see cref="FrequencyFigures"/>).</summary>
    public static double ClosedLoopBandwidth(Loop loop, TransferFunction compensator, double scale) =>
        FrequencyFigures.Of(loop, compensator, scale).Bandwidth;

    /// <summary>
    /// The phase margin of the sampled loop from its frequency response on the unit circle,
    /// L(e^{jωT}) = ±C(z)·[ZOH of G·H](z)·z^(−d), over 0 &lt; ω &lt; π/T: the smallest angular distance from L
    /// to −1 at a gain crossover, in degrees; +∞ when |L| never crosses 1.
    /// </summary>
    public static double PhaseMargin(Loop loop, DiscreteTransferFunction controller, int delaySamples)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(controller);
        var t = controller.SampleTime;
        var path = Discretizer.ZeroOrderHold((loop.Plant * loop.Feedback).WithoutDelay(), t);
        Complex L(double w)
        {
            var z = Complex.FromPolarCoordinates(1.0, w * t);
            return loop.SignFactor * controller.Evaluate(z) * path.Evaluate(z) * Complex.Pow(z, -delaySamples);
        }

        var nyquist = Math.PI / t;
        const int points = 4000;
        var lo = nyquist * 1e-7;
        double Log(double w) => Math.Log(Complex.Abs(L(w)));
        var best = double.PositiveInfinity;
        var w0 = lo;
        var m0 = Log(w0);
        for (var i = 1; i <= points; i++)
        {
            var w1 = lo * Math.Pow(nyquist * (1 - 1e-9) / lo, i / (double)points);
            var m1 = Log(w1);
            if (double.IsFinite(m0) && double.IsFinite(m1) && Math.Sign(m0) != Math.Sign(m1) && m1 != 0)
            {
                double a = w0, b = w1;
                for (var k = 0; k < 60; k++)
                {
                    var mid = 0.5 * (a + b);
                    (a, b) = Math.Sign(Log(mid)) == Math.Sign(m0) ? (mid, b) : (a, mid);
                }

                var phase = L(0.5 * (a + b)).Phase;
                var distance = Math.Abs(Math.IEEERemainder(phase - Math.PI, 2 * Math.PI)) * 180 / Math.PI;
                best = Math.Min(best, distance);
            }

            (w0, m0) = (w1, m1);
        }

        return best;
    }

    private static double Tidy(double value) => double.Parse(value.ToString("G12", System.Globalization.CultureInfo.InvariantCulture), System.Globalization.CultureInfo.InvariantCulture);
}
