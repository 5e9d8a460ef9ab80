using System.Text;
using System.Text.RegularExpressions;

namespace ModalChain.Cli.Tests.Guard;

/// <summary>What a corruption did, in words a developer reads in a failure message.</summary>
/// <param name="Kind">The family of the corruption (truncation, byte flip, ...).</param>
/// <param name="Detail">What exactly was changed.</param>
internal sealed record Corruption(string Kind, string Detail)
{
    public override string ToString() => $"{Kind}: {Detail}";
}

/// <summary>A model file as bytes after zero or more corruptions, with the list of what was done to it.</summary>
internal sealed class MutatedFile(byte[] bytes)
{
    public byte[] Bytes { get; set; } = bytes;
    public List<Corruption> Applied { get; } = [];

    /// <summary>True when only encoding changes (byte-order mark, line ends, UTF-16) were applied: the file must read as the original.</summary>
    public bool EncodingOnly => Applied.Count > 0 && Applied.All(c => c.Kind == Corruptions.EncodingKind);

    public string Text
    {
        get => Encoding.UTF8.GetString(Bytes);
        set => Bytes = Encoding.UTF8.GetBytes(value);
    }
}

/// <summary>Seeded corruptions of model text: each takes the text and a random source and changes one thing.</summary>
/// <remarks>
/// The corruptions imitate what happens to real files: cut off (a full disk, a failed copy), bytes changed (a bad
/// transfer), keys deleted or doubled while editing, a value of the wrong type or unit, numbers at the edges of
/// the double range, stray control characters, a byte-order mark and Windows line ends, and the hostile ones (deep
/// nesting, alias bombs). Every choice is drawn from the given <see cref="Random"/>, so a seed replays a case.
/// </remarks>
internal static partial class Corruptions
{
    public const string EncodingKind = "encoding";

    /// <summary>Numbers at the edges of what a double (or an int) holds, and spellings of NaN and infinity.</summary>
    public static readonly string[] ExtremeNumbers =
    [
        "1e308", "-1e308", "1.7976931348623157e308", "1e309", "-1e309", "1e999", "-0", "-0.0", "0", "0.0", "1e-320", "4.9e-324",
        "-1e-320", "1e-300", "NaN", "nan", ".nan", ".NaN", ".inf", "-.inf", "+.inf", "Infinity", "-Infinity", "inf", "∞",
        "9999999999999999999999999", "2147483647", "2147483648", "-2147483648", "-1", "0x10", "1_000", "1e", "+", "-", ".", "1..2",
        "00000000000000000000000000000000000000000000000000000001", "1e+308", "123456789012345678901234567890e-300",
    ];

    /// <summary>Values that are not a number with a unit, to put where one is expected (and the reverse).</summary>
    private static readonly string[] WrongTypes =
    [
        "[1, 2]", "[]", "{a: 1}", "{}", "~", "null", "''", "\"\"", "true", "yes", "no", "abc", "12 kg kg", "!!binary aGVsbG8=",
        "!!float 1", "!custom 3", "&anchor 3 kg", "\"3 kg\"", "'12'", "- 1", "|\n  multi\n  line", "2026-12-02", "12:30:00",
        "\"\\u0000\"", "1 2 3", "kg", "3kg", "3 KG", "3 Kg", "=3", "<<: {}", "? complex", "*undefined",
    ];

    /// <summary>Units of every kind and some that are none, to swap for a unit in the file.</summary>
    private static readonly string[] Units =
    [
        "kg", "g", "t", "lb", "N/m", "kN/m", "N/mm", "kN/mm", "MN/m", "lbf/in", "N*s/m", "N·s/m", "Ns/m", "kN*s/m", "lbf*s/in",
        "m", "mm", "cm", "um", "µm", "in", "Hz", "rpm", "cpm", "rad/s", "%", "N", "kN", "MN", "lbf", "s", "ms", "min", "rad",
        "deg", "°", "m/s", "mm/s", "in/s", "m/s^2", "mm/s^2", "g*mm", "kg*m", "oz*in", "furlong", "N/m^2", "kg/s", "Hz Hz", "",
        "%%", "1/s", "s^-1", "KG", "n/M", "k", "e3", "kg\u00a0", "N m",
    ];

    private static readonly string[] ControlCharacters =
    [
        "\0", "\u0001", "\u0007", "\b", "\u000b", "\f", "\u001b", "\u001b[31m", "\u007f", "\u0085", "\u2028", "\u2029", "\uFEFF",
        "\uFFFE", "\uFFFF", "\u202E", "\u200B", "\t", "\r", "\ud83d\ude00", "<script>", "]]>", "&amp;", "\"", "'", "\\",
    ];

