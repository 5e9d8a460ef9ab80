using System.Collections.Immutable;
using ModalChain.Io.Diagnostics;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace ModalChain.Io.Yaml;

/// <summary>A YAML node with the position where it starts.</summary>
internal abstract record YNode(SourcePosition Position);

/// <summary>A scalar; <see cref="IsPlainNull"/> is true for an empty plain scalar or <c>~</c>/<c>null</c>.</summary>
internal sealed record YScalar(SourcePosition Position, string Value, bool Quoted) : YNode(Position)
{
    public bool IsPlainNull => !Quoted && (Value.Length == 0 || Value is "~" or "null" or "Null" or "NULL");
}

/// <summary>A list of nodes, in document order.</summary>
/// <remarks>A sequence read from a file gives its items from the compact <see cref="NodeStore"/> when asked, so the
/// many small collections of a large model never all exist as objects at once.</remarks>
internal sealed record YSequence : YNode
{
    private readonly ImmutableArray<YNode> _items;
    private readonly NodeStore? _store;
    private readonly int _slot;

    public YSequence(SourcePosition position, ImmutableArray<YNode> items) : base(position) => _items = items;

    internal YSequence(SourcePosition position, NodeStore store, int slot) : base(position) => (_store, _slot) = (store, slot);

    public ImmutableArray<YNode> Items => _store is null ? _items : _store.Items(_slot);
}

/// <summary>A mapping whose keys are scalars, in document order, duplicates already rejected.</summary>
/// <remarks>A mapping read from a file gives its entries from the compact <see cref="NodeStore"/> when asked.</remarks>
internal sealed record YMapping : YNode
{
    private readonly ImmutableArray<KeyValuePair<YScalar, YNode>> _entries;
    private readonly NodeStore? _store;
    private readonly int _slot;

    /// <param name="position">Where the mapping starts.</param>
    /// <param name="entries">The entries kept, in document order.</param>
    /// <param name="droppedKeys">True when an entry was left out because its key was already reported (duplicate, or not a scalar).</param>
    public YMapping(SourcePosition position, ImmutableArray<KeyValuePair<YScalar, YNode>> entries, bool droppedKeys = false) : base(position) =>
        (_entries, DroppedKeys) = (entries, droppedKeys);

    internal YMapping(SourcePosition position, NodeStore store, int slot, bool droppedKeys) : base(position) =>
        (_store, _slot, DroppedKeys) = (store, slot, droppedKeys);

    /// <summary>The entries kept, in document order.</summary>
    public ImmutableArray<KeyValuePair<YScalar, YNode>> Entries => _store is null ? _entries : _store.Entries(_slot);

    /// <summary>True when an entry was left out because its key was already reported (duplicate, or not a scalar).</summary>
    public bool DroppedKeys { get; }

    /// <summary>The number of entries kept.</summary>
    public int Count => _store is null ? _entries.Length : _store.CountOf(_slot);

    /// <summary>The entries kept, in document order, as <see cref="Entries"/> gives them, but made one at a time: a
    /// section reader that walks a mapping of 100,000 entries once does not hold them all as objects at once.</summary>
    public IEnumerable<KeyValuePair<YScalar, YNode>> Walk() => _store is null ? _entries : _store.WalkEntries(_slot);

    /// <summary>The entries kept, as <see cref="Walk"/> gives them, but without making their nodes until a reader
    /// deconstructs one: a section reader reads a valid entry of a large section straight from its slots.</summary>
    public IEnumerable<YEntry> WalkSlots() => _store is null ? _entries.Select(e => new YEntry(e)) : _store.EntrySlotsOf(_slot);

    /// <summary>The value of <paramref name="key"/>, or null when the mapping has no such key.</summary>
    public YNode? this[string key]
    {
        get
        {
            foreach (var (k, v) in Entries)
                if (k.Value == key) return v;
            return null;
        }
    }
}

/// <summary>An entry of a mapping: its key and value nodes, or, for a mapping read from a file, their slots in the
/// <see cref="NodeStore"/>, from which the nodes are made when the entry is deconstructed.</summary>
internal readonly struct YEntry
{
    private readonly KeyValuePair<YScalar, YNode> _made;

    public YEntry(KeyValuePair<YScalar, YNode> made) => _made = made;

    public YEntry(NodeStore store, int keySlot, int valueSlot) => (Store, KeySlot, ValueSlot) = (store, keySlot, valueSlot);

    /// <summary>The store the entry was read into; null for an entry made in code.</summary>
    public NodeStore? Store { get; }

    /// <summary>The key's slot in <see cref="Store"/> (possibly an alias).</summary>
    public int KeySlot { get; }

    /// <summary>The value's slot in <see cref="Store"/> (possibly an alias).</summary>
    public int ValueSlot { get; }

    public void Deconstruct(out YScalar key, out YNode value)
    {
        if (Store is null) (key, value) = (_made.Key, _made.Value);
        else (key, value) = ((YScalar)Store.Node(KeySlot), Store.Node(ValueSlot));
    }
}

