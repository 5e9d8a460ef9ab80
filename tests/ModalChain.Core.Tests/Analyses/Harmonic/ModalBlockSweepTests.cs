using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>The modal sweep solves frequencies in blocks; its results must not depend on how the frequencies are grouped.</summary>
public class ModalBlockSweepTests
{
    /// <summary>An independent reference: the dense complex solve of (K(1+iη) − ω²M + iωC) x = b with Math.NET's LU, at one frequency.</summary>
    private static Complex[] DenseComplexSolve(DampedSystem system, double frequencyHz, int loadedDof, double amplitude)
    {
        var p = system.Partition;
        var n = p.FreeCount;
        var omega = 2 * Math.PI * frequencyHz;
        var z = Matrix<Complex>.Build.Dense(n, n, (i, j) =>
            new Complex(p.StiffnessFF[i, j], system.LossFactor * p.StiffnessFF[i, j])
            - omega * omega * p.Mass[i, j] + new Complex(0, omega * system.Damping.FF[i, j]));
        var b = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.Dense(n);
        b[loadedDof] = amplitude;
        return [.. z.Solve(b)];
    }

    [Theory]
    [InlineData(1)]
    [InlineData(31)]
    [InlineData(32)]
    [InlineData(33)]
    [InlineData(97)]
    public void ModalSweepWithEveryMode_MatchesDenseComplexSolve_AtEveryBlockBoundary(int points)
    {
        // Reference: a dense complex LU of the dynamic stiffness at each frequency (independent of the modes). With every mode
        // kept the modal sum is exact for classical damping (identity; MethodAgreementTests holds 1e-10 relative on such networks).
        // Counts around the 32-frequency block exercise partial and whole blocks.
        var network = HarmonicModels.Random(31, 14, dampers: false);
        var system = HarmonicModels.System(network, new DampingModel([0.02, 0.03], null, 0.01), new ForceLoad("f", "m3", 250, 0));
        Assert.True(system.IsClassical);
        var f = Enumerable.Range(0, points).Select(i => 0.7 + i * 53.0 / points).ToArray();
        var names = HarmonicModels.Names(network);
        var modal = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Modal, modeCount: network.Masses.Length);
        Assert.Equal(network.Masses.Length, modal.ModesUsed);
        var loaded = system.Partition.Free.IndexOf("m3");
        for (var k = 0; k < points; k++)
        {
            var reference = DenseComplexSolve(system, f[k], loaded, 250);
            var scale = reference.Max(v => v.Magnitude);
            for (var o = 0; o < names.Length; o++)
            {
                var i = system.Partition.Free.IndexOf(names[o]);
                NumericAssert.Small((modal.Responses[o].Displacement[k] - reference[i]).Magnitude, 1e-10 * scale,
                    $"{names[o]} at {f[k]:G5} Hz of {points}");
            }
        }
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void ModalSweep_IsBitIdentical_WhetherFrequenciesAreSweptTogetherOrOneByOne(bool dampers)
    {
        // The block layout changes only where the modal amplitudes are stored, not the operations or their order, so the
        // result of a frequency is the same bit for bit alone or among others (an identity of the implementation). With
        // dampers the damping is not classical and the coupled modal equations are solved; with 6 of 20 modes the
        // residual flexibility is added too.
        var network = HarmonicModels.Random(57, 20, dampers);
        var system = HarmonicModels.System(network, dampers ? null : DampingModel.Modal(0.02),
            new ForceLoad("f", "m2", 100, 0.3), new UnbalanceLoad("u", "m11", 0.02, null, 3.5));
        Assert.Equal(!dampers, system.IsClassical);
        var f = Enumerable.Range(0, 75).Select(i => 0.5 + i * 0.9).ToArray();
        var names = HarmonicModels.Names(network);
        foreach (var modes in new[] { 6, 20 })
        {
            var together = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Modal, modes);
            for (var k = 0; k < f.Length; k += 7)
            {
                var alone = HarmonicAnalysis.Sweep(system, [f[k]], system.Model.Loads, names, HarmonicMethod.Modal, modes);
                for (var o = 0; o < names.Length; o++)
                    Assert.True(together.Responses[o].Displacement[k] == alone.Responses[o].Displacement[0],
                        $"{names[o]} at {f[k]} Hz, {modes} modes: {together.Responses[o].Displacement[k]} swept together, {alone.Responses[o].Displacement[0]} alone");
            }
        }
    }
}
