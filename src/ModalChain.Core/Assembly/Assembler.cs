using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>Builds M, K and C from a network.</summary>
/// <remarks>
/// A two-node element of value k between DOFs a and b adds k to K[a,a] and K[b,b] and −k to K[a,b] and K[b,a];
/// an end on a support drops its row and column (the support is fixed). Dampers build C the same way, and inerters
/// (inertance b) build their part of M the same way, so an inerter between two masses makes M non-diagonal. Masses tied by
/// a link share one DOF, so their masses add and an element between two of them adds nothing. Plane and 3d models
/// (several directions per node, rigid bodies, directional and axial elements) go through the attachment maps of
/// <see cref="SpatialAssembly"/>: each element end's motion is a linear map T of the DOFs and an element adds Tᵀ k T.
/// </remarks>
public static class Assembler
{
    /// <summary>Assembles the matrices of <paramref name="network"/> over <see cref="DofMap.For"/> (one DOF per mass in a line model).</summary>
    public static StructuralMatrices Assemble(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return Assemble(network, DofMap.For(network));
    }

    /// <summary>
    /// Assembles a plane or 3d <paramref name="network"/> with the rotational influence vectors about
    /// <paramref name="referencePoint"/> (m; the model's centre of mass when null). A line model ignores the point.
    /// </summary>
    /// <exception cref="ArgumentException">
    /// Bad spatial input the reader should have caught: a rotational component at a point-mass end, a zero-length
    /// axial element, an inertia matrix that is not positive definite, a mass without a location, links.
    /// </exception>
    public static StructuralMatrices Assemble(Network network, Point3? referencePoint)
    {
        ArgumentNullException.ThrowIfNull(network);
        var dofs = DofMap.For(network);
        return network.Space == ModelSpace.Line ? Assemble(network, dofs) : SpatialAssembly.Assemble(network, dofs, referencePoint);
    }

    /// <summary>Assembles the matrices of <paramref name="network"/> over the DOFs of <paramref name="dofs"/>.</summary>
    public static StructuralMatrices Assemble(Network network, DofMap dofs)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(dofs);
        if (network.Space != ModelSpace.Line) return SpatialAssembly.Assemble(network, dofs, referencePoint: null);
        var n = dofs.Count;

        var elimination = ConstraintElimination.Of(network);
        if (elimination is not null) return AssembleReduced(network, dofs, elimination);
        var mass = new List<(int, int, double)>(n);
        foreach (var m in network.Masses)
        {
            var i = dofs.IndexOf(m.Name);
            mass.Add((i, i, m.Kilograms));
        }
        var coupled = false;
        foreach (var b in network.Inerters)
        {
            int ia = dofs.IndexOf(b.NodeA), ib = dofs.IndexOf(b.NodeB);
            AddTwoNode(mass, ia, ib, b.Inertance);
            coupled |= ia >= 0 && ib >= 0 && ia != ib && b.Inertance > 0;
        }

        var stiffness = new List<(int, int, double)>(4 * network.Springs.Length);
        foreach (var s in network.Springs) AddTwoNode(stiffness, dofs.IndexOf(s.NodeA), dofs.IndexOf(s.NodeB), s.Stiffness);

        var damping = new List<(int, int, double)>(4 * network.Dampers.Length);
        foreach (var d in network.Dampers) AddTwoNode(damping, dofs.IndexOf(d.NodeA), dofs.IndexOf(d.NodeB), d.Coefficient);

