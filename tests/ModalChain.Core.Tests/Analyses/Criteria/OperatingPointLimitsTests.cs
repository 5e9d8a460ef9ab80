using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Criteria;

// Single degree of freedom under a harmonic force: |X| = (F/k)·D, D = [(1−r²)² + (2ζr)²]^(−½)
// (REFERENCES §4: Rao ch. 3, Thomson ch. 3, Chopra ch. 3 [from memory]; ζ = 0.05, r = 0.5 gives D = 1.330380).
public class OperatingPointLimitsTests
{
    private const double M = 1000, K = 4.0e6; // f_n = √(k/m)/2π = 10.066 Hz

    private static DampedSystem Sdof(double zeta, params Load[] loads)
    {
        var net = new NetworkBuilder().AddMass("deck", M).AddSpring("legs", Network.Ground, "deck", K).Build();
        return DampedSystem.Build(new StructuralModel(net, DampingModel.Modal(zeta), [.. loads]));
    }

    private static double NaturalHz => Math.Sqrt(K / M) / (2 * Math.PI);

    [Fact]
    public void ForceAtHalfTheNaturalFrequency_MatchesTheAmplificationFactor()
    {
        const double f = 2000;
        var speed = 0.5 * NaturalHz;
        var system = Sdof(0.05, new ForceLoad("pump", "deck", f, 0, speed));
        var limits = new[]
        {
            new VibrationLimit("deck", ResponseQuantity.Displacement, AmplitudeMeasure.Peak, 1e-3),
            new VibrationLimit("deck", ResponseQuantity.Velocity, AmplitudeMeasure.Rms, 1e-3),
        };
        var outcome = OperatingPointLimits.Evaluate(system, system.Model.Loads, limits);
        Assert.Empty(outcome.NotEvaluated);
        var x = f / K * 1.330380;
        NumericAssert.Close(x, outcome.Evaluated[0].Value, Tolerance.Rel(1e-6), "peak displacement (D printed to 6 digits)");
        NumericAssert.Close(x * 2 * Math.PI * speed / Math.Sqrt(2), outcome.Evaluated[1].Value, Tolerance.Rel(1e-6), "r.m.s. velocity");
        NumericAssert.Close((1e-3 - x) / 1e-3, outcome.Evaluated[0].Reserve, Tolerance.Rel(1e-5), "reserve");
    }

    [Fact]
    public void TwoSpeeds_CombineAsHarmonicsAtDistinctFrequencies()
    {
        // Loads at r = 0.5 and r = 2 (D = 1.330380 and 0.332595 at ζ = 0.05, REFERENCES §4).
        var s1 = 0.5 * NaturalHz;
        var s2 = 2 * NaturalHz;
        var system = Sdof(0.05, new ForceLoad("a", "deck", 1000, 0, s1), new ForceLoad("b", "deck", 3000, 0.4, s2));
        var x1 = 1000 / K * 1.330380;
        var x2 = 3000 / K * 0.332595;
        var a1 = x1 * Math.Pow(2 * Math.PI * s1, 2);
        var a2 = x2 * Math.Pow(2 * Math.PI * s2, 2);
        var outcome = OperatingPointLimits.Evaluate(system, system.Model.Loads,
        [
            new VibrationLimit("deck", ResponseQuantity.Acceleration, AmplitudeMeasure.Rms, 1),
            new VibrationLimit("deck", ResponseQuantity.Acceleration, AmplitudeMeasure.Peak, 1),
        ]);
        NumericAssert.Close(Math.Sqrt((a1 * a1 + a2 * a2) / 2), outcome.Evaluated[0].Value, Tolerance.Rel(1e-5), "r.m.s. of two harmonics");
        NumericAssert.Close(a1 + a2, outcome.Evaluated[1].Value, Tolerance.Rel(1e-5), "peak bound Σ|A|");
    }

    [Fact]
    public void UnbalanceForce_GrowsWithTheSquareOfSpeed()
    {
        // Rotating unbalance: |X| = m e ω²/k · D (REFERENCES §4); at r = 2, ζ = 0.05: D = 0.332595.
        const double me = 0.012;
        var speed = 2 * NaturalHz;
        var system = Sdof(0.05, new UnbalanceLoad("fan", "deck", me, speed));
        var outcome = OperatingPointLimits.Evaluate(system, system.Model.Loads, [new VibrationLimit("deck", ResponseQuantity.Displacement, AmplitudeMeasure.Peak, 1)]);
        var w = 2 * Math.PI * speed;
        NumericAssert.Close(me * w * w / K * 0.332595, outcome.Evaluated[0].Value, Tolerance.Rel(2e-6), "unbalance response");
    }

    [Fact]
    public void NoLoadWithASpeed_IsNotEvaluated()
    {
        var system = Sdof(0.05, new ForceLoad("shaker", "deck", 100, 0));
        var outcome = OperatingPointLimits.Evaluate(system, system.Model.Loads, [new VibrationLimit("deck", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 1e-3)]);
        Assert.Empty(outcome.Evaluated);
        Assert.Contains("no load with a running speed", Assert.Single(outcome.NotEvaluated).Reason);
        Assert.Equal(double.NegativeInfinity, OperatingPointLimits.WorstReserve(system, system.Model.Loads, [new VibrationLimit("deck", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 1e-3)]));
    }
}
