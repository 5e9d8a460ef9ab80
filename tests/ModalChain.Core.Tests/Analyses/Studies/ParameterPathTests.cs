using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Dofs;
using ModalChain.Core.Units;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Analyses.Studies;

public class ParameterPathTests
{
    private static readonly Network Net = new NetworkBuilder().AddMass("deck", 3200).AddMass("skid.frame", 850)
        .AddSpring("columns", Network.Ground, "deck", 95e6).AddSpring("mounts", "deck", "skid.frame", 8.4e6)
        .AddDamper("loss", "deck", "skid.frame", 1500).Build();

    [Theory]
    [InlineData("springs.columns.stiffness", ParameterKind.Stiffness, "columns", 95e6)]
    [InlineData("masses.skid.frame.mass", ParameterKind.Mass, "skid.frame", 850.0)]
    [InlineData("dampers.loss.coefficient", ParameterKind.DamperCoefficient, "loss", 1500.0)]
    public void ValidPaths_ResolveAndApply(string text, ParameterKind kind, string element, double value)
    {
        var path = ParameterPath.Resolve(text, Net, out var error);
        Assert.Null(error);
        Assert.Equal(new ParameterPath(kind, element), path);
        Assert.Equal(text, path!.Text);
        Assert.Equal(value, path.Get(Net));
        var changed = path.Apply(Net, 2 * value);
        Assert.Equal(2 * value, path.Get(changed));
        Assert.Equal(value, path.Get(Net)); // the original is unchanged
    }

    [Theory]
    [InlineData("springs.roof.stiffness", "no entry 'roof' under 'springs'")]
    [InlineData("masses.deck.at", "not a numeric field")]
    [InlineData("springs.columns.between", "not a numeric field")]
    [InlineData("springs.columns.stifness", "no field 'stifness'")]
    [InlineData("loads.fan.speed", "not a section")]
    [InlineData("springs.columns", "not a parameter path")]
    [InlineData("", "not a parameter path")]
    public void BadPaths_SayWhatIsWrong(string text, string expected)
    {
        Assert.Null(ParameterPath.Resolve(text, Net, out var error));
        Assert.Contains(expected, error);
    }
}

/// <summary>Paths on a 3d model: a spring per direction and in rotation, an axial spring, a damper, a body.</summary>
public class SpatialParameterPathTests
{
    private static readonly Network Net = Build();

