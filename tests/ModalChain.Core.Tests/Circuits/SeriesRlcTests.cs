using System.Numerics;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>
/// The series RLC against its closed forms. Source of the formulas: the natural and step response of a series RLC
/// circuit as derived in any circuits text (e.g. Nilsson and Riedel, Electric Circuits, the chapter on RLC natural and
/// step responses [from memory]): α = R/(2L), ω₀ = 1/√(LC), ζ = α/ω₀ = (R/2)√(C/L), Q = 1/(2ζ), ω_d = √(ω₀² − α²);
/// Z(ω) = R + i(ωL − 1/(ωC)).
/// </summary>
public class SeriesRlcTests
{
    private const double L = 10e-3, C = 1e-6;   // ω₀ = 10,000 rad/s
    private static readonly double W0 = 1 / Math.Sqrt(L * C);

    [Theory]
    [InlineData(20.0)]    // ζ = 0.1
    [InlineData(150.0)]   // ζ = 0.75
    [InlineData(2.0)]     // ζ = 0.01, Q = 50
    public void Roots_MatchNaturalFrequencyDampingRatioAndQ(double r)
    {
        var roots = CircuitModes.Solve(CircuitAnalogy.Of(CircuitFixtures.SeriesRlc(r, L, C)));
        var zeta = r / 2 * Math.Sqrt(C / L);
        // The flux of 'mid' and 'out' together is free (no inductor reaches ground), a zero root of the flux coordinate that
        // no voltage or current shows: the circuit's roots are the two of its second-order equation, one oscillation.
        Assert.Equal([CircuitRootKind.Oscillation], roots.Select(x => x.Kind));
        var osc = roots[0];
        NumericAssert.Close(W0 / (2 * Math.PI), osc.NaturalFrequencyHz, Tolerance.Rel(1e-12), "f0 = 1/(2π√(LC))");
        NumericAssert.Close(zeta, osc.DampingRatio, Tolerance.Rel(1e-12), "ζ = (R/2)√(C/L)");
        NumericAssert.Close(1 / (2 * zeta), osc.QualityFactor, Tolerance.Rel(1e-12), "Q = 1/(2ζ)");
        NumericAssert.Close(W0 * Math.Sqrt(1 - zeta * zeta) / (2 * Math.PI), osc.DampedFrequencyHz, Tolerance.Rel(1e-12), "f_d");
    }

    [Fact]
    public void Overdamped_GivesTwoRelaxationsWithTheClosedFormTimeConstants()
    {
        const double r = 500; // ζ = 2.5
        var roots = CircuitModes.Solve(CircuitAnalogy.Of(CircuitFixtures.SeriesRlc(r, L, C)));
        var alpha = r / (2 * L);
        var root = Math.Sqrt(alpha * alpha - W0 * W0);
        Assert.Equal([CircuitRootKind.Relaxation, CircuitRootKind.Relaxation], roots.Select(x => x.Kind));
        NumericAssert.Close(1 / (alpha - root), roots[0].TimeConstant, Tolerance.Rel(1e-12), "slow τ = −1/s₁");
        NumericAssert.Close(1 / (alpha + root), roots[1].TimeConstant, Tolerance.Rel(1e-12), "fast τ = −1/s₂");
    }

    [Theory]
    [InlineData(20.0)]    // underdamped, ζ = 0.1
    [InlineData(200.0)]   // critically damped, R = 2√(L/C)
    [InlineData(500.0)]   // overdamped, ζ = 2.5
    public void StepResponse_CapacitorVoltageAndCurrent_MatchTheClosedForms(double r)
    {
        const double v = 12;
        var circuit = CircuitFixtures.SeriesRlc(r, L, C, new StepFunction(v, 0));
        var result = CircuitTransient.Run(CircuitAnalogy.Of(circuit), 2e-3, 1e-5);
        var alpha = r / (2 * L);
        var outIndex = result.Nodes.IndexOf("out");
        var inductor = result.Currents.Single(b => b.Element == "L1");
        for (var k = 0; k < result.Times.Length; k++)
        {
            var t = result.Times[k];
            var (vc, i) = Closed(alpha, t, v);
            NumericAssert.Close(vc, result.Volts[outIndex][k], Tolerance.Abs(1e-10 * v), $"v_C({t})");
            NumericAssert.Close(i, inductor.Amperes[k], Tolerance.Abs(1e-10 * v / r), $"i({t})");
        }
        NumericAssert.Close(v, result.Volts[result.Nodes.IndexOf("in")][^1], Tolerance.Abs(0), "source node");
    }

