using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>A resistor between two circuit nodes.</summary>
/// <param name="Name">Unique name among the circuit's elements.</param>
/// <param name="NodeA">First terminal: a node name or <see cref="Circuit.Ground"/>.</param>
/// <param name="NodeB">Second terminal, different from <paramref name="NodeA"/>.</param>
/// <param name="Ohms">Resistance in Ω; positive and finite.</param>
public sealed record Resistor(string Name, string NodeA, string NodeB, double Ohms);

/// <summary>An inductor between two circuit nodes.</summary>
/// <param name="Name">Unique name among the circuit's elements.</param>
/// <param name="NodeA">First terminal: a node name or <see cref="Circuit.Ground"/>.</param>
/// <param name="NodeB">Second terminal, different from <paramref name="NodeA"/>.</param>
/// <param name="Henries">Inductance in H; positive and finite.</param>
public sealed record Inductor(string Name, string NodeA, string NodeB, double Henries);

/// <summary>A capacitor between two circuit nodes.</summary>
/// <param name="Name">Unique name among the circuit's elements.</param>
/// <param name="NodeA">First terminal: a node name or <see cref="Circuit.Ground"/>.</param>
/// <param name="NodeB">Second terminal, different from <paramref name="NodeA"/>.</param>
/// <param name="Farads">Capacitance in F; positive and finite.</param>
public sealed record Capacitor(string Name, string NodeA, string NodeB, double Farads);

/// <summary>An ideal voltage source: the potential of <paramref name="Positive"/> minus that of <paramref name="Negative"/> is imposed.</summary>
/// <param name="Name">Unique name among the circuit's elements.</param>
/// <param name="Positive">The + terminal: a node name or <see cref="Circuit.Ground"/>.</param>
/// <param name="Negative">The − terminal; one of the two terminals is ground.</param>
/// <param name="Amplitude">Amplitude in V of the harmonic (sinusoidal steady-state) drive; also the reference of transfer functions.</param>
/// <param name="Waveform">The source voltage in V against time for transient runs; null when the file gives none (the source is then 0 V, a short circuit, in transient runs).</param>
public sealed record VoltageSource(string Name, string Positive, string Negative, double Amplitude, TimeFunction? Waveform);

/// <summary>An ideal current source: it draws its current from <paramref name="From"/> and delivers it into <paramref name="To"/>.</summary>
/// <param name="Name">Unique name among the circuit's elements.</param>
/// <param name="From">The node the current is drawn from (a node name or <see cref="Circuit.Ground"/>).</param>
/// <param name="To">The node the current is delivered into, different from <paramref name="From"/>.</param>
/// <param name="Amplitude">Amplitude in A of the harmonic drive.</param>
/// <param name="Waveform">The source current in A against time for transient runs; null when the file gives none (0 A, an open circuit).</param>
public sealed record CurrentSource(string Name, string From, string To, double Amplitude, TimeFunction? Waveform);

/// <summary>An immutable lumped electrical circuit: named nodes and the two-terminal elements between them, in SI units.</summary>
/// <remarks>
/// The reader checks the references and the topology (no unused node, no loop of voltage sources, no cut set of current
/// sources) before it builds one. <see cref="CircuitAnalogy"/> turns it into the equations of a mechanical network with
/// the node flux linkage as the coordinate.
/// </remarks>
/// <param name="Title">Human-readable title.</param>
/// <param name="Nodes">The node names in declaration order (ground excluded).</param>
/// <param name="Resistors">Resistors in declaration order.</param>
/// <param name="Inductors">Inductors in declaration order.</param>
/// <param name="Capacitors">Capacitors in declaration order.</param>
/// <param name="VoltageSources">Ideal voltage sources in declaration order.</param>
/// <param name="CurrentSources">Ideal current sources in declaration order.</param>
public sealed record Circuit(
    string Title,
    ImmutableArray<string> Nodes,
    ImmutableArray<Resistor> Resistors,
    ImmutableArray<Inductor> Inductors,
    ImmutableArray<Capacitor> Capacitors,
    ImmutableArray<VoltageSource> VoltageSources,
    ImmutableArray<CurrentSource> CurrentSources)
{
    /// <summary>The reserved name of the reference node, at 0 V.</summary>
    public const string Ground = "ground";

    /// <summary>The names of every element, sources included, in the order resistors, inductors, capacitors, voltage sources, current sources.</summary>
    public IEnumerable<string> ElementNames =>
        Resistors.Select(e => e.Name).Concat(Inductors.Select(e => e.Name)).Concat(Capacitors.Select(e => e.Name))
            .Concat(VoltageSources.Select(e => e.Name)).Concat(CurrentSources.Select(e => e.Name));
}
