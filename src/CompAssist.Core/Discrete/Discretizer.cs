using System.Globalization;
using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Discrete;

/// <summary>Discretizes continuous transfer functions by each <see cref="DiscretizationMethod"/>, in factored form.</summary>
public static class Discretizer
{
    /// <summary>The result with any warnings.</summary>
    public sealed record Result(DiscreteTransferFunction Discrete, DiscretizationMethod Method, string GainMatching, IReadOnlyList<string> Warnings);

    /// <summary>Discretizes <paramref name="c"/> at sample time <paramref name="t"/>.</summary>
    public static Outcome<Result> Discretize(TransferFunction c, double t, DiscretizationMethod method, double? prewarpFrequency = null)
    {
        ArgumentNullException.ThrowIfNull(c);
        if (!(t > 0) || !double.IsFinite(t))
        {
            return Outcome<Result>.Refused($"Sample time {t} is not positive", "Give the sample time in seconds, e.g. 0.001.", Setting.SampleTime);
        }

        if (!c.IsProper && method != DiscretizationMethod.Backward)
        {
            // Backward Euler maps s to (1 − z⁻¹)/T: an ideal derivative becomes a causal difference. Tustin maps it
            // to (2/T)(1 − z⁻¹)/(1 + z⁻¹), causal but with a pole at z = −1 that rings at the Nyquist rate; the
            // others have no causal form at all.
            return Outcome<Result>.Refused(
                method is DiscretizationMethod.Tustin or DiscretizationMethod.Prewarp
                    ? "The compensator is improper (an ideal derivative, e.g. ideal PD or PID): under Tustin its derivative gets a pole at z = −1, an undamped oscillation at the Nyquist rate"
                    : "The compensator is improper (an ideal derivative, e.g. ideal PD or PID) and has no causal sampled form by this method",
                "Use backward Euler, which turns the ideal derivative into a causal difference, or add a derivative filter (a filter ratio of about 10).",
                Setting.FilterRatio);
        }

        if (c.Delay > 0)
        {
            return Outcome<Result>.Refused("The compensator contains a delay", "Discretize the rational part and implement the delay as a sample buffer.");
        }

        var warnings = new List<string>();
        var fastest = c.Poles.Concat(c.Zeros).Select(r => r.Magnitude).DefaultIfEmpty(0).Max();
        if (fastest * t > 0.5 * Math.PI)
        {
            warnings.Add($"The sample rate is slow for this compensator: its fastest corner ({F(fastest)} rad/s) is beyond a quarter of the sampling frequency. Sample faster.");
        }

        switch (method)
        {
            case DiscretizationMethod.Tustin:
                return Outcome<Result>.Success(new Result(Bilinear(c, t, 2.0 / t), method, "exact bilinear map (DC gain preserved)", warnings));
            case DiscretizationMethod.Prewarp:
            {
                var w0 = prewarpFrequency ?? DefaultPrewarp(c, t);
                if (!(w0 > 0) || w0 * t >= Math.PI)
                {
                    return Outcome<Result>.Refused($"Pre-warp frequency {F(w0)} rad/s is not between 0 and the Nyquist frequency {F(Math.PI / t)} rad/s", "Give a pre-warping frequency below π/T.", Setting.PrewarpFrequency);
                }

                var note = prewarpFrequency is null ? $"pre-warped at {F(w0)} rad/s (the default: the compensator's geometric-mean corner)" : $"pre-warped at {F(w0)} rad/s";
                return Outcome<Result>.Success(new Result(Bilinear(c, t, w0 / Math.Tan(w0 * t / 2)), method, note, warnings));
            }

            case DiscretizationMethod.Matched:
                return Outcome<Result>.Success(Matched(c, t, warnings));
            case DiscretizationMethod.Zoh:
                return Outcome<Result>.Success(new Result(ZeroOrderHold(c, t), method, "exact for piecewise-constant inputs", warnings));
            case DiscretizationMethod.Backward:
                return Outcome<Result>.Success(new Result(Euler(c, t, backward: true), method, "DC gain preserved", warnings));
            case DiscretizationMethod.Forward:
            {
                var d = Euler(c, t, backward: false);
                warnings.Add("Forward Euler maps the stable s-plane onto a disc that reaches outside the unit circle: stable poles can become unstable. Prefer Tustin or ZOH.");
                if (d.Poles.Any(p => p.Magnitude >= 1 && c.Poles.Any(q => q.Real < 0)))
                {
                    warnings.Add("Here a stable pole has been mapped onto or outside the unit circle.");
                }

                return Outcome<Result>.Success(new Result(d, method, "DC gain preserved", warnings));
            }

            default:
                throw new ArgumentOutOfRangeException(nameof(method), method, "Unknown method.");
        }
    }

