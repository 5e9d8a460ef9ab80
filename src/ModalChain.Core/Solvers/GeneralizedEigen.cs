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
/// <para>Between <see cref="WeighedFromSize"/> and <see cref="SparseFromSize"/> DOFs with the native library, a few
/// modes go to whichever solver is estimated cheaper (<see cref="SparseIsCheaper"/>): the ordering's symbolic pass gives
/// the factor's fill, which with the count prices the sparse solve, against the (4/3)n³ of the tridiagonal reduction
/// the dense solve does whatever the count. Whenever Auto chose the sparse solver for a model no larger than
/// <see cref="SparseFromSize"/> and it fails, the dense solver runs instead and its name says so.</para>
/// <para>An upper limit on the eigenvalue (every mode below a frequency) works with every algorithm: the sparse solver
/// counts the modes below the limit and finds exactly those; the dense ones solve every mode and keep those below. Auto
/// treats a limit like a few modes wanted (the number is not known before the count), and in the weighed range counts
/// them first (one factorisation) to price the sparse solve.</para>
/// </remarks>
public static class GeneralizedEigen
{
    /// <summary>Smallest model that Auto may give to the sparse solver when few modes are wanted.</summary>
    public const int SparseFromSize = 3000;

    /// <summary>Smallest model that Auto may give to the sparse solver when no native library is loaded.</summary>
    public const int ManagedSparseFromSize = 300;

    /// <summary>Models above this many DOFs (and up to <see cref="SparseFromSize"/>) have the two solvers' costs weighed when the native library is loaded.</summary>
    public const int WeighedFromSize = 800;

    /// <summary>
    /// How many times more processor time one estimated operation of the sparse solver costs than one of the native dense
    /// reduction: calibrated on seeded random networks of 1,000 and 2,000 masses (docs/performance.md, "Few modes of
    /// mid-size models"), where the sparse solve took 40× the time per estimated operation; 50 leaves margin for dense.
    /// </summary>
    internal const double SparseOperationWeight = 50;

