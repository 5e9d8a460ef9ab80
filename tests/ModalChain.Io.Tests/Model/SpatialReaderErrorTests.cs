using ModalChain.Io.Model;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>Located errors of plane and 3d models: each one problem, at its line and column, with an actionable message.</summary>
public class SpatialReaderErrorTests
{
    // Lines 1–12; the tests add lines from 13.
    private static readonly string[] Skid =
    [
        "space: 3d",
        "masses:",
        "  deck: {mass: 2600 kg, at: [0, 0, 0], directions: [z]}",
        "bodies:",
        "  skid:",
        "    mass: 1850 kg",
        "    centre-of-mass: [0, 0, 0.6]",
        "    box: [2.4 m, 1.2 m, 1.1 m]",
        "    points: {foot-1: [1.1, 0.55, 0.1], foot-2: [-1.1, -0.55, 0.1]}",
        "springs:",
        "  deck-beams: {between: [ground, deck], stiffness: {z: 48 kN/mm}}",
        "  mount-1: {between: [skid.foot-1, deck], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}}",
    ];

    private static LoadResult ReadSkid(params string[] more) => Read([.. Skid, .. more]);

    private static LoadResult ReadBody(string inertiaLine) => Read(
        "space: 3d",
        "bodies:",
        "  skid:",
        "    mass: 1850 kg",
        "    centre-of-mass: [0, 0, 0.6]",
        inertiaLine,
        "springs:",
        "  mount: {between: [skid, ground], stiffness: {x: 1 kN/mm, y: 1 kN/mm, z: 1 kN/mm}, rotational-stiffness: {rx: 1, ry: 1, rz: 1}}");

    [Fact]
    public void TheBaseModel_IsValid()
    {
        var result = ReadSkid();
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
    }

