using System.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Parsing;

public class ExpressionParserTests
{
    /// <summary>Valid inputs: expression, gain, zeros, poles (real parts / pairs as re±im), delay.</summary>
    public static TheoryData<string, double, double[], double[], double> ValidTable() => new()
    {
        { "10/(s(s+2)(s+10))", 10, [], [0, -2, -10], 0 },
        { "4/(s(s+0.5))", 4, [], [0, -0.5], 0 },
        { "2s", 2, [0], [], 0 },
        { "s(s+1)/(s+1)^3", 1, [0, -1], [-1, -1, -1], 0 },
        { "(s+1)(s+2)/((s+3)(s+4)(s+5))", 1, [-1, -2], [-3, -4, -5], 0 },
        { "1e-3/(s+1E2)", 1e-3, [], [-100], 0 },
        { ".5/(s+.25)", 0.5, [], [-0.25], 0 },
        { "10/s(s+2)", 10, [], [0, -2], 0 },
        { "-3/(s+1)", -3, [], [-1], 0 },
        { "1/(s+1) + 1/(s+2)", 2, [-1.5], [-1, -2], 0 },
        { "1 + 1/(s+1)", 1, [-2], [-1], 0 },
        { "s^-1", 1, [], [0], 0 },
        { "2*exp(-0.02s)/(s+1)", 2, [], [-1], 0.02 },
        { "exp(-0.5*s)/(s+1)", 1, [], [-1], 0.5 },
        { "exp(-s*0.1)*(s+2)/((s+1)(s+3))", 1, [-2], [-1, -3], 0.1 },
        { "3 \u2212 2/(s+1)", 3, [-1.0 / 3], [-1], 0 },
        { "2\u00D7s/(s+1)^2", 2, [0], [-1, -1], 0 },
    };

    [Theory]
    [MemberData(nameof(ValidTable))]
    public void Parse_Valid_GivesFactoredForm(string input, double gain, double[] zeros, double[] poles, double delay)
    {
        var result = ExpressionParser.Parse(input, requireProper: false);
        Assert.True(result.IsSuccess, result.Error?.Render());
        var tf = result.Value;
        Tolerance.Close(gain, tf.Gain, 1e-14, what: "gain");
        Tolerance.SameRoots(zeros.Select(z => new Complex(z, 0)).ToList(), tf.Zeros, 1e-12);
        Tolerance.SameRoots(poles.Select(p => new Complex(p, 0)).ToList(), tf.Poles, 1e-12);
        Tolerance.Close(delay, tf.Delay, 1e-15, what: "delay");
    }

    [Fact]
    public void Parse_QuadraticDenominator_GivesComplexPair()
    {
        var tf = ExpressionParser.ParseProper("(s+3)/(s^2+2s+5)").Value!;
        Tolerance.SameRoots([new Complex(-1, 2), new Complex(-1, -2)], tf.Poles, 1e-14);
        Tolerance.SameRoots([new Complex(-3, 0)], tf.Zeros, 1e-15);
    }

    /// <summary>Invalid inputs: expression, expected message start, index, length.</summary>
    public static TheoryData<string, string, int, int> InvalidTable() => new()
    {
        { "", "The expression is empty", 0, 1 },
        { "   ", "The expression is empty", 0, 3 },
        { "4/(s(s+2", "This '(' is never closed", 4, 1 },
        { "4/(s+2))", "Unexpected ')' without a matching '('", 7, 1 },
        { "s+", "Expected a term after '+'", 1, 1 },
        { "3*/s", "Expected a term after '*'", 2, 1 },
        { "1/(x+1)", "Unknown name 'x'", 3, 1 },
        { "s2+1", "A number cannot follow a factor directly ('2' here)", 1, 1 },
        { "(s+1)2", "A number cannot follow a factor directly ('2' here)", 5, 1 },
        { "s**2", "'**' is not a power operator here", 1, 2 },
        { "s^2.5", "The exponent must be a whole number", 2, 3 },
        { "s^99", "The exponent is larger than 40", 2, 2 },
        { "1/(s-s)", "Division by a polynomial that is identically zero", 2, 5 },
        { "s-s", "The expression is identically zero", 0, 3 },
        { "s^2/(s+1)", "Improper transfer function: numerator degree 2 exceeds denominator degree 1", 0, 9 },
        { "1/exp(-s)", "A delay cannot divide (that would be a prediction)", 2, 7 },
        { "exp(0.1s)/(s+1)", "exp(+T·s) is a prediction (negative delay) and cannot be built", 3, 6 },
        { "exp(s^2)/(s+1)", "The argument of exp must be -T·s with a delay T ≥ 0 (or a constant)", 3, 5 },
        { "exp-s", "exp must be followed by '('", 0, 3 },
        { "exp(-s)/(s+1) + 1/(s+2)", "A delay must multiply the whole transfer function", 14, 1 },
        { "1/(s+1e13)", "The number 1e13 is outside the range this tool accepts (1e-12 … 1e12 in magnitude)", 5, 4 },
        { "1/(s\u20131)", "'\u2013' looks like '-' but is a different character", 4, 1 },
        { "1/(s+1)#", "Unexpected character '#'", 7, 1 },
        { "1/(s+1,5)", "',' looks like '.' but is a different character", 6, 1 },
        { "()", "Expected a term after '('", 1, 1 },
        { "1/(s+1e8)^0*1/(s+1e9)", "A pole at -1e+09 rad/s is outside the range this tool handles (magnitude ≤ 1e8 rad/s)", 0, 21 },
    };

    [Theory]
    [MemberData(nameof(InvalidTable))]
    public void Parse_Invalid_GivesPositionedMessage(string input, string message, int index, int length)
    {
        var result = ExpressionParser.ParseProper(input);
        Assert.False(result.IsSuccess);
        var e = result.Error!;
        Assert.Equal(message, e.Message);
        Assert.Equal(index, e.Index);
        Assert.Equal(length, e.Length);
        Assert.Equal(input, e.Input);
        Assert.False(string.IsNullOrWhiteSpace(e.Hint));
    }

    [Fact]
    public void Parse_DeepNesting_IsRefusedNotOverflowed()
    {
        var input = new string('(', 5000) + "s" + new string(')', 5000);
        var result = ExpressionParser.Parse(input, requireProper: false);
        Assert.False(result.IsSuccess);
        Assert.StartsWith("Nesting is deeper than", result.Error!.Message);
    }

    [Fact]
    public void Render_PutsCaretUnderSpan()
    {
        var e = ExpressionParser.ParseProper("1/(x+1)").Error!;
        var lines = e.Render("  ").Split('\n');
        Assert.Equal("  1/(x+1)", lines[0]);
        Assert.Equal("     ^", lines[1]);
        Assert.StartsWith("Unknown name 'x' (column 4).", lines[2]);
    }

    [Fact]
    public void Parse_FormattedTransferFunction_RoundTrips()
    {
        var original = ExpressionParser.ParseProper("4.7(s+2.93)/(s(s+2)(s^2+2s+5))").Value!;
        var again = ExpressionParser.ParseProper(original.ToString()).Value!;
        Tolerance.Close(original.Gain, again.Gain, 1e-12);
        Tolerance.SameRoots(original.Poles, again.Poles, 1e-6);
        Tolerance.SameRoots(original.Zeros, again.Zeros, 1e-6);
    }
}
