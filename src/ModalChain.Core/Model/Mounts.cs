using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>The viscoelastic mount models that expand into springs, a damper and a massless inner node.</summary>
public enum MountKind
{
    /// <summary>A spring k in series with a damper c (relaxation time τ = c/k): no static stiffness.</summary>
    Maxwell,

    /// <summary>
    /// A long-term spring k1 in parallel with a Maxwell branch (spring k2 = Δ·k1 in series with a damper c = k2·τ):
    /// stiffness k1 when slow, k1 + k2 when fast.
    /// </summary>
    StandardLinearSolid,
}

/// <summary>A named viscoelastic mount between two nodes, in SI units.</summary>
/// <param name="Name">Unique name; the elements it expands into are named after it (see <see cref="MountExpansion"/>).</param>
/// <param name="Kind">Maxwell or standard linear solid.</param>
/// <param name="NodeA">First end: a mass, massless node or support.</param>
/// <param name="NodeB">Second end, different from <paramref name="NodeA"/>.</param>
/// <param name="Stiffness">N/m: the Maxwell spring k, or the standard linear solid's long-term (parallel) spring k1; positive.</param>
/// <param name="RelaxationTime">τ in s, positive: c/k for Maxwell, c/k2 for the standard linear solid (the time constant of its Maxwell branch).</param>
/// <param name="RelaxationStrength">Δ = k2/k1 (dimensionless, positive) for the standard linear solid; 0 for Maxwell.</param>
public sealed record Mount(string Name, MountKind Kind, string NodeA, string NodeB, double Stiffness, double RelaxationTime, double RelaxationStrength = 0)
{
    /// <summary>
    /// Plane and 3d models: the stiffness per global translation (N/m; the Maxwell spring, or the standard linear solid's
    /// long-term spring), each positive; <see cref="Stiffness"/> is then the largest of them. Empty in line models.
    /// </summary>
    /// <remarks>
    /// One <see cref="RelaxationTime"/> and one <see cref="RelaxationStrength"/> hold in every direction: they describe
    /// the elastomer (its creep and how much stiffer it is when fast), while the shape of the mount sets the stiffness
    /// per direction; so each direction's damper is its spring times τ and the loss factor is the same in every direction.
    /// </remarks>
    public ImmutableArray<DirectionalValue> Components { get; init; } = [];

    /// <summary>Plane and 3d models: the location (m) given to the inner node, the location of the mount's first end (or its second when the first is ground).</summary>
    public Point3? InnerLocation { get; init; }

    /// <summary>The complex stiffness K*(ω) = K′ + iK″ in N/m at <paramref name="angularFrequency"/> rad/s.</summary>
    /// <remarks>
    /// Maxwell: K* = k(ωτ)²/(1+(ωτ)²) + i·kωτ/(1+(ωτ)²). Standard linear solid: K* = k1 + k2(ωτ)²/(1+(ωτ)²) + i·k2ωτ/(1+(ωτ)²).
    /// Derived in docs/methods.md ("Massless nodes and mounts").
    /// </remarks>
    public System.Numerics.Complex ComplexStiffness(double angularFrequency)
    {
        var u = angularFrequency * RelaxationTime;
        var branch = Kind == MountKind.Maxwell ? Stiffness : RelaxationStrength * Stiffness;
        var parallel = Kind == MountKind.Maxwell ? 0 : Stiffness;
        return new System.Numerics.Complex(parallel + branch * u * u / (1 + u * u), branch * u / (1 + u * u));
    }
}

/// <summary>Expands mounts into network elements and converts a loss factor at a reference frequency into a relaxation time.</summary>
/// <remarks>
/// A mount named <c>M</c> adds the massless node <c>M~inner</c> and: for Maxwell, the spring <c>M~spring</c> (k, from
/// NodeA to the inner node) and the damper <c>M~damper</c> (c = kτ, from the inner node to NodeB); for the standard
/// linear solid, the spring <c>M~long-term</c> (k1, NodeA to NodeB), the spring <c>M~series</c> (k2 = Δk1, NodeA to
/// the inner node) and the damper <c>M~damper</c> (c = k2τ, inner node to NodeB). The '~' cannot appear in a name
/// written in a model file, so the expansion never clashes with the user's names. In a plane or 3d model
/// (<see cref="Mount.Components"/> given) the inner node is a point at <see cref="Mount.InnerLocation"/> moving in the
/// translations of the components, and each element carries one component per translation (its value times τ for the
/// damper, times Δ for the branch spring).
/// </remarks>
public static class MountExpansion
{
    /// <summary>The name of the massless node a mount adds.</summary>
    public static string InnerNode(string mount) => mount + "~inner";

