using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>The undamped two-mass system as a vibration absorber.</summary>
public class AbsorberTests
{
    // Case A of REFERENCES.md §1: m1 = 10, m2 = 1, k1 = 30, k2 = 5 (Rao, Mechanical Vibrations, 5th ed., Ex. 5.3 [from memory]).
    private static Network CaseA() => new NetworkBuilder().AddMass("m1", 10).AddMass("m2", 1)
        .AddSpring("k1", Network.Ground, "m1", 30).AddSpring("k2", "m1", "m2", 5).Build();

    [Fact]
    public void CaseA_ForcedResponseAtTwoRadPerSecond_MatchesClosedForm()
    {
        // X1 = (k2 − m2ω²)F1/Δ = −0.033333 m, X2 = k2F1/Δ = −0.166667 m at ω = 2 rad/s, F1 = 1 N (REFERENCES.md §1, values recomputed); tolerance 1e-6.
        var system = HarmonicModels.System(CaseA(), null, new ForceLoad("f", "m1", 1, 0));
        foreach (var method in new[] { HarmonicMethod.Direct, HarmonicMethod.Modal })
        {
            var r = HarmonicAnalysis.Sweep(system, [2 / (2 * Math.PI)], system.Model.Loads, ["m1", "m2"], method);
            NumericAssert.Close(-0.033333, r.Responses[0].Displacement[0].Real, Tolerance.Abs(1e-6), $"X1 {method}");
            NumericAssert.Close(-0.166667, r.Responses[1].Displacement[0].Real, Tolerance.Abs(1e-6), $"X2 {method}");
            NumericAssert.Small(r.Responses[0].Displacement[0].Imaginary, 1e-12, "undamped response is real");
        }
    }

    [Fact]
    public void UndampedAbsorber_HoldsPrimaryStillAtItsOwnFrequency()
    {
        // X1 = 0 at ω = √(k2/m2): the classical undamped vibration absorber (Den Hartog, Mechanical Vibrations, 4th ed., §3.2–3.3);
        // the absorber then carries the force: k2 X2 = −F1. Tolerance 1e-12 m on X1 for F1 = 1 N, 1e-9 rel on k2X2.
        var system = HarmonicModels.System(CaseA(), null, new ForceLoad("f", "m1", 1, 0));
        var r = HarmonicAnalysis.Sweep(system, [Math.Sqrt(5.0 / 1) / (2 * Math.PI)], system.Model.Loads, ["m1", "m2"], HarmonicMethod.Direct);
        NumericAssert.Small(r.Responses[0].Displacement[0].Magnitude, 1e-12, "|X1|");
        NumericAssert.Close(-1, 5 * r.Responses[1].Displacement[0].Real, Tolerance.Rel(1e-9), "k2 X2");
    }
}
