using System.Collections.Immutable;
using CompAssist.Core.Model;

namespace CompAssist.Core.Simulation;

/// <summary>
/// A sampled controller in closed loop with the continuous plant, by a route independent of the z-domain proof:
/// the plant G₀ and the measured path G₀·H₀ are advanced exactly under the held command (zero-order hold, matrix
/// exponential) with their delays exact (each output read at the offset inside the period that the delay puts it
/// at), the measurement taken at the sampling instants, and the output read h = T/s apart between them. The plant
/// input is the applied command minus the operating point u0 (the model is about the operating point), plus a
/// load disturbance at the plant input; with a computation delay the command computed at kT is applied at (k+1)T.
/// </summary>
public static class SampledControllerLoop
{
    /// <summary>The controller law: (reference, measurement) → command, one call per sample.</summary>
    public delegate double Law(double reference, double measurement);

    /// <summary>Runs <paramref name="periods"/> sampling periods from rest.</summary>
    /// <param name="loop">The loop (plant, sensor, delays, feedback sign: the measurement passed to the law is σ·H·y).</param>
    /// <param name="law">The controller.</param>
    /// <param name="sampleTime">T, seconds.</param>
    /// <param name="periods">Periods simulated.</param>
    /// <param name="subSteps">Output readings per period (s ≥ 1).</param>
    /// <param name="computationDelay">True when the command is applied one sample after it is computed.</param>
    /// <param name="reference">The reference, a step at t = 0.</param>
    /// <param name="loadDisturbance">A step at the plant input at t = 0.</param>
    /// <param name="operatingPoint">The command u0 at which the plant model holds (the law's commands are absolute).</param>
    /// <exception cref="ArgumentException">The plant or the sensor is improper, or an argument is out of range.</exception>
    public static SampledControllerRun Run(Loop loop, Law law, double sampleTime, int periods, int subSteps, bool computationDelay, double reference, double loadDisturbance, double operatingPoint = 0.0)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(law);
        ArgumentOutOfRangeException.ThrowIfLessThan(periods, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(subSteps, 1);
        if (!(sampleTime > 0) || !double.IsFinite(sampleTime))
        {
            throw new ArgumentOutOfRangeException(nameof(sampleTime), sampleTime, "The sample time must be positive.");
        }

        var t = sampleTime;
        var h = t / subSteps;
        var plantDelay = loop.Plant.Delay;
        var measuredDelay = plantDelay + loop.Feedback.Delay;

        // Where each output reading falls: y(jT + ih) = y₀(jT + ih − τ) = the reading of period j + shift at offset.
        var outputPlaces = Enumerable.Range(0, subSteps).Select(i => Place((i * h) - plantDelay, t)).ToArray();
        var outputOffsets = outputPlaces.Select(p => p.Offset).Distinct().Order().ToArray();
        var outputIndex = outputPlaces.Select(p => Array.IndexOf(outputOffsets, p.Offset)).ToArray();
        var output = new HeldInputTrack(CascadeRealization.Of(loop.Plant.WithoutDelay()), t, outputOffsets);
        var measuredPlace = Place(-measuredDelay, t);
        var measuredNow = measuredDelay == 0 || (measuredPlace.Shift == 0 && measuredPlace.Offset == 0);
        var measured = new HeldInputTrack(CascadeRealization.Of(loop.PlantTimesFeedback.WithoutDelay()), t, measuredNow ? [] : [measuredPlace.Offset]);

        // A static sensor (a gain, no delay) measures the output track itself: two open-loop propagations of an
        // unstable plant drift apart by rounding (e^(t) times 1e-16 is 1 after 37 s at a pole at +1), and the
        // output, never corrected by the feedback that reads the other, would diverge while the loop is stable.
        var f = loop.Feedback;
        var staticSensor = f.Poles.Length == 0 && f.Zeros.Length == 0 && f.Delay == 0;
        var first = outputPlaces[0];

        var readings = new double[periods * outputOffsets.Length];
        var measuredReadings = new double[periods];
        var commands = ImmutableArray.CreateBuilder<double>(periods);
        var measurements = ImmutableArray.CreateBuilder<double>(periods);
        var previousCommand = operatingPoint;
        Span<double> one = stackalloc double[1];
        for (var j = 0; j < periods; j++)
        {
            var source = j + measuredPlace.Shift;
            var firstPeriod = j + first.Shift;
            var m = staticSensor
                ? f.Gain * (plantDelay == 0 || (first.Shift == 0 && first.Offset == 0) ? output.ReadNow() : firstPeriod >= 0 ? readings[(firstPeriod * outputOffsets.Length) + outputIndex[0]] : 0.0)
                : measuredNow ? measured.ReadNow() : source >= 0 ? measuredReadings[source] : 0.0;
            var command = law(reference, loop.SignFactor * m);
            var applied = computationDelay ? previousCommand : command;
            previousCommand = command;
            commands.Add(command);
            measurements.Add(loop.SignFactor * m);
            var input = applied - operatingPoint + loadDisturbance;
            output.Advance(input, readings.AsSpan(j * outputOffsets.Length, outputOffsets.Length));
            if (staticSensor)
            {
                continue;
            }

            if (measuredNow)
            {
                measured.Advance(input, []);
            }
            else
            {
                measured.Advance(input, one);
                measuredReadings[j] = one[0];
            }
        }

        var y = ImmutableArray.CreateBuilder<double>((periods * subSteps) + 1);
        for (var j = 0; j < periods; j++)
        {
            for (var i = 0; i < subSteps; i++)
            {
                var period = j + outputPlaces[i].Shift;
                y.Add(period >= 0 ? readings[(period * outputOffsets.Length) + outputIndex[i]] : 0.0);
            }
        }

        // The last instant, NT, is the first reading of the period after the last: the state there, read directly.
        y.Add(plantDelay == 0 ? output.ReadNow() : y[^1]);
        return new SampledControllerRun(new SampledResponse(h, y.MoveToImmutable()), commands.MoveToImmutable(), measurements.MoveToImmutable());
    }

    // q = shift·T + offset with offset in [0, T); offsets within a part in 10¹² of T of the period's end round to 0.
    private static (int Shift, double Offset) Place(double q, double t)
    {
        var shift = (int)Math.Floor(q / t);
        var offset = q - (shift * t);
        if (offset >= t * (1 - 1e-12) || Math.Abs(offset) <= t * 1e-12)
        {
            return (offset > t / 2 ? shift + 1 : shift, 0.0);
        }

        return (shift, offset);
    }
}