    [Fact]
    public void RectangularPulse_IsTheDifferenceOfTwoSteps_EvenWhenItsEndFallsBetweenSteps()
    {
        // Linearity (superposition of a step at 0 and a negative step at the pulse's end): v(t) = g(t) − g(t − T).
        const double r = 20, v = 5, width = 3.37e-4; // the end lies inside a recording step
        var circuit = CircuitFixtures.SeriesRlc(r, L, C, new RectangularPulse(v, width));
        var result = CircuitTransient.Run(CircuitAnalogy.Of(circuit), 1.5e-3, 2e-5);
        var alpha = r / (2 * L);
        var outIndex = result.Nodes.IndexOf("out");
        for (var k = 0; k < result.Times.Length; k++)
        {
            var t = result.Times[k];
            var expected = Closed(alpha, t, v).Vc - (t >= width ? Closed(alpha, t - width, v).Vc : 0);
            NumericAssert.Close(expected, result.Volts[outIndex][k], Tolerance.Abs(1e-10 * v), $"v_C({t})");
        }
    }

    [Fact]
    public void Impedance_MagnitudeAndPhaseOverASweep_MatchRPlusJOmegaLPlusOneOverJOmegaC()
    {
        const double r = 20;
        var frequencies = Enumerable.Range(0, 41).Select(i => 100 * Math.Pow(10, i / 20.0)).ToArray(); // 100 Hz – 10 kHz
        var response = CircuitFrequencyResponse.Solve(CircuitAnalogy.Of(CircuitFixtures.SeriesRlc(r, L, C)), frequencies).Single();
        Assert.True(response.IsVoltageSource);
        for (var k = 0; k < frequencies.Length; k++)
        {
            var w = 2 * Math.PI * frequencies[k];
            var x = w * L - 1 / (w * C);
            NumericAssert.Close(Math.Sqrt(r * r + x * x), response.Impedance[k].Magnitude, Tolerance.Rel(1e-10), $"|Z| at {frequencies[k]} Hz");
            NumericAssert.Close(Math.Atan2(x, r), response.Impedance[k].Phase, Tolerance.Abs(1e-10), $"arg Z at {frequencies[k]} Hz");
            // Capacitor voltage over source voltage: (1/(iωC)) / Z, the voltage divider.
            var h = 1 / (new Complex(0, w * C) * new Complex(r, x));
            var got = response.Transfer[k][response.Nodes.IndexOf("out")];
            NumericAssert.Close(h.Magnitude, got.Magnitude, Tolerance.Rel(1e-10), "|H|");
            NumericAssert.Close(h.Phase, got.Phase, Tolerance.Abs(1e-10), "arg H");
        }
    }

    // Capacitor voltage and loop current after a step of v at t = 0 from rest (closed forms, see the class summary).
    private static (double Vc, double I) Closed(double alpha, double t, double v)
    {
        var w0 = W0;
        if (Math.Abs(alpha - w0) < 1e-9 * w0)
        {
            var e = Math.Exp(-alpha * t);
            return (v * (1 - e * (1 + alpha * t)), C * v * alpha * alpha * t * e);
        }
        if (alpha < w0)
        {
            var wd = Math.Sqrt(w0 * w0 - alpha * alpha);
            var e = Math.Exp(-alpha * t);
            return (v * (1 - e * (Math.Cos(wd * t) + alpha / wd * Math.Sin(wd * t))), v / (wd * L) * e * Math.Sin(wd * t));
        }
        var root = Math.Sqrt(alpha * alpha - w0 * w0);
        double s1 = -alpha + root, s2 = -alpha - root;
        var vc = v * (1 + (s2 * Math.Exp(s1 * t) - s1 * Math.Exp(s2 * t)) / (s1 - s2));
        var i = C * v * s1 * s2 * (Math.Exp(s1 * t) - Math.Exp(s2 * t)) / (s1 - s2);
        return (vc, i);
    }
}
