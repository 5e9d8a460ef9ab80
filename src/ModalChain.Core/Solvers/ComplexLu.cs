using System.Numerics;

namespace ModalChain.Core.Solvers;

/// <summary>Dense complex LU factorisation with partial pivoting, in place on a caller-owned row-major buffer.</summary>
/// <remarks>
/// P A = L U by Gaussian elimination with row pivoting (Golub &amp; Van Loan, Matrix Computations, 4th ed., §3.4).
/// Cost n³/3 complex multiply-adds. No allocation: the caller owns the matrix, pivot and right-hand-side buffers,
/// so a sweep can factor and solve at every frequency without garbage.
/// </remarks>
public static class ComplexLu
{
    /// <summary>Factors the n×n row-major matrix <paramref name="a"/> in place; returns false when a pivot is exactly zero.</summary>
    /// <param name="a">n·n entries, row-major; overwritten by L (unit lower, below the diagonal) and U.</param>
    /// <param name="n">Order of the matrix.</param>
    /// <param name="pivots">n entries; row i was swapped with row pivots[i].</param>
    public static bool Factor(Span<Complex> a, int n, Span<int> pivots)
    {
        for (var k = 0; k < n; k++)
        {
            var p = k;
            var best = Magnitude1(a[k * n + k]);
            for (var i = k + 1; i < n; i++)
            {
                var v = Magnitude1(a[i * n + k]);
                if (v > best) { best = v; p = i; }
            }
            pivots[k] = p;
            if (best == 0) return false;
            if (p != k)
            {
                var rowK = a.Slice(k * n, n);
                var rowP = a.Slice(p * n, n);
                for (var j = 0; j < n; j++) (rowK[j], rowP[j]) = (rowP[j], rowK[j]);
            }
            var inv = Complex.Reciprocal(a[k * n + k]);
            var pivotRow = a.Slice(k * n + k + 1, n - k - 1);
            for (var i = k + 1; i < n; i++)
            {
                var l = a[i * n + k] * inv;
                a[i * n + k] = l;
                if (l == Complex.Zero) continue;
                var row = a.Slice(i * n + k + 1, n - k - 1);
                for (var j = 0; j < row.Length; j++) row[j] -= l * pivotRow[j];
            }
        }
        return true;
    }

    /// <summary>Solves A x = b in place in <paramref name="b"/> with the factors from <see cref="Factor"/>.</summary>
    public static void Solve(ReadOnlySpan<Complex> lu, int n, ReadOnlySpan<int> pivots, Span<Complex> b)
    {
        for (var k = 0; k < n; k++)
            if (pivots[k] != k) (b[k], b[pivots[k]]) = (b[pivots[k]], b[k]);
        for (var i = 1; i < n; i++)
        {
            var s = b[i];
            var row = lu.Slice(i * n, i);
            for (var j = 0; j < i; j++) s -= row[j] * b[j];
            b[i] = s;
        }
        for (var i = n - 1; i >= 0; i--)
        {
            var s = b[i];
            var row = lu.Slice(i * n, n);
            for (var j = i + 1; j < n; j++) s -= row[j] * b[j];
            b[i] = s / row[i];
        }
    }

    internal static double Magnitude1(Complex z) => Math.Abs(z.Real) + Math.Abs(z.Imaginary);
}
