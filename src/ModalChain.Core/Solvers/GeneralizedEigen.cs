using ModalChain.Core.Assembly;

namespace ModalChain.Core.Solvers;

/// <summary>Which family of eigen algorithm to use (the <c>--solver</c> option).</summary>
public enum SolverChoice
{
    /// <summary>Let <see cref="GeneralizedEigen.Choose(int, int, SolverChoice, long)"/> pick by size, modes wanted and what is installed.</summary>
    Auto,

    /// <summary>The managed dense solver, <see cref="DenseGeneralizedEigen"/>: always available.</summary>
    Managed,

    /// <summary>The native LAPACK solver, <see cref="LapackEigen"/>; only when a library was found.</summary>
    Native,

    /// <summary>The sparse solver for the lowest modes of large models.</summary>
    Sparse,
}

/// <summary>Facade that picks an eigen algorithm for a model and says which one it used.</summary>
/// <remarks>
/// <para>Auto: when at most a quarter of the modes are wanted of a model larger than <see cref="SparseFromSize"/> DOFs
/// (<see cref="ManagedSparseFromSize"/> when no native library is loaded, because the managed dense solve computes every
/// mode), the sparse solver runs; otherwise the dense problem is solved by native LAPACK when a library was found
/// (<see cref="NativeLapack.IsAvailable"/>), by the managed <see cref="DenseGeneralizedEigen"/> when not. The managed
/// solver is embedded and always works; the native one gives the same modes 10–20 times faster. The sparse solver is
/// <see cref="ShiftInvertLanczos"/>, which proves by a Sturm count that no mode below the highest one it reports was missed.</para>
/// <para>An upper limit on the eigenvalue (every mode below a frequency) works with every algorithm: the sparse solver
/// counts the modes below the limit and finds exactly those; the dense ones solve every mode and keep those below. Auto
/// treats a limit like a few modes wanted (the number is not known before the count).</para>
/// </remarks>
public static class GeneralizedEigen
{
    /// <summary>Smallest model that Auto may give to the sparse solver when few modes are wanted.</summary>
    public const int SparseFromSize = 3000;

    /// <summary>Smallest model that Auto may give to the sparse solver when no native library is loaded.</summary>
    public const int ManagedSparseFromSize = 300;

    /// <summary>The lowest <paramref name="count"/> modes of <paramref name="matrices"/>, or all when null.</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count = null, IGeneralizedEigenSolver? solver = null,
        SolverChoice choice = SolverChoice.Auto) =>
        Solve(matrices, count, solver, choice, belowEigenvalue: null);

    /// <summary>The lowest <paramref name="count"/> modes (all when null) with λ below <paramref name="belowEigenvalue"/> (rad²/s²; no limit when null).</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count, IGeneralizedEigenSolver? solver,
        SolverChoice choice, double? belowEigenvalue)
    {
        ArgumentNullException.ThrowIfNull(matrices);
        var n = matrices.Size;
        if (n == 0) throw new ArgumentException("The model has no degrees of freedom.", nameof(matrices));
        var wanted = Math.Clamp(count ?? n, 1, n);
        if (belowEigenvalue is not { } limit)
        {
            solver ??= Choose(n, wanted, choice, NonZeros(matrices));
            return solver.Solve(matrices.Stiffness, matrices.Mass, wanted, matrices.MassIsDiagonal);
        }

        Guard.Finite(limit);
        solver ??= Choose(n, count is null ? 1 : wanted, choice, NonZeros(matrices));
        if (solver is ShiftInvertLanczos lanczos) return lanczos.SolveBelow(matrices.Stiffness, matrices.Mass, limit, count);
        var all = solver.Solve(matrices.Stiffness, matrices.Mass, solver is SubspaceIterationEigen ? wanted : n, matrices.MassIsDiagonal);
        var keep = Math.Min(wanted, all.EigenValues.Count(v => v < limit));
        return all with
        {
            EigenValues = [.. all.EigenValues.Take(keep)],
            Shapes = keep == all.Count ? all.Shapes : all.Shapes.SubMatrix(0, n, 0, keep),
        };
    }

    /// <summary>The algorithm used for a model of <paramref name="size"/> DOFs (kept for callers that ask by size only: all modes, Auto).</summary>
    public static IGeneralizedEigenSolver Choose(int size) => Choose(size, size, SolverChoice.Auto, (long)size * size);

    /// <summary>The algorithm for <paramref name="wanted"/> of <paramref name="size"/> modes under <paramref name="choice"/>, with the installed library probed once.</summary>
    /// <param name="size">Number of DOFs.</param>
    /// <param name="wanted">Number of lowest modes wanted.</param>
    /// <param name="choice">The user's choice.</param>
    /// <param name="nonZeros">Stored entries of K (for the sparse rule; today only the size and the count decide).</param>
    public static IGeneralizedEigenSolver Choose(int size, int wanted, SolverChoice choice, long nonZeros) =>
        Choose(size, wanted, choice, nonZeros, NativeLapack.IsAvailable);

    /// <summary>As <see cref="Choose(int, int, SolverChoice, long)"/> with the probe's answer given, so the rule can be tested either way.</summary>
    /// <exception cref="ArgumentException">Native was asked for but no library is available.</exception>
    public static IGeneralizedEigenSolver Choose(int size, int wanted, SolverChoice choice, long nonZeros, bool nativeAvailable)
    {
        if (size < 1) throw new ArgumentOutOfRangeException(nameof(size), size, "size must be at least 1.");
        if (wanted < 1 || wanted > size) throw new ArgumentOutOfRangeException(nameof(wanted), wanted, $"wanted must be in 1..{size}.");
        return choice switch
        {
            SolverChoice.Managed => new DenseGeneralizedEigen(),
            SolverChoice.Native => nativeAvailable
                ? new LapackEigen()
                : throw new ArgumentException($"The native solver was asked for but no LAPACK library could be loaded (tried {string.Join(", ", NativeLapack.Candidates)}).", nameof(choice)),
            SolverChoice.Sparse => Sparse(),
            SolverChoice.Auto when 4L * wanted <= size && size > (nativeAvailable ? SparseFromSize : ManagedSparseFromSize) => Sparse(),
            SolverChoice.Auto => nativeAvailable ? new LapackEigen() : new DenseGeneralizedEigen(),
            _ => throw new ArgumentOutOfRangeException(nameof(choice), choice, "Unknown solver choice."),
        };
    }

    /// <summary>The sparse solver for the lowest modes.</summary>
    private static IGeneralizedEigenSolver Sparse() => new ShiftInvertLanczos();

    private static long NonZeros(StructuralMatrices matrices) =>
        matrices.Stiffness.Storage is MathNet.Numerics.LinearAlgebra.Storage.SparseCompressedRowMatrixStorage<double> s
            ? s.ValueCount
            : (long)matrices.Size * matrices.Size;
}
