using Simd = System.Numerics.Vector<double>;

namespace ModalChain.Core.Solvers;

/// <summary>All eigenpairs of a dense symmetric matrix in managed code: Householder tridiagonalisation and the implicit QL method.</summary>
/// <remarks>
/// <para>
/// A = Q T Qᵀ with Q = H₀ H₁ ⋯ H₍ₙ₋₃₎ a product of Householder reflections H_k = I − β v vᵀ (Golub &amp; Van Loan,
/// Matrix Computations, 4th ed., §8.3.1), then T = Z Λ Zᵀ by the implicit QL method with Wilkinson's shift
/// (Bowdler, Martin, Reinsch &amp; Wilkinson, "The QR and QL algorithms for symmetric matrices", Numer. Math. 11,
/// 1968, the tql2 procedure of the Handbook for Automatic Computation; the form follows the public-domain JAMA
/// port [from memory]); the eigenvectors are Q Z, orthonormal to round-off whatever the multiplicities.
/// </para>
/// <para>
/// Two changes of order, not of arithmetic, make it fast on large matrices. The rank-two update of each reflection
/// and the product with the next reflection's vector are done in one pass over the trailing block, so the block is
/// read once per step instead of twice. The plane rotations of the QL sweeps are recorded rather than applied one at
/// a time to the whole of Q (which would stream the n×n matrix through memory once per sweep); they are applied later
/// in their original order to blocks of rows of Q that stay in cache, which gives the same result because each
/// rotation combines two columns row by row. Column operations use SIMD and the blocks run in parallel.
/// </para>
/// </remarks>
internal static class SymmetricEigenManaged
{
    /// <summary>Rotations held before they are applied to the eigenvectors.</summary>
    private const int RotationBatch = 1 << 20;

    /// <summary>Rows of Q per block when the rotations are applied (a block of all columns stays in cache).</summary>
    private const int RowBlock = 32;

    /// <summary>Most QL iterations spent on one eigenvalue before giving up (two or three are usual).</summary>
    private const int MaxIterations = 60;

    /// <summary>Eigenvalues (unsorted) and eigenvectors of the symmetric n×n matrix <paramref name="a"/>.</summary>
    /// <param name="a">Column-major n×n, symmetric (both triangles); destroyed.</param>
    /// <param name="n">Order.</param>
    /// <returns>The eigenvalues and, column-major n×n, the orthonormal eigenvectors in the same order.</returns>
    public static (double[] Values, double[] Vectors) Solve(double[] a, int n)
    {
        ArgumentNullException.ThrowIfNull(a);
        if (n < 1 || a.Length < (long)n * n) throw new ArgumentException($"The buffer does not hold an {n}×{n} matrix.", nameof(a));
        var d = new double[n];
        var e = new double[n];
        var beta = new double[n];
        Tridiagonalise(a, n, d, e, beta);
        var q = AccumulateReflections(a, n, beta);
        Diagonalise(d, e, q, n);
        return (d, q);
    }

    /// <summary>Reduces <paramref name="a"/> to tridiagonal form; the reflection vectors stay below the diagonal of <paramref name="a"/>.</summary>
    private static void Tridiagonalise(double[] a, int n, double[] d, double[] e, double[] beta)
    {
        if (n == 1)
        {
            d[0] = a[0];
            return;
        }
        var p = new double[n];
        var w = new double[n];
        // Reflection of step 0 and its product p = β B v with the trailing block B.
        var b = MakeReflection(a, n, 0, e);
        beta[0] = b;
        d[0] = a[0];
        if (n > 2) Product(a, n, 0, b, p);
        for (var k = 0; k < n - 2; k++)
        {
            // w = p − (β/2)(pᵀv) v for the reflection of step k (v in column k, rows k+1..n-1).
            var m = n - k - 1;
            var v = a.AsSpan(k * n + k + 1, m);
            var bk = beta[k];
            if (bk != 0)
            {
                var half = 0.5 * bk * Dot(p.AsSpan(0, m), v);
                for (var i = 0; i < m; i++) w[i] = p[i] - half * v[i];
            }
            // Column k+1 of the trailing block first: the next reflection is made from it.
            if (bk != 0) RankTwo(a.AsSpan((k + 1) * n + k + 1, m), v, w.AsSpan(0, m), w[0], v[0]);
            d[k + 1] = a[(k + 1) * n + k + 1];
            var next = k + 1 < n - 2 ? MakeReflection(a, n, k + 1, e) : 0;
            if (k + 1 == n - 2) e[n - 2] = a[(n - 2) * n + n - 1];
            beta[k + 1] = next;
            // The other columns: the rank-two update of step k, then each column's part of p for step k+1.
            UpdateAndProduct(a, n, k, bk, w, next, p);
        }
        d[n - 1] = a[(n - 1) * n + n - 1];
        e[n - 1] = 0;
    }

