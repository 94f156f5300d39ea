namespace CompAssist.Core.Numerics;

/// <summary>Root finding could not produce roots that pass their residual check.</summary>
public sealed class RootFindingException : Exception
{
    public RootFindingException(string message) : base(message)
    {
    }

    public RootFindingException(string message, Exception inner) : base(message, inner)
    {
    }
}
