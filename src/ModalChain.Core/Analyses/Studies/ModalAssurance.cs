using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Analyses.Studies;

/// <summary>The modal assurance criterion: how alike two mode shapes are, from 0 (orthogonal) to 1 (the same up to scale).</summary>
/// <remarks>
/// Allemang &amp; Brown (1982), "A correlation coefficient for modal vector analysis", Proc. 1st IMAC (citation from memory):
/// MAC(a, b) = (aᵀb)² / ((aᵀa)(bᵀb)). The mass-weighted form replaces each inner product xᵀy by xᵀMy, so that
/// distinct modes of one model score exactly 0 (common practice in model correlation); it is the one used for
/// tracking modes through a study because neighbouring steps have nearly the same M.
/// </remarks>
public static class ModalAssurance
{
    /// <summary>MAC of <paramref name="a"/> and <paramref name="b"/>; with <paramref name="massDiagonal"/> (kg) the mass-weighted form.</summary>
    public static double Criterion(IReadOnlyList<double> a, IReadOnlyList<double> b, IReadOnlyList<double>? massDiagonal = null)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        if (a.Count != b.Count) throw new ArgumentException($"Shapes have {a.Count} and {b.Count} entries.", nameof(b));
        if (massDiagonal is not null && massDiagonal.Count != a.Count) throw new ArgumentException("The mass diagonal must match the shapes.", nameof(massDiagonal));
        double ab = 0, aa = 0, bb = 0;
        for (var i = 0; i < a.Count; i++)
        {
            var w = massDiagonal?[i] ?? 1.0;
            ab += w * a[i] * b[i];
            aa += w * a[i] * a[i];
            bb += w * b[i] * b[i];
        }
        return aa > 0 && bb > 0 ? ab * ab / (aa * bb) : 0;
    }

    /// <summary>The mass-weighted MAC of <paramref name="a"/> and <paramref name="b"/> with the full mass matrix <paramref name="mass"/> (kg, kg·m on rotations): (aᵀMb)² / ((aᵀMa)(bᵀMb)).</summary>
    /// <remarks>For any DOF vector: translations and rotations alike, with a body's inertia coupling its rotations.</remarks>
    public static double Criterion(IReadOnlyList<double> a, IReadOnlyList<double> b, Matrix<double> mass)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(mass);
        if (a.Count != b.Count) throw new ArgumentException($"Shapes have {a.Count} and {b.Count} entries.", nameof(b));
        if (mass.RowCount != a.Count || mass.ColumnCount != a.Count) throw new ArgumentException($"M is {mass.RowCount}×{mass.ColumnCount} but the shapes have {a.Count} entries.", nameof(mass));
        var va = Vector<double>.Build.DenseOfEnumerable(a);
        var vb = Vector<double>.Build.DenseOfEnumerable(b);
        var ma = mass * va;
        var mb = mass * vb;
        return Weighted(va * mb, va * ma, vb * mb);
    }

    /// <summary>The matrix MAC[i, j] between <paramref name="first"/>[i] and <paramref name="second"/>[j], weighted by the full mass matrix <paramref name="mass"/>.</summary>
    public static Matrix<double> Matrix(IReadOnlyList<IReadOnlyList<double>> first, IReadOnlyList<IReadOnlyList<double>> second, Matrix<double> mass)
    {
        ArgumentNullException.ThrowIfNull(first);
        ArgumentNullException.ThrowIfNull(second);
        ArgumentNullException.ThrowIfNull(mass);
        var a = first.Select(x => Vector<double>.Build.DenseOfEnumerable(x)).ToArray();
        var b = second.Select(x => Vector<double>.Build.DenseOfEnumerable(x)).ToArray();
        if (a.Concat(b).Any(v => v.Count != mass.RowCount) || mass.RowCount != mass.ColumnCount)
            throw new ArgumentException($"M is {mass.RowCount}×{mass.ColumnCount}, which does not match every shape.", nameof(mass));
        // M b once per shape: the matrix costs one product per shape, not one per pair.
        var mb = b.Select(v => mass * v).ToArray();
        var aa = a.Select(v => v * (mass * v)).ToArray();
        var bb = b.Select((v, j) => v * mb[j]).ToArray();
        return Matrix<double>.Build.Dense(a.Length, b.Length, (i, j) => Weighted(a[i] * mb[j], aa[i], bb[j]));
    }

    private static double Weighted(double ab, double aa, double bb) => aa > 0 && bb > 0 ? ab * ab / (aa * bb) : 0;

    /// <summary>The matrix MAC[i, j] between shapes <paramref name="first"/>[i] and <paramref name="second"/>[j].</summary>
    public static Matrix<double> Matrix(IReadOnlyList<IReadOnlyList<double>> first, IReadOnlyList<IReadOnlyList<double>> second,
        IReadOnlyList<double>? massDiagonal = null) =>
        Matrix<double>.Build.Dense(first.Count, second.Count, (i, j) => Criterion(first[i], second[j], massDiagonal));
}
