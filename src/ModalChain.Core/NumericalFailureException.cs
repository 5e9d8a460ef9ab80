namespace ModalChain.Core;

/// <summary>A numerical method could not produce a trustworthy result; the message states the figure that failed.</summary>
public sealed class NumericalFailureException : Exception
{
    /// <summary>Creates the exception with a message that names sizes or figures.</summary>
    public NumericalFailureException(string message) : base(message) { }

    /// <summary>Creates the exception wrapping the library error that caused it.</summary>
    public NumericalFailureException(string message, Exception inner) : base(message, inner) { }
}
