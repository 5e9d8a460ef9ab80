using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>The builder marks a transducer model's electrical side, so <see cref="Network.IsElectrical"/> answers for it.</summary>
public class ElectricalSideTests
{
    /// <summary>
    /// An invented floor test: a shaker (coil between the reaction mass and the bay, branch [coil, ground]) fed by the
    /// source support "amp" through a resistor, and a sensor (coil between its seismic mass and the bay) read across a
    /// load resistor to ground.
    /// </summary>
    internal static Network FloorTest(double shakerBl = 20, double sensorBl = 28) =>
        new NetworkBuilder { Title = "floor test" }
            .AddMass("bay", 6000).AddMass("reaction", 30).AddMass("seismic", 0.011)
            .AddMass("shaker-coil", 0).AddMass("sensor-coil", 0).AddMass("out", 0)
            .AddSupport("amp")
            .AddSpring("beams", Network.Ground, "bay", 1.5e7)
            .AddDamper("loss", Network.Ground, "bay", 1.2e4)
            .AddSpring("suspension", "bay", "reaction", 3e4)
            .AddSpring("sensor-spring", "bay", "seismic", 8.8)
            .AddDamper("sensor-loss", "bay", "seismic", 0.19)
            .AddDamper("shaker-r", "amp", "shaker-coil", 0.5)
            .AddDamper("sensor-r", "sensor-coil", "out", 1 / 375.0)
            .AddDamper("load-r", "out", Network.Ground, 1e-4)
            .AddTransducer("shaker", "reaction", "bay", "shaker-coil", Network.Ground, shakerBl)
            .AddTransducer("sensor", "seismic", "bay", "sensor-coil", Network.Ground, sensorBl)
            .Build();

    [Fact]
    public void BranchTerminalsAndTheNodesJoinedToThemByElements_AreElectrical()
    {
        // Definition (docs/model-format.md, "transducers"): the branch terminals and every node joined to them by an
        // element, a source support included; ground is shared and the mechanical terminals are never reached.
        var network = FloorTest();
        Assert.Equal(["shaker-coil", "sensor-coil", "out", "amp"], network.ElectricalNodes.ToArray());
        foreach (var mechanical in new[] { "bay", "reaction", "seismic", Network.Ground })
            Assert.False(network.IsElectrical(mechanical), mechanical);
    }

    [Fact]
    public void ANetworkWithoutTransducers_HasNoElectricalNodes()
    {
        var network = new NetworkBuilder().AddMass("m", 1).AddSpring("k", Network.Ground, "m", 1).Build();
        Assert.Empty(network.ElectricalNodes);
    }
}
