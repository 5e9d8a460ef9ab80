using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>
/// The node flux analogy: a circuit whose nodes all have capacitance to ground and its analogue mass–spring–damper
/// network (m = C, k = 1/L, c = 1/R, force = current) are the same equations. Identity checks: the circuit path and the
/// mechanical engine must agree to rounding.
/// </summary>
public class CircuitAnalogyTests
{
    [Fact]
    public void Matrices_AreTheNetworkAssemblyOfTheAnalogue()
    {
        // Identity: the circuit's stamps equal the support partition of the analogue network (M, C_ff, K_ff).
        var analogy = CircuitAnalogy.Of(CircuitFixtures.CoupledTanks());
        var network = analogy.ToNetwork();
        var partition = SupportPartition.Assemble(network);
        NumericAssert.Close(D(partition.Mass), analogy.Capacitance, Tolerance.Abs(0), "M = capacitance");
        NumericAssert.Close(D(partition.StiffnessFF), analogy.InverseInductance, Tolerance.Abs(0), "K = 1/L");
        NumericAssert.Close(D(partition.DamperFF), analogy.Conductance, Tolerance.Abs(0), "C = 1/R");
        Assert.Equal(["Cab"], network.Inerters.Select(i => i.Name));
    }

    [Fact]
    public void SeriesRlc_RootsEqualTheMasslessNodeEngineOnTheAnalogueNetwork()
    {
        // Identity: 'mid' has no capacitor, so the analogue network has a massless node; the network's first-order
        // engine (support held: the source shorted) must give the circuit's oscillation. R, L, C of order one (ζ = 0.1).
        var analogy = CircuitAnalogy.Of(CircuitFixtures.SeriesRlc(0.2, 1, 1));
        var network = analogy.ToNetwork();
        Assert.Equal(0, network.Masses.Single(m => m.Name == "mid").Kilograms);
        var p = SupportPartition.Assemble(network);
        var mechanical = ModalChain.Core.Analyses.FirstOrder.FirstOrderSystem.Build(p.Mass, p.DamperFF, p.StiffnessFF, p.Free.Label)
            .ComplexModes().Where(m => m.IsOscillatory).ToArray();
        var circuit = CircuitModes.Solve(analogy).Where(r => r.Kind == CircuitRootKind.Oscillation).ToArray();
        Assert.Equal(mechanical.Length, circuit.Length);
        Assert.Single(circuit);
        NumericAssert.Close(mechanical[0].UndampedFrequencyHz, circuit[0].NaturalFrequencyHz, Tolerance.Rel(1e-10), "f0");
        NumericAssert.Close(mechanical[0].DampingRatio, circuit[0].DampingRatio, Tolerance.Rel(1e-10), "ζ");
        NumericAssert.Close(0.1, circuit[0].DampingRatio, Tolerance.Rel(1e-12), "ζ = (R/2)√(C/L)");
    }

    [Fact]
    public void Roots_EqualTheComplexModesOfTheAnalogueNetwork()
    {
        // Identity: circuit roots vs ComplexModes (state-space eigenproblem of M, C, K) of the analogue network. In F, H
        // and Ω of order one: with µF and mH, ComplexModes' unbalanced M⁻¹K loses ζ to 2e-10 relative (checked against a
        // 40-digit solution of det(s²C + sG + Γ) = 0, which the circuit path, the network's first-order form balanced, matches
        // to 1e-12: EnginePathTests.CoupledTanksInMicrofaradsAndMillihenries_RootsMatchA40DigitSolution).
        var analogy = CircuitAnalogy.Of(CircuitFixtures.CoupledTanks(normalised: true));
        var network = analogy.ToNetwork();
        var p = SupportPartition.Assemble(network);
        var mechanical = ComplexModes.Solve(D(p.Mass), D(p.StiffnessFF), D(p.DamperFF))
            .Where(m => m.IsOscillatory).OrderBy(m => m.UndampedFrequencyHz).ToArray();
        var circuit = CircuitModes.Solve(analogy).Where(r => r.Kind == CircuitRootKind.Oscillation).ToArray();
        Assert.Equal(mechanical.Length, circuit.Length);
        Assert.Equal(2, circuit.Length);
        for (var i = 0; i < circuit.Length; i++)
        {
            NumericAssert.Close(mechanical[i].UndampedFrequencyHz, circuit[i].NaturalFrequencyHz, Tolerance.Rel(1e-10), $"f{i + 1}");
            NumericAssert.Close(mechanical[i].DampingRatio, circuit[i].DampingRatio, Tolerance.Rel(1e-10), $"ζ{i + 1}");
        }
    }

