using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.SpatialNetworks;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>
/// Loads in plane and 3d models (f_q = Tᵀ f through the attachment maps) and the forces each mount transmits, against
/// hand solutions of the rigid-body equations, closed forms and equilibrium.
/// </summary>
public class SpatialLoadTests
{
    // A plane skid: m, J_yy about its centre of mass (origin), two mounts a h below it at x = +A1 and x = −A2, each k_x and
    // k_z to ground; an unbalance at point q of the skid turning in the x–z plane.
    private const double SkidMass = 800, SkidJ = 260, A1 = 0.7, A2 = 0.9, H = 0.45, Kx = 2.0e5, Kz = 6.0e5, Eta = 0.06;
    private const double MassRadius = 0.012, Qx = 0.3, Qz = 0.25;

    private static Network Skid(bool dampers = false)
    {
        var b = new NetworkBuilder { Space = ModelSpace.Plane, Title = "skid on two mounts" };
        b.AddBody(new RigidBody("skid", SkidMass, new Point3(0, 0, 0), new InertiaMatrix(SkidJ * 1.2, SkidJ, SkidJ * 1.5),
            [new BodyPoint("front", new Point3(A1, 0, -H)), new BodyPoint("rear", new Point3(-A2, 0, -H)), new BodyPoint("rotor", new Point3(Qx, 0, Qz))]));
        foreach (var (name, point) in new[] { ("mount-front", "skid.front"), ("mount-rear", "skid.rear") })
        {
            b.AddSpring(new Spring(name, point, Network.Ground, Kz) { Components = [K(Direction.X, Kx), K(Direction.Z, Kz)] });
            if (dampers)
                b.AddDamper(new Damper(name + "-damper", point, Network.Ground, 900) { Components = [K(Direction.X, 500), K(Direction.Z, 900), K(Direction.Ry, 40)] });
        }
        return b.Build();
    }

    private static UnbalanceLoad Unbalance(double? speedHz = null) =>
        new("rotor", "skid.rotor", MassRadius, speedHz, 0.4) { Plane = [Direction.X, Direction.Z] };

    /// <summary>
    /// The hand solution: the 3×3 dynamic stiffness in (x, z, θ) of the skid written from its geometry. A mount at
    /// (r_x, −H) stretches Δx = x − H θ and Δz = z − r_x θ (u_p = u_c + θ × r in the x–z plane, any dynamics text), so
    /// K = Σ k_x [1, 0, −H]ᵀ[1, 0, −H] + k_z [0, 1, −r_x]ᵀ[0, 1, −r_x]; the rotor's force F = m·e·ω²·e^{iφ}(1, −i) at q
    /// adds the moment q_z F_x − q_x F_z about y.
    /// </summary>
    private static (Complex[] X, Complex[] Fx, Complex[] Fz) HandSolution(double frequencyHz)
    {
        var w = 2 * Math.PI * frequencyHz;
        var k = new double[3, 3];
        foreach (var rx in new[] { A1, -A2 })
        {
            double[] tx = [1, 0, -H], tz = [0, 1, -rx];
            for (var i = 0; i < 3; i++)
                for (var j = 0; j < 3; j++) k[i, j] += Kx * tx[i] * tx[j] + Kz * tz[i] * tz[j];
        }
        double[] m = [SkidMass, SkidMass, SkidJ];
        var z = MathNet.Numerics.LinearAlgebra.Matrix<Complex>.Build.Dense(3, 3, (i, j) => new Complex(1, Eta) * k[i, j] - (i == j ? w * w * m[i] : 0));
        var f = Complex.FromPolarCoordinates(MassRadius * w * w, 0.4);
        var (fx, fz) = (f, -Complex.ImaginaryOne * f);
        var b = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.DenseOfArray([fx, fz, Qz * fx - Qx * fz]);
        var x = z.Solve(b).ToArray();
        Complex[] MountX(double rx) => [new Complex(1, Eta) * Kx * (x[0] - H * x[2])];
        Complex[] MountZ(double rx) => [new Complex(1, Eta) * Kz * (x[1] - rx * x[2])];
        return (x, [MountX(A1)[0], MountX(-A2)[0]], [MountZ(A1)[0], MountZ(-A2)[0]]);
    }