/// <summary>Reads YAML text into a small tree that keeps positions, reporting malformed text and duplicate keys.</summary>
/// <remarks>
/// The event-level parser of YamlDotNet is used rather than its object model so that every node keeps its mark and
/// duplicate keys (which YAML forbids) are reported with their position instead of silently overwriting.
/// <para>
/// Two limits keep hostile files from exhausting the machine: collections nest at most <see cref="MaximumDepth"/>
/// levels (a model needs four), checked as each '[' or '{' or block collection opens, before the scanner reads
/// further; and aliases may add at most <see cref="MaximumAliasExpansion"/> nodes to the tree as a reader that
/// follows them sees it (a file of nested aliases, "billion laughs", would otherwise stand for 10⁹ nodes), nor make
/// it deeper than the same depth limit.
/// </para>
/// </remarks>
internal static class YamlTree
{
    /// <summary>The deepest nesting of lists and mappings accepted, counting the top-level mapping as 1.</summary>
    public const int MaximumDepth = 32;

    /// <summary>The most nodes that aliases may add to the tree, counted as if every alias were replaced by a copy of its anchor.</summary>
    public const long MaximumAliasExpansion = 1_000_000; // the messages spell it out

    public static YNode? Load(string text, string file, List<Diagnostic> diagnostics) =>
        Load(new StringReader(text), () => text, file, diagnostics);

    /// <summary>Reads YAML from <paramref name="reader"/>; <paramref name="text"/> gives the same text as a string, asked
    /// for only when an error message needs to look at it.</summary>
    /// <param name="reader">The YAML text.</param>
    /// <param name="text">The same text as one string, for error messages.</param>
    /// <param name="file">The file name diagnostics give.</param>
    /// <param name="diagnostics">Where errors are added.</param>
    /// <param name="readAhead">Run the scanner and parser on a second thread (<see cref="ReadAheadParser"/>), worth it
    /// for large texts on a machine with more than one processor; the result is the same either way.</param>
    public static YNode? Load(TextReader reader, Func<string> text, string file, List<Diagnostic> diagnostics, bool readAhead = false)
    {
        using var ahead = readAhead ? new ReadAheadParser(new Parser(reader)) : null;
        var parser = new TrackingParser(ahead ?? (IParser)new Parser(reader));
        var store = new NodeStore();
        var tree = new TreeReader(parser, store, file, diagnostics);
        try
        {
            parser.Consume<StreamStart>();
            if (parser.Accept<StreamEnd>(out _)) return null;
            parser.Consume<DocumentStart>();
            var root = store.Node(tree.ReadNode(depth: 0).Slot);
            parser.Consume<DocumentEnd>();
            if (parser.Accept<DocumentStart>(out var second))
                diagnostics.Add(new Diagnostic(Severity.Error, file, Pos(second.Start), "a model file holds one YAML document; remove the second '---'"));
            return root;
        }
        catch (LimitExceeded e)
        {
            diagnostics.Add(new Diagnostic(Severity.Error, file, e.At, e.Message));
            return null;
        }
        catch (YamlException e)
        {
            var (at, message) = Explain(e, text, parser.OpenFlow);
            diagnostics.Add(new Diagnostic(Severity.Error, file, at, "malformed YAML: " + message));
            return null;
        }
        catch (InvalidOperationException)
        {
            // YamlDotNet's scanner throws this (not a YamlException, and without a mark) for some unclosed flow
            // collections followed by more lines, e.g. "deck: {mass: 3 kg" then "springs: ...".
            var (at, message) = parser.OpenFlow is { } open
                ? (Pos(open.Start), $"this '{open.Bracket}' is never closed; add '{Closing(open.Bracket)}' at the end of the entry")
                : (Pos(parser.LastStart), "the text after this point cannot be read; look for an unclosed '{', '[' or quote");
            diagnostics.Add(new Diagnostic(Severity.Error, file, at, "malformed YAML: " + message));
            return null;
        }
    }

