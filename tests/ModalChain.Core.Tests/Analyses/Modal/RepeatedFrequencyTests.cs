using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// Symmetric structures with repeated natural frequencies: any basis of the repeated eigenspace is valid, but it must
/// be M-orthonormal and every vector in it must satisfy K φ = ω² M φ (issue 2, §6; Golub &amp; Van Loan, Matrix
/// Computations, 4th ed., §8.7, attribution from memory) [common practice].
/// </summary>
public class RepeatedFrequencyTests
{
    private static void AssertMassOrthonormalEigenpairs(ModalResult result, double tolerance)
    {
        var phi = Matrix<double>.Build.DenseOfColumnArrays(result.Modes.Select(m => m.Shape.ToArray()));
        var gram = phi.TransposeThisAndMultiply(result.Matrices.Mass * phi);
        NumericAssert.Close(Matrix<double>.Build.DenseIdentity(phi.ColumnCount), gram, Tolerance.Abs(tolerance), "ΦᵀMΦ");
        var scale = TestNetworks.StiffnessScale(result.Matrices.Stiffness, result.Matrices.Mass);
        foreach (var mode in result.Modes)
        {
            var v = Vector<double>.Build.DenseOfEnumerable(mode.Shape);
            var residual = result.Matrices.Stiffness * v - result.Matrices.Mass * v * mode.EigenValue;
            NumericAssert.Small(residual.L2Norm(), tolerance * scale, $"‖Kφ − ω²Mφ‖ of mode {mode.Number}");
        }
        NumericAssert.Small(result.Quality.MaxOrthogonalityError, tolerance, "reported orthogonality error");
    }

    [Fact]
    public void TwoIdenticalUncoupledOscillators_GiveADoubleFrequencyWithOrthonormalShapes()
    {
        // Two copies of m–k on ground: ω² = k/m twice (single-DOF oscillator, common practice). Tolerance 1e-12.
        const double m = 45, k = 3.2e5;
        var network = new NetworkBuilder()
            .AddMass("left", m).AddMass("right", m)
            .AddSpring("k-left", Network.Ground, "left", k).AddSpring("k-right", Network.Ground, "right", k)
            .Build();
        var result = ModalAnalysis.Solve(network);
        Assert.All(result.Modes, mode => NumericAssert.Close(k / m, mode.EigenValue, Tolerance.Rel(1e-12), $"ω² of mode {mode.Number}"));
        AssertMassOrthonormalEigenpairs(result, 1e-12);
        NumericAssert.Close(2 * m, result.Modes.Sum(x => x.EffectiveModalMass), Tolerance.Rel(1e-12), "Σ M*");
    }

