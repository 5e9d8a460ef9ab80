using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// Where each mode lives: kinetic-energy share per mass m_i φ_i² and strain-energy share per spring k (φ_a − φ_b)² / Σ,
/// checked on systems whose shapes are known in closed form (energy of a linear spring ½ k δ², common practice).
/// </summary>
public class EnergyShareTests
{
    [Fact]
    public void SymmetricTwoMassThreeSpring_SharesMatchHandValues()
    {
        // m1 = m2, k1 = k2 = k3 (REFERENCES.md §1 case D [common practice]). In-phase mode {1, 1}: the middle spring
        // is not stretched, the outer ones share equally → {½, 0, ½}. Out-of-phase {1, −1}: elongations 1, 2, 1 →
        // {1/6, 2/3, 1/6}. Kinetic energy splits ½, ½ in both. Tolerance 1e-12.
        const double m = 30, k = 9e4;
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(m, m, k, k, k));
        Assert.Equal(["k1", "k2", "k3"], result.Network.Springs.Select(s => s.Name));
        NumericAssert.Close(new[] { 0.5, 0.0, 0.5 }, result.Modes[0].StrainEnergyShare, Tolerance.Abs(1e-12), "mode 1 strain shares");
        NumericAssert.Close(new[] { 1.0 / 6, 2.0 / 3, 1.0 / 6 }, result.Modes[1].StrainEnergyShare, Tolerance.Abs(1e-12), "mode 2 strain shares");
        NumericAssert.Close(new[] { 0.5, 0.5 }, result.Modes[0].KineticEnergyShare, Tolerance.Abs(1e-12), "mode 1 kinetic shares");
        NumericAssert.Close(new[] { 0.5, 0.5 }, result.Modes[1].KineticEnergyShare, Tolerance.Abs(1e-12), "mode 2 kinetic shares");
    }

    [Fact]
    public void TwoStoreyShearFrame_SharesMatchHandValues()
    {
        // Case E of REFERENCES.md §1 (m1 = 2m, m2 = m, k1 = 2k, k2 = k; Chopra, Dynamics of Structures, ch. 10;
        // values recomputed; attribution from memory). φ1 = {½, 1}: kinetic 2·¼ : 1 = ⅓ : ⅔; storey drifts ½, ½ store
        // 2k·¼ : k·¼ = ⅔ : ⅓. φ2 = {−1, 1}: kinetic 2 : 1 = ⅔ : ⅓; drifts −1, −2 store 2k : 4k = ⅓ : ⅔. Tolerance 1e-12.
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(2, 1, 2, 1, 0));
        NumericAssert.Close(new[] { 1.0 / 3, 2.0 / 3 }, result.Modes[0].KineticEnergyShare, Tolerance.Abs(1e-12), "mode 1 kinetic shares");
        NumericAssert.Close(new[] { 2.0 / 3, 1.0 / 3 }, result.Modes[0].StrainEnergyShare, Tolerance.Abs(1e-12), "mode 1 strain shares");
        NumericAssert.Close(new[] { 2.0 / 3, 1.0 / 3 }, result.Modes[1].KineticEnergyShare, Tolerance.Abs(1e-12), "mode 2 kinetic shares");
        NumericAssert.Close(new[] { 1.0 / 3, 2.0 / 3 }, result.Modes[1].StrainEnergyShare, Tolerance.Abs(1e-12), "mode 2 strain shares");
    }

    [Fact]
    public void SpringOfZeroStiffness_HoldsNoEnergy()
    {
        var network = new NetworkBuilder().AddMass("a", 2).AddMass("b", 3)
            .AddSpring("ga", Network.Ground, "a", 1e4).AddSpring("ab", "a", "b", 2e4).AddSpring("idle", "a", "b", 0)
            .Build();
        var result = ModalAnalysis.Solve(network);
        Assert.All(result.Modes, m => Assert.Equal(0.0, m.StrainEnergyShare[2]));
    }
}
