using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>Edits made by studies and absorber tuning keep a network's transducers and electrical nodes.</summary>
public class TransducerEditTests
{
    // A moving-coil velocity sensor read across a load: mass on a spring and damper on ground, its coil's branch from
    // the massless node 'coil' to ground, a load resistor from 'coil' to ground.
    private static Network Sensor() => new NetworkBuilder { Title = "sensor" }
        .AddMass("seismic", 0.02)
        .AddNode("coil")
        .AddSpring("suspension", Network.Ground, "seismic", 16)
        .AddDamper("open-circuit", Network.Ground, "seismic", 0.05)
        .AddDamper("load", "coil", Network.Ground, 1 / 4000.0)
        .AddTransducer("t", Network.Ground, "seismic", "coil", Network.Ground, 28)
        .MarkElectrical("coil")
        .Build();

    [Fact]
    public void EditingAnElementToItsOwnValue_LeavesTheAssembledSystemUnchanged()
    {
        // Identity: an edit to the same value must give the same network, so the same assembled matrices. Before this
        // was fixed, the edited copy lost its transducers: the coil's flux became a free coordinate of its own and the
        // sensor's electrical damping vanished from every study and tuned design of a transducer model.
        var original = Sensor();
        foreach (var edited in new[]
                 {
                     original.WithSpringStiffness("suspension", 16),
                     original.WithDamperCoefficient("load", 1 / 4000.0),
                     original.WithMassValue("seismic", 0.02),
                     original.WithAdded([], [], []),
                 })
        {
            Assert.Equal(original.Transducers, edited.Transducers);
            Assert.Equal(original.ElectricalNodes, edited.ElectricalNodes);
            Assert.True(edited.IsElectrical("coil"));
            Assert.False(edited.IsElectrical("seismic"));
            var a = Assembler.Assemble(original);
            var b = Assembler.Assemble(edited);
            Assert.Equal(a.Dofs.Dofs.Select(d => d.Node), b.Dofs.Dofs.Select(d => d.Node));
            NumericAssert.Close(a.DenseDamping(), b.DenseDamping(), Tolerance.Rel(0), "C");
            NumericAssert.Close(a.DenseStiffness(), b.DenseStiffness(), Tolerance.Rel(0), "K");
            NumericAssert.Close(a.DenseMass(), b.DenseMass(), Tolerance.Rel(0), "M");
        }
    }

    [Fact]
    public void ACircuitsAnalogueNetwork_MarksEveryCircuitNodeElectrical()
    {
        var circuit = new Circuit("rc", ["in", "out"],
            [new Resistor("r", "in", "out", 100)], [], [new Capacitor("c", "out", Circuit.Ground, 1e-6)],
            [new VoltageSource("v", "in", Circuit.Ground, 1, null)], []);
        var network = CircuitAnalogy.Of(circuit).ToNetwork();
        Assert.True(network.IsElectrical("in"));
        Assert.True(network.IsElectrical("out"));
        Assert.False(network.IsElectrical(Network.Ground));
    }
}