    private static DampedSystem System(Network network, params Load[] loads) =>
        DampedSystem.Build(new StructuralModel(network, new DampingModel([], null, Eta), [.. loads]));

    [Theory]
    [InlineData(HarmonicMethod.Direct)]
    [InlineData(HarmonicMethod.Modal)]
    public void UnbalanceOnARigidBodyOnTwoMounts_MountForcesMatchTheHandSolution(HarmonicMethod method)
    {
        // Hand solution above (3×3 (x, z, ry) dynamic stiffness, derived by hand); 1e-9 relative.
        var system = System(Skid(), Unbalance());
        double[] frequencies = [2.5, 4.0, 7.3, 11.0, 19.0];
        var result = HarmonicAnalysis.Sweep(system, frequencies, system.Model.Loads, ["skid.x", "skid.z", "skid.ry"], method);
        for (var k = 0; k < frequencies.Length; k++)
        {
            var (x, fx, fz) = HandSolution(frequencies[k]);
            for (var d = 0; d < 3; d++)
                NumericAssert.Small((result.Responses[d].Displacement[k] - x[d]).Magnitude, 1e-9 * x.Max(v => v.Magnitude), $"{result.Responses[d].Dof} at {frequencies[k]} Hz");
            var scale = fz.Concat(fx).Max(v => v.Magnitude);
            foreach (var (mount, i) in new[] { ("mount-front", 0), ("mount-rear", 1) })
            {
                NumericAssert.Small((Force(result, mount, "x")[k] - fx[i]).Magnitude, 1e-9 * scale, $"{mount} x at {frequencies[k]} Hz");
                NumericAssert.Small((Force(result, mount, "z")[k] - fz[i]).Magnitude, 1e-9 * scale, $"{mount} z at {frequencies[k]} Hz");
            }
        }
        Assert.All(result.MountForces, m => Assert.Equal("N", m.Unit));
        Assert.Empty(result.ElementForces);
    }

    [Fact]
    public void UnbalanceAtItsRunningSpeed_GivesTheOperatingPointMountForces()
    {
        // The operating point is the single-frequency solve at the running speed: the hand solution there, 1e-9 relative.
        const double speed = 24.5;
        var system = System(Skid(), Unbalance(speed));
        var result = HarmonicAnalysis.Solve(system, HarmonicSpec.Default(1, 40, 60));
        var at = Assert.Single(result.OperatingPoints).Response;
        var (_, fx, fz) = HandSolution(speed);
        NumericAssert.Small((Force(at, "mount-rear", "z")[0] - fz[1]).Magnitude, 1e-9 * fz[1].Magnitude, "rear mount z");
        NumericAssert.Small((Force(at, "mount-front", "x")[0] - fx[0]).Magnitude, 1e-9 * fx[0].Magnitude, "front mount x");
        var peaks = result.MountForcePeaks();
        Assert.Equal(result.MountForces.Length, peaks.Length);
        foreach (var (force, magnitude, _) in peaks)
            NumericAssert.Close(force.Force.Max(f => f.Magnitude), magnitude, Tolerance.Abs(0), $"peak of {force.Element} {force.Direction}");
    }

