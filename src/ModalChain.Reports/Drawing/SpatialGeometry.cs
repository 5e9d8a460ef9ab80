using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Reports.Drawing;

/// <summary>What a node of a plane or 3d drawing is.</summary>
public enum SpatialNodeKind
{
    /// <summary>A point mass, drawn as a square.</summary>
    Mass,

    /// <summary>A rigid body, drawn as a box around its centre of mass.</summary>
    Body,

    /// <summary>A support, drawn as a hatched anchor where an element meets it.</summary>
    Support,
}

/// <summary>How a body's box was sized, stated under the drawing.</summary>
public enum BoxSource
{
    /// <summary>The homogeneous box with the body's mass and (diagonal) inertia matrix: exactly the box a model states with <c>box:</c>.</summary>
    Inertia,

    /// <summary>The box around the centre of mass that reaches the body's farthest point along each axis.</summary>
    Points,
}

/// <summary>A body's box at rest: axis-aligned, centred on the centre of mass.</summary>
/// <param name="Centre">The centre of mass in m.</param>
/// <param name="HalfSize">Half the edge along x, y and z in m, each positive.</param>
/// <param name="Source">How the size was found.</param>
public sealed record SpatialBox(Point3 Centre, Point3 HalfSize, BoxSource Source)
{
    /// <summary>The corner on the side given by the signs (each −1 or +1) along x, y, z.</summary>
    public Point3 Corner(int sx, int sy, int sz) =>
        new(Centre.X + sx * HalfSize.X, Centre.Y + sy * HalfSize.Y, Centre.Z + sz * HalfSize.Z);
}

/// <summary>A node as drawn: where it is and, for a body, its box and points.</summary>
/// <param name="Name">Node name.</param>
/// <param name="Kind">Mass, body or support.</param>
/// <param name="Location">The mass's or support's location, or the body's centre of mass, in m.</param>
/// <param name="Kilograms">Mass in kg (0 for a support).</param>
/// <param name="Box">The body's box; null for masses and supports.</param>
/// <param name="Points">The body's attachment points; empty for masses and supports.</param>
public sealed record SpatialNode(string Name, SpatialNodeKind Kind, Point3 Location, double Kilograms, SpatialBox? Box, ImmutableArray<BodyPoint> Points);

/// <summary>One end of a drawn spring or damper.</summary>
/// <param name="Node">The mass, body or support it belongs to.</param>
/// <param name="Location">Where the end is at rest, in m (a body's point or centre of mass, a mass's location, or a support's anchor).</param>
/// <param name="IsSupport">True when the end is a support: it stays put in a mode shape.</param>
/// <param name="Placed">True for a support end with no location of its own, drawn below the other end for the picture only.</param>
public sealed record SpatialEnd(string Node, Point3 Location, bool IsSupport, bool Placed);

/// <summary>A spring, damper or inerter as drawn between its two attachment points.</summary>
/// <param name="Name">Element name.</param>
/// <param name="Kind">Spring, damper or inerter.</param>
/// <param name="A">First end.</param>
/// <param name="B">Second end.</param>
public sealed record SpatialElement(string Name, ElementKind Kind, SpatialEnd A, SpatialEnd B);

/// <summary>The mechanical geometry of a plane or 3d model as the figures draw it, in the model's global axes (m, z up).</summary>
/// <param name="Space">Plane (side view only) or 3d (side and plan views).</param>
/// <param name="Nodes">Masses, then bodies, then the supports that have a location (anchors are drawn per element end).</param>
/// <param name="Elements">Springs, then dampers, then inerters.</param>
/// <param name="Size">The model's largest dimension in m (at least a small positive length): sets the drawn size of motion and of placed anchors.</param>
public sealed record SpatialGeometry(ModelSpace Space, ImmutableArray<SpatialNode> Nodes, ImmutableArray<SpatialElement> Elements, double Size)
{
    /// <summary>The fraction of <see cref="Size"/> that an element running to a support without a location is drawn long.</summary>
    public const double PlacedAnchorFraction = 0.12;

