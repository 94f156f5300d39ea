using System.CommandLine;
using System.Globalization;
using CompAssist.Core.Common;
using CompAssist.Core.Proof;

namespace CompAssist.Cli.Commands;

/// <summary>
/// An option that takes an interval LOW,HIGH of two real numbers separated by a comma (the list separator; each
/// number with a decimal point), both finite and within ±1e12, LOW below HIGH.
/// </summary>
internal sealed class RangeOption : Option<CommandRange?>
{
    public RangeOption(string name)
        : base(name)
    {
        CustomParser = result =>
        {
            if (result.Tokens.Count == 0)
            {
                return null;
            }

            var text = result.Tokens[^1].Value;
            var parts = text.Split(',');
            if (parts.Length == 2
                && double.TryParse(parts[0].Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var low)
                && double.TryParse(parts[1].Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var high))
            {
                if (NumberRange.Contains(low) && NumberRange.Contains(high) && low < high)
                {
                    return CommandRange.Create(low, high);
                }

                result.AddError($"{name} '{text}' needs LOW below HIGH, both finite and within ±1e12.");
                return null;
            }

            result.AddError($"{name} '{text}' is not LOW,HIGH: write two numbers with decimal points and a comma between them, for example {name}=0,100.");
            return null;
        };
    }
}