    [Fact]
    public void SumOfMountForces_EqualsTheAppliedForceMinusTheInertiaForce()
    {
        // Equilibrium of the rigid body (Newton–Euler, any dynamics text): Σ f_mount = F + ω² m X for each translation and
        // Σ r × f_mount = M_F + ω² J θ about the centre of mass, springs (with loss factor) and dampers together; 1e-9 relative.
        var network = Skid(dampers: true);
        var system = System(network, Unbalance());
        var frequencies = Enumerable.Range(1, 40).Select(i => 0.75 * i).ToArray();
        var result = HarmonicAnalysis.Sweep(system, frequencies, system.Model.Loads, ["skid.x", "skid.z", "skid.ry"], HarmonicMethod.Direct);
        var lever = new Dictionary<string, Point3> { ["mount-front"] = new(A1, 0, -H), ["mount-rear"] = new(-A2, 0, -H) };
        for (var k = 0; k < frequencies.Length; k++)
        {
            var w = 2 * Math.PI * frequencies[k];
            var f = Complex.FromPolarCoordinates(MassRadius * w * w, 0.4);
            var (fx, fz) = (f, -Complex.ImaginaryOne * f);
            Complex Sum(string direction) => result.MountForces.Where(m => m.Direction == direction).Aggregate(Complex.Zero, (s, m) => s + m.Force[k]);
            Complex Moment() => result.MountForces.Aggregate(Complex.Zero, (s, m) =>
            {
                var r = lever[m.Element.Replace("-damper", "")];
                return s + m.Direction switch { "x" => r.Z * m.Force[k], "z" => -r.X * m.Force[k], "ry" => m.Force[k], _ => Complex.Zero };
            });
            var (x, z, theta) = (result.Responses[0].Displacement[k], result.Responses[1].Displacement[k], result.Responses[2].Displacement[k]);
            var scale = f.Magnitude + w * w * SkidMass * Math.Max(x.Magnitude, z.Magnitude);
            NumericAssert.Small((Sum("x") - (fx + w * w * SkidMass * x)).Magnitude, 1e-9 * scale, $"Σ f_x at {frequencies[k]} Hz");
            NumericAssert.Small((Sum("z") - (fz + w * w * SkidMass * z)).Magnitude, 1e-9 * scale, $"Σ f_z at {frequencies[k]} Hz");
            NumericAssert.Small((Moment() - (Qz * fx - Qx * fz + w * w * SkidJ * theta)).Magnitude, 1e-9 * scale, $"Σ r × f at {frequencies[k]} Hz");
        }
        Assert.Contains(result.MountForces, m => m.Direction == "ry" && m.Unit == "N*m" && m.Kind == ElementKind.Damper);
    }

    [Fact]
    public void PointMassWithAForceInX_MovesInXOnly()
    {
        // A mass on three orthogonal springs: x obeys X = F/(k_x − ω²m) (single-DOF closed form, any vibration text); y and z stay exactly at rest.
        const double m = 50, kx = 4e5, ky = 7e5, kz = 9e5, f0 = 120;
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", m) { Location = new Point3(0.2, 0.1, 1.0) });
        b.AddSpring(new Spring("s", "m", Network.Ground, kz) { Components = [K(Direction.X, kx), K(Direction.Y, ky), K(Direction.Z, kz)] });
        var system = HarmonicModels.System(b.Build(), null, new ForceLoad("push", "m", f0, 0) { Direction = Direction.X });
        double[] frequencies = [3, 9, 12, 30];
        var result = HarmonicAnalysis.Sweep(system, frequencies, system.Model.Loads, Labels(system), HarmonicMethod.Direct);
        Assert.Equal(["m.x", "m.y", "m.z"], result.Responses.Select(r => r.Dof));
        for (var k = 0; k < frequencies.Length; k++)
        {
            var w2 = Math.Pow(2 * Math.PI * frequencies[k], 2);
            NumericAssert.Close(f0 / (kx - w2 * m), result.Responses[0].Displacement[k].Real, Tolerance.Rel(1e-10), $"x at {frequencies[k]} Hz");
            NumericAssert.Small(result.Responses[1].Displacement[k].Magnitude, 1e-12 * result.Responses[0].Displacement[k].Magnitude, "y");
            NumericAssert.Small(result.Responses[2].Displacement[k].Magnitude, 1e-12 * result.Responses[0].Displacement[k].Magnitude, "z");
            NumericAssert.Close(kx * f0 / (kx - w2 * m), Force(result, "s", "x")[k].Real, Tolerance.Rel(1e-10), "mount force x = k_x X");
        }
    }

