using System.Globalization;

namespace CompAssist.Core.Parsing;

/// <summary>Every message and hint the expression parser produces, in one place.</summary>
internal static class ParseMessages
{
    public const string ExampleExpression = "10/(s(s+2)(s+10))";

    public static (string Message, string Hint) Empty() =>
        ("The expression is empty", $"Type a transfer function of s, for example {ExampleExpression}.");

    public static (string Message, string Hint) UnexpectedCharacter(char c) =>
        ($"Unexpected character '{c}'", "Use numbers, s, + - * / ^, parentheses and exp(-T s).");

    public static (string Message, string Hint) LookAlike(char c, string plain) =>
        ($"'{c}' looks like '{plain}' but is a different character", $"Type a plain '{plain}'.");

    public static (string Message, string Hint) UnknownName(string name) =>
        ($"Unknown name '{name}'", "The only variable is s, and the only function is exp(-T s) for a delay.");

    public static (string Message, string Hint) PowerOperator() =>
        ("'**' is not a power operator here", "Write powers with ^, for example s^2.");

    public static (string Message, string Hint) BadNumber(string text) =>
        ($"'{text}' is not a number", "Write numbers like 2, 0.5 or 1e-3.");

    public static (string Message, string Hint) NumberOutOfRange(string text) =>
        ($"The number {text} is outside the range this tool accepts (1e-12 … 1e12 in magnitude)", "Rescale the units (e.g. ms instead of s) so numbers stay in range.");

    public static (string Message, string Hint) ExpectedOperand(string after) =>
        (after.Length == 0 ? "Expected a term" : $"Expected a term after '{after}'", "Add a number, s or a parenthesised expression, or remove the operator.");

    public static (string Message, string Hint) MissingClose() =>
        ("This '(' is never closed", "Add the missing ')'.");

    public static (string Message, string Hint) UnexpectedClose() =>
        ("Unexpected ')' without a matching '('", "Remove it or add the matching '('.");

    public static (string Message, string Hint) UnexpectedToken(string text) =>
        ($"Unexpected '{text}'", "Join terms with an operator such as + or *.");

    public static (string Message, string Hint) NumberAfterFactor(string number) =>
        ($"A number cannot follow a factor directly ('{number}' here)", $"Put numbers first (e.g. {number}s or {number}(s+1)), or use ^ for a power (s^{number}).");

    public static (string Message, string Hint) ExponentNotInteger() =>
        ("The exponent must be a whole number", "Write integer powers such as s^2; for fractional powers there is no rational transfer function.");

    public static (string Message, string Hint) ExponentTooLarge(int limit) =>
        ($"The exponent is larger than {limit.ToString(CultureInfo.InvariantCulture)}", "Use a smaller power; such orders are beyond a practical loop.");

    public static (string Message, string Hint) DivisionByZero() =>
        ("Division by a polynomial that is identically zero", "Check the denominator; it cancels to 0.");

    public static (string Message, string Hint) IdenticallyZero() =>
        ("The expression is identically zero", "A transfer function needs a non-zero numerator.");

    public static (string Message, string Hint) ExpNeedsParenthesis() =>
        ("exp must be followed by '('", "Write a delay as exp(-0.02s).");

    public static (string Message, string Hint) ExpArgument() =>
        ("The argument of exp must be -T·s with a delay T ≥ 0 (or a constant)", "Write a delay as exp(-0.02s) or exp(-0.02*s).");

    public static (string Message, string Hint) ExpPositive() =>
        ("exp(+T·s) is a prediction (negative delay) and cannot be built", "Write the delay with a minus sign: exp(-T s).");

    public static (string Message, string Hint) DelayNotFactor() =>
        ("A delay must multiply the whole transfer function", "Factor it out: exp(-T s)*(...), not a sum of terms with different delays.");

    public static (string Message, string Hint) DelayInDenominator() =>
        ("A delay cannot divide (that would be a prediction)", "Move exp(-T s) to the numerator.");

    public static (string Message, string Hint) Improper(int numeratorDegree, int denominatorDegree) =>
        ($"Improper transfer function: numerator degree {numeratorDegree} exceeds denominator degree {denominatorDegree}",
         "A physical plant or sensor has at least as many poles as zeros; check the parentheses.");

    public static (string Message, string Hint) OrderTooHigh(int order, int limit) =>
        ($"Order {order} is more than the {limit} this tool handles", "Reduce the model (drop fast poles) before designing.");

    public static (string Message, string Hint) RootOutOfRange(string what, string value) =>
        ($"A {what} at {value} rad/s is outside the range this tool handles (magnitude ≤ 1e8 rad/s)", "Rescale the time units or drop the very fast dynamics.");

    public static (string Message, string Hint) GainOutOfRange(string value) =>
        ($"The gain {value} is outside the range this tool handles (1e-30 … 1e30)", "Rescale the units of input or output.");

    public static (string Message, string Hint) NotFinite() =>
        ("The expression evaluates to a value that is not finite", "Check for overflowing powers or products.");

    public static (string Message, string Hint) RootsFailed() =>
        ("The polynomial's roots could not be verified (it is too ill-conditioned)", "Enter the model in factored form, e.g. (s+1)(s+2) instead of expanded coefficients.");
}
