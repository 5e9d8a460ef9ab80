using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Inerters;

/// <summary>Inerters in plane and 3d models: their M terms through the attachment rows, and the modal figures with a full M.</summary>
public class SpatialInerterMassTests
{
    private static DirectionalValue V(Direction d, double value) => new(d, value);

    [Theory]
    [InlineData(240.0, 9.5e4, 360.0)]
    [InlineData(1.5, 2e3, 0.25)]
    public void APointMassOnAVerticalSpringWithAnInerterToGround_HasTheFrequencyOfMassPlusInertance(double m, double k, double b)
    {
        // ω = √(k/(m + b)) (closed form of m ẍ + b ẍ + k x = 0; issue 11).
        var network = new NetworkBuilder { Space = ModelSpace.ThreeD }
            .AddMass(new Mass("tuned", m) { Location = new Point3(0.4, -0.2, 1.1), Moves = [Direction.Z] })
            .AddSpring(new Spring("k", "tuned", Network.Ground, k) { Components = [V(Direction.Z, k)] })
            .AddInerter(new Inerter("b", "tuned", Network.Ground, b) { Components = [V(Direction.Z, b)] })
            .Build();
        var result = ModalAnalysis.Solve(network);
        var mode = Assert.Single(result.Modes);
        NumericAssert.Close(Math.Sqrt(k / (m + b)), mode.AngularFrequency, Tolerance.Rel(1e-12), "ω");
        // The grounded terminal counts in ι_zᵀMι_z; the effective mass of the one mode is all of it.
        NumericAssert.Close(m + b, result.TotalByDirection.Single(t => t.Direction == Direction.Z).Value, Tolerance.Rel(1e-15), "ι_zᵀMι_z");
        NumericAssert.Close(m + b, mode.Participation.Single(p => p.Direction == Direction.Z).EffectiveMass, Tolerance.Rel(1e-12), "M*_z");
    }

    [Fact]
    public void AnInerterBetweenTwoPointMassesAlongX_GivesTheLineModelsMassMatrixAndFrequencies()
    {
        // In x the 3d model is the line model: M_x = [[m1 + b, −b], [−b, m2 + b]] (the two-terminal element matrix,
        // identity), and its x modes have the line model's frequencies (identity; 1e-12 relative, two eigen solves).
        const double m1 = 1200, m2 = 85, b = 40, k1 = 4e6, k2 = 2e5;
        var spatial = new NetworkBuilder { Space = ModelSpace.ThreeD }
            .AddMass(new Mass("deck", m1) { Location = new Point3(0, 0, 0) })
            .AddMass(new Mass("skid", m2) { Location = new Point3(2, 0.5, 0.3) })
            .AddSpring(new Spring("k1", Network.Ground, "deck", k1) { Components = [V(Direction.X, k1), V(Direction.Y, 3e6), V(Direction.Z, 5e6)] })
            .AddSpring(new Spring("k2", "deck", "skid", k2) { Components = [V(Direction.X, k2), V(Direction.Y, 1.1e5), V(Direction.Z, 2.9e5)] })
            .AddInerter(new Inerter("b", "deck", "skid", b) { Components = [V(Direction.X, b)] })
            .Build();
        var line = new NetworkBuilder().AddMass("deck", m1).AddMass("skid", m2)
            .AddSpring("k1", Network.Ground, "deck", k1).AddSpring("k2", "deck", "skid", k2)
            .AddInerter("b", "deck", "skid", b).Build();

        var matrices = Assembler.Assemble(spatial, referencePoint: null);
        Assert.False(matrices.MassIsDiagonal);
        var dofs = matrices.Dofs;
        var expected = Matrix<double>.Build.Dense(dofs.Count, dofs.Count);
        foreach (var (node, kg) in new[] { ("deck", m1), ("skid", m2) })
            foreach (var d in new[] { Direction.X, Direction.Y, Direction.Z })
                expected[dofs.IndexOf(node, d), dofs.IndexOf(node, d)] = kg;
        int dx = dofs.IndexOf("deck", Direction.X), sx = dofs.IndexOf("skid", Direction.X);
        expected[dx, dx] += b;
        expected[sx, sx] += b;
        expected[dx, sx] -= b;
        expected[sx, dx] -= b;
        NumericAssert.Close(expected, matrices.DenseMass(), Tolerance.Abs(0), "M");
        NumericAssert.Close(expected, SupportPartition.Assemble(spatial).Mass, Tolerance.Abs(0), "M of the support partition");

        var lineModes = ModalAnalysis.Solve(line).Modes;
        var xModes = ModalAnalysis.Solve(spatial).Modes
            .Where(mode => mode.KineticEnergyByDirection.Single(s => s.Direction == Direction.X).Value > 0.5).ToArray();
        Assert.Equal(2, xModes.Length);
        for (var j = 0; j < 2; j++)
            NumericAssert.Close(lineModes[j].NaturalFrequencyHz, xModes[j].NaturalFrequencyHz, Tolerance.Rel(1e-12), $"x mode {j + 1}");
    }