    [Fact]
    public void MomentOnASymmetricBlock_TurnsItAboutThatAxisOnly()
    {
        // Yaw of a block on four equal mounts is uncoupled by symmetry: θ_z = M/(4k_h(a² + b²) − ω²J_z) (REFERENCES.md §10
        // closed form; derivable by hand); every other DOF stays at rest (round-off of the largest response).
        const double mass = 1200, a = 0.8, bb = 0.5, h = 0.6, kh = 3e5, kz = 9e5, moment = 350;
        var inertia = new InertiaMatrix(250, 400, 520);
        var system = HarmonicModels.System(Block(mass, inertia, a, bb, h, kh, kz), null,
            new ForceLoad("torque", "block", moment, 0) { Direction = Direction.Rz });
        double[] frequencies = [1.5, 6, 13];
        var result = HarmonicAnalysis.Sweep(system, frequencies, system.Model.Loads, Labels(system), HarmonicMethod.Direct);
        for (var k = 0; k < frequencies.Length; k++)
        {
            var w2 = Math.Pow(2 * Math.PI * frequencies[k], 2);
            var expected = moment / (4 * kh * (a * a + bb * bb) - w2 * inertia.Zz);
            NumericAssert.Close(expected, result.ResponseOf("block.rz")!.Displacement[k].Real, Tolerance.Rel(1e-9), $"θ_z at {frequencies[k]} Hz");
            foreach (var r in result.Responses.Where(r => r.Dof != "block.rz"))
                NumericAssert.Small(r.Displacement[k].Magnitude, 1e-12 * Math.Abs(expected), $"{r.Dof} at {frequencies[k]} Hz");
        }
    }

    [Fact]
    public void ForceAtABodyPoint_IsTheForceAtTheCentreWithItsMoment()
    {
        // f_q = Tᵀ f: a force F_z at p on a body equals F_z at the centre plus the moment (p − c) × F (statics, any text); 1e-12 relative.
        const double mass = 1200, a = 0.8, bb = 0.5, h = 0.6, kh = 3e5, kz = 9e5, f0 = 500;
        var inertia = new InertiaMatrix(250, 400, 520);
        var network = Block(mass, inertia, a, bb, h, kh, kz);
        var atPoint = HarmonicModels.System(network, null, new ForceLoad("f", "block.foot-1", f0, 0) { Direction = Direction.Z });
        var p = new Point3(a, bb, -h);
        var split = HarmonicModels.System(network, null,
            new ForceLoad("f", "block", f0, 0) { Direction = Direction.Z },
            new ForceLoad("mx", "block", f0 * p.Y, 0) { Direction = Direction.Rx },
            new ForceLoad("my", "block", f0 * p.X, Math.PI) { Direction = Direction.Ry });
        double[] frequencies = [2, 7.5];
        var one = HarmonicAnalysis.Sweep(atPoint, frequencies, atPoint.Model.Loads, Labels(atPoint), HarmonicMethod.Direct);
        var other = HarmonicAnalysis.Sweep(split, frequencies, split.Model.Loads, Labels(split), HarmonicMethod.Direct);
        var scale = one.Responses.SelectMany(r => r.Displacement).Max(z => z.Magnitude);
        for (var i = 0; i < one.Responses.Length; i++)
            for (var k = 0; k < frequencies.Length; k++)
                NumericAssert.Small((one.Responses[i].Displacement[k] - other.Responses[i].Displacement[k]).Magnitude, 1e-12 * scale, one.Responses[i].Dof);
    }

