using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Dofs;

/// <summary>A direction in which a node may move.</summary>
/// <remarks>
/// Line models move in <see cref="Along"/> only; plane and 3d models use the global translations x, y, z (z vertical,
/// up) and rotations rx, ry, rz about those axes (right-hand rule). See <see cref="Model.Directions"/>.
/// </remarks>
public enum Direction
{
    /// <summary>The single direction of motion of a line model (vertical for floors, horizontal for rack sway).</summary>
    Along,
    /// <summary>Translation along global x, in m.</summary>
    X,
    /// <summary>Translation along global y, in m.</summary>
    Y,
    /// <summary>Translation along global z (vertical, up), in m.</summary>
    Z,
    /// <summary>Rotation about global x, in rad.</summary>
    Rx,
    /// <summary>Rotation about global y, in rad.</summary>
    Ry,
    /// <summary>Rotation about global z, in rad.</summary>
    Rz,
}

/// <summary>One degree of freedom: a node moving in a direction.</summary>
/// <param name="Node">Name of the mass.</param>
/// <param name="Direction">Direction of motion.</param>
public readonly record struct Dof(string Node, Direction Direction)
{
    /// <inheritdoc />
    public override string ToString() => Direction == Direction.Along ? Node : $"{Node}.{Model.Directions.Label(Direction)}";
}

/// <summary>Numbers the free degrees of freedom of a network; supports are not numbered (they are fixed or prescribed).</summary>
/// <remarks>
/// Assembly and analyses address matrix rows only through this map, so adding directions per node
/// changes the map, not the assembly loops. Masses tied by a <see cref="Link"/> map to one shared index; that DOF's
/// label joins their names with '+', and <see cref="IndexOf"/> answers for each of them.
/// </remarks>
public sealed class DofMap
{
    private readonly FrozenIndex _index;
    private readonly ImmutableArray<ImmutableArray<string>> _nodes;

    private DofMap(ImmutableArray<Dof> dofs, ImmutableArray<ImmutableArray<string>> nodes)
    {
        Dofs = dofs;
        _nodes = nodes;
        _index = new FrozenIndex(dofs, nodes);
    }

    /// <summary>The degrees of freedom in matrix order.</summary>
    public ImmutableArray<Dof> Dofs { get; }

    /// <summary>Number of free degrees of freedom.</summary>
    public int Count => Dofs.Length;

    /// <summary>
    /// One degree of freedom per mass in the network's direction, in the order the masses were declared; masses tied
    /// by links share the DOF of the first of them.
    /// </summary>
    public static DofMap ForScalarNetwork(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var order = network.Masses.Select((m, i) => (m.Name, i)).ToDictionary(p => p.Name, p => p.i);
        var parent = Enumerable.Range(0, network.Masses.Length).ToArray();
        int Find(int x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        foreach (var link in network.Links)
            foreach (var name in link.Masses.Skip(1))
            {
                var (a, b) = (Find(order[link.Masses[0]]), Find(order[name]));
                if (a != b) parent[Math.Max(a, b)] = Math.Min(a, b);
            }
        var groups = Enumerable.Range(0, network.Masses.Length)
            .GroupBy(Find)
            .OrderBy(g => g.Key)
            .Select(g => g.Select(i => network.Masses[i].Name).ToImmutableArray())
            .ToImmutableArray();
        return new DofMap([.. groups.Select(g => new Dof(string.Join("+", g), Direction.Along))], groups);
    }

    /// <summary>The nodes (masses) that move with degree of freedom <paramref name="index"/>: one, or all the masses of a link.</summary>
    public ImmutableArray<string> NodesAt(int index) => _nodes[index];

    /// <summary>The matrix index of <paramref name="node"/> in <paramref name="direction"/>, or −1 when the node is a support.</summary>
    public int IndexOf(string node, Direction direction = Direction.Along) =>
        _index.TryGet(new Dof(node, direction), out var i) ? i : -1;

    private sealed class FrozenIndex(ImmutableArray<Dof> dofs, ImmutableArray<ImmutableArray<string>> nodes)
    {
        private readonly Dictionary<Dof, int> _map = dofs
            .SelectMany((d, i) => nodes[i].Select(n => (Dof: new Dof(n, d.Direction), Index: i)))
            .ToDictionary(p => p.Dof, p => p.Index);
        public bool TryGet(Dof dof, out int index) => _map.TryGetValue(dof, out index);
    }
}
