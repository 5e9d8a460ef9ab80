using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Studies;

/// <summary>Studies that vary an inertance (line, plane and 3d forms) or a transducer's force factor.</summary>
public class InerterAndTransducerStudyTests
{
    private static ParameterPath Path(string text, Network network)
    {
        var path = ParameterPath.Resolve(text, network, out var error);
        Assert.True(path is not null, error);
        return path!;
    }

    private static StudyRequest Request(ParameterPath path, double from, double to, int steps) =>
        new(path, from, to, steps, StudySpacing.Linear, []);

    private static double Hz(double omega2) => Math.Sqrt(omega2) / (2 * Math.PI);

    // ---- line model: a mass on a spring with an inerter to ground ----

    private const double M = 40, K = 2.5e5;

    private static Network Grounded(double b) => new NetworkBuilder { Title = "grounded inerter" }
        .AddMass("m", M).AddSpring("k", Network.Ground, "m", K).AddInerter("b", "m", Network.Ground, b).Build();

    [Fact]
    public void GroundedInertance_GivesRootOfKOverMPlusB_AtEveryValue()
    {
        // Closed form: a grounded inerter adds b to the apparent mass of its other end, so ω = √(k/(m + b)); from b = 0
        // (switched off) to 3m, 13 values (1e-10 relative).
        var network = Grounded(15);
        var path = Path("inerters.b.inertance", network);
        Assert.Equal(ParameterKind.Inertance, path.Kind);
        Assert.Equal(15, path.Get(network));
        var result = ParameterStudy.Run(network, Request(path, 0, 3 * M, 13));
        var mode = Assert.Single(result.Modes);
        for (var s = 0; s < result.Steps.Length; s++)
            NumericAssert.Close(Hz(K / (M + result.Steps[s].Value)), mode.FrequenciesHz[s], Tolerance.Rel(1e-10), $"step {s}, b = {result.Steps[s].Value}");
    }

    [Fact]
    public void InertanceBetweenTwoMasses_FollowsTheTwoByTwoFrequencyEquation()
    {
        // Closed form: masses m1 (spring k1 to ground) and m2 (spring k2 to m1) with an inerter b across them:
        // M = [[m1 + b, −b], [−b, m2 + b]], K = [[k1 + k2, −k2], [−k2, k2]]; det(K − λM) = 0 is a quadratic in λ = ω²,
        // solved here in its own terms (M is not diagonal), 1e-10 relative at every value from b = 0 to 60 kg.
        const double m1 = 300, m2 = 20, k1 = 3e6, k2 = 1.2e5;
        var network = new NetworkBuilder().AddMass("m1", m1).AddMass("m2", m2)
            .AddSpring("k1", Network.Ground, "m1", k1).AddSpring("k2", "m1", "m2", k2)
            .AddInerter("across", "m1", "m2", 5).Build();
        var result = ParameterStudy.Run(network, Request(Path("inerters.across.inertance", network), 0, 60, 7));
        for (var s = 0; s < result.Steps.Length; s++)
        {
            var b = result.Steps[s].Value;
            // det([[k1 + k2 − λ(m1 + b), −k2 + λb], [−k2 + λb, k2 − λ(m2 + b)]]) = a λ² + c1 λ + c0
            var a = (m1 + b) * (m2 + b) - b * b;
            var c1 = -((k1 + k2) * (m2 + b) + k2 * (m1 + b) - 2 * k2 * b);
            var c0 = (k1 + k2) * k2 - k2 * k2;
            var root = Math.Sqrt(c1 * c1 - 4 * a * c0);
            var low = 2 * c0 / (-c1 + root);      // the smaller root in the cancellation-free form
            var high = (-c1 + root) / (2 * a);
            NumericAssert.Close(new[] { Hz(low), Hz(high) }, result.Steps[s].FrequenciesHz, Tolerance.Rel(1e-10), $"step {s}, b = {b}");
        }
    }

    // ---- 3d model: the block on four mounts of SpatialStudyTests (REFERENCES.md §10, mounts in the plane of the centre
    // of mass, so the six motions decouple) with an inerter from its centre of mass to ground ----

