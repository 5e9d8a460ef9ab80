using System.Text;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace ModalChain.Io.Tests.Yaml;

/// <summary>
/// The YAML parser run on a thread of its own, ahead of the tree, gives the same tree and the same diagnostics as the
/// parser run inline, for good text and for every kind of bad text [identity: one parser, two schedules].
/// </summary>
public class ReadAheadParserTests
{
    public static TheoryData<string, string> Texts()
    {
        var data = new TheoryData<string, string>
        {
            { "model", "title: t\nmasses:\n  deck: {mass: 3200 kg, at: [0, 1]}\n  skid: 850 kg\nsprings:\n  a: {between: [ground, deck], stiffness: 95 kN/mm}\n" },
            { "empty", "" },
            { "duplicate keys", "masses:\n  deck: 1 kg\n  deck: 2 kg\n  [x]: 3 kg\n" },
            { "aliases", "masses:\n  deck: &m 3200 kg\n  skid: *m\nsprings:\n  a: &s {between: [ground, deck], stiffness: 1 N/m}\n  b: *s\n" },
            { "unknown alias", "masses:\n  deck: *nowhere\n" },
            { "unclosed bracket", "masses:\n  deck: {mass: 3200 kg, at: [0, 1.2\n" },
            { "unclosed brace then more", "masses:\n  deck: {mass: 3200 kg\nsprings: {}\n" },
            { "open quote", "masses:\n  deck: \"3200 kg\n  skid: 850 kg\n" },
            { "tab", "masses:\n  deck: 3200 kg\n\tskid: 850 kg\n" },
            { "indentation", "masses:\n    deck: 3200 kg\n  skid: 850 kg\n" },
            { "second document", "masses: {deck: 1 kg}\n---\nmasses: {skid: 1 kg}\n" },
            { "deep nesting", "masses:\n  deck: " + new string('[', 20_000) + new string(']', 20_000) + "\n" },
            { "deep unclosed nesting", "masses:\n  deck: " + new string('{', 50_000) + "\n" },
            { "alias bomb", AliasBomb() },
        };
        // More events than several of the read-ahead's batches, with an error near the end.
        var big = new StringBuilder("masses:\n");
        for (var i = 0; i < 5_000; i++) big.Append("  m").Append(i).Append(": {mass: 40 kg, at: [").Append(i).Append(", 0]}\n");
        data.Add("large", big.ToString());
        data.Add("large with error at the end", big + "  m17: 1 kg\n  broken: [1, 2\n");
        return data;
    }

    [Theory]
    [MemberData(nameof(Texts))]
    public void ReadAhead_GivesTheTreeAndDiagnosticsOfTheInlineParser(string name, string text)
    {
        var (inlineTree, inlineDiagnostics) = Load(text, readAhead: false);
        var (aheadTree, aheadDiagnostics) = Load(text, readAhead: true);
        Assert.True(inlineDiagnostics.SequenceEqual(aheadDiagnostics), $"{name}: diagnostics differ:\n{string.Join("\n", inlineDiagnostics)}\n---\n{string.Join("\n", aheadDiagnostics)}");
        Assert.Equal(inlineTree, aheadTree);
    }

    [Fact]
    public void EndlessNesting_IsParsedOnlyToTheFirstLevelTooDeep()
    {
        // A hostile file must not be scanned past the event at which the tree refuses it.
        var inner = new EndlessParser(() => new SequenceStart(AnchorName.Empty, TagName.Empty, true, SequenceStyle.Flow));
        using (var ahead = new ReadAheadParser(inner))
        {
            var read = 0;
            while (ahead.MoveNext()) read++;
            Assert.Equal(YamlTree.MaximumDepth + 1, read);
        }
        Assert.Equal(YamlTree.MaximumDepth + 1, inner.Produced);
    }

    [Fact]
    public void ReaderThatStopsEarly_StopsTheParserThread()
    {
        var inner = new EndlessParser(() => new Scalar("x"));
        var ahead = new ReadAheadParser(inner);
        for (var i = 0; i < 10; i++) Assert.True(ahead.MoveNext());
        ahead.Dispose(); // returns only once the thread has ended
        var produced = inner.Produced;
        Thread.Sleep(50);
        Assert.Equal(produced, inner.Produced);
        Assert.InRange(produced, 10, 100_000);
    }

    /// <summary>A parser of an endless text: the same event for ever.</summary>
    private sealed class EndlessParser(Func<ParsingEvent> next) : IParser
    {
        private int _produced;

        public int Produced => Volatile.Read(ref _produced);

        public ParsingEvent? Current { get; private set; }

        public bool MoveNext()
        {
            Interlocked.Increment(ref _produced);
            Current = next();
            return true;
        }
    }

    private static string AliasBomb()
    {
        var lines = new List<string> { "a: &a [x, x, x, x, x, x, x, x, x]" };
        const string names = "abcdefghi";
        for (var i = 1; i < names.Length; i++)
            lines.Add($"{names[i]}: &{names[i]} [{string.Join(", ", Enumerable.Repeat("*" + names[i - 1], 9))}]");
        return string.Join("\n", lines) + "\n";
    }

    // The tree as text (every scalar, its quoting and the nesting) with every node's position, so two trees compare whole.
    private static (string Tree, List<Diagnostic> Diagnostics) Load(string text, bool readAhead)
    {
        var diagnostics = new List<Diagnostic>();
        var root = YamlTree.Load(new StringReader(text), () => text, "f.yaml", diagnostics, readAhead);
        return (root is null ? "(none)" : Describe(root), diagnostics);
    }

    internal static string Describe(YNode node)
    {
        var text = new StringBuilder();
        void Walk(YNode n)
        {
            text.Append('@').Append(n.Position.Line).Append(':').Append(n.Position.Column);
            switch (n)
            {
                case YScalar s: text.Append(s.Quoted ? " \"" : " '").Append(s.Value).Append('\''); break;
                case YSequence q:
                    text.Append(" [");
                    foreach (var item in q.Items) { Walk(item); text.Append(','); }
                    text.Append(']');
                    break;
                case YMapping m:
                    text.Append(m.DroppedKeys ? " {!" : " {");
                    foreach (var (k, v) in m.Entries) { Walk(k); text.Append(':'); Walk(v); text.Append(','); }
                    text.Append('}');
                    break;
            }
        }
        Walk(node);
        return text.ToString();
    }
}