    [Theory]
    [InlineData(30.0)]
    [InlineData(-65.0)]
    public void AnAxialInerterAtAnAngleInAPlaneModel_AddsBTimesNNTransposed(double degrees)
    {
        // Axial element along n = (cos α, sin α) in (x, z): M_e = b n nᵀ (closed form of b (n·ü)² / 2 as kinetic co-energy).
        const double m = 500, b = 120, length = 1.8;
        var alpha = degrees * Math.PI / 180;
        var anchor = new Point3(length * Math.Cos(alpha), 0, length * Math.Sin(alpha));
        var network = new NetworkBuilder { Space = ModelSpace.Plane }
            .AddMass(new Mass("cabinet", m) { Location = new Point3(0, 0, 0) })
            .AddSupport(new Support("wall") { Location = anchor })
            .AddSpring(new Spring("feet", "cabinet", Network.Ground, 2e5) { Components = [V(Direction.X, 2e5), V(Direction.Z, 6e5)] })
            .AddInerter(new Inerter("brace", "wall", "cabinet", b) { Axial = true })
            .Build();
        var matrices = Assembler.Assemble(network, referencePoint: null);
        var dofs = matrices.Dofs;
        int x = dofs.IndexOf("cabinet", Direction.X), z = dofs.IndexOf("cabinet", Direction.Z);
        double c = Math.Cos(alpha), s = Math.Sin(alpha);
        var expected = Matrix<double>.Build.Dense(2, 2);
        expected[0, 0] = m + b * c * c;
        expected[1, 1] = m + b * s * s;
        expected[0, 1] = expected[1, 0] = b * c * s;
        var got = Matrix<double>.Build.DenseOfArray(new[,] { { matrices.Mass[x, x], matrices.Mass[x, z] }, { matrices.Mass[z, x], matrices.Mass[z, z] } });
        NumericAssert.Close(expected, got, Tolerance.Abs(1e-12 * (m + b)), "M");
        Assert.False(matrices.MassIsDiagonal);
        // The support partition carries the same terminal into M_fp: its columns wall.x and wall.z hold −b n nᵀ.
        var partition = SupportPartition.Assemble(network);
        int wx = partition.SupportIndex("wall", Direction.X), wz = partition.SupportIndex("wall", Direction.Z);
        NumericAssert.Close(-b * c * s, partition.MassFP[x, wz], Tolerance.Abs(1e-12 * b), "M_fp (x, wall.z)");
        NumericAssert.Close(-b * c * c, partition.MassFP[x, wx], Tolerance.Abs(1e-12 * b), "M_fp (x, wall.x)");
        NumericAssert.Close(b * s * s, partition.MassPP[wz, wz], Tolerance.Abs(1e-12 * b), "M_pp (wall.z, wall.z)");
    }

