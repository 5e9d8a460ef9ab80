using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Circuits;

/// <summary>A <c>circuit:</c> section inside a line model: what it reads into, and the located errors it gives.</summary>
public class MixedCircuitReaderTests
{
    // Line 1 is "masses:"; the circuit section starts at line 9.
    private const string Good = """
        masses:
          seismic: 0.011 kg
        supports:
          base: {}
        springs:
          suspension: {between: [base, seismic], stiffness: 8.8 N/m}
        dampers:
          open-circuit: {between: [base, seismic], coefficient: 0.19 N*s/m}
        circuit:
          nodes: [coil, out]
          resistors:
            coil-resistance: {between: [coil, out], resistance: 375 ohm}
            load: {between: [out, ground], resistance: 10 kohm}
        transducers:
          sensor: {between: [seismic, base], branch: [coil, ground], force-factor: 28 T*m}
        """;

    private static LoadResult Read(string text) => ModelReader.Read(text, "m.yaml");

    private static Diagnostic SingleError(string text)
    {
        var r = Read(text);
        return Assert.Single(r.Errors);
    }

    [Fact]
    public void CircuitInsideALineModel_IsStampedIntoItsNetwork()
    {
        var r = Read(Good);
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        var document = r.Model!;
        Assert.Null(document.Circuit); // not a circuit model: the commands treat it as a line model
        var circuit = document.EmbeddedCircuit!;
        Assert.Equal(["coil", "out"], circuit.Nodes.ToArray());
        var network = document.Network;
        // Resistors are dampers 1/R between the same nodes (the node flux analogy), the nodes massless and electrical.
        var load = network.Dampers.Single(d => d.Name == "load");
        Assert.Equal(("out", "ground", 1e-4), (load.NodeA, load.NodeB, load.Coefficient));
        Assert.Equal(0, network.Masses.Single(m => m.Name == "out").Kilograms);
        Assert.True(network.IsElectrical("coil") && network.IsElectrical("out") && !network.IsElectrical("seismic"));
        // The branch names circuit nodes.
        var sensor = Assert.Single(network.Transducers);
        Assert.Equal(("coil", Circuit.Ground), (sensor.BranchA, sensor.BranchB));
        Assert.Empty(r.Diagnostics.Where(d => d.Severity == Severity.Warning));
    }

    [Fact]
    public void Sources_AreLoadsNamedAfterThem()
    {
        var text = Good.Replace("""
                load: {between: [out, ground], resistance: 10 kohm}
            """, """
                load: {between: [out, ground], resistance: 10 kohm}
              voltage-sources:
                bias: {between: [ground, feed], amplitude: 3 V, time: {kind: step, value: 3 V, at: 0.01 s}}
              current-sources:
                test: {from: out, to: ground, amplitude: 2 mA}
            """).Replace("nodes: [coil, out]", "nodes: [coil, out, feed]")
            .Replace("coil-resistance: {between: [coil, out]", "feed-resistance: {between: [feed, out], resistance: 1 kohm}\n    coil-resistance: {between: [coil, out]")
            + "\nharmonic:\n  loads: [bias, test]\n  frequencies: [10 Hz]\n  outputs: [out]\ntransient:\n  duration: 0.1 s\n  step: 1 ms\n  loads: [bias]\n  outputs: [out]\n";
        var r = Read(text);
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        var loads = r.Model!.Structure.Loads;
        // bias holds 'feed' from its − terminal: the node moves at −V, a phase of π; test draws 2 mA from 'out': −I, π.
        var bias = Assert.IsType<BaseMotionLoad>(loads.Single(l => l.Name == "bias"));
        Assert.Equal(("feed", BaseMotionKind.Velocity, 3.0, Math.PI), (bias.Support, bias.Kind, bias.Amplitude, bias.Phase));
        var test = Assert.IsType<ForceLoad>(loads.Single(l => l.Name == "test"));
        Assert.Equal(("out", 2e-3, Math.PI), (test.At, test.Amplitude, test.Phase));
        Assert.Equal(["bias", "test"], r.Model.Harmonic!.Loads.ToArray());
        var timed = Assert.IsType<SupportVelocityHistory>(Assert.Single(r.Model.TimedLoads));
        Assert.Equal(("bias", "feed", -1.0), (timed.Name, timed.Support, timed.Scale));
        Assert.True(r.Model.Network.IsSupport("feed"));
        Assert.Equal(new SourcePosition(16, 5), r.Model.Positions["loads.bias"]);
    }

    [Fact]
    public void CircuitNode_NamedAsAMass_IsALocatedErrorNamingBothPlaces()
    {
        var e = SingleError(Good.Replace("nodes: [coil, out]", "nodes: [coil, seismic]").Replace("[coil, out]", "[coil, seismic]").Replace("[out, ground]", "[seismic, ground]"));
        Assert.Equal(new SourcePosition(10, 17), e.Position);
        Assert.StartsWith("circuit node 'seismic' has the name of mass 'seismic' (line 2, column 3)", e.Message);
    }

    [Fact]
    public void CircuitElement_NamedAsASpring_IsALocatedErrorNamingBothPlaces()
    {
        var e = SingleError(Good.Replace("    load: {between", "    suspension: {between"));
        Assert.Equal(new SourcePosition(13, 5), e.Position);
        Assert.StartsWith("circuit element 'suspension' has the name of spring 'suspension' (line 6, column 3)", e.Message);
    }

    [Fact]
    public void Source_NamedAsALoad_IsALocatedError()
    {
        var text = Good.Replace("    load: {between: [out, ground], resistance: 10 kohm}",
            "    load: {between: [out, ground], resistance: 10 kohm}\n  current-sources:\n    push: {from: ground, to: out, amplitude: 1 mA}")
            + "\nloads:\n  push: {kind: force, at: seismic, amplitude: 1 N}\n";
        var e = SingleError(text);
        Assert.Equal(new SourcePosition(15, 5), e.Position);
        Assert.StartsWith("circuit element 'push' has the name of load 'push' (line 19, column 3)", e.Message);
    }

