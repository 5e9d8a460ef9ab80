using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Inerters;

/// <summary>'inerters' in plane and 3d models: the springs' vocabulary (per direction, rotational, axial) and located errors.</summary>
public class SpatialInerterReaderTests
{
    // Lines 1–13; the tests add lines from 14.
    private static readonly string[] Skid =
    [
        "space: 3d",
        "masses:",
        "  deck: {mass: 2600 kg, at: [0, 0, 0], directions: [z]}",
        "supports:",
        "  floor: {at: [1.5, 0, -0.5]}",
        "bodies:",
        "  skid:",
        "    mass: 1850 kg",
        "    centre-of-mass: [0, 0, 0.6]",
        "    box: [2.4 m, 1.2 m, 1.1 m]",
        "    points: {foot-1: [1.1, 0.55, 0.1], foot-2: [-1.1, -0.55, 0.1]}",
        "springs:",
        "  mount: {between: [skid, ground], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}, rotational-stiffness: {rx: 900 kN*m/rad, ry: 900 kN*m/rad, rz: 900 kN*m/rad}}",
    ];

    private static LoadResult ReadSkid(params string[] more) => Read([.. Skid, "  deck-beams: {between: [ground, deck], stiffness: {z: 48 kN/mm}}", "inerters:", .. more]);

    // Line numbers of the inerters: Skid has 13 lines, then deck-beams (14) and 'inerters:' (15).
    private const int First = 16;

    [Fact]
    public void PerDirectionRotationalAndAxialInerters_ReadInSi()
    {
        var result = ReadSkid(
            "  yaw-damper: {between: [skid.foot-1, floor], inertance: {x: 0.15 t, y: 150 kg}, rotational-inertance: {rz: 12 kg*m^2}}",
            "  strut: {between: [skid.foot-2, floor], axial: 80 kg}",
            "  coupler: {between: [deck, skid], inertance: {z: 40 kg}}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var inerters = result.Model!.Network.Inerters;
        Assert.Equal(["yaw-damper", "strut", "coupler"], inerters.Select(i => i.Name));
        var yaw = inerters[0];
        Assert.Equal(("skid.foot-1", "floor"), (yaw.NodeA, yaw.NodeB));
        Assert.Equal([new DirectionalValue(Direction.X, 150), new DirectionalValue(Direction.Y, 150), new DirectionalValue(Direction.Rz, 12)], yaw.Components.ToArray());
        Assert.Equal(150, yaw.Inertance); // the largest translational component (t = 1000 kg, unit conversion)
        Assert.True(inerters[1].Axial);
        Assert.Equal(80, inerters[1].Inertance);
        Assert.Equal([new DirectionalValue(Direction.Z, 40)], inerters[2].Components.ToArray());
    }

    [Fact]
    public void APlaneModelInerter_IsRead()
    {
        var result = Read(
            "space: plane",
            "masses:",
            "  deck: {mass: 2600 kg, at: [0, 0]}",
            "springs:",
            "  columns: {between: [ground, deck], stiffness: {x: 20 kN/mm, z: 48 kN/mm}}",
            "inerters:",
            "  grounded: {between: [deck, ground], inertance: {z: 150 kg}}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        Assert.Equal([new DirectionalValue(Direction.Z, 150)], Assert.Single(result.Model!.Network.Inerters).Components.ToArray());
    }

    [Fact]
    public void AnUnknownEnd_IsLocated_WithTheNearestName()
    {
        const string line = "  b: {between: [dekc, floor], inertance: {z: 40 kg}}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "dekc"), "inerter 'b' refers to unknown node 'dekc' (did you mean 'deck'?)");
    }

    [Fact]
    public void AnUnknownBodyPoint_IsLocated()
    {
        const string line = "  b: {between: [skid.foot-3, floor], axial: 40 kg}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "skid.foot-3"), "inerter 'b' refers to 'skid.foot-3', but body 'skid' has no point 'foot-3'");
    }

    [Fact]
    public void ANegativeInertance_IsLocated()
    {
        const string line = "  b: {between: [deck, floor], inertance: {z: -40 kg}}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "-40 kg"), "'z' of 'inertance' of inerter 'b'");
    }

    [Fact]
    public void ANegativeAxialInertance_IsLocated()
    {
        const string line = "  b: {between: [skid.foot-1, floor], axial: -3 kg}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "-3 kg"), "'axial' of inerter 'b'");
    }

    [Fact]
    public void AnInerterFromASupportToItself_IsLocated()
    {
        const string line = "  b: {between: [floor, floor], inertance: {z: 40 kg}}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "[floor"), "inerter 'b' connects 'floor' to itself; its two ends must differ");
    }

    [Fact]
    public void AnInerterBetweenTwoSupports_IsLocated()
    {
        const string line = "  b: {between: [floor, ground], inertance: {z: 40 kg}}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "[floor"), "inerter 'b' joins two supports ('floor' and 'ground'), which do not move: it would carry no force");
    }

    [Fact]
    public void ARotationalInertanceAtAPointMass_IsLocated()
    {
        const string line = "  b: {between: [deck, skid], rotational-inertance: {ry: 5 kg*m^2}}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "ry"), "inerter 'b' has a rotational component 'ry', but its end mass 'deck' is a point mass");
    }

    [Fact]
    public void AScalarInertance_AsksForDirectionsOrAxial()
    {
        const string line = "  b: {between: [deck, floor], inertance: 40 kg}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "40 kg"), "'inertance' of inerter 'b' is given per direction in a 3d model", "'axial: ...'");
    }

    [Fact]
    public void AnAxialInerterToGround_HasNoLineToTake()
    {
        const string line = "  b: {between: [skid.foot-1, ground], axial: 40 kg}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "[skid"), "inerter 'b' is axial, but 'ground' has no location");
    }

    [Fact]
    public void ADirectionTheEndsDoNotMoveIn_IsLocated()
    {
        const string line = "  b: {between: [deck, floor], inertance: {x: 40 kg}}";
        SingleError(ReadSkid(line), First, ColumnOf(line, "x:"), "inerter 'b' acts in 'x', but neither mass 'deck'");
    }

    [Fact]
    public void BaseMotionOfASupportCarryingAnInerter_IsAccepted()
    {
        // It was refused before the support partition carried M_fp; harmonic and timed support motion now load the
        // free DOFs by the inerter's terminal (see the Core tests of base motion with inerters).
        var result = Read(
            "masses:",
            "  deck: 3200 kg",
            "supports:",
            "  floor:",
            "springs:",
            "  columns: {between: [floor, deck], stiffness: 95 kN/mm}",
            "inerters:",
            "  grounded: {between: [deck, floor], inertance: 150 kg}",
            "loads:",
            "  shake: {kind: base-motion, support: floor, acceleration: 0.1 g}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
    }
}
