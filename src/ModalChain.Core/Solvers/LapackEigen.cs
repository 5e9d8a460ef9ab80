using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Storage;

namespace ModalChain.Core.Solvers;

/// <summary>Dense symmetric-definite eigen solve by the native LAPACK library found at run time (see <see cref="NativeLapack"/>).</summary>
/// <remarks>
/// For a diagonal M the problem is reduced exactly as the managed solver does, A = M^-½ K M^-½ and φ = M^-½ v
/// (Golub &amp; Van Loan, Matrix Computations, 4th ed., §8.7.2), and A is solved by dsyevd (all pairs, Cuppen's
/// divide and conquer) or dsyevr (the lowest pairs only, by relatively robust representations; Dhillon &amp; Parlett
/// 2004). A full M goes to dsygvd or dsygvx, which do the Cholesky reduction themselves. Both give orthonormal v, so
/// Φᵀ M Φ = I to round-off, repeated eigenvalues included. Cost O(n³) for all pairs, in optimised multi-threaded BLAS.
/// </remarks>
public sealed class LapackEigen : IGeneralizedEigenSolver
{
    /// <inheritdoc />
    public string Name => $"dense symmetric reduction (native LAPACK, {NativeLapack.LibraryName ?? "not loaded"})";

    /// <inheritdoc />
    public EigenSolution Solve(Matrix<double> stiffness, Matrix<double> mass, int count, bool massIsDiagonal)
    {
        var n = Guard.EigenProblem(stiffness, mass, count);
        if (!NativeLapack.IsAvailable) throw new InvalidOperationException("No native LAPACK library is loaded; use the managed solver.");

        var values = new double[n];
        double[] vectors;
        int info;
        if (massIsDiagonal)
        {
            var scale = new double[n];
            for (var i = 0; i < n; i++)
            {
                var mii = mass[i, i];
                if (!(mii > 0)) throw new NumericalFailureException($"M is not positive definite: diagonal entry {i} is {mii}.");
                scale[i] = 1 / Math.Sqrt(mii);
            }
            var a = ColumnMajor(stiffness, n);
            // Symmetrise while scaling; LAPACK reads the lower triangle only.
            for (var j = 0; j < n; j++)
                for (var i = j; i < n; i++)
                {
                    var v = 0.5 * (a[i + j * n] + a[j + i * n]) * scale[i] * scale[j];
                    a[i + j * n] = v;
                }
            if (count == n)
            {
                info = NativeLapack.SymmetricEigen(n, a, values);
                vectors = a;
            }
            else
            {
                vectors = new double[(long)n * count <= int.MaxValue ? n * count : throw new ArgumentOutOfRangeException(nameof(count))];
                info = NativeLapack.SymmetricEigenLowest(n, a, count, values, vectors);
            }
            if (info != 0) throw Failure(info, n, count == n ? "dsyevd" : "dsyevr");
            for (var j = 0; j < count; j++)
                for (var i = 0; i < n; i++) vectors[i + j * n] *= scale[i];
        }
        else
        {
            var k = ColumnMajor(stiffness, n);
            var m = ColumnMajor(mass, n);
            if (count == n)
            {
                info = NativeLapack.GeneralizedEigen(n, k, m, values);
                vectors = k;
            }
            else
            {
                vectors = new double[n * count];
                info = NativeLapack.GeneralizedEigenLowest(n, k, m, count, values, vectors);
            }
            if (info > n) throw new NumericalFailureException($"M is not positive definite: its leading minor of order {info - n} is not (LAPACK INFO {info}).");
            if (info != 0) throw Failure(info, n, count == n ? "dsygvd" : "dsygvx");
        }

        var shapes = Matrix<double>.Build.Dense(n, count, count == n ? vectors : vectors.AsSpan(0, n * count).ToArray());
        ModeNormalisation.ApplySignConvention(shapes);
        return new EigenSolution([.. values.AsSpan(0, count)], shapes, Name);
    }

    private static NumericalFailureException Failure(int info, int n, string routine) => info <= -1000
        ? new NumericalFailureException($"LAPACK {routine} found {-1000 - info} eigenpairs where {n}-DOF model asked for more.")
        : new NumericalFailureException($"LAPACK {routine} failed on the {n}-DOF eigenproblem (INFO {info}).");

    /// <summary>A column-major copy of <paramref name="a"/>, walking only the stored entries of a sparse matrix.</summary>
    internal static double[] ColumnMajor(Matrix<double> a, int n)
    {
        if (a.Storage is DenseColumnMajorMatrixStorage<double> dense) return (double[])dense.Data.Clone();
        var result = new double[(long)n * n <= Array.MaxLength ? n * n : throw new ArgumentOutOfRangeException(nameof(a), "The model is too large for a dense solve.")];
        foreach (var (i, j, v) in a.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip)) result[i + j * n] = v;
        return result;
    }
}
