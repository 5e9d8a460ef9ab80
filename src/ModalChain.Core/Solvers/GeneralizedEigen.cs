using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Double;
using ModalChain.Core.Assembly;

namespace ModalChain.Core.Solvers;

/// <summary>Facade that picks an eigen algorithm for a model and says which one it used.</summary>
/// <remarks>
/// <see cref="DenseGeneralizedEigen"/> is the managed default that must always work and solves for all modes.
/// <see cref="ShiftInvertLanczos"/> is chosen for the lowest modes of large sparse models (see <see cref="Choose(int, int?, long)"/>).
/// An upper limit on the eigenvalue (every mode below a frequency) works with every algorithm: the sparse solver
/// counts and finds exactly those modes; the others solve and keep those below the limit.
/// </remarks>
public static class GeneralizedEigen
{
    /// <summary>Models with more DOFs than this use the sparse solver for their lowest modes.</summary>
    public const int SparseThreshold = 1500;

    /// <summary>The lowest <paramref name="count"/> modes of <paramref name="matrices"/>, or all when null.</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count = null, IGeneralizedEigenSolver? solver = null) =>
        Solve(matrices, count, solver, belowEigenvalue: null);

    /// <summary>The lowest <paramref name="count"/> modes (all when null) with λ below <paramref name="belowEigenvalue"/> (rad²/s², no limit when null).</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count, IGeneralizedEigenSolver? solver, double? belowEigenvalue)
    {
        ArgumentNullException.ThrowIfNull(matrices);
        var n = matrices.Size;
        if (n == 0) throw new ArgumentException("The model has no degrees of freedom.", nameof(matrices));
        var wanted = Math.Clamp(count ?? n, 1, n);
        if (belowEigenvalue is not { } limit)
        {
            solver ??= Choose(n, wanted, StiffnessNonZeros(matrices.Stiffness));
            return solver.Solve(matrices.Stiffness, matrices.Mass, wanted, matrices.MassIsDiagonal);
        }

        Guard.Finite(limit);
        solver ??= Choose(n, wanted: null, StiffnessNonZeros(matrices.Stiffness));
        if (solver is ShiftInvertLanczos lanczos) return lanczos.SolveBelow(matrices.Stiffness, matrices.Mass, limit, count);
        var all = solver.Solve(matrices.Stiffness, matrices.Mass, solver is SubspaceIterationEigen ? wanted : n, matrices.MassIsDiagonal);
        var keep = Math.Min(wanted, all.EigenValues.Count(v => v < limit));
        return all with
        {
            EigenValues = [.. all.EigenValues.Take(keep)],
            Shapes = keep == all.Count ? all.Shapes : all.Shapes.SubMatrix(0, n, 0, keep),
        };
    }

    /// <summary>The algorithm used for a model of <paramref name="size"/> DOFs.</summary>
    public static IGeneralizedEigenSolver Choose(int size) => new DenseGeneralizedEigen();

    /// <summary>
    /// The algorithm for <paramref name="wanted"/> of the lowest modes (null: every mode below a limit, number unknown)
    /// of a model of <paramref name="size"/> DOFs whose K has <paramref name="stiffnessNonZeros"/> stored entries.
    /// </summary>
    /// <remarks>
    /// The sparse solver when the model is large (more than <see cref="SparseThreshold"/> DOFs), K is sparse (at most
    /// 5 % of its entries stored) and at most a fifth of the modes are wanted; otherwise the dense solver, which
    /// computes every mode at O(n³) and is the faster and simpler choice for small models or most of the spectrum.
    /// </remarks>
    public static IGeneralizedEigenSolver Choose(int size, int? wanted, long stiffnessNonZeros)
    {
        var sparse = size > SparseThreshold
            && stiffnessNonZeros <= 0.05 * size * (double)size
            && (wanted is null || wanted <= size / 5);
        return sparse ? new ShiftInvertLanczos() : Choose(size);
    }

    private static long StiffnessNonZeros(Matrix<double> stiffness) =>
        stiffness is SparseMatrix sparse ? sparse.NonZerosCount : (long)stiffness.RowCount * stiffness.ColumnCount;
}
