using System.Collections.Immutable;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

/// <summary>What the line reader needs of a <c>circuit:</c> section inside a line model, filled while it reads.</summary>
internal sealed class CircuitEmbedding
{
    /// <summary>How many errors the file had just before the section was read (only the section's own stop it).</summary>
    public int ErrorsBefore { get; set; }

    /// <summary>Where each circuit node is listed.</summary>
    public Dictionary<string, SourcePosition> NodePositions { get; } = new(StringComparer.Ordinal);

    /// <summary>The node names the section lists, even when the circuit had errors (so transducers naming them add none).</summary>
    public HashSet<string> DeclaredNodes { get; } = new(StringComparer.Ordinal);

    /// <summary>The circuit read, or null after errors in the section.</summary>
    public Circuit? Circuit { get; set; }

    /// <summary>The circuit's node flux analogy, once it is read.</summary>
    public CircuitAnalogy? Analogy { get; set; }

    /// <summary>The nodes voltage sources from ground hold (supports of the network).</summary>
    public HashSet<string> HeldNodes { get; } = new(StringComparer.Ordinal);

    /// <summary>The nodes a free circuit node may be named by (outputs): every circuit node no voltage source holds.</summary>
    public IEnumerable<string> FreeNodes => Analogy is { } a ? a.Nodes.Take(a.FreeCount) : [];
}

public static partial class ModelReader
{
    // The sections whose keys name the nodes and elements of a line model: one namespace with the circuit's names.
    private static readonly string[] MechanicalNodeSections = ["nodes", "masses", "supports", "mounts"];
    private static readonly string[] MechanicalElementSections = ["springs", "dampers", "inerters", "links", "transducers"];

    /// <summary>Whether the file is a line, plane or 3d model with a circuit inside (it has masses) rather than a circuit model.</summary>
    private static bool HasMechanicalNetwork(YMapping top) => top["masses"] is not null || top["repeat"] is not null || top["bodies"] is not null;

    /// <summary>Reads the <c>circuit:</c> section of a line model through the circuit model's reader (<see cref="ReadCircuit"/>).</summary>
    /// <remarks>
    /// The circuit's values and checks are the circuit model's; its topology is checked later, in
    /// <see cref="CheckEmbeddedCircuit"/>, once the transducers that join it to the structure are known.
    /// </remarks>
    private static void ReadEmbeddedCircuit(YMapping top, string title, CircuitEmbedding embedding, ReadContext context)
    {
        var node = top["circuit"]!;
        if (node is YMapping { } section && section["nodes"] is YSequence listed)
            foreach (var item in listed.Items)
                if (item is YScalar { IsPlainNull: false } name && name.Value != Circuit.Ground) embedding.DeclaredNodes.Add(name.Value);
        embedding.ErrorsBefore = context.ErrorCount;
        embedding.Circuit = ReadCircuit(node, title, context, embedding);
        if (embedding.Circuit is not { } circuit) return;
        foreach (var v in circuit.VoltageSources)
            if (v.Positive == Circuit.Ground ^ v.Negative == Circuit.Ground)
                embedding.HeldNodes.Add(v.Positive == Circuit.Ground ? v.Negative : v.Positive);
    }

    /// <summary>Refuses a <c>circuit:</c> section in a plane or 3d model.</summary>
    private static void RefuseCircuitOutsideLine(YMapping top, ReadContext context)
    {
        foreach (var (k, _) in top.Entries)
            if (k.Value == "circuit")
                context.Error(k, "'circuit' cannot be used in a plane or 3d model: a circuit joins a line model's structure through its transducers, which act in line models only; model the electrical side in a line model");
    }

    /// <summary>
    /// The checks of a circuit inside a line model: one namespace for its names and the structure's, sources with a
    /// terminal at ground, and the circuit's topology with the transducer branches joining its nodes.
    /// </summary>
    private static void CheckEmbeddedCircuit(CircuitEmbedding embedding, IReadOnlyList<Transducer> transducers, IReadOnlySet<string> supports,
        ReadContext context)
    {
        if (embedding.Circuit is not { } circuit) return;
        var errors = context.ErrorCount;

        // One namespace: a circuit name may not be a mass, node, support or element name of the structure.
        void Clash(string name, SourcePosition at, string what)
        {
            foreach (var section in MechanicalNodeSections.Concat(MechanicalElementSections).Distinct())
            {
                if (!context.Positions.TryGetValue($"{section}.{name}", out var there)) continue;
                context.Error(at, $"{what} '{name}' has the name of {WhatOf(section)} '{name}' (line {there.Line}, column {there.Column}); a model with a circuit has one namespace for its names: rename one of them");
                return;
            }
        }
        foreach (var n in circuit.Nodes) Clash(n, embedding.NodePositions[n], "circuit node");
        foreach (var e in circuit.ElementNames) Clash(e, context.Positions[$"circuit.{e}"], "circuit element");

        // A line model's load acts at one node: a floating current source would be two.
        foreach (var i in circuit.CurrentSources.Where(i => i.From != Circuit.Ground && i.To != Circuit.Ground))
            context.Error(context.Positions[$"circuit.{i.Name}"],
                $"current source '{i.Name}' has neither terminal at ground; inside a line model a current source drives one node from ground: replace it by two current sources from ground of the same current, one from '{i.From}' into ground and one from ground into '{i.To}' (the same currents at both nodes)");
        foreach (var i in circuit.CurrentSources)
            foreach (var end in new[] { i.From, i.To }.Where(embedding.HeldNodes.Contains))
                context.Error(context.Positions[$"circuit.{i.Name}"],
                    $"current source '{i.Name}' drives '{end}', which a voltage source holds: its current would change only that source's current and move nothing; connect it to another node");
        if (context.ErrorCount > errors) return;

        // The transducer branches that touch the circuit join its nodes (to each other, to ground or through a support).
        var branches = transducers
            .Where(t => embedding.DeclaredNodes.Contains(t.BranchA) || embedding.DeclaredNodes.Contains(t.BranchB))
            .Select(t => (A: supports.Contains(t.BranchA) && !embedding.HeldNodes.Contains(t.BranchA) ? Circuit.Ground : t.BranchA,
                          B: supports.Contains(t.BranchB) && !embedding.HeldNodes.Contains(t.BranchB) ? Circuit.Ground : t.BranchB))
            .ToList();
        CheckCircuitTopology(circuit, embedding.NodePositions, context, branches);
        if (context.ErrorCount == errors) embedding.Analogy = CircuitAnalogy.Of(circuit);
    }

