using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Tests.Yaml;

/// <summary>
/// The tree made on demand from the compact node store is the tree the text describes, however often and in whatever
/// order it is walked [identity: the same text written out and compared].
/// </summary>
public class NodeStoreTests
{
    [Fact]
    public void LargeMapping_WalkedTwiceInAnyOrder_GivesTheSameEntriesEachTime()
    {
        // 3,000 entries with nested lists: far more collections than the store keeps made at once.
        var lines = new List<string> { "springs:" };
        for (var i = 0; i < 3_000; i++) lines.Add($"  s{i}: {{between: [m{i}, m{i + 1}], stiffness: {i} N/m}}");
        var root = Load(string.Join("\n", lines));
        var springs = (YMapping)((YMapping)root)["springs"]!;
        var first = ReadAheadParserTests.Describe(springs);
        for (var i = springs.Entries.Length - 1; i >= 0; i -= 7)
        {
            var (key, value) = springs.Entries[i];
            Assert.Equal($"s{i}", key.Value);
            var between = (YSequence)((YMapping)value)["between"]!;
            Assert.Equal([$"m{i}", $"m{i + 1}"], between.Items.Select(n => ((YScalar)n).Value));
            Assert.Equal($"{i} N/m", ((YScalar)((YMapping)value)["stiffness"]!).Value);
            Assert.Equal(new SourcePosition(i + 2, 3), key.Position);
        }
        Assert.Equal(first, ReadAheadParserTests.Describe(springs));
    }

    [Fact]
    public void Alias_GivesANodeEqualToTheAnchoredOne_AtTheAnchorsPosition()
    {
        var root = (YMapping)Load("a: &x {mass: 3 kg, at: [1, 2]}\nb: *x\nc: [*x, *x]\n");
        var a = ReadAheadParserTests.Describe(root["a"]!);
        Assert.Equal(a, ReadAheadParserTests.Describe(root["b"]!));
        var c = (YSequence)root["c"]!;
        Assert.All(c.Items, item => Assert.Equal(a, ReadAheadParserTests.Describe(item)));
        Assert.Equal(root["a"]!.Position, root["b"]!.Position); // where the anchored node starts, at its anchor
        Assert.Equal(new SourcePosition(1, 4), root["b"]!.Position);
    }

    [Fact]
    public void DroppedEntries_AreLeftOutAndTheMappingSaysSo()
    {
        var diagnostics = new List<Diagnostic>();
        var root = (YMapping)YamlTree.Load("k: 1\nk: 2\n[x]: 3\nj: 4\n", "f.yaml", diagnostics)!;
        Assert.True(root.DroppedKeys);
        Assert.Equal(["k", "j"], root.Entries.Select(e => e.Key.Value));
        Assert.Equal(["1", "4"], root.Entries.Select(e => ((YScalar)e.Value).Value));
        Assert.Equal(2, diagnostics.Count);
    }

    private static YNode Load(string text)
    {
        var diagnostics = new List<Diagnostic>();
        var root = YamlTree.Load(text, "f.yaml", diagnostics);
        Assert.Empty(diagnostics);
        return root!;
    }
}
