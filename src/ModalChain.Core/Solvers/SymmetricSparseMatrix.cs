using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>An immutable symmetric sparse matrix in compressed rows (both triangles stored) with an allocation-free product.</summary>
/// <remarks>
/// Both triangles are stored so that y = A x is one pass over the rows, the form time stepping needs every step.
/// Symmetry is checked at construction to a relative tolerance of 1e-12 of the largest entry.
/// </remarks>
public sealed class SymmetricSparseMatrix
{
    private readonly int[] _rowStart;
    private readonly int[] _columns;
    private readonly double[] _values;
    private readonly int[] _rowsWithEntries;
    private readonly double[] _diagonal;

    private SymmetricSparseMatrix(int size, int[] rowStart, int[] columns, double[] values)
    {
        Size = size;
        _rowStart = rowStart;
        _columns = columns;
        _values = values;
        _rowsWithEntries = [.. Enumerable.Range(0, size).Where(i => rowStart[i + 1] > rowStart[i])];
        _diagonal = new double[size];
        for (var i = 0; i < size; i++)
            for (var p = rowStart[i]; p < rowStart[i + 1]; p++)
                if (columns[p] == i) _diagonal[i] = values[p];
    }

    /// <summary>Number of rows (= columns).</summary>
    public int Size { get; }

    /// <summary>Number of stored entries (both triangles).</summary>
    public int NonZeros => _values.Length;

    /// <summary>The rows (= columns, by symmetry) that hold at least one entry; a product reads only these entries of its argument.</summary>
    public ReadOnlySpan<int> ActiveIndices => _rowsWithEntries;

    /// <summary>True when no entry lies off the diagonal.</summary>
    public bool IsDiagonal { get; private init; }

    /// <summary>Copies the non-zero entries of a square symmetric <paramref name="matrix"/> (dense or sparse).</summary>
    public static SymmetricSparseMatrix From(Matrix<double> matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        Guard.Square(matrix.RowCount, matrix.ColumnCount, nameof(matrix));
        var entries = matrix.EnumerateIndexed(Zeros.AllowSkip).Where(e => e.Item3 != 0).ToList();
        return FromEntries(matrix.RowCount, entries);
    }

    /// <summary>The linear combination Σ wᵢ Aᵢ of matrices of the same size, e.g. an effective stiffness a₀M + a₁C + K.</summary>
    public static SymmetricSparseMatrix Combine(params ReadOnlySpan<(double Weight, Matrix<double> Matrix)> terms)
    {
        if (terms.Length == 0) throw new ArgumentException("At least one term is needed.", nameof(terms));
        var n = terms[0].Matrix.RowCount;
        var sums = new Dictionary<(int, int), double>();
        foreach (var (w, m) in terms)
        {
            ArgumentNullException.ThrowIfNull(m);
            Guard.Square(m.RowCount, m.ColumnCount, nameof(terms));
            Guard.SameSize(n, m.RowCount, "the first matrix", "a later matrix");
            if (w == 0) continue;
            foreach (var (i, j, v) in m.EnumerateIndexed(Zeros.AllowSkip))
                if (v != 0) sums[(i, j)] = sums.GetValueOrDefault((i, j)) + w * v;
        }
        return FromEntries(n, [.. sums.Select(kv => (kv.Key.Item1, kv.Key.Item2, kv.Value))]);
    }

    /// <summary>A diagonal matrix with the given entries.</summary>
    public static SymmetricSparseMatrix Diagonal(ReadOnlySpan<double> diagonal)
    {
        var entries = new List<(int, int, double)>(diagonal.Length);
        for (var i = 0; i < diagonal.Length; i++) entries.Add((i, i, diagonal[i]));
        return FromEntries(diagonal.Length, entries);
    }

    private static SymmetricSparseMatrix FromEntries(int n, List<(int Row, int Column, double Value)> entries)
    {
        var scale = entries.Count == 0 ? 0 : entries.Max(e => Math.Abs(e.Value));
        var lookup = new Dictionary<(int, int), double>(entries.Count);
        foreach (var (r, c, v) in entries) lookup[(r, c)] = v;
        foreach (var (r, c, v) in entries)
        {
            var mirror = lookup.GetValueOrDefault((c, r));
            if (Math.Abs(mirror - v) > 1e-12 * scale)
                throw new ArgumentException($"The matrix is not symmetric: entry ({r},{c}) is {v} but ({c},{r}) is {mirror}.", nameof(entries));
        }

        entries.Sort((a, b) => a.Row != b.Row ? a.Row.CompareTo(b.Row) : a.Column.CompareTo(b.Column));
        var rowStart = new int[n + 1];
        foreach (var e in entries) rowStart[e.Row + 1]++;
        for (var i = 0; i < n; i++) rowStart[i + 1] += rowStart[i];
        var columns = entries.Select(e => e.Column).ToArray();
        var values = entries.Select(e => e.Value).ToArray();
        return new SymmetricSparseMatrix(n, rowStart, columns, values) { IsDiagonal = entries.All(e => e.Row == e.Column) };
    }

