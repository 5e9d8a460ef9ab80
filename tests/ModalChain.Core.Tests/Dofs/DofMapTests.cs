using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Dofs;

/// <summary>The map from (node, direction) to matrix index.</summary>
public class DofMapTests
{
    [Fact]
    public void ScalarNetwork_NumbersMassesInDeclarationOrder()
    {
        var network = new NetworkBuilder().AddSupport("wall")
            .AddMass("zeta", 1).AddMass("alpha", 2).AddMass("mid", 3)
            .AddSpring("k", "wall", "mid", 1).Build();
        var map = DofMap.ForScalarNetwork(network);
        Assert.Equal(3, map.Count);
        Assert.Equal(["zeta", "alpha", "mid"], map.Dofs.Select(d => d.Node));
        Assert.All(map.Dofs, d => Assert.Equal(Direction.Along, d.Direction));
        Assert.Equal(0, map.IndexOf("zeta"));
        Assert.Equal(1, map.IndexOf("alpha"));
        Assert.Equal(2, map.IndexOf("mid", Direction.Along));
    }

    [Fact]
    public void Supports_AreNotNumbered()
    {
        var network = new NetworkBuilder().AddSupport("wall").AddMass("m", 1).Build();
        var map = DofMap.ForScalarNetwork(network);
        Assert.Equal(-1, map.IndexOf(Network.Ground));
        Assert.Equal(-1, map.IndexOf("wall"));
        Assert.Equal(-1, map.IndexOf("not-a-node"));
    }

    [Fact]
    public void ScalarDof_PrintsAsItsNodeName()
    {
        Assert.Equal("deck", new Dof("deck", Direction.Along).ToString());
    }
}