    [GeneratedRegex(@"(?<![\w.])[+-]?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?(?![\w.])")]
    private static partial Regex Number();

    [GeneratedRegex(@"(?<=\d )[A-Za-z%°µ][A-Za-z*/^·0-9]*")]
    private static partial Regex Unit();

    // A key followed by its value: in flow style up to the next ',', '}' or ']'; in block style to the end of the line.
    [GeneratedRegex(@"(?<=^[ \t-]*|[{,][ \t]*)([A-Za-z][\w.-]*):(?:[ \t]+([^,{}\[\]#\n]*[^,{}\[\]#\n \t]))?", RegexOptions.Multiline)]
    private static partial Regex KeyValue();

    [GeneratedRegex(@"(?<=:[ \t]+)([^,{}\[\]#\n \t][^,{}\[\]#\n]*?)(?=[ \t]*(?:[,}\]]|#|$))", RegexOptions.Multiline)]
    private static partial Regex Value();

    /// <summary>Applies one corruption of a kind drawn from <paramref name="random"/>; known hazards are scaled by <paramref name="limits"/>.</summary>
    public static void ApplyOne(MutatedFile file, Random random, HazardLimits limits)
    {
        switch (random.Next(16))
        {
            case 0: Truncate(file, random); break;
            case 1: FlipBytes(file, random); break;
            case 2: case 3: DeleteKey(file, random); break;
            case 4: DuplicateKey(file, random); break;
            case 5: case 6: WrongType(file, random); break;
            case 7: SwapUnit(file, random); break;
            case 8: case 9: Extreme(file, random); break;
            case 10: ControlCharacter(file, random); break;
            case 11: EncodingChange(file, random); break;
            case 12: DeepNesting(file, random, limits); break;
            case 13: AliasBomb(file, random, limits); break;
            case 14: LineEdit(file, random); break;
            default: Extreme(file, random); break;
        }
    }

    public static void Truncate(MutatedFile file, Random random)
    {
        var at = random.Next(file.Bytes.Length + 1);
        file.Bytes = file.Bytes[..at];
        file.Applied.Add(new("truncation", $"cut at byte {at}"));
    }

    public static void FlipBytes(MutatedFile file, Random random)
    {
        if (file.Bytes.Length == 0) return;
        var bytes = (byte[])file.Bytes.Clone();
        var count = 1 + random.Next(4);
        var where = new List<string>();
        for (var i = 0; i < count; i++)
        {
            var at = random.Next(bytes.Length);
            var mask = (byte)(1 << random.Next(8));
            bytes[at] ^= random.Next(3) == 0 ? (byte)random.Next(1, 256) : mask;
            where.Add(at.ToString(System.Globalization.CultureInfo.InvariantCulture));
        }
        file.Bytes = bytes;
        file.Applied.Add(new("byte flip", $"bytes {string.Join(", ", where)}"));
    }

    public static void DeleteKey(MutatedFile file, Random random)
    {
        var text = file.Text;
        var matches = KeyValue().Matches(text);
        if (matches.Count == 0) return;
        var m = matches[random.Next(matches.Count)];
        var end = m.Index + m.Length;
        // Take one separating comma with a flow entry so the rest stays well formed.
        if (end < text.Length && text[end] == ',') end++;
        file.Text = text.Remove(m.Index, end - m.Index);
        file.Applied.Add(new("deleted key", $"'{m.Groups[1].Value}' at offset {m.Index}"));
    }

    public static void DuplicateKey(MutatedFile file, Random random)
    {
        var text = file.Text;
        var matches = KeyValue().Matches(text);
        if (matches.Count == 0) return;
        var m = matches[random.Next(matches.Count)];
        var lineStart = m.Index == 0 ? 0 : text.LastIndexOf('\n', m.Index - 1) + 1;
        var before = text[..m.Index].TrimEnd(' ', '\t');
        var flow = before.EndsWith('{') || before.EndsWith(',');
        if (flow)
            file.Text = text.Insert(m.Index + m.Length, ", " + m.Value);
        else
        {
            var lineEnd = text.IndexOf('\n', m.Index);
            if (lineEnd < 0) lineEnd = text.Length;
            var line = text[lineStart..lineEnd];
            file.Text = text.Insert(lineEnd, "\n" + line);
        }
        file.Applied.Add(new("duplicated key", $"'{m.Groups[1].Value}' at offset {m.Index}"));
    }

