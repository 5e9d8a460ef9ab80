using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Reports.Drawing;

/// <summary>The motion of one node: translation of its location (m, or any consistent unit of a mode shape) and small rotation (rad).</summary>
/// <param name="Translation">Translation along x, y, z.</param>
/// <param name="Rotation">Rotation about x, y, z (right-hand rule); zero for point masses and supports.</param>
public readonly record struct NodeMotion(Point3 Translation, Point3 Rotation)
{
    /// <summary>No motion.</summary>
    public static NodeMotion None => default;

    /// <summary>
    /// The displacement of a point <paramref name="point"/> fixed to a node at <paramref name="centre"/>:
    /// u_p = u_c + θ × (p − c), the rigid-body map of a small rotation.
    /// </summary>
    public Point3 At(Point3 point, Point3 centre)
    {
        var r = point - centre;
        var t = Rotation;
        return Translation + new Point3(t.Y * r.Z - t.Z * r.Y, t.Z * r.X - t.X * r.Z, t.X * r.Y - t.Y * r.X);
    }
}

/// <summary>Gives the motion of each node of a drawing (a mode shape, an operating deflection shape).</summary>
public interface ISpatialMotion
{
    /// <summary>The motion of node <paramref name="node"/>; <see cref="NodeMotion.None"/> for supports and unknown names.</summary>
    NodeMotion Of(string node);
}

/// <summary>The motion of each node read from a vector over the degrees of freedom, through the DOF map's index of (node, direction).</summary>
/// <remarks>
/// A direction a node does not have (index −1) contributes zero: a mass that moves only in z has no x or y motion,
/// a support none at all, a body of a plane model no rx or rz.
/// </remarks>
public sealed class ShapeMotion : ISpatialMotion
{
    private static readonly ImmutableArray<Direction> Translations = [Direction.X, Direction.Y, Direction.Z];
    private static readonly ImmutableArray<Direction> Rotations = [Direction.Rx, Direction.Ry, Direction.Rz];
    private readonly IReadOnlyList<double> _shape;
    private readonly Func<string, Direction, int> _indexOf;

    /// <summary>Reads node motions from <paramref name="shape"/>.</summary>
    /// <param name="shape">One value per degree of freedom (m for translations, rad for rotations, up to a common factor).</param>
    /// <param name="indexOf">The index of (node, direction) in <paramref name="shape"/>, or −1 (normally <see cref="DofMap.IndexOf"/>).</param>
    public ShapeMotion(IReadOnlyList<double> shape, Func<string, Direction, int> indexOf)
    {
        ArgumentNullException.ThrowIfNull(shape);
        ArgumentNullException.ThrowIfNull(indexOf);
        _shape = shape;
        _indexOf = indexOf;
    }

    /// <inheritdoc />
    public NodeMotion Of(string node)
    {
        double Value(Direction d)
        {
            var i = _indexOf(node, d);
            return i >= 0 && i < _shape.Count ? _shape[i] : 0;
        }
        return new NodeMotion(
            new Point3(Value(Translations[0]), Value(Translations[1]), Value(Translations[2])),
            new Point3(Value(Rotations[0]), Value(Rotations[1]), Value(Rotations[2])));
    }
}

/// <summary>Node motions given by name (tests, hand-made shapes); every other node stays put.</summary>
public sealed class GivenMotion(IReadOnlyDictionary<string, NodeMotion> motions) : ISpatialMotion
{
    /// <inheritdoc />
    public NodeMotion Of(string node) => motions.TryGetValue(node, out var m) ? m : NodeMotion.None;
}
