using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>The lowest eigenpairs of a large sparse K φ = λ M φ by subspace iteration on a sparse Cholesky factor.</summary>
/// <remarks>
/// Bathe &amp; Wilson (1972); Bathe, Finite Element Procedures, 1996, §11.6: q = max(2p, p + 8) vectors (at most n) are
/// iterated as K̂ X̄ = M X with K̂ = K − σM, then projected, K_r = X̄ᵀK̂X̄, M_r = X̄ᵀMX̄, and the small problem
/// K_r Q = M_r Q Λ is solved densely; X = X̄Q. σ is a small negative shift (10⁻⁶ of the largest kᵢᵢ/mᵢᵢ) so that K̂ is
/// positive definite even with rigid-body modes. The iteration stops when every wanted λ changes by less than
/// 10⁻¹² relative (absolute 10⁻¹⁴ of the largest kᵢᵢ/mᵢᵢ near zero). Starting vectors: M ι, then unit vectors at the DOFs of largest mᵢᵢ/kᵢᵢ, and
/// one seeded random vector (Bathe's choice). There is no Sturm-sequence check, so a mode orthogonal to every
/// starting vector could in principle be missed; the modal analysis reports residuals, and the dense solver remains
/// the default for complete solutions. Cost per iteration: q sparse solves and a q × q eigen solve.
/// </remarks>
public sealed class SubspaceIterationEigen : IGeneralizedEigenSolver
{
    private const int MaxIterations = 300;
    private const double Tolerance = 1e-12;

    /// <inheritdoc />
    public string Name => "subspace iteration on a sparse Cholesky factor (managed)";

    /// <inheritdoc />
    public EigenSolution Solve(Matrix<double> stiffness, Matrix<double> mass, int count, bool massIsDiagonal)
    {
        var n = Guard.EigenProblem(stiffness, mass, count);
        var q = Math.Min(n, Math.Max(2 * count, count + 8));
        if (q == n) return new DenseGeneralizedEigen().Solve(stiffness, mass, count, massIsDiagonal) with { Algorithm = Name + " (dense: subspace is the whole space)" };

        var m = SymmetricSparseMatrix.From(mass);
        var diagonalRatio = Enumerable.Range(0, n).Select(i => stiffness[i, i] / mass[i, i]).ToArray();
        var sigma = -1e-6 * Math.Max(diagonalRatio.Max(), 1e-30);
        var shifted = SparseCholesky.Factor(SymmetricSparseMatrix.Combine((1.0, stiffness), (-sigma, mass)));

        var x = StartingVectors(mass, diagonalRatio, n, q);
        var y = new double[n];
        var column = new double[n];
        var previous = new double[count];
        Array.Fill(previous, double.NaN);
        var dense = new DenseGeneralizedEigen();
        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            var xBar = Matrix<double>.Build.Dense(n, q);
            var my = Matrix<double>.Build.Dense(n, q);
            for (var j = 0; j < q; j++)
            {
                for (var i = 0; i < n; i++) column[i] = x[i, j];
                m.Multiply(column, y);
                shifted.Solve(y, column);
                for (var i = 0; i < n; i++)
                {
                    xBar[i, j] = column[i];
                    my[i, j] = y[i];
                }
            }
            var kr = xBar.TransposeThisAndMultiply(my);          // X̄ᵀ K̂ X̄ = X̄ᵀ M X
            var mr = xBar.TransposeThisAndMultiply(mass * xBar);
            kr = (kr + kr.Transpose()) * 0.5;
            mr = (mr + mr.Transpose()) * 0.5;
            var projected = dense.Solve(kr, mr, q, massIsDiagonal: false);
            x = xBar * projected.Shapes;

            var converged = true;
            for (var i = 0; i < count; i++)
            {
                var lambda = projected.EigenValues[i] + sigma;
                var scale = Math.Max(Math.Abs(lambda), 1e4 * Math.Abs(sigma));
                if (!(Math.Abs(lambda - previous[i]) <= Tolerance * scale)) converged = false;
                previous[i] = lambda;
            }
            if (converged)
            {
                var shapes = x.SubMatrix(0, n, 0, count);
                ModeNormalisation.ApplySignConvention(shapes);
                return new EigenSolution([.. previous], shapes, Name);
            }
        }
        throw new NumericalFailureException(
            $"Subspace iteration did not converge: the lowest {count} of {n} eigenvalues still changed after {MaxIterations} iterations with {q} vectors.");
    }

    private static Matrix<double> StartingVectors(Matrix<double> mass, double[] diagonalRatio, int n, int q)
    {
        var x = Matrix<double>.Build.Dense(n, q);
        for (var i = 0; i < n; i++) x[i, 0] = mass[i, i];
        var order = Enumerable.Range(0, n).OrderBy(i => diagonalRatio[i]).ToArray();
        for (var j = 1; j < q - 1; j++) x[order[j - 1], j] = 1;
        var random = new Random(12345);
        for (var i = 0; i < n; i++) x[i, q - 1] = random.NextDouble() - 0.5;
        return x;
    }
}