    /// <summary>Adds the elements of <paramref name="mount"/> to <paramref name="builder"/>: its inner node, springs and damper.</summary>
    public static void Expand(Mount mount, NetworkBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(mount);
        ArgumentNullException.ThrowIfNull(builder);
        Guard.Positive(mount.Stiffness, nameof(mount));
        Guard.Positive(mount.RelaxationTime, nameof(mount));
        var inner = InnerNode(mount.Name);
        if (!mount.Components.IsDefaultOrEmpty)
        {
            ExpandInSpace(mount, builder, inner);
            return;
        }
        builder.AddNode(inner);
        if (mount.Kind == MountKind.Maxwell)
        {
            builder.AddSpring(mount.Name + "~spring", mount.NodeA, inner, mount.Stiffness);
            builder.AddDamper(mount.Name + "~damper", inner, mount.NodeB, mount.Stiffness * mount.RelaxationTime);
            return;
        }
        Guard.Positive(mount.RelaxationStrength, nameof(mount));
        var series = mount.RelaxationStrength * mount.Stiffness;
        builder.AddSpring(mount.Name + "~long-term", mount.NodeA, mount.NodeB, mount.Stiffness);
        builder.AddSpring(mount.Name + "~series", mount.NodeA, inner, series);
        builder.AddDamper(mount.Name + "~damper", inner, mount.NodeB, series * mount.RelaxationTime);
    }

    /// <summary>
    /// The expansion in a plane or 3d model: the inner node moves in the translations the stiffness names (no rotation),
    /// at <see cref="Mount.InnerLocation"/>; each element carries one component per such translation.
    /// </summary>
    private static void ExpandInSpace(Mount mount, NetworkBuilder builder, string inner)
    {
        var location = mount.InnerLocation ?? throw new ArgumentException($"Mount '{mount.Name}' in a plane or 3d model needs the location of its inner node.", nameof(mount));
        foreach (var c in mount.Components)
            if (c.Direction.IsRotation() || c.Direction == Dofs.Direction.Along)
                throw new ArgumentException($"Mount '{mount.Name}' acts in '{c.Direction}', but a mount's stiffness is given per translation.", nameof(mount));
            else Guard.Positive(c.Value, nameof(mount));
        var moves = mount.Components.Select(c => c.Direction).Order().ToImmutableArray();
        ImmutableArray<DirectionalValue> Scaled(double factor) => [.. mount.Components.OrderBy(c => c.Direction).Select(c => c with { Value = factor * c.Value })];
        double Largest(ImmutableArray<DirectionalValue> values) => values.Max(v => v.Value);
        builder.AddMass(new Mass(inner, 0, new DrawingPosition(location.X, location.Z)) { Location = location, Moves = moves });
        var tau = mount.RelaxationTime;
        if (mount.Kind == MountKind.Maxwell)
        {
            var k = Scaled(1);
            var c = Scaled(tau);
            builder.AddSpring(new Spring(mount.Name + "~spring", mount.NodeA, inner, Largest(k)) { Components = k });
            builder.AddDamper(new Damper(mount.Name + "~damper", inner, mount.NodeB, Largest(c)) { Components = c });
            return;
        }
        Guard.Positive(mount.RelaxationStrength, nameof(mount));
        var longTerm = Scaled(1);
        var series = Scaled(mount.RelaxationStrength);
        var damper = Scaled(mount.RelaxationStrength * tau);
        builder.AddSpring(new Spring(mount.Name + "~long-term", mount.NodeA, mount.NodeB, Largest(longTerm)) { Components = longTerm });
        builder.AddSpring(new Spring(mount.Name + "~series", mount.NodeA, inner, Largest(series)) { Components = series });
        builder.AddDamper(new Damper(mount.Name + "~damper", inner, mount.NodeB, Largest(damper)) { Components = damper });
    }

    /// <summary>The largest loss factor a standard linear solid of relaxation strength Δ reaches: Δ / (2√(1 + Δ)).</summary>
    public static double MaximumLossFactor(double relaxationStrength)
    {
        Guard.Positive(relaxationStrength);
        return relaxationStrength / (2 * Math.Sqrt(1 + relaxationStrength));
    }

    /// <summary>
    /// The relaxation time τ (s) of a standard linear solid of strength Δ whose loss factor is η at
    /// <paramref name="angularFrequency"/> rad/s; null when η exceeds <see cref="MaximumLossFactor"/>.
    /// </summary>
    /// <remarks>
    /// tan δ = Δu / (1 + (1 + Δ)u²) with u = ωτ; tan δ = η gives η(1+Δ)u² − Δu + η = 0, two roots whose product is
    /// 1/(1+Δ) (the peak at u = 1/√(1+Δ) lies between them). The smaller u is taken: the shorter relaxation time, which
    /// puts the loss peak above the reference frequency. Give the relaxation time itself to choose the other.
    /// </remarks>
    public static double? RelaxationTimeForLossFactor(double relaxationStrength, double lossFactor, double angularFrequency)
    {
        Guard.Positive(relaxationStrength);
        Guard.Positive(lossFactor);
        Guard.Positive(angularFrequency);
        var d = relaxationStrength;
        var a = lossFactor * (1 + d);
        var disc = d * d - 4 * a * lossFactor;
        if (disc < 0)
        {
            // At the maximum itself round-off may make the discriminant slightly negative.
            if (lossFactor > MaximumLossFactor(d) * (1 + 1e-12)) return null;
            disc = 0;
        }
        // Smaller root without cancellation: u = 2η / (Δ + √disc).
        var u = 2 * lossFactor / (d + Math.Sqrt(disc));
        return u / angularFrequency;
    }
}
