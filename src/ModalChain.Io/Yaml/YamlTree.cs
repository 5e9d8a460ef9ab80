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

internal sealed record YSequence(SourcePosition Position, ImmutableArray<YNode> Items) : YNode(Position);

/// <summary>A mapping whose keys are scalars, in document order, duplicates already rejected.</summary>
/// <param name="Position">Where the mapping starts.</param>
/// <param name="Entries">The entries kept, in document order.</param>
/// <param name="DroppedKeys">True when an entry was left out because its key was already reported (duplicate, or not a scalar).</param>
internal sealed record YMapping(SourcePosition Position, ImmutableArray<KeyValuePair<YScalar, YNode>> Entries, bool DroppedKeys = false) : YNode(Position)
{
    public YNode? this[string key] => Entries.FirstOrDefault(e => e.Key.Value == key).Value;
}

/// <summary>Reads YAML text into a small tree that keeps positions, reporting malformed text and duplicate keys.</summary>
/// <remarks>
/// The event-level parser of YamlDotNet is used rather than its object model so that every node keeps its mark and
/// duplicate keys (which YAML forbids) are reported with their position instead of silently overwriting.
/// </remarks>
internal static class YamlTree
{
    public static YNode? Load(string text, string file, List<Diagnostic> diagnostics)
    {
        var anchors = new Dictionary<string, YNode>();
        var parser = new TrackingParser(new Parser(new StringReader(text)));
        try
        {
            parser.Consume<StreamStart>();
            if (parser.Accept<StreamEnd>(out _)) return null;
            parser.Consume<DocumentStart>();
            var root = ReadNode(parser, file, diagnostics, anchors);
            parser.Consume<DocumentEnd>();
            if (parser.Accept<DocumentStart>(out var second))
                diagnostics.Add(new Diagnostic(Severity.Error, file, Pos(second.Start), "a model file holds one YAML document; remove the second '---'"));
            return root;
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
    private static (SourcePosition At, string Message) Explain(YamlException e, string text, OpenCollection? open)
    {
        var raw = Tidy(e.Message).TrimEnd('.');
        var at = Pos(e.Start);
        if (raw.Contains("tab", StringComparison.OrdinalIgnoreCase) && FirstIndentingTab(text) is { } tab)
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

    /// <summary>Remembers where the last event started and which flow collections are open, to place errors the scanner cannot.</summary>
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
            return moved;
        }
    }

    private static YNode ReadNode(IParser parser, string file, List<Diagnostic> diagnostics, Dictionary<string, YNode> anchors)
    {
        if (parser.TryConsume<AnchorAlias>(out var alias))
        {
            if (anchors.TryGetValue(alias.Value.Value, out var target)) return target;
            throw new YamlException(alias.Start, alias.End, $"unknown alias '*{alias.Value.Value}'");
        }

        YNode node;
        string? anchor;
        if (parser.TryConsume<Scalar>(out var scalar))
        {
            node = new YScalar(Pos(scalar.Start), scalar.Value, scalar.Style is ScalarStyle.SingleQuoted or ScalarStyle.DoubleQuoted);
            anchor = scalar.Anchor.IsEmpty ? null : scalar.Anchor.Value;
        }
        else if (parser.TryConsume<SequenceStart>(out var seq))
        {
            var items = ImmutableArray.CreateBuilder<YNode>();
            while (!parser.TryConsume<SequenceEnd>(out _)) items.Add(ReadNode(parser, file, diagnostics, anchors));
            node = new YSequence(Pos(seq.Start), items.ToImmutable());
            anchor = seq.Anchor.IsEmpty ? null : seq.Anchor.Value;
        }
        else if (parser.TryConsume<MappingStart>(out var map))
        {
            var entries = ImmutableArray.CreateBuilder<KeyValuePair<YScalar, YNode>>();
            var seen = new Dictionary<string, SourcePosition>();
            var dropped = false;
            while (!parser.TryConsume<MappingEnd>(out _))
            {
                var keyNode = ReadNode(parser, file, diagnostics, anchors);
                var value = ReadNode(parser, file, diagnostics, anchors);
                if (keyNode is not YScalar key)
                {
                    diagnostics.Add(new Diagnostic(Severity.Error, file, keyNode.Position, "a key must be a plain name, not a list or mapping"));
                    dropped = true;
                    continue;
                }
                if (seen.TryGetValue(key.Value, out var first))
                {
                    diagnostics.Add(new Diagnostic(Severity.Error, file, key.Position,
                        $"duplicate key '{key.Value}' (first defined at line {first.Line}); names must be unique"));
                    dropped = true;
                    continue;
                }
                seen[key.Value] = key.Position;
                entries.Add(new(key, value));
            }
            node = new YMapping(Pos(map.Start), entries.ToImmutable(), dropped);
            anchor = map.Anchor.IsEmpty ? null : map.Anchor.Value;
        }
        else
        {
            var current = parser.Current!;
            throw new YamlException(current.Start, current.End, $"unexpected {current.GetType().Name}");
        }

        if (anchor is not null) anchors[anchor] = node;
        return node;
    }

    internal static SourcePosition Pos(Mark mark) => new(checked((int)mark.Line), checked((int)mark.Column));

    // YamlDotNet prefixes messages with "(Line: 3, Col: 5, Idx: 40) - (Line: ...): "; the position is already in front of ours.
    private static string Tidy(string message)
    {
        var i = message.LastIndexOf("): ", StringComparison.Ordinal);
        return i >= 0 && message.StartsWith('(') ? message[(i + 3)..] : message;
    }
}
