using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Storage;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Assembly;

/// <summary>The free/support partition is stored sparse and equals the element-by-element dense assembly.</summary>
public class SupportPartitionTests
{
    /// <summary>The whole (free + support) matrix of two-node elements, assembled densely entry by entry: the reference.</summary>
    private static Matrix<double> DenseWhole(Network network, IEnumerable<(string A, string B, double Value)> elements)
    {
        var free = ModalChain.Core.Dofs.DofMap.ForScalarNetwork(network);
        var supports = network.Supports.Select(s => s.Name).ToList();
        var n = free.Count;
        int Index(string node) => free.IndexOf(node) is var i and >= 0 ? i : n + supports.IndexOf(node);
        var a = Matrix<double>.Build.Dense(n + supports.Count, n + supports.Count);
        foreach (var (nodeA, nodeB, value) in elements)
        {
            var (i, j) = (Index(nodeA), Index(nodeB));
            if (i == j) continue;
            a[i, i] += value;
            a[j, j] += value;
            a[i, j] -= value;
            a[j, i] -= value;
        }
        return a;
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(5)]
    [InlineData(8)]
    public void EveryBlock_EqualsTheDenseAssembly(int seed)
    {
        // Identity: the sparse blocks are the dense element assembly's sub-matrices (stiffness method, common practice).
        // Seeded random networks with a second support, dampers and free groups. Tolerance 1e-12 relative to each block.
        var network = TestNetworks.Random(new Random(seed), 25);
        var partition = SupportPartition.Assemble(network);
        var n = partition.FreeCount;
        var p = partition.SupportCount;
        var k = DenseWhole(network, network.Springs.Select(s => (s.NodeA, s.NodeB, s.Stiffness)));
        var c = DenseWhole(network, network.Dampers.Select(d => (d.NodeA, d.NodeB, d.Coefficient)));
        var scaleK = k.Enumerate().Max(Math.Abs);
        var scaleC = Math.Max(c.Enumerate().Max(Math.Abs), 1);
        NumericAssert.Close(k.SubMatrix(0, n, 0, n), partition.StiffnessFF, Tolerance.Abs(1e-12 * scaleK), "K_ff");
        NumericAssert.Close(k.SubMatrix(0, n, n, p), partition.StiffnessFP, Tolerance.Abs(1e-12 * scaleK), "K_fp");
        NumericAssert.Close(k.SubMatrix(n, p, n, p), partition.StiffnessPP, Tolerance.Abs(1e-12 * scaleK), "K_pp");
        NumericAssert.Close(c.SubMatrix(0, n, 0, n), partition.DamperFF, Tolerance.Abs(1e-12 * scaleC), "C_ff");
        NumericAssert.Close(c.SubMatrix(0, n, n, p), partition.DamperFP, Tolerance.Abs(1e-12 * scaleC), "C_fp");
        NumericAssert.Close(c.SubMatrix(n, p, n, p), partition.DamperPP, Tolerance.Abs(1e-12 * scaleC), "C_pp");
        foreach (var mass in network.Masses)
            NumericAssert.Close(mass.Kilograms, partition.Mass[partition.Free.IndexOf(mass.Name), partition.Free.IndexOf(mass.Name)],
                Tolerance.Rel(1e-15), $"M of {mass.Name}");
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(5)]
    [InlineData(8)]
    public void QuasiStaticInfluence_SolvesKffTEqualsMinusKfp_OrIsNullForAFreeGroup(int seed)
    {
        // Identity: K_ff T + K_fp = 0 (Chopra, Dynamics of Structures, §9.6 [from memory]) to 1e-9 of ‖K_fp‖ per column,
        // and no T when the topology leaves a group of masses on no spring to a support (K_ff singular).
        var network = TestNetworks.Random(new Random(seed), 25);
        var partition = SupportPartition.Assemble(network);
        var t = partition.QuasiStaticInfluence();
        var free = Topology.UnsupportedGroups(network).Length;
        if (free > 0)
        {
            Assert.Null(t);
            return;
        }
        Assert.NotNull(t);
        var residual = partition.StiffnessFF * t + partition.StiffnessFP;
        for (var s = 0; s < partition.SupportCount; s++)
            NumericAssert.Small(residual.Column(s).AbsoluteMaximum(), 1e-9 * Math.Max(partition.StiffnessFP.Column(s).AbsoluteMaximum(), 1), $"column {s}");
    }

    [Fact]
    public void QuasiStaticInfluence_IsNullWhenAMassHangsOnADamperOnly()
    {
        // A mass held by no spring: K_ff has a zero row, so no quasi-static position exists (rigid-body mode, common practice).
        var network = new NetworkBuilder().AddMass("a", 10).AddMass("b", 3)
            .AddSpring("k", Network.Ground, "a", 1e5).AddDamper("c", "a", "b", 40).Build();
        Assert.Null(SupportPartition.Assemble(network).QuasiStaticInfluence());
    }

    [Fact]
    public void LargeGrid_IsPartitionedAndDampedWithoutADenseMatrix()
    {
        // 10,000 masses: every free-DOF matrix of the damped system stays sparse (a dense n×n would be 800 MB each), the
        // stored entries are those of the 5-point stencil (5 per interior row), and with no damping the modal damping
        // block covers the 20 modes reported only. Structural check; the ratios are η/2 = 0 exactly.
        const int rows = 100, columns = 100;
        var network = TestNetworks.FixedEdgeGrid(rows, columns, 45, 1.2e7);
        var model = StructuralModel.Of(network);
        var modes = ModalAnalysis.Solve(network, new ModalOptions(Count: 20));
        var system = DampedSystem.Build(model, modes);
        Assert.IsType<SparseCompressedRowMatrixStorage<double>>(system.Partition.StiffnessFF.Storage);
        Assert.IsType<SparseCompressedRowMatrixStorage<double>>(system.Partition.Mass.Storage);
        Assert.IsType<SparseCompressedRowMatrixStorage<double>>(system.Damping.FF.Storage);
        Assert.Equal(rows * columns + 4 * rows * columns - 2 * (rows + columns) + 0L,
            system.Partition.StiffnessFF.EnumerateIndexed(Zeros.AllowSkip).LongCount());
        Assert.Equal(20, system.ModalDamping.RowCount);
        Assert.All(system.ModalDampingRatios, z => Assert.Equal(0.0, z));
        Assert.False(system.HasViscousDamping);
    }

    [Fact]
    public void RayleighDampingOnALargeGrid_IsSparseAndClassical()
    {
        // C = a0 M + a1 K stays sparse on a 40 × 50 grid; its modal matrix over the lowest 10 modes is diagonal with
        // Ĉ_jj = a0 + a1 ω_j² (Rayleigh 1877; Chopra §11.4 [from memory]), tolerance 1e-9 relative.
        var network = TestNetworks.FixedEdgeGrid(40, 50, 45, 1.2e7);
        var model = StructuralModel.Of(network) with { Damping = new DampingModel([], new RayleighDamping(0.5, 1e-4), 0) };
        var system = DampedSystem.Build(model, ModalAnalysis.Solve(network, new ModalOptions(Count: 10)));
        Assert.IsType<SparseCompressedRowMatrixStorage<double>>(system.Damping.FF.Storage);
        Assert.True(system.IsClassical);
        for (var j = 0; j < 10; j++)
        {
            var w2 = system.Modes.Modes[j].EigenValue;
            NumericAssert.Close(0.5 + 1e-4 * w2, system.ModalDamping[j, j], Tolerance.Rel(1e-9), $"Ĉ[{j},{j}]");
        }
    }
}
