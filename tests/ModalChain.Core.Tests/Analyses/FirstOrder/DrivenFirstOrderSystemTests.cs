using ModalChain.Core.Analyses.FirstOrder;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.FirstOrder;

/// <summary>
/// The driven first-order form on a mechanical network: a mass m held by a spring k and joined by an inerter b to a
/// support whose velocity steps to V at t = 0. In the relative coordinate y = x − x_p, (m + b) ÿ + k y = −m ẍ_p with
/// ẍ_p = V δ(t), so y(0⁺) = 0, ẏ(0⁺) = −mV/(m + b) and, with ω² = k/(m + b),
/// x(t) = V t − mV/((m + b) ω) sin ωt, ẋ(t) = V − mV/(m + b) cos ωt (closed form derived here from the equation of
/// motion of base excitation, common practice; the jump ẋ(0⁺) = bV/(m + b) is the momentum balance of the inerter).
/// </summary>
public class DrivenFirstOrderSystemTests
{
    private const double M = 2.0, B = 0.5, K = 800.0, V = 0.3;

    private static DrivenFirstOrderSystem System()
    {
        var builder = new NetworkBuilder { Title = "mass on a moving base" };
        builder.AddMass("m", M);
        builder.AddSupport("base");
        builder.AddSpring("k", "base", "m", K);
        builder.AddInerter("b", "base", "m", B);
        return DrivenFirstOrderSystem.Build(SupportPartition.Assemble(builder.Build()), ["base"], []);
    }

    [Fact]
    public void VelocityStepOfTheSupport_GivesTheBaseExcitationClosedForm_WithTheInertersVelocityJump()
    {
        var system = System();
        var w = Math.Sqrt(K / (M + B));
        var amplitude = M * V / (M + B);
        var samples = 0;
        var free = system.Partition.Free.IndexOf("m");
        var support = system.Partition.SupportIndex("base");
        system.Run([new StepFunction(V, 0)], 0.5, 1e-3, (k, t, s) =>
        {
            samples++;
            NumericAssert.Close(V * t - amplitude / w * Math.Sin(w * t), s.Displacement[free], Tolerance.Abs(1e-12), $"x({t})");
            NumericAssert.Close(V - amplitude * Math.Cos(w * t), s.Velocity[free], Tolerance.Abs(1e-12), $"ẋ({t})");
            NumericAssert.Close(amplitude * w * Math.Sin(w * t), s.Acceleration[free], Tolerance.Abs(1e-10), $"ẍ({t})");
            NumericAssert.Close(V * t, s.SupportDisplacement[support], Tolerance.Abs(1e-14), $"x_p({t})");
            Assert.Equal(V, s.SupportVelocity[support]);
        });
        Assert.Equal(501, samples);
    }

    [Fact]
    public void Ground_CannotBeDriven()
    {
        var builder = new NetworkBuilder { Title = "t" };
        builder.AddMass("m", 1);
        builder.AddSpring("k", Network.Ground, "m", 1);
        Assert.Throws<ArgumentException>(() => DrivenFirstOrderSystem.Build(SupportPartition.Assemble(builder.Build()), [Network.Ground], []));
    }
}
