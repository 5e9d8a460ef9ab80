using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Circuits;

/// <summary>The 'circuit:' section: values in Ω, H, F, V, A with prefixes, and every topology problem as a located error.</summary>
public class CircuitReaderTests
{
    private const string Good = """
        title: filter
        circuit:
          nodes: [drive, choke, output]
          resistors:
            R1: {between: [drive, choke], resistance: 2.2 kΩ}
          inductors:
            L1: {between: [choke, output], inductance: 470 uH}
          capacitors:
            C1: {between: [output, ground], capacitance: 22 µF}
          voltage-sources:
            V1: {between: [drive, ground], amplitude: 2 V, time: {kind: step, value: 24 V, at: 5 us}}
          current-sources:
            I1: {from: ground, to: output, amplitude: 10 mA}
        harmonic:
          frequencies: {from: 100 Hz, to: 1 MHz, points: 50, spacing: log}
        transient: {duration: 2 ms, step: 10 us}
        """;

    private static LoadResult Read(string text) => ModelReader.Read(text, "c.yaml");

    [Fact]
    public void GoodCircuit_IsReadInSi()
    {
        var r = Read(Good);
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        var c = r.Model!.Circuit!;
        // SI prefixes by definition (k = 1e3, u/µ = 1e-6, m = 1e-3; BIPM SI Brochure, 9th ed., Table 7 [from memory]).
        Assert.Equal(2200, c.Circuit.Resistors[0].Ohms, 12);
        Assert.Equal(470e-6, c.Circuit.Inductors[0].Henries, 15);
        Assert.Equal(22e-6, c.Circuit.Capacitors[0].Farads, 15);
        Assert.Equal(2, c.Circuit.VoltageSources[0].Amplitude);
        var step = Assert.IsType<StepFunction>(c.Circuit.VoltageSources[0].Waveform);
        Assert.Equal(24, step.Value);
        Assert.Equal(5e-6, step.At, 1e-20);
        Assert.Equal(0.01, c.Circuit.CurrentSources[0].Amplitude, 15);
        Assert.Equal(("ground", "output"), (c.Circuit.CurrentSources[0].From, c.Circuit.CurrentSources[0].To));
        Assert.Equal(1e6, ((Core.Analyses.Harmonic.FrequencyRange)c.Sweep!).ToHz);
        Assert.Equal(2e-3, c.Duration!.Value, 1e-18);
        Assert.Equal(1e-5, c.Step!.Value, 1e-18);
    }

    [Theory]
    // node with nothing attached
    [InlineData("nodes: [drive, choke, output, spare]", "node 'spare' has nothing attached", 3)]
    // unknown node
    [InlineData("R1: {between: [drive, choke], resistance: 2.2 kΩ}|R1: {between: [drive, chock], resistance: 2.2 kΩ}", "unknown node 'chock'", 5)]
    // negative inductance, zero capacitance, zero resistance
    [InlineData("inductance: 470 uH|inductance: -470 uH", "inductance must be positive", 7)]
    [InlineData("capacitance: 22 µF|capacitance: 0 F", "capacitance must be positive", 9)]
    [InlineData("resistance: 2.2 kΩ|resistance: 0 ohm", "resistance must be positive", 5)]
    // two voltage sources between the same nodes: a loop of ideal voltage sources
    [InlineData("V1: {between: [drive, ground], amplitude: 2 V, time: {kind: step, value: 24 V, at: 5 us}}|V1: {between: [drive, ground]}\n    V2: {between: [ground, drive]}", "closes a loop of ideal voltage sources", 12)]
    // a voltage source between two nodes, neither at ground
    [InlineData("V1: {between: [drive, ground], amplitude: 2 V, time: {kind: step, value: 24 V, at: 5 us}}|V1: {between: [drive, choke]}", "neither terminal at ground", 11)]
    public void BadCircuit_IsALocatedError(string edit, string message, int line)
    {
        var parts = edit.Split('|');
        var text = parts.Length == 1 ? Good.Replace("nodes: [drive, choke, output]", parts[0]) : Good.Replace(parts[0], parts[1]);
        Assert.NotEqual(Good, text);
        var r = Read(text);
        Assert.False(r.Succeeded);
        var error = Assert.Single(r.Errors, e => e.Message.Contains(message, StringComparison.Ordinal));
        Assert.Equal(line, error.Position.Line);
        Assert.Equal("c.yaml", error.File);
    }

    [Fact]
    public void LoopOfThreeVoltageSources_IsALocatedError()
    {
        const string text = """
            circuit:
              nodes: [a, b]
              resistors:
                R1: {between: [a, b], resistance: 1 ohm}
              voltage-sources:
                Va: {between: [a, ground]}
                Vb: {between: [b, ground]}
                Vab: {between: [a, b]}
            """;
        var error = Assert.Single(Read(text).Errors);
        Assert.Contains("voltage source 'Vab' closes a loop of ideal voltage sources", error.Message);
        Assert.Equal(8, error.Position.Line);
    }

    [Fact]
    public void CutSetOfCurrentSources_IsALocatedError()
    {
        // 'island' is joined to the rest only through current source I2: its current has no way back.
        var text = """
            circuit:
              nodes: [top, island]
              resistors:
                R1: {between: [top, ground], resistance: 1 kohm}
              capacitors:
                C1: {between: [top, ground], capacitance: 1 nF}
                C2: {between: [island, island2], capacitance: 1 nF}
              current-sources:
                I1: {from: ground, to: top}
                I2: {from: top, to: island}
            """.Replace("[top, island]", "[top, island, island2]");
        var error = Assert.Single(Read(text).Errors);
        Assert.Contains("current source 'I2' drives nodes 'island', 'island2', which only current sources join", error.Message);
        Assert.Equal(10, error.Position.Line);
    }

    [Fact]
    public void CircuitModel_RefusesMechanicalSections()
    {
        // A model with 'masses' and 'circuit' is a line model with a circuit inside (MixedCircuitReaderTests); without masses,
        // a mechanical section is refused.
        var r = Read(Good + "\nsprings:\n  deck-spring: {between: [ground, deck], stiffness: 1 kN/m}\n");
        Assert.Contains(r.Errors, e => e.Message.Contains("'springs' belongs to mechanical models", StringComparison.Ordinal));
    }

    [Fact]
    public void FloatingCapacitorGroup_IsRefusedWithItsNodes()
    {
        const string text = """
            circuit:
              nodes: [a, b]
              resistors:
                Ra: {between: [a, ground], resistance: 1 ohm}
                Rb: {between: [b, ground], resistance: 1 ohm}
              capacitors:
                C1: {between: [a, b], capacitance: 1 uF}
              current-sources:
                I1: {from: ground, to: a}
            """;
        var error = Assert.Single(Read(text).Errors);
        Assert.Contains("nodes 'a', 'b': capacitors join them but none reaches ground", error.Message);
        Assert.Equal(2, error.Position.Line);
    }
}
