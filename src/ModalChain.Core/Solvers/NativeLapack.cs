using System.Runtime.InteropServices;

namespace ModalChain.Core.Solvers;

/// <summary>The few LAPACK and BLAS routines ModalChain calls in a native library found at run time, when one is installed.</summary>
/// <remarks>
/// The Fortran symbols (<c>dsyevd_</c>, <c>dsygvd_</c>, <c>dsyevr_</c>, <c>dsygvx_</c>, <c>dsyrk_</c>) are looked up in
/// <c>libopenblas.so.0</c> first (Debian's libopenblas0-pthread, multi-threaded), then in <c>liblapack.so.3</c>. Fortran
/// passes every argument by reference, and each CHARACTER argument adds a hidden length passed by value after the
/// last argument (gfortran's convention, a size_t since gfortran 8). Matrices are column-major, as Math.NET stores
/// its dense matrices. Nothing here is required: when no library loads, <see cref="IsAvailable"/> is false and the
/// managed solvers are used.
/// </remarks>
public static unsafe class NativeLapack
{
    /// <summary>The library names tried, in order.</summary>
    public static readonly IReadOnlyList<string> Candidates = ["libopenblas.so.0", "liblapack.so.3", "libopenblas.dylib", "libopenblas.dll"];

    private static readonly Lazy<Routines?> Loaded = new(Load, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>True when a library with every routine needed was loaded.</summary>
    public static bool IsAvailable => Loaded.Value is not null;

    /// <summary>The library that was loaded, or null.</summary>
    public static string? LibraryName => Loaded.Value?.Name;

    private sealed class Routines
    {
        public required string Name { get; init; }
        public required nint Dsyevd { get; init; }
        public required nint Dsygvd { get; init; }
        public required nint Dsyevr { get; init; }
        public required nint Dsygvx { get; init; }
        public required nint Dsyrk { get; init; }
    }

    private static Routines? Load()
    {
        foreach (var name in Candidates)
        {
            if (!NativeLibrary.TryLoad(name, out var handle)) continue;
            if (NativeLibrary.TryGetExport(handle, "dsyevd_", out var syevd)
                && NativeLibrary.TryGetExport(handle, "dsygvd_", out var sygvd)
                && NativeLibrary.TryGetExport(handle, "dsyevr_", out var syevr)
                && NativeLibrary.TryGetExport(handle, "dsygvx_", out var sygvx)
                && NativeLibrary.TryGetExport(handle, "dsyrk_", out var syrk))
                return new Routines { Name = name, Dsyevd = syevd, Dsygvd = sygvd, Dsyevr = syevr, Dsygvx = sygvx, Dsyrk = syrk };
            NativeLibrary.Free(handle);
        }
        return null;
    }

    private static Routines Library => Loaded.Value
        ?? throw new InvalidOperationException($"No native LAPACK library could be loaded (tried {string.Join(", ", Candidates)}).");

    /// <summary>All eigenpairs of the symmetric n×n matrix <paramref name="a"/> (column-major, overwritten by the eigenvectors), by divide and conquer (dsyevd).</summary>
    /// <returns>LAPACK's INFO (0 on success).</returns>
    public static int SymmetricEigen(int n, double[] a, double[] eigenValues)
    {
        CheckSizes(n, a, eigenValues);
        var f = (delegate* unmanaged<byte*, byte*, int*, double*, int*, double*, double*, int*, int*, int*, int*, nint, nint, void>)Library.Dsyevd;
        byte jobz = (byte)'V', uplo = (byte)'L';
        int lda = Math.Max(1, n), info = 0, lwork = -1, liwork = -1, iworkQuery = 0;
        double workQuery = 0;
        fixed (double* pa = a, pw = eigenValues)
        {
            f(&jobz, &uplo, &n, pa, &lda, pw, &workQuery, &lwork, &iworkQuery, &liwork, &info, 1, 1);
            if (info != 0) return info;
            lwork = (int)workQuery;
            liwork = iworkQuery;
            var work = new double[Math.Max(1, lwork)];
            var iwork = new int[Math.Max(1, liwork)];
            fixed (double* pwork = work)
            fixed (int* piwork = iwork)
                f(&jobz, &uplo, &n, pa, &lda, pw, pwork, &lwork, piwork, &liwork, &info, 1, 1);
        }
        return info;
    }

    /// <summary>All eigenpairs of K x = λ M x (itype 1) with symmetric K and positive definite M, by divide and conquer (dsygvd).</summary>
    /// <remarks><paramref name="k"/> is overwritten by M-orthonormal eigenvectors, <paramref name="m"/> by its Cholesky factor.</remarks>
    /// <returns>LAPACK's INFO (0 on success; n + i when the leading minor of order i of M is not positive definite).</returns>
    public static int GeneralizedEigen(int n, double[] k, double[] m, double[] eigenValues)
    {
        CheckSizes(n, k, eigenValues);
        CheckSizes(n, m, eigenValues);
        var f = (delegate* unmanaged<int*, byte*, byte*, int*, double*, int*, double*, int*, double*, double*, int*, int*, int*, int*, nint, nint, void>)Library.Dsygvd;
        byte jobz = (byte)'V', uplo = (byte)'L';
        int itype = 1, lda = Math.Max(1, n), info = 0, lwork = -1, liwork = -1, iworkQuery = 0;
        double workQuery = 0;
        fixed (double* pk = k, pm = m, pw = eigenValues)
        {
            f(&itype, &jobz, &uplo, &n, pk, &lda, pm, &lda, pw, &workQuery, &lwork, &iworkQuery, &liwork, &info, 1, 1);
            if (info != 0) return info;
            lwork = (int)workQuery;
            liwork = iworkQuery;
            var work = new double[Math.Max(1, lwork)];
            var iwork = new int[Math.Max(1, liwork)];
            fixed (double* pwork = work)
            fixed (int* piwork = iwork)
                f(&itype, &jobz, &uplo, &n, pk, &lda, pm, &lda, pw, pwork, &lwork, piwork, &liwork, &info, 1, 1);
        }
        return info;
    }

    /// <summary>The lowest <paramref name="count"/> eigenpairs of the symmetric matrix <paramref name="a"/> by relatively robust representations (dsyevr, RANGE = 'I').</summary>
    /// <param name="n">Order.</param>
    /// <param name="a">Column-major n×n, destroyed.</param>
    /// <param name="count">How many of the lowest pairs.</param>
    /// <param name="eigenValues">Length n; the first <paramref name="count"/> entries are set, ascending.</param>
    /// <param name="vectors">Column-major n×count, the orthonormal eigenvectors.</param>
    /// <returns>LAPACK's INFO (0 on success).</returns>
    public static int SymmetricEigenLowest(int n, double[] a, int count, double[] eigenValues, double[] vectors)
    {
        CheckSizes(n, a, eigenValues);
        if (count < 1 || count > n || vectors.Length < (long)n * count) throw new ArgumentException("count or the vector buffer does not fit n.", nameof(count));
        var f = (delegate* unmanaged<byte*, byte*, byte*, int*, double*, int*, double*, double*, int*, int*, double*, int*, double*, double*, int*, int*, double*, int*, int*, int*, int*, nint, nint, nint, void>)Library.Dsyevr;
        byte jobz = (byte)'V', range = (byte)'I', uplo = (byte)'L';
        int lda = Math.Max(1, n), il = 1, iu = count, found = 0, info = 0, lwork = -1, liwork = -1, iworkQuery = 0;
        double vl = 0, vu = 0, abstol = 0, workQuery = 0;
        var support = new int[2 * Math.Max(1, count)];
        fixed (double* pa = a, pw = eigenValues, pz = vectors)
        fixed (int* ps = support)
        {
            f(&jobz, &range, &uplo, &n, pa, &lda, &vl, &vu, &il, &iu, &abstol, &found, pw, pz, &lda, ps, &workQuery, &lwork, &iworkQuery, &liwork, &info, 1, 1, 1);
            if (info != 0) return info;
            lwork = (int)workQuery;
            liwork = iworkQuery;
            var work = new double[Math.Max(1, lwork)];
            var iwork = new int[Math.Max(1, liwork)];
            fixed (double* pwork = work)
            fixed (int* piwork = iwork)
                f(&jobz, &range, &uplo, &n, pa, &lda, &vl, &vu, &il, &iu, &abstol, &found, pw, pz, &lda, ps, pwork, &lwork, piwork, &liwork, &info, 1, 1, 1);
        }
        if (info == 0 && found != count) return -1000 - found;
        return info;
    }

    /// <summary>The lowest <paramref name="count"/> eigenpairs of K x = λ M x (itype 1) by bisection and inverse iteration (dsygvx, RANGE = 'I').</summary>
    /// <remarks><paramref name="k"/> and <paramref name="m"/> are destroyed; <paramref name="vectors"/> (n×count) receives M-orthonormal vectors.</remarks>
    /// <returns>LAPACK's INFO (0 on success).</returns>
    public static int GeneralizedEigenLowest(int n, double[] k, double[] m, int count, double[] eigenValues, double[] vectors)
    {
        CheckSizes(n, k, eigenValues);
        CheckSizes(n, m, eigenValues);
        if (count < 1 || count > n || vectors.Length < (long)n * count) throw new ArgumentException("count or the vector buffer does not fit n.", nameof(count));
        var f = (delegate* unmanaged<int*, byte*, byte*, byte*, int*, double*, int*, double*, int*, double*, double*, int*, int*, double*, int*, double*, double*, int*, double*, int*, int*, int*, int*, nint, nint, nint, void>)Library.Dsygvx;
        byte jobz = (byte)'V', range = (byte)'I', uplo = (byte)'L';
        int itype = 1, lda = Math.Max(1, n), il = 1, iu = count, found = 0, info = 0, lwork = -1;
        double vl = 0, vu = 0, abstol = 0, workQuery = 0;
        var iwork = new int[5 * Math.Max(1, n)];
        var fail = new int[Math.Max(1, n)];
        fixed (double* pk = k, pm = m, pw = eigenValues, pz = vectors)
        fixed (int* piwork = iwork, pfail = fail)
        {
            f(&itype, &jobz, &range, &uplo, &n, pk, &lda, pm, &lda, &vl, &vu, &il, &iu, &abstol, &found, pw, pz, &lda, &workQuery, &lwork, piwork, pfail, &info, 1, 1, 1);
            if (info != 0) return info;
            lwork = Math.Max((int)workQuery, 8 * Math.Max(1, n));
            var work = new double[lwork];
            fixed (double* pwork = work)
                f(&itype, &jobz, &range, &uplo, &n, pk, &lda, pm, &lda, &vl, &vu, &il, &iu, &abstol, &found, pw, pz, &lda, pwork, &lwork, piwork, pfail, &info, 1, 1, 1);
        }
        if (info == 0 && found != count) return -1000 - found;
        return info;
    }

    /// <summary>The lower triangle of C = Aᵀ A for the column-major rows×columns matrix A (dsyrk, UPLO = 'L', TRANS = 'T').</summary>
    /// <param name="rows">Rows of A.</param>
    /// <param name="columns">Columns of A, the order of C.</param>
    /// <param name="a">A, column-major.</param>
    /// <param name="c">columns×columns, column-major; its lower triangle is overwritten.</param>
    public static void GramLower(int rows, int columns, double[] a, double[] c)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(c);
        if (a.Length < (long)rows * columns || c.Length < (long)columns * columns) throw new ArgumentException("Buffers do not fit the sizes.", nameof(a));
        var f = (delegate* unmanaged<byte*, byte*, int*, int*, double*, double*, int*, double*, double*, int*, nint, nint, void>)Library.Dsyrk;
        byte uplo = (byte)'L', trans = (byte)'T';
        int nn = columns, kk = rows, lda = Math.Max(1, rows), ldc = Math.Max(1, columns);
        double alpha = 1, beta = 0;
        fixed (double* pa = a, pc = c)
            f(&uplo, &trans, &nn, &kk, &alpha, pa, &lda, &beta, pc, &ldc, 1, 1);
    }

    private static void CheckSizes(int n, double[] a, double[] w)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(w);
        if (n < 1 || a.Length < (long)n * n || w.Length < n) throw new ArgumentException($"Buffers do not fit order {n}.", nameof(a));
    }
}
