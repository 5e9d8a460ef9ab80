using System.Collections.Immutable;
using ModalChain.Core.Analyses.FirstOrder;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Circuits;

/// <summary>A recorded branch current of a transient run.</summary>
/// <param name="Element">The element's name.</param>
/// <param name="Kind">"resistor", "inductor", "capacitor" or "voltage-source".</param>
/// <param name="Amperes">The current in A at each recorded time: from NodeA to NodeB through the element; for a voltage source, out of its + terminal into the circuit.</param>
public sealed record CircuitBranchHistory(string Element, string Kind, ImmutableArray<double> Amperes);

/// <summary>Node voltages and branch currents of a circuit against time, starting at rest.</summary>
/// <param name="Times">Recorded times in s, from 0.</param>
/// <param name="Nodes">Node names, every node but ground in the circuit's order.</param>
/// <param name="Volts">Node voltages in V, [node][time].</param>
/// <param name="Currents">Branch currents of every resistor, inductor, capacitor and voltage source, in that order.</param>
public sealed record CircuitTransientResult(ImmutableArray<double> Times, ImmutableArray<string> Nodes,
    ImmutableArray<ImmutableArray<double>> Volts, ImmutableArray<CircuitBranchHistory> Currents);

/// <summary>Step, pulse and other responses of a circuit, by the exact time integration of its analogue network.</summary>
/// <remarks>
/// The circuit's analogue network (<see cref="CircuitAnalogy.ToNetwork"/>) runs in its first-order form driven by its
/// supports and forces (<see cref="DrivenFirstOrderSystem"/>): each voltage source moves its node's support at the
/// velocity ±V(t) (+ when the node is its + terminal), each current source is a force I(t) into its To node and −I(t)
/// at its From node. The inputs are followed exactly on pieces cut at their breakpoints (steps, ramps and rectangular
/// pulses whatever the time step; smooth waveforms second order in the step). Branch currents are element forces: a
/// resistor's is its damper's force (v_A − v_B)/R, an inductor's its spring's force (λ_A − λ_B)/L, a capacitor's its
/// inerter's force C(v̇_A − v̇_B); a voltage source's is the force its support exerts on the network (its reaction with
/// the sign turned, less any current a current source delivers into that node). The circuit starts at rest: capacitors
/// uncharged, no current in the inductors. Where a source voltage jumps, a capacitor at its node passes a Dirac impulse
/// of current (the charge the jump needs); it is not shown, and the recorded values are those just after it. At most
/// <see cref="MaxFreeNodes"/> nodes not held by a voltage source (the dense first-order form).
/// </remarks>
public static class CircuitTransient
{
    /// <summary>Largest number of free nodes (nodes not held by a voltage source) a transient run takes.</summary>
    public const int MaxFreeNodes = Transient.TransientAnalysis.ExactMethodMaxDofs;

