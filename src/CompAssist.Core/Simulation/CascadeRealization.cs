using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Simulation;

/// <summary>
/// Realizes a proper rational transfer function as a cascade of first- and second-order sections built
/// from its factored form. Each section is normalized to unit gain at its own natural frequency, so no
/// state carries a huge or tiny scale, and no expanded high-order polynomial is ever formed.
/// </summary>
public static class CascadeRealization
{
    /// <summary>The realization of a proper, delay-free transfer function.</summary>
    /// <exception cref="ArgumentException">The transfer function is improper or has a delay.</exception>
    public static StateSpace Of(TransferFunction tf)
    {
        ArgumentNullException.ThrowIfNull(tf);
        if (!tf.IsProper)
        {
            throw new ArgumentException("Only proper transfer functions have a state-space realization.", nameof(tf));
        }

        if (tf.Delay != 0.0)
        {
            throw new ArgumentException("Replace the delay by a rational approximation first.", nameof(tf));
        }

        var sections = Sections(tf.Poles);
        AssignZeros(sections, tf.Zeros);
        var gain = tf.Gain;
        StateSpace? system = null;
        foreach (var section in sections)
        {
            var (ss, scale) = section.Realize();
            gain *= scale;
            system = system is null ? ss : system.Then(ss);
        }

        var gainStage = StateSpace.Create(new double[0, 0], [], [], gain);
        return system is null ? gainStage : gainStage.Then(system);
    }

    private static List<Section> Sections(IReadOnlyList<Complex> poles)
    {
        var sections = new List<Section>();
        var reals = poles.Where(p => p.Imaginary == 0).Select(p => p.Real).OrderBy(x => x).ToList();
        foreach (var pair in poles.Where(p => p.Imaginary > 0))
        {
            sections.Add(new Section([pair, Complex.Conjugate(pair)]));
        }

        for (var i = 0; i < reals.Count; i += 2)
        {
            sections.Add(i + 1 < reals.Count
                ? new Section([new Complex(reals[i], 0), new Complex(reals[i + 1], 0)])
                : new Section([new Complex(reals[i], 0)]));
        }

        return sections;
    }

    private static void AssignZeros(List<Section> sections, IReadOnlyList<Complex> zeros)
    {
        // Complex zero pairs need a section with two free places; prefer the section whose poles are nearest.
        foreach (var pair in zeros.Where(z => z.Imaginary > 0))
        {
            var target = sections.Where(s => s.Free >= 2).OrderBy(s => s.DistanceTo(pair)).First();
            target.Zeros.Add(pair);
            target.Zeros.Add(Complex.Conjugate(pair));
        }

        foreach (var z in zeros.Where(z => z.Imaginary == 0))
        {
            var target = sections.Where(s => s.Free >= 1).OrderBy(s => s.DistanceTo(z)).First();
            target.Zeros.Add(z);
        }
    }

    private sealed class Section(List<Complex> poles)
    {
        public List<Complex> Poles { get; } = poles;

        public List<Complex> Zeros { get; } = [];

        public int Free => Poles.Count - Zeros.Count;

        public double DistanceTo(Complex z) => Poles.Min(p => Complex.Abs(p - z));

        /// <summary>Realization of Π(s − z)/Π(s − p) times 1/scale, and that scale.</summary>
        public (StateSpace System, double Scale) Realize()
        {
            var den = Polynomial.FromRoots(Poles).Ascending;
            var num = Polynomial.FromRoots(Zeros).Ascending.ToArray();
            var omega = Math.Max(Poles.Max(p => p.Magnitude), 1e-12);
            var atOmega = Complex.Abs(Polynomial.FromRoots(Zeros).Evaluate(new Complex(0, omega)) / Polynomial.FromRoots(Poles).Evaluate(new Complex(0, omega)));
            var scale = atOmega > 0 && double.IsFinite(atOmega) ? atOmega : 1.0;
            var b = new double[Poles.Count + 1];
            for (var k = 0; k < num.Length; k++)
            {
                b[k] = num[k] / scale;
            }

            if (Poles.Count == 1)
            {
                // (b1 s + b0)/(s + a0) with the state scaled by w = |a0| (x = w·ξ of the plain form ξ' = −a0 ξ + u),
                // so the state is of the size of the input: A = −a0, B = w, C = (b0 − b1 a0)/w, D = b1.
                var a0 = den[0];
                var w = a0 != 0 ? Math.Abs(a0) : 1.0;
                return (StateSpace.Create(new double[,] { { -a0 } }, [w], [(b[0] - (b[1] * a0)) / w], b[1]), scale);
            }

            // (b2 s² + b1 s + b0)/(s² + a1 s + a0): the controllable form ξ1' = ξ2, ξ2' = −a0 ξ1 − a1 ξ2 + u with
            // the states scaled by w = √|a0| (x1 = w² ξ1, x2 = w ξ2). Unscaled, the form holds a0 (up to ω², 1e14
            // for a fast pair) beside 1, and the matrix exponential of such a non-normal matrix loses every digit;
            // scaled, each entry is of the size of the poles and each state of the size of the input.
            double c0 = den[0], c1 = den[1];
            var v = c0 != 0 ? Math.Sqrt(Math.Abs(c0)) : (c1 != 0 ? Math.Abs(c1) : 1.0);
            return (StateSpace.Create(
                new double[,] { { 0, v }, { -c0 / v, -c1 } },
                [0.0, v],
                [(b[0] - (b[2] * c0)) / (v * v), (b[1] - (b[2] * c1)) / v],
                b[2]), scale);
        }
    }
}
