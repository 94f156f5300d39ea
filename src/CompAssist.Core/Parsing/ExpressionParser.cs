using CompAssist.Core.Common;
using System.Globalization;
using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Parsing;

/// <summary>
/// Reads transfer functions written in ordinary math notation.
/// </summary>
/// <remarks>
/// <para>Grammar (lowest to highest precedence):</para>
/// <code>
/// sum      := product (('+' | '-') product)*
/// product  := unary (('*' | '/') unary)*
/// unary    := ('+' | '-') unary | implicit
/// implicit := power power*          (juxtaposition: 2s, s(s+1), (s+1)(s+2))
/// power    := primary ('^' ['+'|'-'] integer)?
/// primary  := number | s | exp '(' sum ')' | '(' sum ')'
/// </code>
/// <para>Juxtaposition binds tighter than '*' and '/', so <c>10/s(s+2)</c> means <c>10/(s(s+2))</c>.
/// A delay is written <c>exp(-T s)</c> with T ≥ 0 in seconds and must multiply the whole expression.
/// The unicode minus sign and the multiplication signs × and · are read as '-' and '*'.</para>
/// </remarks>
public static class ExpressionParser
{
    /// <summary>Largest exponent accepted after '^'.</summary>
    public const int MaxExponent = 40;

    /// <summary>Largest number of poles or zeros accepted.</summary>
    public const int MaxOrder = 40;

    /// <summary>Largest pole or zero magnitude accepted, rad/s.</summary>
    public const double MaxRootMagnitude = 1e8;

    /// <summary>
    /// Parses a proper transfer function (plant or sensor).
    /// </summary>
    public static ParseResult<TransferFunction> ParseProper(string input) => Parse(input, requireProper: true);

