using System.Runtime.CompilerServices;

namespace ModalChain.Core;

/// <summary>Precondition checks for caller bugs; input problems are reported by the reader, not here.</summary>
internal static class Guard
{
    public static void Finite(double value, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!double.IsFinite(value)) throw new ArgumentOutOfRangeException(name, value, "Value must be finite.");
    }

    public static void Positive(double value, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!(value > 0) || !double.IsFinite(value)) throw new ArgumentOutOfRangeException(name, value, "Value must be positive and finite.");
    }

    public static void NonNegative(double value, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!(value >= 0) || !double.IsFinite(value)) throw new ArgumentOutOfRangeException(name, value, "Value must be non-negative and finite.");
    }

    public static void Square(int rows, int columns, string name)
    {
        if (rows != columns) throw new ArgumentException($"{name} must be square but is {rows}×{columns}.", name);
    }

    /// <summary>Checks the arguments every generalized eigen solver takes and returns n: K and M square, the same size, 1 ≤ count ≤ n.</summary>
    public static int EigenProblem(MathNet.Numerics.LinearAlgebra.Matrix<double> stiffness, MathNet.Numerics.LinearAlgebra.Matrix<double> mass, int count)
    {
        ArgumentNullException.ThrowIfNull(stiffness);
        ArgumentNullException.ThrowIfNull(mass);
        Square(stiffness.RowCount, stiffness.ColumnCount, "K");
        Square(mass.RowCount, mass.ColumnCount, "M");
        SameSize(stiffness.RowCount, mass.RowCount, "K", "M");
        var n = stiffness.RowCount;
        if (count < 1 || count > n) throw new ArgumentOutOfRangeException(nameof(count), count, $"count must be in 1..{n}.");
        return n;
    }

    public static void SameSize(int a, int b, string nameA, string nameB)
    {
        if (a != b) throw new ArgumentException($"{nameA} is {a}×{a} but {nameB} is {b}×{b}.", nameB);
    }

    public static void Permutation(IReadOnlyList<int> order, int count, string name)
    {
        if (order.Count != count || order.Distinct().Count() != count || order.Any(i => i < 0 || i >= count))
            throw new ArgumentException($"{name} must be a permutation of 0..{count - 1}.", name);
    }
}
