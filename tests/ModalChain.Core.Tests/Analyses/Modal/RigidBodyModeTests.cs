using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// Parts of a network that no spring holds move as rigid bodies: 0 Hz modes that carry their part's whole mass
/// (issue 2, §4 and §6; a free body has a zero eigenvalue, common practice).
/// </summary>
public class RigidBodyModeTests
{
    [Fact]
    public void FreeFreeChain_HasExactlyOneRigidBodyModeCarryingTheFullMass()
    {
        // Unequal masses so that the uniform rigid shape is not an accident of symmetry. Tolerance 1e-12 relative.
        double[] masses = [120, 45, 300, 80, 15];
        var b = new NetworkBuilder();
        for (var i = 0; i < masses.Length; i++) b.AddMass($"m{i}", masses[i]);
        for (var i = 1; i < masses.Length; i++) b.AddSpring($"s{i}", $"m{i - 1}", $"m{i}", 1e5 * i);
        var result = ModalAnalysis.Solve(b.Build());

        Assert.Equal(1, result.RigidBodyModeCount);
        var rigid = result.Modes[0];
        Assert.True(rigid.IsRigidBody);
        Assert.Equal(0.0, rigid.EigenValue);
        Assert.Equal(0.0, rigid.AngularFrequency);
        Assert.Equal(0.0, rigid.NaturalFrequencyHz);
        Assert.Equal(double.PositiveInfinity, rigid.PeriodSeconds);
        Assert.All(rigid.StrainEnergyShare, s => Assert.Equal(0.0, s));
        var total = masses.Sum();
        NumericAssert.Close(total, rigid.EffectiveModalMass, Tolerance.Rel(1e-12), "M* of the rigid-body mode");
        NumericAssert.Close(1.0, rigid.EffectiveMassFraction, Tolerance.Rel(1e-12), "fraction of the rigid-body mode");
        // Mass-normalised rigid translation: every entry 1/√(Σm).
        NumericAssert.Close(Enumerable.Repeat(1 / Math.Sqrt(total), masses.Length).ToArray(), rigid.Shape, Tolerance.Rel(1e-12), "rigid shape");
        foreach (var elastic in result.Modes.Skip(1))
        {
            Assert.False(elastic.IsRigidBody);
            Assert.True(elastic.PeriodSeconds > 0 && double.IsFinite(elastic.PeriodSeconds));
            NumericAssert.Small(elastic.EffectiveModalMass, 1e-12 * total, $"M* of elastic mode {elastic.Number}");
        }
    }

    [Fact]
    public void TwoDisconnectedFreeGroups_HaveTwoRigidBodyModes()
    {
        // Groups {a1, a2} and {b1, b2, b3}, no support: two zero eigenvalues whose effective masses add to the total.
        var network = new NetworkBuilder()
            .AddMass("a1", 10).AddMass("b1", 7).AddMass("a2", 30).AddMass("b2", 2).AddMass("b3", 5)
            .AddSpring("a", "a1", "a2", 4e4)
            .AddSpring("b12", "b1", "b2", 1e4).AddSpring("b23", "b2", "b3", 2e4)
            .Build();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(2, result.RigidBodyModeCount);
        Assert.True(result.Modes[0].IsRigidBody && result.Modes[1].IsRigidBody);
        Assert.All(result.Modes.Skip(2), m => Assert.False(m.IsRigidBody));
        Assert.All(result.Modes.Take(2), m => Assert.Equal(double.PositiveInfinity, m.PeriodSeconds));
        NumericAssert.Close(54.0, result.Modes.Take(2).Sum(m => m.EffectiveModalMass), Tolerance.Rel(1e-12), "Σ M* of the rigid-body modes");
        Assert.Equal(2, Topology.UnsupportedGroups(network).Length);
    }

    [Fact]
    public void FreeGroupBesideAHeldGroup_HasOneRigidBodyModeCarryingTheFreeGroupsMass()
    {
        // The rigid mode is ι_free/√m_free, so Γ = √m_free and M* = m_free = 12 kg. Tolerance 1e-12 relative.
        var network = new NetworkBuilder()
            .AddMass("held", 100).AddSpring("column", Network.Ground, "held", 1e6)
            .AddMass("f1", 4).AddMass("f2", 8).AddSpring("link", "f1", "f2", 5e3)
            .Build();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(1, result.RigidBodyModeCount);
        var rigid = Assert.Single(result.Modes, m => m.IsRigidBody);
        NumericAssert.Close(12.0, rigid.EffectiveModalMass, Tolerance.Rel(1e-12), "M* of the free group's rigid mode");
        NumericAssert.Close(0.0, rigid.Shape[0], Tolerance.Abs(1e-12), "held mass in the rigid mode");
        NumericAssert.Close(1e6 / 100, result.Modes.Single(m => m.Shape[0] > 0.05).EigenValue, Tolerance.Rel(1e-12), "ω² of the held mass");
    }

    [Fact]
    public void MassWithoutAnySpring_IsARigidBodyMode()
    {
        var network = new NetworkBuilder().AddMass("loose", 7).Build();
        var result = ModalAnalysis.Solve(network);
        var mode = Assert.Single(result.Modes);
        Assert.True(mode.IsRigidBody);
        Assert.Equal(double.PositiveInfinity, mode.PeriodSeconds);
        Assert.Empty(mode.StrainEnergyShare);
        NumericAssert.Close(7.0, mode.EffectiveModalMass, Tolerance.Rel(1e-14), "M*");
    }
}
