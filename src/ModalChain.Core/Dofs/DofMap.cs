using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Dofs;

/// <summary>A direction in which a node may move.</summary>
/// <remarks>Scalar networks move in one direction only; further directions (and rotations of rigid bodies) extend this enum.</remarks>
public enum Direction
{
    /// <summary>The single direction of motion of a scalar network (vertical for floors, horizontal for rack sway).</summary>
    Along,
}

/// <summary>One degree of freedom: a node moving in a direction.</summary>
/// <param name="Node">Name of the mass.</param>
/// <param name="Direction">Direction of motion.</param>
public readonly record struct Dof(string Node, Direction Direction)
{
    /// <inheritdoc />
    public override string ToString() => Direction == Direction.Along ? Node : $"{Node}.{Direction}";
}

/// <summary>Numbers the free degrees of freedom of a network; supports are not numbered (they are fixed or prescribed).</summary>
/// <remarks>
/// Assembly and analyses address matrix rows only through this map, so adding directions per node
/// changes the map, not the assembly loops.
/// </remarks>
public sealed class DofMap
{
    private readonly FrozenIndex _index;

    private DofMap(ImmutableArray<Dof> dofs)
    {
        Dofs = dofs;
        _index = new FrozenIndex(dofs);
    }

    /// <summary>The degrees of freedom in matrix order.</summary>
    public ImmutableArray<Dof> Dofs { get; }

    /// <summary>Number of free degrees of freedom.</summary>
    public int Count => Dofs.Length;

    /// <summary>One degree of freedom per mass in the network's direction, in the order the masses were declared.</summary>
    public static DofMap ForScalarNetwork(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return new DofMap([.. network.Masses.Select(m => new Dof(m.Name, Direction.Along))]);
    }

    /// <summary>The matrix index of <paramref name="node"/> in <paramref name="direction"/>, or −1 when the node is a support.</summary>
    public int IndexOf(string node, Direction direction = Direction.Along) =>
        _index.TryGet(new Dof(node, direction), out var i) ? i : -1;

    private sealed class FrozenIndex(ImmutableArray<Dof> dofs)
    {
        private readonly Dictionary<Dof, int> _map = dofs.Select((d, i) => (d, i)).ToDictionary(p => p.d, p => p.i);
        public bool TryGet(Dof dof, out int index) => _map.TryGetValue(dof, out index);
    }
}
