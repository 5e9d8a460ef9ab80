using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>The matrix exponential e^A of a dense square matrix by scaling and squaring with a [13/13] Padé approximant.</summary>
/// <remarks>
/// Higham, "The scaling and squaring method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26
/// (2005) 1179–1193, Algorithm 2.3 with degree 13 throughout: A is scaled by 2⁻ˢ so that ‖A‖₁ ≤ θ₁₃ = 5.37,
/// r₁₃(A) = (V − U)⁻¹(V + U) is formed, and squared s times. The lower degrees of the paper only save work on
/// small norms; degree 13 keeps the backward error below the unit round-off for every norm.
/// </remarks>
public static class MatrixExponential
{
    private const double Theta13 = 5.371920351148152;

    private static readonly double[] B =
    [
        64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000,
        10559470521600, 670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1,
    ];

    /// <summary>e^A for a square matrix A (dimensionless, e.g. a state matrix times a time step).</summary>
    public static Matrix<double> Compute(Matrix<double> a)
    {
        ArgumentNullException.ThrowIfNull(a);
        Guard.Square(a.RowCount, a.ColumnCount, nameof(a));
        var n = a.RowCount;
        var norm = a.L1Norm();
        if (!double.IsFinite(norm)) throw new NumericalFailureException($"The {n}×{n} matrix has a non-finite entry; its exponential is undefined.");
        var s = norm > Theta13 ? (int)Math.Ceiling(Math.Log2(norm / Theta13)) : 0;
        var x = Matrix<double>.Build.DenseOfMatrix(a);
        if (s > 0) x = x / Math.Pow(2, s);

        var identity = Matrix<double>.Build.DenseIdentity(n);
        var x2 = x * x;
        var x4 = x2 * x2;
        var x6 = x4 * x2;
        var u = x * (x6 * (B[13] * x6 + B[11] * x4 + B[9] * x2) + B[7] * x6 + B[5] * x4 + B[3] * x2 + B[1] * identity);
        var v = x6 * (B[12] * x6 + B[10] * x4 + B[8] * x2) + B[6] * x6 + B[4] * x4 + B[2] * x2 + B[0] * identity;
        var r = (v - u).LU().Solve(v + u);
        for (var i = 0; i < s; i++) r = r * r;
        return r;
    }
}
