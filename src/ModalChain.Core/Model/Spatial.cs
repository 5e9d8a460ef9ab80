using System.Collections.Immutable;
using ModalChain.Core.Dofs;

namespace ModalChain.Core.Model;

/// <summary>The space a model's nodes move in.</summary>
/// <remarks>
/// Axes are global and right-handed, z vertical (up), x and y horizontal. A <see cref="Line"/> model is the scalar
/// network of earlier versions: every mass moves along one line (<see cref="Direction.Along"/>) and positions are
/// drawing hints only. In <see cref="Plane"/> and <see cref="ThreeD"/> models locations are mechanical data.
/// </remarks>
public enum ModelSpace
{
    /// <summary>One direction of motion for every mass; the default.</summary>
    Line,
    /// <summary>A side view: translations x and z and rotation about y.</summary>
    Plane,
    /// <summary>Three translations x, y, z and three rotations rx, ry, rz.</summary>
    ThreeD,
}

/// <summary>A point in the model's global axes, in metres (z vertical, up).</summary>
/// <param name="X">Horizontal coordinate x in m.</param>
/// <param name="Y">Horizontal coordinate y in m (0 in plane models).</param>
/// <param name="Z">Vertical coordinate z in m.</param>
public readonly record struct Point3(double X, double Y, double Z)
{
    /// <summary>The vector from <paramref name="b"/> to <paramref name="a"/>.</summary>
    public static Point3 operator -(Point3 a, Point3 b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);

    /// <summary>The vector sum.</summary>
    public static Point3 operator +(Point3 a, Point3 b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);

    /// <summary>Euclidean length in m.</summary>
    public double Length => Math.Sqrt(X * X + Y * Y + Z * Z);
}

/// <summary>A value that acts in one global direction: a stiffness (N/m, or N·m/rad for a rotation) or a damping coefficient (N·s/m, or N·m·s/rad).</summary>
/// <param name="Direction">The global translation or rotation the value acts in.</param>
/// <param name="Value">The value in SI; non-negative and finite.</param>
public readonly record struct DirectionalValue(Direction Direction, double Value);

/// <summary>
/// The inertia matrix J of a rigid body about its centre of mass, in global axes, kg·m²: the kinetic energy of
/// rotation is ½ ωᵀ J ω. Off-diagonal entries are the matrix entries (J_xy = −∫ x y dm), not the products of inertia.
/// </summary>
/// <param name="Xx">J_xx in kg·m².</param>
/// <param name="Yy">J_yy in kg·m².</param>
/// <param name="Zz">J_zz in kg·m².</param>
/// <param name="Xy">J_xy in kg·m².</param>
/// <param name="Yz">J_yz in kg·m².</param>
/// <param name="Xz">J_xz in kg·m².</param>
public readonly record struct InertiaMatrix(double Xx, double Yy, double Zz, double Xy = 0, double Yz = 0, double Xz = 0)
{
    /// <summary>The matrix as a 3×3 array, rows and columns in the order x, y, z.</summary>
    public double[,] ToArray() => new[,] { { Xx, Xy, Xz }, { Xy, Yy, Yz }, { Xz, Yz, Zz } };

    /// <summary>
    /// The inertia of a solid homogeneous box of mass <paramref name="kilograms"/> with edges
    /// <paramref name="dx"/>, <paramref name="dy"/>, <paramref name="dz"/> (m) along the global axes:
    /// J_xx = m(dy² + dz²)/12 and so on (any dynamics text; common practice).
    /// </summary>
    public static InertiaMatrix OfBox(double kilograms, double dx, double dy, double dz) =>
        new(kilograms * (dy * dy + dz * dz) / 12, kilograms * (dx * dx + dz * dz) / 12, kilograms * (dx * dx + dy * dy) / 12);

    /// <summary>
    /// The matrix J = R diag(principal) Rᵀ from principal moments (kg·m²) and their axes, the columns of R
    /// (unit vectors in global axes, mutually orthogonal).
    /// </summary>
    public static InertiaMatrix FromPrincipal(ReadOnlySpan<double> principal, ReadOnlySpan<Point3> axes)
    {
        if (principal.Length != 3 || axes.Length != 3) throw new ArgumentException("Three principal moments and three axes are needed.");
        double Entry(Func<Point3, double> a, Func<Point3, double> b, ReadOnlySpan<double> p, ReadOnlySpan<Point3> r)
        {
            var s = 0.0;
            for (var k = 0; k < 3; k++) s += p[k] * a(r[k]) * b(r[k]);
            return s;
        }
        return new InertiaMatrix(
            Entry(v => v.X, v => v.X, principal, axes), Entry(v => v.Y, v => v.Y, principal, axes), Entry(v => v.Z, v => v.Z, principal, axes),
            Entry(v => v.X, v => v.Y, principal, axes), Entry(v => v.Y, v => v.Z, principal, axes), Entry(v => v.X, v => v.Z, principal, axes));
    }
}

