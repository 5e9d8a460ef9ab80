using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

/// <summary>A circuit model read from the file's <c>circuit:</c> section, with the runs its other sections ask for (SI).</summary>
/// <param name="Circuit">The checked circuit.</param>
/// <param name="Sweep">The frequencies of the file's <c>harmonic</c> section, or null when it has none.</param>
/// <param name="Duration">Duration in s of the file's <c>transient</c> section, or null.</param>
/// <param name="Step">Recording step in s of the file's <c>transient</c> section, or null.</param>
public sealed record CircuitModel(Circuit Circuit, FrequencySweep? Sweep, double? Duration, double? Step);

public static partial class ModelReader
{
    private static readonly Range ResistanceRange = new(0, 1e15, MinimumInclusive: false);   // Ω
    private static readonly Range InductanceRange = new(0, 1e4, MinimumInclusive: false);    // H
    private static readonly Range CapacitanceRange = new(0, 1e5, MinimumInclusive: false);   // F (supercapacitor banks)
    private static readonly Range SourceVoltageRange = new(-1e7, 1e7);                        // V
    private static readonly Range SourceCurrentRange = new(-1e6, 1e6);                        // A
    private static readonly Range CircuitSweepRange = new(0, 1e10, MinimumInclusive: false);  // Hz

    private static readonly string[] CircuitTopLevelKeys = ["title", "circuit", "harmonic", "transient"];
    private static readonly string[] CircuitKeys = ["nodes", "resistors", "inductors", "capacitors", "voltage-sources", "current-sources"];

