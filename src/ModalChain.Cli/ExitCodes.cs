namespace ModalChain.Cli;

/// <summary>Process exit codes, documented in README.md and `modalchain --help`.</summary>
internal static class ExitCodes
{
    /// <summary>The command did what was asked.</summary>
    public const int Success = 0;
    /// <summary>A check ran and at least one criterion failed.</summary>
    public const int CheckFailed = 1;
    /// <summary>The input (model file or command line) is wrong; diagnostics say where.</summary>
    public const int InputError = 2;
    /// <summary>A numerical method failed; the message names the figure.</summary>
    public const int NumericalFailure = 3;
    /// <summary>A bug in the tool.</summary>
    public const int InternalError = 4;
}
