using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace ModalChain.Core.Solvers;

/// <summary>The ordering and the sparsity pattern of L for a symmetric pattern: computed once, reused for every shift.</summary>
/// <remarks>
/// The ordering is <see cref="ApproximateMinimumDegree"/>. The pattern of column j of L is the pattern of A below the
/// diagonal in column j joined with the patterns of the columns whose parent in the elimination tree is j
/// (George &amp; Liu, 1981, §5.1), the parent of a column being its first off-diagonal row.
/// </remarks>
public sealed class SparseLdltPattern
{
    internal SparseLdltPattern(int[] permutation, int[] inverse, int[] columnStart, int[] rows)
    {
        Permutation = permutation;
        Inverse = inverse;
        ColumnStart = columnStart;
        Rows = rows;

        // For each row j, the columns k < j with L[j,k] ≠ 0 and the position of that entry in column k.
        var n = permutation.Length;
        var rowCount = new int[n + 1];
        for (var k = 0; k < n; k++)
            for (var p = columnStart[k] + 1; p < columnStart[k + 1]; p++) rowCount[rows[p] + 1]++;
        for (var j = 0; j < n; j++) rowCount[j + 1] += rowCount[j];
        RowStart = rowCount;
        RowColumns = new int[rowCount[n]];
        RowPositions = new int[rowCount[n]];
        var fill = (int[])rowCount.Clone();
        for (var k = 0; k < n; k++)
            for (var p = columnStart[k] + 1; p < columnStart[k + 1]; p++)
            {
                var slot = fill[rows[p]]++;
                RowColumns[slot] = k;
                RowPositions[slot] = p;
            }
    }

    internal int[] Permutation { get; }      // new index k -> original index
    internal int[] Inverse { get; }          // original index -> new index
    internal int[] ColumnStart { get; }      // CSC of L, the diagonal slot first in each column
    internal int[] Rows { get; }
    internal int[] RowStart { get; }
    internal int[] RowColumns { get; }
    internal int[] RowPositions { get; }

    /// <summary>Order of the matrix.</summary>
    public int Size => Permutation.Length;

    /// <summary>Entries of L including its diagonal: the fill the ordering leaves.</summary>
    public long FactorNonZeros => Rows.Length;

    /// <summary>Σⱼ cⱼ² over the columns of L, cⱼ the entries below the diagonal: the multiply-adds of one factorisation, to leading order.</summary>
    public double FactorOperations
    {
        get
        {
            var sum = 0.0;
            for (var j = 0; j < Size; j++)
            {
                double below = ColumnStart[j + 1] - ColumnStart[j] - 1;
                sum += below * below;
            }
            return sum;
        }
    }

    /// <summary>Orders the union of the patterns of <paramref name="matrices"/> (all of one size) and finds the pattern of L.</summary>
    public static SparseLdltPattern Analyse(params ReadOnlySpan<SymmetricSparseMatrix> matrices)
    {
        if (matrices.Length == 0) throw new ArgumentException("At least one matrix is needed.", nameof(matrices));
        var n = matrices[0].Size;
        foreach (var m in matrices) Guard.SameSize(n, m.Size, "the first matrix", "a later matrix");

        var (rowStart, columns) = UnionPattern(n, matrices);
        var permutation = ApproximateMinimumDegree.Order(n, rowStart, columns);
        return WithOrder(n, rowStart, columns, permutation);
    }

    /// <summary>The pattern of L for a given elimination order of a compressed-row pattern.</summary>
    internal static SparseLdltPattern WithOrder(int n, int[] rowStart, int[] columns, int[] permutation)
    {
        var inverse = new int[n];
        for (var k = 0; k < n; k++) inverse[permutation[k]] = k;

        var columnStart = new int[n + 1];
        var rows = new List<int>(Math.Max(16, 4 * columns.Length));
        var firstChild = new int[n];
        var nextSibling = new int[n];
        Array.Fill(firstChild, -1);
        var mark = new int[n];
        Array.Fill(mark, -1);
        var column = new List<int>(64);
        for (var j = 0; j < n; j++)
        {
            column.Clear();
            columnStart[j] = rows.Count;   // also closes column j − 1, which a child read below may be
            mark[j] = j;
            var original = permutation[j];
            for (var p = rowStart[original]; p < rowStart[original + 1]; p++)
            {
                var i = inverse[columns[p]];
                if (i > j && mark[i] != j) { mark[i] = j; column.Add(i); }
            }
            for (var c = firstChild[j]; c >= 0; c = nextSibling[c])
                for (var p = columnStart[c] + 1; p < columnStart[c + 1]; p++)
                {
                    var i = rows[p];
                    if (i > j && mark[i] != j) { mark[i] = j; column.Add(i); }
                }
            column.Sort();
            rows.Add(j);
            rows.AddRange(column);
            if (column.Count > 0)
            {
                var parent = column[0];
                nextSibling[j] = firstChild[parent];
                firstChild[parent] = j;
            }
        }
        columnStart[n] = rows.Count;
        return new SparseLdltPattern(permutation, inverse, columnStart, [.. rows]);
    }

