using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Rayleigh coefficients from two target ratios and the damping they give each mode.</summary>
public class RayleighDampingTests
{
    [Fact]
    public void FromTargets_MatchesPrintedExample()
    {
        // 5 % at 10 and 30 rad/s: a0 = 0.75 1/s, a1 = 0.0025 s, ζ(17.32) = 0.04330, ζ(60) = 0.08125
        // (Chopra, Dynamics of Structures, §11.4 [from memory]; REFERENCES.md §6, values recomputed). Tolerance 1e-12 / 5e-6.
        var r = RayleighDamping.FromTargets(0.05, 10, 30);
        NumericAssert.Close(0.75, r.MassCoefficient, Tolerance.Rel(1e-12), "a0");
        NumericAssert.Close(0.0025, r.StiffnessCoefficient, Tolerance.Rel(1e-12), "a1");
        NumericAssert.Close(0.05, r.RatioAt(10), Tolerance.Rel(1e-12), "ζ(ω1)");
        NumericAssert.Close(0.05, r.RatioAt(30), Tolerance.Rel(1e-12), "ζ(ω2)");
        NumericAssert.Close(0.04330, r.RatioAt(17.32), Tolerance.Abs(5e-6), "ζ(17.32)");
        NumericAssert.Close(0.08125, r.RatioAt(60), Tolerance.Abs(5e-6), "ζ(60)");
    }

    [Fact]
    public void FromTargets_MatchesClosedFormOverManyPairs()
    {
        // a0 = 2ζω1ω2/(ω1+ω2), a1 = 2ζ/(ω1+ω2) (Chopra §11.4 [from memory]); tolerance 1e-12 rel.
        var random = new Random(11);
        for (var i = 0; i < 50; i++)
        {
            double z = 0.005 + 0.1 * random.NextDouble(), w1 = 1 + 50 * random.NextDouble(), w2 = w1 * (1.1 + 5 * random.NextDouble());
            var r = RayleighDamping.FromTargets(z, w1, w2);
            NumericAssert.Close(2 * z * w1 * w2 / (w1 + w2), r.MassCoefficient, Tolerance.Rel(1e-12), "a0");
            NumericAssert.Close(2 * z / (w1 + w2), r.StiffnessCoefficient, Tolerance.Rel(1e-12), "a1");
        }
    }

    [Fact]
    public void ModalRatiosOfRayleighModel_FollowTheZetaCurve()
    {
        // Rayleigh damping is classical; each mode's ratio is ζ(ω_j) = a0/(2ω_j) + a1ω_j/2 (Chopra §11.4 [from memory]); tolerance 1e-9 rel.
        var network = HarmonicModels.Random(5, 8, dampers: false);
        var rayleigh = RayleighDamping.FromTargets(0.02, 2 * Math.PI * 4, 2 * Math.PI * 30);
        var system = HarmonicModels.System(network, new DampingModel([], rayleigh, 0));
        Assert.True(system.IsClassical, $"coupling index {system.NonClassicalIndex}");
        for (var j = 0; j < system.Modes.Modes.Length; j++)
            NumericAssert.Close(rayleigh.RatioAt(system.Modes.Modes[j].AngularFrequency), system.ModalDampingRatios[j], Tolerance.Rel(1e-9), $"ζ of mode {j + 1}");
    }

    [Fact]
    public void ModalRatios_AreTheGivenOnesWithTheLastRepeating()
    {
        // Φᵀ(MΦ diag(2ζω) ΦᵀM)Φ = diag(2ζω) for mass-normalised Φ (Chopra §11.4.2 [from memory]); tolerance 1e-9 abs.
        var network = HarmonicModels.Random(6, 5, dampers: false);
        var system = HarmonicModels.System(network, new DampingModel([0.02, 0.03, 0.05], null, 0.01));
        var expected = new[] { 0.02, 0.03, 0.05, 0.05, 0.05 };
        for (var j = 0; j < 5; j++)
            NumericAssert.Close(expected[j] + 0.005, system.ModalDampingRatios[j], Tolerance.Abs(1e-9), $"ζ of mode {j + 1} (with η/2 = 0.005)");
        Assert.True(system.IsClassical);
    }
}