    private static Network Build()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddSupport(new Support("wall") { Location = new Point3(-1, 0, 1) });
        b.AddBody(new RigidBody("skid", 900, new Point3(0, 0, 0.5), new InertiaMatrix(120, 150, 200),
            [new BodyPoint("foot", new Point3(0.6, 0.4, 0)), new BodyPoint("top", new Point3(0, 0, 1))]));
        b.AddSpring(new Spring("mount", "skid.foot", Network.Ground, 8e5)
        {
            Components = [new(Direction.X, 2e5), new(Direction.Y, 3e5), new(Direction.Z, 8e5), new(Direction.Rx, 4e4)],
        });
        b.AddSpring(new Spring("pivot", "skid", Network.Ground, 0) { Components = [new(Direction.Rz, 5e4)] });
        b.AddSpring(new Spring("tie", "skid.top", "wall", 1.2e5) { Axial = true });
        b.AddDamper(new Damper("pad", "skid.foot", Network.Ground, 900) { Components = [new(Direction.Z, 900), new(Direction.Ry, 40)] });
        return b.Build();
    }

    [Theory]
    [InlineData("springs.mount.stiffness", 8e5, Quantity.Stiffness)]
    [InlineData("springs.mount.stiffness.y", 3e5, Quantity.Stiffness)]
    [InlineData("springs.mount.rotational-stiffness.rx", 4e4, Quantity.RotationalStiffness)]
    [InlineData("springs.tie.axial", 1.2e5, Quantity.Stiffness)]
    [InlineData("springs.tie.stiffness", 1.2e5, Quantity.Stiffness)]
    [InlineData("dampers.pad.coefficient.z", 900.0, Quantity.Damping)]
    [InlineData("dampers.pad.rotational-coefficient.ry", 40.0, Quantity.RotationalDamping)]
    [InlineData("bodies.skid.mass", 900.0, Quantity.Mass)]
    public void ValidPaths_ResolveReadAndApply(string text, double value, Quantity quantity)
    {
        var path = ParameterPath.Resolve(text, Net, out var error);
        Assert.Null(error);
        Assert.Equal(text, path!.Text);
        Assert.Equal(quantity, path.Quantity);
        Assert.Equal(value, path.Get(Net));
        var changed = path.Apply(Net, 3 * value);
        Assert.Equal(3 * value, path.Get(changed), 9);
        Assert.Equal(value, path.Get(Net)); // the original is unchanged
    }

    [Fact]
    public void OneDirection_ChangesOnlyThatDirection()
    {
        var changed = ParameterPath.Resolve("springs.mount.stiffness.z", Net, out _)!.Apply(Net, 1e5);
        var mount = changed.Springs.Single(s => s.Name == "mount");
        Assert.Equal(new DirectionalValue[] { new(Direction.X, 2e5), new(Direction.Y, 3e5), new(Direction.Z, 1e5), new(Direction.Rx, 4e4) }, mount.Components);
        Assert.Equal(3e5, mount.Stiffness); // the scale follows: now the y value is the largest translation
        Assert.Equal(Net.Springs.Where(s => s.Name != "mount"), changed.Springs.Where(s => s.Name != "mount"));
    }

    [Fact]
    public void WholeSpring_ScalesEveryComponentRotationsIncluded()
    {
        var changed = ParameterPath.Resolve("springs.mount.stiffness", Net, out _)!.Apply(Net, 4e5);
        var mount = changed.Springs.Single(s => s.Name == "mount");
        Assert.Equal(new DirectionalValue[] { new(Direction.X, 1e5), new(Direction.Y, 1.5e5), new(Direction.Z, 4e5), new(Direction.Rx, 2e4) }, mount.Components);
        Assert.Equal(4e5, mount.Stiffness);
    }

    [Fact]
    public void BodyMass_KeepsTheInertiaAndCentre()
    {
        var changed = ParameterPath.Resolve("bodies.skid.mass", Net, out _)!.Apply(Net, 1200);
        Assert.Equal(Net.Bodies[0] with { Kilograms = 1200 }, changed.Bodies[0]);
    }

    [Theory]
    [InlineData("springs.mount.stiffness.w", "'w' is not a translation")]
    [InlineData("springs.mount.stiffness.rx", "'rx' is not a translation")]
    [InlineData("springs.mount.rotational-stiffness.z", "'z' is not a rotation")]
    [InlineData("springs.mount.rotational-stiffness.ry", "has no rotational-stiffness in 'ry'")]
    [InlineData("springs.mount.axial", "is not axial")]
    [InlineData("springs.tie.stiffness.x", "is axial")]
    [InlineData("springs.pivot.stiffness", "no translational stiffness above zero")]
    [InlineData("springs.mount.between", "not a numeric field")]
    [InlineData("springs.mount.damping", "springs have no field 'damping'")]
    [InlineData("dampers.pad.coefficient.x", "has no coefficient in 'x'")]
    [InlineData("bodies.crate.mass", "no entry 'crate' under 'bodies' (it has: skid)")]
    [InlineData("bodies.skid.inertia", "not a numeric field")]
    [InlineData("masses.skid.mass", "the model has no masses")]
    public void BadPaths_SayWhatIsWrongAndWhatExists(string text, string expected)
    {
        Assert.Null(ParameterPath.Resolve(text, Net, out var error));
        Assert.Contains(expected, error);
    }

    [Fact]
    public void BadDirectionPath_ListsTheSpringsFields()
    {
        ParameterPath.Resolve("springs.mount.stiffness.w", Net, out var error);
        Assert.Contains("springs.mount.stiffness (every direction in proportion), springs.mount.stiffness.x, springs.mount.stiffness.y, springs.mount.stiffness.z, springs.mount.rotational-stiffness.rx", error);
    }

    [Fact]
    public void LineModels_HaveNoBodies()
    {
        var line = new NetworkBuilder().AddMass("deck", 100).AddSpring("k", Network.Ground, "deck", 1e5).Build();
        Assert.Null(ParameterPath.Resolve("bodies.deck.mass", line, out var error));
        Assert.Contains("a line model has no bodies", error);
        Assert.Null(ParameterPath.Resolve("springs.k.stiffness.z", line, out error));
        Assert.Contains("springs have no field 'stiffness.z'", error);
    }
}
