using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Assembly;

/// <summary>Stiffness and discrete-damper matrices split into free DOFs (masses) and prescribed DOFs (supports).</summary>
/// <remarks>
/// Every support, ground included, is one prescribed DOF p; the equations of motion of the free DOFs f are
/// M ẍ_f + C_ff ẋ_f + K_ff x_f = F − M_fp ü_p − C_fp u̇_p − K_fp u_p, and the force the supports must supply is
/// r_p = M_pf ẍ_f + C_pf ẋ_f + K_pf x_f + M_pp ü_p + C_pp u̇_p + K_pp u_p (M_fp and M_pp from inerters with an end on a support). Ground has u = 0; a support carrying a base-motion load has its
/// prescribed motion. Every block is stored sparse (compressed rows), so the partition costs memory in proportion to
/// the springs and dampers, not to n²: a 100,000-mass grid is partitioned in a few tens of megabytes.
/// Reusable by every analysis that moves supports (harmonic, time stepping).
/// </remarks>
/// <param name="Free">Numbering of the free DOFs (one per mass in a line model; see <see cref="DofMap.For"/>).</param>
/// <param name="Supports">Names of the prescribed DOFs, ground first, in the network's support order (plane and 3d models: <c>support.x</c>, <c>support.z</c>, … per translation).</param>
/// <param name="Mass">M over the free DOFs in kg, inerters included (diagonal in line models without an inerter between two masses; a body's inertia may couple its rotations, and in plane and 3d models an inerter row couples the DOFs it reaches).</param>
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
    private readonly Matrix<double>? _massFP;
    private readonly Matrix<double>? _massPP;

    /// <summary>
    /// M_fp in kg (free rows, support columns): the inertial coupling of inerters with one end on a support. A support
    /// moving with acceleration ü_p loads the free DOFs by −M_fp ü_p. Zero (n × p) when no inerter reaches a support.
    /// </summary>
    public Matrix<double> MassFP
    {
        get => _massFP ?? Matrix<double>.Build.Sparse(FreeCount, SupportCount);
        init
        {
            _massFP = value;
            HasInertialCoupling = value is not null && value.EnumerateIndexed(Zeros.AllowSkip).Any(e => e.Item3 != 0);
        }
    }

    /// <summary>M_pp in kg: the inertance between supports and their own terminals (enters the support reactions only).</summary>
    public Matrix<double> MassPP
    {
        get => _massPP ?? Matrix<double>.Build.Sparse(SupportCount, SupportCount);
        init => _massPP = value;
    }

    /// <summary>True when an inerter joins a free DOF to a support's prescribed column (M_fp has a non-zero entry).</summary>
    public bool HasInertialCoupling { get; private init; }

    /// <summary>Number of free DOFs.</summary>
    public int FreeCount => Free.Count;

    /// <summary>Number of prescribed DOFs (supports, ground included).</summary>
    public int SupportCount => Supports.Length;

    /// <summary>Column of <paramref name="support"/> in the prescribed partition, or −1.</summary>
    public int SupportIndex(string support) => Supports.IndexOf(support);

    /// <summary>True when the network has a discrete damper that acts (both ends on different DOFs).</summary>
    public bool HasDampers => DamperFF.EnumerateIndexed(Zeros.AllowSkip).Any(e => e.Item3 != 0)
        || DamperFP.EnumerateIndexed(Zeros.AllowSkip).Any(e => e.Item3 != 0)
        || DamperPP.EnumerateIndexed(Zeros.AllowSkip).Any(e => e.Item3 != 0);

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
        var supportIndex = new Dictionary<string, int>(supports.Length);
        for (var s = 0; s < supports.Length; s++) supportIndex.TryAdd(supports[s], s);
        var n = free.Count;
        var p = supports.Length;
        // A node's place in the whole (free, then prescribed) numbering: free DOFs 0..n−1, supports n..n+p−1.
        int Index(string node)
        {
            var i = free.IndexOf(node);
            return i >= 0 ? i : n + supportIndex[node];
        }

        if (ConstraintElimination.Of(network) is { } elimination) return AssembleReduced(network, free, supports, Index, elimination);
        var k = new Blocks(n);
        foreach (var s in network.Springs) k.AddTwoNode(Index(s.NodeA), Index(s.NodeB), s.Stiffness);
        var c = new Blocks(n);
        foreach (var d in network.Dampers) c.AddTwoNode(Index(d.NodeA), Index(d.NodeB), d.Coefficient);
        var m = new Blocks(n);
        foreach (var mass in network.Masses)
        {
            var i = free.IndexOf(mass.Name);
            m.FF.Add((i, i, mass.Kilograms));
        }
        // An inerter adds its inertance to M as a spring adds its stiffness to K, support columns included: a moving
        // support then loads the free DOFs by −M_fp ü_p (the force b·ü_support of its grounded terminal).
        foreach (var b in network.Inerters) m.AddTwoNode(Index(b.NodeA), Index(b.NodeB), b.Inertance);

        return new SupportPartition(free, supports, Assembler.Summed(n, m.FF),
            Summed(n, n, k.FF), Summed(n, p, k.FP), Summed(p, p, k.PP),
            Summed(n, n, c.FF), Summed(n, p, c.FP), Summed(p, p, c.PP))
        {
            MassFP = Summed(n, p, m.FP),
            MassPP = Summed(p, p, m.PP),
        };
    }

    /// <summary>The partition with transducer constraints eliminated by congruence over the whole (free, then support) numbering.</summary>
    /// <remarks>
    /// Each element adds k (t_A − t_B)ᵀ(t_A − t_B) with t the rows of T over free and support columns, so a support in an
    /// eliminated node's terms lands in the FP and PP blocks. A mass on an eliminated node adds to M only its free block:
    /// its coupling to a support's acceleration is not kept (the reader refuses prescribed motion at such a support).
    /// </remarks>
    private static SupportPartition AssembleReduced(Network network, DofMap free, ImmutableArray<string> supports,
        Func<string, int> index, ConstraintElimination elimination)
    {
        var n = free.Count;
        var p = supports.Length;
        var k = new List<(int, int, double)>();
        foreach (var s in network.Springs) elimination.AddTwoEnd(k, index, s.NodeA, s.NodeB, s.Stiffness);
        var c = new List<(int, int, double)>();
        foreach (var d in network.Dampers) elimination.AddTwoEnd(c, index, d.NodeA, d.NodeB, d.Coefficient);
        var m = new List<(int, int, double)>();
        foreach (var mass in network.Masses) elimination.AddOneEnd(m, index, mass.Name, mass.Kilograms);
        foreach (var b in network.Inerters) elimination.AddTwoEnd(m, index, b.NodeA, b.NodeB, b.Inertance);
        static (List<(int, int, double)> FF, List<(int, int, double)> FP, List<(int, int, double)> PP) Split(List<(int, int, double)> all, int n)
        {
            var (ff, fp, pp) = (new List<(int, int, double)>(), new List<(int, int, double)>(), new List<(int, int, double)>());
            foreach (var (r, col, v) in all)
            {
                if (r < n && col < n) ff.Add((r, col, v));
                else if (r < n) fp.Add((r, col - n, v));
                else if (col >= n) pp.Add((r - n, col - n, v));
            }
            return (ff, fp, pp);
        }
        var (kff, kfp, kpp) = Split(k, n);
        var (cff, cfp, cpp) = Split(c, n);
        var (mff, _, _) = Split(m, n);
        return new SupportPartition(free, supports, Assembler.Summed(n, mff),
            Summed(n, n, kff), Summed(n, p, kfp), Summed(p, p, kpp),
            Summed(n, n, cff), Summed(n, p, cfp), Summed(p, p, cpp));
    }

    /// <summary>The quasi-static influence matrix T = −K_ff⁻¹ K_fp (free displacement per unit support displacement), or null when K_ff is singular.</summary>
    /// <remarks>
    /// x_s = T u is the displacement the free DOFs take when the supports move slowly (Chopra, Dynamics of Structures,
    /// §9.6 and §13.5 on multi-support excitation). For a single support holding the whole network T is a column of ones.
    /// Null when part of the network is not held by springs (rigid-body modes). K_ff is factorised sparse (LDLᵀ with the
    /// approximate minimum degree ordering), so T costs one factor and one solve per support column; T itself is dense
    /// n × p, small because supports are few.
    /// </remarks>
    public Matrix<double>? QuasiStaticInfluence()
    {
        if (FreeCount == 0) return Matrix<double>.Build.Dense(0, SupportCount);
        var n = FreeCount;
        var diagonalScale = 0.0;
        for (var i = 0; i < n; i++) diagonalScale = Math.Max(diagonalScale, Math.Abs(StiffnessFF[i, i]));
        if (!(diagonalScale > 0)) return null;
        SparseLdlt factor;
        try { factor = SparseLdlt.Factor(SymmetricSparseMatrix.From(StiffnessFF)); }
        catch (NumericalFailureException) { return null; }
        // K_ff of springs is positive semi-definite: a negative or tiny pivot means a part not held by any spring.
        if (factor.NegativePivots > 0 || factor.SmallestPivotMagnitude() <= 1e-12 * diagonalScale) return null;

        var t = Matrix<double>.Build.Dense(n, SupportCount);
        var column = new double[n];
        for (var s = 0; s < SupportCount; s++)
        {
            Array.Clear(column);
            var any = false;
            foreach (var (i, v) in StiffnessFP.Column(s).EnumerateIndexed(Zeros.AllowSkip))
            {
                column[i] = -v;
                any |= v != 0;
            }
            if (!any) continue;
            factor.Solve(column, column);
            for (var i = 0; i < n; i++) t[i, s] = column[i];
        }
        return t;
    }

    private static Matrix<double> Summed(int rows, int columns, List<(int Row, int Column, double Value)> entries)
    {
        var sums = new Dictionary<(int, int), double>(entries.Count);
        foreach (var (r, c, v) in entries) sums[(r, c)] = sums.GetValueOrDefault((r, c)) + v;
        return Matrix<double>.Build.SparseOfIndexed(rows, columns, sums.Select(kv => (kv.Key.Item1, kv.Key.Item2, kv.Value)));
    }

    /// <summary>Coordinate entries of the three blocks of a two-node element matrix over the whole numbering.</summary>
    private sealed class Blocks(int freeCount)
    {
        public List<(int, int, double)> FF { get; } = [];
        public List<(int, int, double)> FP { get; } = [];
        public List<(int, int, double)> PP { get; } = [];

        public void AddTwoNode(int i, int j, double value)
        {
            if (i == j) return; // both ends on one DOF (a link): no force
            Add(i, i, value);
            Add(j, j, value);
            Add(i, j, -value);
            Add(j, i, -value);
        }

        // K_pf = K_fpᵀ is not stored: only free rows with support columns go to FP.
        private void Add(int row, int column, double value)
        {
            if (row < freeCount && column < freeCount) FF.Add((row, column, value));
            else if (row < freeCount) FP.Add((row, column - freeCount, value));
            else if (column >= freeCount) PP.Add((row - freeCount, column - freeCount, value));
        }
    }
}
