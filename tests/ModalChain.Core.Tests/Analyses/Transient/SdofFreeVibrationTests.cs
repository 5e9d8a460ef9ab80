using ModalChain.Core.Analyses.Transient;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.Analyses.Transient.TransientTestKit;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>Free vibration of one mass on a spring and damper from initial conditions, every method.</summary>
public class SdofFreeVibrationTests
{
    private const double M = 250, K = 4.0e5;
    private static readonly double Omega = Math.Sqrt(K / M);

    /// <summary>x(t) = e^(−ζωt)[x0 cos ω_d t + (v0 + ζω x0)/ω_d sin ω_d t], ω_d = ω√(1 − ζ²)
    /// (Chopra, Dynamics of Structures, Eq. 2.2.4; Rao, Mechanical Vibrations, §2.6 — from memory; closed form re-derived).</summary>
    private static double Closed(double zeta, double x0, double v0, double t)
    {
        var wd = Omega * Math.Sqrt(1 - zeta * zeta);
        return Math.Exp(-zeta * Omega * t) * (x0 * Math.Cos(wd * t) + (v0 + zeta * Omega * x0) / wd * Math.Sin(wd * t));
    }

    [Theory]
    [InlineData("exact", 0.0, 1e-10)]
    [InlineData("exact", 0.05, 1e-10)]
    [InlineData("modal", 0.0, 1e-10)]
    [InlineData("modal", 0.05, 1e-10)]
    [InlineData("newmark", 0.0, 1.2e-2)]
    [InlineData("newmark", 0.05, 1.2e-2)]
    [InlineData("hht", 0.05, 1.2e-2)]
    public void FreeVibration_MatchesClosedFormAtManyTimes(string method, double zeta, double tolerance)
    {
        // Exact and modal are exact for free vibration at any step. Newmark at 100 steps per period lengthens the period
        // by T̄/T − 1 = 3.3e-4 (REFERENCES §5), a phase lag of 2π·5·3.3e-4 = 0.010 rad after the 5 periods run, so its
        // tolerance is 1.2 % of the amplitude; HHT (α = −0.1) has a phase error of the same order.
        const double x0 = 2e-3, v0 = -0.05;
        var c = 2 * zeta * Math.Sqrt(K * M);
        var h = 2 * Math.PI / Omega / 100;
        var sink = Run(method, Sdof(M, c, K), LoadSet.None(1), [x0], [v0], h, 500);
        var amplitude = Math.Sqrt(x0 * x0 + v0 * v0 / (Omega * Omega));
        for (var s = 0; s < sink.Times.Count; s += 7)
            NumericAssert.Close(Closed(zeta, x0, v0, sink.Times[s]), sink.U[s][0], Tolerance.Abs(tolerance * amplitude), $"{method} x({sink.Times[s]:F4})");
    }

    [Theory]
    [InlineData(0.02)]
    [InlineData(0.1)]
    public void LogarithmicDecrement_RecoversTheDampingRatio(double zeta)
    {
        // δ = ln(x_i / x_(i+1)) = 2πζ/√(1 − ζ²), so ζ = δ/√(4π² + δ²) (REFERENCES §4; Rao §2.6, from memory).
        var c = 2 * zeta * Math.Sqrt(K * M);
        var period = 2 * Math.PI / (Omega * Math.Sqrt(1 - zeta * zeta));
        var h = period / 2000;
        var sink = Run("exact", Sdof(M, c, K), LoadSet.None(1), [1e-3], [0], h, 12000);
        var u = sink.Dof(0);
        var peaks = new List<double>();
        for (var s = 1; s < u.Length - 1; s++)
            if (u[s] > u[s - 1] && u[s] >= u[s + 1]) peaks.Add(u[s]);
        Assert.True(peaks.Count >= 4, $"only {peaks.Count} peaks");
        var delta = Math.Log(peaks[0] / peaks[3]) / 3;
        NumericAssert.Close(zeta, delta / Math.Sqrt(4 * Math.PI * Math.PI + delta * delta), Tolerance.Rel(1e-4), "ζ from δ");
    }
}
