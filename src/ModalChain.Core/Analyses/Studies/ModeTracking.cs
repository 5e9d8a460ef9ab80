namespace ModalChain.Core.Analyses.Studies;

/// <summary>Pairs the modes of one step of a study with those of the next by shape, so identities survive frequency crossings.</summary>
/// <remarks>
/// The pairing maximises shape likeness greedily: the pair with the largest MAC (Allemang &amp; Brown 1982) is taken
/// first, then the largest among the remaining rows and columns, and so on. Ties are broken by the smaller frequency
/// change, then by index, so the result is deterministic.
/// </remarks>
public static class ModeTracking
{
    /// <summary>For each previous shape i, the index of the next shape that continues it, and the MAC of that pair.</summary>
    /// <param name="previous">Shapes at the earlier step (one list per mode).</param>
    /// <param name="previousHz">Their frequencies in Hz.</param>
    /// <param name="next">Shapes at the later step.</param>
    /// <param name="nextHz">Their frequencies in Hz.</param>
    /// <param name="massDiagonal">Lumped masses in kg for the mass-weighted MAC, or null for the plain one.</param>
    public static (int[] Next, double[] Mac) Pair(
        IReadOnlyList<IReadOnlyList<double>> previous, IReadOnlyList<double> previousHz,
        IReadOnlyList<IReadOnlyList<double>> next, IReadOnlyList<double> nextHz,
        IReadOnlyList<double>? massDiagonal)
    {
        ArgumentNullException.ThrowIfNull(previous);
        ArgumentNullException.ThrowIfNull(next);
        if (previous.Count != next.Count) throw new ArgumentException($"Steps have {previous.Count} and {next.Count} modes.", nameof(next));
        return Greedy(ModalAssurance.Matrix(previous, next, massDiagonal), previousHz, nextHz);
    }

    /// <summary>As the other overload, with the MAC weighted by the full mass matrix <paramref name="mass"/> (kg; any DOF vector, rotations and coupled inertia included).</summary>
    public static (int[] Next, double[] Mac) Pair(
        IReadOnlyList<IReadOnlyList<double>> previous, IReadOnlyList<double> previousHz,
        IReadOnlyList<IReadOnlyList<double>> next, IReadOnlyList<double> nextHz,
        MathNet.Numerics.LinearAlgebra.Matrix<double> mass)
    {
        ArgumentNullException.ThrowIfNull(previous);
        ArgumentNullException.ThrowIfNull(next);
        if (previous.Count != next.Count) throw new ArgumentException($"Steps have {previous.Count} and {next.Count} modes.", nameof(next));
        return Greedy(ModalAssurance.Matrix(previous, next, mass), previousHz, nextHz);
    }

    private static (int[] Next, double[] Mac) Greedy(MathNet.Numerics.LinearAlgebra.Matrix<double> mac, IReadOnlyList<double> previousHz, IReadOnlyList<double> nextHz)
    {
        var n = mac.RowCount;
        var candidates = new List<(double Mac, double Shift, int I, int J)>(n * n);
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
                candidates.Add((mac[i, j], Math.Abs(Math.Log(Math.Max(nextHz[j], 1e-300) / Math.Max(previousHz[i], 1e-300))), i, j));
        candidates.Sort((x, y) =>
        {
            var c = y.Mac.CompareTo(x.Mac);
            if (c != 0) return c;
            c = x.Shift.CompareTo(y.Shift);
            return c != 0 ? c : (x.I != y.I ? x.I.CompareTo(y.I) : x.J.CompareTo(y.J));
        });
        var map = Enumerable.Repeat(-1, n).ToArray();
        var values = new double[n];
        var used = new bool[n];
        var assigned = 0;
        foreach (var (m, _, i, j) in candidates)
        {
            if (map[i] >= 0 || used[j]) continue;
            map[i] = j;
            values[i] = m;
            used[j] = true;
            if (++assigned == n) break;
        }
        return (map, values);
    }
}
