using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace ModalChain.Core.Solvers;

/// <summary>Sparse Cholesky factorisation P A Pᵀ = L Lᵀ of a symmetric positive definite matrix, ordered by approximate minimum degree.</summary>
/// <remarks>
/// Ordering and the pattern of L come from <see cref="SparseLdltPattern"/> (approximate minimum degree, Amestoy,
/// Davis &amp; Duff, 1996, and the elimination tree; George &amp; Liu, Computer Solution of Large Sparse Positive
/// Definite Systems, 1981, ch. 5). The numeric factorisation is left-looking by columns (George &amp; Liu, ch. 2).
/// A solve is a permuted forward and back substitution, O(nnz(L)), in a scratch buffer owned by the factor: one
/// factor must not be used by two threads at once. A non-positive pivot throws <see cref="NumericalFailureException"/>
/// (the matrix is not positive definite).
/// </remarks>
public sealed class SparseCholesky
{
    private readonly int[] _permutation;   // new index k -> original index
    private readonly int[] _columnStart;   // CSC of L, diagonal first in each column
    private readonly int[] _rows;
    private readonly double[] _values;
    private readonly double[] _scratch;

    private SparseCholesky(int[] permutation, int[] columnStart, int[] rows, double[] values)
    {
        _permutation = permutation;
        _columnStart = columnStart;
        _rows = rows;
        _values = values;
        _scratch = new double[permutation.Length];
    }

    /// <summary>Order of the matrix.</summary>
    public int Size => _permutation.Length;

    /// <summary>Entries of L including its diagonal: a measure of fill.</summary>
    public int FactorNonZeros => _values.Length;

    /// <summary>Factorises <paramref name="matrix"/>, which must be symmetric positive definite.</summary>
    public static SparseCholesky Factor(SymmetricSparseMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        var n = matrix.Size;
        var pattern = SparseLdltPattern.Analyse(matrix);
        var permutation = pattern.Permutation;
        var inverse = pattern.Inverse;
        var columnStart = pattern.ColumnStart;
        var rows = pattern.Rows;
        var rowCount = pattern.RowStart;
        var rowColumns = pattern.RowColumns;
        var rowPositions = pattern.RowPositions;

        var values = new double[rows.Length];
        var work = new double[n];
        for (var j = 0; j < n; j++)
        {
            var (cols, vals) = matrix.Row(permutation[j]);
            var cs = cols.Span;
            var vs = vals.Span;
            for (var q = 0; q < cs.Length; q++)
            {
                var i = inverse[cs[q]];
                if (i >= j) work[i] = vs[q];
            }
            for (var r = rowCount[j]; r < rowCount[j + 1]; r++)
            {
                var k = rowColumns[r];
                var start = rowPositions[r];
                var ljk = values[start];
                for (var p = start; p < columnStart[k + 1]; p++) work[rows[p]] -= values[p] * ljk;
            }
            var pivot = work[j];
            if (!(pivot > 0) || !double.IsFinite(pivot))
                throw new NumericalFailureException(
                    $"The {n}×{n} matrix is not positive definite: pivot {j} (original row {permutation[j]}) is {pivot:G6}.");
            var diagonal = Math.Sqrt(pivot);
            values[columnStart[j]] = diagonal;
            work[j] = 0;
            for (var p = columnStart[j] + 1; p < columnStart[j + 1]; p++)
            {
                values[p] = work[rows[p]] / diagonal;
                work[rows[p]] = 0;
            }
        }

        return new SparseCholesky(permutation, columnStart, rows, values);
    }

    /// <summary>Solves A x = b, writing x into <paramref name="x"/> (which may be the same memory as b); no allocation.</summary>
    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        var n = Size;
        if (b.Length != n || x.Length != n)
            throw new ArgumentException($"The factor is {n}×{n} but b has {b.Length} and x {x.Length} entries.");
        // Index checks are removed by hand in this innermost loop of time stepping; the indices come from the
        // symbolic factorisation, which only produces rows inside 0..n−1.
        ref var y = ref MemoryMarshal.GetArrayDataReference(_scratch);
        ref var perm = ref MemoryMarshal.GetArrayDataReference(_permutation);
        ref var start = ref MemoryMarshal.GetArrayDataReference(_columnStart);
        ref var rows = ref MemoryMarshal.GetArrayDataReference(_rows);
        ref var values = ref MemoryMarshal.GetArrayDataReference(_values);
        for (var k = 0; k < n; k++) Unsafe.Add(ref y, k) = b[Unsafe.Add(ref perm, k)];
        for (var j = 0; j < n; j++)
        {
            var first = Unsafe.Add(ref start, j);
            var end = Unsafe.Add(ref start, j + 1);
            var yj = Unsafe.Add(ref y, j) / Unsafe.Add(ref values, first);
            Unsafe.Add(ref y, j) = yj;
            for (var p = first + 1; p < end; p++) Unsafe.Add(ref y, Unsafe.Add(ref rows, p)) -= Unsafe.Add(ref values, p) * yj;
        }
        for (var j = n - 1; j >= 0; j--)
        {
            var first = Unsafe.Add(ref start, j);
            var end = Unsafe.Add(ref start, j + 1);
            var sum = Unsafe.Add(ref y, j);
            for (var p = first + 1; p < end; p++) sum -= Unsafe.Add(ref values, p) * Unsafe.Add(ref y, Unsafe.Add(ref rows, p));
            Unsafe.Add(ref y, j) = sum / Unsafe.Add(ref values, first);
        }
        for (var k = 0; k < n; k++) x[Unsafe.Add(ref perm, k)] = Unsafe.Add(ref y, k);
    }
}
