using System.Numerics;
using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Damped natural frequencies and damping ratios from the state-space eigenproblem.</summary>
public class ComplexModesTests
{
    [Fact]
    public void SingleMass_GivesTheDampedOscillatorRoots()
    {
        // λ = −ζω_n ± iω_n√(1−ζ²) (standard SDOF result, e.g. Rao ch. 2 [from memory]); tolerance 1e-10 rel.
        const double m = 3, k = 1200, zeta = 0.15;
        var system = HarmonicModels.System(HarmonicModels.Sdof(m, k, zeta));
        var modes = ComplexModes.Solve(system);
        var wn = Math.Sqrt(k / m);
        Assert.Single(modes);
        NumericAssert.Close(zeta, modes[0].DampingRatio, Tolerance.Rel(1e-10), "ζ");
        NumericAssert.Close(wn * Math.Sqrt(1 - zeta * zeta) / (2 * Math.PI), modes[0].DampedFrequencyHz, Tolerance.Rel(1e-10), "f_d");
        NumericAssert.Close(wn / (2 * Math.PI), modes[0].UndampedFrequencyHz, Tolerance.Rel(1e-10), "f_n");
    }

    [Fact]
    public void TwoMassWithOneDamper_MatchesHandDerivedCharacteristicPolynomial()
    {
        // ground –k– m1 –k– m2, m1 = m2 = 1, k = 1, one damper c = 0.4 from ground to m1 (non-classical). By hand,
        // det(λ²M + λC + K) = (λ² + cλ + 2)(λ² + 1) − 1 = λ⁴ + cλ³ + 3λ² + cλ + 1. Its roots, found independently by
        // Math.NET's polynomial root finder (companion matrix), must equal the state-space eigenvalues; tolerance 1e-9.
        const double c = 0.4;
        var network = new NetworkBuilder().AddMass("m1", 1).AddMass("m2", 1)
            .AddSpring("k1", Network.Ground, "m1", 1).AddSpring("k2", "m1", "m2", 1).AddDamper("c", Network.Ground, "m1", c).Build();
        var system = HarmonicModels.System(network);
        Assert.False(system.IsClassical);
        var modes = ComplexModes.Solve(system);
        var roots = FindRoots.Polynomial([1, c, 3, c, 1]).Where(r => r.Imaginary > 0).OrderBy(r => r.Magnitude).ToArray();
        Assert.Equal(2, modes.Length);
        for (var j = 0; j < 2; j++)
        {
            NumericAssert.Close(roots[j].Real, modes[j].EigenValue.Real, Tolerance.Abs(1e-9), $"Re λ{j + 1}");
            NumericAssert.Close(roots[j].Imaginary, modes[j].EigenValue.Imaginary, Tolerance.Abs(1e-9), $"Im λ{j + 1}");
        }
        // Light damping: first-order perturbation ζ_j ≈ φ_jᵀCφ_j/(2ω_j) (Rayleigh's estimate for non-classical damping) within 5 %.
        for (var j = 0; j < 2; j++)
            NumericAssert.Close(system.ModalDampingRatios[j], modes[j].DampingRatio, Tolerance.Rel(0.05), $"ζ{j + 1} vs diagonal estimate");
    }

    [Fact]
    public void EveryEigenvalue_SatisfiesTheQuadraticEigenproblem_OnRandomNetworks()
    {
        // det(λ²M + λC + K) = 0 ⇔ the smallest singular value of λ²M + λC + K vanishes (identity); tolerance 1e-8 of ‖K‖.
        for (var seed = 1; seed <= 10; seed++)
        {
            var system = HarmonicModels.System(HarmonicModels.Random(seed, 6, dampers: true));
            var p = system.Partition;
            var scale = p.StiffnessFF.L2Norm();
            foreach (var mode in ComplexModes.Solve(system))
            {
                var l = mode.EigenValue;
                var q = p.Mass.ToComplex() * (l * l) + system.Damping.FF.ToComplex() * l + p.StiffnessFF.ToComplex();
                var sigma = q.Svd(false).S.Select(s => s.Magnitude).Min();
                NumericAssert.Small(sigma, 1e-8 * scale, $"seed {seed}, mode {mode.Number}");
            }
        }
    }
}
