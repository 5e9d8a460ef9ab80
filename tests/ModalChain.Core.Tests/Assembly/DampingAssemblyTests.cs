using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Assembly;

/// <summary>The damping matrix over free and support DOFs.</summary>
public class DampingAssemblyTests
{
    private static Matrix<double> Full(DampingMatrices c) =>
        Matrix<double>.Build.DenseOfMatrixArray(new[,] { { c.FF, c.FP }, { c.FP.Transpose(), c.PP } });

    [Fact]
    public void RigidMotionWithTheSupport_IsNotDamped()
    {
        // With one support holding the network, moving every node by the same amount stretches no damper, and modal and
        // mass-proportional damping act on motion relative to the quasi-static position (Chopra §13.5 [from memory]):
        // C_full · 1 = 0. Identity; tolerance 1e-9 of the largest entry of C. Seeded random networks, all damping kinds.
        for (var seed = 1; seed <= 10; seed++)
        {
            var network = HarmonicModels.Random(seed, 7, dampers: true);
            var model = new StructuralModel(network, new DampingModel([0.03], null, 0), []);
            var rayleigh = model with { Damping = new DampingModel([], new RayleighDamping(0.4, 0.002), 0) };
            foreach (var m in new[] { model, rayleigh })
            {
                var system = DampedSystem.Build(m);
                var full = Full(system.Damping);
                var ones = Vector<double>.Build.Dense(full.RowCount, 1.0);
                var scale = full.Enumerate().Max(Math.Abs);
                NumericAssert.Small((full * ones).AbsoluteMaximum(), 1e-9 * scale, $"seed {seed}: C·1");
                NumericAssert.Small((full - full.Transpose()).Enumerate().Max(Math.Abs), 1e-9 * scale, $"seed {seed}: symmetry");
            }
        }
    }

    [Fact]
    public void QuasiStaticInfluence_OfSingleSupport_IsOnes()
    {
        // T = −K_ff⁻¹K_fp is a column of ones when one support holds the whole network (rigid-body translation; identity). Tolerance 1e-12.
        var partition = SupportPartition.Assemble(HarmonicModels.Random(4, 9, dampers: false));
        var t = partition.QuasiStaticInfluence()!;
        for (var i = 0; i < t.RowCount; i++) NumericAssert.Close(1, t[i, 0], Tolerance.Abs(1e-12), $"T[{i}]");
    }

    [Fact]
    public void DiscreteDamperOnly_IsNotClassical_AndModalOnlyIs()
    {
        var network = new NetworkBuilder().AddMass("a", 10).AddMass("b", 2)
            .AddSpring("k1", Network.Ground, "a", 1e5).AddSpring("k2", "a", "b", 1e4).AddDamper("c", "a", "b", 50).Build();
        Assert.False(DampedSystem.Build(StructuralModel.Of(network)).IsClassical);
        var noDamper = new NetworkBuilder().AddMass("a", 10).AddMass("b", 2)
            .AddSpring("k1", Network.Ground, "a", 1e5).AddSpring("k2", "a", "b", 1e4).Build();
        Assert.True(DampedSystem.Build(new StructuralModel(noDamper, DampingModel.Modal(0.05), [])).IsClassical);
    }
}
