using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using ResponseQuantity = ModalChain.Core.Analyses.Transient.ResponseQuantity;

namespace ModalChain.Core.Tests.Massless;

/// <summary>Massless nodes and viscoelastic mounts in plane and 3d models against closed forms and the equivalent line models.</summary>
public class SpatialMasslessTests
{
    private static DirectionalValue K(Direction d, double value) => new(d, value);

    /// <summary>
    /// A block of <paramref name="mass"/> kg, centre of mass at the origin, on four equal mounts of <paramref name="kind"/> at
    /// (±a, ±b, 0), each with stiffness k_h in x and y and k_z in z and relaxation time τ, to ground.
    /// </summary>
    private static Network BlockOnMounts(double mass, InertiaMatrix inertia, double a, double b, double kh, double kz, double tau,
        MountKind kind = MountKind.Maxwell, double strength = 0)
    {
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD, Title = "block on four mounts" };
        var corners = new[] { (1, 1), (1, -1), (-1, 1), (-1, -1) };
        var points = corners.Select((c, i) => new BodyPoint($"foot-{i + 1}", new Point3(c.Item1 * a, c.Item2 * b, 0))).ToImmutableArray();
        builder.AddBody(new RigidBody("block", mass, new Point3(0, 0, 0), inertia, points));
        for (var i = 0; i < 4; i++)
            MountExpansion.Expand(new Mount($"mount-{i + 1}", kind, $"block.foot-{i + 1}", Network.Ground, Math.Max(kh, kz), tau, strength)
            {
                Components = [K(Direction.X, kh), K(Direction.Y, kh), K(Direction.Z, kz)],
                InnerLocation = points[i].Location,
            }, builder);
        return builder.Build();
    }

    private static Complex[] AllRoots(ImmutableArray<ComplexMode> modes) =>
        [.. modes.SelectMany(r => r.IsOscillatory ? new[] { r.EigenValue, Complex.Conjugate(r.EigenValue) } : [r.EigenValue])];

    [Theory]
    [InlineData(100.0, 1e4, 0.5)]        // 4c large against √(m·4k): an oscillatory bounce pair
    [InlineData(100.0, 1e4, 1.25e-3)]    // 4c small: two real bounce roots, the fast one the mounts' relaxation
    public void BlockOnFourMaxwellMounts_BounceRoots_AreTheLineModelsCubicScaledToFourMounts(double m, double kz, double tau)
    {
        // Closed form (docs/methods.md "Massless nodes and mounts"): a mass m on one Maxwell element (spring k, damper c)
        // has s(m c s² + m k s + k c) = 0. With the centre of mass in the plane of four symmetric mounts the bounce is
        // decoupled by symmetry (a symmetric mount layout in the plane of the centre of mass: common practice), the four
        // inner nodes move alike, and the mounts act as one of spring 4k and damper 4c: the bounce roots are those of
        // m·4c s² + m·4k s + 4k·4c. The same roots must come from the line model of that one element.
        var c = kz * tau;
        var network = BlockOnMounts(m, InertiaMatrix.OfBox(m, 1.6, 1.0, 0.8), 0.6, 0.4, 0.35 * kz, kz, tau);
        var roots = ComplexModes.Solve(DampedSystem.Build(new StructuralModel(network, DampingModel.None, [])));
        var all = AllRoots(roots);
        var line = AllRoots(ComplexModes.Solve(DampedSystem.Build(new StructuralModel(MasslessTestKit.MassOnMaxwell(m, 4 * kz, 4 * c), DampingModel.None, []))));
        var (r1, r2) = MasslessTestKit.QuadraticRoots(m * 4 * c, m * 4 * kz, 4 * kz * 4 * c);
        foreach (var e in new[] { r1, r2 })
        {
            var nearest = all.MinBy(v => (v - e).Magnitude);
            NumericAssert.Small((nearest - e).Magnitude, 1e-8 * e.Magnitude, $"3d bounce root {e}");
            var inLine = line.MinBy(v => (v - e).Magnitude);
            NumericAssert.Small((inLine - e).Magnitude, 1e-8 * e.Magnitude, $"line model root {e}");
        }
        // Maxwell mounts have no static stiffness: every one of the block's six directions can rest anywhere (a zero root each).
        Assert.Equal(6, roots.Count(r => r.Kind == ComplexModeKind.RigidBody));
        // 2·6 inertial + 12 first-order states.
        Assert.Equal(24, all.Length);
        if (r1.Imaginary == 0)
        {
            var fast = roots.MinBy(r => (r.EigenValue - r1).Magnitude)!;
            Assert.Equal(ComplexModeKind.Relaxation, fast.Kind);
        }
    }

    /// <summary>A point mass at (0, 0, 0.3) on one mount of <paramref name="kind"/> to a support below it, stiffness per direction.</summary>
    private static Network MassOnOneMount(double m, double kx, double ky, double kz, double tau, MountKind kind, double strength)
    {
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD, Title = "mass on one mount" };
        var at = new Point3(0, 0, 0.3);
        builder.AddMass(new Mass("m", m) { Location = at });
        builder.AddSupport(new Support("pad") { Location = new Point3(0, 0, 0) });
        MountExpansion.Expand(new Mount("mount", kind, "m", "pad", Math.Max(kx, Math.Max(ky, kz)), tau, strength)
        {
            Components = [K(Direction.X, kx), K(Direction.Y, ky), K(Direction.Z, kz)],
            InnerLocation = at,
        }, builder);
        return builder.Build();
    }

    [Theory]
    [InlineData(MountKind.Maxwell, 0.0)]
    [InlineData(MountKind.StandardLinearSolid, 0.7)]
    public void OneMountPerDirection_StorageAndLossStiffness_AreTheClosedFormsFromAHarmonicRun(MountKind kind, double strength)
    {
        // Closed form (docs/methods.md): a Maxwell element has K*(ω) = k(ωτ)²/(1+(ωτ)²) + i·kωτ/(1+(ωτ)²); a standard
        // linear solid adds its long-term spring k1 and has k2 = Δk1 in the branch. One τ for every direction, so each
        // direction d has the same form with its own k_d. A unit force on m in d gives X_d = 1/(K*_d − ω²m): K*_d is
        // read back as 1/X_d + ω²m. The force the mount passes on in d (its spring, series with the damper) is K*_d X_d
        // for Maxwell; for the standard linear solid the branch spring carries (K*_d − k1_d) X_d.
        double m = 60, tau = 4e-3;
        var k = new Dictionary<Direction, double> { [Direction.X] = 2e5, [Direction.Y] = 3e5, [Direction.Z] = 8e5 };
        var network = MassOnOneMount(m, k[Direction.X], k[Direction.Y], k[Direction.Z], tau, kind, strength);
        double[] frequencies = [.. new[] { 0.1, 0.6, 1.0, 3.0, 20.0 }.Select(u => u / tau / (2 * Math.PI))];
        foreach (var d in new[] { Direction.X, Direction.Y, Direction.Z })
        {
            var force = new ForceLoad("f", "m", 1, 0) { Direction = d };
            var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [force]));
            var result = HarmonicAnalysis.Sweep(system, frequencies, [force], ["m"], HarmonicMethod.Direct);
            var label = $"m.{d.Label()}";
            var branch = kind == MountKind.Maxwell ? "mount~spring" : "mount~series";
            var springForce = result.MountForces.Single(f => f.Element == branch && f.Direction == d.Label());
            var damperForce = result.MountForces.Single(f => f.Element == "mount~damper" && f.Direction == d.Label());
            for (var i = 0; i < frequencies.Length; i++)
            {
                var omega = 2 * Math.PI * frequencies[i];
                var u = omega * tau;
                var kb = kind == MountKind.Maxwell ? k[d] : strength * k[d];
                var parallel = kind == MountKind.Maxwell ? 0 : k[d];
                var storage = parallel + kb * u * u / (1 + u * u);
                var loss = kb * u / (1 + u * u);
                var x = result.ResponseOf(label)!.Displacement[i];
                var kStar = 1 / x + omega * omega * m;
                NumericAssert.Close(storage, kStar.Real, Tolerance.Abs(1e-9 * k[d]), $"storage stiffness in {d} at ωτ = {u}");
                NumericAssert.Close(loss, kStar.Imaginary, Tolerance.Abs(1e-9 * k[d]), $"loss stiffness in {d} at ωτ = {u}");
                // The branch force through the series spring and damper is one force: (K* − k1) X, on end B (the pad) as reported.
                var expected = (kStar - parallel) * x;
                NumericAssert.Small((springForce.Force[i] - expected).Magnitude, 1e-8 * expected.Magnitude, $"branch spring force in {d}");
                NumericAssert.Small((damperForce.Force[i] - expected).Magnitude, 1e-8 * expected.Magnitude, $"branch damper force in {d}");
                // The other directions are not loaded and must stay still (the directions decouple).
                foreach (var other in new[] { Direction.X, Direction.Y, Direction.Z }.Where(o => o != d))
                    NumericAssert.Small(result.ResponseOf($"m.{other.Label()}")!.Displacement[i].Magnitude, 1e-12 * x.Magnitude, $"{other} under a force in {d}");
            }
        }
    }

    [Fact]
    public void ModalMethod_InSpace_FallsBackToDirect_WithTheNote()
    {
        // Common practice (as in line models): first-order states are not described by undamped modes.
        var network = MassOnOneMount(60, 2e5, 3e5, 8e5, 4e-3, MountKind.StandardLinearSolid, 0.7);
        var force = new ForceLoad("f", "m", 1, 0) { Direction = Direction.Z };
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [force]));
        Assert.True(system.HasFirstOrderStates);
        double[] frequencies = [5, 15, 40];
        var direct = HarmonicAnalysis.Sweep(system, frequencies, [force], ["m"], HarmonicMethod.Direct);
        var modal = HarmonicAnalysis.Sweep(system, frequencies, [force], ["m"], HarmonicMethod.Modal);
        Assert.Contains(modal.Notes, n => n.Contains("first-order state", StringComparison.Ordinal));
        for (var i = 0; i < frequencies.Length; i++)
            Assert.Equal(direct.ResponseOf("m.z")!.Displacement[i], modal.ResponseOf("m.z")!.Displacement[i]);
    }

    [Fact]
    public void SpringOnlyMasslessNodes_BetweenTheFeetAndGround_GiveTheSeriesSpringsModes()
    {
        // Static condensation is exact for a node without inertia (Guyan 1965): springs k1 and k2 in series through a
        // massless joint act as one of 1/k = 1/k1 + 1/k2 (closed form), per direction. The block on four feet, each
        // through a joint, must have the modes of SpatialNetworks.Block with the series stiffnesses, and each joint must
        // move by the divider k1/(k1 + k2) of its foot's motion u_p = u_c + θ × (p − c).
        double mass = 1200, a = 0.8, b = 0.5, h = 0.4;
        var inertia = InertiaMatrix.OfBox(mass, 2.0, 1.2, 1.0);
        (double K1, double K2) horizontal = (3e5, 6e5), vertical = (9e5, 1.8e6);
        double Series((double K1, double K2) p) => p.K1 * p.K2 / (p.K1 + p.K2);
        var reference = ModalAnalysis.Solve(SpatialNetworks.Block(mass, inertia, a, b, h, Series(horizontal), Series(vertical)));

        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD };
        var corners = new[] { (1, 1), (1, -1), (-1, 1), (-1, -1) };
        var feet = corners.Select((c, i) => new Point3(c.Item1 * a, c.Item2 * b, -h)).ToArray();
        builder.AddBody(new RigidBody("block", mass, new Point3(0, 0, 0), inertia, [.. feet.Select((p, i) => new BodyPoint($"foot-{i + 1}", p))]));
        for (var i = 0; i < 4; i++)
        {
            builder.AddMass(new Mass($"joint-{i + 1}", 0) { Location = feet[i] with { Z = -h - 0.1 } });
            builder.AddSpring(new Spring($"upper-{i + 1}", $"block.foot-{i + 1}", $"joint-{i + 1}", vertical.K1)
            { Components = [K(Direction.X, horizontal.K1), K(Direction.Y, horizontal.K1), K(Direction.Z, vertical.K1)] });
            builder.AddSpring(new Spring($"lower-{i + 1}", $"joint-{i + 1}", Network.Ground, vertical.K2)
            { Components = [K(Direction.X, horizontal.K2), K(Direction.Y, horizontal.K2), K(Direction.Z, vertical.K2)] });
        }
        var network = builder.Build();
        var modes = ModalAnalysis.Solve(network);

        Assert.Equal(12, modes.CondensedDofs.Length);
        Assert.Equal(6, modes.Modes.Length);
        var dofs = modes.Matrices.Dofs;
        var block = reference.Matrices.Dofs;
        for (var j = 0; j < 6; j++)
        {
            NumericAssert.Close(reference.Modes[j].NaturalFrequencyHz, modes.Modes[j].NaturalFrequencyHz, Tolerance.Rel(1e-10), $"mode {j + 1}");
            var phi = modes.Modes[j].Shape;
            var all = Directions.All(ModelSpace.ThreeD);
            var sign = Math.Sign(all.Sum(d => phi[dofs.IndexOf("block", d)] * reference.Modes[j].Shape[block.IndexOf("block", d)]));
            double At(Direction d) => phi[dofs.IndexOf("block", d)];
            foreach (var d in all)
                NumericAssert.Close(reference.Modes[j].Shape[block.IndexOf("block", d)], sign * At(d), Tolerance.Abs(1e-7), $"mode {j + 1} block.{d.Label()}");
            for (var i = 0; i < 4; i++)
            {
                var r = feet[i];
                // u_p = u_c + θ × r
                var foot = new Dictionary<Direction, double>
                {
                    [Direction.X] = At(Direction.X) + At(Direction.Ry) * r.Z - At(Direction.Rz) * r.Y,
                    [Direction.Y] = At(Direction.Y) - At(Direction.Rx) * r.Z + At(Direction.Rz) * r.X,
                    [Direction.Z] = At(Direction.Z) + At(Direction.Rx) * r.Y - At(Direction.Ry) * r.X,
                };
                foreach (var (d, pair) in new[] { (Direction.X, horizontal), (Direction.Y, horizontal), (Direction.Z, vertical) })
                    NumericAssert.Close(foot[d] * pair.K1 / (pair.K1 + pair.K2), phi[dofs.IndexOf($"joint-{i + 1}", d)], Tolerance.Abs(1e-9),
                        $"mode {j + 1} joint-{i + 1}.{d.Label()}");
            }
        }
        Assert.True(modes.Quality.MaxResidual < 1e-10, $"residual {modes.Quality.MaxResidual}");
    }

    [Fact]
    public void SpringOnlyMasslessJoints_ModalAndDirectHarmonicAndTransient_Agree()
    {
        // Identity: with modal damping C = MΦ diag(2ζω) ΦᵀM has zero rows at the massless joints, so they stay static
        // (no first-order state) and the modal method runs on the condensed modes. Modal superposition of every mode
        // and the direct solve (harmonic), and modal superposition and the exact state-space integration (transient),
        // solve the same equations and must agree.
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD };
        var feet = new[] { (1, 1), (1, -1), (-1, 1), (-1, -1) }.Select(c => new Point3(c.Item1 * 0.8, c.Item2 * 0.5, -0.4)).ToArray();
        builder.AddBody(new RigidBody("block", 1200, new Point3(0, 0, 0), InertiaMatrix.OfBox(1200, 2.0, 1.2, 1.0),
            [.. feet.Select((p, i) => new BodyPoint($"foot-{i + 1}", p))]));
        for (var i = 0; i < 4; i++)
        {
            builder.AddMass(new Mass($"joint-{i + 1}", 0) { Location = feet[i] with { Z = -0.5 } });
            builder.AddSpring(new Spring($"upper-{i + 1}", $"block.foot-{i + 1}", $"joint-{i + 1}", 9e5)
            { Components = [K(Direction.X, 3e5), K(Direction.Y, 3e5), K(Direction.Z, 9e5)] });
            builder.AddSpring(new Spring($"lower-{i + 1}", $"joint-{i + 1}", Network.Ground, 1.8e6)
            { Components = [K(Direction.X, 6e5), K(Direction.Y, 6e5), K(Direction.Z, 1.8e6)] });
        }
        var network = builder.Build();
        var force = new ForceLoad("f", "block.foot-1", 1, 0) { Direction = Direction.Z };
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.Modal(0.03), [force]));
        Assert.False(system.HasFirstOrderStates);

        double[] frequencies = [2, 5, 8, 11, 14, 20];
        string[] outputs = ["block", "joint-1"];
        var direct = HarmonicAnalysis.Sweep(system, frequencies, [force], outputs, HarmonicMethod.Direct);
        var modal = HarmonicAnalysis.Sweep(system, frequencies, [force], outputs, HarmonicMethod.Modal);
        var largest = direct.Responses.Max(r => r.Displacement.Max(x => x.Magnitude));
        foreach (var r in direct.Responses)
            for (var i = 0; i < frequencies.Length; i++)
                NumericAssert.Small((modal.ResponseOf(r.Dof)!.Displacement[i] - r.Displacement[i]).Magnitude, 1e-9 * largest, $"{r.Dof} at {frequencies[i]} Hz");

        var step = new StepFunction(800, 0);
        ForceHistory Push() => new("push", "block.foot-1", 1, step) { Direction = Direction.Z };
        var exact = TransientAnalysis.Run(system, [Push()], [], new TransientSettings(0.5, 1e-3, TransientMethod.Exact));
        var superposed = TransientAnalysis.Run(system, [Push()], [], new TransientSettings(0.5, 1e-3, TransientMethod.Modal));
        Assert.Contains("first-order form", exact.MethodDescription, StringComparison.Ordinal);
        foreach (var o in new[] { "block.z", "block.ry", "joint-1.z" })
        {
            var e = exact.Get(o, ResponseQuantity.Displacement).Values;
            var m = superposed.Get(o, ResponseQuantity.Displacement).Values;
            var scale = e.Max(Math.Abs);
            for (var s = 0; s < e.Length; s++)
                NumericAssert.Small(Math.Abs(m[s] - e[s]), 1e-6 * scale, $"{o} at step {s}");
        }
    }

    /// <summary>
    /// The same chain in a plane model (everything moving in z only) and in a line model: a massless joint between two
    /// springs under m1, a standard-linear-solid mount under m1 and a Maxwell mount between m2 and ground.
    /// </summary>
    private static (Network Plane, Network Line) Chain()
    {
        double m1 = 300, m2 = 120, k1 = 4e5, k2 = 6e5, k3 = 2.5e5;
        var sls = new Mount("soft", MountKind.StandardLinearSolid, "m1", Network.Ground, 1.5e5, 6e-3, 0.8);
        var maxwell = new Mount("creep", MountKind.Maxwell, "m2", Network.Ground, 9e4, 0.02);

        var plane = new NetworkBuilder { Space = ModelSpace.Plane, Title = "chain in a plane" };
        ImmutableArray<Direction> z = [Direction.Z];
        plane.AddMass(new Mass("m1", m1) { Location = new Point3(0, 0, 1), Moves = z });
        plane.AddMass(new Mass("m2", m2) { Location = new Point3(0, 0, 2), Moves = z });
        plane.AddMass(new Mass("joint", 0) { Location = new Point3(0, 0, 0.5), Moves = z });
        plane.AddSpring(new Spring("lower", Network.Ground, "joint", k1) { Components = [K(Direction.Z, k1)] });
        plane.AddSpring(new Spring("upper", "joint", "m1", k2) { Components = [K(Direction.Z, k2)] });
        plane.AddSpring(new Spring("link", "m1", "m2", k3) { Components = [K(Direction.Z, k3)] });
        MountExpansion.Expand(sls with { Components = [K(Direction.Z, sls.Stiffness)], InnerLocation = new Point3(0, 0, 1) }, plane);
        MountExpansion.Expand(maxwell with { Components = [K(Direction.Z, maxwell.Stiffness)], InnerLocation = new Point3(0, 0, 2) }, plane);

        var line = new NetworkBuilder { Title = "chain in a line" };
        line.AddMass("m1", m1).AddMass("m2", m2).AddNode("joint");
        line.AddSpring("lower", Network.Ground, "joint", k1).AddSpring("upper", "joint", "m1", k2).AddSpring("link", "m1", "m2", k3);
        MountExpansion.Expand(sls, line);
        MountExpansion.Expand(maxwell, line);
        return (plane.Build(), line.Build());
    }

    [Fact]
    public void PlaneModelMovingInZOnly_MatchesTheEquivalentLineModel_InRootsHarmonicAndTransient()
    {
        // Reference: the line model of the same chain (its massless-node machinery is checked against closed forms in
        // FirstOrderRootTests, MaxwellHarmonicTests and FirstOrderTransientTests). The plane model, every node moving in
        // z alone, has the same M, C and K in another numbering, so roots, responses and time histories must agree.
        var (plane, line) = Chain();
        var planeSystem = DampedSystem.Build(StructuralModel.Of(plane));
        var lineSystem = DampedSystem.Build(StructuralModel.Of(line));

        var planeRoots = AllRoots(ComplexModes.Solve(planeSystem)).OrderBy(r => r.Real).ThenBy(r => r.Imaginary).ToArray();
        var lineRoots = AllRoots(ComplexModes.Solve(lineSystem)).OrderBy(r => r.Real).ThenBy(r => r.Imaginary).ToArray();
        Assert.Equal(lineRoots.Length, planeRoots.Length);
        var scale = lineRoots.Max(r => r.Magnitude);
        for (var i = 0; i < lineRoots.Length; i++)
            NumericAssert.Small((planeRoots[i] - lineRoots[i]).Magnitude, 1e-9 * scale, $"root {lineRoots[i]}");

        var planeModes = ModalAnalysis.Solve(plane);
        var lineModes = ModalAnalysis.Solve(line);
        Assert.Equal(lineModes.Modes.Length, planeModes.Modes.Length);
        for (var j = 0; j < lineModes.Modes.Length; j++)
            NumericAssert.Close(lineModes.Modes[j].NaturalFrequencyHz, planeModes.Modes[j].NaturalFrequencyHz, Tolerance.Rel(1e-10), $"undamped mode {j + 1}");

        string[] outputs = ["m1", "m2", "joint", "soft~inner", "creep~inner"];
        double[] frequencies = [0.7, 3, 6.5, 11, 25, 60];
        var planeForce = new ForceLoad("f", "m2", 1, 0) { Direction = Direction.Z };
        var lineForce = new ForceLoad("f", "m2", 1, 0);
        var planeSweep = HarmonicAnalysis.Sweep(planeSystem, frequencies, [planeForce], outputs, HarmonicMethod.Direct);
        var lineSweep = HarmonicAnalysis.Sweep(lineSystem, frequencies, [lineForce], outputs, HarmonicMethod.Direct);
        foreach (var o in outputs)
            for (var i = 0; i < frequencies.Length; i++)
            {
                var expected = lineSweep.ResponseOf(o)!.Displacement[i];
                NumericAssert.Small((planeSweep.ResponseOf(o)!.Displacement[i] - expected).Magnitude, 1e-9 * expected.Magnitude + 1e-18, $"{o} at {frequencies[i]} Hz");
            }

        var settings = new TransientSettings(0.4, 1e-3, TransientMethod.Newmark);
        var step = new StepFunction(500, 0);
        var planeRun = TransientAnalysis.Run(planeSystem, [new ForceHistory("push", "m2", 1, step) { Direction = Direction.Z }], [], settings);
        var lineRun = TransientAnalysis.Run(lineSystem, [new ForceHistory("push", "m2", 1, step)], [], settings);
        Assert.Contains("first-order form", planeRun.MethodDescription, StringComparison.Ordinal);
        foreach (var o in outputs)
        {
            var expected = lineRun.Get(o, ResponseQuantity.Displacement).Values;
            var actual = planeRun.Get(o, ResponseQuantity.Displacement).Values;
            var largest = expected.Max(Math.Abs);
            for (var s = 0; s < expected.Length; s++)
                NumericAssert.Small(Math.Abs(actual[s] - expected[s]), 1e-9 * largest, $"{o} at step {s}");
        }
        // Energy balance E₀ + W = T + V + D over every DOF, the massless ones included (common practice: the library warns at 1 %).
        Assert.True(planeRun.Energy.MaxRelativeError < 5e-3, $"energy balance closes only to {planeRun.Energy.MaxRelativeError}");
    }
}
