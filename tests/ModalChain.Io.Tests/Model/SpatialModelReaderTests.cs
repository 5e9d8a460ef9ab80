using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>Plane and 3d models: space, locations, directions, rigid bodies, directional and axial elements, loads in space.</summary>
public class SpatialModelReaderTests
{
    private static readonly Tolerance Exact = Tolerance.Rel(1e-15);

    private static ModelDocument ReadFixture(string name)
    {
        var path = Path.Combine(AppContext.BaseDirectory, "models", name);
        var result = ModelReader.ReadFile(path);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        Assert.Empty(result.Model!.Warnings);
        return result.Model!;
    }

    [Fact]
    public void CompressorSkid_ReadsIntoTheExpectedNetwork()
    {
        var model = ReadFixture("compressor-skid-deck.yaml");
        var n = model.Network;
        Assert.Equal(ModelSpace.ThreeD, n.Space);

        var deck = Assert.Single(n.Masses);
        Assert.Equal(new Point3(0, 0, 0), deck.Location);
        Assert.Equal([Direction.Z], deck.Moves.ToArray());
        NumericAssert.Close(2600, deck.Kilograms, Exact, "deck");

        var skid = Assert.Single(n.Bodies);
        NumericAssert.Close(1850, skid.Kilograms, Exact, "skid mass");
        Assert.Equal(new Point3(0.08, 0, 0.62), skid.CentreOfMass);
        // A homogeneous box: J_xx = m(dy² + dz²)/12 and cyclically, no products (any dynamics text; common practice).
        NumericAssert.Close(1850 * (1.2 * 1.2 + 1.1 * 1.1) / 12, skid.Inertia.Xx, Tolerance.Rel(1e-14), "J_xx");
        NumericAssert.Close(1850 * (2.4 * 2.4 + 1.1 * 1.1) / 12, skid.Inertia.Yy, Tolerance.Rel(1e-14), "J_yy");
        NumericAssert.Close(1850 * (2.4 * 2.4 + 1.2 * 1.2) / 12, skid.Inertia.Zz, Tolerance.Rel(1e-14), "J_zz");
        Assert.Equal(0, skid.Inertia.Xy);
        Assert.Equal(["foot-1", "foot-2", "foot-3", "foot-4", "crank"], skid.Points.Select(p => p.Name).ToArray());
        Assert.Equal(new Point3(-1.1, -0.55, 0.1), skid.FindPoint("foot-4")!.Location);

        Assert.Equal(5, n.Springs.Length);
        var mount = n.Springs.Single(s => s.Name == "mount-1");
        Assert.Equal(("skid.foot-1", "deck"), (mount.NodeA, mount.NodeB));
        Assert.False(mount.Axial);
        Assert.Equal([new DirectionalValue(Direction.X, 9e5), new DirectionalValue(Direction.Y, 9e5), new DirectionalValue(Direction.Z, 2.6e6)], mount.Components.ToArray());
        Assert.Equal(2.6e6, mount.Stiffness); // the largest translational component: the spring's scale (design of issue 9)
        Assert.Equal(new Attachment("skid", "foot-1", new Point3(1.1, 0.55, 0.1)), n.Resolve(mount.NodeA));

        var unbalance = Assert.IsType<UnbalanceLoad>(Assert.Single(model.Structure.Loads));
        Assert.Equal("skid.crank", unbalance.At);
        Assert.Equal([Direction.X, Direction.Z], unbalance.Plane.ToArray());
        NumericAssert.Close(0.025, unbalance.MassRadius, Tolerance.Rel(1e-15), "m·e in kg·m");
        NumericAssert.Close(980.0 / 60, unbalance.SpeedHz!.Value, Tolerance.Rel(1e-15), "speed");
        Assert.Null(model.ReferencePoint);
    }