    /// <summary>Makes the reflection that zeroes column k below row k+1; stores v in place, the subdiagonal in e[k]; returns β (0 when none is needed).</summary>
    private static double MakeReflection(double[] a, int n, int k, double[] e)
    {
        var x = a.AsSpan(k * n + k + 1, n - k - 1);
        var tail = x.Length > 1 ? Dot(x[1..], x[1..]) : 0;
        if (tail == 0)
        {
            e[k] = x[0];
            return 0;
        }
        var norm = Math.Sqrt(x[0] * x[0] + tail);
        var alpha = x[0] > 0 ? -norm : norm;
        x[0] -= alpha;
        e[k] = alpha;
        return 2 / (x[0] * x[0] + tail);
    }

    /// <summary>p = β B v for the trailing block of step k (first step only; later steps fuse it with the update).</summary>
    private static void Product(double[] a, int n, int k, double b, double[] p)
    {
        var m = n - k - 1;
        var v = a.AsSpan(k * n + k + 1, m);
        Array.Clear(p, 0, m);
        if (b == 0) return;
        for (var j = 0; j < m; j++) Axpy(b * v[j], a.AsSpan((k + 1 + j) * n + k + 1, m), p.AsSpan(0, m));
    }

    /// <summary>
    /// For columns k+2..n-1: B ← B − v wᵀ − w vᵀ of step k (when <paramref name="b"/> ≠ 0), then p ← β' B' v' of step k+1,
    /// in one pass; the columns are split among threads, each with its own part of p.
    /// </summary>
    private static void UpdateAndProduct(double[] a, int n, int k, double b, double[] w, double bNext, double[] p)
    {
        var m = n - k - 1;          // rows k+1..n-1 of step k
        var columns = m - 1;        // columns k+2..n-1
        var mNext = m - 1;          // rows k+2..n-1 of step k+1
        Array.Clear(p, 0, Math.Max(mNext, 0));
        if (columns <= 0) return;
        var vOffset = k * n + k + 1;
        var vNextOffset = (k + 1) * n + k + 2;
        var parts = columns >= 256 ? Math.Min(Environment.ProcessorCount, 8) : 1;
        if (parts == 1)
        {
            Columns(a, n, k, b, w, bNext, vOffset, vNextOffset, 0, columns, p);
            return;
        }
        var partial = new double[parts][];
        Parallel.For(0, parts, t =>
        {
            var local = new double[mNext];
            Columns(a, n, k, b, w, bNext, vOffset, vNextOffset, t * columns / parts, (t + 1) * columns / parts, local);
            partial[t] = local;
        });
        foreach (var local in partial) Axpy(1, local, p.AsSpan(0, mNext));
    }

    private static void Columns(double[] a, int n, int k, double b, double[] w, double bNext, int vOffset, int vNextOffset,
        int from, int to, double[] p)
    {
        var m = n - k - 1;
        var v = new ReadOnlySpan<double>(a, vOffset, m);
        var wSpan = new ReadOnlySpan<double>(w, 0, m);
        for (var c = from; c < to; c++)
        {
            var j = c + 1;                       // index in step k's rows (column k+1+j of A)
            var column = a.AsSpan((k + 1 + j) * n + k + 1, m);
            if (b != 0) RankTwo(column, v, wSpan, w[j], v[j]);
            if (bNext != 0) Axpy(bNext * a[vNextOffset + c], column[1..], p.AsSpan(0, m - 1));
        }
    }

