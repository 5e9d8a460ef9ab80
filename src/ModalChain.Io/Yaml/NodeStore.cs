using System.Collections.Immutable;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using ModalChain.Io.Diagnostics;

namespace ModalChain.Io.Yaml;

/// <summary>The nodes of one YAML document in document order, as compact slots, from which <see cref="YNode"/>s are made when asked.</summary>
/// <remarks>
/// A model written out in full has millions of nodes (100,000 masses are 800,000, their springs 1.6 million more).
/// Held as objects they all outlive several garbage collections and are copied at each, which cost more than
/// reading the text. Here a node is one slot of a few numbers in large chunks the collector never moves; the objects a
/// section reader walks are made from the slots on demand and are garbage as soon as it moves on.
/// <para>
/// Slots are in pre-order: a collection's slot is followed by its children's, and it records how many slots its whole
/// subtree spans, so a parent steps from one child to the next. An alias is a slot that names the anchored node's
/// slot; walking it gives a node equal to the anchored one. A mapping entry dropped while reading (its key was
/// duplicate or not a scalar, already reported) stays in the slots, marked, and is skipped.
/// </para>
/// <para>
/// The children of the few collections asked for last are kept in a small cache, so a reader that looks at one entry
/// several times (its keys, then each value) makes its objects once. A cache line is replaced whole, so a tree may
/// be read from several threads.
/// </para>
/// </remarks>
internal sealed class NodeStore
{
    internal enum Kind : byte { Scalar, Sequence, Mapping, Alias }

    [Flags]
    private enum Marks : byte { None = 0, Quoted = 1, DroppedKeys = 2, DroppedEntry = 4 }

    // Data is the text's number in the text table for a scalar, the number of children of a collection (entries of a
    // mapping) or the anchored slot of an alias; Span is the number of slots of the subtree, the node's own included.
    // No reference in a slot: the collector neither scans nor marks the chunks, and a slot is 20 bytes, not 32.
    [StructLayout(LayoutKind.Auto)]
    private struct Slot
    {
        public int Line;
        public int Column;
        public int Span;
        public int Data;
        public Kind Kind;
        public Marks Marks;
    }

    private const int ChunkBits = 15;
    private const int ChunkSize = 1 << ChunkBits;
    private Slot[][] _chunks = new Slot[4][];
    private int _count;

    // Every scalar's text, each short text once (large models repeat the same few keys and values, and every name
    // of an element end, hundreds of thousands of times).
    private readonly List<string> _texts = [];
    private readonly Dictionary<string, int> _textIds = new(StringComparer.Ordinal);
    private readonly Dictionary<string, int>.AlternateLookup<ReadOnlySpan<char>> _textLookup;
    private const int ShortText = 32;

    public NodeStore() => _textLookup = _textIds.GetAlternateLookup<ReadOnlySpan<char>>();

    private ref Slot At(int slot) => ref _chunks[slot >> ChunkBits][slot & (ChunkSize - 1)];

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int Add(Kind kind, SourcePosition position)
    {
        var chunk = _count >> ChunkBits;
        if (chunk == _chunks.Length) Array.Resize(ref _chunks, 2 * _chunks.Length);
        _chunks[chunk] ??= new Slot[ChunkSize];
        ref var s = ref At(_count);
        s = new Slot { Kind = kind, Line = position.Line, Column = position.Column, Span = 1 };
        return _count++;
    }

    /// <summary>The number of <paramref name="text"/> in the text table, and the table's string for it (one string per
    /// short text, so a reader may keep it).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public (int Id, string Text) Intern(ReadOnlySpan<char> text)
    {
        if (text.Length <= ShortText && _textLookup.TryGetValue(text, out var known)) return (known, _texts[known]);
        return Intern(new string(text));
    }

    /// <inheritdoc cref="Intern(ReadOnlySpan{char})"/>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public (int Id, string Text) Intern(string text)
    {
        if (text.Length > ShortText)
        {
            _texts.Add(text);
            return (_texts.Count - 1, text);
        }
        if (_textIds.TryGetValue(text, out var known)) return (known, _texts[known]);
        _texts.Add(text);
        _textIds.Add(text, _texts.Count - 1);
        return (_texts.Count - 1, text);
    }

    public int AddScalar(SourcePosition position, string text, bool quoted) => AddScalar(position, Intern(text).Id, quoted);

    /// <summary>Adds a scalar whose text is number <paramref name="textId"/> of <see cref="Intern(string)"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public int AddScalar(SourcePosition position, int textId, bool quoted)
    {
        var slot = Add(Kind.Scalar, position);
        ref var s = ref At(slot);
        s.Data = textId;
        if (quoted) s.Marks = Marks.Quoted;
        return slot;
    }

    /// <summary>Adds an alias of the node at <paramref name="target"/>, which is never itself an alias.</summary>
    public int AddAlias(int target)
    {
        ref var t = ref At(target);
        var slot = Add(Kind.Alias, new SourcePosition(t.Line, t.Column));
        At(slot).Data = Resolve(target);
        return slot;
    }

    /// <summary>Adds a sequence or mapping whose children follow; <see cref="CloseCollection"/> ends it.</summary>
    public int OpenCollection(SourcePosition position, Kind kind) => Add(kind, position);

    public void CloseCollection(int slot, int children, bool dropped)
    {
        ref var s = ref At(slot);
        s.Span = _count - slot;
        s.Data = children;
        if (dropped) s.Marks |= Marks.DroppedKeys;
    }