    [Fact]
    public void InstrumentCabinet_ReadsIntoTheExpectedPlaneNetwork()
    {
        var model = ReadFixture("instrument-cabinet-sway.yaml");
        var n = model.Network;
        Assert.Equal(ModelSpace.Plane, n.Space);
        Assert.Empty(n.Masses);
        // Plane locations are [x, z]; y is 0.
        Assert.Equal(new Point3(-0.6, 0, 1.9), n.Supports.Single(s => s.Name == "wall").Location);
        var cabinet = Assert.Single(n.Bodies);
        Assert.Equal(new Point3(0, 0, 0.95), cabinet.CentreOfMass);
        Assert.Equal(160, cabinet.Inertia.Yy);
        Assert.Equal(new Point3(-0.3, 0, 1.9), cabinet.FindPoint("top")!.Location);

        var restraint = n.Springs.Single(s => s.Name == "restraint");
        Assert.True(restraint.Axial);
        Assert.Empty(restraint.Components);
        Assert.Equal(1.2e5, restraint.Stiffness);
        var pads = Assert.Single(n.Dampers);
        Assert.Equal([new DirectionalValue(Direction.X, 400), new DirectionalValue(Direction.Z, 1200)], pads.Components.ToArray());
        Assert.Equal(1200, pads.Coefficient);

        var shake = Assert.IsType<BaseMotionLoad>(Assert.Single(model.Structure.Loads));
        Assert.Equal(Direction.X, shake.Direction);
        Assert.Equal("floor", shake.Support);
        NumericAssert.Close(0.02 * 9.80665, shake.Amplitude, Tolerance.Rel(1e-15), "0.02 g");
    }

    [Fact]
    public void InstrumentCabinet_AssemblesIntoTheStiffnessOfAHandCalculation()
    {
        // Hand calculation from the file's values (own computation): points in global axes, arms r = p − c from the
        // centre of mass (0, 0.95); a side-view body point moves as u_x + θ r_z, u_z − θ r_x.
        // K_xx = 2·0.35e6 + 0.12e6 (pads in shear, the horizontal tie) = 8.2e5 N/m; K_zz = 2·1.8e6 = 3.6e6 N/m;
        // K_θθ = 2·1.8e6·0.3² + 2·0.35e6·0.95² + 0.12e6·0.95² = 1.06405e6 N·m/rad;
        // K_xθ = 2·0.35e6·(−0.95) + 0.12e6·0.95 = −5.51e5 N; K_zθ = 1.8e6·(−0.3) + 1.8e6·0.3 = 0 (pads symmetric).
        var model = ReadFixture("instrument-cabinet-sway.yaml");
        var matrices = Core.Assembly.Assembler.Assemble(model.Network, model.ReferencePoint);
        var k = matrices.DenseStiffness();
        var (x, z, ry) = (matrices.Dofs.IndexOf("cabinet", Direction.X), matrices.Dofs.IndexOf("cabinet", Direction.Z), matrices.Dofs.IndexOf("cabinet", Direction.Ry));
        var tol = Tolerance.Rel(1e-12);
        NumericAssert.Close(8.2e5, k[x, x], tol, "K_xx");
        NumericAssert.Close(3.6e6, k[z, z], tol, "K_zz");
        NumericAssert.Close(1.06405e6, k[ry, ry], tol, "K_θθ");
        NumericAssert.Close(-5.51e5, k[x, ry], tol, "K_xθ");
        NumericAssert.Close(0, k[z, ry], Tolerance.Abs(1e-6), "K_zθ");
        NumericAssert.Close(0, k[x, z], Tolerance.Abs(1e-6), "K_xz");
        var m = matrices.DenseMass();
        NumericAssert.Close(420, m[x, x], Tolerance.Rel(1e-15), "M_xx");
        NumericAssert.Close(160, m[ry, ry], Tolerance.Rel(1e-15), "M_θθ");
    }

