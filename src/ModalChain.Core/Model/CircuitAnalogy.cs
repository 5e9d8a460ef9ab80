using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Model;

/// <summary>How a circuit node enters the equations.</summary>
public enum CircuitNodeRole
{
    /// <summary>A node with capacitance: its flux linkage is a coordinate with inertia (a mass).</summary>
    Massive,
    /// <summary>A node without any capacitor: a massless coordinate whose equation is first order (resistors) .</summary>
    Massless,
    /// <summary>A node whose voltage a voltage source to ground imposes: a support with prescribed velocity.</summary>
    Prescribed,
}

/// <summary>
/// The node flux analogy: a circuit written as the equations of a lumped mechanical network, and the map back.
/// </summary>
/// <remarks>
/// The coordinate of node j is its flux linkage λ_j = ∫ v_j dt (V·s), ground at 0, so the node voltage is the velocity
/// λ̇_j. Kirchhoff's current law at every node reads C λ̈ + G λ̇ + Γ λ = i, the equation of motion M ẍ + C ẋ + K x = f:
/// a capacitor of C farads is an inerter of C kilograms between the same two nodes (a mass C on the node when the other
/// terminal is ground), a resistor of R ohms a damper of 1/R N·s/m, an inductor of L henries a spring of 1/L N/m (its
/// current λ/L is the spring force), a current source a force and a voltage source from ground a support moved with the
/// velocity V(t). Each matrix is stamped exactly as the network assembly stamps a two-node element (value on both
/// diagonals, minus the value off the diagonal, a grounded terminal dropping its row); the nodes are numbered with the
/// nodes carrying capacitance first, then the nodes without any capacitor, then the nodes a voltage source holds.
/// </remarks>
public sealed class CircuitAnalogy
{
    private readonly Dictionary<string, int> _index;

