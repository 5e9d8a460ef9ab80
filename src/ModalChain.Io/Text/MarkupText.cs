using System.Text;

namespace ModalChain.Io.Text;

/// <summary>Makes any string safe to write into XML (SVG), HTML and JSON: characters that XML 1.0 forbids become U+FFFD.</summary>
/// <remarks>
/// XML 1.0 (fifth edition) §2.2 allows only #x9, #xA, #xD, #x20–#xD7FF, #xE000–#xFFFD and #x10000–#x10FFFF; everything else
/// (C0 controls such as ESC and NUL, U+FFFE, U+FFFF, and a surrogate without its partner) is replaced by U+FFFD, the
/// replacement character, so a title typed with stray control characters still gives a well-formed report that shows where
/// they were. Every writer of report text passes user text through <see cref="Clean"/>; text that is already clean is
/// returned as it is, without copying.
/// </remarks>
public static class MarkupText
{
    /// <summary>The character written in place of a forbidden one.</summary>
    public const char Replacement = '\uFFFD';

    /// <summary><paramref name="text"/> with every character XML 1.0 forbids replaced by <see cref="Replacement"/>.</summary>
    public static string Clean(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var first = FirstForbidden(text);
        if (first < 0) return text;
        var clean = new StringBuilder(text.Length);
        clean.Append(text, 0, first);
        for (var i = first; i < text.Length; i++)
        {
            var c = text[i];
            if (char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1]))
            {
                clean.Append(c).Append(text[++i]);
            }
            else clean.Append(IsAllowed(c) ? c : Replacement);
        }
        return clean.ToString();
    }

    /// <summary>True when <paramref name="text"/> holds no character XML 1.0 forbids.</summary>
    public static bool IsClean(string text) => FirstForbidden(text ?? throw new ArgumentNullException(nameof(text))) < 0;

    private static int FirstForbidden(string text)
    {
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1])) i++;
            else if (!IsAllowed(c)) return i;
        }
        return -1;
    }

    // A lone surrogate reaches here only when unpaired, so surrogates count as forbidden.
    private static bool IsAllowed(char c) =>
        c is '\t' or '\n' or '\r' || (c >= '\u0020' && c <= '\uD7FF') || (c >= '\uE000' && c <= '\uFFFD');
}
