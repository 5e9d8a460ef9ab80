using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Model;

/// <summary>The immutable network and its builder: references between elements, renumbering, caller errors.</summary>
public class NetworkTests
{
    [Fact]
    public void Builder_KeepsDeclarationOrderAndGroundFirst()
    {
        var network = new NetworkBuilder { Title = "deck and skid" }.AddSupport("wall")
            .AddMass("deck", 3200).AddMass("skid", 850)
            .AddSpring("columns", Network.Ground, "deck", 95e6).AddSpring("mounts", "deck", "skid", 8.4e6)
            .AddDamper("loss", "deck", "skid", 1.5e3)
            .Build();
        Assert.Equal("deck and skid", network.Title);
        Assert.Equal(["deck", "skid"], network.Masses.Select(m => m.Name));
        Assert.Equal([Network.Ground, "wall"], network.Supports.Select(s => s.Name));
        Assert.Equal(["columns", "mounts"], network.Springs.Select(s => s.Name));
        Assert.Equal(4050.0, network.TotalMass);
        Assert.True(network.IsSupport("wall"));
        Assert.True(network.IsMass("skid"));
        Assert.False(network.IsMass(Network.Ground));
    }

    [Fact]
    public void WithMassOrder_PermutesOnlyTheMasses()
    {
        var network = TestNetworks.UniformChain(3, 10, 1e4, ChainEnds.FixedFree);
        var renumbered = network.WithMassOrder([2, 0, 1]);
        Assert.Equal(["m3", "m1", "m2"], renumbered.Masses.Select(m => m.Name));
        Assert.Equal(network.Springs, renumbered.Springs);
        Assert.Equal(["m1", "m2", "m3"], network.Masses.Select(m => m.Name));
        Assert.Throws<ArgumentException>(() => network.WithMassOrder([0, 0, 1]));
        Assert.Throws<ArgumentException>(() => network.WithMassOrder([0, 1]));
    }

    [Fact]
    public void Builder_RejectsCallerErrorsWithArgumentExceptions()
    {
        var b = new NetworkBuilder().AddMass("a", 1);
        Assert.Throws<ArgumentException>(() => b.AddMass("a", 2));
        Assert.Throws<ArgumentException>(() => b.AddMass(Network.Ground, 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddMass("b", -1));
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddMass("b", double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddSpring("k", Network.Ground, "a", -1));
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddSpring("k", Network.Ground, "a", double.PositiveInfinity));
        Assert.Throws<ArgumentException>(() => b.AddSpring("k", "a", "a", 1));
        Assert.Throws<ArgumentException>(() => b.AddSpring("k", "a", "nowhere", 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddDamper("c", Network.Ground, "a", -1));
        b.AddSpring("k", Network.Ground, "a", 1);
        Assert.Throws<ArgumentException>(() => b.AddSpring("k", Network.Ground, "a", 1));
    }
}
