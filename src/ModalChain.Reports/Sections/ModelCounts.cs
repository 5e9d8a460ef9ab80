using System.Globalization;
using ModalChain.Core.Model;

namespace ModalChain.Reports.Sections;

/// <summary>How many elements of each kind a network holds, as the model summary states them.</summary>
/// <param name="Bodies">Rigid bodies (plane and 3d models).</param>
/// <param name="Masses">Entries of <see cref="Network.Masses"/> on the mechanical side: point masses and massless nodes (a mount's inner node among them); electrical nodes are <see cref="CircuitNodes"/>.</param>
/// <param name="Springs">Springs, a mount's springs included; an inductor (a spring with an end on an electrical node) is <see cref="Inductors"/>.</param>
/// <param name="Dampers">Dampers, a mount's damper included; a resistor is <see cref="Resistors"/>.</param>
/// <param name="Inerters">Inerters; a capacitor between electrical nodes is <see cref="Capacitors"/>.</param>
/// <param name="Mounts">Mounts written by name, counted by the inner node each one adds (see <see cref="MountExpansion"/>).</param>
/// <param name="Transducers">Transducers (line models).</param>
public sealed record ModelCounts(int Bodies, int Masses, int Springs, int Dampers, int Inerters, int Mounts, int Transducers)
{
    private static readonly string InnerSuffix = MountExpansion.InnerNode("");

    /// <summary>Drawn electrical nodes (<see cref="Network.ElectricalNodes"/> that are entries of <see cref="Network.Masses"/>; a voltage source's node is a support).</summary>
    public int CircuitNodes { get; init; }

    /// <summary>Resistors: dampers with an end on an electrical node (coefficient 1/R).</summary>
    public int Resistors { get; init; }

    /// <summary>Inductors: springs with an end on an electrical node (stiffness 1/L).</summary>
    public int Inductors { get; init; }

    /// <summary>Capacitors between two nodes: inerters with an end on an electrical node (inertance C in F).</summary>
    public int Capacitors { get; init; }

    /// <summary>The counts of <paramref name="network"/>.</summary>
    public static ModelCounts Of(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var circuitNodes = network.Masses.Count(m => network.IsElectrical(m.Name));
        var inductors = network.Springs.Count(s => network.IsElectricalElement(s.NodeA, s.NodeB));
        var resistors = network.Dampers.Count(d => network.IsElectricalElement(d.NodeA, d.NodeB));
        var capacitors = network.Inerters.Count(i => network.IsElectricalElement(i.NodeA, i.NodeB));
        return new ModelCounts(network.Bodies.Length, network.Masses.Length - circuitNodes, network.Springs.Length - inductors,
            network.Dampers.Length - resistors, network.Inerters.Length - capacitors,
            network.Masses.Count(m => m.Kilograms == 0 && m.Name.EndsWith(InnerSuffix, StringComparison.Ordinal)), network.Transducers.Length)
        {
            CircuitNodes = circuitNodes,
            Resistors = resistors,
            Inductors = inductors,
            Capacitors = capacitors,
        };
    }

    /// <summary>True when the network has a circuit side (circuit nodes or circuit elements).</summary>
    public bool HasCircuit => CircuitNodes + Resistors + Inductors + Capacitors > 0;

    /// <summary>
    /// One phrase for a figure's header: "2 masses, 3 springs, 1 damper", with bodies first in plane and 3d models and
    /// inerters, mounts and transducers after, each only when the model has one; with a circuit, "4 masses, 3 circuit
    /// nodes, 5 springs, 3 dampers, 3 resistors, ... transducers" (circuit nodes after the masses, resistors, inductors and
    /// capacitors after the mechanical elements, each only when the model has one).
    /// </summary>
    public string Phrase(bool withBodies)
    {
        var parts = new List<string>();
        if (withBodies) parts.Add(Count(Bodies, "body", "bodies"));
        parts.Add(Count(Masses, "mass", "masses"));
        if (CircuitNodes > 0) parts.Add(Count(CircuitNodes, "circuit node", "circuit nodes"));
        parts.Add(Count(Springs, "spring", "springs"));
        parts.Add(Count(Dampers, "damper", "dampers"));
        if (Inerters > 0) parts.Add(Count(Inerters, "inerter", "inerters"));
        if (Mounts > 0) parts.Add(Count(Mounts, "mount", "mounts"));
        if (Resistors > 0) parts.Add(Count(Resistors, "resistor", "resistors"));
        if (Inductors > 0) parts.Add(Count(Inductors, "inductor", "inductors"));
        if (Capacitors > 0) parts.Add(Count(Capacitors, "capacitor", "capacitors"));
        if (Transducers > 0) parts.Add(Count(Transducers, "transducer", "transducers"));
        return string.Join(", ", parts);
    }

    /// <summary>The facts-table row for the elements beyond masses, springs and dampers; null when the model has none of them.</summary>
    public (string Name, string Value)? ExtraFact()
    {
        if (Inerters == 0 && Mounts == 0 && Transducers == 0) return null;
        var value = string.Create(CultureInfo.InvariantCulture, $"{Inerters}, {Mounts}, {Transducers}");
        if (Mounts > 0) value += " (each mount is also counted as the massless node, springs and damper it expands into)";
        return ("Inerters, mounts, transducers", value);
    }

    /// <summary>The facts-table row of the circuit side; null when the model has none.</summary>
    public (string Name, string Value)? CircuitFact() => HasCircuit
        ? ("Circuit nodes, resistors, inductors, capacitors", string.Create(CultureInfo.InvariantCulture, $"{CircuitNodes}, {Resistors}, {Inductors}, {Capacitors}"))
        : null;

    private static string Count(int n, string one, string many) => n.ToString(CultureInfo.InvariantCulture) + " " + (n == 1 ? one : many);
}
