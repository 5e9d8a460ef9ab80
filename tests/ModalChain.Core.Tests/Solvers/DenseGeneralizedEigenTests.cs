using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>
/// The dense symmetric-definite solver of K φ = λ M φ by reduction to standard form (Golub &amp; Van Loan, Matrix
/// Computations, 4th ed., §8.7.2; attribution from memory): eigenvalues, M-orthonormal shapes, sign convention,
/// the full (Cholesky) path for a non-diagonal M, and caller errors.
/// </summary>
public class DenseGeneralizedEigenTests
{
    private static readonly DenseGeneralizedEigen Solver = new();

    [Fact]
    public void DiagonalMass_GivesTheTwoMassRootsAndOrthonormalShapes()
    {
        // K = [[k1+k2, −k2], [−k2, k2]], M = diag(m1, m2) with case B of REFERENCES.md §1 (m1 = 9, m2 = 1, k1 = 24,
        // k2 = 3): λ = 2 and 4 rad²/s² (values recomputed; attribution from memory). Tolerance 1e-12 relative.
        var k = Matrix<double>.Build.DenseOfArray(new double[,] { { 27, -3 }, { -3, 3 } });
        var m = Matrix<double>.Build.DenseOfDiagonalArray([9.0, 1]);
        var solution = Solver.Solve(k, m, 2, massIsDiagonal: true);
        NumericAssert.Close(new[] { 2.0, 4.0 }, solution.EigenValues, Tolerance.Rel(1e-12), "λ");
        NumericAssert.Close(Matrix<double>.Build.DenseIdentity(2), solution.Shapes.TransposeThisAndMultiply(m * solution.Shapes), Tolerance.Abs(1e-14), "ΦᵀMΦ");
        Assert.Equal(solution.Algorithm, Solver.Name);
    }

    [Fact]
    public void FullMass_SolvesThroughCholeskyAndMatchesTheDeterminantCondition()
    {
        // A consistent-mass-like M = (m/6)[[2, 1], [1, 2]] with K = k[[2, −1], [−1, 1]]: for 2×2 matrices
        // det(K − λM) = a λ² + b λ + c with a = det M, b = −(K11 M22 + K22 M11 − 2 K12 M12), c = det K
        // (2×2 algebra, common practice); its roots are the expected λ. Tolerance 1e-12 relative.
        const double mm = 6.0, kk = 1.0e4;
        var k = Matrix<double>.Build.DenseOfArray(new double[,] { { 2 * kk, -kk }, { -kk, kk } });
        var m = Matrix<double>.Build.DenseOfArray(new double[,] { { 2 * mm / 6, mm / 6 }, { mm / 6, 2 * mm / 6 } });
        var a = m.Determinant();
        var b = -(k[0, 0] * m[1, 1] + k[1, 1] * m[0, 0] - 2 * k[0, 1] * m[0, 1]);
        var c = k.Determinant();
        var disc = Math.Sqrt(b * b - 4 * a * c);
        double[] expected = [(-b - disc) / (2 * a), (-b + disc) / (2 * a)];

        var solution = Solver.Solve(k, m, 2, massIsDiagonal: false);
        NumericAssert.Close(expected, solution.EigenValues, Tolerance.Rel(1e-12), "λ");
        NumericAssert.Close(Matrix<double>.Build.DenseIdentity(2), solution.Shapes.TransposeThisAndMultiply(m * solution.Shapes), Tolerance.Abs(1e-12), "ΦᵀMΦ");
        for (var j = 0; j < 2; j++)
        {
            var phi = solution.Shapes.Column(j);
            NumericAssert.Small((k * phi - m * phi * solution.EigenValues[j]).L2Norm(), 1e-10 * (k * phi).L2Norm(), $"residual {j}");
        }
    }

    [Fact]
    public void FullAndDiagonalPaths_AgreeOnADiagonalMass()
    {
        // The Cholesky path must give the diagonal path's answer when M happens to be diagonal. Tolerance 1e-10.
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(7), 12));
        var fast = Solver.Solve(matrices.Stiffness, matrices.Mass, 12, massIsDiagonal: true);
        var full = Solver.Solve(matrices.Stiffness, matrices.Mass, 12, massIsDiagonal: false);
        var scale = TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass);
        NumericAssert.Close(fast.EigenValues, full.EigenValues, new Tolerance(1e-12 * scale, 1e-10), "λ");
    }

    [Fact]
    public void Count_ReturnsTheLowestPairsOnly()
    {
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(8, 2.0, 500.0, ChainEnds.FixedFixed));
        var all = GeneralizedEigen.Solve(matrices);
        var three = GeneralizedEigen.Solve(matrices, count: 3);
        Assert.Equal(8, all.Count);
        Assert.Equal(3, three.Count);
        Assert.Equal(3, three.Shapes.ColumnCount);
        NumericAssert.Close(all.EigenValues.Take(3).ToArray(), three.EigenValues, Tolerance.Rel(1e-14), "lowest three λ");
        // The facade clamps a count above n to n.
        Assert.Equal(8, GeneralizedEigen.Solve(matrices, count: 50).Count);
    }

    [Fact]
    public void EveryShape_HasItsLargestMagnitudeEntryPositive()
    {
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(9, 1.0, 1.0, ChainEnds.FixedFree));
        var solution = GeneralizedEigen.Solve(matrices);
        for (var j = 0; j < solution.Count; j++)
        {
            var column = solution.Shapes.Column(j);
            Assert.True(column.Maximum() >= -column.Minimum(), $"mode {j + 1}: largest entry is negative");
        }
    }

    [Fact]
    public void CallerErrors_AreArgumentExceptionsAndAnIndefiniteMassIsANumericalFailure()
    {
        var k2 = Matrix<double>.Build.DenseIdentity(2);
        var k3 = Matrix<double>.Build.DenseIdentity(3);
        var rectangular = Matrix<double>.Build.Dense(2, 3);
        Assert.Throws<ArgumentException>(() => Solver.Solve(k2, k3, 2, true));
        Assert.Throws<ArgumentException>(() => Solver.Solve(rectangular, k2, 2, true));
        Assert.Throws<ArgumentOutOfRangeException>(() => Solver.Solve(k2, k2, 0, true));
        Assert.Throws<ArgumentOutOfRangeException>(() => Solver.Solve(k2, k2, 3, true));

        var singular = Matrix<double>.Build.DenseOfDiagonalArray([1.0, 0]);
        var failure = Assert.Throws<NumericalFailureException>(() => Solver.Solve(k2, singular, 2, true));
        Assert.Contains("diagonal entry 1", failure.Message);
        var indefinite = Matrix<double>.Build.DenseOfArray(new double[,] { { 1, 2 }, { 2, 1 } });
        Assert.Throws<NumericalFailureException>(() => Solver.Solve(k2, indefinite, 2, false));
    }
}
