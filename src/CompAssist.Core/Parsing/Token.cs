namespace CompAssist.Core.Parsing;

/// <summary>Kinds of lexical token in a transfer-function expression.</summary>
internal enum TokenKind
{
    Number,
    Variable,
    Exp,
    Plus,
    Minus,
    Star,
    Slash,
    Caret,
    OpenParen,
    CloseParen,
    End,
}

/// <summary>One token with its span in the input.</summary>
internal readonly record struct Token(TokenKind Kind, int Index, int Length, string Text, double Number = 0.0);
