using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range PositiveStiffnessRange = new(0, 1e14, MinimumInclusive: false);   // N/m
    private static readonly Range PositiveDampingRange = new(0, 1e13, MinimumInclusive: false);     // N·s/m
    private static readonly Range RelaxationTimeRange = new(0, 1e6, MinimumInclusive: false);       // s
    private static readonly Range RelaxationStrengthRange = new(0, 1e6, MinimumInclusive: false);   // k2/k1
    private static readonly Range LossFactorRange = new(0, 10, MinimumInclusive: false);            // η
    private static readonly Range ReferenceFrequencyRange = new(0, 1e6, MinimumInclusive: false);   // Hz

    private static readonly string[] MountKeys = ["kind", "between", "stiffness", "damping", "relaxation-time", "relaxation-strength", "loss-factor", "at"];
    private static readonly string[] MountKinds = ["maxwell", "standard-linear-solid"];

    /// <summary>Reads 'nodes': points without mass (line models), as a list of names or a mapping of names to '{at: [x, y]}'.</summary>
    /// <remarks>
    /// <c>nodes: [joint, hub]</c> or <c>nodes: {joint: {at: [1, 0]}, hub: }</c>. Each becomes a mass of 0 kg after the
    /// masses, in the order written; springs, dampers, inerters and mounts may join it and outputs may name it.
    /// </remarks>
    private static void ReadNodes(YMapping top, ReadContext context, NetworkBuilder builder, HashSet<string> nodes)
    {
        if (top["nodes"] is not { } section || section is YScalar { IsPlainNull: true }) return;
        var entries = new List<(YScalar Key, YNode? Value)>();
        if (section is YSequence list)
        {
            foreach (var item in list.Items)
            {
                if (item is YScalar { IsPlainNull: false } s) entries.Add((s, null));
                else context.Error(item, "each item of 'nodes' must be a node name, e.g. 'nodes: [joint, hub]'");
            }
        }
        else if (context.Mapping(section, "'nodes'") is { } mapping)
            foreach (var (key, value) in mapping.Walk()) entries.Add((key, value));
        else return;

        foreach (var (key, value) in entries)
        {
            if (!CheckName(key, context, "node")) continue;
            var what = $"node '{key.Value}'";
            if (!nodes.Add(key.Value))
            {
                context.Error(key, $"{what} is declared twice, or has the name of a mass; masses, nodes and supports share one set of names");
                continue;
            }
            context.Positions[$"nodes.{key.Value}"] = key.Position;
            context.Positions[$"masses.{key.Value}"] = key.Position;
            DrawingPosition? at = null;
            if (value is not null and not YScalar { IsPlainNull: true })
            {
                if (context.Mapping(value, what) is not { } entry) continue;
                context.RejectUnknownKeys(entry, what, "at");
                if (entry["at"] is { } atNode) at = ReadPosition(atNode, context, what);
            }
            if (!context.HasErrors) builder.AddNode(key.Value, at);
        }
    }

    /// <summary>Reads 'mounts': viscoelastic mounts by name (Maxwell, standard linear solid), expanded by <see cref="MountExpansion"/>.</summary>
    private static List<Mount> ReadMounts(YMapping top, HashSet<string> nodes, ReadContext context)
    {
        var result = new List<Mount>();
        if (top["mounts"] is not { } section || section is YScalar { IsPlainNull: true }) return result;
        if (context.Mapping(section, "'mounts'") is not { } mapping) return result;
        foreach (var (key, value) in mapping.Walk())
        {
            if (!CheckName(key, context, "mount")) continue;
            var what = $"mount '{key.Value}'";
            RecordMountPositions(key, context);
            if (value is not YMapping entry)
            {
                context.Error(value, $"{what} must be a mapping such as '{{kind: maxwell, between: [fan, ground], stiffness: 80 kN/m, damping: 400 N*s/m}}'");
                continue;
            }
            context.RejectUnknownKeys(entry, what, MountKeys);
            if (entry["kind"] is not { } kindNode)
            {
                context.Error(key, $"{what} needs 'kind', one of: {string.Join(", ", MountKinds)}");
                continue;
            }
            var kindText = context.Text(kindNode, $"'kind' of {what}");
            if (kindText is null) continue;
            if (Array.IndexOf(MountKinds, kindText) < 0)
            {
                context.Error(kindNode, $"'kind' of {what} is '{kindText}'{ReadContext.Suggest(kindText, MountKinds)}; accepted kinds: {string.Join(", ", MountKinds)}");
                continue;
            }
            var ends = ReadBetween(entry, key.Position, nodes, context, what);
            var stiffness = context.Required(entry, "stiffness", Quantity.Stiffness, PositiveStiffnessRange, what, key.Position);
            Mount? mount = kindText == "maxwell"
                ? ReadMaxwell(entry, key, what, ends, stiffness, context)
                : ReadStandardLinearSolid(entry, key, what, ends, stiffness, context);
            if (mount is not null) result.Add(mount);
        }
        return result;
    }

    private static Mount? ReadMaxwell(YMapping entry, YScalar key, string what, (string A, string B)? ends, double? stiffness, ReadContext context)
    {
        foreach (var other in new[] { "relaxation-strength", "loss-factor", "at" })
            if (entry[other] is { } extra) context.Error(extra, $"'{other}' belongs to a standard-linear-solid mount; {what} is a Maxwell mount (stiffness and damping, or stiffness and relaxation-time)");
        var damping = entry["damping"];
        var time = entry["relaxation-time"];
        if ((damping is null) == (time is null))
        {
            context.Error(damping is null ? key : damping, $"{what} needs exactly one of 'damping' (the damper, N*s/m) and 'relaxation-time' (τ = c/k)");
            return null;
        }
        var c = damping is null ? null : context.Value(damping, Quantity.Damping, PositiveDampingRange, $"'damping' of {what}");
        var tau = time is null ? null : context.Value(time, Quantity.Time, RelaxationTimeRange, $"'relaxation-time' of {what}");
        if (ends is not { } e || stiffness is not { } k) return null;
        if (c is { } cv) tau = cv / k;
        return tau is { } t ? new Mount(key.Value, MountKind.Maxwell, e.A, e.B, k, t) : null;
    }

    private static Mount? ReadStandardLinearSolid(YMapping entry, YScalar key, string what, (string A, string B)? ends, double? stiffness, ReadContext context)
    {
        if (entry["damping"] is { } extra)
            context.Error(extra, $"'damping' belongs to a Maxwell mount; {what} takes 'relaxation-strength' (k2/k1) and 'relaxation-time' (τ = c/k2), or 'loss-factor' with 'at'");
        var strength = context.Required(entry, "relaxation-strength", Quantity.Ratio, RelaxationStrengthRange, what, key.Position);
        var time = entry["relaxation-time"];
        var loss = entry["loss-factor"];
        var at = entry["at"];
        if ((time is null) == (loss is null))
        {
            context.Error(time ?? (YNode?)loss ?? key, $"{what} needs exactly one of 'relaxation-time' (τ = c/k2) and 'loss-factor' (with 'at', the frequency where it holds)");
            return null;
        }
        if (time is not null)
        {
            if (at is not null) context.Error(at, $"'at' of {what} goes with 'loss-factor'; with 'relaxation-time' leave it out");
            var tau = context.Value(time, Quantity.Time, RelaxationTimeRange, $"'relaxation-time' of {what}");
            if (ends is not { } e || stiffness is not { } k || strength is not { } d || tau is not { } t) return null;
            return new Mount(key.Value, MountKind.StandardLinearSolid, e.A, e.B, k, t, d);
        }
        if (at is null)
        {
            context.Error(loss!, $"'loss-factor' of {what} needs 'at', the frequency where it holds, e.g. 'at: 25 Hz'");
            return null;
        }
        var eta = context.Value(loss!, Quantity.Ratio, LossFactorRange, $"'loss-factor' of {what}");
        var hz = context.Value(at, Quantity.Frequency, ReferenceFrequencyRange, $"'at' of {what}");
        if (strength is not { } ds || eta is not { } etaValue || hz is not { } f) return null;
        if (MountExpansion.RelaxationTimeForLossFactor(ds, etaValue, 2 * Math.PI * f) is not { } tauFromLoss)
        {
            var max = MountExpansion.MaximumLossFactor(ds);
            context.Error(loss!, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"'loss-factor' of {what} is {etaValue:G4}, more than a standard linear solid of relaxation strength {ds:G4} reaches: its largest loss factor is k2/(2√(k1(k1+k2))) = Δ/(2√(1+Δ)) = {max:G4}; raise 'relaxation-strength' or lower the loss factor"));
            return null;
        }
        if (ends is not { } ee || stiffness is not { } kk) return null;
        return new Mount(key.Value, MountKind.StandardLinearSolid, ee.A, ee.B, kk, tauFromLoss, ds);
    }

    /// <summary>
    /// Refuses massless nodes whose motion nothing determines: a node with nothing attached; a group of massless nodes
    /// joined to no mass or support; dampers (or inerters) among massless nodes that lead to no mass or support.
    /// </summary>
    private static void CheckMasslessNodes(CoreNetwork network, ReadContext context)
    {
        var massless = network.Masses.Where(m => m.Kilograms == 0).Select(m => m.Name).ToHashSet(StringComparer.Ordinal);
        if (massless.Count == 0) return;
        SourcePosition PositionOf(string node)
        {
            if (context.Positions.TryGetValue($"nodes.{node}", out var p)) return p;
            var tilde = node.IndexOf('~', StringComparison.Ordinal);
            if (tilde > 0 && context.Positions.TryGetValue($"mounts.{node[..tilde]}", out p)) return p;
            if (context.Positions.TryGetValue($"circuit.nodes.{node}", out p)) return p;
            return context.Positions.TryGetValue($"masses.{node}", out p) ? p : new SourcePosition(1, 1);
        }
        var elements = network.Springs.Where(s => s.Stiffness > 0).Select(s => (Kind: "spring", s.NodeA, s.NodeB))
            .Concat(network.Dampers.Where(d => d.Coefficient > 0).Select(d => (Kind: "damper", d.NodeA, d.NodeB)))
            .Concat(network.Inerters.Where(b => b.Inertance > 0).Select(b => (Kind: "inerter", b.NodeA, b.NodeB)))
            .ToArray();

        var touched = new HashSet<string>(StringComparer.Ordinal);
        foreach (var (_, a, b) in elements) { touched.Add(a); touched.Add(b); }
        foreach (var node in network.Masses.Where(m => massless.Contains(m.Name) && !touched.Contains(m.Name)))
            context.Error(PositionOf(node.Name), $"node '{node.Name}' has nothing attached: a massless node must join springs, dampers, inerters or mounts (its motion is otherwise undefined)");

        void CheckGroups(IEnumerable<(string Kind, string NodeA, string NodeB)> joining, string message)
        {
            var parent = massless.ToDictionary(x => x, x => x, StringComparer.Ordinal);
            string Find(string x)
            {
                while (parent[x] != x) x = parent[x] = parent[parent[x]];
                return x;
            }
            var list = joining.ToArray();
            foreach (var (_, a, b) in list)
                if (massless.Contains(a) && massless.Contains(b)) parent[Find(a)] = Find(b);
            var anchored = new HashSet<string>(StringComparer.Ordinal);
            var involved = new HashSet<string>(StringComparer.Ordinal);
            foreach (var (_, a, b) in list)
            {
                if (massless.Contains(a)) involved.Add(Find(a));
                if (massless.Contains(b)) involved.Add(Find(b));
                if (massless.Contains(a) && !massless.Contains(b)) anchored.Add(Find(a));
                if (massless.Contains(b) && !massless.Contains(a)) anchored.Add(Find(b));
            }
            foreach (var root in involved.Where(r => !anchored.Contains(r)))
            {
                var members = network.Masses.Where(m => massless.Contains(m.Name) && touched.Contains(m.Name) && Find(m.Name) == root).Select(m => m.Name).ToArray();
                if (members.Length == 0) continue;
                var names = string.Join(", ", members.Select(n => $"'{n}'"));
                context.Error(PositionOf(members[0]), string.Format(System.Globalization.CultureInfo.InvariantCulture, message, names));
            }
        }
        CheckGroups(elements, "massless node(s) {0} are joined to no mass or support: with no inertia and nothing to hold them their motion is undefined; join them to a mass or support, or give one of them a mass");
        CheckGroups(elements.Where(e => e.Kind == "damper"), "the dampers at massless node(s) {0} lead to no mass or support through dampers: such a node drifts at the speed of its neighbour and its position is undefined; add a damper to a mass or support, or give the node a mass");
        CheckGroups(elements.Where(e => e.Kind == "inerter"), "the inerters at massless node(s) {0} lead to no mass or support through inerters: their inertance has nothing to accelerate against and the mass matrix is singular; join an inerter to a mass or support, or give the node a mass");
    }

    /// <summary>The mount and its expansion's elements are found at the mount's key (warnings and reports look them up by section).</summary>
    private static void RecordMountPositions(YScalar key, ReadContext context)
    {
        context.Positions[$"mounts.{key.Value}"] = key.Position;
        context.Positions[$"masses.{MountExpansion.InnerNode(key.Value)}"] = key.Position;
        foreach (var part in new[] { "~spring", "~long-term", "~series" }) context.Positions[$"springs.{key.Value}{part}"] = key.Position;
        context.Positions[$"dampers.{key.Value}~damper"] = key.Position;
    }
}
