using System.CommandLine;
using System.Globalization;

namespace CompAssist.Cli.Commands;

/// <summary>An option that takes one whole number in the invariant culture (digits and a sign only).</summary>
internal sealed class WholeOption : Option<int?>
{
    public WholeOption(string name)
        : base(name)
    {
        CustomParser = result =>
        {
            if (result.Tokens.Count == 0)
            {
                return null;
            }

            var text = result.Tokens[^1].Value;
            if (int.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var value))
            {
                return value;
            }

            result.AddError($"{name} '{text}' is not a whole number, for example 3.");
            return null;
        };
    }
}