    // YamlDotNet's messages say what the scanner saw; add the likely cause and, where its mark is unhelpful, a better place.
    private static (SourcePosition At, string Message) Explain(YamlException e, Func<string> text, OpenCollection? open)
    {
        var raw = Tidy(e.Message).TrimEnd('.');
        var at = Pos(e.Start);
        if (raw.Contains("tab", StringComparison.OrdinalIgnoreCase) && FirstIndentingTab(text()) is { } tab)
            return (tab, "a tab is used for indentation; YAML indents with spaces only");
        if (open is { } o && (raw.Contains("flow sequence", StringComparison.Ordinal) || raw.Contains("flow mapping", StringComparison.Ordinal)))
        {
            var opener = Pos(o.Start);
            var hint = $"the '{o.Bracket}' opened at line {opener.Line}, column {opener.Column} is not closed with '{Closing(o.Bracket)}'";
            // When the scanner only notices at a later line (often the end of the file), the opener is the place to fix.
            return at.Line > opener.Line ? (opener, $"this '{o.Bracket}' is never closed; add '{Closing(o.Bracket)}' at the end of the entry") : (at, $"{raw} ({hint})");
        }
        if (raw.Contains("quoted scalar", StringComparison.Ordinal))
            return (at, $"{raw} (is a quote left open?)");
        if (raw.Contains("did not find expected key", StringComparison.Ordinal))
            return (at, $"{raw} (check the indentation: the keys of one mapping must start in the same column)");
        if (raw.Contains("found invalid mapping", StringComparison.Ordinal))
            return (at, $"{raw} (a 'key: value' is indented deeper than the key before it, or the line above lacks its ':')");
        return (at, raw);
    }

    private static SourcePosition? FirstIndentingTab(string text)
    {
        var lines = text.Split('\n');
        for (var i = 0; i < lines.Length; i++)
        {
            var line = lines[i];
            var indent = line.Length - line.TrimStart(' ', '\t').Length;
            var tab = line.IndexOf('\t', 0, indent);
            if (tab >= 0) return new SourcePosition(i + 1, tab + 1);
        }
        return null;
    }

    private static char Closing(char bracket) => bracket == '{' ? '}' : ']';

    private readonly record struct OpenCollection(Mark Start, char Bracket);

    /// <summary>A limit of the reader was reached; <see cref="At"/> is where, the message says which and what to do.</summary>
    private sealed class LimitExceeded(SourcePosition at, string message) : Exception(message)
    {
        public SourcePosition At { get; } = at;
    }

    /// <summary>A node read, with its slot in the store, its height (levels of collections, 0 for a scalar) and its
    /// size (nodes, aliases counted as copies).</summary>
    private readonly record struct Anchored(int Slot, int Height, long Size);

    /// <summary>Remembers where the last event started and which flow collections are open, to place errors the scanner cannot.</summary>
    /// <remarks>Also refuses nesting deeper than <see cref="MaximumDepth"/> as soon as the opening event arrives.</remarks>
    private sealed class TrackingParser(IParser inner) : IParser
    {
        private readonly Stack<OpenCollection?> _open = new();

        public Mark LastStart { get; private set; } = Mark.Empty;

        /// <summary>The innermost flow collection ('{' or '[') not yet closed, if any.</summary>
        public OpenCollection? OpenFlow => _open.FirstOrDefault(c => c is not null);

        public ParsingEvent? Current => inner.Current;

        public bool MoveNext()
        {
            var moved = inner.MoveNext();
            if (!moved || inner.Current is not { } e) return moved;
            LastStart = e.Start;
            switch (e)
            {
                case MappingStart m: _open.Push(m.Style == MappingStyle.Flow ? new OpenCollection(m.Start, '{') : null); break;
                case SequenceStart q: _open.Push(q.Style == SequenceStyle.Flow ? new OpenCollection(q.Start, '[') : null); break;
                case MappingEnd or SequenceEnd when _open.Count > 0: _open.Pop(); break;
            }
            if (_open.Count > MaximumDepth)
                throw new LimitExceeded(Pos(e.Start),
                    $"lists and mappings are nested more than {MaximumDepth} levels deep here; a model needs a handful of levels (see docs/model-format.md)");
            return moved;
        }
    }

    /// <summary>Writes the parser's events into a <see cref="NodeStore"/>, one node per call of <see cref="ReadNode"/>.</summary>
    private sealed class TreeReader(IParser parser, NodeStore store, string file, List<Diagnostic> diagnostics)
    {
        private readonly Dictionary<string, Anchored> _anchors = [];
        private long _aliasExpansion;

        // The keys of the mapping open at each depth are gathered in one reusable list per depth (the depth is
        // bounded) to find duplicates; the store keeps one string per repeated key or value.
        private readonly List<(string Key, SourcePosition At)>[] _keys = new List<(string, SourcePosition)>[MaximumDepth + 1];

