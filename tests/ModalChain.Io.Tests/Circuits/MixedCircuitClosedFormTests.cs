using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using ResponseQuantity = ModalChain.Core.Analyses.Transient.ResponseQuantity;

namespace ModalChain.Io.Tests.Circuits;

/// <summary>
/// Line models with a circuit inside (read from YAML, so the reader, <c>CircuitAnalogy.AddTo</c> and
/// <c>CircuitSources</c> are all on the path) against the closed forms of moving-coil sensors and shakers.
/// </summary>
public class MixedCircuitClosedFormTests
{
    // An invented moving-coil velocity sensor: 11 g seismic mass on 8.8 N/m (about 4.5 Hz) with 0.19 N·s/m of
    // mechanical damping, Bl = 28 T·m, its 375 Ω coil read across a load resistor; its housing is the support 'base'.
    private const double M = 0.011, K = 8.8, C = 0.19, Bl = 28, RCoil = 375;

    private static string Sensor(double rLoad, string baseMotion = "  shake: {kind: base-motion, support: base, velocity: 1 m/s}") => $$"""
        masses:
          seismic: {{M}} kg
        supports:
          base: {}
        springs:
          suspension: {between: [base, seismic], stiffness: {{K}} N/m}
        dampers:
          open-circuit: {between: [base, seismic], coefficient: {{C}} N*s/m}
        circuit:
          nodes: [coil, out]
          resistors:
            coil-resistance: {between: [coil, out], resistance: {{RCoil}} ohm}
            load: {between: [out, ground], resistance: {{rLoad}} ohm}
        transducers:
          sensor: {between: [seismic, base], branch: [coil, ground], force-factor: {{Bl}} T*m}
        loads:
        {{baseMotion}}
        """;

    private static ModelDocument Read(string text)
    {
        var result = ModelReader.Read(text, "mixed.yaml");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        Assert.NotNull(result.Model!.EmbeddedCircuit);
        return result.Model!;
    }

    [Theory]
    [InlineData(10_000.0)]
    [InlineData(1_000.0)]
    public void VelocitySensor_ReadAcrossALoad_IsTheOpenCircuitSensitivityTimesTheDivider(double rLoad)
    {
        // Closed form (common practice for moving-coil sensors): with z = x_m − x_b, m z̈ + (c + (Bl)²/(R_coil + R_load)) ż
        // + k z = −m ẍ_b, and the coil's voltage Bl·ż divides over R_coil and R_load, so per unit base velocity
        // V_out/v_b = −Bl·s²/(s² + 2ζω₀s + ω₀²) · R_load/(R_coil + R_load), ζ including the shunt. The housing is a
        // support and the coil has no capacitance, so the model holds the closed form exactly: 1e-9 relative on the
        // complex ratio.
        var document = Read(Sensor(rLoad));
        var system = DampedSystem.Build(document.Structure);
        var w0 = Math.Sqrt(K / M);
        var zeta = C / (2 * M * w0) + Bl * Bl / (2 * M * w0 * (RCoil + rLoad));
        double[] frequencies = [0.5, 2, 4, 4.5, 5, 10, 40, 200];
        var result = HarmonicAnalysis.Sweep(system, frequencies, [.. document.Structure.Loads], ["out"], HarmonicMethod.Direct);
        var flux = result.Responses.Single(r => r.Dof == "out").Displacement;
        for (var k = 0; k < frequencies.Length; k++)
        {
            var s = new Complex(0, 2 * Math.PI * frequencies[k]);
            var volts = s * flux[k]; // node voltage = velocity of its flux linkage; the base moves at 1 m/s
            var expected = -Bl * s * s / (s * s + 2 * zeta * w0 * s + w0 * w0) * rLoad / (RCoil + rLoad);
            NumericAssert.Close(expected.Real, volts.Real, Tolerance.Abs(1e-9 * expected.Magnitude), $"Re V_out/v_b at {frequencies[k]} Hz");
            NumericAssert.Close(expected.Imaginary, volts.Imaginary, Tolerance.Abs(1e-9 * expected.Magnitude), $"Im V_out/v_b at {frequencies[k]} Hz");
        }
    }