        return new StructuralMatrices(
            dofs,
            Summed(n, mass),
            Summed(n, stiffness),
            Summed(n, damping),
            LineInfluence(network, dofs),
            MassIsDiagonal: !coupled);
    }

    /// <summary>The line matrices with transducer constraints eliminated by congruence: TᵀMT, TᵀKT, TᵀCT (<see cref="ConstraintElimination"/>).</summary>
    private static StructuralMatrices AssembleReduced(Network network, DofMap dofs, ConstraintElimination elimination)
    {
        var n = dofs.Count;
        int Index(string node) => dofs.IndexOf(node);
        var mass = new List<(int, int, double)>(n);
        foreach (var x in network.Masses) elimination.AddOneEnd(mass, Index, x.Name, x.Kilograms);
        foreach (var b in network.Inerters) elimination.AddTwoEnd(mass, Index, b.NodeA, b.NodeB, b.Inertance);
        var stiffness = new List<(int, int, double)>(4 * network.Springs.Length);
        foreach (var s in network.Springs) elimination.AddTwoEnd(stiffness, Index, s.NodeA, s.NodeB, s.Stiffness);
        var damping = new List<(int, int, double)>(4 * network.Dampers.Length);
        foreach (var d in network.Dampers) elimination.AddTwoEnd(damping, Index, d.NodeA, d.NodeB, d.Coefficient);
        var summedMass = Summed(n, mass);
        // The influence vector is a unit motion of every mechanical coordinate: the transducer constraints leave the
        // flux linkages unchanged under a rigid motion (x_a − x_b = 0), so it is 0 at the electrical ones.
        return new StructuralMatrices(dofs, summedMass, Summed(n, stiffness), Summed(n, damping), LineInfluence(network, dofs),
            // The flexibility refinement reads springs as two-node edges, which an eliminated end is not: keep it out.
            MassIsDiagonal: IsDiagonal(summedMass) && !elimination.TouchesSpring(network));
    }

    /// <summary>
    /// The rigid-body influence vector ι of a line model: 1 at every mechanical DOF and 0 at an electrical node's (a flux
    /// linkage, which a rigid motion of the structure and its supports leaves unchanged), so effective modal masses,
    /// participation factors and the total mass ιᵀMι count no capacitance.
    /// </summary>
    internal static Vector<double> LineInfluence(Network network, DofMap dofs)
    {
        var iota = Vector<double>.Build.Dense(dofs.Count, 1.0);
        if (network.ElectricalNodes.IsEmpty) return iota;
        for (var i = 0; i < dofs.Count; i++)
            if (network.IsElectrical(dofs.Dofs[i].Node)) iota[i] = 0;
        return iota;
    }

    /// <summary>True when <paramref name="m"/> has no non-zero entry off its diagonal (lumped masses; no inerter between two masses).</summary>
    internal static bool IsDiagonal(Matrix<double> m)
    {
        foreach (var (i, j, v) in m.EnumerateIndexed(Zeros.AllowSkip))
            if (i != j && v != 0) return false;
        return true;
    }

    /// <summary>A sparse n×n matrix whose entries are the sums of the coordinate entries (several elements share a DOF).</summary>
    /// <remarks>
    /// Built directly in compressed-row form in linear time: the entries are bucketed by row in their given order,
    /// each row (a handful of entries) is ordered by column with a stable insertion sort, and equal positions are
    /// added in the order given. A sum that is exactly zero is not stored.
    /// </remarks>
    internal static Matrix<double> Summed(int n, List<(int Row, int Column, double Value)> entries)
    {
        var rowStart = new int[n + 1];
        foreach (var (r, _, _) in entries) rowStart[r + 1]++;
        for (var i = 0; i < n; i++) rowStart[i + 1] += rowStart[i];
        var columns = new int[entries.Count];
        var values = new double[entries.Count];
        var next = (int[])rowStart.Clone();
        foreach (var (r, c, v) in entries)
        {
            var k = next[r]++;
            (columns[k], values[k]) = (c, v);
        }

        var rowPointers = new int[n + 1];
        var count = 0;
        for (var i = 0; i < n; i++)
        {
            var (start, end) = (rowStart[i], rowStart[i + 1]);
            for (var k = start + 1; k < end; k++)
            {
                var (c, v) = (columns[k], values[k]);
                var j = k - 1;
                for (; j >= start && columns[j] > c; j--) (columns[j + 1], values[j + 1]) = (columns[j], values[j]);
                (columns[j + 1], values[j + 1]) = (c, v);
            }
            for (var k = start; k < end;)
            {
                var (c, sum) = (columns[k], values[k]);
                for (k++; k < end && columns[k] == c; k++) sum += values[k];
                if (sum != 0) (columns[count], values[count++]) = (c, sum);
            }
            rowPointers[i + 1] = count;
        }
        return Matrix<double>.Build.SparseFromCompressedSparseRowFormat(n, n, count, rowPointers, columns, values);
    }

    /// <summary>Adds a two-node element of value <paramref name="value"/> between DOFs a and b (−1 = support) as coordinate entries.</summary>
    internal static void AddTwoNode(List<(int, int, double)> entries, int a, int b, double value)
    {
        if (a == b) return; // both ends on one DOF (a link): the element carries no force
        if (a >= 0) entries.Add((a, a, value));
        if (b >= 0) entries.Add((b, b, value));
        if (a >= 0 && b >= 0)
        {
            entries.Add((a, b, -value));
            entries.Add((b, a, -value));
        }
    }
}
