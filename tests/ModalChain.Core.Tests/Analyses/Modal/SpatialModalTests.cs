using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.SpatialNetworks;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Modal analysis of plane and 3d models: closed forms, rigid-body modes, participation per direction, names.</summary>
public class SpatialModalTests
{
    private static double[] Omegas(ModalResult r) => [.. r.Modes.Select(m => m.AngularFrequency)];

    [Fact]
    public void RigidBar_BounceAndPitch_MatchThePublishedExample()
    {
        // REFERENCES.md §10 (Rao, two-DOF chapter [from memory]; values recomputed): ω = 5.8593, 9.4341 rad/s; node
        // points 2.646 m behind and 0.306 m ahead of the centre of mass; recomputed from the 2×2 closed form too.
        var result = ModalAnalysis.Solve(Bar());
        var (low, high) = TwoByTwo(KFront + KRear, KRear * LRear - KFront * LFront, KFront * LFront * LFront + KRear * LRear * LRear, BarMass, BarInertia);
        NumericAssert.Close(new[] { Math.Sqrt(low), Math.Sqrt(high), Math.Sqrt(2 * KSurge / BarMass) }, Omegas(result), Tolerance.Rel(1e-10), "ω against the closed form");
        NumericAssert.Close(new[] { 5.8593, 9.4341 }, Omegas(result)[..2], Tolerance.Abs(1e-4), "ω (REFERENCES.md §10)");
        // A point at x along the bar moves u_z = z − x θ: the node point is x = z/θ.
        double Node(Mode m) => result.ShapeAt(m, "bar", Direction.Z) / result.ShapeAt(m, "bar", Direction.Ry);
        NumericAssert.Close(-2.646, Node(result.Modes[0]), Tolerance.Abs(5e-4), "mode 1 node point (behind the centre of mass)");
        NumericAssert.Close(0.306, Node(result.Modes[1]), Tolerance.Abs(5e-4), "mode 2 node point (ahead of the centre of mass)");
        NumericAssert.Close(-(KRear * LRear - KFront * LFront) / (KFront + KRear - BarMass * low), Node(result.Modes[0]), Tolerance.Rel(1e-9), "mode 1 node from the 2×2 eigenvector");
        Assert.Equal(["bounce", "pitch", "surge"], result.Modes.Select(m => m.Motion));
        Assert.Equal(0, result.RigidBodyModeCount);
    }

    [Fact]
    public void RigidBar_KineticSharesAndStrainShares_MatchTheHandSolution()
    {
        var result = ModalAnalysis.Solve(Bar());
        foreach (var mode in result.Modes.Take(2))
        {
            var z = result.ShapeAt(mode, "bar", Direction.Z);
            var t = result.ShapeAt(mode, "bar", Direction.Ry);
            // Kinetic energy m z² and J θ² (mass-normalised, so they sum to 1); strain energy k u² at each spring.
            var share = BarMass * z * z;
            NumericAssert.Close(share, mode.KineticEnergyByDirection.Single(s => s.Direction == Direction.Z).Value, Tolerance.Abs(1e-12), $"mode {mode.Number} bounce share");
            NumericAssert.Close(1 - share, mode.KineticEnergyByDirection.Single(s => s.Direction == Direction.Ry).Value, Tolerance.Abs(1e-12), $"mode {mode.Number} pitch share");
            NumericAssert.Close(Math.Max(share, 1 - share), mode.Decoupling, Tolerance.Abs(1e-12), $"mode {mode.Number} decoupling");
            var front = KFront * Math.Pow(z - LFront * t, 2);
            var rear = KRear * Math.Pow(z + LRear * t, 2);
            NumericAssert.Close(new[] { front / (front + rear), rear / (front + rear) }, mode.StrainEnergyShare, Tolerance.Abs(1e-12), $"mode {mode.Number} strain shares");
        }
    }