    /// <summary>
    /// Parses a transfer function; improper ones (ideal PD, PID) are allowed when
    /// <paramref name="requireProper"/> is false.
    /// </summary>
    public static ParseResult<TransferFunction> Parse(string input, bool requireProper = true)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.Trim().Length == 0)
        {
            return Fail(ExpressionLexer.Error(ParseMessages.Empty(), input, 0, Math.Max(1, input.Length)));
        }

        var (tokens, lexError) = ExpressionLexer.Tokenize(input);
        if (lexError is not null)
        {
            return Fail(lexError);
        }

        var reader = new Reader(input, tokens);
        RationalValue value;
        try
        {
            value = reader.ParseAll();
        }
        catch (ParseFailure failure)
        {
            return Fail(failure.Error);
        }

        return Finish(input, value, requireProper);
    }

    private static ParseResult<TransferFunction> Finish(string input, RationalValue value, bool requireProper)
    {
        var whole = (0, input.Length);
        ParseResult<TransferFunction> Whole((string, string) problem) =>
            Fail(ExpressionLexer.Error(problem, input, whole.Item1, whole.Item2));

        if (value.IsZero)
        {
            return Whole(ParseMessages.IdenticallyZero());
        }

        if (!double.IsFinite(value.Gain) || value.Zeros.Concat(value.Poles).Any(r => !double.IsFinite(r.Real) || !double.IsFinite(r.Imaginary)))
        {
            return Whole(ParseMessages.NotFinite());
        }

        if (value.Delay < 0)
        {
            return Whole(ParseMessages.DelayInDenominator());
        }

        if (value.Zeros.Count > MaxOrder || value.Poles.Count > MaxOrder)
        {
            return Whole(ParseMessages.OrderTooHigh(Math.Max(value.Zeros.Count, value.Poles.Count), MaxOrder));
        }

        if (requireProper && value.Zeros.Count > value.Poles.Count)
        {
            return Whole(ParseMessages.Improper(value.Zeros.Count, value.Poles.Count));
        }

        foreach (var (roots, what) in new[] { (value.Zeros, "zero"), (value.Poles, "pole") })
        {
            foreach (var r in roots)
            {
                if (Complex.Abs(r) > MaxRootMagnitude)
                {
                    return Whole(ParseMessages.RootOutOfRange(what, TransferFunctionFormatter.Complex(r, 3)));
                }
            }
        }

        var absGain = Math.Abs(value.Gain);
        if (absGain > 1e30 || absGain < 1e-30)
        {
            return Whole(ParseMessages.GainOutOfRange(TransferFunctionFormatter.Number(value.Gain, 3)));
        }

        return ParseResult<TransferFunction>.Success(TransferFunction.FromFactors(value.Gain, value.Zeros, value.Poles, value.Delay));
    }

    private static ParseResult<TransferFunction> Fail(ParseError error) => ParseResult<TransferFunction>.Failure(error);

    /// <summary>Carries a positioned error out of the recursive descent.</summary>
    private sealed class ParseFailure(ParseError error) : Exception(error.Message)
    {
        public ParseError Error { get; } = error;
    }

    private sealed class Reader(string input, List<Token> tokens)
    {
        private const int MaxDepth = 200;
        private int _position;
        private int _depth;

        private Token Current => tokens[_position];

        public RationalValue ParseAll()
        {
            var value = Sum();
            if (Current.Kind == TokenKind.CloseParen)
            {
                throw Failure(ParseMessages.UnexpectedClose(), Current);
            }

            if (Current.Kind != TokenKind.End)
            {
                throw Failure(ParseMessages.UnexpectedToken(Current.Text), Current);
            }

            return value;
        }

        private RationalValue Sum()
        {
            var left = Product();
            while (Current.Kind is TokenKind.Plus or TokenKind.Minus)
            {
                var op = Advance();
                var right = Product();
                if (op.Kind == TokenKind.Minus)
                {
                    right = right.Negate();
                }

                if (!left.IsZero && !right.IsZero && left.Delay != right.Delay)
                {
                    throw Failure(ParseMessages.DelayNotFactor(), op);
                }

                try
                {
                    left = left.Plus(right);
                }
                catch (RootFindingException)
                {
                    throw Failure(ParseMessages.RootsFailed(), op);
                }
                catch (OverflowException)
                {
                    throw Failure(ParseMessages.NotFinite(), op);
                }
            }

            return left;
        }

        private RationalValue Product()
        {
            var left = Unary();
            while (Current.Kind is TokenKind.Star or TokenKind.Slash)
            {
                var op = Advance();
                var start = Current;
                var right = Unary();
                left = Checked(op.Kind == TokenKind.Star ? left.Times(right) : Divide(left, right, start), op);
            }

            return left;
        }

        private RationalValue Divide(RationalValue left, RationalValue right, Token divisorStart)
        {
            var span = Span(divisorStart, tokens[_position - 1]);
            if (right.IsZero)
            {
                throw Failure(ParseMessages.DivisionByZero(), span.Index, span.Length);
            }

            if (right.Delay != 0.0)
            {
                throw Failure(ParseMessages.DelayInDenominator(), span.Index, span.Length);
            }

            return left.Times(right.Reciprocal());
        }

        private RationalValue Unary()
        {
            if (Current.Kind is TokenKind.Minus or TokenKind.Plus)
            {
                var op = Advance();
                Enter(op);
                var operand = OperandAfter(op);
                _depth--;
                return op.Kind == TokenKind.Minus ? operand.Negate() : operand;
            }

            return Implicit();
        }

        private RationalValue OperandAfter(Token op)
        {
            if (!StartsPrimary(Current.Kind) && Current.Kind is not (TokenKind.Minus or TokenKind.Plus))
            {
                throw Failure(ParseMessages.ExpectedOperand(op.Text), Current.Kind == TokenKind.End ? op : Current);
            }

            return Unary();
        }

        private RationalValue Implicit()
        {
            var value = Power();
            while (StartsPrimary(Current.Kind))
            {
                if (Current.Kind == TokenKind.Number)
                {
                    throw Failure(ParseMessages.NumberAfterFactor(Current.Text), Current);
                }

                var at = Current;
                value = Checked(value.Times(Power()), at);
            }

            return value;
        }

        private RationalValue Power()
        {
            var baseStart = Current;
            var value = Primary();
            if (Current.Kind != TokenKind.Caret)
            {
                return value;
            }

            var caret = Advance();
            var negative = false;
            if (Current.Kind is TokenKind.Minus or TokenKind.Plus)
            {
                negative = Advance().Kind == TokenKind.Minus;
            }

            if (Current.Kind != TokenKind.Number)
            {
                throw Failure(ParseMessages.ExpectedOperand("^"), Current.Kind == TokenKind.End ? caret : Current);
            }

            var exponentToken = Advance();
            var e = exponentToken.Number;
            if (e != Math.Floor(e) || exponentToken.Text.Contains('.') || exponentToken.Text.Contains('e') || exponentToken.Text.Contains('E'))
            {
                throw Failure(ParseMessages.ExponentNotInteger(), exponentToken);
            }

            if (e > MaxExponent)
            {
                throw Failure(ParseMessages.ExponentTooLarge(MaxExponent), exponentToken);
            }

            var n = (int)e;
            if (negative)
            {
                var span = Span(baseStart, exponentToken);
                if (value.IsZero)
                {
                    throw Failure(ParseMessages.DivisionByZero(), span.Index, span.Length);
                }

                if (value.Delay != 0.0)
                {
                    throw Failure(ParseMessages.DelayInDenominator(), span.Index, span.Length);
                }

                value = value.Reciprocal();
            }

            var result = RationalValue.Constant(1.0);
            for (var k = 0; k < n; k++)
            {
                result = Checked(result.Times(value), caret);
            }

            return result;
        }

        private RationalValue Primary()
        {
            var token = Current;
            switch (token.Kind)
            {
                case TokenKind.Number:
                    Advance();
                    if (!NumberRange.Contains(token.Number))
                    {
                        throw Failure(ParseMessages.NumberOutOfRange(token.Text), token);
                    }

                    return RationalValue.Constant(token.Number);
                case TokenKind.Variable:
                    Advance();
                    return RationalValue.Variable();
                case TokenKind.OpenParen:
                    return Parenthesised();
                case TokenKind.Exp:
                    return Exponential();
                case TokenKind.CloseParen:
                    throw Failure(ParseMessages.ExpectedOperand(Previous()), token);
                case TokenKind.End:
                    throw Failure(ParseMessages.ExpectedOperand(Previous()), _position > 0 ? tokens[_position - 1] : token);
                default:
                    throw Failure(ParseMessages.ExpectedOperand(Previous()), token);
            }
        }

        private RationalValue Parenthesised()
        {
            var open = Advance();
            Enter(open);
            if (Current.Kind == TokenKind.CloseParen)
            {
                throw Failure(ParseMessages.ExpectedOperand("("), Current);
            }

            var inner = Sum();
            if (Current.Kind != TokenKind.CloseParen)
            {
                if (Current.Kind == TokenKind.End)
                {
                    throw Failure(ParseMessages.MissingClose(), open);
                }

                throw Failure(ParseMessages.UnexpectedToken(Current.Text), Current);
            }

            Advance();
            _depth--;
            return inner;
        }

        private RationalValue Exponential()
        {
            var exp = Advance();
            if (Current.Kind != TokenKind.OpenParen)
            {
                throw Failure(ParseMessages.ExpNeedsParenthesis(), exp);
            }

            var argumentStart = _position;
            var argument = Parenthesised();
            var span = Span(tokens[argumentStart], tokens[_position - 1]);
            if (argument.IsZero)
            {
                return RationalValue.Constant(1.0);
            }

            if (argument.Poles.Count == 0 && argument.Zeros.Count == 0 && argument.Delay == 0.0)
            {
                var constant = Math.Exp(argument.Gain);
                if (!double.IsFinite(constant) || constant == 0.0)
                {
                    throw Failure(ParseMessages.NotFinite(), span.Index, span.Length);
                }

                return RationalValue.Constant(constant);
            }

            if (argument.Poles.Count != 0 || argument.Zeros.Count != 1 || argument.Zeros[0] != Complex.Zero || argument.Delay != 0.0)
            {
                throw Failure(ParseMessages.ExpArgument(), span.Index, span.Length);
            }

            if (argument.Gain > 0)
            {
                throw Failure(ParseMessages.ExpPositive(), span.Index, span.Length);
            }

            return RationalValue.PureDelay(-argument.Gain);
        }

        /// <summary>Refuses a sub-expression whose order already exceeds the limit (before any expansion).</summary>
        private RationalValue Checked(RationalValue value, Token at)
        {
            if (value.Zeros.Count > MaxOrder || value.Poles.Count > MaxOrder)
            {
                throw Failure(ParseMessages.OrderTooHigh(Math.Max(value.Zeros.Count, value.Poles.Count), MaxOrder), at);
            }

            return value;
        }

        private void Enter(Token at)
        {
            if (++_depth > MaxDepth)
            {
                throw Failure(("Nesting is deeper than " + MaxDepth.ToString(CultureInfo.InvariantCulture) + " levels", "Simplify the expression."), at);
            }
        }

        private string Previous() => _position > 0 ? tokens[_position - 1].Text : string.Empty;

        private Token Advance() => tokens[_position++];

        private static bool StartsPrimary(TokenKind kind) =>
            kind is TokenKind.Number or TokenKind.Variable or TokenKind.Exp or TokenKind.OpenParen;

        private static (int Index, int Length) Span(Token first, Token last) =>
            (first.Index, Math.Max(1, last.Index + last.Length - first.Index));

        private ParseFailure Failure((string Message, string Hint) problem, Token at) =>
            Failure(problem, at.Index, at.Length);

        private ParseFailure Failure((string Message, string Hint) problem, int index, int length) =>
            new(ExpressionLexer.Error(problem, input, index, length));
    }
}