    /// <summary>The lowest <paramref name="count"/> modes of <paramref name="matrices"/>, or all when null.</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count = null, IGeneralizedEigenSolver? solver = null,
        SolverChoice choice = SolverChoice.Auto) =>
        Solve(matrices, count, solver, choice, belowEigenvalue: null);

    /// <summary>The lowest <paramref name="count"/> modes (all when null) with λ below <paramref name="belowEigenvalue"/> (rad²/s²; no limit when null).</summary>
    public static EigenSolution Solve(StructuralMatrices matrices, int? count, IGeneralizedEigenSolver? solver,
        SolverChoice choice, double? belowEigenvalue) =>
        Solve(matrices, count, solver, choice, belowEigenvalue, new ShiftInvertLanczos());

    /// <summary>As the public overload, with the sparse solver Auto would run given (tests give a faulty one to see the fallback).</summary>
    internal static EigenSolution Solve(StructuralMatrices matrices, int? count, IGeneralizedEigenSolver? solver,
        SolverChoice choice, double? belowEigenvalue, ShiftInvertLanczos sparse)
    {
        ArgumentNullException.ThrowIfNull(matrices);
        var n = matrices.Size;
        if (n == 0) throw new ArgumentException("The model has no degrees of freedom.", nameof(matrices));
        var wanted = Math.Clamp(count ?? n, 1, n);
        if (belowEigenvalue is { } l) Guard.Finite(l);
        var automatic = solver is null && choice == SolverChoice.Auto;
        var few = belowEigenvalue is null || count is not null ? wanted : 1;
        solver ??= Choose(n, few, choice, NonZeros(matrices));
        if (automatic && solver is ShiftInvertLanczos) solver = sparse;

        ShiftInvertLanczos.Problem? problem = null;
        if (automatic && solver is LapackEigen && n > WeighedFromSize && n <= SparseFromSize && 4L * few <= n)
        {
            try
            {
                problem = ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass);
                if (belowEigenvalue is { } limit)
                    few = Math.Max(1, Math.Min(wanted, SturmSequence.CountBelow(problem.Pattern, problem.K, problem.M, limit)));
                if (SparseIsCheaper(n, few, problem.Pattern)) solver = sparse;
            }
            catch (NumericalFailureException)
            {
                // The sparse analysis itself failed (e.g. a singular shifted matrix at the limit): the dense solver decides.
                problem = null;
            }
        }

        if (solver is not ShiftInvertLanczos lanczos) return SolveDense(matrices, solver, wanted, belowEigenvalue);
        if (!automatic || n > SparseFromSize) return SolveSparse(matrices, lanczos, problem, wanted, count, belowEigenvalue);
        try
        {
            return SolveSparse(matrices, lanczos, problem, wanted, count, belowEigenvalue);
        }
        catch (NumericalFailureException e)
        {
            var dense = NativeLapack.IsAvailable ? (IGeneralizedEigenSolver)new LapackEigen() : new DenseGeneralizedEigen();
            var solution = SolveDense(matrices, dense, wanted, belowEigenvalue);
            return solution with { Algorithm = $"{solution.Algorithm}, run because the sparse solver failed: {e.Message}" };
        }
    }

    /// <summary>
    /// True when the sparse solver's estimated work for the lowest <paramref name="wanted"/> of <paramref name="size"/>
    /// modes, weighted by <see cref="SparseOperationWeight"/>, is below the (4/3)n³ multiply-adds of the dense
    /// tridiagonal reduction (Golub &amp; Van Loan, Matrix Computations, 4th ed., §8.3.1).
    /// </summary>
    /// <remarks>
    /// The sparse work is priced as <see cref="ShiftInvertLanczos"/> spends it: two factorisations (the shift and the
    /// Sturm count), Σⱼ cⱼ² each; about 2m Lanczos steps for a basis of m = max(2(k + 1), k + 21) vectors (the basis and
    /// one restart's worth), each a forward and back solve (4 nnz(L)); and the full reorthogonalisation, twice per step
    /// against up to m vectors, 4 n m² in all.
    /// </remarks>
    public static bool SparseIsCheaper(int size, int wanted, SparseLdltPattern pattern)
    {
        ArgumentNullException.ThrowIfNull(pattern);
        return SparseOperationWeight * SparseWork(size, wanted, pattern.FactorOperations, pattern.FactorNonZeros) < DenseWork(size);
    }

    /// <summary>Estimated multiply-adds of the sparse solve (see <see cref="SparseIsCheaper"/>).</summary>
    internal static double SparseWork(int size, int wanted, double factorOperations, long factorNonZeros)
    {
        double n = size;
        double m = Math.Min(size, Math.Max(2 * (wanted + 1), wanted + 21));
        return 2 * factorOperations + 2 * m * 4 * factorNonZeros + 4 * n * m * m;
    }

    /// <summary>(4/3) n³: the Householder reduction to tridiagonal form.</summary>
    internal static double DenseWork(int size) => 4.0 / 3.0 * size * (double)size * size;

    private static EigenSolution SolveSparse(StructuralMatrices matrices, ShiftInvertLanczos lanczos, ShiftInvertLanczos.Problem? problem,
        int wanted, int? count, double? belowEigenvalue)
    {
        problem ??= ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass);
        return belowEigenvalue is { } limit ? lanczos.SolveBelow(problem, limit, count) : lanczos.Solve(problem, wanted);
    }

    private static EigenSolution SolveDense(StructuralMatrices matrices, IGeneralizedEigenSolver solver, int wanted, double? belowEigenvalue)
    {
        var n = matrices.Size;
        if (belowEigenvalue is not { } limit) return solver.Solve(matrices.Stiffness, matrices.Mass, wanted, matrices.MassIsDiagonal);
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
