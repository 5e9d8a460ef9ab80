using ModalChain.Core.Model;
using HarmonicQuantity = ModalChain.Core.Analyses.Harmonic.ResponseQuantity;
using TransientQuantity = ModalChain.Core.Analyses.Transient.ResponseQuantity;

namespace ModalChain.Io.Json;

/// <summary>
/// The one place that names the quantities and units of electrical nodes and elements in the outputs (JSON, CSV,
/// console and report tables): a node's coordinate on the electrical side is its flux linkage, so its velocity is a
/// voltage in V; an element with an end on an electrical node carries a current in A, not a force.
/// </summary>
/// <remarks>
/// Electrical nodes are those of <see cref="Network.IsElectrical"/> (a transducer's electrical side, a circuit's nodes).
/// Outside them every name and unit is the mechanical one, so a model without electrical nodes writes exactly what
/// it wrote before.
/// </remarks>
public static class ElectricalLabels
{
    /// <summary>True when <paramref name="node"/> is an electrical node of <paramref name="network"/>.</summary>
    public static bool IsNode(Network network, string node)
    {
        ArgumentNullException.ThrowIfNull(network);
        return network.IsElectrical(node);
    }

    /// <summary>True when the spring (<paramref name="spring"/> true) or damper named <paramref name="element"/> has an end on an electrical node: an inductor or a resistor.</summary>
    public static bool IsElement(Network network, string element, bool spring)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.ElectricalNodes.IsEmpty) return false;
        var (a, b) = spring
            ? network.Springs.FirstOrDefault(s => s.Name == element) is { } s ? (s.NodeA, s.NodeB) : (null, null)
            : network.Dampers.FirstOrDefault(d => d.Name == element) is { } d ? (d.NodeA, d.NodeB) : ((string?)null, (string?)null);
        return a is not null && network.IsElectricalElement(a, b!);
    }

    /// <summary>The word for a spring (<paramref name="spring"/> true) or damper: "inductor" or "resistor" on the electrical side, else "spring" or "damper".</summary>
    public static string ElementWord(Network network, string element, bool spring) =>
        IsElement(network, element, spring) ? (spring ? "inductor" : "resistor") : spring ? "spring" : "damper";

    /// <summary>The unit of a spring's or damper's force: "A" for an electrical element (its current), else "N".</summary>
    public static string ElementUnit(Network network, string element, bool spring) => IsElement(network, element, spring) ? "A" : "N";

    /// <summary>The name of a harmonic response quantity at <paramref name="node"/>: flux_linkage, voltage, voltage_rate at an electrical node.</summary>
    public static string Quantity(Network network, string node, HarmonicQuantity q) => !IsNode(network, node) ? HarmonicJson.Name(q) : q switch
    {
        HarmonicQuantity.Displacement => "flux_linkage",
        HarmonicQuantity.Velocity => "voltage",
        _ => "voltage_rate",
    };

    /// <summary>The unit of a harmonic response quantity at <paramref name="node"/>: V*s, V, V/s at an electrical node.</summary>
    public static string Unit(Network network, string node, HarmonicQuantity q, bool rotation) => !IsNode(network, node) ? HarmonicJson.Unit(q, rotation) : q switch
    {
        HarmonicQuantity.Displacement => "V*s",
        HarmonicQuantity.Velocity => "V",
        _ => "V/s",
    };

    /// <summary>The name of a transient history's quantity, electrical where its node or element is.</summary>
    public static string Quantity(Network network, string name, TransientQuantity q) => q switch
    {
        TransientQuantity.Displacement when IsNode(network, name) => "flux_linkage",
        TransientQuantity.Velocity when IsNode(network, name) => "voltage",
        TransientQuantity.Acceleration when IsNode(network, name) => "voltage_rate",
        TransientQuantity.SpringForce when IsElement(network, name, spring: true) => "inductor_current",
        TransientQuantity.DamperForce when IsElement(network, name, spring: false) => "resistor_current",
        _ => TransientJson.QuantityName(q),
    };

    /// <summary>The unit of a transient history, electrical where its node or element is (<paramref name="unit"/> otherwise).</summary>
    public static string Unit(Network network, string name, TransientQuantity q, string unit) => q switch
    {
        TransientQuantity.Displacement when IsNode(network, name) => "V*s",
        TransientQuantity.Velocity when IsNode(network, name) => "V",
        TransientQuantity.Acceleration when IsNode(network, name) => "V/s",
        TransientQuantity.SpringForce when IsElement(network, name, spring: true) => "A",
        TransientQuantity.DamperForce when IsElement(network, name, spring: false) => "A",
        _ => unit,
    };
}