    private static string WhatOf(string section) => section switch
    {
        "masses" => "mass",
        "nodes" => "node",
        "supports" => "support",
        "mounts" => "mount",
        "springs" => "spring",
        "dampers" => "damper",
        "inerters" => "inerter",
        "links" => "link",
        _ => "transducer",
    };

    /// <summary>Refuses distributed damping in a model with a circuit: it would act on the circuit's analogue too.</summary>
    /// <remarks>
    /// Rayleigh damping a0·M + a1·K would add conductances a0·C and a1/L to the circuit (its capacitances are masses, its
    /// inductors springs), modal ratios and a loss factor would damp its electrical roots: a silent change of the circuit.
    /// </remarks>
    private static void RefuseDistributedDampingWithCircuit(YMapping top, DampingModel damping, ReadContext context)
    {
        if (damping.IsNone) return;
        foreach (var (k, _) in top.Entries)
            if (k.Value == "damping")
                context.Error(k, "'damping' (Rayleigh, modal or a loss factor) cannot be used in a model with a 'circuit': it would act on the circuit's analogue too (its capacitances are masses and its inductors springs of the same matrices) and change the circuit; give the structure's damping as dampers");
    }

    /// <summary>Refuses a current source at a node a transducer eliminates (the node has no coordinate to load).</summary>
    private static void CheckEmbeddedSources(CoreNetwork network, CircuitEmbedding embedding, ReadContext context)
    {
        if (embedding.Circuit is not { } circuit || ConstraintElimination.Of(network) is not { } elimination) return;
        foreach (var i in circuit.CurrentSources)
        {
            var (node, _) = CircuitSources.DrivenNode(i);
            if (elimination.Find(node) is { } e)
                context.Error(context.Positions[$"circuit.{i.Name}"],
                    $"current source '{i.Name}' drives '{node}', whose coordinate transducer '{e.Transducer.Name}' eliminates (its voltage is Bl times the relative velocity of '{e.Transducer.NodeA}' and '{e.Transducer.NodeB}'); drive the coil through a node of its own (the source into a node joined to the coil by a resistor, its Norton form), or drive it by a voltage source");
        }
    }

    /// <summary>The circuit's sources as the model's harmonic loads, named after them and found at their entries.</summary>
    private static ImmutableArray<Load> EmbeddedSourceLoads(CircuitEmbedding? embedding, ReadContext context)
    {
        if (embedding?.Circuit is not { } circuit || embedding.Analogy is null) return [];
        foreach (var name in circuit.VoltageSources.Select(v => v.Name).Concat(circuit.CurrentSources.Select(i => i.Name)))
        {
            var at = context.Positions[$"circuit.{name}"];
            if (context.Positions.TryGetValue($"loads.{name}", out var there))
                context.Error(at, $"circuit element '{name}' has the name of load '{name}' (line {there.Line}, column {there.Column}); a source is a load of the model named after it: rename one of them");
            else context.Positions[$"loads.{name}"] = at;
        }
        return CircuitSources.HarmonicLoads(circuit);
    }

    /// <summary>The circuit's sources that have a waveform, as transient excitations named after them.</summary>
    private static ImmutableArray<TransientExcitation> EmbeddedSourceHistories(CircuitEmbedding? embedding) =>
        embedding?.Circuit is { } circuit && embedding.Analogy is not null ? CircuitSources.TransientExcitations(circuit) : [];

    /// <summary>Each source's name and whether it has a waveform ('time'), for the harmonic and transient sections' 'loads'.</summary>
    private static IReadOnlyDictionary<string, bool> EmbeddedSourceNames(CircuitEmbedding? embedding) =>
        embedding?.Circuit is not { } circuit
            ? new Dictionary<string, bool>()
            : circuit.VoltageSources.Select(v => (v.Name, Timed: v.Waveform is not null))
                .Concat(circuit.CurrentSources.Select(i => (i.Name, Timed: i.Waveform is not null)))
                .ToDictionary(p => p.Name, p => p.Timed, StringComparer.Ordinal);
}