    [Theory]
    [InlineData(10_000.0)]
    [InlineData(2_500.0)]
    public void ShuntedSensor_DampingRatio_GainsTheShuntTerm(double rLoad)
    {
        // Common practice for moving-coil sensors: the closed coil is a damper (Bl)²/(R_coil + R_load) on the relative
        // motion, so ζ = c/(2mω₀) + (Bl)²/(2mω₀(R_coil + R_load)) and ω₀ = √(k/m) unchanged. The circuit's node 'out' is a
        // massless node between two resistors (a zero root: its flux is a fixed multiple of the relative displacement plus
        // a constant). The oscillatory root against the formula: 1e-9 relative.
        var system = DampedSystem.Build(Read(Sensor(rLoad)).Structure);
        var w0 = Math.Sqrt(K / M);
        var expected = C / (2 * M * w0) + Bl * Bl / (2 * M * w0 * (RCoil + rLoad));
        Assert.True(expected < 1, "under-damped cases");
        var root = Assert.Single(ComplexModes.Solve(system), r => r.IsOscillatory);
        NumericAssert.Close(expected, root.DampingRatio, Tolerance.Rel(1e-9), $"ζ with R_load = {rLoad} Ω");
        NumericAssert.Close(w0 / (2 * Math.PI), root.UndampedFrequencyHz, Tolerance.Rel(1e-9), "undamped frequency");
    }

    [Fact]
    public void HeavilyShuntedSensor_HasTheOverdampedRootsOfItsCharacteristicPolynomial()
    {
        // Closed form: m s² + (c + (Bl)²/(R_coil + R_load)) s + k = 0, here with R_load = 50 Ω (ζ ≈ 3.4 > 1), so two real
        // roots s = −ζω₀ ± ω₀√(ζ² − 1). Both against the formula to 1e-9 relative (the smaller one, about −0.66 1/s, is
        // computed from k/(m·s_large) to keep its digits).
        const double rLoad = 50;
        var system = DampedSystem.Build(Read(Sensor(rLoad)).Structure);
        var cTotal = C + Bl * Bl / (RCoil + rLoad);
        var large = (-cTotal - Math.Sqrt(cTotal * cTotal - 4 * M * K)) / (2 * M);
        var small = K / (M * large);
        var roots = ComplexModes.Solve(system).Where(r => !r.IsOscillatory && r.EigenValue.Magnitude > 1e-9 * Math.Abs(large))
            .Select(r => r.EigenValue).OrderBy(z => z.Real).ToArray();
        Assert.Equal(2, roots.Length);
        NumericAssert.Close(large, roots[0].Real, Tolerance.Rel(1e-9), "fast root (1/s)");
        NumericAssert.Close(small, roots[1].Real, Tolerance.Rel(1e-9), "slow root (1/s)");
        NumericAssert.Small(roots[0].Imaginary, 1e-9 * Math.Abs(large), "fast root is real");
        NumericAssert.Small(roots[1].Imaginary, 1e-9 * Math.Abs(large), "slow root is real");
    }

    [Fact]
    public void ShakerCoil_OnAFixedTable_GivesTheBlockedForce()
    {
        // Common practice for electrodynamic shakers: with the coil held still its back voltage is zero, so the current is
        // V/(R + iωL) and the blocked force Bl·V/(R + iωL) (Bl·V/R at low frequency). The table is a support; the force
        // the coil puts on it is that support's reaction (a support receives −F, so the magnitudes and the current are
        // compared). An invented shaker: Bl = 12 T·m, 4 Ω, 0.8 mH, driven by 2 V. 1e-10 relative.
        const double bl = 12, r = 4, l = 0.8e-3, v = 2;
        var text = $$"""
            masses:
              frame: 50 kg
            supports:
              table: {}
            springs:
              feet: {between: [ground, frame], stiffness: 20 kN/m}
            circuit:
              nodes: [amp, mid, coil]
              resistors:
                winding: {between: [amp, mid], resistance: {{r}} ohm}
              inductors:
                coil-inductance: {between: [mid, coil], inductance: {{l * 1e3}} mH}
              voltage-sources:
                amplifier: {between: [amp, ground], amplitude: {{v}} V}
            transducers:
              drive: {between: [table, ground], branch: [coil, ground], force-factor: {{bl}} T*m}
            harmonic:
              loads: [amplifier]
              frequencies: [1 Hz, 100 Hz, 1 kHz]
            """;
        var document = Read(text);
        var load = Assert.Single(document.Structure.Loads);
        Assert.Equal(new BaseMotionLoad("amplifier", "amp", BaseMotionKind.Velocity, v, 0), load);
        var system = DampedSystem.Build(document.Structure);
        double[] frequencies = [1, 100, 1000];
        var result = HarmonicAnalysis.Sweep(system, frequencies, [load], ["frame", "mid"], HarmonicMethod.Direct);
        var reaction = result.Reactions.Single(x => x.Support == "table").Force;
        var current = result.ElementForces.Single(e => e.Element == "winding").Force;
        for (var k = 0; k < frequencies.Length; k++)
        {
            var z = new Complex(r, 2 * Math.PI * frequencies[k] * l);
            var expectedCurrent = v / z;
            NumericAssert.Close(expectedCurrent.Real, current[k].Real, Tolerance.Abs(1e-10 * expectedCurrent.Magnitude), $"Re I at {frequencies[k]} Hz");
            NumericAssert.Close(expectedCurrent.Imaginary, current[k].Imaginary, Tolerance.Abs(1e-10 * expectedCurrent.Magnitude), $"Im I at {frequencies[k]} Hz");
            NumericAssert.Close((bl * expectedCurrent).Magnitude, reaction[k].Magnitude, Tolerance.Rel(1e-10), $"|F_blocked| at {frequencies[k]} Hz");
        }
        NumericAssert.Close(bl * v / r, reaction[0].Magnitude, Tolerance.Rel(1e-4), "Bl·V/R at 1 Hz (ωL/R = 1.3e-3, so 1e-4 relative)");
    }

