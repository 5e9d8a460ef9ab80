using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>A transient run through a transducer: the source's work equals stored plus dissipated energy.</summary>
public class TransducerEnergyBalanceTests
{
    [Fact]
    public void ShakerRunUp_SourceWork_EqualsStoredPlusDissipatedEnergy()
    {
        // Conservation of energy (common practice): ∫V·I dt = ½m'v² + ½kx² + ∫(c v² + R_e I²) dt at every instant, with
        // m' = m + C_p·Bl² (the port capacitance's ½C_p·λ̇² written through λ̇_port = Bl·v). Every figure is computed here
        // from the recorded histories (table displacement and velocity, the coil-resistance current = the force of damper
        // "re"), the integrals by the trapezoid rule. The voltage rises smoothly to 2 V over 50 ms (a half-sine source
        // acceleration, so V(t) and the power have no kink), the exact integrator runs at h = 1e-5 s, about 4,400 steps
        // per period of the 22.5 Hz table: the trapezoid's error (ωh)²/12 ≈ 2e-7 sets the tolerance, 1e-6 of the largest
        // energy figure. A transducer that created or lost energy would miss it by the size of its power flow.
        const double m = 2, k = 4e4, c = 15, bl = 12, re = 4, cp = 1e-9, v0 = 2, rise = 0.05, h = 1e-5;
        var network = TransducerModels.Shaker(m, k, c, bl, re, cp);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var amplitude = v0 * Math.PI / (2 * rise);
        var drive = new SupportAccelerationHistory("drive", "amp", new HalfSinePulse(amplitude, rise));
        var result = TransientAnalysis.Run(system, [drive], [], new TransientSettings(0.3, h, TransientMethod.Exact) { Outputs = ["table"] });

        var t = result.Times;
        var x = result.Get("table", ResponseQuantity.Displacement).Values;
        var v = result.Get("table", ResponseQuantity.Velocity).Values;
        var current = result.Get("re", ResponseQuantity.DamperForce).Values;
        double Volts(double time) => time >= rise ? v0 : amplitude * rise / Math.PI * (1 - Math.Cos(Math.PI * time / rise));
        var mEff = m + cp * bl * bl;
        double work = 0, dissipated = 0, largest = 0, worst = 0;
        for (var s = 0; s < t.Length; s++)
        {
            if (s > 0)
            {
                var dt = t[s] - t[s - 1];
                work += 0.5 * dt * (Volts(t[s]) * current[s] + Volts(t[s - 1]) * current[s - 1]);
                dissipated += 0.5 * dt * (c * v[s] * v[s] + re * current[s] * current[s] + c * v[s - 1] * v[s - 1] + re * current[s - 1] * current[s - 1]);
            }
            var stored = 0.5 * mEff * v[s] * v[s] + 0.5 * k * x[s] * x[s];
            largest = Math.Max(largest, Math.Max(work, stored + dissipated));
            worst = Math.Max(worst, Math.Abs(work - stored - dissipated));
        }
        Assert.True(work > 0.1 * largest, $"the source did work ({work} J of {largest} J)");
        NumericAssert.Small(worst / largest, 1e-6, "energy balance through the transducer");
        // The table settles at the static deflection of the force Bl·V/R_e (closed form; after 0.25 s at ζ ≈ 0.09 the
        // transient has decayed to e^{−ζω₀·0.25} ≈ 4e-2 of its size, so 5 % is asserted).
        NumericAssert.Close(bl * v0 / re / k, x[^1], Tolerance.Rel(0.05), "final deflection");
    }
}