    /// <summary>The node named <paramref name="name"/>.</summary>
    public SpatialNode Node(string name) => Nodes.First(n => n.Name == name);

    /// <summary>Every point of the drawing at rest: node locations, box corners, body points and element ends.</summary>
    public IEnumerable<Point3> RestPoints()
    {
        foreach (var n in Nodes)
        {
            yield return n.Location;
            if (n.Box is { } box)
                foreach (var c in Corners(box)) yield return c;
            foreach (var p in n.Points) yield return p.Location;
        }
        foreach (var e in Elements)
        {
            yield return e.A.Location;
            yield return e.B.Location;
        }
    }

    /// <summary>The eight corners of a box in the order (x, y, z signs) −−−, +−−, ++−, −+−, −−+, +−+, +++, −++.</summary>
    public static ImmutableArray<Point3> Corners(SpatialBox box)
    {
        ArgumentNullException.ThrowIfNull(box);
        return [box.Corner(-1, -1, -1), box.Corner(1, -1, -1), box.Corner(1, 1, -1), box.Corner(-1, 1, -1),
                box.Corner(-1, -1, 1), box.Corner(1, -1, 1), box.Corner(1, 1, 1), box.Corner(-1, 1, 1)];
    }

    /// <summary>The geometry of a plane or 3d network from its locations, bodies and element ends.</summary>
    /// <remarks>
    /// A mass without a location falls back to its drawing position (x, z) and then to the origin; a support end
    /// without a location is drawn <see cref="PlacedAnchorFraction"/> of the model's size below the other end
    /// (a picture of "to ground", not a location). Boxes: see <see cref="BoxOf"/>.
    /// </remarks>
    public static SpatialGeometry For(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space == ModelSpace.Line) throw new ArgumentException("A line model has no spatial geometry; draw it with NetworkFigure.", nameof(network));
        static Point3 MassLocation(Mass m) =>
            m.Location ?? (m.Position is { } p ? new Point3(p.X, 0, p.Y) : default);
        var located = network.Masses.Select(MassLocation)
            .Concat(network.Bodies.Select(b => b.CentreOfMass))
            .Concat(network.Bodies.SelectMany(b => b.Points.Select(p => p.Location)))
            .Concat(network.Supports.Where(s => s.Location is not null).Select(s => s.Location!.Value))
            .ToList();
        var size = Extent(located);
        var boxes = network.Bodies.Select(b => BoxOf(b, network.Space, size)).ToArray();
        size = Extent(located.Concat(boxes.SelectMany(b => Corners(b))));

        var nodes = ImmutableArray.CreateBuilder<SpatialNode>();
        foreach (var m in network.Masses)
            nodes.Add(new SpatialNode(m.Name, SpatialNodeKind.Mass, MassLocation(m), m.Kilograms, null, []));
        for (var i = 0; i < network.Bodies.Length; i++)
        {
            var b = network.Bodies[i];
            nodes.Add(new SpatialNode(b.Name, SpatialNodeKind.Body, b.CentreOfMass, b.Kilograms, boxes[i], b.Points));
        }

        var supports = network.Supports.ToDictionary(s => s.Name, StringComparer.Ordinal);
        var massAt = network.Masses.ToDictionary(m => m.Name, MassLocation, StringComparer.Ordinal);
        Point3? Fixed(string reference)
        {
            if (massAt.TryGetValue(reference, out var at)) return at;
            if (supports.TryGetValue(reference, out var s)) return s.Location;
            return network.Resolve(reference)?.Location;
        }
        SpatialEnd End(string reference, string other)
        {
            var attachment = network.Resolve(reference);
            var node = attachment?.Node ?? reference;
            var isSupport = supports.ContainsKey(node);
            if (Fixed(reference) is { } at) return new SpatialEnd(node, at, isSupport, false);
            var below = Fixed(other) ?? default;
            return new SpatialEnd(node, below - new Point3(0, 0, PlacedAnchorFraction * size), isSupport, true);
        }

