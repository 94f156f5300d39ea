using System.Globalization;
using System.Numerics;
using CompAssist.Core.Common;

namespace CompAssist.Core.Proof;

/// <summary>
/// One uncertain plant parameter: the gain, or a pole (a real pole, or a complex pair named by its real
/// part) scaled by ±<see cref="Percent"/> %. Written <c>gain=20%</c> or <c>pole=-2:10%</c>. A varied pole
/// moves with the plant's DC (Bode) gain held fixed, as when a time constant changes.
/// </summary>
/// <param name="Pole">The pole varied, or null for the gain.</param>
/// <param name="Percent">Relative variation in percent (0 &lt; p &lt; 100).</param>
public sealed record PlantVariation(Complex? Pole, double Percent)
{
    /// <summary>Reads <c>gain=P%</c> or <c>pole=X:P%</c>.</summary>
    public static Outcome<PlantVariation> Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var hint = "Write gain=20% or pole=-2:10% (the pole at -2 moved by ±10 %).";
        var parts = text.Split('=', 2, StringSplitOptions.TrimEntries);
        if (parts.Length != 2)
        {
            return Outcome<PlantVariation>.Refused($"'{text}' is not a variation", hint);
        }

        var name = parts[0].ToLowerInvariant();
        var value = parts[1];
        Complex? pole = null;
        if (name == "pole")
        {
            var colon = value.LastIndexOf(':');
            if (colon < 0 || !double.TryParse(value[..colon], NumberStyles.Float, CultureInfo.InvariantCulture, out var p))
            {
                return Outcome<PlantVariation>.Refused($"'{text}' does not name a pole", hint);
            }

            pole = new Complex(p, 0);
            value = value[(colon + 1)..];
        }
        else if (name != "gain")
        {
            return Outcome<PlantVariation>.Refused($"'{parts[0]}' cannot be varied", "Vary 'gain' or 'pole'. " + hint);
        }

        if (!value.EndsWith('%') || !double.TryParse(value[..^1], NumberStyles.Float, CultureInfo.InvariantCulture, out var percent) || !(percent > 0 && percent < 100))
        {
            return Outcome<PlantVariation>.Refused($"'{value}' is not a percentage between 0 and 100", hint);
        }

        return Outcome<PlantVariation>.Success(new PlantVariation(pole, percent));
    }

    /// <summary>What is varied: "gain" or "pole -2".</summary>
    public string Subject => Pole is { } p ? $"pole {p.Real.ToString("G4", CultureInfo.InvariantCulture)}" : "gain";

    /// <summary>Short text such as "gain ±20 %" or "pole -2 ±10 %".</summary>
    public override string ToString() =>
        Pole is { } p ? $"pole {p.Real.ToString("G4", CultureInfo.InvariantCulture)} ±{Percent.ToString("G3", CultureInfo.InvariantCulture)} %" : $"gain ±{Percent.ToString("G3", CultureInfo.InvariantCulture)} %";
}
