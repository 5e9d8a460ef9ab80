using System.Numerics;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Circuits.Reference;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>
/// The circuit analyses, which run on the analogue network's assembly and engines (first-order form and its roots, the
/// direct harmonic sweep, the driven first-order integration), against an independent reference computation written in
/// the tests: the circuit's own state-space form in node fluxes and capacitor charges (<see cref="CircuitStateSpace"/>,
/// its eigenvalues, a dense complex solve of the node flux matrices per frequency, and its exact discretisation by one
/// matrix exponential per piece). The two share nothing but the circuit records and the analogy's matrices, so
/// agreement to 1e-10 checks the analogy, the network's assembly and the engines together.
/// </summary>
public class EnginePathTests
{
    private const double Tol = 1e-10;

    public static TheoryData<string> Circuits => new() { "series", "parallel", "ladder", "floating", "source-capacitor", "tanks" };

    /// <summary>The circuits the comparison runs on, each with a waveform on every source.</summary>
    internal static Circuit Build(string name, Func<double, TimeFunction>? waveform = null)
    {
        waveform ??= v => new StepFunction(v, 0);
        return name switch
        {
            // R = 20 Ω, L = 10 mH, C = 1 µF: ζ = 0.1.
            "series" => CircuitFixtures.SeriesRlc(20, 10e-3, 1e-6, waveform(12)),
            "parallel" => CircuitFixtures.ParallelRlc(50, 2e-3, 4.7e-6, waveform(0.2)),
            // A ladder filter whose first inner node has no capacitor (a massless node, a first-order state).
            "ladder" => new Circuit("ladder", ["in", "a", "b", "out"],
                [new Resistor("R1", "in", "a", 10), new Resistor("Rload", "out", Circuit.Ground, 50)],
                [new Inductor("L1", "a", "b", 1e-3), new Inductor("L2", "b", "out", 2.2e-3)],
                [new Capacitor("C1", "b", Circuit.Ground, 4.7e-6), new Capacitor("C2", "out", Circuit.Ground, 2.2e-6)],
                [new VoltageSource("V1", "in", Circuit.Ground, 1, waveform(5))],
                []),
            // No resistor or inductor reaches ground: the node fluxes float (DC levels), and a current step charges the
            // capacitors steadily.
            "floating" => new Circuit("floating", ["p", "q", "r"],
                [new Resistor("Rpq", "p", "q", 100)],
                [new Inductor("Lqr", "q", "r", 5e-3)],
                [new Capacitor("Cp", "p", Circuit.Ground, 1e-6), new Capacitor("Cq", "q", Circuit.Ground, 2e-6), new Capacitor("Cr", "r", Circuit.Ground, 0.5e-6)],
                [],
                [new CurrentSource("I1", Circuit.Ground, "p", 1, waveform(0.01))]),
            // A capacitor from the node a voltage source holds (an inerter to a moving support), the source on its − terminal.
            "source-capacitor" => new Circuit("source capacitor", ["in", "out", "x"],
                [new Resistor("R1", "out", Circuit.Ground, 1000), new Resistor("R2", "x", Circuit.Ground, 20)],
                [new Inductor("L1", "out", "x", 10e-3)],
                [new Capacitor("C1", "in", "out", 1e-6), new Capacitor("C2", "out", Circuit.Ground, 0.47e-6), new Capacitor("C3", "in", Circuit.Ground, 1e-9)],
                [new VoltageSource("V1", Circuit.Ground, "in", 1, waveform(3))],
                [new CurrentSource("I1", "x", "in", 1, waveform(0.05))]),
            // Two tanks in µF, mH and ohms coupled by a capacitor: every node has capacitance (the sweep's Hessenberg engine).
            "tanks" => CircuitFixtures.CoupledTanks(waveform(0.1)),
            _ => throw new ArgumentException(name),
        };
    }

    [Theory]
    [MemberData(nameof(Circuits))]
    public void Roots_EqualTheStateSpaceReference(string name)
    {
        var analogy = CircuitAnalogy.Of(Build(name));
        // The reference lists every zero root; the network path leaves out the flux levels, which no voltage or current shows.
        var expected = ReferenceModes.Solve(CircuitStateSpace.Of(analogy)).Skip(CircuitTopology.FluxLevelCount(analogy)).ToArray();
        var actual = CircuitModes.Solve(analogy);
        Assert.Equal(expected.Select(r => r.Kind), actual.Select(r => r.Kind));
        Assert.NotEmpty(actual);
        for (var i = 0; i < actual.Length; i++)
        {
            var scale = Math.Max(expected[i].Root.Magnitude, 1e-300);
            NumericAssert.Close(expected[i].Root.Real, actual[i].Root.Real, Tolerance.Abs(Tol * scale), $"{name}: Re s{i + 1}");
            NumericAssert.Close(expected[i].Root.Imaginary, actual[i].Root.Imaginary, Tolerance.Abs(Tol * scale), $"{name}: Im s{i + 1}");
        }
    }

    [Fact]
    public void CoupledTanksInMicrofaradsAndMillihenries_RootsMatchA40DigitSolution()
    {
        // Own computation: the four roots of det(s²C + sG + Γ) = 0 of CircuitFixtures.CoupledTanks() found with mpmath at
        // 40 digits (the quartic's coefficients from five exact evaluations, then polyroots). Capacitances of 1e-6 and
        // inverse inductances of 1e3 put 1e9 between the entries of the network's first-order form: the balancing keeps ζ.
        var roots = CircuitModes.Solve(CircuitAnalogy.Of(CircuitFixtures.CoupledTanks())).Where(r => r.Kind == CircuitRootKind.Oscillation).ToArray();
        Assert.Equal(2, roots.Length);
        NumericAssert.Close(2024.0895018345367577, roots[0].NaturalFrequencyHz, Tolerance.Rel(1e-12), "f1");
        NumericAssert.Close(0.11372342882525052832, roots[0].DampingRatio, Tolerance.Rel(1e-12), "ζ1");
        NumericAssert.Close(3251.2103307956127896, roots[1].NaturalFrequencyHz, Tolerance.Rel(1e-12), "f2");
        NumericAssert.Close(0.10332220928413869477, roots[1].DampingRatio, Tolerance.Rel(1e-12), "ζ2");
    }