    [Fact]
    public void RigidBarIn3dWithVerticalSpringsOnly_HasFourRigidBodyModesNamedByDirection()
    {
        // z springs on the bar's axis hold bounce and pitch only: surge, sway, roll and yaw are free (common practice).
        var result = ModalAnalysis.Solve(Bar(ModelSpace.ThreeD, surgeSprings: false));
        Assert.Equal(4, result.RigidBodyModeCount);
        Assert.All(result.Modes.Take(4), m => Assert.Equal(0, m.NaturalFrequencyHz));
        Assert.Equal(["surge", "sway", "roll", "yaw"], result.Modes.Take(4).Select(m => m.Motion));
        Assert.All(result.Modes.Take(4), m => NumericAssert.Close(1, m.Decoupling, Tolerance.Abs(1e-9), $"mode {m.Number} decoupling"));
        var (low, high) = TwoByTwo(KFront + KRear, KRear * LRear - KFront * LFront, KFront * LFront * LFront + KRear * LRear * LRear, BarMass, BarInertia);
        NumericAssert.Close(new[] { Math.Sqrt(low), Math.Sqrt(high) }, Omegas(result)[4..], Tolerance.Rel(1e-9), "bounce and pitch as in the plane model");
        NumericAssert.Small(result.Quality.MaxOrthogonalityError, 1e-12, "Φᵀ M Φ − I after re-basing the rigid-body modes");
    }

