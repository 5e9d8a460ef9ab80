using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>A modal sweep of a model above 300 DOFs solves only the modes it superposes and gives the all-mode result.</summary>
public class LowestModesSweepTests
{
    private static StructuralModel Model(int seed, int size) =>
        new(HarmonicModels.Random(seed, size, dampers: false), new DampingModel([], RayleighDamping.FromTargets(0.02, 0.1, 1), 0),
            [new ForceLoad("f", "m3", 800, 0.3), new UnbalanceLoad("u", $"m{size - 2}", 0.05, 0.4, 0.2)]);

    [Theory]
    [InlineData(3, null)]
    [InlineData(7, 12)]
    public void LowestModesOnly_GiveTheSameSweepAsEveryMode(int seed, int? modeCount)
    {
        // Identity: the superposition uses the kept modes and K⁻¹ only (Craig & Kurdila §14.3 [from memory]), so solving
        // the modes above those kept changes nothing. 1e-8 relative to each output's largest amplitude (two eigen solvers).
        const int size = 340;
        var model = Model(seed, size);
        var spec = new HarmonicSpec([], new FrequencyRange(0.05, 0.5, 40, FrequencySpacing.Linear), false,
            ["m3", "m100", $"m{size - 2}"], HarmonicMethod.Modal, modeCount);
        var few = HarmonicAnalysis.Assemble(model, spec);
        var all = DampedSystem.Build(model);
        var expectedModes = modeCount ?? all.Modes.Modes.Count(m => m.NaturalFrequencyHz < 2 * 0.5);
        Assert.Equal(expectedModes, few.Modes.Modes.Length);
        Assert.True(few.Modes.Modes.Length < size / 4, "only the lowest modes are solved");

        var low = HarmonicAnalysis.Solve(few, spec);
        var reference = HarmonicAnalysis.Solve(all, spec);
        Assert.Equal(reference.ModesUsed, low.ModesUsed);
        Assert.Contains(low.Notes, n => n.Contains($"only the lowest {expectedModes} of {size} modes were solved", StringComparison.Ordinal));
        for (var o = 0; o < reference.Responses.Length; o++)
        {
            var scale = reference.Responses[o].Displacement.Max(z => z.Magnitude);
            for (var k = 0; k < reference.FrequenciesHz.Length; k++)
                NumericAssert.Small((reference.Responses[o].Displacement[k] - low.Responses[o].Displacement[k]).Magnitude, 1e-8 * scale,
                    $"{reference.Responses[o].Dof} at {reference.FrequenciesHz[k]:G4} Hz");
        }
        NumericAssert.Close(reference.OperatingPoints[0].Response.Responses[0].Displacement[0].Magnitude,
            low.OperatingPoints[0].Response.Responses[0].Displacement[0].Magnitude, Tolerance.Rel(1e-8), "operating point");
    }

    [Fact]
    public void SmallModels_StillSolveEveryMode_AndLargeDirectSweeps_TheModesBelowTwiceTheTop()
    {
        // Results of models up to 300 DOFs do not depend on the choice (structural check).
        var small = Model(4, 60);
        var spec = new HarmonicSpec([], new FrequencyRange(0.05, 0.5, 10, FrequencySpacing.Linear), false, ["m3"], HarmonicMethod.Modal);
        Assert.Equal(60, HarmonicAnalysis.Assemble(small, spec).Modes.Modes.Length);
        // A direct sweep of a larger model needs the modes only to refine the grid: those below twice the highest frequency.
        var large = Model(4, 320);
        var all = DampedSystem.Build(large);
        Assert.Equal(all.Modes.Modes.Count(m => m.NaturalFrequencyHz < 1.0),
            HarmonicAnalysis.Assemble(large, spec with { Method = HarmonicMethod.Direct }).Modes.Modes.Length);
    }
}
