using System.Globalization;
using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;

namespace ModalChain.Reports.Tests.Pdf;

/// <summary>Reads the text of each page of a PDF as SkiaSharp writes it, to check report.pdf without a PDF library.</summary>
/// <remarks>
/// Enough of the format for SkiaSharp's output only (PDF 1.4 reference, §3.2 objects, §5.3 text operators, §5.9 ToUnicode
/// CMaps): objects "N 0 obj", streams compressed with FlateDecode, Type0 fonts with Identity-H encoding whose resource name
/// is "/F" plus the font's object number, glyphs shown with Tj and TJ as 4-digit hex strings, and bfchar/bfrange maps.
/// Pages come in file order (SkiaSharp writes each page as it ends). Text of one page is joined without layout: each
/// shown string is followed by a space.
/// </remarks>
internal static partial class PdfTextReader
{
    public static IReadOnlyList<string> Pages(byte[] pdf)
    {
        var text = Encoding.Latin1.GetString(pdf);
        var objects = new Dictionary<int, (string Dictionary, byte[]? Stream)>();
        foreach (Match m in ObjectStart().Matches(text))
        {
            var number = int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
            var end = text.IndexOf("endobj", m.Index, StringComparison.Ordinal);
            var body = text[(m.Index + m.Length)..end];
            var streamAt = body.IndexOf("stream", StringComparison.Ordinal);
            if (streamAt < 0 || !body.Contains("endstream", StringComparison.Ordinal))
            {
                objects[number] = (body, null);
                continue;
            }
            var dictionary = body[..streamAt];
            var start = streamAt + "stream".Length;
            if (body[start] == '\r') start++;
            if (body[start] == '\n') start++;
            var length = Length().Match(dictionary);
            var stop = length.Success ? start + int.Parse(length.Groups[1].Value, CultureInfo.InvariantCulture) : body.LastIndexOf("endstream", StringComparison.Ordinal);
            var bytes = Encoding.Latin1.GetBytes(body[start..stop]);
            objects[number] = (dictionary, dictionary.Contains("/FlateDecode", StringComparison.Ordinal) ? Inflate(bytes) : bytes);
        }

        var unicode = new Dictionary<string, Dictionary<int, string>>(StringComparer.Ordinal);
        foreach (var (number, (dictionary, _)) in objects)
            if (ToUnicode().Match(dictionary) is { Success: true } t && objects[int.Parse(t.Groups[1].Value, CultureInfo.InvariantCulture)].Stream is { } cmap)
                unicode["F" + number.ToString(CultureInfo.InvariantCulture)] = CMap(Encoding.Latin1.GetString(cmap));

        var pages = new List<string>();
        foreach (var (_, (dictionary, _)) in objects.OrderBy(o => o.Key))
        {
            if (!PageType().IsMatch(dictionary)) continue;
            var contents = Contents().Match(dictionary);
            var stream = objects[int.Parse(contents.Groups[1].Value, CultureInfo.InvariantCulture)].Stream!;
            pages.Add(Show(Encoding.Latin1.GetString(stream), unicode));
        }
        return pages;
    }

    private static string Show(string content, Dictionary<string, Dictionary<int, string>> fonts)
    {
        var result = new StringBuilder();
        Dictionary<int, string>? font = null;
        foreach (Match m in Operator().Matches(content))
        {
            if (m.Groups["font"].Success)
            {
                font = fonts.GetValueOrDefault(m.Groups["font"].Value);
                continue;
            }
            foreach (Match hex in HexString().Matches(m.Groups["shown"].Value))
            {
                var digits = hex.Groups[1].Value;
                for (var i = 0; i + 4 <= digits.Length; i += 4)
                {
                    var glyph = int.Parse(digits.AsSpan(i, 4), NumberStyles.HexNumber, CultureInfo.InvariantCulture);
                    result.Append(font is not null && font.TryGetValue(glyph, out var s) ? s : "\uFFFD");
                }
            }
            result.Append(' ');
        }
        return result.ToString();
    }

    private static Dictionary<int, string> CMap(string cmap)
    {
        var map = new Dictionary<int, string>();
        foreach (Match block in BfChar().Matches(cmap))
            foreach (Match pair in Pair().Matches(block.Groups[1].Value))
                map[Hex(pair.Groups[1].Value)] = Utf16(pair.Groups[2].Value);
        foreach (Match block in BfRange().Matches(cmap))
            foreach (Match range in Range().Matches(block.Groups[1].Value))
            {
                var low = Hex(range.Groups[1].Value);
                var high = Hex(range.Groups[2].Value);
                var first = Hex(range.Groups[3].Value);
                for (var g = low; g <= high; g++) map[g] = char.ConvertFromUtf32(first + g - low);
            }
        return map;
    }

    private static int Hex(string digits) => int.Parse(digits, NumberStyles.HexNumber, CultureInfo.InvariantCulture);

    private static string Utf16(string digits)
    {
        var units = new char[digits.Length / 4];
        for (var i = 0; i < units.Length; i++) units[i] = (char)Hex(digits.Substring(4 * i, 4));
        return new string(units);
    }

    private static byte[] Inflate(byte[] data)
    {
        using var input = new ZLibStream(new MemoryStream(data), CompressionMode.Decompress);
        using var output = new MemoryStream();
        input.CopyTo(output);
        return output.ToArray();
    }

    [GeneratedRegex(@"(?m)^(\d+) 0 obj\s*")]
    private static partial Regex ObjectStart();

    [GeneratedRegex(@"/Length (\d+)\b(?! 0 R)")]
    private static partial Regex Length();

    [GeneratedRegex(@"/ToUnicode (\d+) 0 R")]
    private static partial Regex ToUnicode();

    [GeneratedRegex(@"/Type /Page\b(?!s)")]
    private static partial Regex PageType();

    [GeneratedRegex(@"/Contents (\d+) 0 R")]
    private static partial Regex Contents();

    [GeneratedRegex(@"/(?<font>F\d+) [\d.]+ Tf|(?<shown>\[[^\]]*\]|<[0-9A-Fa-f]*>)\s*(TJ|Tj)")]
    private static partial Regex Operator();

    [GeneratedRegex(@"<([0-9A-Fa-f]*)>")]
    private static partial Regex HexString();

    [GeneratedRegex(@"beginbfchar(.*?)endbfchar", RegexOptions.Singleline)]
    private static partial Regex BfChar();

    [GeneratedRegex(@"<([0-9A-Fa-f]+)>\s*<([0-9A-Fa-f]+)>")]
    private static partial Regex Pair();

    [GeneratedRegex(@"beginbfrange(.*?)endbfrange", RegexOptions.Singleline)]
    private static partial Regex BfRange();

    [GeneratedRegex(@"<([0-9A-Fa-f]+)>\s*<([0-9A-Fa-f]+)>\s*<([0-9A-Fa-f]+)>")]
    private static partial Regex Range();
}
