using System.Numerics;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>
/// A circuit without any capacitor: its analogue network has no mass at all, only a massless node, so every analysis runs
/// on the first-order states alone. Series RL under a voltage source: one relaxation τ = L/R, Z = R + iωL, and after a
/// step V the current V/R·(1 − e^{−t/τ}) (first-order RL response; common practice, any circuits text, from memory).
/// </summary>
public class SeriesRlTests
{
    private const double R = 47, L = 22e-3, V = 9; // τ = 0.468 ms

    private static Circuit Rl(TimeFunction? waveform = null) => new("series RL", ["in", "mid"],
        [new Resistor("R1", "in", "mid", R)], [new Inductor("L1", "mid", Circuit.Ground, L)], [],
        [new VoltageSource("V1", "in", Circuit.Ground, 1, waveform)], []);

    [Fact]
    public void Root_IsOneRelaxationWithTheTimeConstantLOverR()
    {
        var root = CircuitModes.Solve(CircuitAnalogy.Of(Rl())).Single();
        Assert.Equal(CircuitRootKind.Relaxation, root.Kind);
        NumericAssert.Close(L / R, root.TimeConstant, Tolerance.Rel(1e-12), "τ = L/R");
    }

    [Fact]
    public void Impedance_IsRPlusJOmegaL()
    {
        var frequencies = new[] { 10.0, 340.0, 1e3, 2.5e4 };
        var response = CircuitFrequencyResponse.Solve(CircuitAnalogy.Of(Rl()), frequencies).Single();
        for (var k = 0; k < frequencies.Length; k++)
        {
            var z = new Complex(R, 2 * Math.PI * frequencies[k] * L);
            NumericAssert.Close(z.Real, response.Impedance[k].Real, Tolerance.Rel(1e-10), $"Re Z at {frequencies[k]} Hz");
            NumericAssert.Close(z.Imaginary, response.Impedance[k].Imaginary, Tolerance.Rel(1e-10), $"Im Z at {frequencies[k]} Hz");
        }
    }

    [Fact]
    public void StepResponse_CurrentRisesAsOneMinusExponential()
    {
        var result = CircuitTransient.Run(CircuitAnalogy.Of(Rl(new StepFunction(V, 0))), 3e-3, 2e-5);
        var inductor = result.Currents.Single(b => b.Element == "L1").Amperes;
        var resistor = result.Currents.Single(b => b.Element == "R1").Amperes;
        var source = result.Currents.Single(b => b.Element == "V1").Amperes;
        var mid = result.Volts[result.Nodes.IndexOf("mid")];
        for (var k = 0; k < result.Times.Length; k++)
        {
            var t = result.Times[k];
            var i = V / R * (1 - Math.Exp(-t * R / L));
            NumericAssert.Close(i, inductor[k], Tolerance.Abs(1e-10 * V / R), $"i_L({t})");
            NumericAssert.Close(i, resistor[k], Tolerance.Abs(1e-10 * V / R), $"i_R({t})");
            NumericAssert.Close(i, source[k], Tolerance.Abs(1e-10 * V / R), $"i_V({t})");
            NumericAssert.Close(V * Math.Exp(-t * R / L), mid[k], Tolerance.Abs(1e-10 * V), $"v_L({t})");
        }
    }
}
