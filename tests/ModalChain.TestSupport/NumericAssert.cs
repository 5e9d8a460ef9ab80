using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using Xunit.Sdk;

namespace ModalChain.TestSupport;

/// <summary>A tolerance: a value passes when |actual − expected| ≤ Absolute + Relative·|expected|.</summary>
/// <param name="Absolute">Absolute part, in the quantity's unit.</param>
/// <param name="Relative">Relative part, as a fraction of |expected|.</param>
public readonly record struct Tolerance(double Absolute, double Relative)
{
    public static Tolerance Abs(double absolute) => new(absolute, 0);
    public static Tolerance Rel(double relative) => new(0, relative);
    public bool Accepts(double expected, double actual) =>
        !double.IsNaN(actual) && Math.Abs(actual - expected) <= Absolute + Relative * Math.Abs(expected);
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"abs {Absolute:G3} + rel {Relative:G3}");
}

/// <summary>The one numeric assertion helper of the test suite: scalars, vectors and matrices, naming the failing index.</summary>
public static class NumericAssert
{
    public static void Close(double expected, double actual, Tolerance tolerance, string? what = null)
    {
        if (!tolerance.Accepts(expected, actual))
            throw new XunitException(string.Create(CultureInfo.InvariantCulture,
                $"{what ?? "value"}: expected {expected:R}, got {actual:R} (difference {actual - expected:G4}, tolerance {tolerance})"));
    }

    public static void Close(IReadOnlyList<double> expected, IReadOnlyList<double> actual, Tolerance tolerance, string? what = null)
    {
        if (expected.Count != actual.Count)
            throw new XunitException($"{what ?? "vector"}: expected length {expected.Count}, got {actual.Count}");
        for (var i = 0; i < expected.Count; i++)
            Close(expected[i], actual[i], tolerance, $"{what ?? "vector"}[{i}]");
    }

    public static void Close(Vector<double> expected, Vector<double> actual, Tolerance tolerance, string? what = null) =>
        Close(expected.ToArray(), actual.ToArray(), tolerance, what);

    public static void Close(Matrix<double> expected, Matrix<double> actual, Tolerance tolerance, string? what = null)
    {
        if (expected.RowCount != actual.RowCount || expected.ColumnCount != actual.ColumnCount)
            throw new XunitException($"{what ?? "matrix"}: expected {expected.RowCount}×{expected.ColumnCount}, got {actual.RowCount}×{actual.ColumnCount}");
        for (var i = 0; i < expected.RowCount; i++)
            for (var j = 0; j < expected.ColumnCount; j++)
                Close(expected[i, j], actual[i, j], tolerance, $"{what ?? "matrix"}[{i},{j}]");
    }

    /// <summary>Asserts |actual| ≤ bound (e.g. a residual or an orthogonality error).</summary>
    public static void Small(double actual, double bound, string? what = null)
    {
        if (!(Math.Abs(actual) <= bound))
            throw new XunitException(string.Create(CultureInfo.InvariantCulture, $"{what ?? "value"}: |{actual:G4}| exceeds {bound:G3}"));
    }
}
