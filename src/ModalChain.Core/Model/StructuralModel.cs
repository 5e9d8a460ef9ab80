using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>Everything an analysis needs beyond the geometry of the network: its distributed damping and its loads.</summary>
/// <param name="Network">The network of masses, springs, dampers and supports (SI).</param>
/// <param name="Damping">Distributed damping added to the discrete dampers.</param>
/// <param name="Loads">The named loads, in declaration order.</param>
public sealed record StructuralModel(Network Network, DampingModel Damping, ImmutableArray<Load> Loads)
{
    /// <summary>A model of <paramref name="network"/> with no distributed damping and no loads.</summary>
    public static StructuralModel Of(Network network) => new(network, DampingModel.None, []);

    /// <summary>The load named <paramref name="name"/>, or null.</summary>
    public Load? FindLoad(string name) => Loads.FirstOrDefault(l => l.Name == name);
}