    [Fact]
    public void FreeBodyInSpace_HasSixPureRigidBodyModes()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("crate", 250, new Point3(1, 2, 3), new InertiaMatrix(30, 40, 50, Xy: 5), []));
        var result = ModalAnalysis.Solve(b.Build());
        Assert.Equal(6, result.RigidBodyModeCount);
        Assert.Equal(["surge", "sway", "bounce"], result.Modes.Take(3).Select(m => m.Motion));
        Assert.All(result.Modes.Take(3), m => NumericAssert.Close(1, m.Decoupling, Tolerance.Abs(1e-12), $"mode {m.Number}"));
        // The rotations are re-based in the order rx, ry, rz, each M-orthogonal to the ones before (J_xy couples rx and ry).
        Assert.Equal(["roll", "pitch", "yaw"], result.Modes.Skip(3).Select(m => m.Motion));
        NumericAssert.Small(result.Quality.MaxOrthogonalityError, 1e-12, "Φᵀ M Φ − I");
    }

    [Fact]
    public void BlockOnFourMounts_NamesBounceAndYawAndSplitsTheCoupledPairAsThe2x2Problem()
    {
        // REFERENCES.md §10: bounce √(4k_z/m), yaw √(4k_h(a²+b²)/J_z); the x–ry pair from its 2×2 problem, whose
        // eigenvector (x, θ) gives the surge share m x² / (m x² + J_y θ²) (closed form, derived by hand).
        const double mass = 1200, a = 0.8, b = 0.5, h = 0.6, kh = 3e5, kz = 9e5;
        var inertia = new InertiaMatrix(250, 400, 520);
        var result = ModalAnalysis.Solve(Block(mass, inertia, a, b, h, kh, kz));
        Mode Near(double omega2) => result.Modes.MinBy(m => Math.Abs(m.EigenValue - omega2))!;
        var bounce = Near(4 * kz / mass);
        NumericAssert.Close(4 * kz / mass, bounce.EigenValue, Tolerance.Rel(1e-10), "bounce ω²");
        Assert.Equal("bounce", bounce.Motion);
        NumericAssert.Close(1, bounce.Decoupling, Tolerance.Abs(1e-12), "bounce is pure");
        var yaw = Near(4 * kh * (a * a + b * b) / inertia.Zz);
        NumericAssert.Close(4 * kh * (a * a + b * b) / inertia.Zz, yaw.EigenValue, Tolerance.Rel(1e-10), "yaw ω²");
        Assert.Equal("yaw", yaw.Motion);
        var (k11, k12, k22) = (4 * kh, -4 * kh * h, 4 * kz * a * a + 4 * kh * h * h);
        var pair = TwoByTwo(k11, k12, k22, mass, inertia.Yy);
        foreach (var lambda in new[] { pair.Low, pair.High })
        {
            var mode = Near(lambda);
            NumericAssert.Close(lambda, mode.EigenValue, Tolerance.Rel(1e-10), "x–ry ω²");
            var ratio = -k12 / (k11 - mass * lambda); // x/θ
            var surge = mass * ratio * ratio / (mass * ratio * ratio + inertia.Yy);
            NumericAssert.Close(surge, mode.KineticEnergyByDirection.Single(s => s.Direction == Direction.X).Value, Tolerance.Abs(1e-9), "surge share");
            NumericAssert.Close(Math.Max(surge, 1 - surge), mode.Decoupling, Tolerance.Abs(1e-9), "decoupling");
            var expected = Math.Max(surge, 1 - surge) >= MotionNames.DominantShare
                ? (surge > 0.5 ? "surge" : "pitch")
                : surge > 0.5 ? "coupled surge + pitch" : "coupled pitch + surge";
            Assert.Equal(expected, mode.Motion);
        }
    }

    [Fact]
    public void PointMassOnThreeOrthogonalSprings_GivesTheThreeSingleDirectionFrequencies()
    {
        // ω_d = √(k_d/m) per direction (common practice).
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", 40) { Location = new Point3(0.3, -0.2, 1.1) });
        b.AddSpring(new Spring("sx", "m", Network.Ground, 1.6e5) { Components = [K(Direction.X, 1.6e5)] });
        b.AddSpring(new Spring("sy", "m", Network.Ground, 4.0e4) { Components = [K(Direction.Y, 4.0e4)] });
        b.AddSpring(new Spring("sz", "m", Network.Ground, 9.0e4) { Components = [K(Direction.Z, 9.0e4)] });
        var result = ModalAnalysis.Solve(b.Build());
        NumericAssert.Close(new[] { Math.Sqrt(4e4 / 40), Math.Sqrt(9e4 / 40), Math.Sqrt(1.6e5 / 40) }, Omegas(result), Tolerance.Rel(1e-12), "ω");
        Assert.Equal(["sway", "bounce", "surge"], result.Modes.Select(m => m.Motion));
        NumericAssert.Close(new[] { 0.0, 40, 0 }, result.Modes.Select(m => m.EffectiveModalMass).ToArray(), Tolerance.Abs(1e-10), "vertical effective masses");
        NumericAssert.Close(new[] { 0.0, 1, 0 }, result.Modes[0].StrainEnergyShare, Tolerance.Abs(1e-12), "sway strains sy only");
    }

    [Fact]
    public void LineModelAndTheSameModelIn3dWithZOnly_GiveTheSameModes()
    {
        // A line model is the 3d model whose masses move in z only with z springs (identity of the two formulations).
        var line = new NetworkBuilder().AddMass("a", 12).AddMass("b", 7).AddMass("c", 3)
            .AddSpring("ga", Network.Ground, "a", 4e4).AddSpring("ab", "a", "b", 2.5e4).AddSpring("bc", "b", "c", 9e3).AddSpring("ac", "a", "c", 1e3).Build();
        var space = new NetworkBuilder { Space = ModelSpace.ThreeD };
        foreach (var (m, i) in line.Masses.Select((m, i) => (m, i)))
            space.AddMass(new Mass(m.Name, m.Kilograms) { Location = new Point3(i, 2 * i, -i), Moves = [Direction.Z] });
        foreach (var s in line.Springs) space.AddSpring(new Spring(s.Name, s.NodeA, s.NodeB, s.Stiffness) { Components = [K(Direction.Z, s.Stiffness)] });
        var l = ModalAnalysis.Solve(line);
        var t = ModalAnalysis.Solve(space.Build());
        Assert.Equal(["a", "b", "c"], t.Matrices.Dofs.Dofs.Select(d => d.ToString()));
        NumericAssert.Close(Omegas(l), Omegas(t), Tolerance.Rel(1e-12), "ω");
        for (var j = 0; j < 3; j++)
        {
            NumericAssert.Close(l.Modes[j].Shape, t.Modes[j].Shape, Tolerance.Abs(1e-12), $"mode {j + 1} shape");
            NumericAssert.Close(l.Modes[j].EffectiveModalMass, t.Modes[j].EffectiveModalMass, Tolerance.Abs(1e-10), $"mode {j + 1} effective mass");
            NumericAssert.Close(l.Modes[j].StrainEnergyShare, t.Modes[j].StrainEnergyShare, Tolerance.Abs(1e-12), $"mode {j + 1} strain shares");
            Assert.Equal("bounce", t.Modes[j].Motion);
        }
        NumericAssert.Close(l.TotalMass, t.TotalMass, Tolerance.Abs(0), "total mass");
    }

    [Fact]
    public void ShapeByMass_IsRefusedForSpatialModels()
    {
        var result = ModalAnalysis.Solve(Bar());
        Assert.Throws<InvalidOperationException>(() => result.ShapeByMass(result.Modes[0]));
        Assert.Equal(0, result.ShapeAt(result.Modes[0], "bar", Direction.Y));
    }

    [Fact]
    public void LineModel_CarriesOneParticipationAlongTheLine()
    {
        var result = ModalAnalysis.Solve(new NetworkBuilder().AddMass("a", 2).AddMass("b", 3)
            .AddSpring("ga", Network.Ground, "a", 100).AddSpring("ab", "a", "b", 50).Build());
        Assert.All(result.Modes, m =>
        {
            var p = Assert.Single(m.Participation);
            Assert.Equal(Direction.Along, p.Direction);
            Assert.Equal(m.EffectiveModalMass, p.EffectiveMass);
            Assert.Equal(m.CumulativeEffectiveMassFraction, p.CumulativeFraction);
            Assert.Null(m.Motion);
        });
        Assert.Equal(result.TotalMass, Assert.Single(result.TotalByDirection).Value);
    }

    [Fact]
    public void SpatialModel_BuildsADampedSystemWithModalRatios()
    {
        // Modal damping ratios applied to every elastic mode come back from Φᵀ C Φ (identity); rigid-body modes take none.
        var model = new StructuralModel(Bar(ModelSpace.ThreeD, surgeSprings: false), DampingModel.Modal(0.04), []);
        var system = DampedSystem.Build(model);
        Assert.Equal(6, system.Partition.FreeCount);
        Assert.Equal(["ground.x", "ground.y", "ground.z"], system.Partition.Supports.ToArray());
        Assert.Equal(1, system.Partition.SupportIndex(Network.Ground, Direction.Y));
        var ratios = system.ModalDampingRatios;
        Assert.All(ratios.Take(4), r => Assert.True(double.IsNaN(r)));
        NumericAssert.Close(new[] { 0.04, 0.04 }, ratios.Skip(4).ToArray(), Tolerance.Abs(1e-12), "ζ of the elastic modes");
        NumericAssert.Close(system.Partition.StiffnessFF, Assembler.Assemble(model.Network).DenseStiffness(), Tolerance.Abs(0), "K_ff equals the assembled K");
    }

    [Fact]
    public void ComplexModes_OfABodyWithAFullInertiaMatrix_FollowStiffnessProportionalDamping()
    {
        // C = βK is classical: each mode keeps its shape and ζ_j = βω_j/2 (Rayleigh damping; Chopra, Dynamics of
        // Structures, §11.4 [from memory]); M is full here, so the state matrix needs M⁻¹ through a Cholesky solve.
        const double beta = 2e-3;
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("cab", 300, new Point3(0, 0, 1), new InertiaMatrix(40, 50, 60, Xy: -6, Yz: 4, Xz: 3),
            [new BodyPoint("f1", new Point3(0.6, 0.4, 0)), new BodyPoint("f2", new Point3(-0.6, 0.4, 0)), new BodyPoint("f3", new Point3(0, -0.5, 0))]));
        foreach (var p in new[] { "f1", "f2", "f3" })
            b.AddSpring(new Spring(p, $"cab.{p}", Network.Ground, 2e5) { Components = [K(Direction.X, 8e4), K(Direction.Y, 1e5), K(Direction.Z, 2e5)] });
        var model = new StructuralModel(b.Build(), new DampingModel([], new RayleighDamping(0, beta), 0), []);
        var system = DampedSystem.Build(model);
        Assert.False(system.Modes.Matrices.MassIsDiagonal);
        var complex = ComplexModes.Solve(system);
        var expected = system.Modes.Modes.Select(m => m.AngularFrequency).ToArray();
        Assert.Equal(expected.Length, complex.Length);
        NumericAssert.Close(expected.Select(w => w / (2 * Math.PI)).ToArray(), complex.Select(c => c.UndampedFrequencyHz).ToArray(), Tolerance.Rel(1e-9), "|λ|/2π");
        NumericAssert.Close(expected.Select(w => beta * w / 2).ToArray(), complex.Select(c => c.DampingRatio).ToArray(), Tolerance.Rel(1e-8), "ζ = βω/2");
    }
}
