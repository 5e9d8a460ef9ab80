using System.Numerics;

namespace ModalChain.Core.Solvers;

/// <summary>Unitary reduction A = Q H Qᴴ of a complex square matrix to upper Hessenberg form, and shifted solves with it.</summary>
/// <remarks>
/// Householder reflections (Golub &amp; Van Loan, Matrix Computations, 4th ed., §7.4.3), cost about 10n³/3. Once A is
/// reduced, (sI − A)⁻¹ b = Q (sI − H)⁻¹ Qᴴ b costs O(n²) per shift s instead of O(n³): the classical way to reuse
/// one factorisation over a whole frequency response (Laub, IEEE Trans. Automatic Control 26(2), 1981, 407–408).
/// </remarks>
public sealed class ComplexHessenberg
{
    private ComplexHessenberg(int n, Complex[] h, Complex[] q)
    {
        Order = n;
        H = h;
        Q = q;
    }

    /// <summary>Order n of the matrix.</summary>
    public int Order { get; }

    /// <summary>H, n·n row-major, zero below the first subdiagonal.</summary>
    public Complex[] H { get; }

    /// <summary>Q, n·n row-major, unitary.</summary>
    public Complex[] Q { get; }

    /// <summary>Reduces the n×n row-major matrix <paramref name="a"/> (left unchanged).</summary>
    public static ComplexHessenberg Reduce(ReadOnlySpan<Complex> a, int n)
    {
        if (a.Length != n * n) throw new ArgumentException($"Expected {n * n} entries for a {n}×{n} matrix, got {a.Length}.", nameof(a));
        var h = a.ToArray();
        var q = new Complex[n * n];
        for (var i = 0; i < n; i++) q[i * n + i] = Complex.One;
        var v = new Complex[n];
        var w = new Complex[n];
        for (var k = 0; k < n - 2; k++)
        {
            // Householder vector for x = H[k+1.., k]: P = I − 2vvᴴ maps x onto a multiple of e1.
            var norm2 = 0.0;
            for (var i = k + 1; i < n; i++) norm2 += Norm2(h[i * n + k]);
            var norm = Math.Sqrt(norm2);
            if (norm == 0) continue;
            var x0 = h[(k + 1) * n + k];
            var phase = x0 == Complex.Zero ? Complex.One : x0 / x0.Magnitude;
            var alpha = -phase * norm;
            for (var i = 0; i < n; i++) v[i] = Complex.Zero;
            for (var i = k + 1; i < n; i++) v[i] = h[i * n + k];
            v[k + 1] -= alpha;
            var vNorm2 = 0.0;
            for (var i = k + 1; i < n; i++) vNorm2 += Norm2(v[i]);
            if (vNorm2 == 0) continue;
            var scale = 1 / Math.Sqrt(vNorm2);
            for (var i = k + 1; i < n; i++) v[i] *= scale;

            // H ← P H: rows k+1.. change; w_j = Σ_i conj(v_i) H_ij.
            for (var j = k; j < n; j++) w[j] = Complex.Zero;
            for (var i = k + 1; i < n; i++)
            {
                var cv = Complex.Conjugate(v[i]);
                var row = h.AsSpan(i * n, n);
                for (var j = k; j < n; j++) w[j] += cv * row[j];
            }
            for (var i = k + 1; i < n; i++)
            {
                var f = 2 * v[i];
                var row = h.AsSpan(i * n, n);
                for (var j = k; j < n; j++) row[j] -= f * w[j];
            }
            // H ← H P and Q ← Q P: columns k+1.. change; for each row r, s = Σ_j H_rj v_j.
            ApplyRight(h, n, k + 1, v);
            ApplyRight(q, n, k + 1, v);
            for (var i = k + 2; i < n; i++) h[i * n + k] = Complex.Zero;
        }
        return new ComplexHessenberg(n, h, q);
    }

    /// <summary>Solves (s·I − H) y = g in place in <paramref name="g"/>; <paramref name="work"/> holds n·n + n entries and is overwritten.</summary>
    /// <remarks>
    /// Gaussian elimination with partial pivoting between neighbouring rows, O(n²). Rows of sI − H are formed as they
    /// are reached, so H is read once and each row of U is written once (no copy of the whole matrix per shift).
    /// </remarks>
    /// <returns>False when the shifted matrix is exactly singular.</returns>
    public bool SolveShifted(Complex s, Span<Complex> g, Span<Complex> work)
    {
        var n = Order;
        var hs = H.AsSpan();
        var u = work[..(n * n)];
        var carried = work.Slice(n * n, n);   // the row still to be eliminated, entries k..n−1
        // Row 0 of sI − H.
        {
            var h0 = hs.Slice(0, n);
            for (var j = 0; j < n; j++) carried[j] = -h0[j];
            carried[0] += s;
        }
        for (var k = 0; k < n - 1; k++)
        {
            // Next row of sI − H: −H[k+1, k..] with s on its diagonal.
            var next = hs.Slice((k + 1) * n + k, n - k);
            var sub = -next[0];
            var c = carried.Slice(k, n - k);
            var urow = u.Slice(k * n + k, n - k);
            if (ComplexLu.Magnitude1(sub) > ComplexLu.Magnitude1(c[0]))
            {
                // The fresh row becomes U's row k; the carried row is eliminated against it.
                if (sub == Complex.Zero) return false;
                var l = c[0] / sub;
                urow[0] = sub;
                urow[1] = -next[1] + s;
                c[1] -= l * urow[1];
                for (var j = 2; j < urow.Length; j++) urow[j] = -next[j];
                ComplexKernels.SubtractScaled(c[2..], l, urow[2..]);
                (g[k], g[k + 1]) = (g[k + 1], g[k]);
                g[k + 1] -= l * g[k];
            }
            else
            {
                if (c[0] == Complex.Zero) return false;
                var l = sub / c[0];
                urow[0] = c[0];
                for (var j = 1; j < urow.Length; j++) urow[j] = c[j];
                var diagonal = -next[1] + s;
                c[1] = diagonal - l * urow[1];
                ComplexKernels.NegateSubtractScaled(c[2..], next[2..], l, urow[2..]);
                g[k + 1] -= l * g[k];
            }
        }
        u[(n - 1) * n + n - 1] = carried[n - 1];
        for (var i = n - 1; i >= 0; i--)
        {
            var row = u.Slice(i * n, n);
            var sum = g[i] - ComplexKernels.Dot(row[(i + 1)..], g[(i + 1)..]);
            if (row[i] == Complex.Zero) return false;
            g[i] = sum / row[i];
        }
        return true;
    }

    private static void ApplyRight(Complex[] a, int n, int from, Complex[] v)
    {
        for (var r = 0; r < n; r++)
        {
            var row = a.AsSpan(r * n, n);
            var s = Complex.Zero;
            for (var j = from; j < n; j++) s += row[j] * v[j];
            if (s == Complex.Zero) continue;
            s *= 2;
            for (var j = from; j < n; j++) row[j] -= s * Complex.Conjugate(v[j]);
        }
    }

    private static double Norm2(Complex z) => z.Real * z.Real + z.Imaginary * z.Imaginary;
}
