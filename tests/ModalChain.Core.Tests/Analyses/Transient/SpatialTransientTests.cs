using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.SpatialNetworks;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>Timed loads in plane and 3d models (f_q = Tᵀ f(t)) and the mount forces recorded with their peaks.</summary>
public class SpatialTransientTests
{
    private static DampedSystem System(Network network) => DampedSystem.Build(StructuralModel.Of(network));

    [Fact]
    public void StepForceInXOnAPointMass_MovesItInXOnly_AndTheMountPeaksAtTwiceTheForce()
    {
        // Undamped single DOF under a suddenly applied force: u = F/k (1 − cos ωt), so the spring force peaks at 2F at
        // t = π/ω (Chopra, Dynamics of Structures, §4.3); Newmark with 400 steps per period, 2e-4 relative.
        const double m = 20, kx = 8e4, ky = 1.1e5, kz = 1.5e5, f0 = 60;
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", m) { Location = new Point3(0, 0, 0.3) });
        b.AddSpring(new Spring("mount", "m", Network.Ground, kz) { Components = [K(Direction.X, kx), K(Direction.Y, ky), K(Direction.Z, kz)] });
        var period = 2 * Math.PI / Math.Sqrt(kx / m);
        var settings = new TransientSettings(1.5 * period, period / 400);
        var result = TransientAnalysis.Run(System(b.Build()),
            [new ForceHistory("push", "m", 1, new StepFunction(f0, 0)) { Direction = Direction.X }], [], settings);
        var x = result.Get("m.x", ResponseQuantity.Displacement);
        NumericAssert.Close(2 * f0 / kx, x.Peak.Value, Tolerance.Rel(2e-4), "peak u_x = 2F/k");
        NumericAssert.Close(period / 2, x.Peak.Time, Tolerance.Abs(settings.Step), "at half a period");
        Assert.Equal(0, result.Get("m.y", ResponseQuantity.Displacement).Peak.Value);
        Assert.Equal(0, result.Get("m.z", ResponseQuantity.Displacement).Peak.Value);
        var mount = result.Responses.Single(r => r.Name == "mount" && r.Quantity == ResponseQuantity.SpringForce && r.Direction == "x");
        NumericAssert.Close(2 * f0, mount.Peak.Value, Tolerance.Rel(2e-4), "peak mount force in x = 2F");
        Assert.Equal("N", mount.Unit);
        Assert.Equal(0, result.Responses.Single(r => r.Name == "mount" && r.Direction == "z").Peak.Value);
    }

    [Fact]
    public void MomentStepOnASymmetricBlock_TurnsItAboutZOnly()
    {
        // Yaw of a block on four equal mounts is uncoupled by symmetry (REFERENCES.md §10): θ = M/K (1 − cos ωt) with
        // K = 4k_h(a² + b²), peak 2M/K (Chopra §4.3); each mount's rotation-free components carry the yaw; 2e-4 relative.
        const double mass = 1200, a = 0.8, bb = 0.5, h = 0.6, kh = 3e5, kz = 9e5, moment = 400;
        var inertia = new InertiaMatrix(250, 400, 520);
        var stiffness = 4 * kh * (a * a + bb * bb);
        var period = 2 * Math.PI / Math.Sqrt(stiffness / inertia.Zz);
        var settings = new TransientSettings(period, period / 400);
        var result = TransientAnalysis.Run(System(Block(mass, inertia, a, bb, h, kh, kz)),
            [new ForceHistory("torque", "block", 1, new StepFunction(moment, 0)) { Direction = Direction.Rz }], [], settings);
        var theta = result.Get("block.rz", ResponseQuantity.Displacement).Peak.Value;
        NumericAssert.Close(2 * moment / stiffness, theta, Tolerance.Rel(2e-4), "peak θ_z = 2M/K");
        foreach (var r in result.Responses.Where(r => r.Quantity == ResponseQuantity.Displacement && r.Name != "block.rz"))
            NumericAssert.Small(Math.Abs(r.Peak.Value), 1e-9 * theta, r.Name);
        // Mount 1 at (a, b): its x part is −b θ and its y part a θ (u = θ × r), times k_h.
        var fx = result.Responses.Single(r => r.Name == "mount-1" && r.Direction == "x").Peak.Value;
        NumericAssert.Close(-bb * kh * theta, fx, Tolerance.Rel(1e-6), "mount-1 x = −b k_h θ");
    }

    [Fact]
    public void BaseAccelerationInZ_GivesTheLineModelHistories()
    {
        // The same mass, spring and damper written as a 3d model moving in z and as a line model: identical equations, so
        // identical Newmark histories (identity; 1e-9 of the largest value); the mount force is k(u − u_s), the line spring's reversed.
        const double m = 12, k = 6e4, c = 90;
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", m) { Location = new Point3(0, 0, 1) });
        b.AddSupport(new Support("floor") { Location = new Point3(0, 0, 0) });
        b.AddSpring(new Spring("s", "m", "floor", k) { Components = [K(Direction.X, k), K(Direction.Y, k), K(Direction.Z, k)] });
        b.AddDamper(new Damper("d", "m", "floor", c) { Components = [K(Direction.Z, c)] });
        var line = new NetworkBuilder().AddMass("m", m).AddSupport("floor").AddSpring("s", "floor", "m", k).AddDamper("d", "floor", "m", c).Build();
        var shake = new SineFunction(3.0, 7.5);
        var settings = new TransientSettings(1.0, 1e-3);
        var spatial = TransientAnalysis.Run(System(b.Build()), [new SupportAccelerationHistory("shake", "floor", shake) { Direction = Direction.Z }], [], settings);
        var reference = TransientAnalysis.Run(System(line), [new SupportAccelerationHistory("shake", "floor", shake)], [], settings);
        var z = spatial.Get("m.z", ResponseQuantity.Displacement).Values;
        var u = reference.Get("m", ResponseQuantity.Displacement).Values;
        var scale = u.Max(Math.Abs);
        for (var i = 0; i < u.Length; i++) NumericAssert.Small(Math.Abs(z[i] - u[i]), 1e-9 * scale, $"u at step {i}");
        Assert.Equal(0, spatial.Get("m.x", ResponseQuantity.Displacement).Peak.Value);
        var mount = spatial.Responses.Single(r => r.Name == "s" && r.Direction == "z").Values;
        var spring = reference.Get("s", ResponseQuantity.SpringForce).Values;
        var forceScale = spring.Max(Math.Abs);
        for (var i = 0; i < spring.Length; i++) NumericAssert.Small(Math.Abs(mount[i] + spring[i]), 1e-9 * forceScale, $"mount force at step {i}");
    }
}
