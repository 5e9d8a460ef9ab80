using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests;

/// <summary>How the ends of a uniform chain are held.</summary>
public enum ChainEnds
{
    /// <summary>Ground springs at both ends: n masses, n + 1 springs.</summary>
    FixedFixed,
    /// <summary>A ground spring at the first mass only: n masses, n springs.</summary>
    FixedFree,
    /// <summary>No ground spring: n masses, n − 1 springs, one rigid-body mode.</summary>
    FreeFree,
}

/// <summary>Networks shared by the Core tests: two-mass systems, uniform chains and seeded random networks.</summary>
public static class TestNetworks
{
    /// <summary>m1–k1–ground, k2 between m1 and m2, k3 from m2 to ground (omitted when k3 = 0); masses in kg, stiffnesses in N/m.</summary>
    public static Network TwoMassThreeSpring(double m1, double m2, double k1, double k2, double k3)
    {
        var b = new NetworkBuilder { Title = "two masses, three springs" }
            .AddMass("m1", m1).AddMass("m2", m2)
            .AddSpring("k1", Network.Ground, "m1", k1).AddSpring("k2", "m1", "m2", k2);
        if (k3 > 0) b.AddSpring("k3", "m2", Network.Ground, k3);
        return b.Build();
    }

    /// <summary>n equal masses of m kg joined by equal springs of k N/m, masses declared m1..mn along the chain.</summary>
    public static Network UniformChain(int n, double m, double k, ChainEnds ends)
    {
        var b = new NetworkBuilder { Title = $"uniform chain of {n}, {ends}" };
        for (var i = 1; i <= n; i++) b.AddMass($"m{i}", m);
        if (ends != ChainEnds.FreeFree) b.AddSpring("s0", Network.Ground, "m1", k);
        for (var i = 1; i < n; i++) b.AddSpring($"s{i}", $"m{i}", $"m{i + 1}", k);
        if (ends == ChainEnds.FixedFixed) b.AddSpring($"s{n}", $"m{n}", Network.Ground, k);
        return b.Build();
    }

    /// <summary>
    /// A rows × columns lattice of equal masses m (kg), each joined by springs k (N/m) to its four neighbours; a mass on
    /// an edge has a spring k to ground in place of each missing neighbour (fixed edges). Masses are named "r-c", 1-based.
    /// </summary>
    public static Network FixedEdgeGrid(int rows, int columns, double m, double k)
    {
        var b = new NetworkBuilder { Title = $"{rows} × {columns} grid, fixed edges" };
        string Name(int r, int c) => r < 1 || r > rows || c < 1 || c > columns ? Network.Ground : $"{r}-{c}";
        for (var r = 1; r <= rows; r++)
            for (var c = 1; c <= columns; c++) b.AddMass(Name(r, c), m);
        for (var r = 1; r <= rows; r++)
            for (var c = 0; c <= columns; c++)
                b.AddSpring($"h{r}-{c}", Name(r, c), Name(r, c + 1), k);
        for (var c = 1; c <= columns; c++)
            for (var r = 0; r <= rows; r++) b.AddSpring($"v{r}-{c}", Name(r, c), Name(r + 1, c), k);
        return b.Build();
    }

    /// <summary>
    /// A seeded random network of <paramref name="size"/> masses (1–100 kg): each mass belongs to one of one to three
    /// groups, each group is a random tree of springs (10 kN/m – 1 MN/m) with a few cross springs and parallel springs,
    /// and most groups (not all) are held by springs to ground or to a second support. Some dampers are added too.
    /// </summary>
    public static Network Random(Random random, int size)
    {
        var b = new NetworkBuilder { Title = $"random network of {size}" };
        var hasWall = random.NextDouble() < 0.3;
        if (hasWall) b.AddSupport("wall");
        var groups = Math.Min(size, random.NextDouble() < 0.3 ? 1 + random.Next(1, 3) : 1);
        var groupOf = new int[size];
        for (var i = 0; i < size; i++)
        {
            groupOf[i] = i < groups ? i : random.Next(groups);
            b.AddMass($"n{i}", Math.Pow(10, 2 * random.NextDouble()));
        }

        var springs = 0;
        double Stiffness() => Math.Pow(10, 4 + 2 * random.NextDouble());
        void Spring(string a, string c) => b.AddSpring($"k{springs++}", a, c, Stiffness());

        for (var g = 0; g < groups; g++)
        {
            var members = Enumerable.Range(0, size).Where(i => groupOf[i] == g).ToArray();
            for (var j = 1; j < members.Length; j++) Spring($"n{members[random.Next(j)]}", $"n{members[j]}");
            if (members.Length > 2)
                for (var c = 0; c < 1 + members.Length / 4; c++)
                {
                    var a = members[random.Next(members.Length)];
                    var d = members[random.Next(members.Length)];
                    if (a != d) Spring($"n{a}", $"n{d}");
                }
            // Group 0 is nearly always held; later groups are left free half the time, giving rigid-body modes.
            var held = g == 0 ? random.NextDouble() < 0.9 : random.NextDouble() < 0.5;
            if (held)
                for (var c = 0; c < 1 + random.Next(2); c++)
                    Spring(hasWall && random.NextDouble() < 0.5 ? "wall" : Network.Ground, $"n{members[random.Next(members.Length)]}");
        }

        for (var d = 0; d < size / 3; d++)
        {
            var a = random.Next(size);
            var c = random.Next(size);
            if (a != c) b.AddDamper($"c{d}", $"n{a}", $"n{c}", 1e3 * random.NextDouble());
        }
        return b.Build();
    }

    /// <summary>maxᵢ Σⱼ|Kᵢⱼ| / Mᵢᵢ in rad²/s², an upper bound on ω²_max for diagonal M; the scale for "zero" eigenvalues.</summary>
    public static double StiffnessScale(Matrix<double> k, Matrix<double> m)
    {
        var scale = 0.0;
        for (var i = 0; i < k.RowCount; i++) scale = Math.Max(scale, k.Row(i).L1Norm() / m[i, i]);
        return scale > 0 ? scale : 1.0;
    }

    /// <summary>Unit-length copy of <paramref name="v"/> with the sign that makes its dot product with <paramref name="reference"/> non-negative.</summary>
    public static double[] NormalisedLike(IReadOnlyList<double> v, IReadOnlyList<double> reference)
    {
        var norm = Math.Sqrt(v.Sum(x => x * x));
        var dot = v.Zip(reference, (a, r) => a * r).Sum();
        var sign = dot < 0 ? -1 : 1;
        return [.. v.Select(x => sign * x / norm)];
    }

    /// <summary>Unit-length copy of <paramref name="v"/>.</summary>
    public static double[] Normalised(IReadOnlyList<double> v)
    {
        var norm = Math.Sqrt(v.Sum(x => x * x));
        return [.. v.Select(x => x / norm)];
    }
}
