using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>A support moved at a prescribed velocity history: against the equivalent acceleration history and closed forms.</summary>
public class SupportVelocityHistoryTests
{
    private const double M = 80, K = 2e5, Inertance = 12, Damping = 300;

    // A shelf on a post from a slab, with a damper and an inerter also from the slab (so the support's displacement,
    // velocity and acceleration each load the shelf: −K_fp u_s − C_fp u̇_s − M_fp ü_s).
    private static Network Shelf() => new NetworkBuilder().AddSupport("slab").AddMass("shelf", M)
        .AddSpring("post", "slab", "shelf", K).AddDamper("pad", "slab", "shelf", Damping).AddInerter("flywheel", "slab", "shelf", Inertance).Build();

    private static TransientResult Run(TransientExcitation e, double h, double duration, TransientMethod method = TransientMethod.Exact)
    {
        var network = Shelf();
        return TransientAnalysis.Run(network, Assembler.Assemble(network), [e], [], new TransientSettings(duration, h, method));
    }

    [Theory]
    [InlineData(TransientMethod.Exact)]
    [InlineData(TransientMethod.Newmark)]
    public void VelocityRamp_IsTheSameLoadAsItsConstantAcceleration(TransientMethod method)
    {
        // Identity: a velocity rising linearly, v(t) = a0·t, is the integral of the constant acceleration a0 from rest; the
        // grid derivative and the corrected trapezoid are exact for it, so both excitations give the same support motion
        // and the same response on the same grid: 1e-9 of the largest value asserted (rounding).
        const double a0 = 0.8, duration = 0.5, h = 1e-3;
        var byAcceleration = Run(new SupportAccelerationHistory("quake", "slab", new StepFunction(a0, 0)), h, duration, method);
        var byVelocity = Run(new SupportVelocityHistory("quake", "slab", new RampFunction(0, a0 * duration, duration)), h, duration, method);
        foreach (var (name, quantity) in new[] { ("shelf", ResponseQuantity.Displacement), ("shelf", ResponseQuantity.Velocity),
                     ("shelf", ResponseQuantity.Acceleration), ("post", ResponseQuantity.SpringForce), ("slab", ResponseQuantity.Reaction) })
        {
            var expected = byAcceleration.Get(name, quantity).Values;
            var actual = byVelocity.Get(name, quantity).Values;
            var scale = expected.Max(Math.Abs);
            Assert.True(scale > 0, $"{name} {quantity} moves");
            NumericAssert.Close(expected, actual, Tolerance.Abs(1e-9 * scale), $"{name} {quantity}");
        }
    }

    [Fact]
    public void ConstantVelocityFromRest_GivesTheClosedForm()
    {
        // Closed form: the slab moves at v0 from t = 0 (u_s = v0·t, ü_s = 0), the shelf starts at rest; without the damper
        // and inerter, x = v0·t − (v0/ω)·sin ωt. The velocity is constant on the grid (no jump to differentiate) and the
        // support's displacement linear, which the exact integrator's first-order hold follows exactly: 1e-9 relative to
        // the largest displacement asserted.
        const double v0 = 0.05;
        var network = new NetworkBuilder().AddSupport("slab").AddMass("shelf", M).AddSpring("post", "slab", "shelf", K).Build();
        var omega = Math.Sqrt(K / M);
        var period = 2 * Math.PI / omega;
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network),
            [new SupportVelocityHistory("push", "slab", new StepFunction(v0, 0))], [], new TransientSettings(3 * period, period / 200, TransientMethod.Exact));
        var x = result.Get("shelf", ResponseQuantity.Displacement).Values;
        var scale = v0 * 3 * period;
        for (var s = 0; s < result.Times.Length; s++)
        {
            var t = result.Times[s];
            NumericAssert.Close(v0 * t - v0 / omega * Math.Sin(omega * t), x[s], Tolerance.Abs(1e-9 * scale), $"x at {t:F5} s");
        }
    }

    [Fact]
    public void SineVelocity_ConvergesAtSecondOrderToItsAccelerationForm()
    {
        // v(t) = V sin(2πft) against a(t) = 2πfV cos(2πft) (its derivative; the support starts at rest in both, u_s(0) = 0,
        // with v(0) = 0). The acceleration form is exact for a linear between steps and the velocity form differentiates on
        // the grid, both second order: halving the step must divide their difference by about 4 (between 3 and 5
        // asserted), and at h = T_f/400 it is below 1e-3 of the response.
        const double v = 0.02, f = 7;
        var duration = 0.6;
        double Difference(double h)
        {
            var a = Run(new SupportAccelerationHistory("shake", "slab", new SineFunction(2 * Math.PI * f * v, f, Math.PI / 2)), h, duration);
            var b = Run(new SupportVelocityHistory("shake", "slab", new SineFunction(v, f)), h, duration);
            var x = a.Get("shelf", ResponseQuantity.Displacement).Values;
            var y = b.Get("shelf", ResponseQuantity.Displacement).Values;
            return x.Zip(y).Max(p => Math.Abs(p.First - p.Second)) / x.Max(Math.Abs);
        }
        var coarse = Difference(1.0 / (f * 200));
        var fine = Difference(1.0 / (f * 400));
        Assert.InRange(coarse / fine, 3.0, 5.0);
        NumericAssert.Small(fine, 1e-3, "relative difference at h = T/400");
    }

    [Fact]
    public void VelocityJump_GivesTheInerterTheImpulseOfItsJump()
    {
        // Momentum (closed form): a velocity jump Δv of the slab through the inerter b alone (no spring, no damper) changes
        // the shelf's momentum by b·Δv in the end — (m + b)·ẋ = b·u̇_s once the jump is over — whatever the step; the grid
        // spreads the impulse over two steps. 1e-9 relative asserted.
        const double dv = 0.3;
        var network = new NetworkBuilder().AddSupport("slab").AddMass("shelf", M).AddInerter("flywheel", "slab", "shelf", Inertance).Build();
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network),
            [new SupportVelocityHistory("kick", "slab", new StepFunction(dv, 0.0105))], [], new TransientSettings(0.05, 1e-3, TransientMethod.Exact));
        var velocity = result.Get("shelf", ResponseQuantity.Velocity).Values;
        NumericAssert.Close(Inertance * dv / (M + Inertance), velocity[^1], Tolerance.Rel(1e-9), "shelf velocity after the jump");
        NumericAssert.Small(velocity[5], 1e-12, "shelf at rest before the jump");
    }

    [Fact]
    public void ScaleMinusOne_TurnsTheMotion()
    {
        // Linearity (identity): a scale of −1 gives the negative of the response, to rounding.
        var plus = Run(new SupportVelocityHistory("s", "slab", new HalfSinePulse(0.1, 0.05)), 1e-3, 0.3);
        var minus = Run(new SupportVelocityHistory("s", "slab", new HalfSinePulse(0.1, 0.05)) { Scale = -1 }, 1e-3, 0.3);
        var x = plus.Get("shelf", ResponseQuantity.Displacement).Values;
        var y = minus.Get("shelf", ResponseQuantity.Displacement).Values;
        NumericAssert.Close([.. x.Select(value => -value)], y, Tolerance.Abs(1e-12 * x.Max(Math.Abs)), "x with the scale turned");
    }
}
