using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>
/// Kirchhoff's current law at every node and every recorded instant of a transient run (common practice: the branch
/// currents into a node sum to zero), on circuits with a capacitor at a voltage source's node driven by smooth waveforms,
/// where the capacitor's current C(v̇_A − v̇_B) includes the source's own rate dV/dt.
/// </summary>
public class KirchhoffTests
{
    public static TheoryData<string> Waveforms => new() { "sine", "half-sine", "ramp" };

    private static TimeFunction Waveform(string kind, double v) => kind switch
    {
        "sine" => new SineFunction(v, 1.7e3, 0.6),
        "half-sine" => new HalfSinePulse(v, 3.3e-4, 5.1e-5),
        _ => new RampFunction(0, v, 4.4e-4, 1e-4),
    };

    [Theory]
    [MemberData(nameof(Waveforms))]
    public void CurrentsIntoEveryNode_SumToZero(string kind)
    {
        var circuit = EnginePathTests.Build("source-capacitor", v => Waveform(kind, v));
        var result = CircuitTransient.Run(CircuitAnalogy.Of(circuit), 2e-3, 2e-5);
        var current = result.Currents.ToDictionary(b => b.Element, b => b.Amperes);
        var terminals = circuit.Resistors.Select(e => (e.Name, e.NodeA, e.NodeB))
            .Concat(circuit.Inductors.Select(e => (e.Name, e.NodeA, e.NodeB)))
            .Concat(circuit.Capacitors.Select(e => (e.Name, e.NodeA, e.NodeB)))
            .ToArray();
        var scale = result.Currents.Max(b => b.Amperes.Max(Math.Abs));
        for (var k = 0; k < result.Times.Length; k++)
        {
            foreach (var node in circuit.Nodes)
            {
                var sum = 0.0;
                // Element currents flow from NodeA to NodeB; a voltage source's current flows out of its + terminal.
                foreach (var (name, a, b) in terminals)
                    sum += (a == node ? -1 : 0) * current[name][k] + (b == node ? 1 : 0) * current[name][k];
                foreach (var v in circuit.VoltageSources)
                    sum += (v.Positive == node ? 1 : 0) * current[v.Name][k] - (v.Negative == node ? 1 : 0) * current[v.Name][k];
                foreach (var c in circuit.CurrentSources)
                {
                    var i = c.Waveform?.ValueAt(result.Times[k]) ?? 0;
                    sum += (c.To == node ? i : 0) - (c.From == node ? i : 0);
                }
                NumericAssert.Close(0, sum, Tolerance.Abs(1e-10 * scale), $"{kind}: KCL at '{node}', t = {result.Times[k]}");
            }
        }
    }

    [Theory]
    [MemberData(nameof(Waveforms))]
    public void CapacitorCurrents_AreCTimesTheRateOfTheRecordedVoltages(string kind)
    {
        // i_C = C d(v_A − v_B)/dt checked against central differences of the recorded node voltages (step h = 1 µs:
        // truncation h²v‴/6, about 1e-5 of the currents here), away from the waveform's kinks. The run takes a smooth
        // source's rate as the slope of its piece (start value and midpoint secant), f′ + f″h/4: ωh/4 ≈ 3e-3 relative at
        // 1.7 kHz, hence 5e-3. (Leaving the source's rate out would miss by the whole C·dV/dt, a factor of ten here.)
        var circuit = EnginePathTests.Build("source-capacitor", v => Waveform(kind, v));
        const double h = 1e-6;
        var result = CircuitTransient.Run(CircuitAnalogy.Of(circuit), 6e-4, h);
        var kinks = circuit.VoltageSources.Concat<object>(circuit.CurrentSources).SelectMany(e => e switch
        {
            VoltageSource v => v.Waveform!.Breakpoints,
            CurrentSource c => c.Waveform!.Breakpoints,
            _ => [],
        }).ToArray();
        double Volts(string node, int k) => node == Circuit.Ground ? 0 : result.Volts[result.Nodes.IndexOf(node)][k];
        foreach (var c in circuit.Capacitors)
        {
            var current = result.Currents.Single(b => b.Element == c.Name).Amperes;
            var scale = current.Max(Math.Abs);
            Assert.True(scale > 0, $"{c.Name} carries current");
            for (var k = 1; k < result.Times.Length - 1; k++)
            {
                if (kinks.Any(t => Math.Abs(t - result.Times[k]) < 1.5 * h)) continue;
                var rate = (Volts(c.NodeA, k + 1) - Volts(c.NodeB, k + 1) - Volts(c.NodeA, k - 1) + Volts(c.NodeB, k - 1)) / (2 * h);
                NumericAssert.Close(c.Farads * rate, current[k], Tolerance.Abs(5e-3 * scale), $"{kind}: i({c.Name}) at t = {result.Times[k]}");
            }
        }
    }
}