    /// <summary>column ← column − v·wj − w·vj.</summary>
    private static void RankTwo(Span<double> column, ReadOnlySpan<double> v, ReadOnlySpan<double> w, double wj, double vj)
    {
        var i = 0;
        if (System.Numerics.Vector.IsHardwareAccelerated)
        {
            var width = Simd.Count;
            var sw = new Simd(wj);
            var sv = new Simd(vj);
            for (; i <= column.Length - width; i += width)
            {
                var x = new Simd(column.Slice(i, width)) - new Simd(v.Slice(i, width)) * sw - new Simd(w.Slice(i, width)) * sv;
                x.CopyTo(column.Slice(i, width));
            }
        }
        for (; i < column.Length; i++) column[i] -= v[i] * wj + w[i] * vj;
    }

    /// <summary>Q = H₀ H₁ ⋯ H₍ₙ₋₃₎, formed backwards from the identity (each H_k touches rows and columns k+1.. only).</summary>
    private static double[] AccumulateReflections(double[] a, int n, double[] beta)
    {
        var q = new double[(long)n * n];
        for (var i = 0; i < n; i++) q[i * n + i] = 1;
        for (var k = n - 3; k >= 0; k--)
        {
            var b = beta[k];
            if (b == 0) continue;
            var m = n - k - 1;
            var offset = k * n + k + 1;
            void Column(int j)
            {
                var v = new ReadOnlySpan<double>(a, offset, m);
                var column = q.AsSpan(j * n + k + 1, m);
                Axpy(-b * Dot(v, column), v, column);
            }
            if (m >= 256) Parallel.For(k + 1, n, Column);
            else for (var j = k + 1; j < n; j++) Column(j);
        }
        return q;
    }

    /// <summary>Implicit QL on (d, e), e[i] coupling i and i+1; the rotations are applied to the columns of <paramref name="q"/>.</summary>
    private static void Diagonalise(double[] d, double[] e, double[] q, int n)
    {
        var index = new int[(int)Math.Min(RotationBatch, Math.Max(1L, (long)n * n))];
        var cosines = new double[index.Length];
        var sines = new double[index.Length];
        var recorded = 0;
        void Record(int i, double c, double s)
        {
            if (recorded == index.Length)
            {
                ApplyRotations(q, n, index, cosines, sines, recorded);
                recorded = 0;
            }
            index[recorded] = i;
            cosines[recorded] = c;
            sines[recorded] = s;
            recorded++;
        }

        double f = 0, largest = 0;
        const double eps = 2.220446049250313e-16;
        for (var l = 0; l < n; l++)
        {
            largest = Math.Max(largest, Math.Abs(d[l]) + Math.Abs(e[l]));
            var m = l;
            while (m < n - 1 && Math.Abs(e[m]) > eps * largest) m++;
            if (m > l)
            {
                var iterations = 0;
                do
                {
                    if (++iterations > MaxIterations)
                        throw new NumericalFailureException($"The implicit QL method did not converge on eigenvalue {l + 1} of {n} after {MaxIterations} iterations.");
                    // Wilkinson's shift from the leading 2×2 block.
                    var g = d[l];
                    var p = (d[l + 1] - g) / (2 * e[l]);
                    var r = Hypot(p, 1);
                    if (p < 0) r = -r;
                    d[l] = e[l] / (p + r);
                    d[l + 1] = e[l] * (p + r);
                    var dl1 = d[l + 1];
                    var h = g - d[l];
                    for (var i = l + 2; i < n; i++) d[i] -= h;
                    f += h;

                    p = d[m];
                    double c = 1, c2 = 1, c3 = 1, s = 0, s2 = 0;
                    var el1 = e[l + 1];
                    for (var i = m - 1; i >= l; i--)
                    {
                        c3 = c2;
                        c2 = c;
                        s2 = s;
                        g = c * e[i];
                        h = c * p;
                        r = Hypot(p, e[i]);
                        e[i + 1] = s * r;
                        s = e[i] / r;
                        c = p / r;
                        p = c * d[i] - s * g;
                        d[i + 1] = h + s * (c * g + s * d[i]);
                        Record(i, c, s);
                    }
                    p = -s * s2 * c3 * el1 * e[l] / dl1;
                    e[l] = s * p;
                    d[l] = c * p;
                }
                while (Math.Abs(e[l]) > eps * largest);
            }
            d[l] += f;
            e[l] = 0;
        }
        ApplyRotations(q, n, index, cosines, sines, recorded);
    }

