using SimdVector = System.Numerics.Vector;
using Simd = System.Numerics.Vector<double>;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Storage;

namespace ModalChain.Core.Solvers;

/// <summary>Quality figures of a set of mode shapes that cost no more than the shapes themselves.</summary>
public static class ModeChecks
{
    /// <summary>max |(Φᵀ M Φ − I)_ij| over the n×m shapes Φ.</summary>
    /// <remarks>
    /// For a diagonal M the Gram matrix of B = M^½ Φ is formed, one triangle only: n·m²/2 multiply-adds, by BLAS dsyrk
    /// when a native library is loaded and by vectorised dot products of the contiguous columns otherwise. A full M
    /// takes Φᵀ (M Φ).
    /// </remarks>
    public static double OrthogonalityError(Matrix<double> shapes, Matrix<double> mass, bool massIsDiagonal) =>
        OrthogonalityError(shapes, mass, massIsDiagonal, NativeLapack.IsAvailable);

    /// <summary>As the public overload, with the native BLAS path allowed or not (tests check both).</summary>
    internal static double OrthogonalityError(Matrix<double> shapes, Matrix<double> mass, bool massIsDiagonal, bool useNative)
    {
        ArgumentNullException.ThrowIfNull(shapes);
        ArgumentNullException.ThrowIfNull(mass);
        var n = shapes.RowCount;
        var m = shapes.ColumnCount;
        if (!massIsDiagonal)
        {
            var g = shapes.TransposeThisAndMultiply(mass * shapes);
            var worstFull = 0.0;
            for (var i = 0; i < m; i++)
                for (var j = 0; j < m; j++)
                    worstFull = Math.Max(worstFull, Math.Abs(g[i, j] - (i == j ? 1 : 0)));
            return worstFull;
        }

        var b = shapes.Storage is DenseColumnMajorMatrixStorage<double> dense ? (double[])dense.Data.Clone() : shapes.ToColumnMajorArray();
        var root = new double[n];
        for (var i = 0; i < n; i++) root[i] = Math.Sqrt(mass[i, i]);
        for (var j = 0; j < m; j++)
            for (var i = 0; i < n; i++) b[i + j * n] *= root[i];

        if (useNative && NativeLapack.IsAvailable && (long)m * m <= Array.MaxLength)
        {
            var gram = new double[m * m];
            NativeLapack.GramLower(n, m, b, gram);
            var worst = 0.0;
            for (var j = 0; j < m; j++)
                for (var i = j; i < m; i++)
                    worst = Math.Max(worst, Math.Abs(gram[i + j * m] - (i == j ? 1 : 0)));
            return worst;
        }

        var worstPerColumn = new double[m];
        Parallel.For(0, m, j =>
        {
            var cj = new ReadOnlySpan<double>(b, j * n, n);
            var worst = 0.0;
            for (var i = j; i < m; i++)
            {
                var d = Dot(new ReadOnlySpan<double>(b, i * n, n), cj);
                worst = Math.Max(worst, Math.Abs(d - (i == j ? 1 : 0)));
            }
            worstPerColumn[j] = worst;
        });
        return worstPerColumn.DefaultIfEmpty(0).Max();
    }

    private static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        var sum = Simd.Zero;
        var i = 0;
        var width = Simd.Count;
        for (; i <= x.Length - width; i += width)
            sum += new Simd(x.Slice(i, width)) * new Simd(y.Slice(i, width));
        var total = SimdVector.Sum(sum);
        for (; i < x.Length; i++) total += x[i] * y[i];
        return total;
    }
}
