using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Transient;
using TQ = ModalChain.Core.Analyses.Transient.ResponseQuantity;
using ResponseQuantity = ModalChain.Core.Analyses.Harmonic.ResponseQuantity;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>Port voltage and current, source currents and the mechanical reactions of a harmonic sweep against closed forms and power balances.</summary>
public class TransducerPortOutputTests
{
    private static readonly double[] Frequencies = [2, 4.5, 5, 7.3, 11, 19, 33];

    private static HarmonicResult Sweep(Network network, params Load[] loads)
    {
        var system = DampedSystem.Build(StructuralModel.Of(network));
        return HarmonicAnalysis.Sweep(system, Frequencies, loads,
            [.. network.Masses.Select(m => m.Name).Where(m => system.Partition.Free.IndexOf(m) >= 0)], HarmonicMethod.Direct);
    }

    private static readonly Load OneVolt = new BaseMotionLoad("drive", "amp", BaseMotionKind.Velocity, 1, 0);

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void BlockedShaker_DrawsTheCurrentOfItsCoilImpedance(bool reversedBranch)
    {
        // Closed form (Ohm's law): with the coil's mechanical pair held ("frame" a support), the back voltage is 0 and a
        // source V behind R and L drives I = V/(R + iωL). The source delivers I (minus its support's reaction); the port
        // current, which the transducer drives out of n1 into the circuit, is −I with the branch [coil, ground] and +I with
        // [ground, coil] (the coil is then n2, where the current enters the transducer); the port voltage is 0. 1e-10 relative.
        const double r = 4, l = 2e-3;
        var network = new NetworkBuilder { Title = "blocked shaker" }
            .AddMass("bay", 100).AddSupport("frame").AddSupport("amp").AddMass("mid", 0).AddMass("coil", 0)
            .AddSpring("k", Network.Ground, "bay", 1e5)
            .AddDamper("re", "amp", "mid", 1 / r)
            .AddSpring("le", "mid", "coil", 1 / l)
            .AddTransducer("shaker", "frame", Network.Ground, reversedBranch ? Network.Ground : "coil", reversedBranch ? "coil" : Network.Ground, 20)
            .Build();
        var result = Sweep(network, OneVolt);
        var port = Assert.Single(result.TransducerPorts);
        var source = Assert.Single(result.SourceCurrents);
        Assert.Equal("amp", source.Support);
        Assert.DoesNotContain(result.Reactions, x => x.Support == "amp");
        var sign = reversedBranch ? 1 : -1;
        for (var k = 0; k < Frequencies.Length; k++)
        {
            var expected = 1 / new Complex(r, 2 * Math.PI * Frequencies[k] * l);
            NumericAssert.Close(expected.Real, source.Current[k].Real, Tolerance.Rel(1e-10), "Re I_source");
            NumericAssert.Close(expected.Imaginary, source.Current[k].Imaginary, Tolerance.Rel(1e-10), "Im I_source");
            NumericAssert.Close(sign * expected.Real, port.Current[k].Real, Tolerance.Rel(1e-10), "Re i_port");
            NumericAssert.Close(sign * expected.Imaginary, port.Current[k].Imaginary, Tolerance.Rel(1e-10), "Im i_port");
            Assert.Equal(0, port.Voltage[k].Magnitude);
        }
    }

    [Fact]
    public void SensorAcrossALoad_GivesTheVoltageDivider()
    {
        // Closed form (voltage divider): the sensor's coil (its port voltage u, coil resistance R_c) read across R_L gives
        // V_out = u·R_L/(R_c + R_L), and the port current is u/(R_c + R_L). 1e-10 relative.
        const double rc = 375, rl = 1e4;
        var network = ElectricalSideTests.FloorTest();
        var result = Sweep(network, new ForceLoad("push", "bay", 1000, 0));
        var sensor = result.TransducerPorts.Single(p => p.Transducer == "sensor");
        var output = result.ResponseOf("out")!;
        for (var k = 0; k < Frequencies.Length; k++)
        {
            var vOut = output.At(k, Frequencies[k], ResponseQuantity.Velocity);
            var divided = sensor.Voltage[k] * rl / (rc + rl);
            NumericAssert.Close(divided.Magnitude, vOut.Magnitude, Tolerance.Rel(1e-10), $"|V_out| at {Frequencies[k]} Hz");
            NumericAssert.Close(0, (divided - vOut).Magnitude / vOut.Magnitude, Tolerance.Abs(1e-10), "phase of V_out");
            var current = sensor.Voltage[k] / (rc + rl);
            NumericAssert.Close(0, (current - sensor.Current[k]).Magnitude / current.Magnitude, Tolerance.Abs(1e-10), "port current");
        }
    }