    /// <summary>Applies the recorded rotations in order to blocks of rows: column i+1 ← s·col i + c·col i+1, column i ← c·col i − s·col i+1.</summary>
    private static void ApplyRotations(double[] q, int n, int[] index, double[] cosines, double[] sines, int count)
    {
        if (count == 0) return;
        var blocks = (n + RowBlock - 1) / RowBlock;
        void Block(int block)
        {
            var row = block * RowBlock;
            var rows = Math.Min(RowBlock, n - row);
            for (var r = 0; r < count; r++)
            {
                var i = index[r];
                var c = cosines[r];
                var s = sines[r];
                var x = q.AsSpan(i * n + row, rows);
                var y = q.AsSpan((i + 1) * n + row, rows);
                var t = 0;
                if (System.Numerics.Vector.IsHardwareAccelerated)
                {
                    var width = Simd.Count;
                    var sc = new Simd(c);
                    var ss = new Simd(s);
                    for (; t <= rows - width; t += width)
                    {
                        var xi = new Simd(x.Slice(t, width));
                        var yi = new Simd(y.Slice(t, width));
                        (ss * xi + sc * yi).CopyTo(y.Slice(t, width));
                        (sc * xi - ss * yi).CopyTo(x.Slice(t, width));
                    }
                }
                for (; t < rows; t++)
                {
                    var xi = x[t];
                    var yi = y[t];
                    y[t] = s * xi + c * yi;
                    x[t] = c * xi - s * yi;
                }
            }
        }
        if (blocks > 1 && (long)count * n >= 1 << 20) Parallel.For(0, blocks, Block);
        else for (var b = 0; b < blocks; b++) Block(b);
    }

    private static double Hypot(double a, double b)
    {
        // Scaled, so neither square overflows nor underflows.
        var x = Math.Abs(a);
        var y = Math.Abs(b);
        if (x < y) (x, y) = (y, x);
        if (x == 0) return 0;
        var t = y / x;
        return x * Math.Sqrt(1 + t * t);
    }

    private static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        var i = 0;
        var total = 0.0;
        if (System.Numerics.Vector.IsHardwareAccelerated)
        {
            var sum = Simd.Zero;
            var width = Simd.Count;
            for (; i <= x.Length - width; i += width)
                sum += new Simd(x.Slice(i, width)) * new Simd(y.Slice(i, width));
            total = System.Numerics.Vector.Sum(sum);
        }
        for (; i < x.Length; i++) total += x[i] * y[i];
        return total;
    }

    /// <summary>y ← y + α x.</summary>
    private static void Axpy(double alpha, ReadOnlySpan<double> x, Span<double> y)
    {
        var i = 0;
        if (System.Numerics.Vector.IsHardwareAccelerated)
        {
            var width = Simd.Count;
            var sa = new Simd(alpha);
            for (; i <= x.Length - width; i += width)
                (new Simd(y.Slice(i, width)) + sa * new Simd(x.Slice(i, width))).CopyTo(y.Slice(i, width));
        }
        for (; i < x.Length; i++) y[i] += alpha * x[i];
    }
}
