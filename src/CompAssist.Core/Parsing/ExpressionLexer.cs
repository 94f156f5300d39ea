using System.Globalization;

namespace CompAssist.Core.Parsing;

/// <summary>Splits an expression into tokens, or reports the first character it cannot read.</summary>
internal static class ExpressionLexer
{
    public static (List<Token> Tokens, ParseError? Error) Tokenize(string input)
    {
        var tokens = new List<Token>();
        var i = 0;
        while (i < input.Length)
        {
            var c = input[i];
            if (char.IsWhiteSpace(c))
            {
                i++;
                continue;
            }

            if (char.IsAsciiDigit(c) || (c == '.' && i + 1 < input.Length && char.IsAsciiDigit(input[i + 1])))
            {
                var start = i;
                while (i < input.Length && (char.IsAsciiDigit(input[i]) || input[i] == '.'))
                {
                    i++;
                }

                if (i < input.Length && (input[i] == 'e' || input[i] == 'E'))
                {
                    var j = i + 1;
                    if (j < input.Length && (input[j] == '+' || input[j] == '-'))
                    {
                        j++;
                    }

                    if (j < input.Length && char.IsAsciiDigit(input[j]))
                    {
                        i = j;
                        while (i < input.Length && char.IsAsciiDigit(input[i]))
                        {
                            i++;
                        }
                    }
                }

                var text = input[start..i];
                if (!double.TryParse(text, NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent, CultureInfo.InvariantCulture, out var value))
                {
                    return (tokens, Error(ParseMessages.BadNumber(text), input, start, text.Length));
                }

                tokens.Add(new Token(TokenKind.Number, start, text.Length, text, value));
                continue;
            }

            if (char.IsAsciiLetter(c))
            {
                var start = i;
                while (i < input.Length && char.IsAsciiLetterOrDigit(input[i]))
                {
                    i++;
                }

                var name = input[start..i];
                if (name == "s")
                {
                    tokens.Add(new Token(TokenKind.Variable, start, 1, name));
                }
                else if (name == "exp")
                {
                    tokens.Add(new Token(TokenKind.Exp, start, 3, name));
                }
                else if (name.Length > 1 && name[0] == 's' && name[1..].All(char.IsAsciiDigit))
                {
                    // "s2": a variable followed by a number; let the parser explain.
                    tokens.Add(new Token(TokenKind.Variable, start, 1, "s"));
                    var digits = name[1..];
                    tokens.Add(new Token(TokenKind.Number, start + 1, digits.Length, digits, double.Parse(digits, CultureInfo.InvariantCulture)));
                }
                else
                {
                    return (tokens, Error(ParseMessages.UnknownName(name), input, start, name.Length));
                }

                continue;
            }

            TokenKind? kind = c switch
            {
                '+' => TokenKind.Plus,
                '-' or '\u2212' => TokenKind.Minus,
                '*' or '\u00D7' or '\u00B7' => TokenKind.Star,
                '/' => TokenKind.Slash,
                '^' => TokenKind.Caret,
                '(' => TokenKind.OpenParen,
                ')' => TokenKind.CloseParen,
                _ => null,
            };
            if (kind is { } k)
            {
                if (c == '*' && i + 1 < input.Length && input[i + 1] == '*')
                {
                    return (tokens, Error(ParseMessages.PowerOperator(), input, i, 2));
                }

                tokens.Add(new Token(k, i, 1, c.ToString()));
                i++;
                continue;
            }

            var lookAlike = c switch
            {
                '\u2013' or '\u2014' or '\u2010' or '\u2011' or '\u2012' or '\uFE63' or '\uFF0D' => "-",
                '\uFF0B' => "+",
                '\u2215' or '\u00F7' => "/",
                '\uFF08' => "(",
                '\uFF09' => ")",
                ',' => ".",
                '[' or '{' => "(",
                ']' or '}' => ")",
                _ => null,
            };
            var problem = lookAlike is null ? ParseMessages.UnexpectedCharacter(c) : ParseMessages.LookAlike(c, lookAlike);
            return (tokens, Error(problem, input, i, 1));
        }

        tokens.Add(new Token(TokenKind.End, input.Length, 0, string.Empty));
        return (tokens, null);
    }

    public static ParseError Error((string Message, string Hint) problem, string input, int index, int length) =>
        new(problem.Message, problem.Hint, input, index, Math.Max(1, length));
}
