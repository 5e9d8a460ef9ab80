using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>Dense symmetric-definite eigen solve by reduction to a standard symmetric problem, managed code only.</summary>
/// <remarks>
/// With M = L Lᵀ (L = M^½ when M is diagonal), K φ = λ M φ becomes A v = λ v with A = L⁻¹ K L⁻ᵀ and φ = L⁻ᵀ v
/// (Golub &amp; Van Loan, Matrix Computations, 4th ed., §8.7.2). A is symmetrised and solved by Math.NET's symmetric
/// tridiagonal QL method, whose eigenvectors are orthonormal even for repeated eigenvalues, so the shapes are
/// M-orthonormal: Φᵀ M Φ = I. Cost O(n³); the default for models up to a few thousand DOFs.
/// </remarks>
public sealed class DenseGeneralizedEigen : IGeneralizedEigenSolver
{
    /// <inheritdoc />
    public string Name => "dense symmetric reduction (Math.NET, managed)";

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

        var symmetric = (a + a.Transpose()) * 0.5;
        var evd = symmetric.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Symmetric);
        var values = evd.EigenValues.Select(c => c.Real).ToArray();
        var order = Enumerable.Range(0, n).OrderBy(i => values[i]).Take(count).ToArray();
        var v = Matrix<double>.Build.Dense(n, count, (i, j) => evd.EigenVectors[i, order[j]]);
        var shapes = backTransform(v);
        ModeNormalisation.ApplySignConvention(shapes);
        return new EigenSolution([.. order.Select(i => values[i])], shapes, Name);
    }
}