    [Fact]
    public void PortPower_IsThePowerTheMechanicalSideGives_AndTheSourcePowerIsAllDissipated()
    {
        // Identities of the lossless transducer in steady state (energy conservation; docs/methods.md, "Transducer
        // ports"): over a period the mechanical side dissipates what the ports take from the circuits, so
        // ½Re(Σ u·i*) + Σ_mechanical ½Re(F·Δv*) = 0, where u·i is the port power Bl·i·(v_a − v_b) delivered to the circuit;
        // and the source's power ½Re(V·I*) equals every damper's dissipation, electrical and mechanical. Both to 1e-9 of
        // the source power. Also u = Bl·(v_a − v_b) from the mechanical velocities (identity, 1e-12).
        var network = ElectricalSideTests.FloorTest();
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var outputs = network.Masses.Select(m => m.Name).Where(m => system.Partition.Free.IndexOf(m) >= 0).ToArray();
        var result = HarmonicAnalysis.Sweep(system, Frequencies, [OneVolt], outputs, HarmonicMethod.Direct);
        var elimination = ConstraintElimination.Of(network)!;
        for (var k = 0; k < Frequencies.Length; k++)
        {
            var w = 2 * Math.PI * Frequencies[k];
            Complex X(string node) => node == "amp" ? 1 / new Complex(0, w) : network.IsSupport(node) ? Complex.Zero
                : elimination.Value<Complex>(node, n => n == "amp" ? 1 / new Complex(0, w) : network.IsSupport(n) ? Complex.Zero : result.ResponseOf(n)!.Displacement[k]);
            double Dissipation(Damper d)
            {
                var dv = new Complex(0, w) * (X(d.NodeA) - X(d.NodeB));
                return 0.5 * d.Coefficient * dv.Magnitude * dv.Magnitude;
            }
            var mechanical = network.Dampers.Where(d => !network.IsElectrical(d.NodeA) && !network.IsElectrical(d.NodeB)).Sum(Dissipation);
            var all = network.Dampers.Sum(Dissipation);
            var ports = result.TransducerPorts.Sum(p => 0.5 * (p.Voltage[k] * Complex.Conjugate(p.Current[k])).Real);
            var source = 0.5 * Complex.Conjugate(Assert.Single(result.SourceCurrents).Current[k]).Real; // V = 1
            NumericAssert.Close(0, ports + mechanical, Tolerance.Abs(1e-9 * source), $"port and mechanical power at {Frequencies[k]} Hz");
            NumericAssert.Close(source, all, Tolerance.Rel(1e-9), $"source power at {Frequencies[k]} Hz");
            foreach (var p in result.TransducerPorts)
            {
                var t = network.Transducers.Single(x => x.Name == p.Transducer);
                var u = t.ForceFactor * new Complex(0, w) * (X(t.NodeA) - X(t.NodeB));
                NumericAssert.Close(0, (u - p.Voltage[k]).Magnitude, Tolerance.Abs(1e-12 * u.Magnitude), $"u of {t.Name}");
            }
        }
    }

