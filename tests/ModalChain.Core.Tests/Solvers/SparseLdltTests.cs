using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

public class SparseLdltTests
{
    [Theory]
    [InlineData(1, 0, 1)]
    [InlineData(12, 5, 2)]
    [InlineData(80, 40, 3)]
    [InlineData(300, 60, 4)]
    public void Ordering_IsAPermutation(int n, int extra, int seed)
    {
        var a = SymmetricSparseMatrix.From(SparseCholeskyTests.RandomSpd(n, extra, seed));
        var pattern = SparseLdltPattern.Analyse(a);
        Assert.Equal(Enumerable.Range(0, n), pattern.Permutation.Order());
    }

    [Theory]
    [InlineData(1, 0, 1)]
    [InlineData(12, 5, 2)]
    [InlineData(80, 40, 3)]
    [InlineData(300, 60, 4)]
    public void Solve_MatchesDenseLu(int n, int extra, int seed)
    {
        // Reference: Math.NET's dense LU solve of the same matrix (an independent implementation).
        var a = SparseCholeskyTests.RandomSpd(n, extra, seed);
        var random = new Random(seed + 100);
        var b = Vector<double>.Build.Dense(n, _ => random.NextDouble() - 0.5);
        var expected = a.LU().Solve(b);
        var factor = SparseLdlt.Factor(SymmetricSparseMatrix.From(a));
        var x = new double[n];
        factor.Solve(b.ToArray(), x);
        NumericAssert.Close(expected.ToArray(), x, Tolerance.Abs(1e-9), "x");
        Assert.Equal(0, factor.NegativePivots);
    }
}
