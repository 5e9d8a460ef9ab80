using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

public class SparseCholeskyTests
{
    /// <summary>A seeded random sparse SPD matrix: a graph Laplacian with random weights plus a positive diagonal.</summary>
    internal static Matrix<double> RandomSpd(int n, int extraEdges, int seed)
    {
        var random = new Random(seed);
        var a = Matrix<double>.Build.Dense(n, n);
        void Edge(int i, int j, double w)
        {
            a[i, i] += w; a[j, j] += w; a[i, j] -= w; a[j, i] -= w;
        }
        for (var i = 1; i < n; i++) Edge(i - 1, i, 0.5 + random.NextDouble());
        for (var e = 0; e < extraEdges; e++)
        {
            var i = random.Next(n);
            var j = random.Next(n);
            if (i != j) Edge(i, j, random.NextDouble());
        }
        for (var i = 0; i < n; i++) a[i, i] += 0.01 + random.NextDouble() * (i == 0 ? 1 : 0.1);
        return a;
    }

    [Theory]
    [InlineData(1, 0, 1)]
    [InlineData(12, 5, 2)]
    [InlineData(80, 40, 3)]
    [InlineData(300, 60, 4)]
    public void Solve_MatchesDenseCholesky(int n, int extra, int seed)
    {
        // Reference: Math.NET's dense Cholesky solve of the same matrix (an independent implementation).
        var a = RandomSpd(n, extra, seed);
        var random = new Random(seed + 100);
        var b = Vector<double>.Build.Dense(n, _ => random.NextDouble() - 0.5);
        var expected = a.Cholesky().Solve(b);

        var factor = SparseCholesky.Factor(SymmetricSparseMatrix.From(Matrix<double>.Build.SparseOfMatrix(a)));
        var x = new double[n];
        factor.Solve(b.ToArray(), x);
        NumericAssert.Close(expected.ToArray(), x, Tolerance.Rel(1e-9) with { Absolute = 1e-9 * expected.AbsoluteMaximum() }, "x");
        Assert.True(factor.FactorNonZeros <= n * (n + 1) / 2);
    }

    [Fact]
    public void Chain_HasNoFill()
    {
        // A tridiagonal matrix eliminated from an end has L bidiagonal: 2n − 1 entries (George & Liu 1981, ch. 4).
        const int n = 500;
        var a = RandomSpd(n, 0, 9);
        var factor = SparseCholesky.Factor(SymmetricSparseMatrix.From(a));
        Assert.Equal(2 * n - 1, factor.FactorNonZeros);
    }

    [Fact]
    public void Solve_InPlace_GivesTheSameAnswer()
    {
        var a = RandomSpd(40, 20, 5);
        var factor = SparseCholesky.Factor(SymmetricSparseMatrix.From(a));
        var b = Enumerable.Range(0, 40).Select(i => Math.Sin(i)).ToArray();
        var x = new double[40];
        factor.Solve(b, x);
        factor.Solve(b, b);
        NumericAssert.Close(x, b, Tolerance.Abs(0), "in place");
    }

    [Fact]
    public void IndefiniteMatrix_ThrowsNumericalFailure()
    {
        var a = Matrix<double>.Build.DenseOfArray(new double[,] { { 1, 2 }, { 2, 1 } });
        var e = Assert.Throws<NumericalFailureException>(() => SparseCholesky.Factor(SymmetricSparseMatrix.From(a)));
        Assert.Contains("not positive definite", e.Message);
    }

    [Fact]
    public void Unsymmetric_IsACallerBug()
    {
        var a = Matrix<double>.Build.DenseOfArray(new double[,] { { 2, 1 }, { 0, 2 } });
        Assert.Throws<ArgumentException>(() => SymmetricSparseMatrix.From(a));
    }

    [Fact]
    public void MatrixProducts_MatchDense()
    {
        var a = RandomSpd(30, 15, 8);
        var s = SymmetricSparseMatrix.From(a);
        var x = Enumerable.Range(0, 30).Select(i => Math.Cos(0.3 * i)).ToArray();
        var y = new double[30];
        s.Multiply(x, y);
        var expected = a * Vector<double>.Build.DenseOfArray(x);
        NumericAssert.Close(expected.ToArray(), y, Tolerance.Abs(1e-12), "A x");
        NumericAssert.Close(expected.DotProduct(Vector<double>.Build.DenseOfArray(x)), s.QuadraticForm(x), Tolerance.Rel(1e-12), "xᵀAx");
        NumericAssert.Close(4 * s.QuadraticForm(x), s.QuadraticFormOfSum(x, x), Tolerance.Rel(1e-12), "(2x)ᵀA(2x)");
        NumericAssert.Close(a, s.ToDense(), Tolerance.Abs(0), "dense copy");
    }
}