    [Fact]
    public void GroundReaction_HoldsTheMechanicalForcesOnly()
    {
        // Closed form (the element laws): ground receives from the floor's spring and damper (k + iωc)·X_bay, in N. The
        // load resistor to ground and the transducers' branch returns carry currents, which must not be added to it.
        var network = ElectricalSideTests.FloorTest();
        var result = Sweep(network, OneVolt);
        var ground = result.Reactions.Single(r => r.Support == Network.Ground);
        var bay = result.ResponseOf("bay")!;
        for (var k = 0; k < Frequencies.Length; k++)
        {
            var expected = new Complex(1.5e7, 2 * Math.PI * Frequencies[k] * 1.2e4) * bay.Displacement[k];
            NumericAssert.Close(0, (expected - ground.Force[k]).Magnitude, Tolerance.Abs(1e-10 * expected.Magnitude), $"ground reaction at {Frequencies[k]} Hz");
        }
    }
}

/// <summary>The transient histories of the port terms and source currents against instant-by-instant closed forms.</summary>
public class TransducerPortTransientTests
{
    [Fact]
    public void TransientPortHistories_FollowOhmsLawAtEveryInstant()
    {
        // Closed forms (Ohm's law and the voltage divider, which hold at every instant in a purely resistive loop): a
        // force pulse on the bay with the amplifier held at 0 V gives, at each recorded instant, the shaker's port current
        // i = u/R_s and the amplifier's current −u/R_s; the sensor's port current u/(R_c + R_L) and, at its output node,
        // V_out = u·R_L/(R_c + R_L); ground's reaction k·x + c·v by the element laws. 1e-9 of each history's largest value. Port voltage = Bl·(v_a − v_b) from the recorded
        // velocities (identity of the constraint, 1e-12 of its largest value).
        const double rs = 2, rc = 375, rl = 1e4;
        var network = ElectricalSideTests.FloorTest();
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var pulse = new ForceHistory("hit", "bay", 1, new HalfSinePulse(5000, 0.01));
        var result = TransientAnalysis.Run(system, [pulse], [], new TransientSettings(0.2, 1e-4, TransientMethod.Exact));
        double[] H(string name, TQ q) => [.. result.Get(name, q).Values];
        var uShaker = H("shaker", TQ.PortVoltage);
        var iShaker = H("shaker", TQ.PortCurrent);
        var source = H("amp", TQ.SourceCurrent);
        var uSensor = H("sensor", TQ.PortVoltage);
        var iSensor = H("sensor", TQ.PortCurrent);
        var vOut = H("out", TQ.Velocity);
        var vReaction = H("reaction", TQ.Velocity);
        var vBay = H("bay", TQ.Velocity);
        var xBay = H("bay", TQ.Displacement);
        var ground = H(Network.Ground, TQ.Reaction);
        Assert.Equal("V", result.Get("shaker", TQ.PortVoltage).Unit);
        Assert.Equal("A", result.Get("amp", TQ.SourceCurrent).Unit);
        Assert.DoesNotContain(result.Responses, r => r.Name == "amp" && r.Quantity == TQ.Reaction);
        static double Max(double[] x) => x.Max(Math.Abs);
        Assert.True(Max(iSensor) > 0 && Max(iShaker) > 0, "the pulse drives both ports");
        for (var k = 0; k < uShaker.Length; k++)
        {
            NumericAssert.Close(uShaker[k] / rs, iShaker[k], Tolerance.Abs(1e-9 * Max(iShaker)), "shaker port current");
            NumericAssert.Close(-uShaker[k] / rs, source[k], Tolerance.Abs(1e-9 * Max(iShaker)), "amplifier current");
            NumericAssert.Close(uSensor[k] / (rc + rl), iSensor[k], Tolerance.Abs(1e-9 * Max(iSensor)), "sensor port current");
            NumericAssert.Close(uSensor[k] * rl / (rc + rl), vOut[k], Tolerance.Abs(1e-9 * Max(vOut)), "divider");
            NumericAssert.Close(20 * (vReaction[k] - vBay[k]), uShaker[k], Tolerance.Abs(1e-12 * Max(uShaker)), "u = Bl(v_a − v_b)");
            // Element laws: ground receives k·x_bay + c·v_bay from the floor, in N, and no current.
            NumericAssert.Close(1.5e7 * xBay[k] + 1.2e4 * vBay[k], ground[k], Tolerance.Abs(1e-9 * Max(ground)), "ground reaction");
        }
    }
}
