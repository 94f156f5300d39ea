using System.Numerics;
using CompAssist.Core.Model;

namespace CompAssist.Core.Synthesis;

/// <summary>
/// The gain forms a firmware engineer may need for a P/PI/PD/PID compensator, each labelled:
/// <list type="bullet">
/// <item><b>parallel</b>: C(s) = Kp + Ki/s + Kd·s/(Tf·s + 1) (Tf = 0 without a derivative filter);</item>
/// <item><b>standard</b> (ideal/ISA): C(s) = Kc·(1 + 1/(Ti·s) + Td·s/(1 + Td·s/N)) (N infinite without filter);</item>
/// <item><b>series</b> (interacting, only for real zeros and no filter): C(s) = Kc′·(1 + 1/(Ti′·s))·(1 + Td′·s).</item>
/// </list>
/// Gains in the compensator's units, times in seconds. A term that is absent is 0 (Ki for PD, Kd for PI),
/// and its time constant is infinite (Ti) or 0 (Td). Conversions are common practice (e.g. Åström and
/// Murray, Feedback Systems, section 10.1, or Åström and Hägglund's PID texts).
/// </summary>
/// <param name="Kp">Parallel proportional gain.</param>
/// <param name="Ki">Parallel integral gain (1/s).</param>
/// <param name="Kd">Parallel derivative gain (s).</param>
/// <param name="Tf">Derivative filter time constant (s), 0 when ideal.</param>
/// <param name="Kc">Standard-form gain (equals Kp).</param>
/// <param name="Ti">Integral time (s); infinite without integral action.</param>
/// <param name="Td">Derivative time (s); 0 without derivative action.</param>
/// <param name="N">Derivative filter ratio Td/Tf; infinite when ideal.</param>
/// <param name="SeriesKc">Series-form gain, or null when the zeros are complex or a filter is present.</param>
/// <param name="SeriesTi">Series-form integral time, or null.</param>
/// <param name="SeriesTd">Series-form derivative time, or null.</param>
public sealed record PidForms(
    double Kp,
    double Ki,
    double Kd,
    double Tf,
    double Kc,
    double Ti,
    double Td,
    double N,
    double? SeriesKc,
    double? SeriesTi,
    double? SeriesTd)
{
    /// <summary>From parallel gains.</summary>
    /// <remarks>With Kp = 0 the standard and series forms do not exist: Ti, Td and N are NaN, the series form null.</remarks>
    /// <exception cref="ArgumentException">A value is not finite or the filter time is negative.</exception>
    public static PidForms FromParallel(double kp, double ki, double kd, double tf = 0.0)
    {
        if (!double.IsFinite(kp) || !double.IsFinite(ki) || !double.IsFinite(kd) || !double.IsFinite(tf) || tf < 0)
        {
            throw new ArgumentException("PID gains must be finite and the filter time non-negative.");
        }

        if (kp == 0)
        {
            // No proportional action: the standard and series forms do not exist (reported as NaN / null).
            return new PidForms(kp, ki, kd, tf, 0.0, double.NaN, double.NaN, double.NaN, null, null, null);
        }

        var ti = ki == 0 ? double.PositiveInfinity : kp / ki;
        var td = kd / kp;
        var n = tf == 0 ? double.PositiveInfinity : td / tf;

        // Series form: Kc′(1 + 1/(Ti′s))(1 + Td′s) = Kc′(1 + Td′/Ti′) + Kc′/(Ti′s) + Kc′Td′s needs
        // Ti ≥ 4Td (real zeros) and no filter; then Ti′ + Td′ = Ti, Ti′·Td′ = Ti·Td.
        double? sk = null, sti = null, std = null;
        if (tf == 0)
        {
            if (kd == 0)
            {
                (sk, sti, std) = (kp, ti, 0.0);
            }
            else if (ki == 0)
            {
                (sk, sti, std) = (kp, double.PositiveInfinity, td);
            }
            else if (ti >= 4 * td && td > 0)
            {
                var root = Math.Sqrt((ti * ti) - (4 * ti * td));
                var tiSeries = 0.5 * (ti + root);
                var tdSeries = 0.5 * (ti - root);
                (sk, sti, std) = (kp * tiSeries / ti, tiSeries, tdSeries);
            }
        }

        return new PidForms(kp, ki, kd, tf, kp, ti, td, n, sk, sti, std);
    }

    /// <summary>From the standard form.</summary>
    public static PidForms FromStandard(double kc, double ti, double td, double n = double.PositiveInfinity)
    {
        var ki = double.IsPositiveInfinity(ti) ? 0.0 : kc / ti;
        var tf = double.IsPositiveInfinity(n) || td == 0 ? 0.0 : td / n;
        return FromParallel(kc, ki, kc * td, tf);
    }

    /// <summary>
    /// From a factored compensator K·Π(s − z)/(s^i·(s − p_f)^f) with at most two real-or-pair zeros, at most one
    /// integrator and at most one filter pole.
    /// </summary>
    /// <exception cref="ArgumentException">The compensator is not of PID shape.</exception>
    public static PidForms FromTransferFunction(TransferFunction c)
    {
        ArgumentNullException.ThrowIfNull(c);
        var integrators = c.Poles.Count(p => p == Complex.Zero);
        var filters = c.Poles.Where(p => p != Complex.Zero).ToList();
        if (integrators > 1 || filters.Count > 1 || c.Zeros.Length > 1 + integrators)
        {
            throw new ArgumentException("Not a PID-shaped compensator.", nameof(c));
        }

        // Numerator a2 s² + a1 s + a0 of C·s^i·(Tf s + 1); with the filter pole p_f, (s − p_f) = (Tf s + 1)/Tf.
        var tf = filters.Count == 1 ? -1.0 / filters[0].Real : 0.0;
        var k = c.Gain * (filters.Count == 1 ? tf : 1.0);
        Complex sum = 0, product = 1;
        foreach (var z in c.Zeros)
        {
            sum += z;
            product *= z;
        }

        var (a2, a1, a0) = c.Zeros.Length switch
        {
            0 => (0.0, 0.0, k),
            1 => (0.0, k, -k * c.Zeros[0].Real),
            _ => (k, -k * sum.Real, k * product.Real),
        };

        if (integrators == 0)
        {
            // C(Tf s + 1) = a2 s² + a1 s + a0 = Kp(Tf s + 1) + Kd s: a2 must vanish, Kp = a0, Kd = a1 − Kp·Tf.
            if (a2 != 0)
            {
                throw new ArgumentException("Two zeros without an integrator is not PID-shaped.", nameof(c));
            }

            return FromParallel(a0, 0.0, a1 - (a0 * tf), tf);
        }

        // C·s(Tf s + 1) = (Kp Tf + Kd) s² + (Kp + Ki Tf) s + Ki.
        var ki = a0;
        var kp = a1 - (ki * tf);
        var kd = a2 - (kp * tf);
        return FromParallel(kp, ki, kd, tf);
    }

    /// <summary>Back to factored form: K·Π(s − z)/(s^i (s − p_f)) (for round-trip checks and export).</summary>
    public TransferFunction ToTransferFunction()
    {
        // C = [ (Kp Tf + Kd) s² + (Kp + Ki Tf) s + Ki ] / ( s (Tf s + 1) ), integrator only when Ki ≠ 0.
        var num = Ki != 0
            ? Numerics.Polynomial.FromAscending([Ki, Kp + (Ki * Tf), (Kp * Tf) + Kd])
            : Numerics.Polynomial.FromAscending([Kp, (Kp * Tf) + Kd]);
        var den = Ki != 0 ? Numerics.Polynomial.FromAscending([0.0, 1.0, Tf]) : Numerics.Polynomial.FromAscending([1.0, Tf]);
        return TransferFunction.FromPolynomials(num, den);
    }
}