    [Fact]
    public void FloatingCurrentSource_IsRefusedWithWhatToDoInstead()
    {
        var e = SingleError(Good.Replace("    load: {between: [out, ground], resistance: 10 kohm}",
            "    load: {between: [out, ground], resistance: 10 kohm}\n  current-sources:\n    bridge: {from: coil, to: out, amplitude: 1 mA}"));
        Assert.Equal(new SourcePosition(15, 5), e.Position);
        Assert.Contains("current source 'bridge' has neither terminal at ground", e.Message);
        Assert.Contains("two current sources from ground", e.Message);
    }

    [Fact]
    public void FloatingVoltageSource_IsRefusedWithItsNortonEquivalent()
    {
        var e = SingleError(Good.Replace("    load: {between: [out, ground], resistance: 10 kohm}",
            "    load: {between: [out, ground], resistance: 10 kohm}\n  voltage-sources:\n    bridge: {between: [coil, out], amplitude: 1 V}"));
        Assert.Equal(new SourcePosition(15, 5), e.Position);
        Assert.Contains("voltage source 'bridge' has neither terminal at ground; inside a line model", e.Message);
        Assert.Contains("Norton", e.Message);
    }

    [Fact]
    public void CurrentSource_IntoANodeATransducerEliminates_IsRefused()
    {
        var e = SingleError(Good.Replace("    load: {between: [out, ground], resistance: 10 kohm}",
            "    load: {between: [out, ground], resistance: 10 kohm}\n  current-sources:\n    drive: {from: ground, to: coil, amplitude: 1 mA}"));
        Assert.Equal(new SourcePosition(15, 5), e.Position);
        Assert.StartsWith("current source 'drive' drives 'coil', whose coordinate transducer 'sensor' eliminates", e.Message);
    }

    [Fact]
    public void CriterionAtACircuitNode_IsRefused()
    {
        var e = SingleError(Good + "\ncriteria:\n  limits:\n    - {at: out, quantity: velocity, peak: 1 mm/s}\n");
        Assert.Equal(18, e.Position.Line);
        Assert.Contains("a node of the model's circuit", e.Message);
    }

    [Fact]
    public void TransientNamingASourceWithoutWaveform_IsRefused()
    {
        var text = Good.Replace("nodes: [coil, out]", "nodes: [coil, out, feed]")
            .Replace("    load: {between: [out, ground], resistance: 10 kohm}",
                "    load: {between: [out, ground], resistance: 10 kohm}\n    feed-r: {between: [feed, out], resistance: 1 kohm}\n  voltage-sources:\n    bias: {between: [feed, ground], amplitude: 1 V}")
            + "\ntransient:\n  duration: 1 s\n  step: 1 ms\n  loads: [bias]\n";
        var e = SingleError(text);
        Assert.Equal(new SourcePosition(22, 11), e.Position);
        Assert.Contains("names circuit source 'bias', which has no 'time' waveform", e.Message);
    }

    [Fact]
    public void CircuitInAPlaneModel_IsRefused()
    {
        var r = Read("""
            space: plane
            masses:
              deck: {mass: 10 kg, at: [0, 0]}
            springs:
              leg: {between: [ground, deck], stiffness: {z: 1 kN/m}}
            circuit:
              nodes: [a]
              resistors:
                r: {between: [a, ground], resistance: 1 ohm}
            """);
        var e = Assert.Single(r.Errors, d => d.Message.StartsWith("'circuit' cannot be used in a plane or 3d model", StringComparison.Ordinal));
        Assert.Equal(new SourcePosition(6, 1), e.Position);
    }

    [Fact]
    public void StiffnessSpreadWarning_LeavesOutTheInductorsAnalogueSprings()
    {
        // A 1 nH inductor is an analogue spring of 1e9 N/m beside the 8.8 N/m suspension, a ratio of 1.1e8, above the
        // warned 1e8 (Topology.WarnedStiffnessRatio). Written as a circuit it is no stiffness of the structure: no warning.
        // The same stiffness as a spring of the structure is warned about (the control).
        var withInductor = Good.Replace("    load: {between: [out, ground], resistance: 10 kohm}",
            "    load: {between: [out, ground], resistance: 10 kohm}\n  inductors:\n    choke: {between: [out, ground], inductance: 1 nH}");
        var r = Read(withInductor);
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        NumericAssert.Close(1e9, r.Model!.Network.Springs.Single(s => s.Name == "choke").Stiffness, Tolerance.Rel(1e-15), "1/L in N/m");
        Assert.DoesNotContain(r.Diagnostics, d => d.Message.Contains("spring stiffnesses span a ratio", StringComparison.Ordinal));
        var control = Read(Good.Replace("  suspension: {between: [base, seismic], stiffness: 8.8 N/m}",
            "  suspension: {between: [base, seismic], stiffness: 8.8 N/m}\n  stiff: {between: [base, seismic], stiffness: 1e9 N/m}"));
        Assert.Contains(control.Diagnostics, d => d.Severity == Severity.Warning && d.Message.Contains("spring stiffnesses span a ratio", StringComparison.Ordinal));
    }

    [Fact]
    public void SpringToACircuitNode_IsAnUnknownNode()
    {
        // Mechanical elements stay on the structure's side: a circuit node joins it only through a transducer.
        var e = SingleError(Good.Replace("suspension: {between: [base, seismic]", "suspension: {between: [out, seismic]"));
        Assert.Equal(6, e.Position.Line);
        Assert.Contains("'out'", e.Message);
    }
}
