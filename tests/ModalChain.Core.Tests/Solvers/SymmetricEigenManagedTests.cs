using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>The managed Householder + implicit QL eigen solve against closed forms, identities and Math.NET's own solver.</summary>
public class SymmetricEigenManagedTests
{
    private static (double[] Values, Matrix<double> Vectors) Solve(Matrix<double> a)
    {
        var n = a.RowCount;
        var (values, vectors) = SymmetricEigenManaged.Solve(a.ToColumnMajorArray(), n);
        return (values, Matrix<double>.Build.Dense(n, n, vectors));
    }

    private static void AssertEigenpairs(Matrix<double> a, double[] values, Matrix<double> vectors, double tolerance, string what)
    {
        // Identities: A V = V Λ and Vᵀ V = I, scaled by the largest eigenvalue magnitude.
        var n = a.RowCount;
        var scale = Math.Max(1, values.Max(Math.Abs));
        var residual = a * vectors - vectors * Matrix<double>.Build.DenseOfDiagonalArray(values);
        NumericAssert.Small(residual.Enumerate().Max(Math.Abs) / scale, tolerance, $"{what}: max |AV − VΛ| / max|λ|");
        var gram = vectors.TransposeThisAndMultiply(vectors) - Matrix<double>.Build.DenseIdentity(n);
        NumericAssert.Small(gram.Enumerate().Max(Math.Abs), tolerance, $"{what}: max |VᵀV − I|");
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(10)]
    [InlineData(300)]
    public void SecondDifferenceMatrix_MatchesTheClosedForm(int n)
    {
        // tridiag(−1, 2, −1) of order n: λ_k = 2 − 2 cos(kπ/(n+1)), k = 1..n (closed form; e.g. Strang, Introduction
        // to Applied Mathematics, §1.5 [from memory]; common practice). Tolerance 1e-12 absolute (λ ≤ 4).
        var a = Matrix<double>.Build.Dense(n, n, (i, j) => i == j ? 2 : Math.Abs(i - j) == 1 ? -1 : 0);
        var (values, vectors) = Solve(a);
        var expected = Enumerable.Range(1, n).Select(k => 2 - 2 * Math.Cos(k * Math.PI / (n + 1))).ToArray();
        NumericAssert.Close(expected, values.Order().ToArray(), Tolerance.Abs(1e-12), $"n = {n}: eigenvalues");
        AssertEigenpairs(a, values, vectors, 1e-12, $"n = {n}");
    }

    [Theory]
    [InlineData(5, 1)]
    [InlineData(64, 2)]
    [InlineData(257, 3)]
    [InlineData(600, 4)]
    public void RandomSymmetricMatrix_AgreesWithMathNet(int n, int seed)
    {
        // Reference library: Math.NET's symmetric Evd. Seeded entries in [−1, 1]. Tolerances 1e-11 relative to the spectrum.
        var random = new Random(seed);
        var b = Matrix<double>.Build.Dense(n, n, (_, _) => 2 * random.NextDouble() - 1);
        var a = (b + b.Transpose()) * 0.5;
        var (values, vectors) = Solve(a);
        var reference = a.Evd(Symmetricity.Symmetric).EigenValues.Select(c => c.Real).Order().ToArray();
        var scale = reference.Max(Math.Abs);
        NumericAssert.Close(reference, values.Order().ToArray(), Tolerance.Abs(1e-12 * scale * Math.Sqrt(n)), $"n = {n}: eigenvalues against Math.NET");
        AssertEigenpairs(a, values, vectors, 1e-11, $"n = {n}");
    }

    [Fact]
    public void RepeatedEigenvalues_KeepOrthonormalVectors()
    {
        // Q diag(1, 1, 1, 5, 5, 9) Qᵀ with Q orthogonal (from Math.NET's QR of a seeded matrix): a triple and a double
        // eigenvalue, where the vectors are defined only as subspaces; the identities must still hold.
        var random = new Random(7);
        var q = Matrix<double>.Build.Dense(6, 6, (_, _) => random.NextDouble()).QR().Q;
        var a = q * Matrix<double>.Build.DenseOfDiagonalArray([1, 1, 1, 5, 5, 9]) * q.Transpose();
        a = (a + a.Transpose()) * 0.5;
        var (values, vectors) = Solve(a);
        NumericAssert.Close(new double[] { 1, 1, 1, 5, 5, 9 }, values.Order().ToArray(), Tolerance.Abs(1e-13), "eigenvalues");
        AssertEigenpairs(a, values, vectors, 1e-13, "repeated");
    }

    [Fact]
    public void AlreadyDiagonalOrTridiagonal_NeedsNoReflection()
    {
        // Diagonal input: the eigenvalues are the diagonal, the vectors the unit vectors up to sign (common practice).
        var a = Matrix<double>.Build.DenseOfDiagonalArray([3, -1, 4, 1, -5]);
        var (values, vectors) = Solve(a);
        NumericAssert.Close(new double[] { -5, -1, 1, 3, 4 }, values.Order().ToArray(), Tolerance.Abs(0), "eigenvalues");
        AssertEigenpairs(a, values, vectors, 0, "diagonal");
    }
}
