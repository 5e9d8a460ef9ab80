using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>Dense symmetric-definite eigen solve by reduction to a standard symmetric problem, managed code only.</summary>
/// <remarks>
/// With M = L Lᵀ (L = M^½ when M is diagonal), K φ = λ M φ becomes A v = λ v with A = L⁻¹ K L⁻ᵀ and φ = L⁻ᵀ v
/// (Golub &amp; Van Loan, Matrix Computations, 4th ed., §8.7.2). A is symmetrised and solved by Householder
/// tridiagonalisation and the implicit QL method (<see cref="SymmetricEigenManaged"/>), whose eigenvectors are
/// orthonormal even for repeated eigenvalues, so the shapes are M-orthonormal: Φᵀ M Φ = I. Cost O(n³); the fallback
/// when no native LAPACK is installed.
/// </remarks>
public sealed class DenseGeneralizedEigen : IGeneralizedEigenSolver
{
    /// <inheritdoc />
    public string Name => "dense symmetric reduction (managed tridiagonal QL)";

    /// <inheritdoc />
    public EigenSolution Solve(Matrix<double> stiffness, Matrix<double> mass, int count, bool massIsDiagonal)
    {
        var n = Guard.EigenProblem(stiffness, mass, count);

        var k = Matrix<double>.Build.DenseOfMatrix(stiffness);
        Matrix<double> a;
        Func<Matrix<double>, Matrix<double>> backTransform;
        if (massIsDiagonal)
        {
            var scale = new double[n];
            for (var i = 0; i < n; i++)
            {
                var mii = mass[i, i];
                if (!(mii > 0)) throw new NumericalFailureException($"M is not positive definite: diagonal entry {i} is {mii}.");
                scale[i] = 1 / Math.Sqrt(mii);
            }
            a = Matrix<double>.Build.Dense(n, n, (i, j) => scale[i] * k[i, j] * scale[j]);
            backTransform = v => Matrix<double>.Build.Dense(n, v.ColumnCount, (i, j) => scale[i] * v[i, j]);
        }
        else
        {
            var m = Matrix<double>.Build.DenseOfMatrix(mass);
            Matrix<double> l;
            try { l = m.Cholesky().Factor; }
            catch (ArgumentException e) { throw new NumericalFailureException("M is not positive definite: its Cholesky factorisation failed.", e); }
            var lInvK = l.Solve(k);                       // L⁻¹ K
            a = l.Solve(lInvK.Transpose()).Transpose();  // (L⁻¹ (L⁻¹ K)ᵀ)ᵀ = L⁻¹ K L⁻ᵀ
            var lt = l.Transpose();
            backTransform = v => lt.Solve(v);
        }

        // Symmetrised, column-major, for the managed tridiagonal QL solve.
        var symmetric = new double[(long)n * n <= Array.MaxLength ? n * n : throw new ArgumentOutOfRangeException(nameof(stiffness), "The model is too large for a dense solve.")];
        var stored = a.Storage is MathNet.Numerics.LinearAlgebra.Storage.DenseColumnMajorMatrixStorage<double> dense ? dense.Data : a.ToColumnMajorArray();
        for (var j = 0; j < n; j++)
            for (var i = 0; i < n; i++) symmetric[i + j * n] = 0.5 * (stored[i + j * n] + stored[j + i * n]);
        var (values, vectors) = SymmetricEigenManaged.Solve(symmetric, n);
        var order = Enumerable.Range(0, n).OrderBy(i => values[i]).Take(count).ToArray();
        var v = Matrix<double>.Build.Dense(n, count);
        var columns = ((MathNet.Numerics.LinearAlgebra.Storage.DenseColumnMajorMatrixStorage<double>)v.Storage).Data;
        for (var j = 0; j < count; j++) Array.Copy(vectors, (long)order[j] * n, columns, (long)j * n, n);
        var shapes = backTransform(v);
        ModeNormalisation.ApplySignConvention(shapes);
        return new EigenSolution([.. order.Select(i => values[i])], shapes, Name);
    }
}
