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

    [Fact]
    public void ModalRatioList_OnAFreeNetwork_StartsAtTheLowestElasticMode()
    {
        // Two free groups ({b, c} and {d, e}, tied to no support) have two 0 Hz rigid-body modes, counted from the
        // topology; the ratios 1, 2, 3, 4 % go to the three elastic modes in ascending order (1, 2, 3 %), the
        // rigid-body modes take none (common practice: a rigid-body mode has no damping ratio). With modal damping
        // alone Φᵀ C Φ = diag(2ζ_jω_j) (identity of the assembly), so ζ_j = Ĉ_jj/(2ω_j) recovers the ratio; tolerance 1e-10.
        var network = new NetworkBuilder().AddMass("a", 10).AddMass("b", 4).AddMass("c", 6).AddMass("d", 3).AddMass("e", 5)
            .AddSpring("ka", Network.Ground, "a", 4e4)    // 10 Hz
            .AddSpring("kbc", "b", "c", 2e5)              // free pair
            .AddSpring("kde", "d", "e", 1e3)              // free pair, lowest elastic mode
            .Build();
        var model = new StructuralModel(network, new DampingModel([0.01, 0.02, 0.03, 0.04], null, 0), []);
        var system = DampedSystem.Build(model);
        Assert.Equal(2, Topology.UnsupportedGroups(network).Length);
        var ratios = system.ModalDampingRatios;
        Assert.True(double.IsNaN(ratios[0]) && double.IsNaN(ratios[1]), "rigid-body modes have no ratio");
        NumericAssert.Close(0.01, ratios[2], Tolerance.Abs(1e-10), "lowest elastic mode");
        NumericAssert.Close(0.02, ratios[3], Tolerance.Abs(1e-10), "second elastic mode");
        NumericAssert.Close(0.03, ratios[4], Tolerance.Abs(1e-10), "third elastic mode");
        for (var j = 0; j < 2; j++)
            NumericAssert.Small(system.ModalDamping.Row(j).AbsoluteMaximum(), 1e-9 * system.ModalDamping.Enumerate().Max(Math.Abs), $"rigid-body mode {j + 1} is not damped");
    }

    [Fact]
    public void ModalRatioList_OnAFreeFreePair_DampsTheElasticModeByTheFirstEntry()
    {
        // m–k–m with no support: one rigid-body mode and one elastic mode at ω² = 2k/m (closed form, common
        // practice). The list [2 %, 5 %] puts 2 % on the elastic mode: Ĉ_22 = 2ζω. Tolerance 1e-10 relative.
        const double m = 5, k = 2e4;
        var network = new NetworkBuilder().AddMass("p", m).AddMass("q", m).AddSpring("k", "p", "q", k).Build();
        var system = DampedSystem.Build(new StructuralModel(network, new DampingModel([0.02, 0.05], null, 0), []));
        NumericAssert.Close(2 * 0.02 * Math.Sqrt(2 * k / m), system.ModalDamping[1, 1], Tolerance.Rel(1e-10), "2ζω of the elastic mode");
    }
}
