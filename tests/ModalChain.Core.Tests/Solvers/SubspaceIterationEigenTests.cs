using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

public class SubspaceIterationEigenTests
{
    [Theory]
    [InlineData(60, 30, 1, 5)]
    [InlineData(200, 80, 2, 20)]
    public void LowestModes_MatchTheDenseSolver(int n, int extra, int seed, int count)
    {
        // Reference: the dense symmetric reduction (an independent algorithm) on the same seeded sparse problem.
        var k = SparseCholeskyTests.RandomSpd(n, extra, seed);
        var random = new Random(seed);
        var m = Matrix<double>.Build.DenseOfDiagonalArray([.. Enumerable.Range(0, n).Select(_ => 0.5 + random.NextDouble())]);
        var expected = new DenseGeneralizedEigen().Solve(k, m, count, massIsDiagonal: true);
        var actual = new SubspaceIterationEigen().Solve(Matrix<double>.Build.SparseOfMatrix(k), Matrix<double>.Build.SparseOfMatrix(m), count, massIsDiagonal: true);
        NumericAssert.Close(expected.EigenValues, actual.EigenValues, Tolerance.Rel(1e-10), "λ");
        for (var j = 0; j < count; j++)
        {
            // Shapes agree up to round-off unless two eigenvalues nearly coincide; compare through |φ_dᵀ M φ_s| = 1.
            var dot = expected.Shapes.Column(j) * (m * actual.Shapes.Column(j));
            NumericAssert.Close(1.0, Math.Abs(dot), Tolerance.Abs(1e-7), $"mode {j + 1} alignment");
        }
        var orthogonality = actual.Shapes.TransposeThisAndMultiply(m * actual.Shapes) - Matrix<double>.Build.DenseIdentity(count);
        NumericAssert.Small(orthogonality.Enumerate().Max(Math.Abs), 1e-10, "ΦᵀMΦ − I");
    }

    [Fact]
    public void FreeFreeChain_FindsTheRigidBodyMode()
    {
        // A free-free chain of n equal masses and springs: ω_j = 2√(k/m) sin((j−1)π/(2n)), one rigid-body mode
        // (REFERENCES §2, common practice).
        const int n = 120;
        var k = Matrix<double>.Build.Sparse(n, n);
        for (var i = 1; i < n; i++)
        {
            k[i - 1, i - 1] += 1; k[i, i] += 1; k[i - 1, i] -= 1; k[i, i - 1] -= 1;
        }
        var m = Matrix<double>.Build.SparseIdentity(n);
        var solution = new SubspaceIterationEigen().Solve(k, m, 6, massIsDiagonal: true);
        for (var j = 1; j <= 6; j++)
        {
            var omega = 2 * Math.Sin((j - 1) * Math.PI / (2 * n));
            NumericAssert.Close(omega * omega, solution.EigenValues[j - 1], Tolerance.Abs(1e-12), $"λ{j}");
        }
    }
}
