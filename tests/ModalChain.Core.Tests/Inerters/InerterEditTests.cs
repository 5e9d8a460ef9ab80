using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Inerters;

/// <summary>The edits studies make to inerters and transducers: copies that change one value and keep everything else.</summary>
public class InerterEditTests
{
    /// <summary>A line model with every element list filled: masses, a link, springs, a damper, two inerters, a transducer and its electrical node.</summary>
    private static Network Line()
    {
        var b = new NetworkBuilder { Title = "line" }
            .AddMass("deck", 500).AddMass("frame", 200).AddMass("tuned", 25).AddMass("coil-node", 1e-3)
            .AddSpring("k", Network.Ground, "deck", 2e6).AddSpring("kt", "deck", "tuned", 4e4)
            .AddDamper("c", "deck", "tuned", 60)
            .AddInerter("grounded", "tuned", Network.Ground, 80).AddInerter("across", "deck", "tuned", 10)
            .AddTransducer("coil", "frame", Network.Ground, "coil-node", Network.Ground, 9)
            .MarkElectrical("coil-node");
        b.AddLink("bolted", "deck", "frame");
        return b.Build();
    }

    /// <summary>A 3d model: a body with a per-direction inerter (with a rotational component) and an axial one.</summary>
    private static Network Space()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddSupport(new Support("pit") { Location = new Point3(0, 0, -1) });
        b.AddBody(new RigidBody("skid", 900, new Point3(0, 0, 0), new InertiaMatrix(120, 150, 200), [new BodyPoint("foot", new Point3(0.5, 0.3, 0))]));
        b.AddSpring(new Spring("mount", "skid.foot", Network.Ground, 8e5) { Components = [new(Direction.X, 2e5), new(Direction.Y, 3e5), new(Direction.Z, 8e5)] });
        b.AddSpring(new Spring("pivot", "skid", Network.Ground, 0) { Components = [new(Direction.Rx, 4e4), new(Direction.Ry, 4e4), new(Direction.Rz, 5e4)] });
        b.AddInerter(new Inerter("brake", "skid", Network.Ground, 40) { Components = [new(Direction.X, 20), new(Direction.Z, 40), new(Direction.Rz, 6)] });
        b.AddInerter(new Inerter("strut", "skid", "pit", 15) { Axial = true });
        return b.Build();
    }

    private static void KeepsEverythingBut(Network original, Network edited)
    {
        Assert.Equal(original.Title, edited.Title);
        Assert.Equal(original.Space, edited.Space);
        // Element by element (ImmutableArray's own equality compares array references).
        Assert.Equal<Mass>(original.Masses, edited.Masses);
        Assert.Equal<Support>(original.Supports, edited.Supports);
        Assert.Equal<Spring>(original.Springs, edited.Springs);
        Assert.Equal<Damper>(original.Dampers, edited.Dampers);
        Assert.Equal<RigidBody>(original.Bodies, edited.Bodies);
        Assert.Equal(original.Links.Select(l => (l.Name, string.Join(",", l.Masses))), edited.Links.Select(l => (l.Name, string.Join(",", l.Masses))));
        Assert.Equal<string>(original.ElectricalNodes, edited.ElectricalNodes);
    }

    [Fact]
    public void InertanceEdit_ChangesThatInerterAlone_AndKeepsEveryOtherList()
    {
        var original = Line();
        var edited = original.WithInerterInertance("grounded", 120);
        KeepsEverythingBut(original, edited);
        Assert.Equal<Transducer>(original.Transducers, edited.Transducers);
        Assert.Equal(120, edited.Inerters.Single(i => i.Name == "grounded").Inertance);
        Assert.Equal(original.Inerters.Single(i => i.Name == "across"), edited.Inerters.Single(i => i.Name == "across"));
        Assert.Equal(original.Inerters.Select(i => i.Name), edited.Inerters.Select(i => i.Name)); // order kept
        Assert.Equal(80, original.Inerters.Single(i => i.Name == "grounded").Inertance);         // the original is untouched
    }

    [Fact]
    public void ForceFactorEdit_ChangesThatTransducerAlone_AndKeepsItsEndsAndBranch()
    {
        var original = Line();
        var edited = original.WithTransducerForceFactor("coil", 3.5);
        KeepsEverythingBut(original, edited);
        Assert.Equal<Inerter>(original.Inerters, edited.Inerters);
        Assert.Equal(original.Transducers[0] with { ForceFactor = 3.5 }, edited.Transducers[0]);
        Assert.True(edited.IsElectrical("coil-node"));
        Assert.Equal(9, original.Transducers[0].ForceFactor);
    }

    [Fact]
    public void InertanceScale_MultipliesEveryComponentByTheSameFactor()
    {
        // Identity (the springs' rule): the new scale over the old one multiplies each component, rotations included.
        var original = Space();
        var edited = original.WithInerterInertance("brake", 100);
        KeepsEverythingBut(original, edited);
        var brake = edited.Inerters.Single(i => i.Name == "brake");
        Assert.Equal(100, brake.Inertance);
        NumericAssert.Close(new[] { 50.0, 100.0, 15.0 }, brake.Components.Select(c => c.Value).ToArray(), Tolerance.Rel(1e-15), "components × 2.5");
        Assert.Equal(new[] { Direction.X, Direction.Z, Direction.Rz }, brake.Components.Select(c => c.Direction));
    }

    [Fact]
    public void OneComponent_IsSetAlone_AndTheScaleIsTheLargestTranslationAgain()
    {
        var original = Space();
        var raised = original.WithInerterComponent("brake", Direction.X, 70).Inerters.Single(i => i.Name == "brake");
        Assert.Equal(new DirectionalValue[] { new(Direction.X, 70), new(Direction.Z, 40), new(Direction.Rz, 6) }, raised.Components);
        Assert.Equal(70, raised.Inertance);
        var rotation = original.WithInerterComponent("brake", Direction.Rz, 500).Inerters.Single(i => i.Name == "brake");
        Assert.Equal(40, rotation.Inertance); // a rotational component never sets the scale
        var axial = original.WithInerterInertance("strut", 0).Inerters.Single(i => i.Name == "strut");
        Assert.True(axial.Axial);
        Assert.Equal(0, axial.Inertance);
    }

    [Fact]
    public void EditsThatNameNothingOrGoOutOfRange_AreRefused()
    {
        var line = Line();
        Assert.Contains("no inerter named 'flywheel'", Assert.Throws<ArgumentException>(() => line.WithInerterInertance("flywheel", 1)).Message);
        Assert.Contains("no transducer named 'k'", Assert.Throws<ArgumentException>(() => line.WithTransducerForceFactor("k", 1)).Message);
        Assert.ThrowsAny<ArgumentException>(() => line.WithInerterInertance("grounded", -1));
        Assert.ThrowsAny<ArgumentException>(() => line.WithTransducerForceFactor("coil", 0));
        var space = Space();
        Assert.Contains("no value in direction", Assert.Throws<ArgumentException>(() => space.WithInerterComponent("brake", Direction.Y, 5)).Message);
        var zeroScale = new NetworkBuilder { Space = ModelSpace.ThreeD };
        zeroScale.AddBody(new RigidBody("skid", 900, new Point3(0, 0, 0), new InertiaMatrix(120, 150, 200), []));
        zeroScale.AddSpring(new Spring("mount", "skid", Network.Ground, 8e5) { Components = [new(Direction.X, 8e5), new(Direction.Y, 8e5), new(Direction.Z, 8e5), new(Direction.Rx, 1e4), new(Direction.Ry, 1e4), new(Direction.Rz, 1e4)] });
        zeroScale.AddInerter(new Inerter("turn", "skid", Network.Ground, 0) { Components = [new(Direction.Rz, 6)] });
        var net = zeroScale.Build();
        Assert.Contains("no translational value above zero", Assert.Throws<ArgumentException>(() => net.WithInerterInertance("turn", 5)).Message);
    }
}
