using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests;

/// <summary>Plane and 3d networks built in code for the spatial tests.</summary>
internal static class SpatialNetworks
{
    /// <summary>Bar mass in kg (REFERENCES.md §10).</summary>
    public const double BarMass = 1000;

    /// <summary>Bar inertia about the centre of mass: m·0.9² kg·m².</summary>
    public const double BarInertia = 810;

    /// <summary>Front and rear spring rates in N/m and their distances ahead of / behind the centre of mass in m.</summary>
    public const double KFront = 18e3, KRear = 22e3, LFront = 1.0, LRear = 1.5;

    /// <summary>Horizontal stiffness of each bar support in N/m (acts at the centre's height, so surge stays apart).</summary>
    public const double KSurge = 5e4;

    public static DirectionalValue K(Direction d, double value) => new(d, value);

    /// <summary>
    /// The rigid bar on two springs (bounce and pitch) as a plane model: centre of mass at the origin, front spring at
    /// x = +1.0 m, rear at x = −1.5 m, both vertical; a horizontal spring at each support keeps surge apart.
    /// </summary>
    public static Network Bar(ModelSpace space = ModelSpace.Plane, bool surgeSprings = true)
    {
        var b = new NetworkBuilder { Space = space };
        b.AddBody(new RigidBody("bar", BarMass, new Point3(0, 0, 0), new InertiaMatrix(BarInertia, BarInertia, BarInertia),
            [new BodyPoint("front", new Point3(LFront, 0, 0)), new BodyPoint("rear", new Point3(-LRear, 0, 0))]));
        ImmutableArray<DirectionalValue> Rate(double kz) => surgeSprings ? [K(Direction.X, KSurge), K(Direction.Z, kz)] : [K(Direction.Z, kz)];
        b.AddSpring(new Spring("front-spring", "bar.front", Network.Ground, KFront) { Components = Rate(KFront) });
        b.AddSpring(new Spring("rear-spring", "bar.rear", Network.Ground, KRear) { Components = Rate(KRear) });
        return b.Build();
    }

    /// <summary>
    /// A block of <paramref name="mass"/> kg with principal inertia along the axes on four equal mounts at (±a, ±b) in
    /// a plane <paramref name="h"/> below its centre of mass (at the origin); each mount k_h in x and y and k_z in z.
    /// </summary>
    public static Network Block(double mass, InertiaMatrix inertia, double a, double b, double h, double kh, double kz)
    {
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD };
        var corners = new[] { (1, 1), (1, -1), (-1, 1), (-1, -1) };
        builder.AddBody(new RigidBody("block", mass, new Point3(0, 0, 0), inertia,
            [.. corners.Select((c, i) => new BodyPoint($"foot-{i + 1}", new Point3(c.Item1 * a, c.Item2 * b, -h)))]));
        for (var i = 1; i <= 4; i++)
            builder.AddSpring(new Spring($"mount-{i}", $"block.foot-{i}", Network.Ground, Math.Max(kh, kz))
            {
                Components = [K(Direction.X, kh), K(Direction.Y, kh), K(Direction.Z, kz)],
            });
        return builder.Build();
    }

    /// <summary>The two roots λ of det(K − λ M) = 0 for a 2×2 K and diagonal M, ascending.</summary>
    public static (double Low, double High) TwoByTwo(double k11, double k12, double k22, double m1, double m2)
    {
        var a = m1 * m2;
        var b = -(k11 * m2 + k22 * m1);
        var c = k11 * k22 - k12 * k12;
        var root = Math.Sqrt(b * b - 4 * a * c);
        // The product of the roots is c/a: take the large root by the stable formula and the small one from it.
        var high = (-b + root) / (2 * a);
        return (c / (a * high), high);
    }
}
