using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>Transient runs on a model's full damping model (modal, Rayleigh), through <see cref="DampedSystem"/>.</summary>
public class DampingModelTransientTests
{
    private const double M = 80, K = 2e5, Zeta = 0.05;
    private static readonly double Omega = Math.Sqrt(K / M);

    private static DampedSystem OnMovingSlab(DampingModel damping)
    {
        var network = new NetworkBuilder().AddSupport("slab").AddMass("shelf", M).AddSpring("post", "slab", "shelf", K).Build();
        return DampedSystem.Build(new StructuralModel(network, damping, []));
    }

    [Theory]
    [InlineData(TransientMethod.Exact)]
    [InlineData(TransientMethod.Modal)]
    [InlineData(TransientMethod.Newmark)]
    public void ModalDamping_OnAMovingSupport_DampsTheRelativeMotion(TransientMethod method)
    {
        // Modal damping acts on the motion relative to the support (see DampingAssembly), so for a step support
        // acceleration a0 the relative motion is the damped step response z = −(a0/ω²)[1 − e^(−ζωt)(cos ω_d t +
        // ζ/√(1−ζ²) sin ω_d t)] (Chopra, Dynamics of Structures, §4.3 and §6.2 — from memory; closed form re-derived).
        const double a0 = 0.8;
        var system = OnMovingSlab(DampingModel.Modal(Zeta));
        var period = 2 * Math.PI / Omega;
        var result = TransientAnalysis.Run(system, [new SupportAccelerationHistory("quake", "slab", new StepFunction(a0, 0))], [],
            new TransientSettings(4 * period, period / 400, method));
        var wd = Omega * Math.Sqrt(1 - Zeta * Zeta);
        var force = result.Get("post", ResponseQuantity.SpringForce);
        var reaction = result.Get("slab", ResponseQuantity.Reaction);
        var tolerance = method == TransientMethod.Newmark ? 3e-3 : 1e-3;
        for (var s = 0; s < result.Times.Length; s += 40)
        {
            var t = result.Times[s];
            var z = -(a0 / (Omega * Omega)) * (1 - Math.Exp(-Zeta * Omega * t) * (Math.Cos(wd * t) + Zeta / Math.Sqrt(1 - Zeta * Zeta) * Math.Sin(wd * t)));
            NumericAssert.Close(-K * z, force.Values[s], Tolerance.Abs(tolerance * M * a0), $"{method} spring force at {t:F4}");
            // The slab receives the spring force plus the damping force c ż of the relative motion.
            var zDot = result.Get("shelf", ResponseQuantity.Velocity).Values[s] - a0 * t;
            NumericAssert.Close(K * z + 2 * Zeta * Omega * M * zDot, reaction.Values[s], Tolerance.Abs(tolerance * M * a0), $"{method} reaction at {t:F4}");
        }
    }

    [Fact]
    public void LossFactor_IsLeftOutWithAWarning()
    {
        var system = OnMovingSlab(new DampingModel([], null, 0.04));
        var result = TransientAnalysis.Run(system, [], [new InitialCondition("shelf", 1e-3, 0)], new TransientSettings(1, 1e-3));
        Assert.Contains(result.Warnings, w => w.Contains("loss factor"));
        // Without viscous damping the free vibration keeps its amplitude (Newmark has no amplitude decay).
        NumericAssert.Close(1e-3, result.Get("shelf", ResponseQuantity.Displacement).Values.Max(), Tolerance.Rel(1e-3), "amplitude");
    }
}