    /// <summary>Entry (row, column); O(row length).</summary>
    public double this[int row, int column]
    {
        get
        {
            for (var p = _rowStart[row]; p < _rowStart[row + 1]; p++)
                if (_columns[p] == column) return _values[p];
            return 0.0;
        }
    }

    /// <summary>The stored entries of row <paramref name="row"/>: column indices and values.</summary>
    public (ReadOnlyMemory<int> Columns, ReadOnlyMemory<double> Values) Row(int row)
    {
        var start = _rowStart[row];
        var length = _rowStart[row + 1] - start;
        return (_columns.AsMemory(start, length), _values.AsMemory(start, length));
    }

    /// <summary>Writes y = A x into <paramref name="y"/>; no allocation.</summary>
    public void Multiply(ReadOnlySpan<double> x, Span<double> y)
    {
        y.Clear();
        MultiplyAdd(1.0, x, y);
    }

    /// <summary>Adds w·A x to <paramref name="y"/>; no allocation.</summary>
    public void MultiplyAdd(double weight, ReadOnlySpan<double> x, Span<double> y)
    {
        CheckLength(x, y);
        ref var xr = ref MemoryMarshal.GetReference(x);
        if (IsDiagonal)
        {
            for (var i = 0; i < Size; i++) y[i] += weight * _diagonal[i] * Unsafe.Add(ref xr, i);
            return;
        }
        foreach (var i in _rowsWithEntries)
            y[i] += weight * RowDot(i, ref xr);
    }

    /// <summary>The quadratic form xᵀ A x; no allocation.</summary>
    public double QuadraticForm(ReadOnlySpan<double> x)
    {
        CheckLength(x, x);
        ref var xr = ref MemoryMarshal.GetReference(x);
        var total = 0.0;
        if (IsDiagonal)
        {
            for (var i = 0; i < Size; i++) total += _diagonal[i] * x[i] * x[i];
            return total;
        }
        foreach (var i in _rowsWithEntries) total += x[i] * RowDot(i, ref xr);
        return total;
    }

    /// <summary>The quadratic form (x + y)ᵀ A (x + y) without forming x + y; no allocation.</summary>
    public double QuadraticFormOfSum(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        CheckLength(x, y);
        ref var xr = ref MemoryMarshal.GetReference(x);
        ref var yr = ref MemoryMarshal.GetReference(y);
        var total = 0.0;
        foreach (var i in _rowsWithEntries)
        {
            var sum = 0.0;
            for (var p = _rowStart[i]; p < _rowStart[i + 1]; p++)
            {
                var c = _columns[p];
                sum += _values[p] * (Unsafe.Add(ref xr, c) + Unsafe.Add(ref yr, c));
            }
            total += (x[i] + y[i]) * sum;
        }
        return total;
    }

    /// <summary>Σ_p A[i, col_p] x[col_p] over the stored entries of row i; the column indices are in range by construction.</summary>
    private double RowDot(int i, ref double x)
    {
        var sum = 0.0;
        ref var columns = ref MemoryMarshal.GetArrayDataReference(_columns);
        ref var values = ref MemoryMarshal.GetArrayDataReference(_values);
        var end = _rowStart[i + 1];
        for (var p = _rowStart[i]; p < end; p++) sum += Unsafe.Add(ref values, p) * Unsafe.Add(ref x, Unsafe.Add(ref columns, p));
        return sum;
    }

    private void CheckLength(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != Size || y.Length != Size)
            throw new ArgumentException($"The matrix is {Size}×{Size} but the vectors have {x.Length} and {y.Length} entries.");
    }

    /// <summary>A dense copy (for tests and small models).</summary>
    public Matrix<double> ToDense()
    {
        var m = Matrix<double>.Build.Dense(Size, Size);
        for (var i = 0; i < Size; i++)
            for (var p = _rowStart[i]; p < _rowStart[i + 1]; p++) m[i, _columns[p]] = _values[p];
        return m;
    }
}