    [Fact]
    public void BaseMotionInZOfAMassOnAZSpring_EqualsTheLineModelTransmissibility()
    {
        // |X/U| = √(1 + (2ζr)²)/√((1 − r²)² + (2ζr)²) (Chopra, Dynamics of Structures, §3.6) and the line model's own sweep; 1e-10 relative.
        const double m = 30, k = 2.4e5, zeta = 0.04;
        var c = 2 * zeta * Math.Sqrt(k * m);
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", m) { Location = new Point3(0, 0, 0.5) });
        b.AddSupport(new Support("floor") { Location = new Point3(0, 0, 0) });
        b.AddSpring(new Spring("s", "m", "floor", k) { Components = [K(Direction.X, k / 3), K(Direction.Y, k / 2), K(Direction.Z, k)] });
        b.AddDamper(new Damper("d", "m", "floor", c) { Components = [K(Direction.Z, c)] });
        var spatial = HarmonicModels.System(b.Build(), null,
            new BaseMotionLoad("shake", "floor", BaseMotionKind.Displacement, 0.002, 0) { Direction = Direction.Z });
        var line = HarmonicModels.System(HarmonicModels.Sdof(m, k, zeta, "floor"), null,
            new BaseMotionLoad("shake", "floor", BaseMotionKind.Displacement, 0.002, 0));
        var frequencies = Enumerable.Range(1, 30).Select(i => 0.5 * i).ToArray();
        var s = HarmonicAnalysis.Sweep(spatial, frequencies, spatial.Model.Loads, ["m.z", "m.x"], HarmonicMethod.Direct);
        var l = HarmonicAnalysis.Sweep(line, frequencies, line.Model.Loads, ["m"], HarmonicMethod.Direct);
        var wn = Math.Sqrt(k / m);
        for (var i = 0; i < frequencies.Length; i++)
        {
            var r = 2 * Math.PI * frequencies[i] / wn;
            var closed = Math.Sqrt(1 + Math.Pow(2 * zeta * r, 2)) / Math.Sqrt(Math.Pow(1 - r * r, 2) + Math.Pow(2 * zeta * r, 2));
            NumericAssert.Close(closed, s.Transmissibilities.Single(t => t.Dof == "m.z").Ratio[i], Tolerance.Rel(1e-10), $"T at r = {r:F3}");
            NumericAssert.Small((s.Responses[0].Displacement[i] - l.Responses[0].Displacement[i]).Magnitude, 1e-10 * l.Responses[0].Displacement[i].Magnitude, "same as the line model");
            NumericAssert.Small(s.Responses[1].Displacement[i].Magnitude, 1e-12 * s.Responses[0].Displacement[i].Magnitude, "x stays at rest");
            // The mount forces see the floor's motion through the support's prescribed column: k(X − U) and iωc(X − U).
            var lineSpring = l.ElementForces.Single(e => e.Element == "k").Force[i];
            NumericAssert.Small((Force(s, "s", "z")[i] + lineSpring).Magnitude, 1e-9 * lineSpring.Magnitude, "spring z = k(X − U), the line spring's k(U − X) reversed");
        }
        Assert.Contains(s.Reactions, r => r.Support == "floor.z");
    }

    [Fact]
    public void BodyWithProductsOfInertia_DirectAndModalMethodsAgree()
    {
        // A full inertia matrix (principal axes turned 30° about z) couples the rotations in M. The direct method forms M⁻¹;
        // modal superposition of every mass-normalised mode is exact (identity, Chopra §12.8); 1e-8 relative.
        var turn = Math.PI / 6;
        var inertia = InertiaMatrix.FromPrincipal([220, 410, 530],
            [new Point3(Math.Cos(turn), Math.Sin(turn), 0), new Point3(-Math.Sin(turn), Math.Cos(turn), 0), new Point3(0, 0, 1)]);
        var network = Block(900, inertia, 0.7, 0.45, 0.5, 2.5e5, 8e5);
        var load = new UnbalanceLoad("fan", "block.foot-2", 0.02) { Plane = [Direction.X, Direction.Y] };
        var system = DampedSystem.Build(new StructuralModel(network, new DampingModel([], null, 0.04), [load]));
        Assert.False(system.Modes.Matrices.MassIsDiagonal);
        double[] frequencies = [1.7, 4.2, 6.9, 9.8, 16];
        var direct = HarmonicAnalysis.Sweep(system, frequencies, [load], Labels(system), HarmonicMethod.Direct);
        var modal = HarmonicAnalysis.Sweep(system, frequencies, [load], Labels(system), HarmonicMethod.Modal, modeCount: 6);
        var scale = direct.Responses.SelectMany(r => r.Displacement).Max(z => z.Magnitude);
        for (var i = 0; i < direct.Responses.Length; i++)
            for (var k = 0; k < frequencies.Length; k++)
                NumericAssert.Small((direct.Responses[i].Displacement[k] - modal.Responses[i].Displacement[k]).Magnitude, 1e-8 * scale, $"{direct.Responses[i].Dof} at {frequencies[k]} Hz");
    }

