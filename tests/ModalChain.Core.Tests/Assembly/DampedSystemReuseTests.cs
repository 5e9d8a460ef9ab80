using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Assembly;

/// <summary>A damped system built around modes already solved equals one that solves them itself, and a few modes give the leading block.</summary>
public class DampedSystemReuseTests
{
    private static StructuralModel Damped(int seed, int size, bool rayleigh) =>
        StructuralModel.Of(TestNetworks.Random(new Random(seed), size)) is var model && rayleigh
            ? model with { Damping = model.Damping with { Rayleigh = new RayleighDamping(0.3, 2e-4) } }
            : model;

    [Theory]
    [InlineData(4, false)]
    [InlineData(9, true)]
    public void ReusedModes_GiveTheSameRatiosAndCoupling(int seed, bool rayleigh)
    {
        // Identity: Φᵀ C Φ does not depend on who solved Φ. Tolerance 1e-12 absolute on ζ, 1e-10 on the index.
        var model = Damped(seed, 24, rayleigh);
        var own = DampedSystem.Build(model);
        var reused = DampedSystem.Build(model, ModalAnalysis.Solve(model.Network));
        NumericAssert.Close(own.ModalDampingRatios.Select(Finite).ToArray(), reused.ModalDampingRatios.Select(Finite).ToArray(), Tolerance.Abs(1e-12), "ζ");
        NumericAssert.Close(own.NonClassicalIndex, reused.NonClassicalIndex, Tolerance.Abs(1e-10), "coupling index");
    }

    [Fact]
    public void LowestModes_GiveTheLeadingBlockOfTheModalDampingMatrix()
    {
        // (Φ_mᵀ C Φ_m) is the leading m×m block of Φᵀ C Φ (block identity). Tolerance 1e-9 relative to the largest entry.
        var model = Damped(12, 30, rayleigh: true);
        var all = DampedSystem.Build(model);
        var few = DampedSystem.Build(model, new ModalOptions(Count: 8));
        Assert.Equal(8, few.Modes.Modes.Length);
        var scale = all.ModalDamping.Enumerate().Max(Math.Abs);
        for (var i = 0; i < 8; i++)
            for (var j = 0; j < 8; j++)
                NumericAssert.Close(all.ModalDamping[i, j], few.ModalDamping[i, j], Tolerance.Abs(1e-9 * scale), $"Ĉ[{i},{j}]");
    }

    [Fact]
    public void NoViscousDamping_GivesAZeroModalDampingMatrixAndZeroRatios()
    {
        var network = TestNetworks.UniformChain(6, 2, 1e4, ChainEnds.FixedFree);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        Assert.All(system.ModalDamping.Enumerate(), v => Assert.Equal(0.0, v));
        Assert.All(system.ModalDampingRatios, z => Assert.Equal(0.0, z));
        Assert.True(system.IsClassical);
    }

    private static double Finite(double z) => double.IsNaN(z) ? -1 : z;
}
