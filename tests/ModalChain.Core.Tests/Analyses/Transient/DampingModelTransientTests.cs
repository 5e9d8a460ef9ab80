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
    [Fact]
    public void ModalDamping_NewmarkInModalCoordinates_MatchesThePhysicalStep()
    {
        // Modal damping fills C, so the analysis steps Newmark's recurrence in u = Φq with all modes. The recurrence is
        // linear in M, C and K and ΦᵀMΦ = I, ΦᵀCΦ and ΦᵀKΦ are diagonal, so it must equal the physical step on the
        // dense C to round-off (identity; Bathe, Finite Element Procedures, 1996, §9.3, from memory).
        var network = new NetworkBuilder().AddSupport("floor")
            .AddMass("a", 60).AddMass("b", 45).AddMass("c", 90).AddMass("d", 30).AddMass("e", 70)
            .AddSpring("s1", "floor", "a", 3e5).AddSpring("s2", "a", "b", 2e5).AddSpring("s3", "b", "c", 4e5)
            .AddSpring("s4", "c", "d", 1.5e5).AddSpring("s5", "d", "e", 2.5e5).AddSpring("s6", "a", "d", 1e5).Build();
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.Modal(0.03), []));
        var pulse = new HalfSinePulse(500, 0.02, 0.005);
        const double h = 1e-3;
        const int steps = 400;
        var result = TransientAnalysis.Run(system, [new ForceHistory("bump", "e", 1.0, pulse)], [new InitialCondition("b", 1e-3, 0.02)],
            new TransientSettings(steps * h, h, TransientMethod.Newmark));
        Assert.Contains("coordinates of all 5 undamped modes", result.MethodDescription);

        var p = system.Partition;
        var dofs = p.Free;
        var u0 = new double[5];
        var v0 = new double[5];
        u0[dofs.IndexOf("b")] = 1e-3;
        v0[dofs.IndexOf("b")] = 0.02;
        var reference = TransientTestKit.Run("newmark", new LinearDynamicSystem(p.Mass, system.Damping.FF, p.StiffnessFF),
            TransientTestKit.Force(5, dofs.IndexOf("e"), pulse), u0, v0, h, steps);
        foreach (var mass in new[] { "a", "c", "e" })
        {
            var history = result.Get(mass, ResponseQuantity.Displacement).Values;
            var scale = reference.U.Max(u => Math.Abs(u[dofs.IndexOf(mass)]));
            for (var s = 0; s <= steps; s += 20)
                NumericAssert.Close(reference.U[s][dofs.IndexOf(mass)], history[s], Tolerance.Abs(1e-9 * scale), $"{mass} at step {s}");
        }
        Assert.True(result.Energy.MaxRelativeError < 1e-9, $"energy balance {result.Energy.MaxRelativeError}");
    }
}
