using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

/// <summary>Writes a model file that adds elements to an existing one, keeping every other section as written.</summary>
/// <remarks>
/// The original text is read again into a tree; masses, springs and dampers of the new network that the file does
/// not name are appended to their sections (created when missing), with SI values written in round-trip precision
/// and their unit ("153.2 kg", "1.26e6 N/m"), so that reading the result gives exactly the new network. Every other
/// section and entry keeps its text and units. Comments of the original are not carried over.
/// </remarks>
public static class ModelWriter
{
    /// <summary>The text of a model file equal to <paramref name="originalText"/> plus the elements of <paramref name="network"/> it lacks.</summary>
    /// <param name="originalText">The model file's text as read.</param>
    /// <param name="file">Its name, for messages.</param>
    /// <param name="network">The network to write: the original's elements, unchanged, followed by additions.</param>
    /// <param name="headerLines">Lines written as comments at the top (without '#').</param>
    public static string WithAdditions(string originalText, string file, CoreNetwork network, IEnumerable<string> headerLines)
    {
        ArgumentNullException.ThrowIfNull(originalText);
        ArgumentNullException.ThrowIfNull(network);
        var diagnostics = new List<Diagnostic>();
        var root = YamlTree.Load(originalText.TrimStart('\uFEFF'), file, diagnostics);
        if (root is not YMapping top || diagnostics.Any(d => d.Severity == Severity.Error))
            throw new ArgumentException($"{file} is not a readable model file; read it with ModelReader first.", nameof(originalText));

        var origin = new SourcePosition(0, 0);
        var entries = top.Entries.ToList();
        Extend(entries, "masses", network.Masses.Select(m => (m.Name, MassNode(m, origin))), origin);
        Extend(entries, "springs", network.Springs.Select(s => (s.Name, TwoNode(s.NodeA, s.NodeB, "stiffness", s.Stiffness, Quantity.Stiffness, origin))), origin);
        Extend(entries, "dampers", network.Dampers.Select(d => (d.Name, TwoNode(d.NodeA, d.NodeB, "coefficient", d.Coefficient, Quantity.Damping, origin))), origin);

        var text = new StringBuilder();
        foreach (var line in headerLines) text.Append("# ").Append(line).Append('\n');
        text.Append(YamlTreeWriter.Write(new YMapping(top.Position, [.. entries])).Replace("\r\n", "\n"));
        return text.ToString();
    }

    private static void Extend(List<KeyValuePair<YScalar, YNode>> top, string section, IEnumerable<(string Name, YNode Node)> elements, SourcePosition origin)
    {
        var index = top.FindIndex(e => e.Key.Value == section);
        var existing = index >= 0 && top[index].Value is YMapping m ? m.Entries : [];
        var names = existing.Select(e => e.Key.Value).ToHashSet();
        var added = elements.Where(e => !names.Contains(e.Name)).Select(e => new KeyValuePair<YScalar, YNode>(Plain(e.Name, origin), e.Node)).ToList();
        if (added.Count == 0) return;
        var mapping = new YMapping(origin, [.. existing, .. added]);
        var entry = new KeyValuePair<YScalar, YNode>(Plain(section, origin), mapping);
        if (index >= 0) top[index] = entry;
        else
        {
            // Keep the network sections together, in the documented order, before anything else.
            var order = new[] { "title", "masses", "springs", "dampers" };
            var at = top.FindLastIndex(e => order.Contains(e.Key.Value)) + 1;
            top.Insert(at, entry);
        }
    }

    private static YNode MassNode(Mass m, SourcePosition origin)
    {
        var entries = ImmutableArray.CreateBuilder<KeyValuePair<YScalar, YNode>>();
        entries.Add(new(Plain("mass", origin), Plain(Si(m.Kilograms, Quantity.Mass), origin)));
        if (m.Position is { } p)
            entries.Add(new(Plain("at", origin), new YSequence(origin, [Plain(Number(p.X), origin), Plain(Number(p.Y), origin)])));
        return new YMapping(origin, entries.ToImmutable());
    }

    private static YNode TwoNode(string a, string b, string key, double value, Quantity quantity, SourcePosition origin) =>
        new YMapping(origin, [
            new(Plain("between", origin), new YSequence(origin, [Plain(a, origin), Plain(b, origin)])),
            new(Plain(key, origin), Plain(Si(value, quantity), origin)),
        ]);

    private static YScalar Plain(string text, SourcePosition origin) => new(origin, text, Quoted: false);

    private static string Si(double value, Quantity quantity) => Number(value) + " " + UnitTable.SiSymbol(quantity);

    private static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