    [Fact]
    public void AnInerterAtABodyPoint_AddsBATransposedA_WithTheAttachmentRowsBuiltByHand()
    {
        // u_p = u_c + θ × r, r = p − c: row x = [1, 0, 0, 0, r_z, −r_y], y = [0, 1, 0, −r_z, 0, r_x],
        // z = [0, 0, 1, r_y, −r_x, 0] over (x, y, z, rx, ry, rz); M gains Σ_d b_d a_dᵀ a_d (identity, written out here
        // independently of the attachment map).
        const double mass = 1850, bx = 35, by = 60, bz = 90, br = 12;
        var c = new Point3(0.2, -0.1, 0.6);
        var p = new Point3(1.1, 0.55, 0.1);
        var inertia = new InertiaMatrix(420, 610, 520);
        var network = new NetworkBuilder { Space = ModelSpace.ThreeD }
            .AddBody(new RigidBody("skid", mass, c, inertia, [new BodyPoint("foot", p)]))
            .AddSpring(new Spring("mount", "skid", Network.Ground, 1e6)
            {
                Components = [V(Direction.X, 1e6), V(Direction.Y, 1e6), V(Direction.Z, 1e6), V(Direction.Rx, 1e5), V(Direction.Ry, 1e5), V(Direction.Rz, 1e5)],
            })
            .AddInerter(new Inerter("b", "skid.foot", Network.Ground, bz) { Components = [V(Direction.X, bx), V(Direction.Y, by), V(Direction.Z, bz), V(Direction.Ry, br)] })
            .Build();
        var matrices = Assembler.Assemble(network, referencePoint: null);
        var dofs = matrices.Dofs;
        Direction[] order = [Direction.X, Direction.Y, Direction.Z, Direction.Rx, Direction.Ry, Direction.Rz];
        var index = order.Select(d => dofs.IndexOf("skid", d)).ToArray();
        double rx = p.X - c.X, ry = p.Y - c.Y, rz = p.Z - c.Z;
        var rows = new (double B, double[] A)[]
        {
            (bx, [1, 0, 0, 0, rz, -ry]),
            (by, [0, 1, 0, -rz, 0, rx]),
            (bz, [0, 0, 1, ry, -rx, 0]),
            (br, [0, 0, 0, 0, 1, 0]),
        };
        var expected = Matrix<double>.Build.Dense(6, 6);
        for (var i = 0; i < 3; i++) expected[i, i] = mass;
        var j = inertia.ToArray();
        for (var r = 0; r < 3; r++)
            for (var q = 0; q < 3; q++) expected[3 + r, 3 + q] = j[r, q];
        foreach (var (bd, a) in rows)
            for (var r = 0; r < 6; r++)
                for (var q = 0; q < 6; q++) expected[r, q] += bd * a[r] * a[q];
        var got = Matrix<double>.Build.Dense(6, 6, (r, q) => matrices.Mass[index[r], index[q]]);
        NumericAssert.Close(expected, got, Tolerance.Abs(1e-12 * mass), "M of the body");
        Assert.False(matrices.MassIsDiagonal);
    }

    [Fact]
    public void EffectiveMassesPerDirection_SumToIotaTransposedMIota_WithInertersToSupportsCountedAndBetweenNodesCancelled()
    {
        // Σ_modes (φᵀMι_d)²/φᵀMφ = ι_dᵀMι_d for M-orthonormal complete modes (identity). For a translation d, ι_dᵀMι_d is
        // the physical mass plus the d-components of the inerters to supports: an inerter between two moving nodes sees
        // no relative motion under a rigid translation (hand sum, common practice).
        const double foot = GroundedInertance;
        var network = BlockWithPump();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(result.Matrices.Size, result.Modes.Length);
        Assert.False(result.Matrices.MassIsDiagonal);
        var physical = network.TotalMass;
        var expectedTranslation = new Dictionary<Direction, double>
        {
            [Direction.X] = physical,
            [Direction.Y] = physical + foot,
            [Direction.Z] = physical + 2 * foot,
        };
        foreach (var total in result.TotalByDirection)
        {
            var sum = result.Modes.Sum(mode => mode.Participation.Single(p => p.Direction == total.Direction).EffectiveMass);
            NumericAssert.Close(total.Value, sum, Tolerance.Rel(1e-10), $"Σ M*_{total.Direction}");
            if (expectedTranslation.TryGetValue(total.Direction, out var hand))
                NumericAssert.Close(hand, total.Value, Tolerance.Rel(1e-13), $"ι_{total.Direction}ᵀMι");
            NumericAssert.Close(1.0, result.Modes[^1].Participation.Single(p => p.Direction == total.Direction).CumulativeFraction, Tolerance.Abs(1e-10), "cumulative fraction");
        }
        // Mass-normalised shapes: φᵀMφ = 1 with the full M (identity).
        var m = result.Matrices.Mass;
        foreach (var mode in result.Modes)
        {
            var phi = Vector<double>.Build.DenseOfEnumerable(mode.Shape);
            NumericAssert.Close(1.0, phi * (m * phi), Tolerance.Abs(1e-10), $"φᵀMφ of mode {mode.Number}");
        }
    }