        /// <param name="depth">How many collections enclose the node.</param>
        public Anchored ReadNode(int depth)
        {
            if (parser.TryConsume<AnchorAlias>(out var alias))
            {
                if (!_anchors.TryGetValue(alias.Value.Value, out var target))
                    throw new YamlException(alias.Start, alias.End, $"unknown alias '*{alias.Value.Value}'");
                // The store keeps the alias as a reference to the anchored node, but whoever walks the tree meets a
                // copy at every alias.
                _aliasExpansion += target.Size;
                if (_aliasExpansion > MaximumAliasExpansion)
                    throw new LimitExceeded(Pos(alias.Start),
                        $"the aliases of this file expand to more than 1,000,000 nodes (here '*{alias.Value.Value}'); write the values out or use fewer nested aliases");
                // Aliases can make the tree deeper than the text (each anchor one level around the previous alias);
                // the readers and the writer walk the tree, so its depth is held to the same limit as the text's.
                if (depth + target.Height > MaximumDepth)
                    throw new LimitExceeded(Pos(alias.Start),
                        $"'*{alias.Value.Value}' here nests lists and mappings more than {MaximumDepth} levels deep; a model needs a handful of levels (see docs/model-format.md)");
                return target with { Slot = store.AddAlias(target.Slot) };
            }

            int slot;
            string? anchor;
            var height = 0; // levels of collections, counted as the text's depth is: 0 for a scalar
            var size = 1L;
            if (parser.TryConsume<Scalar>(out var scalar))
            {
                slot = store.AddScalar(Pos(scalar.Start), scalar.Value, scalar.Style is ScalarStyle.SingleQuoted or ScalarStyle.DoubleQuoted);
                anchor = scalar.Anchor.IsEmpty ? null : scalar.Anchor.Value;
            }
            else if (parser.TryConsume<SequenceStart>(out var seq))
            {
                slot = store.OpenCollection(Pos(seq.Start), NodeStore.Kind.Sequence);
                var count = 0;
                height = 1;
                while (!parser.TryConsume<SequenceEnd>(out _))
                {
                    var item = ReadNode(depth + 1);
                    count++;
                    (height, size) = (Math.Max(height, item.Height + 1), size + item.Size);
                }
                store.CloseCollection(slot, count, dropped: false);
                anchor = seq.Anchor.IsEmpty ? null : seq.Anchor.Value;
            }
            else if (parser.TryConsume<MappingStart>(out var map))
            {
                slot = store.OpenCollection(Pos(map.Start), NodeStore.Kind.Mapping);
                var keys = _keys[depth] ??= [];
                keys.Clear();
                Dictionary<string, SourcePosition>? seen = null; // only for mappings too long to search
                var dropped = false;
                height = 1;
                while (!parser.TryConsume<MappingEnd>(out _))
                {
                    var keyRead = ReadNode(depth + 1);
                    var valueRead = ReadNode(depth + 1);
                    (height, size) = (Math.Max(height, Math.Max(keyRead.Height, valueRead.Height) + 1), size + keyRead.Size + valueRead.Size);
                    if (store.ScalarOf(keyRead.Slot) is not var (key, at))
                    {
                        diagnostics.Add(new Diagnostic(Severity.Error, file, store.PositionOf(keyRead.Slot), "a key must be a plain name, not a list or mapping"));
                        store.DropEntry(keyRead.Slot);
                        dropped = true;
                        continue;
                    }
                    if (FirstDefinition(keys, ref seen, key) is { } first)
                    {
                        diagnostics.Add(new Diagnostic(Severity.Error, file, at,
                            $"duplicate key '{key}' (first defined at line {first.Line}); names must be unique"));
                        store.DropEntry(keyRead.Slot);
                        dropped = true;
                        continue;
                    }
                    keys.Add((key, at));
                    seen?.Add(key, at);
                }
                store.CloseCollection(slot, keys.Count, dropped);
                anchor = map.Anchor.IsEmpty ? null : map.Anchor.Value;
            }
            else
            {
                var current = parser.Current!;
                throw new YamlException(current.Start, current.End, $"unexpected {current.GetType().Name}");
            }

            var read = new Anchored(slot, height, size);
            if (anchor is not null) _anchors[anchor] = read;
            return read;
        }

        /// <summary>Where <paramref name="key"/> was first defined among the keys so far, or null when it is new.</summary>
        private static SourcePosition? FirstDefinition(List<(string Key, SourcePosition At)> keys, ref Dictionary<string, SourcePosition>? seen, string key)
        {
            const int searched = 16;
            if (seen is null && keys.Count < searched)
            {
                foreach (var (k, at) in keys)
                    if (k == key) return at;
                return null;
            }
            if (seen is null)
            {
                seen = new Dictionary<string, SourcePosition>(StringComparer.Ordinal);
                foreach (var (k, at) in keys) seen.Add(k, at);
            }
            return seen.TryGetValue(key, out var first) ? first : null;
        }
    }

    internal static SourcePosition Pos(Mark mark) => new(checked((int)mark.Line), checked((int)mark.Column));

    // YamlDotNet prefixes messages with "(Line: 3, Col: 5, Idx: 40) - (Line: ...): "; the position is already in front of ours.
    private static string Tidy(string message)
    {
        var i = message.LastIndexOf("): ", StringComparison.Ordinal);
        return i >= 0 && message.StartsWith('(') ? message[(i + 3)..] : message;
    }
}
