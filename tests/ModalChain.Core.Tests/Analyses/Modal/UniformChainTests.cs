using ModalChain.Core.Analyses.Modal;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// Uniform chains of n equal masses m and springs k against the closed-form spectra of REFERENCES.md §2 (the classical
/// result for N masses on a spring chain, derived in texts on waves and vibration) [common practice; values recomputed].
/// </summary>
public class UniformChainTests
{
    private const double MassKg = 3.7;
    private const double StiffnessNPerM = 2.9e5;
    private static readonly double Unit = Math.Sqrt(StiffnessNPerM / MassKg);

    public static TheoryData<int> Sizes => [1, 2, 3, 10, 50, 200];

    [Theory]
    [MemberData(nameof(Sizes))]
    public void FixedFreeChain_MatchesClosedFormFrequencies(int n)
    {
        // ω_j = 2√(k/m)·sin((2j−1)π/(2(2n+1))), j = 1..n. Tolerance 1e-9 relative.
        var result = ModalAnalysis.Solve(TestNetworks.UniformChain(n, MassKg, StiffnessNPerM, ChainEnds.FixedFree));
        Assert.Equal(n, result.Modes.Length);
        for (var j = 1; j <= n; j++)
        {
            var expected = 2 * Unit * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1)));
            NumericAssert.Close(expected, result.Modes[j - 1].AngularFrequency, Tolerance.Rel(1e-9), $"n = {n}, ω{j}");
            Assert.False(result.Modes[j - 1].IsRigidBody);
        }
    }

    [Theory]
    [MemberData(nameof(Sizes))]
    public void FixedFixedChain_MatchesClosedFormFrequencies(int n)
    {
        // ω_j = 2√(k/m)·sin(jπ/(2(n+1))), j = 1..n (n + 1 springs). Tolerance 1e-9 relative.
        var result = ModalAnalysis.Solve(TestNetworks.UniformChain(n, MassKg, StiffnessNPerM, ChainEnds.FixedFixed));
        Assert.Equal(n, result.Modes.Length);
        for (var j = 1; j <= n; j++)
        {
            var expected = 2 * Unit * Math.Sin(j * Math.PI / (2 * (n + 1)));
            NumericAssert.Close(expected, result.Modes[j - 1].AngularFrequency, Tolerance.Rel(1e-9), $"n = {n}, ω{j}");
        }
    }

    [Theory]
    [MemberData(nameof(Sizes))]
    public void FixedFixedChain_ModeShapesAreSines(int n)
    {
        // φ_j(i) ∝ sin(ijπ/(n+1)). Both shapes are scaled to unit length and signed alike before comparing, since a
        // shape is defined up to scale. Tolerance 1e-9 absolute on the unit-length entries.
        var result = ModalAnalysis.Solve(TestNetworks.UniformChain(n, MassKg, StiffnessNPerM, ChainEnds.FixedFixed));
        for (var j = 1; j <= n; j++)
        {
            var sine = Enumerable.Range(1, n).Select(i => Math.Sin(i * j * Math.PI / (n + 1))).ToArray();
            var expected = TestNetworks.Normalised(sine);
            var actual = TestNetworks.NormalisedLike(result.Modes[j - 1].Shape, expected);
            NumericAssert.Close(expected, actual, Tolerance.Abs(1e-9), $"n = {n}, shape {j}");
        }
    }

    [Theory]
    [MemberData(nameof(Sizes))]
    public void FreeFreeChain_MatchesClosedFormFrequenciesWithOneRigidBodyMode(int n)
    {
        // ω_j = 2√(k/m)·sin((j−1)π/(2n)), j = 1..n: ω1 = 0 is the rigid-body mode. Tolerance 1e-9 relative
        // (ω1 exactly 0, flagged rigid).
        var result = ModalAnalysis.Solve(TestNetworks.UniformChain(n, MassKg, StiffnessNPerM, ChainEnds.FreeFree));
        Assert.Equal(n, result.Modes.Length);
        Assert.True(result.Modes[0].IsRigidBody);
        Assert.Equal(0.0, result.Modes[0].AngularFrequency);
        Assert.Equal(1, result.RigidBodyModeCount);
        for (var j = 2; j <= n; j++)
        {
            var expected = 2 * Unit * Math.Sin((j - 1) * Math.PI / (2 * n));
            NumericAssert.Close(expected, result.Modes[j - 1].AngularFrequency, Tolerance.Rel(1e-9), $"n = {n}, ω{j}");
        }
    }

    [Fact]
    public void FixedFreeChainOfThree_MatchesListedFrequenciesAndShapes()
    {
        // ω = 0.445042, 1.246980, 1.801938 × √(k/m); shapes {1, 1.8019, 2.2470}, {1, 0.4450, −0.8019},
        // {1, −1.2470, 0.5550} scaled to a first entry of 1. Source: REFERENCES.md §2 (common practice; values
        // recomputed). Printed to 6 decimals (frequencies, tolerance 1e-6) and 4 decimals (shapes, tolerance 1e-4).
        var result = ModalAnalysis.Solve(TestNetworks.UniformChain(3, MassKg, StiffnessNPerM, ChainEnds.FixedFree));
        double[] frequencies = [0.445042, 1.246980, 1.801938];
        double[][] shapes = [[1, 1.8019, 2.2470], [1, 0.4450, -0.8019], [1, -1.2470, 0.5550]];
        for (var j = 0; j < 3; j++)
        {
            var mode = result.Modes[j];
            NumericAssert.Close(frequencies[j], mode.AngularFrequency / Unit, Tolerance.Abs(1e-6), $"ω{j + 1}/√(k/m)");
            var scaled = mode.Shape.Select(x => x / mode.Shape[0]).ToArray();
            NumericAssert.Close(shapes[j], scaled, Tolerance.Abs(1e-4), $"shape {j + 1}");
        }
    }
}
