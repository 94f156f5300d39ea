using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Analysis;

/// <summary>L(jω) on a log-spaced grid: magnitude in dB and phase in degrees, unwrapped along the grid.</summary>
/// <param name="Frequencies">ω, rad/s, ascending.</param>
/// <param name="MagnitudeDb">20·log10|L(jω)|.</param>
/// <param name="PhaseDegrees">∠L(jω), unwrapped (continuous along the grid), delay included.</param>
public sealed record FrequencyResponse(ImmutableArray<double> Frequencies, ImmutableArray<double> MagnitudeDb, ImmutableArray<double> PhaseDegrees)
{
    /// <summary>Evaluates a transfer function (delay exact) from ω₁ to ω₂ at <paramref name="points"/> log-spaced frequencies.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The range or count is invalid.</exception>
    public static FrequencyResponse Of(TransferFunction tf, double from, double to, int points = 600)
    {
        ArgumentNullException.ThrowIfNull(tf);
        if (!(from > 0 && to > from) || points < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(points), "Need 0 < from < to and at least two points.");
        }

        var w = ImmutableArray.CreateBuilder<double>(points);
        var mag = ImmutableArray.CreateBuilder<double>(points);
        var phase = ImmutableArray.CreateBuilder<double>(points);
        var previous = double.NaN;
        for (var i = 0; i < points; i++)
        {
            var omega = from * Math.Pow(to / from, (double)i / (points - 1));
            var s = new Complex(0, omega);
            var m = tf.MagnitudeAt(s);
            var p = tf.PhaseAt(s) * 180.0 / Math.PI;
            if (!double.IsNaN(previous))
            {
                p -= 360.0 * Math.Round((p - previous) / 360.0);
            }

            previous = p;
            w.Add(omega);
            mag.Add(20.0 * Math.Log10(m));
            phase.Add(p);
        }

        return new FrequencyResponse(w.MoveToImmutable(), mag.MoveToImmutable(), phase.MoveToImmutable());
    }
}