    private CircuitAnalogy(Circuit circuit, ImmutableArray<string> nodes, int massive, int massless,
        Matrix<double> capacitance, Matrix<double> conductance, Matrix<double> inverseInductance,
        ImmutableArray<(int Node, int Sign)> voltageSourceNodes)
    {
        Circuit = circuit;
        Nodes = nodes;
        MassiveCount = massive;
        MasslessCount = massless;
        Capacitance = capacitance;
        Conductance = conductance;
        InverseInductance = inverseInductance;
        VoltageSourceNodes = voltageSourceNodes;
        _index = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < nodes.Length; i++) _index[nodes[i]] = i;
    }

    /// <summary>The circuit mapped.</summary>
    public Circuit Circuit { get; }

    /// <summary>Every node except ground: the massive ones, then the massless ones, then the prescribed ones.</summary>
    public ImmutableArray<string> Nodes { get; }

    /// <summary>Number of nodes with capacitance (they come first in <see cref="Nodes"/>).</summary>
    public int MassiveCount { get; }

    /// <summary>Number of nodes without any capacitor and not held by a source (after the massive ones).</summary>
    public int MasslessCount { get; }

    /// <summary>Number of free nodes: massive and massless.</summary>
    public int FreeCount => MassiveCount + MasslessCount;

    /// <summary>Number of nodes held by voltage sources (last in <see cref="Nodes"/>).</summary>
    public int PrescribedCount => Nodes.Length - FreeCount;

    /// <summary>The capacitance matrix in F over <see cref="Nodes"/>: the analogue of the mass matrix.</summary>
    public Matrix<double> Capacitance { get; }

    /// <summary>The conductance matrix in S (1/Ω) over <see cref="Nodes"/>: the analogue of the damping matrix.</summary>
    public Matrix<double> Conductance { get; }

    /// <summary>The inverse-inductance matrix in 1/H over <see cref="Nodes"/>: the analogue of the stiffness matrix.</summary>
    public Matrix<double> InverseInductance { get; }

    /// <summary>For each voltage source in declaration order: the index in <see cref="Nodes"/> of the node it holds, and +1 when that node is its + terminal, −1 when it is its − terminal.</summary>
    public ImmutableArray<(int Node, int Sign)> VoltageSourceNodes { get; }

    /// <summary>The role of node <paramref name="index"/> in <see cref="Nodes"/>.</summary>
    public CircuitNodeRole RoleOf(int index) =>
        index < MassiveCount ? CircuitNodeRole.Massive : index < FreeCount ? CircuitNodeRole.Massless : CircuitNodeRole.Prescribed;

    /// <summary>The index of <paramref name="node"/> in <see cref="Nodes"/>; −1 for ground.</summary>
    public int IndexOf(string node) =>
        node == Circuit.Ground ? -1 : _index.TryGetValue(node, out var i) ? i : throw new ArgumentException($"'{node}' is not a node of the circuit.", nameof(node));

    /// <summary>Maps <paramref name="circuit"/>; the circuit must have passed the reader's checks (each voltage source has a terminal at ground, and no two hold one node).</summary>
    public static CircuitAnalogy Of(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        var held = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var v in circuit.VoltageSources)
        {
            if (v.Positive != Circuit.Ground && v.Negative != Circuit.Ground)
                throw new ArgumentException($"Voltage source '{v.Name}' has no terminal at ground; only sources from ground are mapped.", nameof(circuit));
            var node = v.Positive == Circuit.Ground ? v.Negative : v.Positive;
            if (node == Circuit.Ground || !held.TryAdd(node, 0))
                throw new ArgumentException($"Voltage source '{v.Name}' closes a loop of voltage sources.", nameof(circuit));
        }
        var withCapacitor = new HashSet<string>(circuit.Capacitors.SelectMany(c => new[] { c.NodeA, c.NodeB }), StringComparer.Ordinal);
        var massive = circuit.Nodes.Where(n => !held.ContainsKey(n) && withCapacitor.Contains(n)).ToList();
        var massless = circuit.Nodes.Where(n => !held.ContainsKey(n) && !withCapacitor.Contains(n)).ToList();
        var prescribed = circuit.Nodes.Where(held.ContainsKey).ToList();
        ImmutableArray<string> nodes = [.. massive, .. massless, .. prescribed];
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < nodes.Length; i++) index[nodes[i]] = i;
        foreach (var n in circuit.ElementNodes())
            if (n != Circuit.Ground && !index.ContainsKey(n))
                throw new ArgumentException($"An element names '{n}', which is not a node of the circuit.", nameof(circuit));

        var size = nodes.Length;
        var c = Matrix<double>.Build.Dense(size, size);
        var g = Matrix<double>.Build.Dense(size, size);
        var gamma = Matrix<double>.Build.Dense(size, size);
        int At(string node) => node == Circuit.Ground ? -1 : index[node];
        foreach (var e in circuit.Capacitors) Stamp(c, At(e.NodeA), At(e.NodeB), e.Farads);
        foreach (var e in circuit.Resistors) Stamp(g, At(e.NodeA), At(e.NodeB), 1 / e.Ohms);
        foreach (var e in circuit.Inductors) Stamp(gamma, At(e.NodeA), At(e.NodeB), 1 / e.Henries);
        var sources = circuit.VoltageSources
            .Select(v => v.Positive == Circuit.Ground ? (index[v.Negative], -1) : (index[v.Positive], 1)).ToImmutableArray();
        return new CircuitAnalogy(circuit, nodes, massive.Count, massless.Count, c, g, gamma, sources);
    }

    /// <summary>
    /// The analogue mechanical network: every free node a mass of its capacitance to ground, or a massless node when it
    /// has none; the nodes voltage sources hold are supports.
    /// </summary>
    /// <remarks>
    /// Node ↔ mass (kg = the node's capacitance to ground in F) or support (a node a voltage source holds), capacitor
    /// between two nodes, or from a held node to ground, ↔ inerter (kg = F), inductor ↔ spring (N/m = 1/H), resistor ↔ damper (N·s/m = 1/Ω); element
    /// names are kept. Current and voltage sources are loads on this network, not part of it.
    /// </remarks>
    public Network ToNetwork()
    {
        var builder = new NetworkBuilder { Title = Circuit.Title };
        AddTo(builder);
        return builder.Build();
    }

    /// <summary>
    /// Adds the circuit's analogue nodes and elements to <paramref name="builder"/>, marking its nodes electrical: the one
    /// stamping path of a circuit model's network (<see cref="ToNetwork"/>) and of a circuit inside a line model.
    /// </summary>
    /// <remarks>
    /// The builder must hold none of the circuit's node or element names yet (the reader checks the one namespace);
    /// ground is the network's ground. Sources are not added: they are loads (see
    /// <c>Analyses.Circuits.CircuitSources</c>), the nodes voltage sources hold being supports.
    /// </remarks>
    /// <param name="builder">A line-model builder.</param>
    public void AddTo(NetworkBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        if (builder.Space != ModelSpace.Line)
            throw new ArgumentException("A circuit joins line models only.", nameof(builder));
        var grounded = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var e in Circuit.Capacitors)
        {
            if (e.NodeA == Circuit.Ground) grounded[e.NodeB] = grounded.GetValueOrDefault(e.NodeB) + e.Farads;
            else if (e.NodeB == Circuit.Ground) grounded[e.NodeA] = grounded.GetValueOrDefault(e.NodeA) + e.Farads;
        }
        for (var i = 0; i < FreeCount; i++)
        {
            if (grounded.GetValueOrDefault(Nodes[i]) > 0) builder.AddMass(Nodes[i], grounded[Nodes[i]]);
            else builder.AddNode(Nodes[i]);
        }
        for (var i = FreeCount; i < Nodes.Length; i++) builder.AddSupport(Nodes[i]);
        var held = new HashSet<string>(Nodes.Skip(FreeCount), StringComparer.Ordinal);
        foreach (var e in Circuit.Capacitors)
        {
            if (e.NodeA != Circuit.Ground && e.NodeB != Circuit.Ground) builder.AddInerter(e.Name, e.NodeA, e.NodeB, e.Farads);
            // A capacitor from a source's node to ground: an inerter between that support and ground, which only the
            // source's current (the support's reaction) feels.
            else if (held.Contains(e.NodeA == Circuit.Ground ? e.NodeB : e.NodeA)) builder.AddInerter(e.Name, e.NodeA, e.NodeB, e.Farads);
        }
        foreach (var e in Circuit.Inductors) builder.AddSpring(e.Name, e.NodeA, e.NodeB, 1 / e.Henries);
        foreach (var e in Circuit.Resistors) builder.AddDamper(e.Name, e.NodeA, e.NodeB, 1 / e.Ohms);
        foreach (var n in Nodes) builder.MarkElectrical(n);
    }

    // The two-node stamp of the network assembly (SupportPartition.Blocks.AddTwoNode): ground (−1) drops its row.
    private static void Stamp(Matrix<double> m, int a, int b, double value)
    {
        if (a >= 0) m[a, a] += value;
        if (b >= 0) m[b, b] += value;
        if (a >= 0 && b >= 0)
        {
            m[a, b] -= value;
            m[b, a] -= value;
        }
    }
}

/// <summary>Small helpers over a circuit's elements.</summary>
public static class CircuitElements
{
    /// <summary>Every terminal of every element, sources included, in declaration order (names may repeat).</summary>
    public static IEnumerable<string> ElementNodes(this Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        foreach (var e in circuit.Resistors) { yield return e.NodeA; yield return e.NodeB; }
        foreach (var e in circuit.Inductors) { yield return e.NodeA; yield return e.NodeB; }
        foreach (var e in circuit.Capacitors) { yield return e.NodeA; yield return e.NodeB; }
        foreach (var e in circuit.VoltageSources) { yield return e.Positive; yield return e.Negative; }
        foreach (var e in circuit.CurrentSources) { yield return e.From; yield return e.To; }
    }
}
