using ModalChain.Core.Model;

namespace ModalChain.Benchmarks;

/// <summary>Seeded benchmark networks, so every run measures the same model.</summary>
public static class Networks
{
    /// <summary>A fixed-free chain of n masses with a seeded spread of masses (±30 %) and stiffnesses (±30 %), plus random cross springs and dampers.</summary>
    public static Network RandomChain(int n, int seed = 1, int crossSprings = 0, int dampers = 0)
    {
        var random = new Random(seed);
        var b = new NetworkBuilder { Title = $"benchmark chain of {n}" };
        for (var i = 0; i < n; i++) b.AddMass($"m{i}", 100 * (0.7 + 0.6 * random.NextDouble()));
        b.AddSpring("s0", Network.Ground, "m0", 1e6 * (0.7 + 0.6 * random.NextDouble()));
        for (var i = 1; i < n; i++) b.AddSpring($"s{i}", $"m{i - 1}", $"m{i}", 1e6 * (0.7 + 0.6 * random.NextDouble()));
        for (var c = 0; c < crossSprings; c++)
        {
            var a = random.Next(n);
            var d = random.Next(n);
            if (a != d) b.AddSpring($"x{c}", $"m{a}", $"m{d}", 1e5 * random.NextDouble());
        }
        // Dampers draw from their own generator so that the springs of a given seed do not change when dampers are added.
        var dampingRandom = new Random(seed + 1);
        for (var d = 0; d < dampers; d++)
        {
            var a = dampingRandom.Next(n);
            var other = dampingRandom.Next(-1, n);
            if (a != other) b.AddDamper($"c{d}", $"m{a}", other < 0 ? Network.Ground : $"m{other}", 2e3 * dampingRandom.NextDouble());
        }
        return b.Build();
    }

    /// <summary>A rows × columns lattice of equal masses (kg) and springs (N/m) to the four neighbours, fixed at every edge; masses "r-c".</summary>
    public static Network FixedEdgeGrid(int rows, int columns, double mass = 45, double stiffness = 1.2e7)
    {
        var b = new NetworkBuilder { Title = $"benchmark grid {rows} × {columns}" };
        string Name(int r, int c) => r < 1 || r > rows || c < 1 || c > columns ? Network.Ground : $"{r}-{c}";
        for (var r = 1; r <= rows; r++)
            for (var c = 1; c <= columns; c++) b.AddMass(Name(r, c), mass);
        for (var r = 1; r <= rows; r++)
            for (var c = 0; c <= columns; c++) b.AddSpring($"h{r}-{c}", Name(r, c), Name(r, c + 1), stiffness);
        for (var c = 1; c <= columns; c++)
            for (var r = 0; r <= rows; r++) b.AddSpring($"v{r}-{c}", Name(r, c), Name(r + 1, c), stiffness);
        return b.Build();
    }
}