    [Fact]
    public void ParallelRlc_RootsAndFrequencyResponse_EqualTheMassSpringDamper()
    {
        // m = C, k = 1/L, c = 1/R: ω_n = √(k/m), ζ = c/(2√(km)) (standard SDOF, common practice); the node voltage per
        // unit current is the mobility iω/(k − ω²m + iωc) of the mass under a unit force.
        const double r = 50, l = 2e-3, c = 4.7e-6;
        double m = c, k = 1 / l, d = 1 / r;
        var analogy = CircuitAnalogy.Of(CircuitFixtures.ParallelRlc(r, l, c));
        var root = CircuitModes.Solve(analogy).Single();
        NumericAssert.Close(Math.Sqrt(k / m) / (2 * Math.PI), root.NaturalFrequencyHz, Tolerance.Rel(1e-10), "f_n");
        NumericAssert.Close(d / (2 * Math.Sqrt(k * m)), root.DampingRatio, Tolerance.Rel(1e-10), "ζ");

        var frequencies = new[] { 100.0, 500, 1000, 1038.1, 2000, 10000 };
        var response = CircuitFrequencyResponse.Solve(analogy, frequencies).Single();
        for (var i = 0; i < frequencies.Length; i++)
        {
            var w = 2 * Math.PI * frequencies[i];
            var mobility = new Complex(0, w) / new Complex(k - w * w * m, w * d);
            NumericAssert.Close(mobility.Real, response.Transfer[i][0].Real, Tolerance.Abs(1e-10 * mobility.Magnitude), "Re v/F");
            NumericAssert.Close(mobility.Imaginary, response.Transfer[i][0].Imaginary, Tolerance.Abs(1e-10 * mobility.Magnitude), "Im v/F");
            NumericAssert.Close(mobility.Magnitude, response.Impedance[i].Magnitude, Tolerance.Rel(1e-10), "Z = mobility");
        }
    }

    [Fact]
    public void CoupledTanks_FrequencyResponse_EqualsADenseSolveOfTheAnalogueNetwork()
    {
        // Identity: velocities of (K − ω²M + iωC) x = F, F = unit force on 'a', solved densely here, vs node voltages.
        var analogy = CircuitAnalogy.Of(CircuitFixtures.CoupledTanks());
        var p = SupportPartition.Assemble(analogy.ToNetwork());
        var frequencies = new[] { 300.0, 1200, 2500, 4000 };
        var response = CircuitFrequencyResponse.Solve(analogy, frequencies).Single();
        foreach (var (f, i) in frequencies.Select((f, i) => (f, i)))
        {
            var w = 2 * Math.PI * f;
            var a = Matrix<Complex>.Build.Dense(2, 2, (row, col) => new Complex(p.StiffnessFF[row, col] - w * w * p.Mass[row, col], w * p.DamperFF[row, col]));
            var x = a.Solve(MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.DenseOfArray([1, 0]));
            var scale = x.Select(v => (w * v).Magnitude).Max();
            for (var node = 0; node < 2; node++)
            {
                var velocity = new Complex(0, w) * x[p.Free.IndexOf(analogy.Circuit.Nodes[node])];
                NumericAssert.Close(velocity.Real, response.Transfer[i][node].Real, Tolerance.Abs(1e-10 * scale), "Re");
                NumericAssert.Close(velocity.Imaginary, response.Transfer[i][node].Imaginary, Tolerance.Abs(1e-10 * scale), "Im");
            }
        }
    }

