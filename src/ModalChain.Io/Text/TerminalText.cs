using System.Text;

namespace ModalChain.Io.Text;

/// <summary>Makes text from a model safe to print on one line of a terminal.</summary>
/// <remarks>
/// A title is free text in the model file; printed as it is, an escape character (U+001B) or a C1 control such as
/// U+009B would be read by the terminal as a command (colours, cursor moves, a cleared screen), and a carriage return
/// or line feed would break the table below it. Every control character (Unicode category Cc: C0, DEL and C1) and every
/// character XML 1.0 forbids becomes U+FFFD, as in <see cref="MarkupText"/>, so the reader sees where it was.
/// </remarks>
public static class TerminalText
{
    /// <summary><paramref name="text"/> with control characters replaced by U+FFFD; clean text is returned without copying.</summary>
    public static string Line(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var clean = MarkupText.Clean(text);
        var first = -1;
        for (var i = 0; i < clean.Length && first < 0; i++)
            if (char.IsControl(clean[i])) first = i;
        if (first < 0) return clean;
        var line = new StringBuilder(clean.Length);
        foreach (var c in clean) line.Append(char.IsControl(c) ? MarkupText.Replacement : c);
        return line.ToString();
    }
}