    [Fact]
    public void ShakerDrivenByAVoltageBurst_SourceWork_EqualsStoredPlusDissipatedEnergy()
    {
        // Conservation of energy (common practice): ∫V·I dt = ½mv² + ½kx² + ∫(c v² + R I²) dt at every instant, the source
        // current I being the winding's current (its damper force (v_amp − v_coil)·(1/R)). The source is a voltage source of
        // the circuit with a half-sine waveform of 2 V over 50 ms (the node it holds moves at that velocity:
        // SupportVelocityHistory). The exact integrator at h = 1e-5 s; the integrals by the trapezoid rule, whose error
        // (about (ωh)²/12 ≈ 2e-7 for the 22.5 Hz table) and the first-order hold of the sampled voltage set the tolerance:
        // 1e-6 of the largest energy figure (3.6e-9 seen). A transducer that created or lost energy would miss by the size
        // of its power.
        const double m = 2, k = 4e4, c = 15, bl = 12, r = 4, v0 = 2, pulse = 0.05, h = 1e-5;
        var text = $$"""
            masses:
              table: {{m}} kg
            springs:
              flexure: {between: [ground, table], stiffness: {{k}} N/m}
            dampers:
              friction: {between: [ground, table], coefficient: {{c}} N*s/m}
            circuit:
              nodes: [amp, coil]
              resistors:
                winding: {between: [amp, coil], resistance: {{r}} ohm}
              voltage-sources:
                amplifier: {between: [amp, ground], amplitude: 1 V, time: {kind: half-sine, amplitude: {{v0}} V, duration: {{pulse}} s} }
            transducers:
              drive: {between: [table, ground], branch: [coil, ground], force-factor: {{bl}} T*m}
            transient:
              duration: 0.3 s
              step: {{h}} s
              method: exact
              loads: [amplifier]
              outputs: [table]
            """;
        var document = Read(text);
        var excitation = Assert.Single(document.TimedLoads);
        Assert.Equal("amplifier", excitation.Name);
        Assert.IsType<SupportVelocityHistory>(excitation);
        var system = DampedSystem.Build(document.Structure);
        var result = TransientAnalysis.Run(system, [.. document.TimedLoads], [], document.Transient!.Settings);

        var t = result.Times;
        var x = result.Get("table", ResponseQuantity.Displacement).Values;
        var v = result.Get("table", ResponseQuantity.Velocity).Values;
        var current = result.Get("winding", ResponseQuantity.DamperForce).Values;
        double Volts(double time) => time < pulse ? v0 * Math.Sin(Math.PI * time / pulse) : 0;
        double work = 0, dissipated = 0, largest = 0, worst = 0;
        for (var s = 0; s < t.Length; s++)
        {
            if (s > 0)
            {
                var dt = t[s] - t[s - 1];
                work += 0.5 * dt * (Volts(t[s]) * current[s] + Volts(t[s - 1]) * current[s - 1]);
                dissipated += 0.5 * dt * (c * v[s] * v[s] + r * current[s] * current[s] + c * v[s - 1] * v[s - 1] + r * current[s - 1] * current[s - 1]);
            }
            var stored = 0.5 * m * v[s] * v[s] + 0.5 * k * x[s] * x[s];
            largest = Math.Max(largest, Math.Max(work, stored + dissipated));
            worst = Math.Max(worst, Math.Abs(work - stored - dissipated));
        }
        Assert.True(work > 0.1 * largest, $"the source did work ({work} J of {largest} J)");
        NumericAssert.Small(worst / largest, 1e-6, "energy balance through the transducer");
    }
}
