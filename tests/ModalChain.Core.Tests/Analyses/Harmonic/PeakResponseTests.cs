using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>The band peak search used by optimisers: it must find the highest of several nearly equal peaks.</summary>
public class PeakResponseTests
{
    // Undamped primary (m = 1 kg, k = 1 N/m, ω_p = 1 rad/s) with Den Hartog's optimum absorber at μ = 0.05:
    // f = 1/(1+μ), c_a = 2 m_a ω_p √(3μ/(8(1+μ)³)) (Den Hartog, Mechanical Vibrations, 4th ed., §3.3 [confirmed citation]).
    // Its two frequency-response peaks |X1|k/F are 6.4075 and 6.4084 (REFERENCES.md §3, values recomputed).
    private const double Mu = 0.05;

    private static Network TunedPair()
    {
        var ma = Mu;
        var wa = 1 / (1 + Mu);
        var ca = 2 * ma * Math.Sqrt(3 * Mu / (8 * Math.Pow(1 + Mu, 3)));
        return new NetworkBuilder()
            .AddMass("p", 1).AddMass("a", ma)
            .AddSpring("k", Network.Ground, "p", 1).AddSpring("ka", "p", "a", ma * wa * wa)
            .AddDamper("ca", "p", "a", ca)
            .Build();
    }

    [Theory]
    [InlineData(240)]
    [InlineData(12)]
    public void TwoNearlyEqualPeaks_TheHigherIsReturned(int points)
    {
        var system = HarmonicModels.System(TunedPair(), null, new ForceLoad("f", "p", 1, 0));
        var fp = 1 / (2 * Math.PI);
        var peak = HarmonicAnalysis.PeakResponse(system, system.Model.Loads, "p", 0.5 * fp, 1.5 * fp, points);
        NumericAssert.Close(6.4084, peak.Magnitude, Tolerance.Abs(1e-4), $"worst peak, {points} points");
        Assert.True(peak.FrequencyHz > fp, "the higher of the two peaks lies above the primary's frequency for this tuning");

        var lower = HarmonicAnalysis.PeakResponse(system, system.Model.Loads, "p", 0.5 * fp, fp, points);
        NumericAssert.Close(6.4075, lower.Magnitude, Tolerance.Abs(1e-4), $"lower peak, {points} points");
    }
}