        var elements = network.Springs.Select(s => new SpatialElement(s.Name, ElementKind.Spring, End(s.NodeA, s.NodeB), End(s.NodeB, s.NodeA)))
            .Concat(network.Dampers.Select(d => new SpatialElement(d.Name, ElementKind.Damper, End(d.NodeA, d.NodeB), End(d.NodeB, d.NodeA))))
            .Concat(network.Inerters.Select(i => new SpatialElement(i.Name, ElementKind.Inerter, End(i.NodeA, i.NodeB), End(i.NodeB, i.NodeA))))
            .ToImmutableArray();
        foreach (var s in network.Supports.Where(s => s.Location is not null))
            nodes.Add(new SpatialNode(s.Name, SpatialNodeKind.Support, s.Location!.Value, 0, null, []));
        size = Extent(located.Concat(boxes.SelectMany(b => Corners(b))).Concat(elements.SelectMany(e => new[] { e.A.Location, e.B.Location })));
        return new SpatialGeometry(network.Space, nodes.ToImmutable(), elements, size);
    }

    /// <summary>
    /// The box a body is drawn as: the homogeneous box with the body's mass and inertia when the inertia matrix is
    /// diagonal and such a box exists (edges dx² = 6(J_yy + J_zz − J_xx)/m and so on, the inverse of
    /// <see cref="InertiaMatrix.OfBox"/>), otherwise the box around the centre of mass that reaches the body's
    /// farthest point along each axis.
    /// </summary>
    /// <param name="body">The body.</param>
    /// <param name="space">The model's space (a plane model's inertia has only J_yy to go by).</param>
    /// <param name="modelSize">The model's size in m: an axis along which no point lies off the centre gets a share of it.</param>
    public static SpatialBox BoxOf(RigidBody body, ModelSpace space, double modelSize)
    {
        ArgumentNullException.ThrowIfNull(body);
        var j = body.Inertia;
        var m = body.Kilograms;
        var trace = Math.Abs(j.Xx) + Math.Abs(j.Yy) + Math.Abs(j.Zz);
        var diagonal = Math.Abs(j.Xy) + Math.Abs(j.Yz) + Math.Abs(j.Xz) <= 1e-9 * trace;
        if (space == ModelSpace.ThreeD && diagonal && trace > 0)
        {
            var dx2 = 6 * (j.Yy + j.Zz - j.Xx) / m;
            var dy2 = 6 * (j.Xx + j.Zz - j.Yy) / m;
            var dz2 = 6 * (j.Xx + j.Yy - j.Zz) / m;
            var smallest = 1e-6 * Math.Max(dx2, Math.Max(dy2, dz2));
            if (dx2 > smallest && dy2 > smallest && dz2 > smallest)
                return new SpatialBox(body.CentreOfMass, new Point3(Math.Sqrt(dx2) / 2, Math.Sqrt(dy2) / 2, Math.Sqrt(dz2) / 2), BoxSource.Inertia);
        }
        var c = body.CentreOfMass;
        double Reach(Func<Point3, double> axis) => body.Points.Select(p => Math.Abs(axis(p.Location) - axis(c))).DefaultIfEmpty(0).Max();
        var h = new[] { Reach(p => p.X), Reach(p => p.Y), Reach(p => p.Z) };
        var largest = h.Max();
        var fallback = largest > 0 ? 0.5 * largest : 0.1 * modelSize;
        for (var k = 0; k < 3; k++)
            if (h[k] < 1e-6 * Math.Max(largest, modelSize)) h[k] = fallback;
        return new SpatialBox(c, new Point3(h[0], h[1], h[2]), BoxSource.Points);
    }

    private static double Extent(IEnumerable<Point3> points)
    {
        var list = points.ToList();
        if (list.Count == 0) return 1;
        var span = Math.Max(list.Max(p => p.X) - list.Min(p => p.X),
            Math.Max(list.Max(p => p.Y) - list.Min(p => p.Y), list.Max(p => p.Z) - list.Min(p => p.Z)));
        return span > 1e-9 ? span : 1;
    }
}
