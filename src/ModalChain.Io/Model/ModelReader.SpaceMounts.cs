using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    /// <summary>Reads 'nodes' of a plane or 3d model: massless points with a location and the translations they move in.</summary>
    /// <remarks>
    /// <c>nodes: {joint: {at: [x, y, z], directions: [z]}}</c>. Each becomes a mass of 0 kg after the masses, in the order
    /// written, moving in its translations (every translation of the space by default) and never rotating.
    /// </remarks>
    private static void ReadSpatialNodes(YMapping top, NetworkBuilder builder, SpatialNodes spatial, HashSet<string> names, ReadContext context)
    {
        if (top["nodes"] is not { } section || section is YScalar { IsPlainNull: true }) return;
        var space = spatial.Space;
        var form = $"'nodes: {{joint: {{at: {LocationForm(space)}}}}}'";
        if (section is YSequence list)
        {
            foreach (var item in list.Items)
            {
                var name = item is YScalar { IsPlainNull: false } s ? $" '{s.Value}'" : "";
                context.Error(item, $"node{name} needs its location in a {SpaceName(space)} model: write {form}, each node with 'at'");
            }
            return;
        }
        if (context.Mapping(section, "'nodes'") is not { } mapping) return;
        var translations = Directions.Translations(space);
        foreach (var (key, value) in mapping.Entries)
        {
            if (!CheckName(key, context, "node")) continue;
            var what = $"node '{key.Value}'";
            if (!names.Add(key.Value))
            {
                context.Error(key, $"{what} is declared twice, or has the name of a mass or support; masses, nodes, supports and bodies share one set of names");
                continue;
            }
            context.Positions[$"nodes.{key.Value}"] = key.Position;
            context.Positions[$"masses.{key.Value}"] = key.Position;
            spatial.Nodes[key.Value] = (null, translations);
            if (value is not YMapping entry)
            {
                context.Error(value is YScalar { IsPlainNull: true } ? key : value,
                    $"{what} needs 'at: {LocationForm(space)}', its location in m: locations are mechanical data in a {SpaceName(space)} model; write {form}");
                continue;
            }
            context.RejectUnknownKeys(entry, what, "at", "directions");
            Point3? at = null;
            if (entry["at"] is { } atNode) at = ReadLocation(atNode, space, context, $"'at' of {what}");
            else context.Error(key, $"{what} needs 'at: {LocationForm(space)}', its location in m: locations are mechanical data in a {SpaceName(space)} model");
            ImmutableArray<Direction> moves = translations;
            if (entry["directions"] is { } dirNode)
            {
                if (dirNode is not YSequence { Items.Length: > 0 } seq)
                    context.Error(dirNode, $"'directions' of {what} must list the translations it moves in, e.g. [z]");
                else
                {
                    var listed = new List<Direction>();
                    foreach (var item in seq.Items)
                    {
                        if (item is YScalar { Value: "rx" or "ry" or "rz" } r)
                        {
                            context.Error(item, $"'directions' of {what} names the rotation '{r.Value}': a massless node is a point and moves in translations only; to carry a moment, attach the elements to a body");
                            continue;
                        }
                        if (ReadDirectionWord(item, space, context, $"'directions' of {what}", translations) is not { } d) continue;
                        if (listed.Contains(d)) context.Error(item, $"'directions' of {what} names '{d.Label()}' twice");
                        else listed.Add(d);
                    }
                    if (listed.Count > 0) moves = [.. listed.Order()];
                }
            }
            spatial.Nodes[key.Value] = (at, moves);
            if (at is { } p && !context.HasErrors)
                builder.AddMass(new Mass(key.Value, 0, new DrawingPosition(p.X, p.Z)) { Location = p, Moves = moves.Length == translations.Length ? [] : moves });
        }
    }

    /// <summary>
    /// Reads 'mounts' of a plane or 3d model: a Maxwell or standard-linear-solid mount with its stiffness per translation
    /// and one relaxation time (and strength) for every direction, expanded by <see cref="MountExpansion"/>.
    /// </summary>
    private static List<Mount> ReadSpatialMounts(YMapping top, SpatialNodes spatial, ReadContext context)
    {
        var result = new List<Mount>();
        if (top["mounts"] is not { } section || section is YScalar { IsPlainNull: true }) return result;
        if (context.Mapping(section, "'mounts'") is not { } mapping) return result;
        var space = spatial.Space;
        var translations = Directions.Translations(space);
        var example = space == ModelSpace.Plane ? "{x: 0.3 kN/mm, z: 0.9 kN/mm}" : "{x: 0.3 kN/mm, y: 0.3 kN/mm, z: 0.9 kN/mm}";
        foreach (var (key, value) in mapping.Entries)
        {
            if (!CheckName(key, context, "mount")) continue;
            var what = $"mount '{key.Value}'";
            RecordMountPositions(key, context);
            if (value is not YMapping entry)
            {
                context.Error(value, $"{what} must be a mapping such as '{{kind: maxwell, between: [skid.foot-1, ground], stiffness: {example}, relaxation-time: 8 ms}}'");
                continue;
            }
            context.RejectUnknownKeys(entry, what, MountKeys);
            if (entry["kind"] is not { } kindNode)
            {
                context.Error(key, $"{what} needs 'kind', one of: {string.Join(", ", MountKinds)}");
                continue;
            }
            if (context.Text(kindNode, $"'kind' of {what}") is not { } kindText) continue;
            if (Array.IndexOf(MountKinds, kindText) < 0)
            {
                context.Error(kindNode, $"'kind' of {what} is '{kindText}'{ReadContext.Suggest(kindText, MountKinds)}; accepted kinds: {string.Join(", ", MountKinds)}");
                continue;
            }
            var ends = ReadSpatialEnds(entry, key.Position, spatial, context, what);

            // Stiffness per translation: the inner node moves in exactly these directions.
            var components = new List<DirectionalValue>();
            var ok = true;
            if (entry["stiffness"] is not { } stiffnessNode)
            {
                context.Error(key, $"{what} needs 'stiffness: {example}', its stiffness per translation");
                ok = false;
            }
            else if (stiffnessNode is not YMapping perDirection)
            {
                context.Error(stiffnessNode, $"'stiffness' of {what} is given per translation in a {SpaceName(space)} model, e.g. 'stiffness: {example}'");
                ok = false;
            }
            else if (perDirection.Entries.Length == 0)
            {
                context.Error(perDirection, $"'stiffness' of {what} gives no direction; list e.g. {{{translations[^1].Label()}: ...}}");
                ok = false;
            }
            else
                foreach (var (k, v) in perDirection.Entries)
                {
                    if (k.Value is "rx" or "ry" or "rz")
                    {
                        context.Error(k, $"'stiffness' of {what} names the rotation '{k.Value}': a mount's inner node is a point and moves in translations only; give {DirectionList(translations)}, or a rotational spring between bodies under 'springs'");
                        ok = false;
                        continue;
                    }
                    if (ReadDirectionWord(k, space, context, $"a direction of 'stiffness' of {what}", translations) is not { } d) { ok = false; continue; }
                    if (components.Any(c => c.Direction == d))
                    {
                        context.Error(k, $"'stiffness' of {what} names '{d.Label()}' twice");
                        ok = false;
                        continue;
                    }
                    if (context.Value(v, Quantity.Stiffness, PositiveStiffnessRange, $"'{k.Value}' of 'stiffness' of {what}") is not { } x) { ok = false; continue; }
                    if (ends is var (ea, eb) && !ea.Moves.Contains(d) && !eb.Moves.Contains(d))
                    {
                        context.Error(k, $"{what} acts in '{d.Label()}', but neither {Describe(ea)} ({MovesText(ea)}) nor {Describe(eb)} ({MovesText(eb)}) moves in '{d.Label()}': it would carry no force");
                        ok = false;
                        continue;
                    }
                    components.Add(new DirectionalValue(d, x));
                }

            if (entry["damping"] is { } damping)
            {
                // One relaxation time for every direction (the elastomer's), so the damper per direction is its spring times τ.
                context.Error(damping, $"'damping' of {what}: in a {SpaceName(space)} model a Maxwell mount takes 'relaxation-time' (τ = c/k, one for every direction: the damper in each direction is that direction's stiffness times τ)");
                continue;
            }
            var scale = components.Count > 0 ? components.Max(c => c.Value) : (double?)null;
            var names = ends is var (a, b) ? (a.Reference, b.Reference) : ((string, string)?)null;
            var mount = kindText == "maxwell"
                ? ReadMaxwell(entry, key, what, names, scale, context)
                : ReadStandardLinearSolid(entry, key, what, names, scale, context);
            if (mount is null || !ok || ends is not var (first, second)) continue;
            result.Add(mount with
            {
                Components = [.. components.OrderBy(c => c.Direction)],
                InnerLocation = first.Location ?? second.Location,
            });
        }
        return result;
    }

    /// <summary>
    /// Refuses a massless node of a plane or 3d model that moves in a translation no element acts in: its motion there
    /// would be undefined (no stiffness, damping or inertance).
    /// </summary>
    private static void CheckSpatialNodeDirections(CoreNetwork network, ReadContext context)
    {
        var massless = network.Masses.Where(m => m.Kilograms == 0).ToArray();
        if (massless.Length == 0) return;
        var acted = new HashSet<(string, Direction)>();
        void Mark(string nodeA, string nodeB, ImmutableArray<DirectionalValue> components, bool axial)
        {
            foreach (var end in new[] { nodeA, nodeB })
            {
                if (axial)
                {
                    // An axial element acts along its line: on every translation with a component of it.
                    var a = network.Resolve(nodeA)?.Location;
                    var b = network.Resolve(nodeB)?.Location;
                    if (a is { } p && b is { } q)
                        foreach (var d in Directions.Translations(network.Space))
                            if ((d == Direction.X ? q.X - p.X : d == Direction.Y ? q.Y - p.Y : q.Z - p.Z) != 0) acted.Add((end, d));
                    continue;
                }
                foreach (var c in components) if (c.Value > 0) acted.Add((end, c.Direction));
            }
        }
        foreach (var s in network.Springs) Mark(s.NodeA, s.NodeB, s.Components, s.Axial);
        foreach (var d in network.Dampers) Mark(d.NodeA, d.NodeB, d.Components, d.Axial);
        foreach (var i in network.Inerters) Mark(i.NodeA, i.NodeB, i.Components, i.Axial);
        var touched = acted.Select(a => a.Item1).ToHashSet(StringComparer.Ordinal);
        foreach (var node in massless)
        {
            var moves = node.Moves.IsDefaultOrEmpty ? Directions.Translations(network.Space) : node.Moves;
            var missing = moves.Where(d => !acted.Contains((node.Name, d))).ToArray();
            if (missing.Length == 0 || !touched.Contains(node.Name)) continue; // a node nothing touches is reported by CheckMasslessNodes
            if (!context.Positions.TryGetValue($"nodes.{node.Name}", out var at)) continue;
            context.Error(at, $"node '{node.Name}' moves in {DirectionList(missing)}, but no spring, damper or inerter acts on it there: a massless node's motion in such a direction is undefined; list under 'directions' only the translations its elements act in");
        }
    }
}
