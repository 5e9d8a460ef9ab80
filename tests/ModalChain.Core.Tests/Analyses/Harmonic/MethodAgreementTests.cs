using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>The direct and modal methods against each other (an identity: both solve the same equations).</summary>
public class MethodAgreementTests
{
    private static void AssertAgree(HarmonicResult direct, HarmonicResult modal, double relative, string what)
    {
        for (var o = 0; o < direct.Responses.Length; o++)
        {
            var scale = direct.Responses[o].Displacement.Max(z => z.Magnitude);
            for (var k = 0; k < direct.FrequenciesHz.Length; k++)
                NumericAssert.Small((direct.Responses[o].Displacement[k] - modal.Responses[o].Displacement[k]).Magnitude,
                    relative * scale, $"{what}: {direct.Responses[o].Dof} at {direct.FrequenciesHz[k]:G5} Hz");
        }
        for (var s = 0; s < direct.Reactions.Length; s++)
        {
            var scale = direct.Reactions[s].Force.Max(z => z.Magnitude) + 1e-300;
            for (var k = 0; k < direct.FrequenciesHz.Length; k++)
                NumericAssert.Small((direct.Reactions[s].Force[k] - modal.Reactions[s].Force[k]).Magnitude, relative * scale,
                    $"{what}: reaction {direct.Reactions[s].Support} at {direct.FrequenciesHz[k]:G5} Hz");
        }
    }

    [Fact]
    public void DirectAndModal_Agree_OnRandomClassicallyDampedNetworks()
    {
        // Agreement with every mode kept on classically damped models (identity of the two formulations): 1e-10 relative;
        // these networks pass at 1e-11 and fail at 1e-13 (round-off), so 1e-10 leaves a tenfold margin. Modal, Rayleigh and loss-factor damping, force and unbalance loads, 30 seeded networks.
        for (var seed = 1; seed <= 30; seed++)
        {
            var network = HarmonicModels.Random(100 + seed, 4 + seed % 9, dampers: false);
            DampingModel damping = (seed % 3) switch
            {
                0 => DampingModel.Modal(0.01 + 0.002 * seed),
                1 => new DampingModel([], RayleighDamping.FromTargets(0.03, 10, 200), 0),
                _ => new DampingModel([0.02, 0.04], null, 0.01),
            };
            var system = HarmonicModels.System(network, damping,
                new ForceLoad("f", network.Masses[0].Name, 1000, 0.4), new UnbalanceLoad("u", network.Masses[^1].Name, 0.01, null, 1.1));
            Assert.True(system.IsClassical);
            var f = Enumerable.Range(0, 60).Select(i => 0.2 + i * 0.8).ToArray();
            var names = HarmonicModels.Names(network);
            var direct = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Direct);
            var modal = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Modal, modeCount: network.Masses.Length);
            AssertAgree(direct, modal, 1e-10, $"seed {seed}");
        }
    }

    [Fact]
    public void DirectAndModal_Agree_ForNonClassicalDampingWithEveryMode()
    {
        // With every mode kept, the coupled modal equations are an exact change of basis (identity); tolerance 1e-8 relative.
        for (var seed = 1; seed <= 10; seed++)
        {
            var network = HarmonicModels.Random(200 + seed, 5 + seed % 4, dampers: true);
            var system = HarmonicModels.System(network, null, new ForceLoad("f", network.Masses[1].Name, 1, 0));
            Assert.False(system.IsClassical);
            var f = Enumerable.Range(0, 40).Select(i => 0.5 + i).ToArray();
            var names = HarmonicModels.Names(network);
            AssertAgree(HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Direct),
                HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Modal, network.Masses.Length), 1e-8, $"seed {seed}");
        }
    }

    [Fact]
    public void ResidualFlexibility_MakesTruncatedModalSumExactAtLowFrequency()
    {
        // Residual flexibility restores the static part of the truncated modes (Craig & Kurdila, Fundamentals of Structural Dynamics,
        // 2nd ed., §14.3 [from memory]): with 2 of 12 modes, the response well below the 3rd mode agrees with the direct solve to 1 %,
        // and at 1e-3 of the first natural frequency to 1e-4 (what is left is the truncated modes' damping and inertia, O(2ζω/ω3)).
        var network = HarmonicModels.Random(7, 12, dampers: false);
        var system = HarmonicModels.System(network, DampingModel.Modal(0.02), new ForceLoad("f", network.Masses[5].Name, 1, 0));
        var f1 = system.Modes.Modes[0].NaturalFrequencyHz;
        var f3 = system.Modes.Modes[2].NaturalFrequencyHz;
        var names = HarmonicModels.Names(network);
        double[] f = [1e-3 * f1, 0.3 * f3];
        var direct = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Direct);
        var modal = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Modal, modeCount: 2);
        for (var o = 0; o < names.Length; o++)
        {
            Complex d0 = direct.Responses[o].Displacement[0], m0 = modal.Responses[o].Displacement[0];
            NumericAssert.Small((d0 - m0).Magnitude, 1e-4 * d0.Magnitude, $"{names[o]} near static");
            Complex d1 = direct.Responses[o].Displacement[1], m1 = modal.Responses[o].Displacement[1];
            NumericAssert.Small((d1 - m1).Magnitude, 1e-2 * direct.Responses.Max(r => r.Displacement[1].Magnitude), $"{names[o]} at 0.3 f3");
        }
    }

    [Fact]
    public void SeveralLoads_Superpose()
    {
        // Linearity: the response to two loads together is the sum of the responses to each (common practice); tolerance 1e-12 rel.
        var network = HarmonicModels.Random(3, 6, dampers: true);
        var a = new ForceLoad("a", "m1", 500, 0.3);
        var b = new UnbalanceLoad("b", "m4", 0.02, null, -0.7);
        var system = HarmonicModels.System(network, DampingModel.Modal(0.03), a, b);
        double[] f = [1, 3, 7];
        var both = HarmonicAnalysis.Sweep(system, f, [a, b], ["m2"], HarmonicMethod.Direct).Responses[0].Displacement;
        var onlyA = HarmonicAnalysis.Sweep(system, f, [a], ["m2"], HarmonicMethod.Direct).Responses[0].Displacement;
        var onlyB = HarmonicAnalysis.Sweep(system, f, [b], ["m2"], HarmonicMethod.Direct).Responses[0].Displacement;
        for (var k = 0; k < f.Length; k++)
            NumericAssert.Small((both[k] - onlyA[k] - onlyB[k]).Magnitude, 1e-12 * both[k].Magnitude, $"at {f[k]} Hz");
    }
}
