using ModalChain.Core.Assembly;

namespace ModalChain.Core.Solvers;

/// <summary>Facade that picks an eigen algorithm for a model and says which one it used.</summary>
/// <remarks>
/// Today every size uses <see cref="DenseGeneralizedEigen"/>, the managed default that must always work.
/// Sparse iterative and native-library algorithms are meant to plug in here behind <see cref="IGeneralizedEigenSolver"/>.
/// </remarks>
public static class GeneralizedEigen
{
    /// <summary>The lowest <paramref name="count"/> modes of <paramref name="matrices"/>, or all when null.</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count = null, IGeneralizedEigenSolver? solver = null)
    {
        ArgumentNullException.ThrowIfNull(matrices);
        var n = matrices.Size;
        if (n == 0) throw new ArgumentException("The model has no degrees of freedom.", nameof(matrices));
        var wanted = Math.Clamp(count ?? n, 1, n);
        solver ??= Choose(n);
        return solver.Solve(matrices.Stiffness, matrices.Mass, wanted, matrices.MassIsDiagonal);
    }

    /// <summary>The algorithm used for a model of <paramref name="size"/> DOFs.</summary>
    public static IGeneralizedEigenSolver Choose(int size) => new DenseGeneralizedEigen();
}
