using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>The facade's choice of algorithm and the limit on frequency, which must work with every algorithm.</summary>
public class GeneralizedEigenLimitTests
{
    [Theory]
    [InlineData(21, 260)]
    [InlineData(22, 320)]
    public void Limit_GivesTheSameModesWithEverySolver(int seed, int size)
    {
        // Reference: every mode of the dense solver, cut at a limit half-way between the 10th and 11th eigenvalues.
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(seed), size));
        var all = GeneralizedEigen.Solve(matrices, solver: new DenseGeneralizedEigen());
        var limit = (all.EigenValues[9] + all.EigenValues[10]) / 2;
        var scale = TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass);
        IGeneralizedEigenSolver[] solvers = [new DenseGeneralizedEigen(), new SubspaceIterationEigen(), new ShiftInvertLanczos()];
        foreach (var solver in solvers)
        {
            var below = GeneralizedEigen.Solve(matrices, null, solver, SolverChoice.Auto, limit);
            NumericAssert.Close(all.EigenValues.Take(10).ToArray(), below.EigenValues, new Tolerance(1e-10 * scale, 1e-8), solver.Name);
            ShiftInvertLanczosTests.AssertMassOrthonormal(below, matrices.Mass, 1e-9);
            var lowestFour = GeneralizedEigen.Solve(matrices, 4, solver, SolverChoice.Auto, limit);
            Assert.Equal(4, lowestFour.Count);
        }
    }

    [Fact]
    public void ModalAnalysisBelowAFrequency_OnALargeGrid_UsesTheSparseSolver()
    {
        // 50 × 70 fixed-edge lattice (3,500 masses, above the size where auto turns sparse with or without a native
        // library): ω² = (4k/m)[sin²(pπ/(2(R+1))) + sin²(qπ/(2(C+1)))] (docs/methods.md, from the chain of
        // REFERENCES §2). The limit sits half-way between the 9th and 10th, which are distinct.
        const int rows = 50, columns = 70;
        const double m = 20.0, k = 4.0e6;
        var network = TestNetworks.FixedEdgeGrid(rows, columns, m, k);
        var exact = ShiftInvertLanczosTests.LatticeEigenvalues(rows, columns, m, k).Take(11).ToArray();
        Assert.True(exact[9] > exact[8] * (1 + 1e-6));
        var limitHz = Math.Sqrt((exact[8] + exact[9]) / 2) / (2 * Math.PI);
        var result = ModalAnalysis.Solve(network, new ModalOptions(BelowFrequencyHz: limitHz));
        Assert.Equal(new ShiftInvertLanczos().Name, result.Algorithm);
        NumericAssert.Close(exact.Take(9).ToArray(), [.. result.Modes.Select(mode => mode.EigenValue)], Tolerance.Rel(1e-9), "λ");
        NumericAssert.Small(result.Quality.MaxResidual, 1e-8, "largest residual");
        NumericAssert.Small(result.Quality.MaxOrthogonalityError, 1e-9, "ΦᵀMΦ − I");
    }
}
