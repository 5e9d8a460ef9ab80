using System.Text;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Tests.Yaml;

/// <summary>
/// The plain-subset reader gives, for every text it accepts, exactly the tree (values, quoting, positions, order) that
/// YamlDotNet's parser gives through <see cref="YamlTree"/>, and YamlDotNet finds nothing to report in that text
/// [reference library: YamlDotNet, the reader used for every other text; identity: same tree, same positions].
/// </summary>
public class PlainYamlReaderTests
{
    /// <summary>Reads <paramref name="bytes"/> both ways; asserts the identity when the plain reader accepts.</summary>
    private static bool AcceptsTheSameTree(byte[] bytes, string label)
    {
        var start = 0;
        while (bytes.AsSpan(start) is [0xEF, 0xBB, 0xBF, ..]) start += 3;
        var accepted = PlainYamlReader.TryLoad(bytes, start, out var fast);
        if (!accepted) return false;
        Assert.True(System.Text.Unicode.Utf8.IsValid(bytes), label); // the caller only hands valid UTF-8
        var diagnostics = new List<Diagnostic>();
        using var reader = new StreamReader(new MemoryStream(bytes, start, bytes.Length - start), new UTF8Encoding(false, true), false);
        var slow = YamlTree.Load(reader, () => Encoding.UTF8.GetString(bytes, start, bytes.Length - start), "f.yaml", diagnostics);
        Assert.True(diagnostics.Count == 0, $"{label}: accepted, but YamlDotNet reports {string.Join("; ", diagnostics)}");
        Assert.NotNull(slow);
        Assert.Equal(ReadAheadParserTests.Describe(slow!), ReadAheadParserTests.Describe(fast!));
        return true;
    }

    private static bool AcceptsTheSameTree(string text) => AcceptsTheSameTree(Encoding.UTF8.GetBytes(text), text);