    public static void WrongType(MutatedFile file, Random random)
    {
        var text = file.Text;
        var matches = Value().Matches(text);
        if (matches.Count == 0) return;
        var m = matches[random.Next(matches.Count)];
        var replacement = WrongTypes[random.Next(WrongTypes.Length)];
        file.Text = text[..m.Index] + replacement + text[(m.Index + m.Length)..];
        file.Applied.Add(new("wrong type", $"'{m.Value}' at offset {m.Index} -> '{Printable(replacement)}'"));
    }

    public static void SwapUnit(MutatedFile file, Random random)
    {
        var text = file.Text;
        var matches = Unit().Matches(text);
        if (matches.Count == 0) return;
        var m = matches[random.Next(matches.Count)];
        var unit = Units[random.Next(Units.Length)];
        file.Text = text[..m.Index] + unit + text[(m.Index + m.Length)..];
        file.Applied.Add(new("swapped unit", $"'{m.Value}' at offset {m.Index} -> '{unit}'"));
    }

    public static void Extreme(MutatedFile file, Random random)
    {
        var text = file.Text;
        var matches = Number().Matches(text);
        if (matches.Count == 0) return;
        var m = matches[random.Next(matches.Count)];
        var number = ExtremeNumbers[random.Next(ExtremeNumbers.Length)];
        file.Text = text[..m.Index] + number + text[(m.Index + m.Length)..];
        file.Applied.Add(new("extreme number", $"'{m.Value}' at offset {m.Index} -> '{number}'"));
    }

    /// <summary>YAML escapes of characters a file cannot hold raw, for a double-quoted title.</summary>
    private static readonly string[] EscapedControls = [@"\x1b[31m", @"\0", @"\uFFFE", @"\uFFFF", @"\u202E", @"\x07", @"\e", @"\N", @"\L", @"\P", @"\x7f", @"\b", @"\uD800"];

    public static void ControlCharacter(MutatedFile file, Random random)
    {
        var text = file.Text;
        var title = TitleRegex().Match(text);
        if (title.Success && random.Next(3) == 0)
        {
            // A double-quoted title reaches characters YAML refuses raw (ESC, NUL, U+FFFE) into every output.
            var escape = EscapedControls[random.Next(EscapedControls.Length)];
            file.Text = text[..title.Index] + $"title: \"Deck {escape} end\"" + text[(title.Index + title.Length)..];
            file.Applied.Add(new("control character", $"title with the escape '{escape}'"));
            return;
        }
        var c = ControlCharacters[random.Next(ControlCharacters.Length)];
        int at;
        var titleAt = text.IndexOf("title:", StringComparison.Ordinal);
        if (random.Next(2) == 0 && titleAt >= 0)
        {
            // Into the title, which reaches every output (tables, JSON, CSV, SVG, HTML).
            var end = text.IndexOf('\n', titleAt);
            at = random.Next(titleAt + 7, Math.Max(titleAt + 8, end < 0 ? text.Length : end));
            at = Math.Min(at, text.Length);
        }
        else at = random.Next(text.Length + 1);
        file.Text = text.Insert(at, c);
        file.Applied.Add(new("control character", $"'{Printable(c)}' at offset {at}"));
    }

    /// <summary>Byte-order mark, CRLF, CR and UTF-16: a file that differs only by these must read as the original.</summary>
    public static void EncodingChange(MutatedFile file, Random random)
    {
        // Once is enough: a second change would read the first one's UTF-16 or mark as text and garble it.
        if (file.Applied.Any(c => c.Kind == EncodingKind)) return;
        var text = file.Text.Replace("\r\n", "\n", StringComparison.Ordinal);
        byte[] bom = [0xEF, 0xBB, 0xBF];
        switch (random.Next(5))
        {
            case 0:
                file.Bytes = [.. bom, .. Encoding.UTF8.GetBytes(text)];
                file.Applied.Add(new(EncodingKind, "UTF-8 byte-order mark"));
                break;
            case 1:
                file.Text = text.Replace("\n", "\r\n", StringComparison.Ordinal);
                file.Applied.Add(new(EncodingKind, "CRLF line ends"));
                break;
            case 2:
                file.Bytes = [.. bom, .. Encoding.UTF8.GetBytes(text.Replace("\n", "\r\n", StringComparison.Ordinal))];
                file.Applied.Add(new(EncodingKind, "byte-order mark and CRLF"));
                break;
            case 3:
                file.Bytes = [0xFF, 0xFE, .. Encoding.Unicode.GetBytes(text.Replace("\n", "\r\n", StringComparison.Ordinal))];
                file.Applied.Add(new(EncodingKind, "UTF-16 LE with mark and CRLF"));
                break;
            default:
                file.Bytes = [0xFE, 0xFF, .. Encoding.BigEndianUnicode.GetBytes(text)];
                file.Applied.Add(new(EncodingKind, "UTF-16 BE with mark"));
                break;
        }
    }

