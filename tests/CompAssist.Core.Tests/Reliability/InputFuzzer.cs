using System.Text;

namespace CompAssist.Core.Tests.Reliability;

/// <summary>
/// Generates malformed and borderline transfer-function expressions: grammar-built expressions, then
/// mutated by inserting, deleting or replacing characters (operators, digits, brackets, unicode look-alikes),
/// plus huge and tiny numbers, deep nesting and very long inputs. Seeded, so every failure is reproducible.
/// </summary>
internal sealed class InputFuzzer(int seed)
{
    private static readonly string[] Atoms = ["s", "1", "2", "0.5", "1e-3", "10", "3.7", "1e12", "1e-12", "1e300", "0", "exp(-0.1s)", "exp(-s)", "(s+1)", "(s^2+2s+5)"];
    private static readonly char[] Noise = "+-*/^().,s0123456789e exp\u2212\u2013\u00D7\u00B7\uFF08[]{}#%$x\t\n\u00A0".ToCharArray();
    private readonly Random _random = new(seed);

    public string Next()
    {
        var kind = _random.Next(10);
        var text = kind switch
        {
            0 => new string('(', _random.Next(1, 400)) + "s" + new string(')', _random.Next(0, 400)),
            1 => string.Concat(Enumerable.Repeat("(s+1)", _random.Next(1, 60))),
            2 => "1/(" + string.Join("+", Enumerable.Range(0, _random.Next(1, 200)).Select(_ => Atom())) + ")",
            3 => _random.Next(2) == 0 ? "1e" + _random.Next(-400, 400) + "/(s+1)" : new string('9', _random.Next(1, 400)),
            _ => Expression(_random.Next(1, 6)),
        };

        var mutations = _random.Next(4);
        var sb = new StringBuilder(text);
        for (var i = 0; i < mutations && sb.Length > 0; i++)
        {
            var at = _random.Next(sb.Length);
            switch (_random.Next(3))
            {
                case 0:
                    sb.Insert(at, Noise[_random.Next(Noise.Length)]);
                    break;
                case 1:
                    sb.Remove(at, 1);
                    break;
                default:
                    sb[at] = Noise[_random.Next(Noise.Length)];
                    break;
            }
        }

        return sb.ToString();
    }

    private string Atom() => Atoms[_random.Next(Atoms.Length)];

    private string Expression(int depth)
    {
        if (depth == 0)
        {
            return Atom();
        }

        return _random.Next(7) switch
        {
            0 => $"{Expression(depth - 1)}+{Expression(depth - 1)}",
            1 => $"{Expression(depth - 1)}-{Expression(depth - 1)}",
            2 => $"{Expression(depth - 1)}*{Expression(depth - 1)}",
            3 => $"{Expression(depth - 1)}/{Expression(depth - 1)}",
            4 => $"({Expression(depth - 1)})^{_random.Next(-3, 8)}",
            5 => $"{Expression(depth - 1)}{Expression(depth - 1)}",
            _ => $"({Expression(depth - 1)})",
        };
    }
}
