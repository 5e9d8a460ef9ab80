using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>Modal figures of a transducer model: no capacitance in the masses, no flux-level roots, no warnings about circuit nodes.</summary>
public class ElectricalModalFiguresTests
{
    /// <summary>
    /// A sensor whose coil drives, through R, a node "out" with a capacitance C to ground and an inductor L to ground;
    /// C is made large (0.5 F) so that counting it as a mass would show.
    /// </summary>
    private static Network SensorWithTank(double m = 2, double c = 0.5) =>
        new NetworkBuilder { Title = "sensor with a tank" }
            .AddMass("seismic", m).AddMass("coil", 0).AddMass("out", c)
            .AddSpring("k", Network.Ground, "seismic", 8e3)
            .AddDamper("loss", Network.Ground, "seismic", 5)
            .AddDamper("r", "coil", "out", 1 / 50.0)
            .AddSpring("l", "out", Network.Ground, 1 / 0.2)
            .AddTransducer("t", "seismic", Network.Ground, "coil", Network.Ground, 3)
            .Build();

    [Fact]
    public void EffectiveMasses_SumToTheMechanicalMass_AndCountNoCapacitance()
    {
        // Identity (completeness of mass-normalised modes): Σ over every mode of M* = ιᵀMι, with ι the rigid motion of
        // the structure, which leaves every flux linkage unchanged (ι = 0 at electrical nodes). So Σ M* = 2 kg, the
        // seismic mass, not 2.5 (1e-10 relative); the network's physical total mass is 2 kg too (exact), and the
        // electrical node's participation is 0 in every mode's Γ (ι has no entry there).
        var network = SensorWithTank();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(2, network.TotalMass);
        NumericAssert.Close(2, result.TotalMass, Tolerance.Rel(1e-12), "ιᵀMι");
        NumericAssert.Close(2, result.Modes.Sum(x => x.EffectiveModalMass), Tolerance.Rel(1e-10), "Σ M*");
        NumericAssert.Close(1, result.Modes[^1].CumulativeEffectiveMassFraction, Tolerance.Rel(1e-10), "cumulative fraction");
        var iota = Assembler.Assemble(network).Influence;
        var dofs = Assembler.Assemble(network).Dofs;
        Assert.Equal(0, iota[dofs.IndexOf("out")]);
        Assert.Equal(1, iota[dofs.IndexOf("seismic")]);
    }

    [Fact]
    public void ACircuitNodeHeldByNoInductor_SetsAFluxLevelThatIsNoRoot_AndIsNotWarnedAbout()
    {
        // Closed form: a node joined only through resistors has the equation G·(λ̇_out − ...) = 0, in which λ_out itself
        // never appears: one root at 0 that only fixes a constant flux level. The floor test's "out" is such a node:
        // Topology counts one flux level and the complex roots keep the three mechanical modes (oscillatory) and no zero
        // root; the undamped modes carry no "held by no spring" warning for it.
        var network = ElectricalSideTests.FloorTest();
        Assert.Equal(1, Topology.FluxLevelCount(network));
        Assert.Equal(["out"], Assert.Single(Topology.FluxLevelGroups(network)).ToArray());
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var roots = ComplexModes.Solve(system);
        Assert.DoesNotContain(roots, r => r.Kind == ComplexModeKind.RigidBody);
        Assert.Equal(3, roots.Count(r => r.IsOscillatory));
        Assert.Equal(Enumerable.Range(1, roots.Length), roots.Select(r => r.Number));
        Assert.DoesNotContain(system.Modes.Warnings, w => w.Contains("'out'", StringComparison.Ordinal));
        // A circuit node held to ground by an inductor sets no flux level.
        Assert.Equal(0, Topology.FluxLevelCount(SensorWithTank()));
    }
}
