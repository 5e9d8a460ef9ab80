using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>What an element end or a load is attached to.</summary>
internal enum AttachmentKind
{
    /// <summary>A point mass: its own translations, no rotation.</summary>
    PointMass,
    /// <summary>A point (or the centre of mass) of a rigid body.</summary>
    BodyPoint,
    /// <summary>A support: fixed, or moved by prescribed translations.</summary>
    Support,
}

/// <summary>
/// The motion of one attachment point as a linear map of the model's degrees of freedom: six rows (x, y, z, rx, ry,
/// rz), each a short list of (DOF index, coefficient).
/// </summary>
/// <remarks>
/// A point mass gives its own translations (a translation it does not have is held at zero) and no rotation. A point
/// p of a rigid body with centre of mass c gives u_p = u_c + θ × (p − c) and θ_p = θ, so with r = p − c:
/// u_x = u_cx + r_z θ_y − r_y θ_z, u_y = u_cy − r_z θ_x + r_x θ_z, u_z = u_cz + r_y θ_x − r_x θ_y. A support gives
/// zero, or, where the caller numbers prescribed support translations, those columns. Directions a node does not
/// have (y and rx, rz of a body in a plane model) drop out. Elements add Tᵀ k T through these rows; loads enter as
/// Tᵀ f.
/// </remarks>
internal sealed class AttachmentMap
{
    private readonly (int Dof, double Coefficient)[][] _rows;

    private AttachmentMap(string reference, string node, AttachmentKind kind, Point3? location, (int, double)[][] rows)
    {
        Reference = reference;
        Node = node;
        Kind = kind;
        Location = location;
        _rows = rows;
    }

    /// <summary>The reference as written: a node name or <c>body.point</c>.</summary>
    public string Reference { get; }

    /// <summary>The mass, body or support the point belongs to.</summary>
    public string Node { get; }

    /// <summary>What the point belongs to.</summary>
    public AttachmentKind Kind { get; }

    /// <summary>The point's location in m, or null (a support or mass without a location).</summary>
    public Point3? Location { get; }

    /// <summary>The row of global direction <paramref name="direction"/> (x … rz): the point's motion in it as Σ coefficient·u[DOF].</summary>
    public IReadOnlyList<(int Dof, double Coefficient)> Row(Direction direction) => _rows[RowIndex(direction)];

    /// <summary>Row position of a global direction: x, y, z, rx, ry, rz → 0..5.</summary>
    public static int RowIndex(Direction direction) => direction switch
    {
        Direction.X => 0,
        Direction.Y => 1,
        Direction.Z => 2,
        Direction.Rx => 3,
        Direction.Ry => 4,
        Direction.Rz => 5,
        _ => throw new ArgumentOutOfRangeException(nameof(direction), "A plane or 3d attachment has no 'Along' row."),
    };

    /// <summary>Builds attachment maps of one plane or 3d network over a DOF map.</summary>
    /// <param name="network">The network (plane or 3d).</param>
    /// <param name="dofs">Its free DOFs.</param>
    /// <param name="supportColumn">
    /// Column of a support's prescribed translation (support name, direction) in an extended numbering, or −1 when the
    /// support is held fixed; null holds every support fixed.
    /// </param>
    public sealed class Resolver(Network network, DofMap dofs, Func<string, Direction, int>? supportColumn = null)
    {
        private readonly Dictionary<string, Mass> _masses = network.Masses.ToDictionary(m => m.Name, StringComparer.Ordinal);
        private readonly Dictionary<string, Support> _supports = network.Supports.ToDictionary(s => s.Name, StringComparer.Ordinal);
        private readonly Dictionary<string, AttachmentMap> _cache = new(StringComparer.Ordinal);

        /// <summary>The map of <paramref name="reference"/> (a mass, support or body name, or <c>body.point</c>).</summary>
        /// <exception cref="ArgumentException">The reference names nothing in the network.</exception>
        public AttachmentMap Of(string reference)
        {
            if (_cache.TryGetValue(reference, out var cached)) return cached;
            var attachment = network.Resolve(reference)
                ?? throw new ArgumentException($"'{reference}' is not a mass, support, body or body point of the network.", nameof(reference));
            var rows = new (int, double)[6][];
            for (var r = 0; r < 6; r++) rows[r] = [];
            AttachmentMap map;
            if (_masses.TryGetValue(attachment.Node, out var mass))
            {
                foreach (var d in Directions.Translations(network.Space))
                    if (dofs.IndexOf(mass.Name, d) is var i and >= 0) rows[RowIndex(d)] = [(i, 1.0)];
                map = new AttachmentMap(reference, mass.Name, AttachmentKind.PointMass, mass.Location, rows);
            }
            else if (_supports.TryGetValue(attachment.Node, out var support))
            {
                if (supportColumn is not null)
                    foreach (var d in Directions.Translations(network.Space))
                        if (supportColumn(support.Name, d) is var c and >= 0) rows[RowIndex(d)] = [(c, 1.0)];
                map = new AttachmentMap(reference, support.Name, AttachmentKind.Support, support.Location, rows);
            }
            else
            {
                var body = network.Bodies.First(b => b.Name == attachment.Node);
                var p = attachment.Location ?? body.CentreOfMass;
                var r = p - body.CentreOfMass;
                int At(Direction d) => dofs.IndexOf(body.Name, d);
                rows[0] = Terms((At(Direction.X), 1), (At(Direction.Ry), r.Z), (At(Direction.Rz), -r.Y));
                rows[1] = Terms((At(Direction.Y), 1), (At(Direction.Rx), -r.Z), (At(Direction.Rz), r.X));
                rows[2] = Terms((At(Direction.Z), 1), (At(Direction.Rx), r.Y), (At(Direction.Ry), -r.X));
                rows[3] = Terms((At(Direction.Rx), 1));
                rows[4] = Terms((At(Direction.Ry), 1));
                rows[5] = Terms((At(Direction.Rz), 1));
                map = new AttachmentMap(reference, body.Name, AttachmentKind.BodyPoint, p, rows);
            }
            _cache[reference] = map;
            return map;
        }

        private static (int, double)[] Terms(params (int Dof, double Coefficient)[] terms) =>
            [.. terms.Where(t => t.Dof >= 0 && t.Coefficient != 0)];
    }
}