    private static string Root()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) return dir.FullName;
        throw new InvalidOperationException("ModalChain.sln not found");
    }

    /// <summary>Every YAML file of the repository: the example models, the corpus of bad and accepted models, the
    /// spatial test models and the scale models.</summary>
    private static IEnumerable<string> RepositoryYaml()
    {
        var root = Root();
        foreach (var folder in new[] { "models", "tests/ModalChain.Cli.Tests/Corpus", "tests/ModalChain.Io.Tests", "tests/ModalChain.Benchmarks/scale" })
            foreach (var file in Directory.EnumerateFiles(Path.Combine(root, folder), "*.yaml", SearchOption.AllDirectories))
                if (!file.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                    && !file.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
                    yield return file;
    }

    [Fact]
    public void EveryRepositoryFile_ItAccepts_GivesYamlDotNetsTree()
    {
        var (files, accepted) = (0, 0);
        foreach (var file in RepositoryYaml())
        {
            files++;
            var bytes = File.ReadAllBytes(file);
            if (!System.Text.Unicode.Utf8.IsValid(bytes) || bytes is [0xFF, 0xFE, ..] or [0xFE, 0xFF, ..]) continue; // never handed to it
            if (AcceptsTheSameTree(bytes, file)) accepted++;
        }
        Assert.True(files > 100, $"only {files} files found");
        // Most files are in the subset (the example models, most of the corpus); the rest are declined whole.
        Assert.True(accepted > files / 3, $"only {accepted} of {files} files accepted: the subset covers too little");
    }

    [Fact]
    public void ExampleModels_AreAllInTheSubset()
    {
        foreach (var file in Directory.EnumerateFiles(Path.Combine(Root(), "models"), "*.yaml"))
            Assert.True(AcceptsTheSameTree(File.ReadAllBytes(file), file), $"{file} was declined");
    }

    [Fact]
    public void GeneratedGrid_WrittenOutInFull_IsAccepted()
    {
        // The shape of tests/ModalChain.Benchmarks/ModelFiles.cs, small.
        var text = new StringBuilder("title: grid 12 x 15\nmasses:\n");
        for (var r = 1; r <= 12; r++)
            for (var c = 1; c <= 15; c++)
                text.Append($"  g-{r}-{c}: {{mass: 40 kg, at: [{0.5 * c}, {0.5 * r}]}}\n");
        text.Append("springs:\n");
        for (var r = 1; r <= 12; r++)
            for (var c = 1; c < 15; c++)
                text.Append($"  h-{r}-{c}: {{between: [g-{r}-{c}, g-{r}-{c + 1}], stiffness: 5 MN/m}}\n");
        Assert.True(AcceptsTheSameTree(text.ToString()));
    }

    [Theory]
    [InlineData("a: 1\n")]
    [InlineData("a: 1")]
    [InlineData("a: 1\r\nb: {c: 2, d: [3, 4]}\r\n")]
    [InlineData("# head\n\n  # indented comment\na: 1   # trailing\n\nb:   two words  \n")]
    [InlineData("a:\n  b:\n    c: {}\n    d: []\n  e: [x]\nf: -5 mm\n")]
    [InlineData("a:\n  - {at: x, peak: 0.4 mm/s}   # c\n  - [1, 2]\n  - plain words\nb: 1\n")]
    [InlineData("a:\n    - 1\n    - 2\n")]
    [InlineData("title: Chiller, deck\nx: 1\n")]
    [InlineData("a: {b: µm, c: 1}\nμ: {é: [ü, 2]}  # ¿qué?\n")]
    [InlineData("a: {b:   1  ,   c: [ 2 ,3 ] }\n")]
    [InlineData("a: 2 %\nb: 1 kN*s/m\nc: 5'\nd: x!y&z|w>v\n")]
    [InlineData("a: ~\nb: null\nc: .5\nd: -.5\n")]
    [InlineData("a: {x: 1}\nb: [y]")]
    public void SubsetTexts_AreAccepted_WithYamlDotNetsTree(string text) => Assert.True(AcceptsTheSameTree(text), "declined");

    [Theory]
    [InlineData("")]
    [InlineData("# only a comment\n")]
    [InlineData("a: 'quoted'\n")]
    [InlineData("a: \"quoted\"\n")]
    [InlineData("a: &x 1\nb: *x\n")]
    [InlineData("a: 1\na: 2\n")]                 // duplicate: YamlDotNet's path reports it
    [InlineData("a: {b: 1, b: 2}\n")]
    [InlineData("a: {b: 1\n")]                    // unclosed
    [InlineData("a: {b: 1,\n  c: 2}\n")]          // multi-line flow
    [InlineData("a: one\n  two\n")]               // multi-line plain scalar
    [InlineData("a:\n")]                          // empty value
    [InlineData("a:\tb\n")]
    [InlineData("\ta: 1\n")]
    [InlineData("---\na: 1\n")]
    [InlineData("%YAML 1.1\n---\na: 1\n")]
    [InlineData("a: |\n  text\n")]
    [InlineData("a: !!str 1\n")]
    [InlineData("? a\n: 1\n")]
    [InlineData("a: 1\r b: 2\n")]
    [InlineData("a: 1\u0085b: 2\n")]
    [InlineData("a: 1 # x\u2028b: 2\n")]
    [InlineData("a: 😀\n")]
    [InlineData("- a\n- b\n")]
    [InlineData("  a: 1\n")]
    [InlineData("a:\n- 1\n")]
    [InlineData("a:\n  - b: 1\n")]
    [InlineData("a: [b: 1]\n")]
    [InlineData("a: {b: 1,}\n")]
    [InlineData("a: b: c\n")]
    [InlineData("a: 1\n b: 2\n")]
    [InlineData("a:b\n")]
    [InlineData("a : 1\n")]
    [InlineData("a: x#y\n")]
    public void TextsOutsideTheSubset_AreDeclined(string text) =>
        Assert.False(PlainYamlReader.TryLoad(Encoding.UTF8.GetBytes(text), 0, out _));

    [Fact]
    public void DeepNesting_IsDeclined_SoTheLimitIsReportedAsBefore()
    {
        var text = "a: " + new string('[', YamlTree.MaximumDepth + 2) + new string(']', YamlTree.MaximumDepth + 2) + "\n";
        Assert.False(PlainYamlReader.TryLoad(Encoding.UTF8.GetBytes(text), 0, out _));
    }

    /// <summary>Property: random edits of a model (characters that matter to YAML inserted, deleted or replaced),
    /// whenever the plain reader accepts the result, give YamlDotNet's tree and nothing for YamlDotNet to report.</summary>
    [Fact]
    public void RandomEdits_WhateverItAccepts_GivesYamlDotNetsTree()
    {
        const string model = """
            # A deck with a fan
            title: Deck, bay 3
            masses:
              deck: {mass: 2600 kg, at: [0, 0]}
              fan-base: 420 kg   # with frame
            springs:
              beams:  {between: [ground, deck], stiffness: 68 kN/mm}
              mounts: {between: [deck, fan-base], stiffness: 1.6 kN/mm}
            criteria:
              separation: {margin: 20 %, speeds: [1470 rpm], orders: [1, 2]}
              limits:
                - {at: fan-base, quantity: velocity, rms: 4.5 mm/s}
                - {at: deck, quantity: acceleration, peak: 0.05 m/s^2}
            """;
        string[] pieces = [" ", "  ", ":", ": ", ",", "{", "}", "[", "]", "#", " #", "-", "- ", "\n", "\r\n", "\r", "\t", "a", "7", "µ", "é", "'", "\"", "&", "*", "!", ".", "?", "~", "%", "@", "|", ">", "\n  ", "\n    - "];
        var random = new Random(20261202);
        var (tried, accepted) = (0, 0);
        for (var round = 0; round < 4000; round++)
        {
            var text = new StringBuilder(model);
            for (var edits = 1 + random.Next(3); edits > 0; edits--)
            {
                var at = random.Next(text.Length);
                switch (random.Next(3))
                {
                    case 0: text.Insert(at, pieces[random.Next(pieces.Length)]); break;
                    case 1: text.Remove(at, Math.Min(1 + random.Next(3), text.Length - at)); break;
                    default: text.Remove(at, 1).Insert(at, pieces[random.Next(pieces.Length)]); break;
                }
            }
            tried++;
            if (AcceptsTheSameTree(Encoding.UTF8.GetBytes(text.ToString()), text.ToString())) accepted++;
        }
        // Enough edits stay in the subset for the identity to be tested, and enough leave it for declining to be tested.
        Assert.True(accepted > tried / 10 && accepted < tried * 9 / 10, $"{accepted} of {tried} edited texts accepted");
    }
}
