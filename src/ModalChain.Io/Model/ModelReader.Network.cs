using System.Runtime.CompilerServices;
using System.Text.RegularExpressions;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    // Plausibility limits: values beyond them are almost always a unit or typing mistake (common practice).
    private static readonly Range MassRange = new(1e-6, 1e9);             // 1 mg .. 1,000,000 t
    private static readonly Range StiffnessRange = new(0, 1e14);          // N/m
    private static readonly Range DampingRange = new(0, 1e13);            // N·s/m
    private static readonly Range InertanceRange = new(0, 1e9);           // kg, as masses (0 allowed: an inerter switched off)
    private static readonly Range DrawingRange = new(-1e5, 1e5);          // m

    private static readonly string[] MassKeys = ["mass", "at", "directions"];

    [GeneratedRegex(@"^[\p{L}\p{N}_][\p{L}\p{N}_.\-]*$")]
    internal static partial Regex NamePattern();

    /// <summary>Whether <paramref name="name"/> matches <see cref="NamePattern"/>; ASCII names, nearly all of them, by a
    /// loop that gives the same answer (a large model checks hundreds of thousands of names), others by the pattern.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static bool IsUsableName(string name)
    {
        // The pattern's '$' also matches before one final '\n'.
        var length = name.Length > 1 && name[^1] == '\n' ? name.Length - 1 : name.Length;
        if (length == 0) return false;
        for (var i = 0; i < length; i++)
        {
            var c = name[i];
            if (c >= 0x80) return NamePattern().IsMatch(name);
            var ok = c is (>= 'a' and <= 'z') or (>= 'A' and <= 'Z') or (>= '0' and <= '9') or '_' || (i > 0 && c is '.' or '-');
            if (!ok) return false;
        }
        return true;
    }

    private static CoreNetwork? ReadNetwork(YMapping top, ReadContext context, string defaultTitle, Repeated repeated, SpatialNodes? spatial,
        CircuitEmbedding? embedding = null)
    {
        var builder = new NetworkBuilder { Title = defaultTitle, Space = spatial?.Space ?? ModelSpace.Line };
        if (top["title"] is { } titleNode && context.Text(titleNode, "'title'") is { } title) builder.Title = title;

        var massesNode = top["masses"];
        var nodes = new HashSet<string> { CoreNetwork.Ground };
        // A plane or 3d model may consist of bodies alone.
        var bodiesGiven = spatial is not null && top["bodies"] is YMapping { Entries.Length: > 0 };
        if (massesNode is null or YScalar { IsPlainNull: true } && (top["repeat"] is not null || bodiesGiven))
            massesNode = new YMapping(top.Position, []); // every mass is generated, or there are bodies only
        if (massesNode is null)
        {
            context.Error(top, "the model has no 'masses' section; a network needs at least one mass");
            return null;
        }
        if (massesNode is YScalar { IsPlainNull: true })
        {
            context.Error(massesNode, "'masses' is empty; a network needs at least one mass, e.g. 'deck: 3200 kg'");
            return null;
        }
        if (context.Mapping(massesNode, "'masses'") is not { } masses) return null;
        if (masses.Count == 0 && repeated.Masses.Count == 0 && !bodiesGiven)
        {
            // Its only entries were already reported (e.g. a key that is a list): "empty" would be a second, wrong error.
            if (masses.DroppedKeys || (top["repeat"] is not null && context.HasErrors)) return null;
            context.Error(massesNode, "'masses' is empty; a network needs at least one mass, e.g. 'deck: 3200 kg'");
            return null;
        }

        context.Positions.EnsureCapacity("masses", masses.Count);
        nodes.EnsureCapacity(masses.Count + 1);
        foreach (var item in masses.WalkSlots())
        {
            if (spatial is null && TryAddValidMass(item, builder, nodes, context)) continue;
            var (key, value) = item;
            if (!CheckName(key, context, "mass")) continue;
            var what = $"mass '{key.Value}'";
            context.Positions[$"masses.{key.Value}"] = key.Position;
            // Known as a node even when its value is wrong, so springs that name it do not add a second error.
            nodes.Add(key.Value);
            if (spatial is not null)
            {
                ReadSpatialMass(key, value, builder, spatial, context);
                continue;
            }
            double? kg;
            DrawingPosition? at = null;
            if (value is YScalar)
                kg = context.Value(value, Quantity.Mass, MassRange, what); // shorthand: "deck: 3200 kg"
            else if (value is YSequence)
            {
                context.Error(value, $"{what} must be a value such as '3200 kg' or a mapping such as '{{mass: 3200 kg, at: [0, 0]}}'");
                continue;
            }
            else if (context.Mapping(value, what) is { } entry)
            {
                context.RejectUnknownKeys(entry, what, MassKeys);
                RefuseInLine(entry, "directions", what, context);
                kg = context.Required(entry, "mass", Quantity.Mass, MassRange, what, key.Position);
                if (entry["at"] is { } atNode) at = ReadPosition(atNode, context, what);
            }
            else continue;
            if (kg is { } m && !context.HasErrors) builder.AddMass(key.Value, m, at);
        }

        AddRepeatedMasses(repeated, builder, nodes, context);
        if (spatial is null) ReadNodes(top, context, builder, nodes);
        ReadSupports(top, context, builder, nodes, spatial);
        if (spatial is not null) return ReadSpatialNetwork(top, builder, spatial, nodes, context);
        if (embedding is not null) ReadEmbeddedCircuit(top, builder.Title, embedding, context);
        var springs = ReadTwoNodeSection(top, "springs", "spring", "stiffness", Quantity.Stiffness, StiffnessRange, nodes, context);
        var dampers = ReadTwoNodeSection(top, "dampers", "damper", "coefficient", Quantity.Damping, DampingRange, nodes, context);
        var inerters = ReadTwoNodeSection(top, "inerters", "inerter", "inertance", Quantity.Mass, InertanceRange, nodes, context);
        CheckRepeatedSprings(repeated, springs, context);
        // The set of mass names is asked for only by a 'links' section (absent, ReadLinks returns at once).
        var links = ReadLinks(top, context, top["links"] is null ? new HashSet<string>() : masses.Walk().Select(e => e.Key.Value).Concat(repeated.MassNames).ToHashSet(), nodes);
        // A transducer's branch may name the circuit's nodes; those a voltage source holds are supports.
        var supportNames = DeclaredNames(top, "supports");
        var branchNodes = nodes;
        if (embedding is not null)
        {
            branchNodes = [.. nodes, .. embedding.DeclaredNodes];
            supportNames.UnionWith(embedding.HeldNodes);
        }
        var transducers = ReadTransducers(top, context, branchNodes, supportNames, links);
        var mounts = ReadMounts(top, nodes, context);
        if (embedding is not null) CheckEmbeddedCircuit(embedding, transducers, supportNames, context);
        if (context.HasErrors) return null;

        embedding?.Analogy?.AddTo(builder);

        foreach (var (name, a, b, k) in springs) builder.AddSpring(name, a, b, k);
        foreach (var (name, a, b, k, _) in repeated.Springs) builder.AddSpring(name, a, b, k);
        foreach (var (name, a, b, c) in dampers) builder.AddDamper(name, a, b, c);
        foreach (var (name, a, b, inertance) in inerters) builder.AddInerter(name, a, b, inertance);
        foreach (var (name, linked) in links) builder.AddLink(name, linked);
        foreach (var t in transducers) builder.AddTransducer(t.Name, t.NodeA, t.NodeB, t.BranchA, t.BranchB, t.ForceFactor);
        foreach (var mount in mounts) MountExpansion.Expand(mount, builder);
        var network = builder.Build();
        CheckMasslessNodes(network, context);
        if (embedding is not null) CheckEmbeddedSources(network, embedding, context);
        if (context.HasErrors) return null;
        WarnAboutLinkedElements(network, context);
        WarnAboutConnectivity(network, context);
        return network;
    }

    private static List<(string Name, string A, string B, double Value)> ReadTwoNodeSection(
        YMapping top, string section, string element, string valueKey, Quantity quantity, Range range,
        HashSet<string> nodes, ReadContext context)
    {
        var result = new List<(string, string, string, double)>();
        if (top[section] is not { } sectionNode) return result;
        if (sectionNode is YScalar s && s.IsPlainNull) return result;
        if (context.Mapping(sectionNode, $"'{section}'") is not { } mapping) return result;
        result.Capacity = mapping.Count;

        // The same for every element: made once, not per spring.
        var rotationalKey = $"rotational-{valueKey}";
        string[] allowed = ["between", valueKey, "axial", rotationalKey];
        context.Positions.EnsureCapacity(section, mapping.Count);
        foreach (var item in mapping.WalkSlots())
        {
            if (TryReadValidElement(item, section, valueKey, quantity, range, nodes, context, result)) continue;
            var (key, value) = item;
            if (!CheckName(key, context, element)) continue;
            var what = $"{element} '{key.Value}'";
            context.Positions[$"{section}.{key.Value}"] = key.Position;
            if (value is not YMapping entry)
            {
                var example = quantity == Quantity.Stiffness ? "95 kN/mm" : quantity == Quantity.Mass ? "150 kg" : "1.5 kN*s/m";
                context.Error(value, $"{what} must be a mapping such as '{{between: [ground, deck], {valueKey}: {example}}}'");
                continue;
            }
            context.RejectUnknownKeys(entry, what, allowed);
            if (entry["axial"] is not null || entry[rotationalKey] is not null)
            {
                RefuseInLine(entry, "axial", what, context);
                RefuseInLine(entry, rotationalKey, what, context);
                continue;
            }
            if (entry[valueKey] is YMapping perDirection && perDirection.Entries.Any(e => Directions.Parse(e.Key.Value) is not null))
            {
                context.Error(perDirection, $"'{valueKey}' of {what} is given per direction, which needs 'space: plane' or 'space: 3d' at the top of the file; a line model moves every mass along one line");
                continue;
            }
            var ends = ReadBetween(entry, key.Position, nodes, context, what);
            var v = context.Required(entry, valueKey, quantity, range, what, key.Position);
            if (ends is { } e && v is { } x) result.Add((key.Value, e.A, e.B, x));
        }
        return result;
    }

    // Valid entries of a large section, nearly all of them, are read from the tree's slots without making their nodes
    // or composing their descriptions. Anything these readers do not recognise as valid (a wrong name, key, form,
    // unknown node, a value text not read before or out of range, a quoted or aliased-to-collection scalar) returns
    // false before any effect, and the entry is read by the general code below, which gives every diagnostic.
    // A command reads its model once, so these run in a fresh process: they are compiled optimized at their first call
    // (AggressiveOptimization) instead of running unoptimized through the first tens of thousands of elements.

    /// <summary>Adds a valid mass of a line model given as 'name: 40 kg' or 'name: {mass: 40 kg, at: [x, y]}', as the
    /// general reader would; false, with nothing done, for anything else.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static bool TryAddValidMass(YEntry item, NetworkBuilder builder, HashSet<string> nodes, ReadContext context)
    {
        if (item.Store is not { } store || ValidName(store, item.KeySlot) is not { } name) return false;
        double kg;
        DrawingPosition? at = null;
        var value = store.Resolve(item.ValueSlot);
        switch (store.KindOf(value))
        {
            case NodeStore.Kind.Scalar:
                if (!KnownValue(store, value, Quantity.Mass, MassRange, context, out kg)) return false;
                break;
            case NodeStore.Kind.Mapping when !store.Marked(value):
                var (massSeen, entries) = (false, store.CountOf(value));
                kg = 0;
                for (var (k, i) = (value + 1, 0); i < entries; i++)
                {
                    var v = store.Resolve(store.After(k));
                    switch (PlainText(store, k))
                    {
                        case "mass" when !massSeen:
                            if (!KnownValue(store, v, Quantity.Mass, MassRange, context, out kg)) return false;
                            massSeen = true;
                            break;
                        case "at" when at is null:
                            if (store.KindOf(v) != NodeStore.Kind.Sequence || store.CountOf(v) != 2
                                || !KnownValue(store, store.Resolve(v + 1), Quantity.Length, DrawingRange, context, out var x)
                                || !KnownValue(store, store.Resolve(store.After(v + 1)), Quantity.Length, DrawingRange, context, out var y))
                                return false;
                            at = new DrawingPosition(x, y);
                            break;
                        default:
                            return false;
                    }
                    k = store.After(store.After(k));
                }
                if (!massSeen) return false;
                break;
            default:
                return false;
        }
        context.Positions.Set("masses", name, store.PositionOf(item.KeySlot));
        nodes.Add(name);
        if (!context.HasErrors) builder.AddMass(name, kg, at);
        return true;
    }

    /// <summary>Adds a valid element of a line model, '{between: [a, b], stiffness: 5 MN/m}' (or the section's value
    /// key), to <paramref name="result"/> as <see cref="ReadTwoNodeSection"/> would; false, with nothing done, for anything else.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static bool TryReadValidElement(YEntry item, string section, string valueKey, Quantity quantity, Range range,
        HashSet<string> nodes, ReadContext context, List<(string Name, string A, string B, double Value)> result)
    {
        if (item.Store is not { } store || ValidName(store, item.KeySlot) is not { } name) return false;
        var entry = store.Resolve(item.ValueSlot);
        if (store.KindOf(entry) != NodeStore.Kind.Mapping || store.Marked(entry)) return false;
        var entries = store.CountOf(entry);
        if (entries != 2) return false;
        string? a = null, b = null;
        double? amount = null;
        for (var (k, i) = (entry + 1, 0); i < entries; i++)
        {
            var v = store.Resolve(store.After(k));
            var key = PlainText(store, k);
            if (key == "between" && a is null)
            {
                if (store.KindOf(v) != NodeStore.Kind.Sequence || store.CountOf(v) != 2) return false;
                a = PlainText(store, v + 1);
                b = PlainText(store, store.After(v + 1));
                if (a is null || b is null || a == b || !nodes.Contains(a) || !nodes.Contains(b)) return false;
            }
            else if (key == valueKey && amount is null)
            {
                if (!KnownValue(store, v, quantity, range, context, out var x)) return false;
                amount = x;
            }
            else return false;
            k = store.After(store.After(k));
        }
        if (a is null || amount is not { } value) return false;
        context.Positions.Set(section, name, store.PositionOf(item.KeySlot));
        result.Add((name, a, b!, value));
        return true;
    }

    /// <summary>The key at <paramref name="slot"/> when it is a name <see cref="CheckName"/> accepts without a word.</summary>
    private static string? ValidName(NodeStore store, int slot) =>
        PlainText(store, slot) is { } name && name != CoreNetwork.Ground && IsUsableName(name) ? name : null;

    /// <summary>The text of the unquoted scalar at <paramref name="slot"/> (through an alias) that is not empty or a
    /// null (what <see cref="ReadContext.Text"/> accepts), or null for anything else.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static string? PlainText(NodeStore store, int slot)
    {
        slot = store.Resolve(slot);
        if (store.KindOf(slot) != NodeStore.Kind.Scalar || store.Marked(slot)) return null;
        var text = store.TextOf(slot);
        return text.Length == 0 || text is "~" or "null" or "Null" or "NULL" ? null : text;
    }

    /// <summary>The value of the plain scalar at <paramref name="slot"/> when its text was read before as
    /// <paramref name="quantity"/> and lies in <paramref name="range"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static bool KnownValue(NodeStore store, int slot, Quantity quantity, Range range, ReadContext context, out double value)
    {
        value = 0;
        return PlainText(store, slot) is { } text && context.TryKnownValue(text, quantity, range, out value);
    }

    /// <summary>The two-item 'between' list of an element, or null after a located error: the entry lacks it (it
    /// needs <paramref name="needs"/>) or it does not list exactly two <paramref name="example"/>.</summary>
    private static YSequence? BetweenPair(YMapping entry, SourcePosition owner, ReadContext context, string what, string needs, string example)
    {
        var node = entry["between"];
        if (node is null)
        {
            context.Error(owner, $"{what} needs 'between: [node, node]' naming {needs}");
            return null;
        }
        if (node is not YSequence { Items.Length: 2 } seq)
        {
            context.Error(node, $"'between' of {what} must list exactly two {example}");
            return null;
        }
        return seq;
    }

    private static (string A, string B)? ReadBetween(YMapping entry, SourcePosition owner, HashSet<string> nodes, ReadContext context, string what)
    {
        if (BetweenPair(entry, owner, context, what, "the two masses or supports it connects", "nodes, e.g. [ground, deck]") is not { } seq) return null;
        var names = new string?[2];
        for (var i = 0; i < 2; i++)
        {
            var name = context.Text(seq.Items[i], $"'between' of {what}");
            if (name is null) continue;
            if (!nodes.Contains(name))
            {
                context.Error(seq.Items[i], $"{what} refers to unknown node '{name}'{ReadContext.Suggest(name, nodes)}; declare it under 'masses' or 'supports', or use 'ground'");
                continue;
            }
            names[i] = name;
        }
        if (names[0] is null || names[1] is null) return null;
        if (names[0] == names[1])
        {
            context.Error(seq, $"{what} connects '{names[0]}' to itself; its two ends must differ");
            return null;
        }
        return (names[0]!, names[1]!);
    }

    private static DrawingPosition? ReadPosition(YNode node, ReadContext context, string what)
    {
        if (node is not YSequence { Items.Length: 2 } seq)
        {
            context.Error(node, $"'at' of {what} must be a drawing position [x, y] in m" +
                (node is YSequence { Items.Length: 3 } ? " (a location [x, y, z] needs 'space: 3d' at the top of the file)" : ""));
            return null;
        }
        var x = context.Value(seq.Items[0], Quantity.Length, DrawingRange, $"'at' of {what}");
        var y = context.Value(seq.Items[1], Quantity.Length, DrawingRange, $"'at' of {what}");
        return x is { } xv && y is { } yv ? new DrawingPosition(xv, yv) : null;
    }

    /// <summary>The rest of a plane or 3d model's network, after its masses and supports: massless nodes, bodies, springs, dampers, inerters and mounts.</summary>
    private static CoreNetwork? ReadSpatialNetwork(YMapping top, NetworkBuilder builder, SpatialNodes spatial, HashSet<string> nodes, ReadContext context)
    {
        ReadSpatialNodes(top, builder, spatial, nodes, context);
        ReadBodies(top, builder, spatial, nodes, context);
        var springs = ReadSpatialElements(top, SpringKind, spatial, context);
        var dampers = ReadSpatialElements(top, DamperKind, spatial, context);
        var inerters = ReadSpatialInerters(top, spatial, context);
        var mounts = ReadSpatialMounts(top, spatial, context);
        if (context.HasErrors) return null;
        foreach (var s in springs) builder.AddSpring(new Spring(s.Name, s.A, s.B, s.Scale) { Components = s.Components, Axial = s.Axial });
        foreach (var d in dampers) builder.AddDamper(new Damper(d.Name, d.A, d.B, d.Scale) { Components = d.Components, Axial = d.Axial });
        foreach (var i in inerters) builder.AddInerter(i);
        foreach (var mount in mounts) MountExpansion.Expand(mount, builder);
        var network = builder.Build();
        CheckMasslessNodes(network, context);
        CheckSpatialNodeDirections(network, context);
        if (context.HasErrors) return null;
        WarnAboutSpatialConnectivity(network, context);
        return network;
    }

    private static bool CheckName(YScalar key, ReadContext context, string element)
    {
        if (key.Value == CoreNetwork.Ground)
        {
            context.Error(key, $"'{CoreNetwork.Ground}' is the reserved fixed support and cannot name a {element}");
            return false;
        }
        if (!IsUsableName(key.Value))
        {
            context.Error(key, $"'{key.Value}' is not a usable {element} name; use letters, digits, '_', '-' and '.', starting with a letter or digit");
            return false;
        }
        return true;
    }

    private static void WarnAboutConnectivity(CoreNetwork network, ReadContext context)
    {
        var spread = Topology.StiffnessRatioWarning(network);
        if (spread is not null && context.Positions.TryGetValue($"springs.{Topology.StiffnessSpread(network).Stiff[0].Name}", out var at))
            context.Warning(at, spread);
        // A massless node has no rigid-body mode of its own (it is condensed or a first-order state): not warned about here.
        var massless = network.Masses.Where(m => m.Kilograms == 0).Select(m => m.Name).ToHashSet(StringComparer.Ordinal);
        // A circuit's node without an inductor is no loose mass: its "rigid-body mode" is a charge held at rest.
        massless.UnionWith(network.ElectricalNodes);
        var loose = Topology.MassesWithoutSpring(network).Where(name => !massless.Contains(name)).ToHashSet();
        foreach (var name in loose)
            context.Warning(context.Positions[$"masses.{name}"],
                $"mass '{name}' has no spring: nothing holds it, so it has a rigid-body mode (reported at 0 Hz)");
        foreach (var group in Topology.RigidBodyGroups(network))
        {
            if (group.All(g => loose.Contains(g) || massless.Contains(g))) continue;
            var shown = group.Where(g => !network.IsElectrical(g)).ToArray();
            context.Warning(context.Positions[$"masses.{shown[0]}"],
                $"masses {string.Join(", ", shown.Select(g => $"'{g}'"))} are not connected to ground by springs: " +
                "that part of the network has a rigid-body mode (reported at 0 Hz)");
        }
    }
}