    [Fact]
    public void TwoIdenticalUncoupledChains_GiveEachChainFrequencyTwice()
    {
        // Two identical fixed-free chains of three: each closed-form ω_j = 2√(k/m) sin((2j−1)π/14) appears twice
        // (REFERENCES.md §2, common practice). Tolerance 1e-10 relative.
        const double m = 80, k = 6.0e5;
        var b = new NetworkBuilder();
        foreach (var side in new[] { "a", "b" })
        {
            for (var i = 1; i <= 3; i++) b.AddMass($"{side}{i}", m);
            b.AddSpring($"{side}-k0", Network.Ground, $"{side}1", k);
            b.AddSpring($"{side}-k1", $"{side}1", $"{side}2", k);
            b.AddSpring($"{side}-k2", $"{side}2", $"{side}3", k);
        }
        var result = ModalAnalysis.Solve(b.Build());
        for (var j = 1; j <= 3; j++)
        {
            var expected = 2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / 14);
            NumericAssert.Close(expected, result.Modes[2 * j - 2].AngularFrequency, Tolerance.Rel(1e-10), $"ω{j}, first copy");
            NumericAssert.Close(expected, result.Modes[2 * j - 1].AngularFrequency, Tolerance.Rel(1e-10), $"ω{j}, second copy");
        }
        AssertMassOrthonormalEigenpairs(result, 1e-11);
    }

    [Fact]
    public void StarOfIdenticalMasses_GivesRepeatedLeafFrequencyAndTheCollectiveTwoMassModes()
    {
        // A hub M0 on K0 to ground carries p identical leaves m, each on its own spring k. Symmetry gives p − 1 modes at
        // ω² = k/m with the hub still and the leaves summing to zero; the in-phase motion is the two-mass system
        // m1 = M0, m2 = p·m, k1 = K0, k2 = p·k, k3 = 0 (REFERENCES.md §1 frequency equation; values recomputed;
        // attribution from memory). Tolerances 1e-10 relative on ω², 1e-11 on orthonormality.
        const int p = 6;
        const double hub = 500, k0 = 2.0e6, leaf = 20, k = 1.0e5;
        var b = new NetworkBuilder().AddMass("hub", hub).AddSpring("base", Network.Ground, "hub", k0);
        for (var i = 0; i < p; i++) b.AddMass($"leaf{i}", leaf).AddSpring($"arm{i}", "hub", $"leaf{i}", k);
        var result = ModalAnalysis.Solve(b.Build());

        var (m1, m2, k1, k2) = (hub, p * leaf, k0, p * k);
        var bq = m1 * k2 + m2 * (k1 + k2);
        var disc = Math.Sqrt(bq * bq - 4 * m1 * m2 * k1 * k2);
        double[] expected = [.. new[] { (bq - disc) / (2 * m1 * m2), (bq + disc) / (2 * m1 * m2) }
            .Concat(Enumerable.Repeat(k / leaf, p - 1)).Order()];
        NumericAssert.Close(expected, result.Modes.Select(x => x.EigenValue).ToArray(), Tolerance.Rel(1e-10), "ω² of the star");

        AssertMassOrthonormalEigenpairs(result, 1e-11);
        var repeated = result.Modes.Where(x => Math.Abs(x.EigenValue - k / leaf) < 1e-8 * k / leaf).ToArray();
        Assert.Equal(p - 1, repeated.Length);
        foreach (var mode in repeated)
        {
            NumericAssert.Small(mode.Shape[0], 1e-10 * mode.Shape.Max(Math.Abs), $"hub entry of mode {mode.Number}");
            NumericAssert.Small(mode.EffectiveModalMass, 1e-10 * result.TotalMass, $"M* of mode {mode.Number}");
        }
        NumericAssert.Close(result.TotalMass, result.Modes.Sum(x => x.EffectiveModalMass), Tolerance.Rel(1e-12), "Σ M*");
    }

    [Fact]
    public void SymmetricBranchesOnACommonMass_GiveOrthonormalShapesForTheirRepeatedFrequencies()
    {
        // A grounded hub with three identical two-mass branches (a three-fold symmetric structure): each antisymmetric
        // pattern leaves the hub still, so the branch modes with the hub held, a fixed-free chain of two with
        // ω_j = 2√(k/m) sin((2j−1)π/10) (REFERENCES.md §2, common practice), each appear twice. Tolerance 1e-10.
        const double hub = 300, kHub = 4.0e6, m = 25, k = 2.5e5;
        var b = new NetworkBuilder().AddMass("hub", hub).AddSpring("base", Network.Ground, "hub", kHub);
        foreach (var side in new[] { "a", "b", "c" })
            b.AddMass($"{side}1", m).AddMass($"{side}2", m)
                .AddSpring($"{side}-root", "hub", $"{side}1", k).AddSpring($"{side}-tip", $"{side}1", $"{side}2", k);
        var result = ModalAnalysis.Solve(b.Build());
        AssertMassOrthonormalEigenpairs(result, 1e-11);
        for (var j = 1; j <= 2; j++)
        {
            var w2 = Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / 10), 2);
            var matches = result.Modes.Count(x => Math.Abs(x.EigenValue - w2) <= 1e-10 * w2);
            Assert.True(matches == 2, $"ω²{j} = {w2} found {matches} times, expected 2");
        }
    }
}