    private static (int[] RowStart, int[] Columns) UnionPattern(int n, ReadOnlySpan<SymmetricSparseMatrix> matrices)
    {
        var rowStart = new int[n + 1];
        var columns = new List<int>(matrices[0].NonZeros + n);
        var mark = new int[n];
        Array.Fill(mark, -1);
        for (var i = 0; i < n; i++)
        {
            foreach (var m in matrices)
                foreach (var c in m.Row(i).Columns.Span)
                    if (mark[c] != i) { mark[c] = i; columns.Add(c); }
            rowStart[i + 1] = columns.Count;
        }
        return (rowStart, [.. columns]);
    }
}

/// <summary>Sparse factorisation P A Pᵀ = L D Lᵀ of a symmetric matrix (L unit lower triangular, D diagonal) and its inertia.</summary>
/// <remarks>
/// Left-looking by columns on a pattern from <see cref="SparseLdltPattern"/>, with no pivoting: the pivots are taken
/// in the order given, which is safe for definite matrices and for the shifted K − σM of an eigen solve whose shift
/// lies away from an eigenvalue. A pivot smaller than 10⁻¹³ of the magnitudes of its column's diagonal entries (|aⱼⱼ| + |w bⱼⱼ|) is refused
/// (<see cref="NumericalFailureException"/>); the caller moves the shift. By Sylvester's law of inertia the number of
/// negative entries of D equals the number of negative eigenvalues of A; for A = K − σM with M positive definite this
/// is the number of eigenvalues of K φ = λ M φ below σ (the Sturm sequence property; Grimes, Lewis &amp; Simon, 1994, §2).
/// A solve costs O(nnz(L)) and uses a scratch buffer owned by the factor: one factor must not be used by two threads at once.
/// </remarks>
public sealed class SparseLdlt
{
    private const double PivotTolerance = 1e-13;
    private readonly SparseLdltPattern _pattern;
    private readonly double[] _values;   // L below the diagonal; the diagonal slot of each column holds D
    private readonly double[] _scratch;

    private SparseLdlt(SparseLdltPattern pattern, double[] values, int negativePivots)
    {
        _pattern = pattern;
        _values = values;
        _scratch = new double[pattern.Size];
        NegativePivots = negativePivots;
    }

    /// <summary>Order of the matrix.</summary>
    public int Size => _pattern.Size;

    /// <summary>Number of negative entries of D: the number of negative eigenvalues of the matrix factorised.</summary>
    public int NegativePivots { get; }

    /// <summary>Entries of L including its diagonal.</summary>
    public long FactorNonZeros => _pattern.FactorNonZeros;

    /// <summary>The smallest |D_jj|: near zero when the matrix factorised is (near-)singular.</summary>
    public double SmallestPivotMagnitude()
    {
        var smallest = double.PositiveInfinity;
        var start = _pattern.ColumnStart;
        for (var j = 0; j < Size; j++) smallest = Math.Min(smallest, Math.Abs(_values[start[j]]));
        return smallest;
    }

    /// <summary>Factorises <paramref name="matrix"/> with its own ordering.</summary>
    public static SparseLdlt Factor(SymmetricSparseMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        return Factor(SparseLdltPattern.Analyse(matrix), matrix, 0, null);
    }