    /// <summary>Reads a model whose top level has 'circuit': title, the circuit and its harmonic and transient runs.</summary>
    private static LoadResult ReadCircuitModel(YMapping top, ReadContext context, string file, byte[] bytes)
    {
        foreach (var (key, _) in top.Walk())
            if (key.Value != "circuit" && !CircuitTopLevelKeys.Contains(key.Value) && TopLevelKeys.Contains(key.Value))
                context.Error(key, $"'{key.Value}' belongs to mechanical models; a model with 'circuit' takes only {string.Join(", ", CircuitTopLevelKeys.Select(k => $"'{k}'"))}");
        var title = Path.GetFileNameWithoutExtension(file);
        if (top["title"] is { } titleNode && context.Text(titleNode, "'title'") is { } t) title = t;
        var circuit = ReadCircuit(top["circuit"]!, title, context);
        var sweep = ReadCircuitHarmonic(top, context);
        var (duration, step) = ReadCircuitTransient(top, context);
        if (circuit is null || context.HasErrors) return Finish(context, null);

        var analogy = CircuitAnalogy.Of(circuit);
        var network = analogy.ToNetwork();
        var document = new ModelDocument(file, Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes)), network,
            [.. context.Diagnostics.Where(d => d.Severity == Severity.Warning)],
            new System.Collections.ObjectModel.ReadOnlyDictionary<string, SourcePosition>(context.Positions))
        {
            Circuit = new CircuitModel(circuit, sweep, duration, step),
        };
        return Finish(context, document);
    }

    /// <summary>Reads a 'circuit' section; <paramref name="embedding"/> is given for a circuit inside a line model, whose topology the line reader checks once the transducers are known.</summary>
    private static Circuit? ReadCircuit(YNode node, string title, ReadContext context, CircuitEmbedding? embedding = null)
    {
        if (context.Mapping(node, "'circuit'") is not { } c) return null;
        context.RejectUnknownKeys(c, "'circuit'", CircuitKeys);
        context.Positions["circuit"] = c.Position;

        // Nodes: a list of names; ground is implied.
        var nodes = new List<string>();
        var nodePositions = new Dictionary<string, SourcePosition>(StringComparer.Ordinal);
        if (c["nodes"] is not { } nodesNode)
            context.Error(c, "'circuit' needs 'nodes': the list of its node names, e.g. [supply, coil, out] (ground is implied)");
        else if (nodesNode is not YSequence list)
            context.Error(nodesNode, "'nodes' of 'circuit' must be a list of node names, e.g. [supply, coil, out]");
        else
            foreach (var item in list.Items)
            {
                if (context.Text(item, "a node of 'circuit'") is not { } name) continue;
                if (name == Circuit.Ground) { context.Error(item, "'ground' is the reference node and is always there; leave it out of 'nodes'"); continue; }
                if (!IsUsableName(name)) { context.Error(item, $"'{name}' is not a usable node name; use letters, digits, '_', '-' and '.', starting with a letter or digit"); continue; }
                if (!nodePositions.TryAdd(name, item.Position)) { context.Error(item, $"node '{name}' is listed twice in 'nodes'"); continue; }
                nodes.Add(name);
                context.Positions[$"circuit.nodes.{name}"] = item.Position;
            }
        var known = new HashSet<string>(nodes, StringComparer.Ordinal) { Circuit.Ground };
        var names = new HashSet<string>(StringComparer.Ordinal);

        var resistors = ReadCircuitElements(c, "resistors", "resistor", "resistance", Quantity.Resistance, ResistanceRange, "4.7 ohm", known, names, context)
            .Select(e => new Resistor(e.Name, e.A, e.B, e.Value)).ToImmutableArray();
        var inductors = ReadCircuitElements(c, "inductors", "inductor", "inductance", Quantity.Inductance, InductanceRange, "2.2 mH", known, names, context)
            .Select(e => new Inductor(e.Name, e.A, e.B, e.Value)).ToImmutableArray();
        var capacitors = ReadCircuitElements(c, "capacitors", "capacitor", "capacitance", Quantity.Capacitance, CapacitanceRange, "10 uF", known, names, context)
            .Select(e => new Capacitor(e.Name, e.A, e.B, e.Value)).ToImmutableArray();
        var voltageSources = ReadSources(c, "voltage-sources", "voltage source", Quantity.Voltage, SourceVoltageRange, known, names, context)
            .Select(e => new VoltageSource(e.Name, e.A, e.B, e.Amplitude, e.Waveform)).ToImmutableArray();
        var currentSources = ReadSources(c, "current-sources", "current source", Quantity.Current, SourceCurrentRange, known, names, context)
            .Select(e => new CurrentSource(e.Name, e.A, e.B, e.Amplitude, e.Waveform)).ToImmutableArray();
        if (embedding is not null)
        {
            foreach (var (name, at) in nodePositions) embedding.NodePositions[name] = at;
            // Only this section's own errors stop it: the line model's others are reported beside them.
            if (context.ErrorCount > embedding.ErrorsBefore) return null;
            return new Circuit(title, [.. nodes], resistors, inductors, capacitors, voltageSources, currentSources);
        }
        if (context.HasErrors) return null;

        var circuit = new Circuit(title, [.. nodes], resistors, inductors, capacitors, voltageSources, currentSources);
        CheckCircuitTopology(circuit, nodePositions, context);
        if (context.HasErrors) return null;
        return circuit;
    }

    private static List<(string Name, string A, string B, double Value)> ReadCircuitElements(YMapping c, string section, string element,
        string valueKey, Quantity quantity, Range range, string example, HashSet<string> known, HashSet<string> names, ReadContext context)
    {
        var result = new List<(string, string, string, double)>();
        foreach (var (key, entry, what) in CircuitEntries(c, section, element, $"{{between: [a, b], {valueKey}: {example}}}", names, context))
        {
            context.RejectUnknownKeys(entry, what, "between", valueKey);
            var ends = ReadTerminals(entry, "between", key.Position, known, context, what, "the two nodes it connects");
            var v = context.Required(entry, valueKey, quantity, range, what, key.Position);
            if (ends is { } e && v is { } x) result.Add((key.Value, e.A, e.B, x));
        }
        return result;
    }

    private static List<(string Name, string A, string B, double Amplitude, TimeFunction? Waveform)> ReadSources(YMapping c, string section,
        string element, Quantity quantity, Range range, HashSet<string> known, HashSet<string> names, ReadContext context)
    {
        var result = new List<(string, string, string, double, TimeFunction?)>();
        var voltage = quantity == Quantity.Voltage;
        var example = voltage ? "{between: [supply, ground], amplitude: 1 V}" : "{from: ground, to: out, amplitude: 10 mA}";
        foreach (var (key, entry, what) in CircuitEntries(c, section, element, example, names, context))
        {
            (string A, string B)? ends;
            if (voltage)
            {
                context.RejectUnknownKeys(entry, what, "between", "amplitude", "time");
                ends = ReadTerminals(entry, "between", key.Position, known, context, what, "its + terminal, then its − terminal");
            }
            else
            {
                context.RejectUnknownKeys(entry, what, "from", "to", "amplitude", "time");
                var from = ReadTerminal(entry, "from", key.Position, known, context, what);
                var to = ReadTerminal(entry, "to", key.Position, known, context, what);
                ends = null;
                if (from is not null && to is not null)
                {
                    if (from == to) context.Error(entry["to"]!, $"{what} draws from and delivers into '{from}'; its two terminals must differ");
                    else ends = (from, to);
                }
            }
            var amplitude = context.Optional(entry, "amplitude", quantity, range, what) ?? 1.0;
            TimeFunction? waveform = null;
            if (entry["time"] is { } timeNode) waveform = ReadValueFunction(timeNode, quantity, $"'time' of {what}", context);
            if (ends is { } e) result.Add((key.Value, e.A, e.B, amplitude, waveform));
        }
        return result;
    }

    private static IEnumerable<(YScalar Key, YMapping Entry, string What)> CircuitEntries(YMapping c, string section, string element,
        string example, HashSet<string> names, ReadContext context)
    {
        if (c[section] is not { } node || node is YScalar { IsPlainNull: true }) yield break;
        if (context.Mapping(node, $"'{section}' of 'circuit'") is not { } mapping) yield break;
        foreach (var (key, value) in mapping.Walk())
        {
            if (!CheckName(key, context, element)) continue;
            var what = $"{element} '{key.Value}'";
            if (!names.Add(key.Value))
            {
                context.Error(key, $"{what}: another element of the circuit is already named '{key.Value}'; element names must be unique");
                continue;
            }
            context.Positions[$"circuit.{key.Value}"] = key.Position;
            if (value is not YMapping entry)
            {
                context.Error(value, $"{what} must be a mapping such as '{example}'");
                continue;
            }
            yield return (key, entry, what);
        }
    }

    private static (string A, string B)? ReadTerminals(YMapping entry, string key, SourcePosition owner, HashSet<string> known,
        ReadContext context, string what, string needs)
    {
        var node = entry[key];
        if (node is null) { context.Error(owner, $"{what} needs '{key}: [node, node]' naming {needs}"); return null; }
        if (node is not YSequence { Items.Length: 2 } seq) { context.Error(node, $"'{key}' of {what} must list exactly two nodes, e.g. [out, ground]"); return null; }
        var a = Terminal(seq.Items[0], known, context, what);
        var b = Terminal(seq.Items[1], known, context, what);
        if (a is null || b is null) return null;
        if (a == b) { context.Error(seq, $"{what} connects '{a}' to itself; its two terminals must differ"); return null; }
        return (a, b);
    }

    private static string? ReadTerminal(YMapping entry, string key, SourcePosition owner, HashSet<string> known, ReadContext context, string what)
    {
        if (entry[key] is not { } node) { context.Error(owner, $"{what} needs '{key}': a node name or ground"); return null; }
        return Terminal(node, known, context, what);
    }

    private static string? Terminal(YNode node, HashSet<string> known, ReadContext context, string what)
    {
        if (context.Text(node, $"a terminal of {what}") is not { } name) return null;
        if (known.Contains(name)) return name;
        context.Error(node, $"{what} refers to unknown node '{name}'{ReadContext.Suggest(name, known)}; list it under 'nodes' of 'circuit', or use 'ground'");
        return null;
    }

    // The circuit's topology: every node used, no loop of voltage sources, no cut set of current sources, voltage sources
    // from ground, and the groups the state-space form cannot take.
    private static void CheckCircuitTopology(Circuit circuit, Dictionary<string, SourcePosition> nodePositions, ReadContext context,
        IReadOnlyList<(string A, string B)>? branches = null)
    {
        // Inside a line model, transducer branches also join circuit nodes (to each other, to ground or to supports).
        var embedded = branches is not null;
        branches ??= [];
        var used = circuit.ElementNodes().Concat(branches.SelectMany(b => new[] { b.A, b.B })).ToHashSet(StringComparer.Ordinal);
        foreach (var node in circuit.Nodes.Where(n => !used.Contains(n)))
            context.Error(nodePositions[node], $"node '{node}' has nothing attached: no element names it; connect it or remove it from 'nodes'");

        // A loop of ideal voltage sources (two in parallel included) fixes one voltage twice: Kirchhoff's voltage law
        // either contradicts it or leaves the sources' currents undetermined.
        var sets = new DisjointNames();
        foreach (var v in circuit.VoltageSources)
        {
            if (!sets.Union(v.Positive, v.Negative))
            {
                context.Error(context.Positions[$"circuit.{v.Name}"],
                    $"voltage source '{v.Name}' closes a loop of ideal voltage sources (between '{v.Positive}' and '{v.Negative}', which other voltage sources already join); two ideal sources may not fix the same voltage: remove one, or put a resistor in series");
                continue;
            }
            if (v.Positive != Circuit.Ground && v.Negative != Circuit.Ground)
                context.Error(context.Positions[$"circuit.{v.Name}"],
                    embedded
                        ? $"voltage source '{v.Name}' has neither terminal at ground; inside a line model a voltage source holds one node against ground (a floating source would need a constraint the node flux form does not take yet): redraw it with one terminal at ground, or replace it and its series resistor R by two current sources from ground, V/R into its + node and V/R out of its − node, with R between those nodes (its Norton equivalent)"
                        : $"voltage source '{v.Name}' has neither terminal at ground; only sources from ground are supported (a floating source would need a constraint the node flux form does not take yet): redraw it with one terminal at ground, or model it as a current source with a resistor (its Norton equivalent)");
        }

        // A group of nodes that only current sources join to the rest (ground included): Kirchhoff's current law at
        // the group cannot hold for arbitrary source currents.
        var joined = new DisjointNames();
        foreach (var e in circuit.Resistors) joined.Union(e.NodeA, e.NodeB);
        foreach (var e in circuit.Inductors) joined.Union(e.NodeA, e.NodeB);
        foreach (var e in circuit.Capacitors) joined.Union(e.NodeA, e.NodeB);
        foreach (var e in circuit.VoltageSources) joined.Union(e.Positive, e.Negative);
        foreach (var (a, b) in branches) joined.Union(a, b);
        var reported = new HashSet<string>(StringComparer.Ordinal);
        foreach (var i in circuit.CurrentSources)
            foreach (var end in new[] { i.From, i.To })
            {
                if (joined.Connected(end, Circuit.Ground) || !reported.Add(joined.Find(end))) continue;
                var group = circuit.Nodes.Where(n => joined.Connected(n, end)).Select(n => $"'{n}'");
                context.Error(context.Positions[$"circuit.{i.Name}"],
                    $"current source '{i.Name}' drives nodes {string.Join(", ", group)}, which only current sources join to the rest of the circuit (a cut set of current sources): no current can return; add a path to ground (a resistor or a capacitor)");
            }
        // Inside a line model the network's own checks (massless nodes) apply instead of the circuit solver's limits.
        if (context.HasErrors || embedded) return;

        var analogy = CircuitAnalogy.Of(circuit);
        foreach (var (groupNodes, lacks) in CircuitTopology.UnsupportedGroups(analogy))
        {
            var list = string.Join(", ", groupNodes.Select(n => $"'{n}'"));
            context.Error(nodePositions[groupNodes[0]], lacks == "capacitor"
                ? $"node{(groupNodes.Length > 1 ? "s" : "")} {list}: capacitors join them but none reaches ground or a source node, which the solver does not take yet; add a capacitor to ground (a stray capacitance of a few pF will do)"
                : $"node{(groupNodes.Length > 1 ? "s" : "")} {list} {(groupNodes.Length > 1 ? "have" : "has")} no capacitor and no resistor to the rest of the circuit (only inductors), which the solver does not take yet; add a resistor or a capacitor to ground, or join series inductors into one");
        }
    }

    private static FrequencySweep? ReadCircuitHarmonic(YMapping top, ReadContext context)
    {
        if (top["harmonic"] is not { } node || node is YScalar { IsPlainNull: true }) return null;
        const string what = "'harmonic' of a circuit model";
        if (context.Mapping(node, what) is not { } h) return null;
        context.RejectUnknownKeys(h, what, "frequencies");
        context.Positions["harmonic"] = h.Position;
        if (h["frequencies"] is not { } fNode)
        {
            context.Error(h, $"{what} needs 'frequencies': a range {{from: 10 Hz, to: 100 kHz, points: 300, spacing: log}} or a list [50 Hz, 1 kHz]");
            return null;
        }
        const string fw = "'frequencies' of 'harmonic'";
        if (fNode is YSequence list)
        {
            if (list.Items.Length == 0) context.Error(list, $"{fw} lists no frequency");
            var values = list.Items.Select(i => context.Value(i, Quantity.Frequency, CircuitSweepRange, fw)).ToArray();
            return values.Length > 0 && values.All(v => v is not null) ? new FrequencyList([.. values.Select(v => v!.Value)]) : null;
        }
        if (context.Mapping(fNode, fw) is not { } range) return null;
        context.RejectUnknownKeys(range, fw, "from", "to", "points", "spacing");
        var from = context.Required(range, "from", Quantity.Frequency, CircuitSweepRange, fw);
        var to = context.Required(range, "to", Quantity.Frequency, CircuitSweepRange, fw);
        if (from is { } a && to is { } b && !(b > a))
            context.Error(range["to"]!, $"'to' of {fw} ({Format(b)} Hz) must be above 'from' ({Format(a)} Hz)");
        var points = 200;
        if (range["points"] is { } pNode)
        {
            if (pNode is YScalar ps && int.TryParse(ps.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var p) && p >= 2 && p <= MaxSweepPoints) points = p;
            else { context.Error(pNode, $"'points' of {fw} must be a whole number from 2 to {MaxSweepPoints}, found '{(pNode as YScalar)?.Value}'"); points = -1; }
        }
        var spacing = FrequencySpacing.Linear;
        if (range["spacing"] is { } sNode && context.Text(sNode, $"'spacing' of {fw}") is { } s)
        {
            if (s == "log") spacing = FrequencySpacing.Logarithmic;
            else if (s != "linear") context.Error(sNode, $"'spacing' of {fw} is '{s}'; write 'linear' or 'log'");
        }
        return from is { } f0 && to is { } f1 && f1 > f0 && points >= 2 ? new FrequencyRange(f0, f1, points, spacing) : null;
    }

    private static (double? Duration, double? Step) ReadCircuitTransient(YMapping top, ReadContext context)
    {
        if (top["transient"] is not { } node || node is YScalar { IsPlainNull: true }) return (null, null);
        const string what = "'transient' of a circuit model";
        if (context.Mapping(node, what) is not { } t) return (null, null);
        context.RejectUnknownKeys(t, what, "duration", "step");
        context.Positions["transient"] = t.Position;
        var duration = context.Required(t, "duration", Quantity.Time, DurationRange, what);
        var step = context.Required(t, "step", Quantity.Time, new Range(0, 1e4, MinimumInclusive: false), what);
        if (duration is { } d && step is { } h)
        {
            if (h > d) context.Error(t["step"]!, $"'step' of {what} ({Format(h)} s) is longer than 'duration' ({Format(d)} s)");
            else if (d / h > 1e6) context.Error(t["step"]!, $"{what} asks for {d / h:G3} steps (duration / step), more than 1e+06; lengthen the step or shorten the run");
        }
        return (duration, step);
    }

    /// <summary>Union–find over node names (ground included), for the topology checks.</summary>
    private sealed class DisjointNames
    {
        private readonly Dictionary<string, string> _parent = new(StringComparer.Ordinal);

        public string Find(string x)
        {
            if (!_parent.TryGetValue(x, out var p)) { _parent[x] = x; return x; }
            if (p == x) return x;
            var root = Find(p);
            _parent[x] = root;
            return root;
        }

        /// <summary>Joins the sets of a and b; false when they were already one.</summary>
        public bool Union(string a, string b)
        {
            var (ra, rb) = (Find(a), Find(b));
            if (ra == rb) return false;
            _parent[ra] = rb;
            return true;
        }

        public bool Connected(string a, string b) => Find(a) == Find(b);
    }
}
