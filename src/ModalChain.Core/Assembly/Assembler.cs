using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>Builds M, K and C from a network.</summary>
/// <remarks>
/// A two-node element of value k between DOFs a and b adds k to K[a,a] and K[b,b] and −k to K[a,b] and K[b,a];
/// an end on a support drops its row and column (the support is fixed). Dampers build C the same way. Masses tied by
/// a link share one DOF, so their masses add and an element between two of them adds nothing.
/// </remarks>
public static class Assembler
{
    /// <summary>Assembles the matrices of <paramref name="network"/> with one DOF per mass.</summary>
    public static StructuralMatrices Assemble(Network network) => Assemble(network, DofMap.ForScalarNetwork(network));

    /// <summary>Assembles the matrices of <paramref name="network"/> over the DOFs of <paramref name="dofs"/>.</summary>
    public static StructuralMatrices Assemble(Network network, DofMap dofs)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(dofs);
        var n = dofs.Count;

        var mass = new List<(int, int, double)>(n);
        foreach (var m in network.Masses)
        {
            var i = dofs.IndexOf(m.Name);
            mass.Add((i, i, m.Kilograms));
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
            Vector<double>.Build.Dense(n, 1.0),
            MassIsDiagonal: true);
    }

    /// <summary>A sparse n×n matrix whose entries are the sums of the coordinate entries (several elements share a DOF).</summary>
    internal static Matrix<double> Summed(int n, List<(int Row, int Column, double Value)> entries)
    {
        var sums = new Dictionary<(int, int), double>(entries.Count);
        foreach (var (r, c, v) in entries)
            sums[(r, c)] = sums.GetValueOrDefault((r, c)) + v;
        return Matrix<double>.Build.SparseOfIndexed(n, n, sums.Select(kv => (kv.Key.Item1, kv.Key.Item2, kv.Value)));
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