    private const double GroundedInertance = 75;

    /// <summary>A block on four mounts carrying a pump on a mount, an axial inerter between the pump and a foot, and an inerter from another foot to a support.</summary>
    private static Network BlockWithPump()
    {
        var block = SpatialNetworks.Block(900, new InertiaMatrix(160, 210, 250), 0.6, 0.4, 0.3, 4e5, 9e5);
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD };
        foreach (var body in block.Bodies) builder.AddBody(body);
        foreach (var spring in block.Springs) builder.AddSpring(spring);
        return builder.AddMass(new Mass("pump", 120) { Location = new Point3(0.3, 0.1, 0.5) })
            .AddSpring(new Spring("pump-mount", "pump", "block", 2e5) { Components = [V(Direction.X, 2e5), V(Direction.Y, 1.5e5), V(Direction.Z, 3e5)] })
            .AddInerter(new Inerter("coupler", "pump", "block.foot-1", 140) { Axial = true })
            .AddSupport(new Support("floor") { Location = new Point3(0.9, -0.8, -0.3) })
            .AddInerter(new Inerter("grounded", "block.foot-2", "floor", GroundedInertance)
            {
                Components = [V(Direction.Y, GroundedInertance), V(Direction.Z, 2 * GroundedInertance)],
            })
            .Build();
    }

    [Fact]
    public void TheSparseSolver_AgreesWithTheDenseOne_OnTheFullM()
    {
        // Shift-invert Lanczos on the sparse K and full M against the dense generalised solve (identity: two solvers of
        // the same K φ = ω² M φ); both residuals ‖Kφ − ω²Mφ‖/‖Kφ‖ small with the full M. 1e-9 relative.
        var network = BlockWithPump();
        var dense = ModalAnalysis.Solve(network);
        var sparse = ModalAnalysis.Solve(network, new ModalOptions(4, new ModalChain.Core.Solvers.ShiftInvertLanczos()));
        Assert.Equal(4, sparse.Modes.Length);
        for (var j = 0; j < 4; j++)
            NumericAssert.Close(dense.Modes[j].EigenValue, sparse.Modes[j].EigenValue, Tolerance.Rel(1e-9), $"ω² of mode {j + 1}");
        NumericAssert.Small(sparse.Quality.MaxResidual, 1e-8, "residual of the sparse solve");
        NumericAssert.Small(sparse.Quality.MaxOrthogonalityError, 1e-8, "ΦᵀMΦ − I of the sparse solve");
    }

    [Fact]
    public void RotationalAndPointMassMisuse_AreCallerErrors()
    {
        // A rotation at a point-mass end has no meaning (a point mass does not rotate): the assembler refuses it, as for springs.
        var network = new NetworkBuilder { Space = ModelSpace.ThreeD }
            .AddMass(new Mass("m", 10) { Location = new Point3(0, 0, 0) })
            .AddSpring(new Spring("k", "m", Network.Ground, 1e4) { Components = [V(Direction.X, 1e4), V(Direction.Y, 1e4), V(Direction.Z, 1e4)] })
            .AddInerter(new Inerter("b", "m", Network.Ground, 0) { Components = [V(Direction.Rz, 3)] })
            .Build();
        Assert.Throws<ArgumentException>(() => Assembler.Assemble(network, referencePoint: null));
        Assert.Throws<ArgumentException>(() => new NetworkBuilder { Space = ModelSpace.Plane }
            .AddMass(new Mass("m", 10) { Location = new Point3(0, 0, 0) }).AddInerter("b", "m", Network.Ground, 5));
        Assert.Throws<ArgumentException>(() => new NetworkBuilder().AddMass("m", 10)
            .AddInerter(new Inerter("b", "m", Network.Ground, 5) { Axial = true }));
        Assert.Throws<ArgumentOutOfRangeException>(() => new NetworkBuilder { Space = ModelSpace.Plane }
            .AddMass(new Mass("m", 10) { Location = new Point3(0, 0, 0) })
            .AddInerter(new Inerter("b", "m", Network.Ground, 5) { Components = [V(Direction.X, -5)] }));
    }
}