    [Fact]
    public void APointThatIsNotOnTheBody_IsLocated_WithTheNearestPoint()
    {
        const string line = "  mount-2: {between: [skid.foot-9, deck], stiffness: {z: 2.6 kN/mm}}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "skid.foot-9"),
            "spring 'mount-2' refers to 'skid.foot-9', but body 'skid' has no point 'foot-9' (did you mean 'foot-1'?); its points are foot-1, foot-2");
    }

    [Fact]
    public void AnInertiaThatIsNotPositiveDefinite_IsLocated()
    {
        // Eigenvalues of [[100, 150, 0], [150, 100, 0], [0, 0, 100]] are -50, 100, 250.
        const string line = "    inertia: {xx: 100 kg*m^2, yy: 100 kg*m^2, zz: 100 kg*m^2, xy: 150 kg*m^2}";
        SingleError(ReadBody(line), 6, ColumnOf(line, "{"), "'inertia' of body 'skid' is not positive definite (principal moments -50, 100, 250 kg*m^2)");
    }

    [Fact]
    public void PrincipalMomentsBreakingTheTriangleInequality_AreLocated()
    {
        // Each principal moment of a real body is at most the sum of the other two (I_z = ∫(x² + y²) dm ≤ I_x + I_y;
        // Landau & Lifshitz, Mechanics, §32, from memory).
        const string line = "    inertia: {xx: 100 kg*m^2, yy: 100 kg*m^2, zz: 300 kg*m^2}";
        SingleError(ReadBody(line), 6, ColumnOf(line, "{"), "principal moments 100, 100, 300 kg*m^2: the largest exceeds the sum of the other two");
        const string principal = "    principal-inertia: {values: [100, 100, 300], axes: [[1, 0, 0], [0, 1, 0], [0, 0, 1]]}";
        SingleError(ReadBody(principal), 6, ColumnOf(principal, "{"), "the largest exceeds the sum of the other two");
    }

    [Fact]
    public void PrincipalAxesThatAreNotPerpendicular_AreLocated()
    {
        const string line = "    principal-inertia: {values: [100, 120, 150], axes: [[1, 0, 0], [1, 1, 0], [0, 0, 1]]}";
        SingleError(ReadBody(line), 6, ColumnOf(line, "[1, 1, 0]"), "axes 1 and 2 of 'axes' of 'principal-inertia' of body 'skid' are not perpendicular");
    }

    [Fact]
    public void TwoInertiaForms_OrNone_AreRefused()
    {
        SingleError(ReadBody("    box: [1, 1, 1]\n    inertia: {xx: 1, yy: 1, zz: 1}"), 7, 5, "needs exactly one of");
        SingleError(ReadBody("    points: {a: [0, 0, 0]}"), 3, 3, "body 'skid' needs exactly one of");
    }

    [Fact]
    public void ASpringComponentInADirectionNeitherEndMovesIn_IsLocated()
    {
        const string line = "  side: {between: [ground, deck], stiffness: {y: 1 kN/mm}}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "y:"),
            "spring 'side' acts in 'y', but neither support 'ground' (it does not move) nor mass 'deck' (moves in z) moves in 'y'");
    }

    [Fact]
    public void ALoadInADirectionTheMassDoesNotHave_IsLocated()
    {
        const string line = "  push: {kind: force, at: deck, direction: y, amplitude: 1 kN}";
        SingleError(ReadSkid("loads:", line), 14, ColumnOf(line, "y,"), "load 'push' acts in 'y' on mass 'deck', which moves only in z");
    }

    [Fact]
    public void AMomentOnAPointMass_IsLocated()
    {
        const string line = "  twist: {kind: force, at: deck, direction: rz, amplitude: 1 kN*m}";
        SingleError(ReadSkid("loads:", line), 14, ColumnOf(line, "rz"), "is a moment ('rz') on mass 'deck', a point mass, which has no rotation");
    }

    [Fact]
    public void AnUnbalanceInAPlaneTheMassDoesNotMoveIn_IsLocated()
    {
        const string line = "  fan: {kind: unbalance, at: deck, plane: [x, z], mass-radius: 1 kg*mm}";
        SingleError(ReadSkid("loads:", line), 14, ColumnOf(line, "[x, z]"), "rotates in the plane [x, z], but mass 'deck' moves only in z");
    }

    [Fact]
    public void YInAPlaneModel_IsLocated()
    {
        const string line = "  push: {kind: force, at: beam, direction: y, amplitude: 1 kN}";
        var result = Read("space: plane", "masses:", "  beam: {mass: 400 kg, at: [0, 2]}", "springs:",
            "  post: {between: [ground, beam], stiffness: {x: 1 kN/mm, z: 3 kN/mm}}", "loads:", line);
        SingleError(result, 7, ColumnOf(line, "y,"), "'direction' of load 'push' is 'y', which a plane model does not have: its directions are x, z, ry");
    }

    [Fact]
    public void AZeroLengthAxialSpring_IsLocated()
    {
        const string line = "  strut: {between: [skid.foot-1, pad], axial: 2 kN/mm}";
        SingleError(ReadSkid(line, "supports:", "  pad: {at: [1.1, 0.55, 0.1]}"), 13, ColumnOf(line, "["),
            "spring 'strut' is axial, but its ends 'skid.foot-1' and 'pad' are at the same location");
    }

    [Fact]
    public void AnAxialSpringToGround_IsLocated()
    {
        const string line = "  strut: {between: [skid.foot-1, ground], axial: 2 kN/mm}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "["), "'ground' has no location");
    }

    [Fact]
    public void ARotationalComponentAtAPointMassEnd_IsLocated()
    {
        const string line = "  twist: {between: [deck, skid], stiffness: {z: 1 kN/mm}, rotational-stiffness: {rx: 5 kN*m/rad}}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "rx"), "rotational component 'rx', but its end mass 'deck' is a point mass");
    }

    [Fact]
    public void ARotationUnderStiffness_SaysWhereItBelongs()
    {
        const string line = "  twist: {between: [ground, skid], stiffness: {rz: 1 kN/mm}}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "rz"), "names 'rz', which belongs under 'rotational-stiffness'");
    }

    [Fact]
    public void ASpringBetweenTwoPointsOfOneBody_IsLocated()
    {
        const string line = "  inner: {between: [skid.foot-1, skid.foot-2], stiffness: {z: 1 kN/mm}}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "["), "two points of the one rigid body 'skid'");
    }

    [Fact]
    public void AScalarStiffnessInA3dModel_AsksForDirections()
    {
        const string line = "  plain: {between: [ground, skid], stiffness: 1 kN/mm}";
        SingleError(ReadSkid(line), 13, ColumnOf(line, "1 kN"), "'stiffness' of spring 'plain' is given per direction in a 3d model");
    }

    [Fact]
    public void BodiesOrDirectionalKeysInALineModel_AreLocated()
    {
        SingleError(Read("masses:", "  deck: 10 kg", "bodies:", "  skid: {mass: 1 kg}"), 3, 1, "'bodies' of the model file needs 'space: plane' or 'space: 3d'");
        SingleError(Read("masses:", "  deck: {mass: 10 kg, directions: [z]}"), 2, 23, "'directions' of mass 'deck' needs 'space: plane' or 'space: 3d'");
        const string line = "  c: {between: [ground, deck], stiffness: {z: 1 kN/mm}}";
        SingleError(Read("masses:", "  deck: 10 kg", "springs:", line), 4, ColumnOf(line, "{z"), "'stiffness' of spring 'c' is given per direction, which needs 'space: plane' or 'space: 3d'");
        const string axial = "  c: {between: [ground, deck], axial: 1 kN/mm}";
        SingleError(Read("masses:", "  deck: 10 kg", "springs:", axial), 4, ColumnOf(axial, "axial"), "'axial' of spring 'c' needs 'space: plane' or 'space: 3d'");
        const string load = "  f: {kind: force, at: deck, direction: z, amplitude: 1 kN}";
        SingleError(Read("masses:", "  deck: 10 kg", "springs:", "  c: {between: [ground, deck], stiffness: 1 kN/mm}", "loads:", load), 6,
            ColumnOf(load, "direction"), "'direction' of load 'f' needs 'space: plane' or 'space: 3d'");
    }

    [Fact]
    public void LinksInA3dModel_AreLocated()
    {
        SingleError(ReadSkid("links:", "  tie: [deck, skid]"), 13, 1, "'links' cannot be used in a 3d model");
    }

    [Fact]
    public void AMassWithoutItsLocation_IsLocated()
    {
        var shorthand = Read("space: 3d", "masses:", "  deck: 2600 kg", "springs:", "  c: {between: [ground, deck], stiffness: {z: 1 kN/mm}}");
        SingleError(shorthand, 3, 9, "mass 'deck' needs its location in a 3d model");
        var noAt = Read("space: plane", "masses:", "  deck: {mass: 2600 kg}", "springs:", "  c: {between: [ground, deck], stiffness: {z: 1 kN/mm}}");
        SingleError(noAt, 3, 3, "mass 'deck' needs 'at: [x, z]'");
        const string two = "  deck: {mass: 2600 kg, at: [0, 0]}";
        var wrongCount = Read("space: 3d", "masses:", two, "springs:", "  c: {between: [ground, deck], stiffness: {z: 1 kN/mm}}");
        SingleError(wrongCount, 3, ColumnOf(two, "["), "'at' of mass 'deck' must be a location [x, y, z] in m");
    }

    [Fact]
    public void ASupportWithoutItsLocation_IsLocated()
    {
        SingleError(ReadSkid("supports:", "  pad:"), 14, 3, "support 'pad' needs 'at: [x, y, z]'");
    }

    [Fact]
    public void AnUnknownSpace_IsLocated_WithASuggestion()
    {
        SingleError(Read("space: 3D", "masses:", "  deck: 1 kg"), 1, 8, "'space' is '3D' (did you mean '3d'?)");
    }

    [Fact]
    public void ARotationAmongAMassesDirections_SaysToUseABody()
    {
        const string line = "  deck: {mass: 2600 kg, at: [0, 0, 0], directions: [z, rx]}";
        SingleError(Read("space: 3d", "masses:", line, "springs:", "  c: {between: [ground, deck], stiffness: {z: 1 kN/mm}}"), 3, ColumnOf(line, "rx"),
            "a point mass has no rotary inertia");
    }

    [Fact]
    public void ATimedLoadWithoutADirection_IsLocated()
    {
        const string line = "  kick: {kind: force, at: skid, time: {kind: step, value: 1 kN}}";
        SingleError(ReadSkid("loads:", line), 14, ColumnOf(line, "{kind: force"), "load 'kick' needs 'direction' in a 3d model");
    }

    [Fact]
    public void ATimedMomentOnAPointMass_IsLocated()
    {
        const string line = "  kick: {kind: force, at: deck, direction: rx, time: {kind: step, value: 1 kN*m}}";
        SingleError(ReadSkid("loads:", line), 14, ColumnOf(line, "rx"), "a point mass, which has no rotation");
    }

    [Fact]
    public void ATimedSupportMotionInARotation_IsLocated()
    {
        const string line = "  quake: {kind: base-motion, support: pad, direction: rz, time: {kind: step, value: 1 m/s^2}}";
        SingleError(ReadSkid("supports:", "  pad: {at: [0, 0, -1]}", "loads:", line), 16, ColumnOf(line, "rz"), "a support's prescribed motion is a translation");
    }

    [Fact]
    public void ALimitAtARotation_IsLocated()
    {
        const string line = "  limits: [{at: skid.ry, quantity: displacement, peak: 1 mm}]";
        SingleError(ReadSkid("criteria:", line), 14, ColumnOf(line, "skid.ry"),
            "limit 1 of 'criteria' is at 'skid.ry', which is a rotation ('ry'); limits, machine zones and floor curves bound motion in length units: name a translation (skid.x, skid.y, skid.z)");
    }

    [Fact]
    public void AZoneAtAnUnknownBodyPoint_IsLocated_WithTheNearestName()
    {
        const string line = "  machine-zones: [{at: [deck, skid.foot-3], class: medium-rigid, zone: B}]";
        SingleError(ReadSkid("criteria:", line), 14, ColumnOf(line, "skid.foot-3"),
            "entry 1 of 'machine-zones' is at 'skid.foot-3', which is not a mass, body, body point ('body.point') or translation ('mass.z', 'body.point.x') of the model (did you mean 'skid.foot-1'?)");
    }

    [Fact]
    public void AFloorCurveInADirectionTheMassDoesNotMove_IsLocated()
    {
        const string line = "  floor-curves: [{at: deck.x, curve: VC-A}]";
        SingleError(ReadSkid("criteria:", line), 14, ColumnOf(line, "deck.x"), "entry 1 of 'floor-curves' is at 'deck.x', which names 'x', but 'deck' does not move in 'x'");
    }

    [Fact]
    public void ALimitAtASupport_IsLocated()
    {
        const string line = "  limits: [{at: ground, quantity: velocity, rms: 1 mm/s}]";
        SingleError(ReadSkid("criteria:", line), 14, ColumnOf(line, "ground"), "limit 1 of 'criteria' is at 'ground', which is a support: it does not move");
    }

    [Fact]
    public void CriteriaAtDofLabelsBodyPointsAndBarePoints_AreRead()
    {
        var result = ReadSkid(
            "criteria:",
            "  limits: [{at: deck.z, quantity: velocity, rms: 1 mm/s}, {at: skid.foot-1.x, quantity: velocity, rms: 1 mm/s}]",
            "  machine-zones: [{at: [skid, skid.foot-2], class: medium-rigid, zone: B}]",
            "  floor-curves: [{at: deck, curve: VC-A}]");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var criteria = result.Model!.Criteria;
        Assert.Equal(["deck.z", "skid.foot-1.x"], criteria.Limits.Select(l => l.At));
        Assert.Equal("skid, skid.foot-2", string.Join(", ", criteria.Zones[0].At));
        Assert.Equal("deck", Assert.Single(criteria.Floors[0].At));
    }
}
