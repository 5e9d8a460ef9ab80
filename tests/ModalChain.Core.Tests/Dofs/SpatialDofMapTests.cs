using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Dofs;

/// <summary>The DOF map of plane and 3d models: masses with their translations, then bodies with every direction.</summary>
public class SpatialDofMapTests
{
    private static Network Mixed(ModelSpace space)
    {
        var b = new NetworkBuilder { Space = space };
        b.AddMass(new Mass("deck", 500) { Location = new Point3(0, 0, 0) });
        b.AddMass(new Mass("pump", 80) { Location = new Point3(1, 0, 0), Moves = [Direction.Z] });
        b.AddBody(new RigidBody("skid", 900, new Point3(0, 0, 1), new InertiaMatrix(100, 120, 150), [new BodyPoint("foot", new Point3(0, 0, 0.5))]));
        b.AddSupport(new Support("wall") { Location = new Point3(5, 0, 0) });
        return b.Build();
    }

    [Fact]
    public void ThreeD_NumbersMassTranslationsThenBodyDirections()
    {
        var map = DofMap.For(Mixed(ModelSpace.ThreeD));
        Assert.Equal(["deck.x", "deck.y", "deck.z", "pump", "skid.x", "skid.y", "skid.z", "skid.rx", "skid.ry", "skid.rz"],
            map.Dofs.Select(d => d.ToString()));
        Assert.Equal(ModelSpace.ThreeD, map.Space);
        Assert.Equal(3, map.IndexOf("pump", Direction.Z));
        Assert.Equal(-1, map.IndexOf("pump", Direction.X));
        Assert.Equal(-1, map.IndexOf("pump"));
        Assert.Equal(9, map.IndexOf("skid", Direction.Rz));
        Assert.Equal(-1, map.IndexOf("wall", Direction.X));
        Assert.Equal(-1, map.IndexOf(Network.Ground, Direction.Z));
        Assert.Equal("skid.rx", map.Label(7));
    }

    [Fact]
    public void Plane_UsesXZAndRy()
    {
        var map = DofMap.For(Mixed(ModelSpace.Plane));
        Assert.Equal(["deck.x", "deck.z", "pump", "skid.x", "skid.z", "skid.ry"], map.Dofs.Select(d => d.ToString()));
        Assert.Equal(-1, map.IndexOf("skid", Direction.Y));
        Assert.Equal(-1, map.IndexOf("skid", Direction.Rz));
    }

    [Fact]
    public void Line_IsTheScalarMap()
    {
        var network = new NetworkBuilder().AddMass("a", 1).AddMass("b", 2).AddMass("c", 3).AddLink("ab", "a", "b").Build();
        Assert.Equal(DofMap.ForScalarNetwork(network).Dofs.ToArray(), DofMap.For(network).Dofs.ToArray());
        Assert.Equal(["a+b", "c"], DofMap.For(network).Dofs.Select(d => d.ToString()));
    }

    [Fact]
    public void DofEquality_IgnoresTheLabel()
    {
        Assert.Equal(new Dof("skid", Direction.Rz), new Dof("skid", Direction.Rz) { Label = "skid.rz" });
    }

    [Fact]
    public void MassMovingInADirectionTheSpaceLacks_IsRefused()
    {
        var b = new NetworkBuilder { Space = ModelSpace.Plane };
        b.AddMass(new Mass("m", 1) { Location = new Point3(0, 0, 0), Moves = [Direction.Y] });
        Assert.Throws<ArgumentException>(() => DofMap.For(b.Build()));
    }

    [Fact]
    public void LinksInASpatialModel_AreRefused()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("a", 1) { Location = new Point3(0, 0, 0) }).AddMass(new Mass("b", 1) { Location = new Point3(0, 0, 0) }).AddLink("tie", "a", "b");
        Assert.Throws<ArgumentException>(() => DofMap.For(b.Build()));
    }

    [Fact]
    public void MovesInAnyOrder_AreNumberedXYZ()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", 1) { Location = new Point3(0, 0, 0), Moves = ImmutableArray.Create(Direction.Z, Direction.X) });
        Assert.Equal(["m.x", "m.z"], DofMap.For(b.Build()).Dofs.Select(d => d.ToString()));
    }
}
