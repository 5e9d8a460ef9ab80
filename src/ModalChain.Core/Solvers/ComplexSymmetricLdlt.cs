using System.Numerics;

namespace ModalChain.Core.Solvers;

/// <summary>Numeric LDLᵀ of a complex symmetric matrix A = Σ w_t A_t (real symmetric A_t, complex w_t) on a fixed symbolic pattern.</summary>
/// <remarks>
/// <para>The dynamic stiffness of a harmonic sweep, Z(ω) = K(1+iη) − ω²M + iωC, is complex symmetric (Zᵀ = Z, not
/// Hermitian) and keeps the sparsity pattern of K, M and C at every frequency. So the ordering and the pattern of L
/// (<see cref="SparseLdltPattern"/>, approximate minimum degree) are computed once per sweep and each frequency costs
/// one numeric factorisation Z = P L D Lᵀ Pᵀ (transposes, not conjugate transposes) and two triangular solves.</para>
/// <para>No pivoting, as in <see cref="SparseLdlt"/>: complex symmetric LDLᵀ without pivoting is the usual direct solve
/// of damped structural dynamic stiffness (its pivots stay away from zero except at an undamped resonance); a pivot
/// below 10⁻¹³ of its column's original diagonal magnitude is reported as a failure at that frequency, as the dense
/// solve reports a singular matrix.</para>
/// </remarks>
public sealed class ComplexSymmetricLdlt
{
    private const double PivotTolerance = 1e-13;
    private readonly SparseLdltPattern _pattern;
    private readonly Complex[] _values;   // L below the diagonal; the diagonal slot of each column holds D
    private readonly Complex[] _work;

    /// <summary>A factor workspace on <paramref name="pattern"/>: allocate one per thread and refactorise it per frequency.</summary>
    public ComplexSymmetricLdlt(SparseLdltPattern pattern)
    {
        ArgumentNullException.ThrowIfNull(pattern);
        _pattern = pattern;
        _values = new Complex[pattern.Rows.Length];
        _work = new Complex[pattern.Size];
    }

    /// <summary>Order of the matrix.</summary>
    public int Size => _pattern.Size;

    /// <summary>Factorises Σ w_t A_t in place of the previous factor; false when a pivot is (near) zero (the matrix is singular there).</summary>
    /// <param name="terms">The weights and matrices; every matrix's pattern must lie within the pattern analysed.</param>
    public bool Factor(ReadOnlySpan<(Complex Weight, SymmetricSparseMatrix Matrix)> terms)
    {
        var n = Size;
        var permutation = _pattern.Permutation;
        var inverse = _pattern.Inverse;
        var columnStart = _pattern.ColumnStart;
        var rows = _pattern.Rows;
        var rowStart = _pattern.RowStart;
        var rowColumns = _pattern.RowColumns;
        var rowPositions = _pattern.RowPositions;
        var values = _values;
        var work = _work;
        Array.Clear(values);
        for (var j = 0; j < n; j++)
        {
            var original = permutation[j];
            var magnitude = 0.0;
            foreach (var (weight, matrix) in terms)
            {
                if (weight == Complex.Zero) continue;
                var (cols, vals) = matrix.Row(original);
                var cs = cols.Span;
                var vs = vals.Span;
                for (var q = 0; q < cs.Length; q++)
                {
                    var i = inverse[cs[q]];
                    if (i < j) continue;
                    work[i] += weight * vs[q];
                    if (i == j) magnitude += (weight * vs[q]).Magnitude;
                }
            }
            for (var r = rowStart[j]; r < rowStart[j + 1]; r++)
            {
                var k = rowColumns[r];
                var start = rowPositions[r];
                var scaled = values[start] * values[columnStart[k]];
                var end = columnStart[k + 1];
                for (var p = start; p < end; p++) work[rows[p]] -= values[p] * scaled;
            }
            var pivot = work[j];
            if (!double.IsFinite(pivot.Real) || !double.IsFinite(pivot.Imaginary) || pivot.Magnitude <= PivotTolerance * magnitude || pivot == Complex.Zero)
            {
                Array.Clear(work);
                return false;
            }
            values[columnStart[j]] = pivot;
            work[j] = Complex.Zero;
            var inversePivot = 1 / pivot;
            for (var p = columnStart[j] + 1; p < columnStart[j + 1]; p++)
            {
                values[p] = work[rows[p]] * inversePivot;
                work[rows[p]] = Complex.Zero;
            }
        }
        return true;
    }

    /// <summary>Solves A x = b in place in <paramref name="x"/> (b on entry, x on return) with the last factor; no allocation.</summary>
    public void Solve(Span<Complex> x)
    {
        var n = Size;
        if (x.Length != n) throw new ArgumentException($"The factor is {n}×{n} but the vector has {x.Length} entries.", nameof(x));
        var permutation = _pattern.Permutation;
        var start = _pattern.ColumnStart;
        var rows = _pattern.Rows;
        var values = _values;
        var y = _work;
        for (var k = 0; k < n; k++) y[k] = x[permutation[k]];
        for (var j = 0; j < n; j++)
        {
            var yj = y[j];
            if (yj == Complex.Zero) continue;
            for (var p = start[j] + 1; p < start[j + 1]; p++) y[rows[p]] -= values[p] * yj;
        }
        for (var j = 0; j < n; j++) y[j] /= values[start[j]];
        for (var j = n - 1; j >= 0; j--)
        {
            var sum = y[j];
            for (var p = start[j] + 1; p < start[j + 1]; p++) sum -= values[p] * y[rows[p]];
            y[j] = sum;
        }
        for (var k = 0; k < n; k++)
        {
            x[permutation[k]] = y[k];
            y[k] = Complex.Zero;
        }
    }
}