    /// <summary>Marks the mapping entry whose key is at <paramref name="keySlot"/> as left out.</summary>
    public void DropEntry(int keySlot) => At(keySlot).Marks |= Marks.DroppedEntry;

    /// <summary>The text and position of the scalar at <paramref name="slot"/> (through an alias), or null for a collection.</summary>
    public (string Text, SourcePosition At)? ScalarOf(int slot)
    {
        ref var s = ref At(Resolve(slot));
        return s.Kind == Kind.Scalar ? (_texts[s.Data], new SourcePosition(s.Line, s.Column)) : null;
    }

    public SourcePosition PositionOf(int slot)
    {
        ref var s = ref At(Resolve(slot));
        return new SourcePosition(s.Line, s.Column);
    }

    /// <summary>The slot an alias at <paramref name="slot"/> stands for, or <paramref name="slot"/> itself.</summary>
    public int Resolve(int slot)
    {
        ref var s = ref At(slot);
        return s.Kind == Kind.Alias ? s.Data : slot;
    }

    /// <summary>The node at <paramref name="slot"/>; an alias gives the anchored node.</summary>
    public YNode Node(int slot)
    {
        slot = Resolve(slot);
        ref var s = ref At(slot);
        var position = new SourcePosition(s.Line, s.Column);
        return s.Kind switch
        {
            Kind.Scalar => new YScalar(position, _texts[s.Data], (s.Marks & Marks.Quoted) != 0),
            Kind.Sequence => new YSequence(position, this, slot),
            _ => new YMapping(position, this, slot, (s.Marks & Marks.DroppedKeys) != 0),
        };
    }

    public ImmutableArray<YNode> Items(int slot)
    {
        if (Cached(slot) is ImmutableArray<YNode> known) return known;
        ref var s = ref At(slot);
        var items = new YNode[s.Data];
        var (child, k) = (slot + 1, 0);
        for (; k < items.Length; child += At(child).Span) items[k++] = Node(child);
        var result = ImmutableCollectionsMarshal.AsImmutableArray(items);
        Remember(slot, result);
        return result;
    }

    public ImmutableArray<KeyValuePair<YScalar, YNode>> Entries(int slot)
    {
        if (Cached(slot) is ImmutableArray<KeyValuePair<YScalar, YNode>> known) return known;
        ref var s = ref At(slot);
        var entries = new KeyValuePair<YScalar, YNode>[s.Data];
        var (key, end, k) = (slot + 1, slot + s.Span, 0);
        while (key < end)
        {
            var value = key + At(key).Span;
            var next = value + At(value).Span;
            if ((At(key).Marks & Marks.DroppedEntry) == 0) entries[k++] = new((YScalar)Node(key), Node(value));
            key = next;
        }
        var result = ImmutableCollectionsMarshal.AsImmutableArray(entries);
        Remember(slot, result);
        return result;
    }

    /// <summary>The entries kept of the mapping at <paramref name="slot"/>, made one at a time and not cached.</summary>
    public IEnumerable<KeyValuePair<YScalar, YNode>> WalkEntries(int slot)
    {
        var (key, end) = (slot + 1, slot + At(slot).Span);
        while (key < end)
        {
            var value = key + At(key).Span;
            var next = value + At(value).Span;
            if ((At(key).Marks & Marks.DroppedEntry) == 0) yield return new((YScalar)Node(key), Node(value));
            key = next;
        }
    }

    /// <summary>The slots of the key and value of each entry kept of the mapping at <paramref name="slot"/>, in document
    /// order: a section reader reads a valid entry from its slots without making its nodes.</summary>
    public IEnumerable<YEntry> EntrySlotsOf(int slot)
    {
        var (key, end) = (slot + 1, slot + At(slot).Span);
        while (key < end)
        {
            var value = key + At(key).Span;
            var next = value + At(value).Span;
            if ((At(key).Marks & Marks.DroppedEntry) == 0) yield return new YEntry(this, key, value);
            key = next;
        }
    }

    /// <summary>The kind of the node at <paramref name="slot"/>, which is not an alias (see <see cref="Resolve"/>).</summary>
    public Kind KindOf(int slot) => At(slot).Kind;

    /// <summary>True when the collection at <paramref name="slot"/> left out an entry or the scalar there was quoted.</summary>
    public bool Marked(int slot) => At(slot).Marks != Marks.None;

    /// <summary>The text of the scalar at <paramref name="slot"/>, which is not an alias.</summary>
    public string TextOf(int slot) => _texts[At(slot).Data];

    /// <summary>The slot after the subtree at <paramref name="slot"/>: its next sibling, if it has one.</summary>
    public int After(int slot) => slot + At(slot).Span;

    /// <summary>The number of items of a sequence, or of entries kept of a mapping, at <paramref name="slot"/>.</summary>
    public int CountOf(int slot) => At(slot).Data;

    private sealed class CacheLine(int slot, object children)
    {
        public int Slot { get; } = slot;
        public object Children { get; } = children;
    }

    private readonly CacheLine?[] _cache = new CacheLine?[64];

    // Neighbouring collections are a few slots apart: a multiplicative hash spreads them over the lines.
    private static int LineOf(int slot) => (int)(((uint)slot * 2654435769u) >> 26);

    private object? Cached(int slot) => _cache[LineOf(slot)] is { } line && line.Slot == slot ? line.Children : null;

    private void Remember(int slot, object children) => _cache[LineOf(slot)] = new CacheLine(slot, children);
}