    [Fact]
    public void LineModels_KeepTheirSpaceAndReadAsBefore()
    {
        var result = Read("masses:", "  deck: {mass: 3200 kg, at: [0, 0]}", "springs:", "  c: {between: [ground, deck], stiffness: 95 kN/mm}",
            "loads:", "  f: {kind: force, at: deck, amplitude: 1 kN}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        Assert.Equal(ModelSpace.Line, result.Model!.Network.Space);
        Assert.Null(result.Model.Network.Masses[0].Location);
        Assert.Equal(Direction.Along, Assert.IsType<ForceLoad>(result.Model.Structure.Loads[0]).Direction);
    }

    [Fact]
    public void RotationalValues_MomentsAndInertiaEntries_AreReadInTheirUnits()
    {
        // Unit factors by definition: 1 kN·m/rad = 1000 N·m/rad, 1 t·m² = 1000 kg·m², 1 kN·m = 1000 N·m.
        var result = Read(
            "space: 3d",
            "reference-point: [0.5 m, 0, 250 mm]",
            "bodies:",
            "  block:",
            "    mass: 3 t",
            "    centre-of-mass: [0, 0, 0.5]",
            "    inertia: {xx: 1.2 t*m^2, yy: 1500 kg*m^2, zz: 1.8 t*m^2, xz: -40 kg*m^2}",
            "    points: {base: [0, 0, 0]}",
            "springs:",
            "  pad: {between: [block.base, ground], stiffness: {x: 2 kN/mm, y: 2 kN/mm, z: 8 kN/mm}, rotational-stiffness: {rx: 5 kN*m/rad, ry: 5 kN*m/rad}}",
            "dampers:",
            "  pad-loss: {between: [block.base, ground], coefficient: {z: 3 kN*s/m}, rotational-coefficient: {rz: 2 N*m*s/rad}}",
            "loads:",
            "  twist: {kind: force, at: block, direction: rz, amplitude: 2 kN*m, speed: 25 Hz}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var n = result.Model!.Network;
        Assert.Equal(new InertiaMatrix(1200, 1500, 1800, 0, 0, -40), n.Bodies[0].Inertia);
        Assert.Equal(new Point3(0.5, 0, 0.25), result.Model.ReferencePoint);
        var pad = n.Springs[0];
        Assert.Equal([new DirectionalValue(Direction.X, 2e6), new DirectionalValue(Direction.Y, 2e6), new DirectionalValue(Direction.Z, 8e6),
            new DirectionalValue(Direction.Rx, 5000), new DirectionalValue(Direction.Ry, 5000)], pad.Components.ToArray());
        Assert.Equal(8e6, pad.Stiffness);
        Assert.Equal([new DirectionalValue(Direction.Z, 3000), new DirectionalValue(Direction.Rz, 2)], n.Dampers[0].Components.ToArray());
        var twist = Assert.IsType<ForceLoad>(Assert.Single(result.Model.Structure.Loads));
        Assert.Equal(Direction.Rz, twist.Direction);
        Assert.Equal(2000, twist.Amplitude);
    }

    [Fact]
    public void PrincipalInertia_IsTurnedIntoTheMatrixInGlobalAxes()
    {
        // Principal moments 100, 200, 250 kg·m² with axes turned 30° about z: J = R diag(I) Rᵀ, so
        // J_xx = I1 cos² + I2 sin², J_yy = I1 sin² + I2 cos², J_xy = (I1 − I2) sin cos (rotation of a tensor; common practice).
        // The axes are given unscaled (length 2) to show they are normalised.
        var c = Math.Cos(Math.PI / 6);
        var s = Math.Sin(Math.PI / 6);
        var result = Read(
            "space: 3d",
            "bodies:",
            "  rotor-frame:",
            "    mass: 900 kg",
            "    centre-of-mass: [0, 0, 1]",
            "    principal-inertia:",
            "      values: [100 kg*m^2, 200 kg*m^2, 250 kg*m^2]",
            FormattableString.Invariant($"      axes: [[{2 * c:R}, {2 * s:R}, 0], [{-s:R}, {c:R}, 0], [0, 0, 1]]"),
            "springs:",
            "  mount: {between: [rotor-frame, ground], stiffness: {x: 1 kN/mm, y: 1 kN/mm, z: 1 kN/mm}, rotational-stiffness: {rx: 1, ry: 1, rz: 1}}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var j = result.Model!.Network.Bodies[0].Inertia;
        var tol = Tolerance.Abs(1e-12);
        NumericAssert.Close(100 * c * c + 200 * s * s, j.Xx, tol, "J_xx");
        NumericAssert.Close(100 * s * s + 200 * c * c, j.Yy, tol, "J_yy");
        NumericAssert.Close(250, j.Zz, tol, "J_zz");
        NumericAssert.Close((100 - 200) * s * c, j.Xy, tol, "J_xy");
        NumericAssert.Close(0, j.Xz, tol, "J_xz");
        NumericAssert.Close(0, j.Yz, tol, "J_yz");
    }

    [Fact]
    public void PrincipalMoments_RecoverTheMomentsOfSeededRandomlyTurnedBodies()
    {
        // Identity: the eigenvalues of R diag(I) Rᵀ are I for any rotation R. Seeded, 200 cases; relative 1e-9 of the largest.
        var random = new Random(20261202);
        for (var i = 0; i < 200; i++)
        {
            var moments = new[] { 1 + 99 * random.NextDouble(), 1 + 99 * random.NextDouble(), 0.0 };
            moments[2] = Math.Abs(moments[0] - moments[1]) + random.NextDouble() * (moments[0] + moments[1] - Math.Abs(moments[0] - moments[1]));
            var axes = RandomRotation(random);
            var j = InertiaMatrix.FromPrincipal(moments, axes);
            var found = ModelReader.PrincipalMoments(j);
            NumericAssert.Close(moments.Order().ToArray(), found, Tolerance.Abs(1e-9 * moments.Max()), $"case {i}");
        }
    }

    private static Point3[] RandomRotation(Random random)
    {
        // Gram–Schmidt on two random vectors, the third their cross product: a proper rotation.
        Point3 Unit(Point3 v) => new(v.X / v.Length, v.Y / v.Length, v.Z / v.Length);
        Point3 Random3() => new(random.NextDouble() - 0.5, random.NextDouble() - 0.5, random.NextDouble() - 0.5);
        var a = Unit(Random3());
        var b0 = Random3();
        var dot = a.X * b0.X + a.Y * b0.Y + a.Z * b0.Z;
        var b = Unit(new Point3(b0.X - dot * a.X, b0.Y - dot * a.Y, b0.Z - dot * a.Z));
        var c = new Point3(a.Y * b.Z - a.Z * b.Y, a.Z * b.X - a.X * b.Z, a.X * b.Y - a.Y * b.X);
        return [a, b, c];
    }

    [Fact]
    public void PlaneModels_TakeTwoCoordinates_AndTheUnbalancePlaneDefaultsToXz()
    {
        var result = Read(
            "space: plane",
            "masses:",
            "  beam: {mass: 400 kg, at: [1.5, 2.0]}",
            "springs:",
            "  post: {between: [ground, beam], stiffness: {x: 1 kN/mm, z: 3 kN/mm}}",
            "loads:",
            "  fan: {kind: unbalance, at: beam, mass-radius: 5 kg*mm}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var beam = result.Model!.Network.Masses[0];
        Assert.Equal(new Point3(1.5, 0, 2.0), beam.Location);
        Assert.Empty(beam.Moves); // every translation of the space
        Assert.Equal([Direction.X, Direction.Z], Assert.IsType<UnbalanceLoad>(result.Model.Structure.Loads[0]).Plane.ToArray());
    }

    [Fact]
    public void ABodyWithoutSprings_IsWarnedAbout()
    {
        var result = Read(
            "space: 3d",
            "masses:",
            "  deck: {mass: 100 kg, at: [0, 0, 0], directions: [z]}",
            "bodies:",
            "  loose: {mass: 50 kg, centre-of-mass: [0, 0, 1], box: [1, 1, 1]}",
            "springs:",
            "  c: {between: [ground, deck], stiffness: {z: 1 kN/mm}}");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var warning = Assert.Single(result.Model!.Warnings);
        Assert.Equal(5, warning.Position.Line);
        Assert.Contains("body 'loose' has no spring", warning.Message, StringComparison.Ordinal);
    }
}