    /// <summary>The zero-order-hold equivalent of a proper transfer function (a plant or a compensator).</summary>
    public static DiscreteTransferFunction ZeroOrderHold(TransferFunction g, double t)
    {
        ArgumentNullException.ThrowIfNull(g);
        var poles = g.Poles.Select(p => Complex.Exp(p * t)).ToList();
        var n = poles.Count;
        if (n == 0)
        {
            return DiscreteTransferFunction.FromFactors(g.Gain, [], [], t);
        }

        var ss = CascadeRealization.Of(g.WithoutDelay());
        var (phi, gamma) = StepSimulator.Discretize(ss, t);
        if (InvariantZeros(ss, phi, gamma) is { } invariant)
        {
            return DiscreteTransferFunction.FromFactors(invariant.Gain, invariant.Zeros, poles, t);
        }

        // G(z) = C(zI − Φ)⁻¹Γ + D; the numerator N(z) = den(z)·G(z) is recovered from its values on the unit
        // circle by an inverse discrete Fourier transform (well conditioned), then its roots are found.
        var den = Numerics.Polynomial.FromRoots(poles);
        var m = n + 1;
        var values = new Complex[m];
        for (var k = 0; k < m; k++)
        {
            var z = Complex.FromPolarCoordinates(1.0, 2 * Math.PI * (k + 0.5) / m);
            values[k] = den.Evaluate(z) * Evaluate(ss, phi, gamma, z);
        }

        var coefficients = new double[m];
        for (var j = 0; j < m; j++)
        {
            Complex sum = 0;
            for (var k = 0; k < m; k++)
            {
                sum += values[k] * Complex.FromPolarCoordinates(1.0, -2 * Math.PI * (k + 0.5) * j / m);
            }

            coefficients[j] = sum.Real / m;
        }

        // Coefficients below rounding against the largest are exact zeros (e.g. the leading one of a strictly proper G).
        var largest = coefficients.Max(Math.Abs);
        for (var j = 0; j < m; j++)
        {
            if (Math.Abs(coefficients[j]) <= 1e-12 * largest)
            {
                coefficients[j] = 0;
            }
        }

        if (g.RelativeDegree > 0)
        {
            // A strictly proper G has no direct feedthrough: the zⁿ coefficient is exactly zero.
            coefficients[n] = 0;
        }

        var num = Numerics.Polynomial.FromAscending(coefficients);
        var zeros = num.Degree > 0 ? Numerics.RootFinder.Find(num).Roots : [];
        return DiscreteTransferFunction.FromFactors(num.Leading, zeros, poles, t);
    }

