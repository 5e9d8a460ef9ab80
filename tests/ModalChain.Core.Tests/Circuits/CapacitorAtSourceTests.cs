using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>
/// A capacitor from the node a voltage source holds: in the analogue network an inerter to a support moved at the
/// source's velocity, whose acceleration (the source's dV/dt) loads the network. Checked on the RC high-pass driven by a
/// voltage ramp V = k t, whose output is v(t) = kRC(1 − e^{−t/RC}) during the ramp and decays as e^{−(t−T)/RC} after it
/// (first-order step/ramp response of an RC network; common practice, any circuits text, from memory).
/// </summary>
public class CapacitorAtSourceTests
{
    [Fact]
    public void RampThroughACapacitor_GivesTheHighPassClosedForm_AndKirchhoffsCurrentLaw()
    {
        const double r = 1000, c = 1e-6, volts = 10, rise = 2e-3; // τ = RC = 1 ms, k = 5000 V/s
        var circuit = new Circuit("ramp high-pass", ["in", "out"],
            [new Resistor("R1", "out", Circuit.Ground, r)], [],
            [new Capacitor("C1", "in", "out", c)],
            [new VoltageSource("V1", "in", Circuit.Ground, 1, new RampFunction(0, volts, rise))], []);
        var result = CircuitTransient.Run(CircuitAnalogy.Of(circuit), 5e-3, 2.5e-5);
        const double tau = r * c, k = volts / rise;
        var atEnd = k * tau * (1 - Math.Exp(-rise / tau));
        var outIndex = result.Nodes.IndexOf("out");
        var capacitor = result.Currents.Single(b => b.Element == "C1").Amperes;
        var resistor = result.Currents.Single(b => b.Element == "R1").Amperes;
        var source = result.Currents.Single(b => b.Element == "V1").Amperes;
        for (var i = 0; i < result.Times.Length; i++)
        {
            var t = result.Times[i];
            var expected = t <= rise ? k * tau * (1 - Math.Exp(-t / tau)) : atEnd * Math.Exp(-(t - rise) / tau);
            NumericAssert.Close(expected, result.Volts[outIndex][i], Tolerance.Abs(1e-10 * volts), $"v_out({t})");
            // KCL at 'out' and at the source's node: the capacitor's current C d(V − v)/dt is the resistor's and the source's.
            NumericAssert.Close(expected / r, capacitor[i], Tolerance.Abs(1e-10 * volts / r), $"i_C({t})");
            NumericAssert.Close(expected / r, resistor[i], Tolerance.Abs(1e-10 * volts / r), $"i_R({t})");
            NumericAssert.Close(expected / r, source[i], Tolerance.Abs(1e-10 * volts / r), $"i_V({t})");
        }
    }
}