/// <summary>A named point fixed to a rigid body, where springs, dampers and loads attach.</summary>
/// <param name="Name">Name unique within its body; referred to as <c>body.point</c>.</param>
/// <param name="Location">Location in global axes, m, in the undeformed position.</param>
public sealed record BodyPoint(string Name, Point3 Location);

/// <summary>
/// A rigid body (a machine, a skid, an inertia block, a cabinet): six degrees of freedom in a 3d model (three in a
/// plane model) at its centre of mass; its points move as u_p = u_c + θ × (p − c).
/// </summary>
/// <param name="Name">Unique node name.</param>
/// <param name="Kilograms">Mass in kg; positive and finite.</param>
/// <param name="CentreOfMass">Location of the centre of mass in global axes, m.</param>
/// <param name="Inertia">Inertia matrix about the centre of mass in global axes, kg·m²; positive definite.</param>
/// <param name="Points">The attachment points, in declaration order.</param>
public sealed record RigidBody(string Name, double Kilograms, Point3 CentreOfMass, InertiaMatrix Inertia, ImmutableArray<BodyPoint> Points)
{
    /// <summary>The point named <paramref name="name"/>, or null.</summary>
    public BodyPoint? FindPoint(string name) => Points.FirstOrDefault(p => p.Name == name);
}

/// <summary>Helpers on <see cref="Direction"/> and <see cref="ModelSpace"/>.</summary>
public static class Directions
{
    /// <summary>The translations of a space: Along for line, x and z for plane, x, y and z for 3d.</summary>
    public static ImmutableArray<Direction> Translations(ModelSpace space) => space switch
    {
        ModelSpace.Line => [Direction.Along],
        ModelSpace.Plane => [Direction.X, Direction.Z],
        _ => [Direction.X, Direction.Y, Direction.Z],
    };

    /// <summary>The rotations of a space: none for line, ry for plane, rx, ry and rz for 3d.</summary>
    public static ImmutableArray<Direction> Rotations(ModelSpace space) => space switch
    {
        ModelSpace.Line => [],
        ModelSpace.Plane => [Direction.Ry],
        _ => [Direction.Rx, Direction.Ry, Direction.Rz],
    };

    /// <summary>Every direction of a space: the degrees of freedom of a rigid body in it.</summary>
    public static ImmutableArray<Direction> All(ModelSpace space) => [.. Translations(space), .. Rotations(space)];

    /// <summary>True for rx, ry, rz.</summary>
    public static bool IsRotation(this Direction direction) => direction is Direction.Rx or Direction.Ry or Direction.Rz;

    /// <summary>The lower-case label used in files and outputs: <c>x</c>, <c>rz</c>; empty for <see cref="Direction.Along"/>.</summary>
    public static string Label(this Direction direction) => direction switch
    {
        Direction.Along => "",
        Direction.X => "x",
        Direction.Y => "y",
        Direction.Z => "z",
        Direction.Rx => "rx",
        Direction.Ry => "ry",
        Direction.Rz => "rz",
        _ => throw new ArgumentOutOfRangeException(nameof(direction)),
    };

    /// <summary>The direction a label names (<c>x</c> … <c>rz</c>, lower case), or null.</summary>
    public static Direction? Parse(string label) => label switch
    {
        "x" => Direction.X,
        "y" => Direction.Y,
        "z" => Direction.Z,
        "rx" => Direction.Rx,
        "ry" => Direction.Ry,
        "rz" => Direction.Rz,
        _ => null,
    };

    /// <summary>The unit vector of a translation, or of the axis of a rotation, in global axes.</summary>
    public static Point3 Axis(this Direction direction) => direction switch
    {
        Direction.X or Direction.Rx => new Point3(1, 0, 0),
        Direction.Y or Direction.Ry => new Point3(0, 1, 0),
        Direction.Z or Direction.Rz => new Point3(0, 0, 1),
        _ => throw new ArgumentOutOfRangeException(nameof(direction), "Along has no axis in space."),
    };
}