    /// <summary>
    /// The zeros of the sampled system (Φ, Γ, C, D) as eigenvalues rather than polynomial roots: with D ≠ 0 they are
    /// the eigenvalues of Φ − Γ·C/D; with D = 0 and CΓ ≠ 0 they are those of (I − Γ·C/(CΓ))·Φ less the one
    /// structural eigenvalue at 0 (the output's next value set to zero: y[k+1] = CΦx + CΓu = 0). Polynomial roots of the
    /// expanded numerator lose the zeros that crowd against z = 1 at fast rates (a fifth-order lag at 0.5 ms: the DC
    /// gain three times off); the eigenvalues of the well-scaled cascade keep them. Null when CΓ vanishes (relative
    /// degree above one), left to the polynomial route.
    /// </summary>
    private static (double Gain, IReadOnlyList<Complex> Zeros)? InvariantZeros(StateSpace ss, double[,] phi, double[] gamma)
    {
        var n = ss.Order;
        var c = Enumerable.Range(0, n).Select(ss.C).ToArray();
        var cGamma = c.Zip(gamma, (x, y) => x * y).Sum();
        var scale = Math.Sqrt(c.Sum(x => x * x) * gamma.Sum(x => x * x));
        double factor;
        var m = new double[n, n];
        if (ss.D != 0)
        {
            factor = ss.D;
            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    m[i, j] = phi[i, j] - (gamma[i] * c[j] / ss.D);
                }
            }
        }
        else if (Math.Abs(cGamma) > 1e-9 * scale)
        {
            factor = cGamma;
            var cPhi = new double[n];
            for (var j = 0; j < n; j++)
            {
                for (var k = 0; k < n; k++)
                {
                    cPhi[j] += c[k] * phi[k, j];
                }
            }

            for (var i = 0; i < n; i++)
            {
                for (var j = 0; j < n; j++)
                {
                    m[i, j] = phi[i, j] - (gamma[i] * cPhi[j] / cGamma);
                }
            }
        }
        else
        {
            return null;
        }

        if (n == 0)
        {
            return (factor, []);
        }

        var eigen = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(m).Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Asymmetric).EigenValues.ToList();
        if (ss.D == 0)
        {
            eigen.RemoveAt(eigen.FindIndex(e => e.Magnitude == eigen.Min(x => x.Magnitude)));
        }

        if (eigen.Any(e => !double.IsFinite(e.Real) || !double.IsFinite(e.Imaginary)) || !Numerics.ConjugateSymmetry.IsClosed(eigen))
        {
            return null;
        }

        return (factor, Numerics.ConjugateSymmetry.Canonical(eigen));
    }

    private static Complex Evaluate(StateSpace ss, double[,] phi, double[] gamma, Complex z)
    {
        var n = ss.Order;
        var a = new Complex[n, n + 1];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                a[i, j] = (i == j ? z : Complex.Zero) - phi[i, j];
            }

            a[i, n] = gamma[i];
        }

        // Gaussian elimination with partial pivoting on (zI − Φ) x = Γ.
        for (var col = 0; col < n; col++)
        {
            var pivot = col;
            for (var r = col + 1; r < n; r++)
            {
                if (a[r, col].Magnitude > a[pivot, col].Magnitude)
                {
                    pivot = r;
                }
            }

            for (var j = 0; j <= n; j++)
            {
                (a[col, j], a[pivot, j]) = (a[pivot, j], a[col, j]);
            }

            for (var r = col + 1; r < n; r++)
            {
                var f = a[r, col] / a[col, col];
                for (var j = col; j <= n; j++)
                {
                    a[r, j] -= f * a[col, j];
                }
            }
        }

        var x = new Complex[n];
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = a[i, n];
            for (var j = i + 1; j < n; j++)
            {
                sum -= a[i, j] * x[j];
            }

            x[i] = sum / a[i, i];
        }

        Complex y = ss.D;
        for (var i = 0; i < n; i++)
        {
            y += ss.C(i) * x[i];
        }

        return y;
    }

    /// <summary>Factored bilinear map with s = c·(z − 1)/(z + 1): (s − r) = (c − r)(z − (c + r)/(c − r))/(z + 1).</summary>
    private static DiscreteTransferFunction Bilinear(TransferFunction g, double t, double c)
    {
        Complex gain = g.Gain;
        var zeros = new List<Complex>();
        var poles = new List<Complex>();
        foreach (var z in g.Zeros)
        {
            gain *= c - z;
            zeros.Add((c + z) / (c - z));
        }

        foreach (var p in g.Poles)
        {
            gain /= c - p;
            poles.Add((c + p) / (c - p));
        }

        zeros.AddRange(Enumerable.Repeat(new Complex(-1, 0), g.Poles.Length - g.Zeros.Length));
        return DiscreteTransferFunction.FromFactors(gain.Real, zeros, poles, t);
    }

    private static DiscreteTransferFunction Euler(TransferFunction g, double t, bool backward)
    {
        // Backward: (s − r) = (1 − rT)(z − 1/(1 − rT))/(zT); forward: (s − r) = (z − (1 + rT))/T.
        Complex gain = g.Gain;
        var zeros = new List<Complex>();
        var poles = new List<Complex>();
        foreach (var z in g.Zeros)
        {
            gain *= backward ? (1 - (z * t)) / t : 1 / t;
            zeros.Add(backward ? 1 / (1 - (z * t)) : 1 + (z * t));
        }

        foreach (var p in g.Poles)
        {
            gain /= backward ? (1 - (p * t)) / t : 1 / t;
            poles.Add(backward ? 1 / (1 - (p * t)) : 1 + (p * t));
        }

        if (backward)
        {
            // Each factor carries 1/z: the ratio leaves z^(n − m), i.e. zeros at the origin for n > m, and for an
            // ideal derivative (m > n) poles there: a causal difference such as (1 − z⁻¹)/T.
            var excess = g.Poles.Length - g.Zeros.Length;
            (excess >= 0 ? zeros : poles).AddRange(Enumerable.Repeat(Complex.Zero, Math.Abs(excess)));
        }

        return DiscreteTransferFunction.FromFactors(gain.Real, zeros, poles, t);
    }

    private static Result Matched(TransferFunction g, double t, List<string> warnings)
    {
        var zeros = g.Zeros.Select(z => Complex.Exp(z * t)).ToList();
        var poles = g.Poles.Select(p => Complex.Exp(p * t)).ToList();
        zeros.AddRange(Enumerable.Repeat(new Complex(-1, 0), g.Poles.Length - g.Zeros.Length));
        var unit = DiscreteTransferFunction.FromFactors(1.0, zeros, poles, t);
        string matching;
        double gain;
        var dc = g.DcGain;
        if (double.IsFinite(dc) && dc != 0)
        {
            gain = dc / unit.Evaluate(Complex.One).Real;
            matching = "gain matched at DC";
        }
        else
        {
            // An integrator or a zero at the origin: match the magnitude at a tenth of the Nyquist frequency.
            var w = 0.1 * Math.PI / t;
            gain = g.MagnitudeAt(new Complex(0, w)) / unit.Evaluate(Complex.FromPolarCoordinates(1.0, w * t)).Magnitude;
            matching = $"gain matched in magnitude at {F(w)} rad/s (a tenth of Nyquist; DC is {(double.IsInfinity(dc) ? "infinite" : "zero")})";
        }

        return new Result(DiscreteTransferFunction.FromFactors(gain, zeros, poles, t), DiscretizationMethod.Matched, matching, warnings);
    }

    private static double DefaultPrewarp(TransferFunction c, double t)
    {
        var corners = c.Poles.Concat(c.Zeros).Select(r => r.Magnitude).Where(m => m > 0).ToList();
        var w = corners.Count == 0 ? 0.1 * Math.PI / t : Math.Exp(corners.Average(Math.Log));
        return Math.Min(w, 0.9 * Math.PI / t);
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
