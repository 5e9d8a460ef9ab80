using System.Globalization;

namespace ModalChain.Io.Diagnostics;

/// <summary>How serious a diagnostic is.</summary>
public enum Severity
{
    /// <summary>The model can still be analysed, but a reviewer should know.</summary>
    Warning,
    /// <summary>The model cannot be analysed until this is fixed.</summary>
    Error,
}

/// <summary>A position in a source file, 1-based line and column.</summary>
/// <param name="Line">1-based line.</param>
/// <param name="Column">1-based column.</param>
public readonly record struct SourcePosition(int Line, int Column);

/// <summary>One problem found in an input file, at a position, in a sentence the user can act on.</summary>
/// <param name="Severity">Error or warning.</param>
/// <param name="File">The file as the user named it.</param>
/// <param name="Position">Where the problem is.</param>
/// <param name="Message">What is wrong and, where it helps, what to write instead.</param>
public sealed record Diagnostic(Severity Severity, string File, SourcePosition Position, string Message)
{
    /// <summary>The conventional one-line form <c>FILE:LINE:COL: error: message</c>.</summary>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture,
        $"{File}:{Position.Line}:{Position.Column}: {(Severity == Severity.Error ? "error" : "warning")}: {Message}");
}
