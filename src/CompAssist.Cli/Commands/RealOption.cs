using System.CommandLine;
using System.Globalization;

namespace CompAssist.Cli.Commands;

/// <summary>
/// An option that takes one real number, read in the invariant culture with a decimal point and an optional
/// exponent only: no thousands separators, so "2,5" is refused (with a hint) rather than read as 25.
/// NaN, infinities and subnormal values (below 1e-300 in magnitude) are refused here as unusable input;
/// each setting's own range is the validated input's business.
/// </summary>
internal sealed class RealOption : Option<double?>
{
    public RealOption(string name)
        : base(name)
    {
        CustomParser = result =>
        {
            if (result.Tokens.Count == 0)
            {
                return null;
            }

            var text = result.Tokens[^1].Value;
            if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value))
            {
                if (Core.Common.NumberRange.Usable(value))
                {
                    return value;
                }

                result.AddError($"{name} '{text}' is not a usable number: give a finite value (not NaN, an infinity or a value below 1e-300 in magnitude).");
                return null;
            }

            var comma = text.Contains(',', StringComparison.Ordinal) ? " (write the decimal point as '.', not ',')" : string.Empty;
            result.AddError($"{name} '{text}' is not a number, for example 2.5 or 1e-3{comma}.");
            return null;
        };
    }
}