    private const double Mass = 1200, A = 0.8, B = 0.5, Kx = 3e5, Ky = 2e5, Kz = 9e5, Bx = 100, Bz = 300, Brz = 60, Baxial = 200;
    private static readonly InertiaMatrix Inertia = new(250, 400, 520);

    private static Network Block()
    {
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD, Title = "block with inerters" };
        builder.AddSupport(new Support("pit") { Location = new Point3(0, 0, -1) });
        var corners = new[] { (1, 1), (1, -1), (-1, 1), (-1, -1) };
        builder.AddBody(new RigidBody("block", Mass, new Point3(0, 0, 0), Inertia,
            [.. corners.Select((c, i) => new BodyPoint($"foot-{i + 1}", new Point3(c.Item1 * A, c.Item2 * B, 0)))]));
        for (var i = 1; i <= 4; i++)
            builder.AddSpring(new Spring($"mount-{i}", $"block.foot-{i}", Network.Ground, Kz)
            {
                Components = [new(Direction.X, Kx), new(Direction.Y, Ky), new(Direction.Z, Kz)],
            });
        builder.AddInerter(new Inerter("brake", "block", Network.Ground, Bz)
        {
            Components = [new(Direction.X, Bx), new(Direction.Z, Bz), new(Direction.Rz, Brz)],
        });
        builder.AddInerter(new Inerter("strut", "block", "pit", Baxial) { Axial = true });
        return builder.Build();
    }

    /// <summary>ω² of each motion: the inerter's translational components add to m in their direction, its rz component to J_z, the vertical strut to m in z.</summary>
    private static Dictionary<string, double> Closed(double bx = Bx, double bz = Bz, double brz = Brz, double axial = Baxial) => new()
    {
        ["surge"] = 4 * Kx / (Mass + bx),
        ["sway"] = 4 * Ky / Mass,
        ["bounce"] = 4 * Kz / (Mass + bz + axial),
        ["roll"] = 4 * Kz * B * B / Inertia.Xx,
        ["pitch"] = 4 * Kz * A * A / Inertia.Yy,
        ["yaw"] = 4 * (Kx * B * B + Ky * A * A) / (Inertia.Zz + brz),
    };

    private static void AssertClosed(Network network, Dictionary<string, double> closed, string what)
    {
        var modes = ModalAnalysis.Solve(network).Modes;
        foreach (var (motion, omega2) in closed)
            NumericAssert.Close(Hz(omega2), modes.Single(m => m.Motion == motion).NaturalFrequencyHz, Tolerance.Rel(1e-10), $"{what}: {motion}");
    }

    [Fact]
    public void TheBlockWithInertersIsTheClosedForm() => AssertClosed(Block(), Closed(), "as built");

    [Fact]
    public void OneDirectionOfAnInerter_MovesOnlyItsOwnMotion()
    {
        // Closed form (REFERENCES.md §10 with b added to m or J): inertance.z moves bounce alone, rotational-inertance.rz
        // yaw alone, axial the strut's share of bounce; each value set then checked against all six motions (1e-10 relative).
        var network = Block();
        var z = Path("inerters.brake.inertance.z", network);
        Assert.Equal((Direction?)Direction.Z, z.Component);
        Assert.Equal(Quantity.Mass, z.Quantity);
        AssertClosed(z.Apply(network, 900), Closed(bz: 900), "inertance.z = 900 kg");
        var rz = Path("inerters.brake.rotational-inertance.rz", network);
        Assert.Equal(Quantity.MomentOfInertia, rz.Quantity);
        Assert.Equal(Brz, rz.Get(network));
        AssertClosed(rz.Apply(network, 400), Closed(brz: 400), "rotational-inertance.rz = 400 kg·m²");
        var axial = Path("inerters.strut.axial", network);
        Assert.True(axial.Axial);
        AssertClosed(axial.Apply(network, 0), Closed(axial: 0), "strut switched off");
    }

    [Fact]
    public void WholeInertance_ScalesEveryComponentInProportion()
    {
        // inerters.brake.inertance is the scale (the largest translational component, Bz); setting it to s·Bz multiplies
        // every component, the rotational one included, by s (the springs' rule; closed form of each motion, 1e-10 relative).
        const double s = 2.5;
        var network = Block();
        var path = Path("inerters.brake.inertance", network);
        Assert.Equal(Bz, path.Get(network));
        var scaled = path.Apply(network, s * Bz);
        AssertClosed(scaled, Closed(bx: s * Bx, bz: s * Bz, brz: s * Brz), "scale × 2.5");
        Assert.Equal(new DirectionalValue[] { new(Direction.X, s * Bx), new(Direction.Z, s * Bz), new(Direction.Rz, s * Brz) },
            scaled.Inerters.Single(i => i.Name == "brake").Components);
    }

    [Fact]
    public void YawStudyOfTheRotationalInertance_FollowsItsClosedForm()
    {
        // yaw ω² = 4(k_x b² + k_y a²)/(J_z + b_rz) at every value; the other five motions stay put (closed form, 1e-10 relative).
        var network = Block();
        var result = ParameterStudy.Run(network, Request(Path("inerters.brake.rotational-inertance.rz", network), 0, 800, 9));
        foreach (var mode in result.Modes)
            for (var s = 0; s < result.Steps.Length; s++)
            {
                var motion = mode.Motions[s];
                NumericAssert.Close(Hz(Closed(brz: result.Steps[s].Value)[motion]), mode.FrequenciesHz[s], Tolerance.Rel(1e-10), $"mode {mode.Identity} ({motion}) at step {s}");
            }
    }

    // ---- transducers ----

    private const double Table = 2, Flexure = 4e4, Capacitance = 2e-3, Inductance = 0.05;

    /// <summary>
    /// A table (mass m on spring k to ground) whose coil [table, ground] drives the branch [tank, ground]; the node
    /// 'tank' has capacitance C to ground (a mass of C kg in the node flux form) and an inductor L to ground (a spring 1/L).
    /// </summary>
    private static Network Resonant(double? bl)
    {
        var b = new NetworkBuilder { Title = "coil on a tank circuit" }
            .AddMass("table", Table).AddMass("tank", Capacitance)
            .AddSpring("flexure", Network.Ground, "table", Flexure)
            .AddSpring("inductor", "tank", Network.Ground, 1 / Inductance)
            .AddDamper("resistor", "tank", Network.Ground, 0.01);
        if (bl is { } f) b.AddTransducer("coil", "table", Network.Ground, "tank", Network.Ground, f);
        return b.MarkElectrical("tank").Build();
    }

    [Fact]
    public void ForceFactorStudy_FollowsTheCoupledClosedForm()
    {
        // Closed form: the transducer eliminates the tank's flux, λ = Bl·x, so the capacitance adds Bl²C to the table's
        // mass and the inductor Bl²/L to its stiffness: ω² = (k + Bl²/L)/(m + Bl²C), 1e-10 relative at every value.
        // The resistor is a damper and does not enter the undamped modes.
        var network = Resonant(12);
        var path = Path("transducers.coil.force-factor", network);
        Assert.Equal(ParameterKind.ForceFactor, path.Kind);
        Assert.Equal(Quantity.ForceFactor, path.Quantity);
        Assert.Equal(12, path.Get(network));
        var result = ParameterStudy.Run(network, Request(path, 0.5, 40, 12));
        var mode = Assert.Single(result.Modes);
        for (var s = 0; s < result.Steps.Length; s++)
        {
            var bl = result.Steps[s].Value;
            NumericAssert.Close(Hz((Flexure + bl * bl / Inductance) / (Table + bl * bl * Capacitance)), mode.FrequenciesHz[s], Tolerance.Rel(1e-10), $"step {s}, Bl = {bl}");
        }
    }

    [Fact]
    public void ATinyForceFactor_LeavesTheTableAsWithoutTheTransducer()
    {
        // Limit Bl → 0+: the coupling terms Bl²C and Bl²/L vanish, so the table's mode tends to the one of the model
        // without a transducer, √(k/m) (closed form). At Bl = 1e-6 T·m the relative change is about Bl²C/(2m) + Bl²/(2Lk),
        // far below the 1e-9 relative tolerance. The model without transducer keeps the tank as a free electrical
        // coordinate, so it has a second mode, 1/√(LC); the transducer eliminates that coordinate, and with it that mode.
        var coupled = Resonant(12);
        var tiny = Path("transducers.coil.force-factor", coupled).Apply(coupled, 1e-6);
        var withModes = ModalAnalysis.Solve(tiny).Modes;
        var without = ModalAnalysis.Solve(Resonant(null)).Modes;
        Assert.Single(withModes);
        Assert.Equal(2, without.Length);
        var table = without.Single(m => Math.Abs(m.NaturalFrequencyHz - Hz(Flexure / Table)) < 1e-6 * Hz(Flexure / Table));
        NumericAssert.Close(table.NaturalFrequencyHz, withModes[0].NaturalFrequencyHz, Tolerance.Rel(1e-9), "table mode, Bl → 0+");
        NumericAssert.Close(Hz(1 / (Inductance * Capacitance)), without.Single(m => m != table).NaturalFrequencyHz, Tolerance.Rel(1e-10), "the free tank, 1/√(LC)");
    }

    [Fact]
    public void EditsToTheSameValue_LeaveMCAndKUnchanged()
    {
        // Identity: setting a field to the value it already has gives the same assembled matrices, exactly.
        var line = Resonant(12).WithAdded([], [], []);
        var withInerter = new NetworkBuilder().AddMass("table", Table).AddMass("tank", Capacitance)
            .AddSpring("flexure", Network.Ground, "table", Flexure).AddSpring("inductor", "tank", Network.Ground, 1 / Inductance)
            .AddDamper("resistor", "tank", Network.Ground, 0.01).AddInerter("flywheel", "table", Network.Ground, 0.7)
            .AddTransducer("coil", "table", Network.Ground, "tank", Network.Ground, 12).MarkElectrical("tank").Build();
        foreach (var (original, edited, what) in new[]
                 {
                     (line, line.WithTransducerForceFactor("coil", 12), "force factor"),
                     (withInerter, withInerter.WithInerterInertance("flywheel", 0.7), "inertance"),
                     (withInerter, withInerter.WithTransducerForceFactor("coil", 12), "force factor beside an inerter"),
                 })
        {
            // Element by element: ImmutableArray's own equality compares the array reference, which an edit replaces.
            Assert.Equal<Inerter>(original.Inerters, edited.Inerters);
            Assert.Equal<Transducer>(original.Transducers, edited.Transducers);
            Assert.Equal<string>(original.ElectricalNodes, edited.ElectricalNodes);
            var a = Assembler.Assemble(original);
            var b = Assembler.Assemble(edited);
            NumericAssert.Close(a.DenseMass(), b.DenseMass(), Tolerance.Rel(0), $"{what}: M");
            NumericAssert.Close(a.DenseDamping(), b.DenseDamping(), Tolerance.Rel(0), $"{what}: C");
            NumericAssert.Close(a.DenseStiffness(), b.DenseStiffness(), Tolerance.Rel(0), $"{what}: K");
        }
        var block = Block();
        foreach (var edited in new[]
                 {
                     block.WithInerterInertance("brake", Bz), block.WithInerterComponent("brake", Direction.Rz, Brz),
                     block.WithInerterInertance("strut", Baxial),
                 })
        {
            var a = Assembler.Assemble(block);
            var b = Assembler.Assemble(edited);
            NumericAssert.Close(a.DenseMass(), b.DenseMass(), Tolerance.Rel(0), "3d M");
            NumericAssert.Close(a.DenseStiffness(), b.DenseStiffness(), Tolerance.Rel(0), "3d K");
        }
    }

    [Theory]
    [InlineData("inerters.flywheel.inertance", "no entry 'flywheel' under 'inerters' (it has: b)")]
    [InlineData("inerters.b.between", "'between' of inerters is not a numeric field; the numeric field is 'inertance'")]
    [InlineData("inerters.b.inertance.z", "no field 'inertance.z'")]
    [InlineData("transducers.coil.force-factor", "the model has no transducers")]
    [InlineData("loads.x.y", "inerters.NAME.inertance, transducers.NAME.force-factor")]
    public void BadLinePaths_NameWhatExists(string text, string expected)
    {
        Assert.Null(ParameterPath.Resolve(text, Grounded(15), out var error));
        Assert.Contains(expected, error);
    }

    [Theory]
    [InlineData("transducers.coil.branch", "'branch' of transducers is not a numeric field; the numeric field is 'force-factor'")]
    [InlineData("transducers.coil.bl", "transducers have no field 'bl'; the numeric field is 'force-factor' (transducers.coil.force-factor)")]
    [InlineData("transducers.shaker.force-factor", "(it has: coil)")]
    public void BadTransducerPaths_NameWhatExists(string text, string expected)
    {
        Assert.Null(ParameterPath.Resolve(text, Resonant(12), out var error));
        Assert.Contains(expected, error);
    }

    [Theory]
    [InlineData("inerters.brake.inertance.y", "inerter 'brake' has no inertance in 'y'; inerter 'brake' has: inerters.brake.inertance (every direction in proportion), inerters.brake.inertance.x, inerters.brake.inertance.z, inerters.brake.rotational-inertance.rz")]
    [InlineData("inerters.strut.inertance.z", "inerter 'strut' is axial")]
    [InlineData("inerters.brake.axial", "inerter 'brake' is not axial")]
    [InlineData("transducers.coil.force-factor", "a 3d model has no transducers (line models only)")]
    public void BadSpatialPaths_NameWhatExists(string text, string expected)
    {
        Assert.Null(ParameterPath.Resolve(text, Block(), out var error));
        Assert.Contains(expected, error);
    }

    [Fact]
    public void AForceFactorMustBeAboveZero_AndAnInertanceMayBeZero()
    {
        var bl = Path("transducers.coil.force-factor", Resonant(12));
        Assert.False(bl.Admits(0));
        Assert.True(bl.Admits(1e-9));
        Assert.Contains("(above 0 up to 1E+06, SI)", Assert.Single(new StudyRequest(bl, 0, 10, 3, StudySpacing.Linear, []).Problems()));
        var b = Path("inerters.b.inertance", Grounded(15));
        Assert.True(b.Admits(0));
        Assert.False(b.Admits(-1));
        Assert.False(b.Admits(2e9));
    }

    [Fact]
    public void AnInerterCarryingAMasslessNode_IsStudiedAboveZeroOnly()
    {
        // At b = 0 the node 'j' would have no inertia and turn from a moving coordinate into a condensed one part-way
        // through the study (an internal error before: steps with 1 and 2 modes). Above 0 the study runs and the node
        // keeps its coordinate; the 2×2 closed form det(K − λM) = 0 with M = diag(b, m), K = [[k1 + k2, −k2], [−k2, k2]].
        const double m = 40, k1 = 1e5, k2 = 5e4;
        var network = new NetworkBuilder().AddMass("m", m).AddNode("j")
            .AddSpring("k1", Network.Ground, "j", k1).AddSpring("k2", "j", "m", k2)
            .AddInerter("b", "j", Network.Ground, 10).Build();
        var path = Path("inerters.b.inertance", network);
        Assert.Equal("j", path.MasslessEnd);
        Assert.False(path.Admits(0));
        Assert.Contains("the inerter carries the massless node 'j'", Assert.Single(new StudyRequest(path, 0, 20, 3, StudySpacing.Linear, []).Problems()));
        var result = ParameterStudy.Run(network, Request(path, 1, 20, 5));
        for (var s = 0; s < result.Steps.Length; s++)
        {
            var b = result.Steps[s].Value;
            var (low, high) = SpatialNetworks.TwoByTwo(k1 + k2, -k2, k2, b, m);
            NumericAssert.Close(new[] { Hz(low), Hz(high) }, result.Steps[s].FrequenciesHz, Tolerance.Rel(1e-10), $"b = {b}");
        }
        Assert.Null(Path("inerters.b.inertance", Grounded(15)).MasslessEnd);
    }
}