    /// <summary>Runs the circuit <paramref name="analogy"/> maps from rest for <paramref name="duration"/> s with recording step <paramref name="step"/> s.</summary>
    /// <exception cref="NumericalFailureException">The first-order form cannot be built, or the circuit has more than <see cref="MaxFreeNodes"/> free nodes.</exception>
    public static CircuitTransientResult Run(CircuitAnalogy analogy, double duration, double step)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        if (!(duration > 0) || !double.IsFinite(duration)) throw new ArgumentOutOfRangeException(nameof(duration));
        if (!(step > 0) || !(step <= duration)) throw new ArgumentOutOfRangeException(nameof(step));
        var circuit = analogy.Circuit;
        var network = analogy.ToNetwork();
        var partition = SupportPartition.Assemble(network);
        var n = partition.FreeCount;
        var supports = circuit.VoltageSources.Select((_, s) => analogy.Nodes[analogy.VoltageSourceNodes[s].Node]).ToArray();
        var forces = circuit.CurrentSources.Select(source =>
        {
            var f = new double[n];
            if (partition.Free.IndexOf(source.To) is var to and >= 0) f[to] += 1;
            if (partition.Free.IndexOf(source.From) is var from and >= 0) f[from] -= 1;
            return f;
        }).ToArray();
        var driven = DrivenFirstOrderSystem.Build(partition, supports, forces);
        TimeFunction?[] inputs =
        [
            .. circuit.VoltageSources.Select((v, s) => analogy.VoltageSourceNodes[s].Sign > 0 || v.Waveform is null ? v.Waveform : new Negated(v.Waveform)),
            .. circuit.CurrentSources.Select(c => c.Waveform),
        ];
        var count = (int)Math.Ceiling(duration / step - 1e-9);
        var recorder = new Recorder(analogy, partition, count + 1);
        driven.Run(inputs, duration, step, recorder.Accept);
        return recorder.Result();
    }

    /// <summary>A waveform with its sign turned (a voltage source whose − terminal holds the node).</summary>
    private sealed record Negated(TimeFunction Inner) : TimeFunction
    {
        public override double ValueAt(double time) => -Inner.ValueAt(time);

        public override IEnumerable<double> Breakpoints => Inner.Breakpoints;
    }

    private sealed class Recorder
    {
        private readonly CircuitAnalogy _analogy;
        private readonly SupportPartition _partition;
        private readonly double[] _times;
        private readonly double[][] _volts;
        private readonly List<(string Name, string Kind, Func<DrivenSample, double> Current)> _branches = [];
        private readonly double[][] _currents;

        public Recorder(CircuitAnalogy analogy, SupportPartition partition, int samples)
        {
            _analogy = analogy;
            _partition = partition;
            var circuit = analogy.Circuit;
            _times = new double[samples];
            _volts = [.. circuit.Nodes.Select(_ => new double[samples])];
            var p = partition;
            // A node's displacement (flux), velocity (voltage) or acceleration (voltage rate): a free DOF or a support.
            Func<DrivenSample, double> Of(string node, Func<DrivenSample, double[]> free, Func<DrivenSample, double[]> held)
            {
                if (p.Free.IndexOf(node) is var i and >= 0) return x => free(x)[i];
                var s = p.SupportIndex(node);
                return x => held(x)[s];
            }
            Func<DrivenSample, double> Flux(string node) => Of(node, x => x.Displacement, x => x.SupportDisplacement);
            Func<DrivenSample, double> Volts(string node) => Of(node, x => x.Velocity, x => x.SupportVelocity);
            Func<DrivenSample, double> Rate(string node) => Of(node, x => x.Acceleration, x => x.SupportAcceleration);
            foreach (var r in circuit.Resistors)
            {
                var (a, b) = (Volts(r.NodeA), Volts(r.NodeB));
                _branches.Add((r.Name, "resistor", x => (a(x) - b(x)) / r.Ohms));
            }
            foreach (var l in circuit.Inductors)
            {
                var (a, b) = (Flux(l.NodeA), Flux(l.NodeB));
                _branches.Add((l.Name, "inductor", x => (a(x) - b(x)) / l.Henries));
            }
            foreach (var c in circuit.Capacitors)
            {
                var (a, b) = (Rate(c.NodeA), Rate(c.NodeB));
                _branches.Add((c.Name, "capacitor", x => c.Farads * (a(x) - b(x))));
            }
            var nv = circuit.VoltageSources.Length;
            for (var s = 0; s < nv; s++)
            {
                var (node, sign) = analogy.VoltageSourceNodes[s];
                var column = p.SupportIndex(analogy.Nodes[node]);
                var name = analogy.Nodes[node];
                // Current sources into this node, with their input numbers and directions.
                var injected = circuit.CurrentSources.Select((c, j) => (Input: nv + j, Sign: (c.To == name ? 1 : 0) - (c.From == name ? 1 : 0)))
                    .Where(e => e.Sign != 0).ToArray();
                _branches.Add((circuit.VoltageSources[s].Name, "voltage-source", x =>
                {
                    // The current the node passes into the elements, M_pf ẍ + C_pf ẋ + K_pf x + M_pp a_p + C_pp v_p + K_pp x_p
                    // (minus the reaction the support receives), less the current sources' share.
                    var balance = 0.0;
                    for (var i = 0; i < p.FreeCount; i++)
                    {
                        var m = p.MassFP[i, column];
                        balance += p.StiffnessFP[i, column] * x.Displacement[i] + p.DamperFP[i, column] * x.Velocity[i]
                            + (m != 0 ? m * x.Acceleration[i] : 0);
                    }
                    for (var t = 0; t < p.SupportCount; t++)
                        balance += p.StiffnessPP[column, t] * x.SupportDisplacement[t] + p.DamperPP[column, t] * x.SupportVelocity[t]
                            + p.MassPP[column, t] * x.SupportAcceleration[t];
                    foreach (var (input, direction) in injected) balance -= direction * x.Inputs[input];
                    return sign * balance;
                }));
            }
            _currents = [.. _branches.Select(_ => new double[samples])];
        }

        public void Accept(int index, double time, DrivenSample sample)
        {
            _times[index] = time;
            var nodes = _analogy.Circuit.Nodes;
            for (var j = 0; j < nodes.Length; j++)
            {
                var i = _partition.Free.IndexOf(nodes[j]);
                _volts[j][index] = i >= 0 ? sample.Velocity[i] : sample.SupportVelocity[_partition.SupportIndex(nodes[j])];
            }
            for (var b = 0; b < _branches.Count; b++) _currents[b][index] = _branches[b].Current(sample);
        }

        public CircuitTransientResult Result() =>
            new([.. _times], _analogy.Circuit.Nodes, [.. _volts.Select(h => h.ToImmutableArray())],
                [.. _branches.Select((b, i) => new CircuitBranchHistory(b.Name, b.Kind, [.. _currents[i]]))]);
    }
}
