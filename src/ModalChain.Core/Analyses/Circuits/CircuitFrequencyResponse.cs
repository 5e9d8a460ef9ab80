using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Circuits;

/// <summary>The sinusoidal steady state of a circuit driven by one source alone, over a list of frequencies.</summary>
/// <param name="Source">The driving source's name.</param>
/// <param name="IsVoltageSource">True for a voltage source (transfer functions in V/V), false for a current source (in V/A = Ω).</param>
/// <param name="FrequenciesHz">The frequencies in Hz.</param>
/// <param name="Impedance">Driving-point impedance Z = V/I at the source (Ω), per frequency: the source's voltage over the current it delivers out of its + terminal (a current source: the voltage of its To node over its From node, over its current).</param>
/// <param name="Nodes">The node names of <see cref="Transfer"/>'s columns, every node but ground in the circuit's order.</param>
/// <param name="Transfer">Node voltage per unit source value, [frequency][node]: V/V for a voltage source, V/A for a current source.</param>
public sealed record CircuitSourceResponse(string Source, bool IsVoltageSource, ImmutableArray<double> FrequenciesHz,
    ImmutableArray<Complex> Impedance, ImmutableArray<string> Nodes, ImmutableArray<ImmutableArray<Complex>> Transfer);

/// <summary>Driving-point impedances and transfer functions of a circuit, by the harmonic analysis of its analogue network.</summary>
/// <remarks>
/// The circuit's analogue network (<see cref="CircuitAnalogy.ToNetwork"/>) is swept by
/// <see cref="HarmonicAnalysis.Sweep"/> with the direct method, one source at a time (the others switched off: voltage
/// sources shorted, as their supports stand still, current sources open). A voltage source is the harmonic motion of
/// its support at unit velocity (<see cref="BaseMotionKind.Velocity"/>); the current it delivers is the force its
/// support exerts on the network, minus the reaction the sweep reports. A current source is a unit force into its To
/// node and the opposite force at its From node. A node voltage is the velocity iωX of its node. The direct solve of
/// K − ω²M + iωC needs no mode and takes massless nodes as they are; the sparse complex LDLᵀ runs when a node has no
/// capacitor, so no size limit applies beyond the sweep's own.
/// </remarks>
public static class CircuitFrequencyResponse
{
    /// <summary>The response to each source of the circuit, alone, at <paramref name="frequenciesHz"/> (each positive).</summary>
    /// <exception cref="NumericalFailureException">The dynamic stiffness is singular at a frequency (a lossless resonance hit exactly).</exception>
    public static ImmutableArray<CircuitSourceResponse> Solve(CircuitAnalogy analogy, IReadOnlyList<double> frequenciesHz)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        foreach (var f in frequenciesHz)
            if (!(f > 0) || !double.IsFinite(f)) throw new ArgumentOutOfRangeException(nameof(frequenciesHz), f, "Frequencies must be positive and finite.");
        var circuit = analogy.Circuit;
        if (circuit.VoltageSources.IsEmpty && circuit.CurrentSources.IsEmpty) return [];
        var network = analogy.ToNetwork();
        // A direct sweep solves the dynamic stiffness and reads no mode: none is solved.
        var modes = new ModalResult(network, Assembler.Assemble(network), [], 0, new ModalQuality(0, 0), "none (a direct sweep needs no modes)");
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, []), modes);
        var free = analogy.Nodes.Take(analogy.FreeCount).ToImmutableArray();
        var responses = new List<CircuitSourceResponse>();
        for (var s = 0; s < circuit.VoltageSources.Length; s++)
        {
            var (node, sign) = analogy.VoltageSourceNodes[s];
            var support = analogy.Nodes[node];
            var load = new BaseMotionLoad(circuit.VoltageSources[s].Name, support, BaseMotionKind.Velocity, 1, 0);
            var result = Sweep(system, frequenciesHz, [load], free);
            // The analogue network's nodes are electrical, so the sweep gives the support's current into the circuit
            // (minus its reaction) as a source current.
            var current = result.SourceCurrents.Single(r => r.Support == support).Current;
            // The sweep moved the node at +1 V; the source holds it at sign·1 V, and its current out of + is sign times the
            // node's current into the circuit: Z = 1/(sign · sign · i₊) = 1/i₊.
            var impedance = current.Select(i => 1 / i).ToArray();
            responses.Add(Response(analogy, circuit.VoltageSources[s].Name, true, frequenciesHz, free, result,
                impedance, held => held == node ? sign : 0, sign));
        }
        for (var s = 0; s < circuit.CurrentSources.Length; s++)
        {
            var source = circuit.CurrentSources[s];
            var loads = new List<Load>();
            // A current into a node a voltage source holds flows into that source and moves nothing.
            if (free.Contains(source.To)) loads.Add(new ForceLoad(source.Name + ":to", source.To, 1, 0));
            if (free.Contains(source.From)) loads.Add(new ForceLoad(source.Name + ":from", source.From, 1, Math.PI));
            var result = Sweep(system, frequenciesHz, loads, free);
            var response = Response(analogy, source.Name, false, frequenciesHz, free, result, null, _ => 0, 1);
            var to = source.To == Circuit.Ground ? -1 : response.Nodes.IndexOf(source.To);
            var from = source.From == Circuit.Ground ? -1 : response.Nodes.IndexOf(source.From);
            var impedance = response.Transfer.Select(v => (to >= 0 ? v[to] : Complex.Zero) - (from >= 0 ? v[from] : Complex.Zero)).ToImmutableArray();
            responses.Add(response with { Impedance = impedance });
        }
        return [.. responses];
    }

    private static HarmonicResult Sweep(DampedSystem system, IReadOnlyList<double> frequenciesHz, IReadOnlyList<Load> loads, ImmutableArray<string> free)
    {
        if (loads.Count > 0) return HarmonicAnalysis.Sweep(system, frequenciesHz, loads, free, HarmonicMethod.Direct);
        // Nothing moves: a current source whose both ends a voltage source holds or ground.
        var zero = ImmutableArray.Create(new Complex[frequenciesHz.Count]);
        return new HarmonicResult([.. frequenciesHz], HarmonicMethod.Direct, 0, [], [.. free.Select(n => new DofResponse(n, zero))], [], [], [], [], []);
    }

    // Node voltages iωX of the free nodes; a held node is at held(index) volts (the driving source's, or 0).
    private static CircuitSourceResponse Response(CircuitAnalogy analogy, string name, bool voltage, IReadOnlyList<double> frequencies,
        ImmutableArray<string> free, HarmonicResult result, Complex[]? impedance, Func<int, double> held, double sign)
    {
        var circuit = analogy.Circuit;
        var column = free.Select(n => result.Responses.Single(r => r.Dof == n).Displacement).ToArray();
        var transfer = new ImmutableArray<Complex>[frequencies.Count];
        for (var k = 0; k < frequencies.Count; k++)
        {
            var iw = new Complex(0, 2 * Math.PI * frequencies[k]);
            transfer[k] = [.. circuit.Nodes.Select(node =>
            {
                var i = analogy.IndexOf(node);
                return i < analogy.FreeCount ? sign * iw * column[i][k] : (Complex)held(i);
            })];
        }
        return new CircuitSourceResponse(name, voltage, [.. frequencies], impedance is null ? [] : [.. impedance], circuit.Nodes, [.. transfer]);
    }
}
