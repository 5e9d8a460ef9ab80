using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Maxwell–Betti reciprocity of receptances on seeded random networks.</summary>
public class ReciprocityTests
{
    [Fact]
    public void Receptance_IsSymmetric_OnRandomDampedNetworks()
    {
        // H_ij(ω) = H_ji(ω) for symmetric M, K, C (Maxwell's reciprocal theorem; Rao, Mechanical Vibrations, §6.5 [from memory]).
        // Non-classical discrete dampers plus a loss factor; 20 seeded networks, 3 frequencies each; tolerance 1e-9 rel of the larger receptance.
        for (var seed = 1; seed <= 20; seed++)
        {
            var network = HarmonicModels.Random(seed, 6 + seed % 5, dampers: true);
            var random = new Random(seed);
            var i = random.Next(network.Masses.Length);
            var j = (i + 1 + random.Next(network.Masses.Length - 1)) % network.Masses.Length;
            string a = network.Masses[i].Name, b = network.Masses[j].Name;
            var system = HarmonicModels.System(network, new DampingModel([], null, 0.02),
                new ForceLoad("at-a", a, 1, 0), new ForceLoad("at-b", b, 1, 0));
            double[] f = [0.7 * system.Modes.Modes[0].NaturalFrequencyHz, system.Modes.Modes[1].NaturalFrequencyHz, 9.3];
            var fromA = HarmonicAnalysis.Sweep(system, f, [system.Model.Loads[0]], [b], HarmonicMethod.Direct).Responses[0].Displacement;
            var fromB = HarmonicAnalysis.Sweep(system, f, [system.Model.Loads[1]], [a], HarmonicMethod.Direct).Responses[0].Displacement;
            for (var k = 0; k < f.Length; k++)
            {
                var scale = Math.Max(fromA[k].Magnitude, fromB[k].Magnitude);
                NumericAssert.Small((fromA[k] - fromB[k]).Magnitude, 1e-9 * scale, $"seed {seed}: H({b},{a}) − H({a},{b}) at {f[k]:G4} Hz");
            }
        }
    }
}
