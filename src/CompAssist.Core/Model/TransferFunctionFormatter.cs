using System.Globalization;
using System.Numerics;
using System.Text;

namespace CompAssist.Core.Model;

/// <summary>Human-readable text for transfer functions and numbers, in the notation the parser reads back.</summary>
public static class TransferFunctionFormatter
{
    /// <summary>A number with up to <paramref name="digits"/> significant digits, invariant culture.</summary>
    public static string Number(double x, int digits = 6)
    {
        if (double.IsPositiveInfinity(x))
        {
            return "inf";
        }

        if (double.IsNegativeInfinity(x))
        {
            return "-inf";
        }

        if (double.IsNaN(x))
        {
            return "n/a";
        }

        if (x == 0.0)
        {
            return "0";
        }

        return x.ToString("G" + digits, CultureInfo.InvariantCulture).Replace("E", "e", StringComparison.Ordinal);
    }

    /// <summary>A complex number as <c>-2 + 3.46j</c>, or a plain real.</summary>
    public static string Complex(Complex z, int digits = 6)
    {
        if (z.Imaginary == 0.0)
        {
            return Number(z.Real, digits);
        }

        var sign = z.Imaginary < 0 ? "-" : "+";
        return $"{Number(z.Real, digits)} {sign} {Number(Math.Abs(z.Imaginary), digits)}j";
    }

    /// <summary>
    /// Factored form such as <c>4.7 (s + 2.93) / (s (s + 2) (s + 5.46))</c>; complex pairs as quadratics.
    /// The text parses back to the same transfer function (to the digits shown).
    /// </summary>
    public static string Factored(TransferFunction tf, int digits = 6)
    {
        ArgumentNullException.ThrowIfNull(tf);
        var numFactors = FactorList(tf.Zeros, digits);
        var denFactors = FactorList(tf.Poles, digits);
        var sb = new StringBuilder();
        if (numFactors.Count == 0 || Math.Abs(tf.Gain) != 1.0)
        {
            sb.Append(Number(tf.Gain, digits));
        }
        else if (tf.Gain < 0)
        {
            sb.Append('-');
        }

        if (numFactors.Count > 0)
        {
            sb.Append(sb.Length > 0 && sb[^1] != '-' ? " " : string.Empty).Append(string.Join(' ', numFactors));
        }

        if (denFactors.Count > 0)
        {
            sb.Append(" / ");
            sb.Append(denFactors.Count == 1 && denFactors[0].StartsWith('(') ? denFactors[0] : "(" + string.Join(' ', denFactors) + ")");
        }

        if (tf.Delay > 0)
        {
            sb.Append(" exp(-").Append(Number(tf.Delay, digits)).Append("s)");
        }

        return sb.ToString();
    }

    private static List<string> FactorList(IReadOnlyList<Complex> roots, int digits)
    {
        var parts = new List<string>();
        foreach (var r in roots.OrderBy(r => r.Magnitude).ThenBy(r => r.Imaginary))
        {
            if (r.Imaginary < 0)
            {
                continue;
            }

            if (r.Imaginary > 0)
            {
                // (s − r)(s − r̄) = s² − 2Re(r)s + |r|²
                var b = -2 * r.Real;
                var c = (r.Real * r.Real) + (r.Imaginary * r.Imaginary);
                var linear = b == 0 ? string.Empty : (b > 0 ? " + " : " - ") + Number(Math.Abs(b), digits) + "s";
                parts.Add($"(s^2{linear} + {Number(c, digits)})");
            }
            else if (r.Real == 0)
            {
                parts.Add("s");
            }
            else
            {
                parts.Add(r.Real < 0 ? $"(s + {Number(-r.Real, digits)})" : $"(s - {Number(r.Real, digits)})");
            }
        }

        return parts;
    }
}