    /// <summary>Factorises A + w B (e.g. K − σM with w = −σ) on a pattern analysed for both.</summary>
    /// <param name="pattern">The ordering and pattern of L, from <see cref="SparseLdltPattern.Analyse"/> of a and b.</param>
    /// <param name="a">The first matrix.</param>
    /// <param name="weight">The factor w on <paramref name="b"/>.</param>
    /// <param name="b">The second matrix, or null for A alone.</param>
    public static SparseLdlt Factor(SparseLdltPattern pattern, SymmetricSparseMatrix a, double weight, SymmetricSparseMatrix? b)
    {
        ArgumentNullException.ThrowIfNull(pattern);
        ArgumentNullException.ThrowIfNull(a);
        var n = pattern.Size;
        Guard.SameSize(n, a.Size, "the pattern", "A");
        if (b is not null) Guard.SameSize(n, b.Size, "the pattern", "B");

        var permutation = pattern.Permutation;
        var inverse = pattern.Inverse;
        var columnStart = pattern.ColumnStart;
        var rows = pattern.Rows;
        var rowStart = pattern.RowStart;
        var rowColumns = pattern.RowColumns;
        var rowPositions = pattern.RowPositions;
        var values = new double[rows.Length];
        var work = new double[n];
        var negative = 0;
        for (var j = 0; j < n; j++)
        {
            Scatter(a, 1.0, permutation[j], inverse, j, work);
            if (b is not null && weight != 0) Scatter(b, weight, permutation[j], inverse, j, work);
            var original = Math.Abs(a[permutation[j], permutation[j]]) + (b is null ? 0 : Math.Abs(weight * b[permutation[j], permutation[j]]));
            for (var r = rowStart[j]; r < rowStart[j + 1]; r++)
            {
                var k = rowColumns[r];
                var start = rowPositions[r];
                var ljk = values[start];
                var scaled = ljk * values[columnStart[k]];
                UpdateColumn(values, rows, start, columnStart[k + 1], scaled, work);
            }
            var pivot = work[j];
            if (!double.IsFinite(pivot) || Math.Abs(pivot) <= PivotTolerance * original || pivot == 0)
                throw new NumericalFailureException(
                    $"The {n}×{n} shifted matrix has a (near-)zero pivot: pivot {j} (original row {permutation[j]}) is {pivot:G6} against diagonal entries of magnitude {original:G6}.");
            if (pivot < 0) negative++;
            values[columnStart[j]] = pivot;
            work[j] = 0;
            var inversePivot = 1 / pivot;
            for (var p = columnStart[j] + 1; p < columnStart[j + 1]; p++)
            {
                values[p] = work[rows[p]] * inversePivot;
                work[rows[p]] = 0;
            }
        }
        return new SparseLdlt(pattern, values, negative);
    }

    private static void Scatter(SymmetricSparseMatrix m, double weight, int originalColumn, int[] inverse, int j, double[] work)
    {
        var (cols, vals) = m.Row(originalColumn);
        var cs = cols.Span;
        var vs = vals.Span;
        for (var q = 0; q < cs.Length; q++)
        {
            var i = inverse[cs[q]];
            if (i >= j) work[i] += weight * vs[q];
        }
    }

    /// <summary>work[rows[p]] −= values[p]·s for p in start..end−1; indices come from the symbolic pattern, so in range.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void UpdateColumn(double[] values, int[] rows, int start, int end, double scaled, double[] work)
    {
        ref var v = ref MemoryMarshal.GetArrayDataReference(values);
        ref var r = ref MemoryMarshal.GetArrayDataReference(rows);
        ref var w = ref MemoryMarshal.GetArrayDataReference(work);
        for (var p = start; p < end; p++) Unsafe.Add(ref w, Unsafe.Add(ref r, p)) -= Unsafe.Add(ref v, p) * scaled;
    }

    /// <summary>Solves A x = b, writing x into <paramref name="x"/> (which may be the same memory as b); no allocation.</summary>
    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        var n = Size;
        if (b.Length != n || x.Length != n)
            throw new ArgumentException($"The factor is {n}×{n} but b has {b.Length} and x {x.Length} entries.");
        ref var y = ref MemoryMarshal.GetArrayDataReference(_scratch);
        ref var perm = ref MemoryMarshal.GetArrayDataReference(_pattern.Permutation);
        ref var start = ref MemoryMarshal.GetArrayDataReference(_pattern.ColumnStart);
        ref var rows = ref MemoryMarshal.GetArrayDataReference(_pattern.Rows);
        ref var values = ref MemoryMarshal.GetArrayDataReference(_values);
        for (var k = 0; k < n; k++) Unsafe.Add(ref y, k) = b[Unsafe.Add(ref perm, k)];
        for (var j = 0; j < n; j++)
        {
            var yj = Unsafe.Add(ref y, j);
            if (yj == 0) continue;
            var end = Unsafe.Add(ref start, j + 1);
            for (var p = Unsafe.Add(ref start, j) + 1; p < end; p++) Unsafe.Add(ref y, Unsafe.Add(ref rows, p)) -= Unsafe.Add(ref values, p) * yj;
        }
        for (var j = 0; j < n; j++) Unsafe.Add(ref y, j) /= Unsafe.Add(ref values, Unsafe.Add(ref start, j));
        for (var j = n - 1; j >= 0; j--)
        {
            var end = Unsafe.Add(ref start, j + 1);
            var sum = Unsafe.Add(ref y, j);
            for (var p = Unsafe.Add(ref start, j) + 1; p < end; p++) sum -= Unsafe.Add(ref values, p) * Unsafe.Add(ref y, Unsafe.Add(ref rows, p));
            Unsafe.Add(ref y, j) = sum;
        }
        for (var k = 0; k < n; k++) x[Unsafe.Add(ref perm, k)] = Unsafe.Add(ref y, k);
    }
}
