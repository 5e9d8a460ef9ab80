using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Model;

/// <summary>Connectivity warnings: parts not held by any support, and masses that no spring touches.</summary>
public class TopologyTests
{
    [Fact]
    public void FullyGroundedChain_HasNoUnsupportedGroupsAndNoLooseMasses()
    {
        var network = TestNetworks.UniformChain(4, 10, 1e4, ChainEnds.FixedFree);
        Assert.Empty(Topology.UnsupportedGroups(network));
        Assert.Empty(Topology.MassesWithoutSpring(network));
    }

    [Fact]
    public void FreeFreeChain_IsOneUnsupportedGroupInDeclarationOrder()
    {
        var network = TestNetworks.UniformChain(3, 10, 1e4, ChainEnds.FreeFree);
        var group = Assert.Single(Topology.UnsupportedGroups(network));
        Assert.Equal(new[] { "m1", "m2", "m3" }, group);
    }

    [Fact]
    public void SeparateGroups_AreReportedEachOnce()
    {
        // deck on ground; {skid, motor} joined to each other only; {crate} touched by no spring; the damper on the crate
        // does not hold it, and a zero-stiffness spring does not either.
        var network = new NetworkBuilder()
            .AddMass("deck", 3200).AddMass("skid", 850).AddMass("crate", 40).AddMass("motor", 120)
            .AddSpring("columns", Network.Ground, "deck", 95e6)
            .AddSpring("mounts", "skid", "motor", 8e5)
            .AddSpring("slack", "deck", "crate", 0)
            .AddDamper("pad", Network.Ground, "crate", 500)
            .Build();
        var groups = Topology.UnsupportedGroups(network);
        Assert.Equal(2, groups.Length);
        Assert.Contains(groups, g => g.SequenceEqual(["skid", "motor"]));
        Assert.Contains(groups, g => g.SequenceEqual(["crate"]));
        Assert.Equal(new[] { "crate" }, Topology.MassesWithoutSpring(network));
    }

    [Fact]
    public void GroupHeldOnlyByASecondSupport_IsSupported()
    {
        var network = new NetworkBuilder().AddSupport("wall")
            .AddMass("shelf", 60).AddMass("box", 15)
            .AddSpring("bracket", "wall", "shelf", 2e5).AddSpring("feet", "shelf", "box", 5e4)
            .Build();
        Assert.Empty(Topology.UnsupportedGroups(network));
        Assert.Empty(Topology.MassesWithoutSpring(network));
    }

    [Fact]
    public void GroupJoinedToGroundThroughAnotherMass_IsSupported()
    {
        // a is held directly, c through b; d–e free, f has nothing.
        var network = new NetworkBuilder()
            .AddMass("a", 1).AddMass("b", 1).AddMass("c", 1).AddMass("d", 1).AddMass("e", 1).AddMass("f", 1)
            .AddSpring("ga", Network.Ground, "a", 1).AddSpring("ab", "b", "a", 1).AddSpring("bc", "c", "b", 1)
            .AddSpring("de", "e", "d", 1)
            .Build();
        var groups = Topology.UnsupportedGroups(network);
        Assert.Equal(2, groups.Length);
        Assert.Contains(groups, g => g.SequenceEqual(["d", "e"]));
        Assert.Contains(groups, g => g.SequenceEqual(["f"]));
        Assert.Equal(new[] { "f" }, Topology.MassesWithoutSpring(network));
    }
}