    [Fact]
    public void AxialMount_ReportsItsForceAlongItsLineAndResolved()
    {
        // An axial element carries k·Δ along n = (x_B − x_A)/|x_B − x_A|; its x and z parts are that force times n_x, n_z (statics); exact.
        var b = new NetworkBuilder { Space = ModelSpace.Plane };
        b.AddMass(new Mass("m", 40) { Location = new Point3(0, 0, 1) });
        b.AddSupport(new Support("wall") { Location = new Point3(0.6, 0, 0.2) });
        b.AddSpring(new Spring("brace", "m", "wall", 3e5) { Axial = true });
        b.AddSpring(new Spring("post", "m", Network.Ground, 5e5) { Components = [K(Direction.X, 1e5), K(Direction.Z, 5e5)] });
        var system = HarmonicModels.System(b.Build(), null, new ForceLoad("f", "m", 80, 0) { Direction = Direction.X });
        var result = HarmonicAnalysis.Sweep(system, [5], system.Model.Loads, Labels(system), HarmonicMethod.Direct);
        var n = new Point3(0.6, 0, -0.8);
        var axial = Force(result, "brace", "axial")[0];
        var x = result.ResponseOf("m.x")!.Displacement[0];
        var z = result.ResponseOf("m.z")!.Displacement[0];
        NumericAssert.Small((axial - 3e5 * (n.X * x + n.Z * z)).Magnitude, 1e-12 * axial.Magnitude, "axial = k n·(u_A − u_B)");
        NumericAssert.Small((Force(result, "brace", "x")[0] - n.X * axial).Magnitude, 1e-12 * axial.Magnitude, "x part");
        NumericAssert.Small((Force(result, "brace", "z")[0] - n.Z * axial).Magnitude, 1e-12 * axial.Magnitude, "z part");
    }

    [Fact]
    public void LoadsThatCannotActInTheModel_AreRefused()
    {
        var network = Skid();
        Assert.Throws<ArgumentException>(() => HarmonicAnalysis.Sweep(System(network), [1], [new ForceLoad("f", "skid", 1, 0) { Direction = Direction.Y }], [], HarmonicMethod.Direct));
        Assert.Throws<ArgumentException>(() => HarmonicAnalysis.Sweep(System(network), [1], [new ForceLoad("f", "skid", 1, 0)], [], HarmonicMethod.Direct));
        Assert.Throws<ArgumentException>(() => HarmonicAnalysis.Sweep(System(network), [1],
            [new BaseMotionLoad("b", Network.Ground, BaseMotionKind.Displacement, 1, 0) { Direction = Direction.Z }], [], HarmonicMethod.Direct));
    }

    /// <summary>Every DOF label of the system, in matrix order.</summary>
    private static string[] Labels(DampedSystem system) =>
        [.. Enumerable.Range(0, system.Partition.FreeCount).Select(system.Partition.Free.Label)];

    private static ImmutableArray<Complex> Force(HarmonicResult result, string element, string direction) =>
        result.MountForces.Single(m => m.Element == element && m.Direction == direction).Force;
}
