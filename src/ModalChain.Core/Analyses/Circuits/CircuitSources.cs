using System.Collections.Immutable;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Circuits;

/// <summary>The sources of a circuit inside a line model, as loads of the model's network.</summary>
/// <remarks>
/// In the node flux analogy (<see cref="CircuitAnalogy"/>) a node's voltage is its velocity and a current delivered into a
/// node is a force on it. A voltage source V from ground holds its node, a support of the network, at the velocity +V
/// (its + terminal is the node) or −V (its − terminal is the node): a base-motion load prescribing that velocity for
/// harmonic runs, a <see cref="SupportVelocityHistory"/> of its waveform for transient runs. A current source I from
/// ground into node n is a force +I on n; from n into ground, a force −I on n. Every load is named after its source, so
/// the harmonic and transient sections name sources as they name loads. A negative amplitude, or a source whose sign is
/// turned, is a load of the amplitude's magnitude with its phase turned by π. A source without a waveform is a
/// harmonic load only: in transient runs it is 0 V (a short circuit, its node held at rest) or 0 A (an open circuit).
/// Floating sources (no terminal at ground) are refused by the line model's reader: a load acts at one node.
/// </remarks>
public static class CircuitSources
{
    /// <summary>The harmonic loads of the circuit's sources: voltage sources first, then current sources, each in declaration order.</summary>
    /// <param name="circuit">A circuit whose every source has a terminal at ground.</param>
    public static ImmutableArray<Load> HarmonicLoads(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        var loads = ImmutableArray.CreateBuilder<Load>();
        foreach (var v in circuit.VoltageSources)
        {
            var (node, sign) = HeldNode(v);
            var value = sign * v.Amplitude;
            loads.Add(new BaseMotionLoad(v.Name, node, BaseMotionKind.Velocity, Math.Abs(value), value < 0 ? Math.PI : 0));
        }
        foreach (var i in circuit.CurrentSources)
        {
            var (node, sign) = DrivenNode(i);
            var value = sign * i.Amplitude;
            loads.Add(new ForceLoad(i.Name, node, Math.Abs(value), value < 0 ? Math.PI : 0));
        }
        return loads.ToImmutable();
    }

    /// <summary>The transient excitations of the circuit's sources that have a waveform, in the order of <see cref="HarmonicLoads"/>.</summary>
    /// <param name="circuit">A circuit whose every source has a terminal at ground.</param>
    public static ImmutableArray<TransientExcitation> TransientExcitations(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        var result = ImmutableArray.CreateBuilder<TransientExcitation>();
        foreach (var v in circuit.VoltageSources)
        {
            if (v.Waveform is null) continue;
            var (node, sign) = HeldNode(v);
            result.Add(new SupportVelocityHistory(v.Name, node, v.Waveform) { Scale = sign });
        }
        foreach (var i in circuit.CurrentSources)
        {
            if (i.Waveform is null) continue;
            var (node, sign) = DrivenNode(i);
            result.Add(new ForceHistory(i.Name, node, sign, i.Waveform));
        }
        return result.ToImmutable();
    }

    /// <summary>The node a voltage source from ground holds, and +1 when it is the + terminal, −1 when the − terminal.</summary>
    public static (string Node, int Sign) HeldNode(VoltageSource source)
    {
        ArgumentNullException.ThrowIfNull(source);
        if (source.Negative == Circuit.Ground && source.Positive != Circuit.Ground) return (source.Positive, 1);
        if (source.Positive == Circuit.Ground && source.Negative != Circuit.Ground) return (source.Negative, -1);
        throw new ArgumentException($"Voltage source '{source.Name}' has no terminal at ground.", nameof(source));
    }

    /// <summary>The node a current source from or to ground drives, and +1 when the current is delivered into it, −1 when drawn from it.</summary>
    public static (string Node, int Sign) DrivenNode(CurrentSource source)
    {
        ArgumentNullException.ThrowIfNull(source);
        if (source.From == Circuit.Ground && source.To != Circuit.Ground) return (source.To, 1);
        if (source.To == Circuit.Ground && source.From != Circuit.Ground) return (source.From, -1);
        throw new ArgumentException($"Current source '{source.Name}' has no terminal at ground.", nameof(source));
    }
}