    [Fact]
    public void ParallelRlc_StepCurrent_GivesTheNormalisedStepResponseOfTheMassSpringDamper()
    {
        // A force step F on m, k, c gives the velocity ẋ(t) = F/(m ω_d) e^{−ζω_n t} sin ω_d t (SDOF step response,
        // common practice); the node voltage under a current step must be the same curve.
        const double r = 50, l = 2e-3, c = 4.7e-6, amps = 0.2;
        double m = c, k = 1 / l, d = 1 / r;
        var analogy = CircuitAnalogy.Of(CircuitFixtures.ParallelRlc(r, l, c, new StepFunction(amps, 0)));
        var result = CircuitTransient.Run(analogy, 5e-3, 2.5e-5);
        var wn = Math.Sqrt(k / m);
        var zeta = d / (2 * Math.Sqrt(k * m));
        var wd = wn * Math.Sqrt(1 - zeta * zeta);
        var peak = amps / (m * wd);
        for (var i = 0; i < result.Times.Length; i++)
        {
            var t = result.Times[i];
            var velocity = amps / (m * wd) * Math.Exp(-zeta * wn * t) * Math.Sin(wd * t);
            NumericAssert.Close(velocity / peak, result.Volts[0][i] / peak, Tolerance.Abs(1e-10), $"normalised v({t})");
        }
    }

    [Fact]
    public void Topology_CountsDcLevelsAndRefusesFloatingGroups()
    {
        // A capacitor alone between two nodes with resistors to ground: no capacitance reaches ground (refused).
        var floating = new Circuit("floating", ["a", "b"],
            [new Resistor("R1", "a", Circuit.Ground, 10), new Resistor("R2", "b", Circuit.Ground, 10)], [],
            [new Capacitor("C1", "a", "b", 1e-6)], [], [new CurrentSource("I1", Circuit.Ground, "a", 1, null)]);
        var groups = CircuitTopology.UnsupportedGroups(CircuitAnalogy.Of(floating));
        Assert.Equal([(["a", "b"], "capacitor")], groups.Select(g => (g.Nodes.ToArray(), g.Lacks)));
        // A lone capacitor to ground under a current source: the voltage integrates the current, a double zero root.
        var integrator = new Circuit("integrator", ["a"], [], [], [new Capacitor("C1", "a", Circuit.Ground, 1e-6)], [],
            [new CurrentSource("I1", Circuit.Ground, "a", 1, null)]);
        Assert.Equal(2, CircuitTopology.ZeroRootCount(CircuitAnalogy.Of(integrator)));
        // Of these, one is the flux level (shows in no voltage), one the voltage the capacitor keeps: a DC level.
        Assert.Equal(1, CircuitTopology.FluxLevelCount(CircuitAnalogy.Of(integrator)));
        Assert.Equal(1, CircuitTopology.VoltageLevelCount(CircuitAnalogy.Of(integrator)));
        Assert.Equal(CircuitRootKind.DcLevel, Assert.Single(CircuitModes.Solve(CircuitAnalogy.Of(integrator))).Kind);
        Assert.Equal(0, CircuitTopology.ZeroRootCount(CircuitAnalogy.Of(CircuitFixtures.ParallelRlc(1, 1, 1))));
        Assert.Equal(1, CircuitTopology.ZeroRootCount(CircuitAnalogy.Of(CircuitFixtures.SeriesRlc(1, 1, 1))));
        Assert.Equal(0, CircuitTopology.VoltageLevelCount(CircuitAnalogy.Of(CircuitFixtures.SeriesRlc(1, 1, 1))));
    }

    private static Matrix<double> D(Matrix<double> m) => Matrix<double>.Build.DenseOfMatrix(m);
}
