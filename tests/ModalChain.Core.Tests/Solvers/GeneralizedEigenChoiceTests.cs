using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>Which algorithm the facade picks for each --solver choice, with the native library present or absent (the probe's answer is injected).</summary>
public class GeneralizedEigenChoiceTests
{
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Managed_IsTheEmbeddedSolverWhateverIsInstalled(bool native) =>
        Assert.IsType<DenseGeneralizedEigen>(GeneralizedEigen.Choose(500, 500, SolverChoice.Managed, 1500, native));

    [Fact]
    public void Auto_WithoutTheLibrary_FallsBackToTheManagedSolver()
    {
        Assert.IsType<DenseGeneralizedEigen>(GeneralizedEigen.Choose(2000, 2000, SolverChoice.Auto, 6000, nativeAvailable: false));
        Assert.IsType<DenseGeneralizedEigen>(GeneralizedEigen.Choose(200, 20, SolverChoice.Auto, 600, nativeAvailable: false));
    }

    [Fact]
    public void Auto_WithTheLibrary_UsesNativeLapackForDenseSolves() =>
        Assert.IsType<LapackEigen>(GeneralizedEigen.Choose(2000, 2000, SolverChoice.Auto, 6000, nativeAvailable: true));

    [Theory]
    [InlineData(false, 1000)]
    [InlineData(true, 10_000)]
    public void Auto_GivesAFewModesOfALargeModelToTheSparseSolver(bool native, int size) =>
        Assert.IsType<ShiftInvertLanczos>(GeneralizedEigen.Choose(size, 20, SolverChoice.Auto, 3L * size, native));

    [Fact]
    public void Choose_BySizeAlone_KeepsAFewModesOfAMidSizeModelDenseWhenNativeIsThere() =>
        // Choose sees no pattern; Solve then weighs the two costs for models of 801–3,000 DOFs (tests below).
        Assert.IsType<LapackEigen>(GeneralizedEigen.Choose(1000, 20, SolverChoice.Auto, 3000, nativeAvailable: true));

    [Theory]
    [InlineData(1000, 20, true)]    // a sparse random network, a few modes: the factor is nearly as sparse as K
    [InlineData(2000, 20, true)]
    [InlineData(1000, 250, false)]  // a quarter of the modes: the Lanczos basis work (4 n m²) exceeds the dense reduction
    public void SparseIsCheaper_OnRandomNetworks_FollowsTheFillAndTheCount(int size, int wanted, bool expected)
    {
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(size), size));
        var problem = ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass);
        Assert.Equal(expected, GeneralizedEigen.SparseIsCheaper(size, wanted, problem.Pattern));
    }

    [Fact]
    public void SparseIsCheaper_IsFalseWhenTheFactorFillsIn()
    {
        // Every mass coupled to every other: L is full, each factorisation n³/3 operations, so dense wins (common practice).
        const int n = 900;
        var full = Matrix<double>.Build.Dense(n, n, (i, j) => i == j ? n : -1.0 / (1 + Math.Abs(i - j)));
        var pattern = SparseLdltPattern.Analyse(SymmetricSparseMatrix.From(full));
        Assert.Equal((long)n * (n + 1) / 2, pattern.FactorNonZeros);
        Assert.False(GeneralizedEigen.SparseIsCheaper(n, 20, pattern));
    }

    [Fact]
    public void Auto_GivesAFewModesOfAMidSizeChainToTheSparseSolver()
    {
        // The 2,100-mass chain of issue 13 (20 kg, 5 MN/m, held at one end): 31 modes by Lanczos whatever is installed,
        // against the fixed–free closed form ω_j = 2√(k/m) sin((2j − 1)π/(2(2n + 1))) (REFERENCES §2, common practice).
        const int n = 2100;
        const double m = 20, k = 5e6;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFree));
        var solution = GeneralizedEigen.Solve(matrices, 31);
        Assert.Equal(new ShiftInvertLanczos().Name, solution.Algorithm);
        var exact = Enumerable.Range(1, 31).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1))), 2)).ToArray();
        NumericAssert.Close(exact, solution.EigenValues, Tolerance.Rel(1e-9), "λ");
    }

    [Fact]
    public void Auto_BelowALimit_CountsTheModesAndSolvesThemSparse()
    {
        // Every mode below a frequency of the same chain: the Sturm count prices the sparse solve; the result holds exactly
        // the closed-form eigenvalues below the limit.
        const int n = 2100;
        const double m = 20, k = 5e6;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFree));
        var exact = Enumerable.Range(1, 12).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1))), 2)).ToArray();
        var solution = GeneralizedEigen.Solve(matrices, null, null, SolverChoice.Auto, (exact[9] + exact[10]) / 2);
        Assert.Equal(new ShiftInvertLanczos().Name, solution.Algorithm);
        NumericAssert.Close(exact.Take(10).ToArray(), solution.EigenValues, Tolerance.Rel(1e-9), "λ");
    }

    [Fact]
    public void Auto_FallsBackToTheDenseSolverWhenLanczosFails_AndSaysSo()
    {
        // A deliberately faulty sparse solver (it throws away every pair it finds, so the Sturm count never agrees): Auto
        // must still return the modes, from the dense solver, and its name must say the sparse one failed. Reference: the
        // dense solver run directly.
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(7), 1000));
        var faulty = new ShiftInvertLanczos { InjectedSkips = int.MaxValue };
        var solution = GeneralizedEigen.Solve(matrices, 20, null, SolverChoice.Auto, null, faulty);
        Assert.Contains("run because the sparse solver failed", solution.Algorithm);
        Assert.Contains("Sturm count", solution.Algorithm);
        var denseSolver = NativeLapack.IsAvailable ? (IGeneralizedEigenSolver)new LapackEigen() : new DenseGeneralizedEigen();
        var dense = denseSolver.Solve(matrices.Stiffness, matrices.Mass, 20, massIsDiagonal: true);
        Assert.StartsWith(denseSolver.Name, solution.Algorithm);
        NumericAssert.Close(dense.EigenValues, solution.EigenValues, Tolerance.Rel(1e-12), "λ");
    }

    [Fact]
    public void Native_WithoutTheLibrary_IsACallerError()
    {
        var e = Assert.Throws<ArgumentException>(() => GeneralizedEigen.Choose(10, 10, SolverChoice.Native, 30, nativeAvailable: false));
        Assert.Contains("libopenblas.so.0", e.Message);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Sparse_RoutesToTheSparseSolver(bool native) =>
        Assert.IsType<ShiftInvertLanczos>(GeneralizedEigen.Choose(50, 5, SolverChoice.Sparse, 150, native));

    [Fact]
    public void Solve_NamesTheAlgorithmThatRan()
    {
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(4, 1, 1e3, ChainEnds.FixedFree));
        var solution = GeneralizedEigen.Solve(matrices, choice: SolverChoice.Managed);
        Assert.Equal(new DenseGeneralizedEigen().Name, solution.Algorithm);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void OrthogonalityCheck_EqualsTheLargestEntryOfPhiTMPhiMinusI(bool useNative)
    {
        // Definition check on a deliberately perturbed basis: max |(ΦᵀMΦ − I)_ij| formed directly. Tolerance 1e-13.
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(3), 40));
        var shapes = new DenseGeneralizedEigen().Solve(matrices.Stiffness, matrices.Mass, 15, true).Shapes;
        shapes[3, 4] += 1e-3;
        shapes[10, 0] -= 2e-4;
        var g = shapes.TransposeThisAndMultiply(matrices.Mass * shapes) - Matrix<double>.Build.DenseIdentity(15);
        var expected = g.Enumerate().Max(Math.Abs);
        NumericAssert.Close(expected, ModeChecks.OrthogonalityError(shapes, matrices.Mass, true, useNative), Tolerance.Abs(1e-13), "orthogonality error");
    }
}
