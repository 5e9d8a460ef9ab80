using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range ForceFactorRange = new(0, 1e6, MinimumInclusive: false); // T·m

    /// <summary>Reads 'transducers': ideal moving-coil transducers between a mechanical pair and an electrical branch (line models).</summary>
    /// <remarks>
    /// <c>transducers: {coil: {between: [magnet, coil-mass], branch: [n1, n2], force-factor: 12 T*m}}</c>. Each one
    /// eliminates the coordinate of n1 (or n2 when n1 is a support; see <see cref="ConstraintElimination"/>); a
    /// transducer whose coordinate cannot be eliminated is a located error at its name.
    /// </remarks>
    private static List<Transducer> ReadTransducers(YMapping top, ReadContext context, HashSet<string> nodes,
        HashSet<string> supports, List<(string Name, string[] Masses)> links)
    {
        var result = new List<Transducer>();
        if (top["transducers"] is not { } sectionNode || sectionNode is YScalar { IsPlainNull: true }) return result;
        if (context.Mapping(sectionNode, "'transducers'") is not { } mapping) return result;
        bool IsSupport(string n) => n == CoreNetwork.Ground || supports.Contains(n);
        var linked = links.SelectMany(l => l.Masses).ToHashSet(StringComparer.Ordinal);
        foreach (var (key, value) in mapping.Walk())
        {
            if (!CheckName(key, context, "transducer")) continue;
            var what = $"transducer '{key.Value}'";
            context.Positions[$"transducers.{key.Value}"] = key.Position;
            if (value is not YMapping entry)
            {
                context.Error(value, $"{what} must be a mapping such as '{{between: [magnet, coil-mass], branch: [n1, n2], force-factor: 12 T*m}}'");
                continue;
            }
            context.RejectUnknownKeys(entry, what, "between", "branch", "force-factor");
            var between = ReadBetween(entry, key.Position, nodes, context, what);
            var branch = ReadBranch(entry, key.Position, nodes, context, what);
            var bl = context.Required(entry, "force-factor", Quantity.ForceFactor, ForceFactorRange, what, key.Position);
            if (between is not { } m || branch is not { } e || bl is not { } forceFactor) continue;
            if (result.Any(t => t.Name == key.Value))
            {
                context.Error(key, $"{what} is declared twice");
                continue;
            }
            var transducer = new Transducer(key.Value, m.A, m.B, e.A, e.B, forceFactor);
            if (ConstraintElimination.Problem(result, transducer, IsSupport, linked.Contains) is { } problem)
            {
                context.Error(key, problem);
                continue;
            }
            result.Add(transducer);
        }
        return result;
    }

    /// <summary>The two terminals of 'branch', or null after a located error.</summary>
    private static (string A, string B)? ReadBranch(YMapping entry, SourcePosition owner, HashSet<string> nodes, ReadContext context, string what)
    {
        var node = entry["branch"];
        if (node is null)
        {
            context.Error(owner, $"{what} needs 'branch: [n1, n2]' naming the two electrical nodes of its coil");
            return null;
        }
        if (node is not YSequence { Items.Length: 2 } seq)
        {
            context.Error(node, $"'branch' of {what} must list exactly two nodes, e.g. [coil-plus, ground]");
            return null;
        }
        var names = new string?[2];
        for (var i = 0; i < 2; i++)
        {
            if (context.Text(seq.Items[i], $"'branch' of {what}") is not { } name) continue;
            if (!nodes.Contains(name))
            {
                context.Error(seq.Items[i], $"{what} refers to unknown node '{name}'{ReadContext.Suggest(name, nodes)} in 'branch'; declare it under 'masses' (its capacitance in F as kg) or 'supports', or use 'ground'");
                continue;
            }
            names[i] = name;
        }
        if (names[0] is not { } a || names[1] is not { } b) return null;
        if (a == b)
        {
            context.Error(seq.Items[1], $"'branch' of {what} connects '{a}' to itself");
            return null;
        }
        return (a, b);
    }

    /// <summary>Refuses 'transducers' in plane and 3d models.</summary>
    private static void RefuseTransducersOutsideLine(YMapping top, ModelSpace space, ReadContext context)
    {
        if (space == ModelSpace.Line) return;
        foreach (var (k, _) in top.Entries)
            if (k.Value == "transducers")
                context.Error(k, "'transducers' cannot be used in a plane or 3d model yet: transducers act in line models only");
    }

    /// <summary>
    /// Refuses what names a node a transducer eliminates (it has no degree of freedom of its own: its flux follows the
    /// constraint): a load 'at' it, an output or initial condition, a criterion 'at' it; and prescribed motion of a
    /// support in the terms of an eliminated node that carries capacitance (its coupling to the support's acceleration
    /// is not carried by the support partition).
    /// </summary>
    private static void CheckTransducerReferences(YMapping top, CoreNetwork network, IEnumerable<Load> loads,
        IEnumerable<TransientExcitation> timed, ReadContext context)
    {
        if (ConstraintElimination.Of(network) is not { } elimination) return;
        void Refuse(YScalar at, string use)
        {
            if (elimination.Find(at.Value) is not { } e) return;
            context.Error(at, $"{use} names '{at.Value}', whose coordinate transducer '{e.Transducer.Name}' eliminates (its voltage is Bl times the relative velocity of '{e.Transducer.NodeA}' and '{e.Transducer.NodeB}'); name another node, or read the port through the mechanical pair");
        }
        void Scan(YNode? node, string use, bool keys)
        {
            switch (node)
            {
                case YMapping map:
                    foreach (var (k, v) in map.Entries)
                    {
                        if (keys) Refuse(k, use);
                        if (k.Value == "at" && v is YScalar s) Refuse(s, use);
                        else if (k.Value == "outputs" && v is YSequence outputs)
                            foreach (var item in outputs.Items.OfType<YScalar>()) Refuse(item, "an output");
                        else if (k.Value == "initial") Scan(v, "an initial condition", keys: true);
                        else Scan(v, use, keys: false);
                    }
                    break;
                case YSequence seq:
                    foreach (var item in seq.Items) Scan(item, use, keys: false);
                    break;
            }
        }
        Scan(top["loads"], "a load", keys: false);
        Scan(top["harmonic"], "the harmonic analysis", keys: false);
        Scan(top["transient"], "the transient analysis", keys: false);
        Scan(top["criteria"], "a criterion", keys: false);

        var moving = loads.OfType<BaseMotionLoad>().Select(l => (l.Name, l.Support))
            .Concat(timed.OfType<SupportAccelerationHistory>().Select(l => (l.Name, l.Support)))
            .Concat(timed.OfType<SupportVelocityHistory>().Select(l => (l.Name, l.Support)));
        var massOf = network.Masses.ToDictionary(m => m.Name, m => m.Kilograms, StringComparer.Ordinal);
        foreach (var (name, support) in moving)
            foreach (var e in elimination.Nodes)
                if (massOf.GetValueOrDefault(e.Node) > 0 && e.Terms.Any(t => t.Node == support) && context.Positions.TryGetValue($"loads.{name}", out var at))
                    context.Error(at, $"load '{name}' moves support '{support}', whose motion drives the capacitance at '{e.Node}' through transducer '{e.Transducer.Name}'; moving such a support is not supported yet: drive the mechanical pair with a force, or hold that support");
    }
}
