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
/// <param name="Node">Name of the mass or rigid body.</param>
/// <param name="Direction">Direction of motion.</param>
/// <remarks>Two DOFs are equal when node and direction are; the label is presentation only.</remarks>
public readonly record struct Dof(string Node, Direction Direction)
{
    /// <summary>
    /// The label outputs print: the node's name where it has one DOF, <c>name.z</c>, <c>name.rx</c> where it has
    /// more (set by <see cref="DofMap"/>); null for a DOF made outside a map.
    /// </summary>
    public string? Label { get; init; }

    /// <inheritdoc />
    public bool Equals(Dof other) => string.Equals(Node, other.Node, StringComparison.Ordinal) && Direction == other.Direction;

    /// <inheritdoc />
    public override int GetHashCode() => HashCode.Combine(Node, Direction);

    /// <inheritdoc />
    public override string ToString() => Label ?? (Direction == Direction.Along ? Node : $"{Node}.{Model.Directions.Label(Direction)}");
}

/// <summary>Numbers the free degrees of freedom of a network; supports are not numbered (they are fixed or prescribed).</summary>
/// <remarks>
/// Assembly and analyses address matrix rows only through this map, so adding directions per node
/// changes the map, not the assembly loops. Masses tied by a <see cref="Link"/> map to one shared index; that DOF's
/// label joins their names with '+', and <see cref="IndexOf"/> answers for each of them.
/// Plane and 3d models (<see cref="For"/>): the masses in declaration order, each with its translations in the order
/// x, y, z; then the rigid bodies in declaration order, each with every direction of the space
/// (<see cref="Directions.All"/>) at its centre of mass.
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

    /// <summary>The space the numbered network moves in.</summary>
    public ModelSpace Space { get; private init; } = ModelSpace.Line;

    /// <summary>The label of DOF <paramref name="index"/> as outputs print it (<c>deck</c>, <c>skid.rz</c>).</summary>
    public string Label(int index) => Dofs[index].ToString();

    /// <summary>
    /// The DOF map of <paramref name="network"/>: <see cref="ForScalarNetwork"/> for a line model; for plane and 3d
    /// models each mass's translations (x, y, z order) in declaration order, then every body's directions.
    /// </summary>
    /// <exception cref="ArgumentException">A plane or 3d model has links, or a mass moves in a direction its space lacks.</exception>
    public static DofMap For(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space == ModelSpace.Line) return ForScalarNetwork(network);
        if (!network.Links.IsDefaultOrEmpty)
            throw new ArgumentException($"Links are not supported in {SpaceName(network.Space)} models (use a rigid body); found '{network.Links[0].Name}'.", nameof(network));
        var translations = Model.Directions.Translations(network.Space);
        var dofs = ImmutableArray.CreateBuilder<Dof>();
        var nodes = ImmutableArray.CreateBuilder<ImmutableArray<string>>();
        void Add(string node, IReadOnlyList<Direction> directions)
        {
            foreach (var d in directions)
            {
                dofs.Add(new Dof(node, d) { Label = directions.Count == 1 ? node : $"{node}.{Model.Directions.Label(d)}" });
                nodes.Add([node]);
            }
        }
        foreach (var mass in network.Masses)
        {
            if (!mass.Moves.IsDefaultOrEmpty)
                foreach (var d in mass.Moves)
                    if (!translations.Contains(d))
                        throw new ArgumentException($"Mass '{mass.Name}' moves in '{d}', which is not a translation of a {SpaceName(network.Space)} model.", nameof(network));
            Add(mass.Name, mass.Moves.IsDefaultOrEmpty ? translations : [.. translations.Where(mass.Moves.Contains)]);
        }
        foreach (var body in network.Bodies) Add(body.Name, Model.Directions.All(network.Space));
        return new DofMap(dofs.ToImmutable(), nodes.ToImmutable()) { Space = network.Space };
    }

    /// <summary>
    /// One degree of freedom per mass in the network's direction, in the order the masses were declared; masses tied
    /// by links share the DOF of the first of them. A node a transducer's constraint eliminates has no DOF (its motion is
    /// a combination of others, <see cref="Assembly.ConstraintElimination"/>).
    /// </summary>
    public static DofMap ForScalarNetwork(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var masses = network.Masses;
        var parent = new int[masses.Length];
        for (var i = 0; i < parent.Length; i++) parent[i] = i;
        int Find(int x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        if (!network.Links.IsDefaultOrEmpty)
        {
            var order = new Dictionary<string, int>(masses.Length, StringComparer.Ordinal);
            for (var i = 0; i < masses.Length; i++) order.Add(masses[i].Name, i);
            foreach (var link in network.Links)
                foreach (var name in link.Masses.Skip(1))
                {
                    var (a, b) = (Find(order[link.Masses[0]]), Find(order[name]));
                    if (a != b) parent[Math.Max(a, b)] = Math.Min(a, b);
                }
        }
        // Each group's DOF comes at the place of its first mass (the root of a group is its smallest index), its
        // masses in declaration order.
        var members = new List<string>?[masses.Length];
        var elimination = Assembly.ConstraintElimination.Of(network);
        for (var i = 0; i < masses.Length; i++)
        {
            if (elimination is not null && elimination.IsEliminated(masses[i].Name)) continue; // a transducer's constraint removes it
            var root = Find(i);
            if (root == i) members[i] = [masses[i].Name];
            else members[root]!.Add(masses[i].Name);
        }
        var groups = ImmutableArray.CreateBuilder<ImmutableArray<string>>();
        var dofs = ImmutableArray.CreateBuilder<Dof>();
        foreach (var group in members)
        {
            if (group is null) continue;
            groups.Add([.. group]);
            dofs.Add(new Dof(group.Count == 1 ? group[0] : string.Join("+", group), Direction.Along));
        }
        return new DofMap(dofs.DrainToImmutable(), groups.DrainToImmutable());
    }

    /// <summary>The nodes (masses) that move with degree of freedom <paramref name="index"/>: one, or all the masses of a link.</summary>
    public ImmutableArray<string> NodesAt(int index) => _nodes[index];

    /// <summary>
    /// The matrix index of <paramref name="node"/> in <paramref name="direction"/>, or −1 when the node is a support,
    /// is not in the network or does not move in that direction (in plane and 3d models a node never moves
    /// <see cref="Direction.Along"/>).
    /// </summary>
    public int IndexOf(string node, Direction direction = Direction.Along) =>
        _index.TryGet(new Dof(node, direction), out var i) ? i : -1;

    /// <summary>
    /// The matrix index of the DOF an output names: its label as outputs print it (<c>deck</c>, <c>skid.rz</c>), or in a
    /// line model the name of any mass (a linked mass answers for its shared DOF); −1 when nothing matches.
    /// </summary>
    public int IndexOfLabel(string label)
    {
        ArgumentNullException.ThrowIfNull(label);
        var i = IndexOf(label);
        if (i >= 0) return i;
        _labels ??= Enumerable.Range(0, Count).GroupBy(Label, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.First(), StringComparer.Ordinal);
        return _labels.TryGetValue(label, out var j) ? j : -1;
    }

    private Dictionary<string, int>? _labels;

    /// <summary>The test <see cref="IsRotationLabel"/> of <paramref name="network"/>'s map, without building the map for a line
    /// model (which has no rotation): output writers ask it per row.</summary>
    public static Func<string, bool> RotationLabels(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return network.Space == ModelSpace.Line ? static _ => false : For(network).IsRotationLabel;
    }

    /// <summary>True when <paramref name="label"/> is the label of a rotation DOF (<c>skid.ry</c>) of a plane or 3d model:
    /// its values are angles (rad, rad/s, rad/s²), not lengths.</summary>
    public bool IsRotationLabel(string label)
    {
        ArgumentNullException.ThrowIfNull(label);
        if (Space == ModelSpace.Line) return false;
        var i = IndexOfLabel(label);
        return i >= 0 && Dofs[i].Direction.IsRotation();
    }

    /// <summary>
    /// The DOF labels an output name stands for: itself when it is a label (or, in a line model, a mass); in plane and
    /// 3d models the name of a mass or body stands for every DOF of that node (<c>skid</c> → <c>skid.x</c> … <c>skid.rz</c>).
    /// Empty when the name matches nothing.
    /// </summary>
    public ImmutableArray<string> OutputLabels(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        if (IndexOfLabel(name) >= 0) return [name];
        if (Space == ModelSpace.Line) return [];
        return [.. Enumerable.Range(0, Count).Where(i => Dofs[i].Node == name).Select(Label)];
    }

    private static string SpaceName(ModelSpace space) => space == ModelSpace.Plane ? "plane" : "3d";

    /// <summary>The index of each (node, direction), one ordinal string table per direction (a string key hashes
    /// faster than a <see cref="Dof"/>, and assembly asks once per element end).</summary>
    private sealed class FrozenIndex
    {
        private readonly Dictionary<string, int>?[] _byDirection = new Dictionary<string, int>?[Enum.GetValues<Direction>().Length];

        public FrozenIndex(ImmutableArray<Dof> dofs, ImmutableArray<ImmutableArray<string>> nodes)
        {
            for (var i = 0; i < dofs.Length; i++)
            {
                var table = _byDirection[(int)dofs[i].Direction] ??= new Dictionary<string, int>(StringComparer.Ordinal);
                foreach (var node in nodes[i]) table.Add(node, i); // a node twice in one direction is a caller bug, as before
            }
        }

        public bool TryGet(Dof dof, out int index)
        {
            index = 0;
            return (uint)dof.Direction < (uint)_byDirection.Length && _byDirection[(int)dof.Direction] is { } table && dof.Node is not null
                && table.TryGetValue(dof.Node, out index);
        }
    }
}
