using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>Stiffness and discrete-damper matrices split into free DOFs (masses) and prescribed DOFs (supports).</summary>
/// <remarks>
/// Every support, ground included, is one prescribed DOF p; the equations of motion of the free DOFs f are
/// M ẍ_f + C_ff ẋ_f + K_ff x_f = F − C_fp u̇_p − K_fp u_p, and the force the supports must supply is
/// r_p = C_pf ẋ_f + K_pf x_f + C_pp u̇_p + K_pp u_p. Ground has u = 0; a support carrying a base-motion load has its
/// prescribed motion. Matrices are dense (this partition is meant for models up to a few thousand DOFs).
/// Reusable by every analysis that moves supports (harmonic, time stepping).
/// </remarks>
/// <param name="Free">Numbering of the free DOFs (one per mass in a line model; see <see cref="DofMap.For"/>).</param>
/// <param name="Supports">Names of the prescribed DOFs, ground first, in the network's support order (plane and 3d models: <c>support.x</c>, <c>support.z</c>, … per translation).</param>
/// <param name="Mass">M over the free DOFs in kg, inerters included (diagonal in line models without an inerter between two masses; a body's inertia may couple its rotations).</param>
/// <param name="StiffnessFF">K_ff in N/m.</param>
/// <param name="StiffnessFP">K_fp in N/m (free rows, support columns).</param>
/// <param name="StiffnessPP">K_pp in N/m.</param>
/// <param name="DamperFF">C_ff of the discrete dampers in N·s/m.</param>
/// <param name="DamperFP">C_fp of the discrete dampers in N·s/m.</param>
/// <param name="DamperPP">C_pp of the discrete dampers in N·s/m.</param>
public sealed record SupportPartition(
    DofMap Free,
    ImmutableArray<string> Supports,
    Matrix<double> Mass,
    Matrix<double> StiffnessFF,
    Matrix<double> StiffnessFP,
    Matrix<double> StiffnessPP,
    Matrix<double> DamperFF,
    Matrix<double> DamperFP,
    Matrix<double> DamperPP)
{
    /// <summary>Number of free DOFs.</summary>
    public int FreeCount => Free.Count;

    /// <summary>Number of prescribed DOFs (supports, ground included).</summary>
    public int SupportCount => Supports.Length;

    /// <summary>Column of <paramref name="support"/> in the prescribed partition, or −1.</summary>
    public int SupportIndex(string support) => Supports.IndexOf(support);

    /// <summary>
    /// Column of <paramref name="support"/>'s prescribed translation <paramref name="direction"/> (plane and 3d models,
    /// whose prescribed columns are labelled <c>support.x</c> …), or −1; in a line model the direction must be Along.
    /// </summary>
    public int SupportIndex(string support, Direction direction) =>
        direction == Direction.Along ? SupportIndex(support) : Supports.IndexOf($"{support}.{direction.Label()}");

    /// <summary>Assembles the partition of <paramref name="network"/>.</summary>
    /// <remarks>Plane and 3d models: one prescribed column per support and translation of the space (<see cref="SpatialAssembly.Partition"/>).</remarks>
    public static SupportPartition Assemble(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space != ModelSpace.Line) return SpatialAssembly.Partition(network);
        var free = DofMap.ForScalarNetwork(network);
        var supports = network.Supports.Select(s => s.Name).ToImmutableArray();
        var n = free.Count;
        var total = n + supports.Length;
        int Index(string node)
        {
            var i = free.IndexOf(node);
            return i >= 0 ? i : n + supports.IndexOf(node);
        }

        var k = Matrix<double>.Build.Dense(total, total);
        foreach (var s in network.Springs) AddTwoNode(k, Index(s.NodeA), Index(s.NodeB), s.Stiffness);
        var c = Matrix<double>.Build.Dense(total, total);
        foreach (var d in network.Dampers) AddTwoNode(c, Index(d.NodeA), Index(d.NodeB), d.Coefficient);
        var m = Matrix<double>.Build.Dense(n, n);
        foreach (var mass in network.Masses) m[free.IndexOf(mass.Name), free.IndexOf(mass.Name)] += mass.Kilograms;
        var inertance = Matrix<double>.Build.Dense(total, total);
        foreach (var b in network.Inerters) AddTwoNode(inertance, Index(b.NodeA), Index(b.NodeB), b.Inertance);
        m += inertance.SubMatrix(0, n, 0, n);

        var p = supports.Length;
        return new SupportPartition(free, supports, m,
            k.SubMatrix(0, n, 0, n), k.SubMatrix(0, n, n, p), k.SubMatrix(n, p, n, p),
            c.SubMatrix(0, n, 0, n), c.SubMatrix(0, n, n, p), c.SubMatrix(n, p, n, p));
    }

    /// <summary>The quasi-static influence matrix T = −K_ff⁻¹ K_fp (free displacement per unit support displacement), or null when K_ff is singular.</summary>
    /// <remarks>
    /// x_s = T u is the displacement the free DOFs take when the supports move slowly (Chopra, Dynamics of Structures,
    /// §9.6 and §13.5 on multi-support excitation). For a single support holding the whole network T is a column of ones.
    /// Null when part of the network is not held by springs (rigid-body modes).
    /// </remarks>
    public Matrix<double>? QuasiStaticInfluence()
    {
        if (FreeCount == 0) return Matrix<double>.Build.Dense(0, SupportCount);
        var lu = StiffnessFF.LU();
        var diagonalScale = Enumerable.Range(0, FreeCount).Max(i => Math.Abs(StiffnessFF[i, i]));
        var u = lu.U;
        for (var i = 0; i < FreeCount; i++)
            if (!(Math.Abs(u[i, i]) > 1e-12 * diagonalScale)) return null;
        return -lu.Solve(StiffnessFP);
    }

    private static void AddTwoNode(Matrix<double> a, int i, int j, double value)
    {
        if (i == j) return; // both ends on one DOF (a link): no force
        a[i, i] += value;
        a[j, j] += value;
        a[i, j] -= value;
        a[j, i] -= value;
    }
}
