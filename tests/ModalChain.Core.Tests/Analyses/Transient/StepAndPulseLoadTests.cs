using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.Analyses.Transient.TransientTestKit;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>Step loads and short pulses on one degree of freedom against their closed-form maximum responses.</summary>
public class StepAndPulseLoadTests
{
    private const double M = 120, K = 3.0e5, F0 = 1500;
    private static readonly double Omega = Math.Sqrt(K / M);
    private static readonly double Period = 2 * Math.PI / Omega;
    private const double Static = F0 / K;

    [Theory]
    [InlineData("newmark")]
    [InlineData("exact")]
    [InlineData("modal")]
    public void SuddenlyAppliedLoad_UndampedDynamicFactorIsTwo(string method)
    {
        // u = (F0/k)(1 − cos ωt), peak 2F0/k at t = T/2 (Chopra, Dynamics of Structures, §4.3 — from memory;
        // the factor 2 of a suddenly applied load is common practice).
        var sink = Run(method, Sdof(M, 0, K), Force(1, 0, new StepFunction(F0, 0)), [0], [0], Period / 400, 800);
        var u = sink.Dof(0);
        NumericAssert.Close(2.0, u.Max() / Static, Tolerance.Rel(1e-4), $"{method} dynamic factor");
        var firstPeriod = u[..401];
        var atPeak = sink.Times[Array.IndexOf(firstPeriod, firstPeriod.Max())];
        NumericAssert.Close(Period / 2, atPeak, Tolerance.Abs(Period / 400), "time of the peak");
    }

    [Theory]
    [InlineData(0.05)]
    [InlineData(0.2)]
    public void SuddenlyAppliedLoad_DampedMatchesClosedForm(double zeta)
    {
        // u/u_st = 1 − e^(−ζωt)[cos ω_d t + ζ/√(1−ζ²) sin ω_d t]; peak 1 + exp(−πζ/√(1−ζ²)) at t = π/ω_d
        // (Chopra §4.3, from memory; closed form re-derived).
        var c = 2 * zeta * Math.Sqrt(K * M);
        var wd = Omega * Math.Sqrt(1 - zeta * zeta);
        var h = Period / 1000;
        var sink = Run("exact", Sdof(M, c, K), Force(1, 0, new StepFunction(F0, 0)), [0], [0], h, 3000);
        for (var s = 0; s < sink.Times.Count; s += 37)
        {
            var t = sink.Times[s];
            var expected = Static * (1 - Math.Exp(-zeta * Omega * t) * (Math.Cos(wd * t) + zeta / Math.Sqrt(1 - zeta * zeta) * Math.Sin(wd * t)));
            NumericAssert.Close(expected, sink.U[s][0], Tolerance.Abs(1e-10 * Static), $"u({t:F4})");
        }
        NumericAssert.Close(1 + Math.Exp(-Math.PI * zeta / Math.Sqrt(1 - zeta * zeta)), sink.Dof(0).Max() / Static, Tolerance.Rel(1e-5), "peak factor");
    }

    [Theory]
    [InlineData(0.125)]
    [InlineData(0.25)]
    [InlineData(0.4)]
    [InlineData(1.0)]
    public void RectangularPulse_MaximumMatchesShockSpectrum(double ratio)
    {
        // Undamped maximum response to a rectangular pulse of length t_d: R = 2 sin(π t_d/T) for t_d/T ≤ ½, 2 otherwise
        // (Chopra, Dynamics of Structures, §4.7; Biggs, Introduction to Structural Dynamics, 1964, ch. 2 — from memory).
        var expected = ratio <= 0.5 ? 2 * Math.Sin(Math.PI * ratio) : 2.0;
        var h = Period / 4000;
        var sink = Run("exact", Sdof(M, 0, K), Force(1, 0, new RectangularPulse(F0, ratio * Period)), [0], [0], h, 4000 * 3);
        var peak = sink.Dof(0).Select(Math.Abs).Max() / Static;
        // The load is sampled at the steps, so the jump at the end of the pulse is spread over one step: rel 1e-3.
        NumericAssert.Close(expected, peak, Tolerance.Rel(1e-3), $"R at t_d/T = {ratio}");
    }

    [Theory]
    [InlineData(0.25)]
    [InlineData(0.5)]
    [InlineData(1.0)]
    [InlineData(2.0)]
    public void HalfSinePulse_MaximumMatchesShockSpectrum(double ratio)
    {
        // Undamped half-cycle sine pulse, β = T/(2t_d) (Chopra, Dynamics of Structures, §4.8 — from memory; re-derived):
        // t_d/T < ½ (maximum in free vibration): R = (T/t_d) cos(π t_d/T) / ((T/2t_d)² − 1);
        // t_d/T = ½: R = π/2; t_d/T > ½ (maximum during the pulse): R = max over l of sin(2πl/(1 + 2t_d/T)) / (1 − T/2t_d)
        // for the peaks l = 1, 2, ... that fall inside the pulse.
        double expected;
        if (Math.Abs(ratio - 0.5) < 1e-12) expected = Math.PI / 2;
        else if (ratio < 0.5) expected = (1 / ratio) * Math.Cos(Math.PI * ratio) / (Math.Pow(1 / (2 * ratio), 2) - 1);
        else
        {
            var beta = 1 / (2 * ratio);
            expected = Enumerable.Range(1, 10)
                .Where(l => 2 * Math.PI * l / (Omega * (1 + beta)) <= ratio * Period)
                .Max(l => Math.Sin(2 * Math.PI * l / (1 + 2 * ratio)) / (1 - beta));
        }
        var h = Period / 2000;
        var steps = (int)Math.Ceiling((ratio + 2) * Period / h);
        var sink = Run("exact", Sdof(M, 0, K), Force(1, 0, new HalfSinePulse(F0, ratio * Period)), [0], [0], h, steps);
        var peak = sink.Dof(0).Select(Math.Abs).Max() / Static;
        NumericAssert.Close(expected, peak, Tolerance.Rel(1e-4), $"R at t_d/T = {ratio}");
    }
}
