using System.Collections;
using ModalChain.Io.Diagnostics;

namespace ModalChain.Io.Model;

/// <summary>Where each element was written, keyed as "section.name" ("masses.deck", "springs.columns") or by a key
/// without a dot ("criteria"); a dictionary of those keys to the outside.</summary>
/// <remarks>
/// A section's entries are kept under the element's own name, one table per section, so a large model does not make
/// a "section.name" string per element (300,000 of them for a 100,000-mass grid). A key is split at its first dot:
/// section names have none.
/// </remarks>
internal sealed class PositionTable : IDictionary<string, SourcePosition>, IReadOnlyDictionary<string, SourcePosition>
{
    private readonly Dictionary<string, SourcePosition> _whole = new(StringComparer.Ordinal);
    private readonly Dictionary<string, Dictionary<string, SourcePosition>> _sections = new(StringComparer.Ordinal);
    private readonly Dictionary<string, Dictionary<string, SourcePosition>>.AlternateLookup<ReadOnlySpan<char>> _sectionLookup;

    public PositionTable() => _sectionLookup = _sections.GetAlternateLookup<ReadOnlySpan<char>>();

    /// <summary>Records (or replaces) where element <paramref name="name"/> of <paramref name="section"/> was written:
    /// the entry "section.name".</summary>
    public void Set(string section, string name, SourcePosition at) => Section(section)[name] = at;

    /// <summary>Makes room for <paramref name="count"/> entries of <paramref name="section"/>.</summary>
    public void EnsureCapacity(string section, int count) => Section(section).EnsureCapacity(count);

    private Dictionary<string, SourcePosition> Section(string section)
    {
        if (!_sections.TryGetValue(section, out var table)) _sections.Add(section, table = new(StringComparer.Ordinal));
        return table;
    }

    /// <summary>The table that holds <paramref name="key"/> and the key within it; for a "section.name" key whose
    /// section has no table yet, null (or a new table when <paramref name="create"/>).</summary>
    private Dictionary<string, SourcePosition>? TableOf(string key, bool create, out string name)
    {
        var dot = key.IndexOf('.');
        if (dot < 0)
        {
            name = key;
            return _whole;
        }
        name = key[(dot + 1)..];
        if (_sectionLookup.TryGetValue(key.AsSpan(0, dot), out var table)) return table;
        return create ? Section(key[..dot]) : null;
    }

    public SourcePosition this[string key]
    {
        get => TryGetValue(key, out var at) ? at : throw new KeyNotFoundException($"No position recorded for '{key}'.");
        set => TableOf(key, create: true, out var name)![name] = value;
    }

    public bool TryGetValue(string key, out SourcePosition value)
    {
        ArgumentNullException.ThrowIfNull(key);
        value = default;
        return TableOf(key, create: false, out var name) is { } table && table.TryGetValue(name, out value);
    }

    public bool TryAdd(string key, SourcePosition value) => TableOf(key, create: true, out var name)!.TryAdd(name, value);

    public void Add(string key, SourcePosition value)
    {
        if (!TryAdd(key, value)) throw new ArgumentException($"A position for '{key}' is already recorded.", nameof(key));
    }

    public bool ContainsKey(string key) => TryGetValue(key, out _);

    public bool Remove(string key) => TableOf(key, create: false, out var name) is { } table && table.Remove(name);

    public int Count => _whole.Count + _sections.Values.Sum(t => t.Count);

    public bool IsReadOnly => false;

    public ICollection<string> Keys => [.. Pairs().Select(p => p.Key)];

    public ICollection<SourcePosition> Values => [.. Pairs().Select(p => p.Value)];

    IEnumerable<string> IReadOnlyDictionary<string, SourcePosition>.Keys => Pairs().Select(p => p.Key);

    IEnumerable<SourcePosition> IReadOnlyDictionary<string, SourcePosition>.Values => Pairs().Select(p => p.Value);

    public void Clear()
    {
        _whole.Clear();
        _sections.Clear();
    }

    void ICollection<KeyValuePair<string, SourcePosition>>.Add(KeyValuePair<string, SourcePosition> item) => Add(item.Key, item.Value);

    bool ICollection<KeyValuePair<string, SourcePosition>>.Contains(KeyValuePair<string, SourcePosition> item) =>
        TryGetValue(item.Key, out var at) && at == item.Value;

    void ICollection<KeyValuePair<string, SourcePosition>>.CopyTo(KeyValuePair<string, SourcePosition>[] array, int arrayIndex)
    {
        ArgumentNullException.ThrowIfNull(array);
        foreach (var pair in Pairs()) array[arrayIndex++] = pair;
    }

    bool ICollection<KeyValuePair<string, SourcePosition>>.Remove(KeyValuePair<string, SourcePosition> item) =>
        ((ICollection<KeyValuePair<string, SourcePosition>>)this).Contains(item) && Remove(item.Key);

    /// <summary>The entries without a dot, then each section's ("section.name"), sections in the order first recorded.</summary>
    private IEnumerable<KeyValuePair<string, SourcePosition>> Pairs()
    {
        foreach (var pair in _whole) yield return pair;
        foreach (var (section, table) in _sections)
            foreach (var (name, at) in table)
                yield return new($"{section}.{name}", at);
    }

    public IEnumerator<KeyValuePair<string, SourcePosition>> GetEnumerator() => Pairs().GetEnumerator();

    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();
}
