using System.Xml;
using ModalChain.Io.Text;

namespace ModalChain.Io.Tests.Text;

/// <summary>The one helper that makes any string safe for SVG, HTML and JSON (XML 1.0 fifth edition, §2.2, production [2] Char).</summary>
public sealed class MarkupTextTests
{
    [Theory]
    [InlineData("\u001b[31m", "\uFFFD[31m")]
    [InlineData("a\0b", "a\uFFFDb")]
    [InlineData("\u0007\u0008\u000b\u000c\u001f", "\uFFFD\uFFFD\uFFFD\uFFFD\uFFFD")]
    [InlineData("x\uFFFEy\uFFFF", "x\uFFFDy\uFFFD")]
    public void ForbiddenCharacters_BecomeTheReplacementCharacter(string text, string expected) =>
        Assert.Equal(expected, MarkupText.Clean(text));

    [Fact]
    public void LoneSurrogates_BecomeTheReplacementCharacter_PairsAreKept()
    {
        // Built in code: attribute arguments are stored as UTF-8 in metadata, which cannot carry a lone surrogate.
        char high = (char)0xD83D, low = (char)0xDE00;
        Assert.Equal("a\uFFFDb", MarkupText.Clean($"a{high}b"));
        Assert.Equal("a\uFFFDb", MarkupText.Clean($"a{low}b"));
        Assert.Equal("end\uFFFD", MarkupText.Clean($"end{high}"));
        Assert.Equal("\uFFFD\uFFFD", MarkupText.Clean($"{low}{high}"));
        Assert.Equal($"x{high}{low}\uFFFDy", MarkupText.Clean($"x{high}{low}{high}y"));
    }

    [Theory]
    [InlineData("plain ASCII, 1.5 kN/mm")]
    [InlineData("tab\tnewline\nreturn\r")]
    [InlineData("Grüße · ω² · \uD7FF \uE000 \uFFFD")]
    [InlineData("pair \uD83D\uDE00 kept")]
    public void AllowedText_IsReturnedUnchanged(string text)
    {
        Assert.Same(text, MarkupText.Clean(text));
        Assert.True(MarkupText.IsClean(text));
    }

    [Fact]
    public void EverySingleUtf16Unit_CleanedText_IsAcceptedByAStrictXmlWriter()
    {
        // Exhaustive over the 65,536 code units: XmlWriter with CheckCharacters (the default) throws on any character
        // XML 1.0 forbids, so each cleaned unit must write without error and only forbidden ones may change.
        var changed = 0;
        for (var u = 0; u <= 0xFFFF; u++)
        {
            var text = ((char)u).ToString();
            var clean = MarkupText.Clean(text);
            using var writer = XmlWriter.Create(new StringWriter(), new XmlWriterSettings { CheckCharacters = true });
            writer.WriteElementString("t", clean);
            writer.Flush();
            if (clean != text) changed++;
        }
        // Forbidden single units: 32 C0 controls minus tab, newline, return (29), 2048 surrogates, U+FFFE and U+FFFF.
        Assert.Equal(29 + 2048 + 2, changed);
    }
}