    [Theory]
    [MemberData(nameof(Circuits))]
    public void FrequencyResponses_EqualTheDenseComplexSolve(string name)
    {
        var analogy = CircuitAnalogy.Of(Build(name));
        var frequencies = Enumerable.Range(0, 25).Select(i => 50 * Math.Pow(10, i / 8.0)).ToArray(); // 50 Hz – 50 kHz
        var expected = ReferenceFrequencyResponse.Solve(analogy, frequencies);
        var actual = CircuitFrequencyResponse.Solve(analogy, frequencies);
        Assert.Equal(expected.Select(r => r.Source), actual.Select(r => r.Source));
        for (var s = 0; s < actual.Length; s++)
        {
            Assert.Equal(expected[s].IsVoltageSource, actual[s].IsVoltageSource);
            Assert.Equal(expected[s].Nodes, actual[s].Nodes);
            for (var k = 0; k < frequencies.Length; k++)
            {
                Close(expected[s].Impedance[k], actual[s].Impedance[k], Tol * expected[s].Impedance[k].Magnitude, $"{name}: Z at {frequencies[k]} Hz");
                var scale = expected[s].Transfer[k].Max(v => v.Magnitude);
                for (var j = 0; j < actual[s].Nodes.Length; j++)
                    Close(expected[s].Transfer[k][j], actual[s].Transfer[k][j], Tol * scale, $"{name}: {actual[s].Nodes[j]} at {frequencies[k]} Hz");
            }
        }
    }

    [Theory]
    [MemberData(nameof(Circuits))]
    public void StepResponses_EqualTheChargeStateReference(string name) =>
        CompareTransients(Build(name), 3e-3, 2e-5);

    [Theory]
    [MemberData(nameof(Circuits))]
    public void PulseResponses_EqualTheChargeStateReference_WithTheEndsBetweenSteps(string name) =>
        // A rectangular pulse starting and ending inside recording steps: both paths cut the steps at its ends.
        CompareTransients(Build(name, v => new RectangularPulse(v, 4.13e-4, 1.07e-4)), 2e-3, 2e-5);

    [Theory]
    [MemberData(nameof(Circuits))]
    public void SineResponses_EqualTheChargeStateReference(string name) =>
        // A sine from t = 0 with a phase (a jump at the start) and a half-sine pulse: smooth inputs, taken on each piece as
        // its start value and the midpoint secant by both paths, so the two agree although neither is exact.
        CompareTransients(Build(name, v => new SineFunction(v, 1.7e3, 0.6)), 2e-3, 2e-5, smooth: true);

    [Theory]
    [MemberData(nameof(Circuits))]
    public void HalfSinePulseResponses_EqualTheChargeStateReference(string name) =>
        CompareTransients(Build(name, v => new HalfSinePulse(v, 3.3e-4, 5.1e-5)), 2e-3, 2e-5, smooth: true);

    private static void CompareTransients(Circuit circuit, double duration, double step, bool smooth = false)
    {
        var analogy = CircuitAnalogy.Of(circuit);
        // The reference leaves a source's own rate dV/dt out of the capacitor currents (and so of the source's current)
        // where a capacitor touches a source's node: wrong while the source voltage changes (KirchhoffTests shows it
        // against the rate of the recorded voltages), right under steps and pulses. Those currents are compared only then.
        var held = analogy.Nodes.Skip(analogy.FreeCount).ToHashSet();
        var sourceRate = smooth && circuit.Capacitors.Any(c => held.Contains(c.NodeA) || held.Contains(c.NodeB));
        var expected = ReferenceTransient.Run(CircuitStateSpace.Of(analogy), duration, step);
        var actual = CircuitTransient.Run(analogy, duration, step);
        NumericAssert.Close([.. expected.Times], [.. actual.Times], Tolerance.Abs(1e-15), "times");
        Assert.Equal(expected.Nodes, actual.Nodes);
        for (var j = 0; j < actual.Nodes.Length; j++)
        {
            var scale = expected.Volts[j].Max(Math.Abs);
            NumericAssert.Close([.. expected.Volts[j]], [.. actual.Volts[j]], Tolerance.Abs(Tol * Math.Max(scale, 1e-300)), $"{circuit.Title}: v({actual.Nodes[j]})");
        }
        Assert.Equal(expected.Currents.Select(b => (b.Element, b.Kind)), actual.Currents.Select(b => (b.Element, b.Kind)));
        for (var b = 0; b < actual.Currents.Length; b++)
        {
            if (sourceRate && actual.Currents[b].Kind is "capacitor" or "voltage-source") continue;
            var scale = expected.Currents[b].Amperes.Max(Math.Abs);
            NumericAssert.Close([.. expected.Currents[b].Amperes], [.. actual.Currents[b].Amperes],
                Tolerance.Abs(Tol * Math.Max(scale, 1e-300)), $"{circuit.Title}: i({actual.Currents[b].Element})");
        }
    }

    private static void Close(Complex expected, Complex actual, double tolerance, string what)
    {
        NumericAssert.Close(expected.Real, actual.Real, Tolerance.Abs(tolerance), what + " (real)");
        NumericAssert.Close(expected.Imaginary, actual.Imaginary, Tolerance.Abs(tolerance), what + " (imaginary)");
    }
}