    public static void DeepNesting(MutatedFile file, Random random, HazardLimits limits)
    {
        int[] depths = [10, 100, 1_000, 5_000, 20_000, 100_000];
        var depth = Math.Min(depths[random.Next(depths.Length)], limits.MaxNesting);
        var text = file.Text;
        var matches = Value().Matches(text);
        var flowMap = random.Next(2) == 0;
        var nest = flowMap
            ? string.Concat(Enumerable.Repeat("{a: ", depth)) + "1" + new string('}', depth)
            : new string('[', depth) + new string(']', depth);
        if (matches.Count == 0 || random.Next(4) == 0)
            file.Text = "nested: " + nest + "\n" + text;
        else
        {
            var m = matches[random.Next(matches.Count)];
            file.Text = text[..m.Index] + nest + text[(m.Index + m.Length)..];
        }
        file.Applied.Add(new("deep nesting", $"{depth} levels of {(flowMap ? "{a: ...}" : "[...]")}"));
    }

    public static void AliasBomb(MutatedFile file, Random random, HazardLimits limits)
    {
        var levels = Math.Min(3 + random.Next(8), limits.MaxAliasLevels);
        var fan = Math.Min(2 + random.Next(9), limits.MaxAliasFan);
        var bomb = new StringBuilder();
        bomb.Append("x0: &x0 [").Append(string.Join(", ", Enumerable.Repeat("lol", fan))).Append("]\n");
        for (var i = 1; i <= levels; i++)
            bomb.Append($"x{i}: &x{i} [").Append(string.Join(", ", Enumerable.Repeat($"*x{i - 1}", fan))).Append("]\n");
        var text = file.Text;
        // Either top-level keys before the model, or the bomb used where the reader walks a value (a title, a mass).
        var top = bomb.ToString();
        var use = random.Next(3) switch
        {
            0 => text.Contains("title:", StringComparison.Ordinal)
                ? TitleRegex().Replace(text, $"title: *x{levels}", 1)
                : text + $"\ntitle: *x{levels}\n",
            1 => text.Replace("masses:\n", $"masses:\n  bomb: *x{levels}\n", StringComparison.Ordinal),
            _ => text,
        };
        file.Text = top + use;
        file.Applied.Add(new("alias bomb", $"{levels} levels of {fan} aliases"));
    }

    [GeneratedRegex(@"title:[^\n]*")]
    private static partial Regex TitleRegex();

    public static void LineEdit(MutatedFile file, Random random)
    {
        var lines = file.Text.Split('\n').ToList();
        if (lines.Count < 2) return;
        var i = random.Next(lines.Count);
        switch (random.Next(4))
        {
            case 0:
                lines.RemoveAt(i);
                file.Applied.Add(new("line edit", $"deleted line {i + 1}"));
                break;
            case 1:
                var j = random.Next(lines.Count);
                (lines[i], lines[j]) = (lines[j], lines[i]);
                file.Applied.Add(new("line edit", $"swapped lines {i + 1} and {j + 1}"));
                break;
            case 2:
                lines[i] = " " + lines[i];
                file.Applied.Add(new("line edit", $"indented line {i + 1} by one space"));
                break;
            default:
                lines[i] = lines[i].Replace("  ", "\t", StringComparison.Ordinal);
                file.Applied.Add(new("line edit", $"tabs for indentation on line {i + 1}"));
                break;
        }
        file.Text = string.Join('\n', lines);
    }

    /// <summary>The text with control characters escaped, for failure messages.</summary>
    public static string Printable(string text)
    {
        var b = new StringBuilder(text.Length);
        foreach (var c in text)
        {
            if (c == '\n') b.Append('\n');
            else if (char.IsControl(c) || c is '\uFFFE' or '\uFFFF' or '\u2028' or '\u2029' or '\u202E' or '\uFEFF' or '\u200B')
                b.Append(System.Globalization.CultureInfo.InvariantCulture, $"\\u{(int)c:X4}");
            else b.Append(c);
        }
        return b.ToString();
    }
}
