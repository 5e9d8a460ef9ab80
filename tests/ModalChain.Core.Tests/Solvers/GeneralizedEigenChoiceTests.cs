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
    public void Auto_KeepsAFewModesOfAMidSizeModelDenseWhenNativeIsThere() =>
        Assert.IsType<LapackEigen>(GeneralizedEigen.Choose(1000, 20, SolverChoice.Auto, 3000, nativeAvailable: true));

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
