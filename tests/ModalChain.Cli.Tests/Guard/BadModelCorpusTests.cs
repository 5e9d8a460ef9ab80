using System.Text;
using System.Text.RegularExpressions;

namespace ModalChain.Cli.Tests.Guard;

/// <summary>
/// The corpus of hand-written bad model files (tests/ModalChain.Cli.Tests/Corpus/bad): each states in its header the
/// message it must produce and, optionally, the command it targets. Every file goes through <c>validate</c> and its
/// command in-process; each must exit 2 with its message at its place.
/// </summary>
/// <remarks>
/// Header lines: <c># expect: LINE:COL: error: start of the message</c> (the position in the file itself),
/// <c># expect: TABLE.csv:LINE:COL: error: ...</c> (in a time table beside it) or <c># expect: modalchain: error: ...</c>
/// (a command-line value refused); <c># command: harmonic FILE --points 5</c> runs that command too, and the model is
/// then otherwise valid, so <c>validate</c> must accept it.
/// </remarks>
public sealed partial class BadModelCorpusTests
{
    private static string Folder(string name) => Path.Combine(CliRun.RepositoryRoot, "tests", "ModalChain.Cli.Tests", "Corpus", name);

    public static TheoryData<string> BadFiles() =>
        [.. Directory.GetFiles(Folder("bad"), "*.yaml").Select(f => Path.GetFileName(f)).Order(StringComparer.Ordinal)];

    public static TheoryData<string> AcceptedFiles() =>
        [.. Directory.GetFiles(Folder("accepted"), "*.yaml").Select(f => Path.GetFileName(f)).Order(StringComparer.Ordinal)];

    [GeneratedRegex(@"^#\s*expect:\s*(.+?)\s*$", RegexOptions.Multiline)]
    private static partial Regex Expect();

    [GeneratedRegex(@"^#\s*command:\s*(.+?)\s*$", RegexOptions.Multiline)]
    private static partial Regex Command();

    [GeneratedRegex(@"^\S+\.csv:")]
    private static partial Regex TableFile();

    [GeneratedRegex(@"""([^""]*)""|(\S+)")]
    private static partial Regex Word();

    [Fact]
    public void Corpus_HasAtLeastFiftyFiles_CoveringEverySection()
    {
        var names = Directory.GetFiles(Folder("bad"), "*.yaml").Select(f => Path.GetFileName(f)).ToArray();
        Assert.True(names.Length >= 50, $"only {names.Length} bad files");
        // One file at least per family the model format documents (docs/model-format.md).
        foreach (var family in new[] { "syntax-", "unknown-", "type-", "missing-", "unit-", "value-", "ref-", "dup-", "self-", "time-", "table-",
                     "criteria-", "harmonic-", "transient-", "damping-", "load-", "space-", "cli-", "bom-crlf-" })
            Assert.Contains(names, n => n.StartsWith(family, StringComparison.Ordinal));
    }

    [Theory]
    [MemberData(nameof(BadFiles))]
    public void BadFile_ExitsTwo_WithItsLocatedMessage(string name)
    {
        var path = Path.Combine(Folder("bad"), name);
        var header = Decode(File.ReadAllBytes(path));
        var expect = Expect().Match(header);
        Assert.True(expect.Success, $"{name} has no '# expect:' line");
        var expected = expect.Groups[1].Value;
        var command = Command().Match(header);

        var validate = CliRun.Run("validate", path);
        if (command.Success)
        {
            // The file is a valid model; the command line is what is refused.
            Assert.True(validate.ExitCode == 0, $"validate {name}: {validate}");
            var args = Word().Matches(command.Groups[1].Value)
                .Select(m => m.Groups[1].Success ? m.Groups[1].Value : m.Groups[2].Value)
                .Select(a => a == "FILE" ? path : a).ToArray();
            var run = CliRun.Run(args);
            AssertRefused(run, expected, path, name);
        }
        else AssertRefused(validate, expected, path, name);
    }

    private static void AssertRefused(CliOutcome outcome, string expected, string path, string name)
    {
        Assert.True(outcome.ExitCode == 2, $"{name}: expected exit 2\n{outcome}");
        // A position belongs to the model file unless it names a table file beside it.
        var located = expected.StartsWith("modalchain:", StringComparison.Ordinal) ? expected
            : TableFile().IsMatch(expected) ? Path.Combine(Path.GetDirectoryName(path)!, expected)
            : path + ":" + expected;
        Assert.True(outcome.Stderr.Contains(located, StringComparison.Ordinal), $"{name}: expected on stderr\n  {located}\n{outcome}");
        Assert.DoesNotContain("   at ", outcome.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain(": valid", outcome.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(AcceptedFiles))]
    public void EncodingVariant_IsAccepted_AndGivesTheSameModes(string name)
    {
        var path = Path.Combine(Folder("accepted"), name);
        var reference = CliRun.Run("modes", Path.Combine(Folder("accepted"), "plain.yaml"), "--format", "csv");
        var validate = CliRun.Run("validate", path);
        Assert.True(validate.ExitCode == 0, $"{name}: {validate}");
        var modes = CliRun.Run("modes", path, "--format", "csv");
        Assert.True(modes.ExitCode == 0, $"{name}: {modes}");
        Assert.Equal(reference.Stdout, modes.Stdout);
    }

    // The header is read as the reader would: UTF-8 (with or without a mark) or UTF-16 with its mark.
    private static string Decode(byte[] bytes) => bytes switch
    {
        [0xFF, 0xFE, ..] => Encoding.Unicode.GetString(bytes, 2, bytes.Length - 2),
        [0xFE, 0xFF, ..] => Encoding.BigEndianUnicode.GetString(bytes, 2, bytes.Length - 2),
        _ => Encoding.UTF8.GetString(bytes).TrimStart('\uFEFF').Replace("\r\n", "\n", StringComparison.Ordinal),
    };
}
