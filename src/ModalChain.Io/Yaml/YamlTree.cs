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
internal sealed record YMapping(SourcePosition Position, ImmutableArray<KeyValuePair<YScalar, YNode>> Entries) : YNode(Position)
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
        try
        {
            var parser = new Parser(new StringReader(text));
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
            diagnostics.Add(new Diagnostic(Severity.Error, file, Pos(e.Start), "malformed YAML: " + Tidy(e.Message)));
            return null;
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
            while (!parser.TryConsume<MappingEnd>(out _))
            {
                var keyNode = ReadNode(parser, file, diagnostics, anchors);
                var value = ReadNode(parser, file, diagnostics, anchors);
                if (keyNode is not YScalar key)
                {
                    diagnostics.Add(new Diagnostic(Severity.Error, file, keyNode.Position, "a key must be a plain name, not a list or mapping"));
                    continue;
                }
                if (seen.TryGetValue(key.Value, out var first))
                {
                    diagnostics.Add(new Diagnostic(Severity.Error, file, key.Position,
                        $"duplicate key '{key.Value}' (first defined at line {first.Line}); names must be unique"));
                    continue;
                }
                seen[key.Value] = key.Position;
                entries.Add(new(key, value));
            }
            node = new YMapping(Pos(map.Start), entries.ToImmutable());
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
