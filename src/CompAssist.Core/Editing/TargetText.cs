using System.Globalization;
using System.Numerics;
using System.Text.RegularExpressions;
using CompAssist.Core.Common;
using CompAssist.Core.Parsing;

namespace CompAssist.Core.Editing;

/// <summary>
/// Reads a typed target pole: "-2, 3.46" (real, imaginary), "-2 + 3.46j", "-2 ± 3.46j" (i or j), a real
/// point "-5", or a damping ratio and natural frequency "zeta=0.5 wn=4" (also "ζ=0.5 ωn=4").
/// </summary>
public static partial class TargetText
{
    private const string Hint = "Type re, im (e.g. -2, 3.46), re ± im j (e.g. -2 ± 3.46j), or zeta=0.5 wn=4.";

    /// <summary>The point (upper half-plane), or where the text is wrong.</summary>
    public static (Complex? Point, ParseError? Error) Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var t = text.Trim();
        if (t.Length == 0)
        {
            return (null, new ParseError("No target typed", Hint, text, 0, 1));
        }

        var polar = PolarForm().Match(t);
        if (polar.Success)
        {
            var zeta = D(polar.Groups["z"].Value);
            var wn = D(polar.Groups["w"].Value);
            if (!(zeta >= 0 && zeta <= 1) || !(wn > 0) || !double.IsFinite(wn))
            {
                return (null, Whole(text, "ζ must be within 0…1 and ωn above 0"));
            }

            return (new Complex(-zeta * wn, wn * Math.Sqrt(1 - (zeta * zeta))), null);
        }

        var pair = PairForm().Match(t);
        if (pair.Success)
        {
            return Finite(text, D(pair.Groups["re"].Value), D(pair.Groups["im"].Value));
        }

        var complex = ComplexForm().Match(t);
        if (complex.Success)
        {
            var im = complex.Groups["im"].Success ? D(complex.Groups["im"].Value) : 0.0;
            return Finite(text, D(complex.Groups["re"].Value), im);
        }

        var offset = text.Length - text.TrimStart().Length;
        for (var i = 0; i < t.Length; i++)
        {
            if (!(char.IsAsciiDigit(t[i]) || t[i] is '.' or 'e' or 'E' or '+' or '-' or '±' or ',' or ' ' or 'j' or 'i'))
            {
                return (null, new ParseError($"'{t[i]}' does not belong in a target", Hint, text, offset + i, 1));
            }
        }

        return (null, Whole(text, $"'{t}' is not a target point"));
    }

    private static (Complex? Point, ParseError? Error) Finite(string text, double re, double im) =>
        double.IsFinite(re) && double.IsFinite(im) && Math.Abs(re) <= NumberRange.Largest && Math.Abs(im) <= NumberRange.Largest
            ? (new Complex(re, Math.Abs(im)), null)
            : (null, Whole(text, "The target is too far out (beyond 1e12 rad/s)"));

    private static double D(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);

    private static ParseError Whole(string text, string message)
    {
        var start = text.Length - text.TrimStart().Length;
        return new ParseError(message, Hint, text, start, Math.Max(1, text.Trim().Length));
    }

    private const string Number = @"[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?";

    [GeneratedRegex(@"^(?:zeta|ζ|z)\s*=\s*(?<z>" + Number + @")\s*[, ]\s*(?:wn|ωn|w)\s*=\s*(?<w>" + Number + @")$", RegexOptions.IgnoreCase)]
    private static partial Regex PolarForm();

    [GeneratedRegex(@"^(?<re>" + Number + @")\s*,\s*(?<im>" + Number + @")$")]
    private static partial Regex PairForm();

    [GeneratedRegex(@"^(?<re>" + Number + @")(?:\s*(?:\+|-|±|\+-)\s*(?<im>(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*[ij])?$")]
    private static partial Regex ComplexForm();
}
