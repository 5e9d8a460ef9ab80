using System.Diagnostics;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;

namespace ModalChain.Benchmarks;

/// <summary>
/// Stopwatch stages of the sparse eigen solve on a fixed-edge grid, too large for BenchmarkDotNet's repetitions:
/// <c>dotnet run -c Release --project tests/ModalChain.Benchmarks -- --sparse-stages ROWS COLUMNS MODES</c>
/// (MODALCHAIN_STAGES_NETWORK=1 adds building the network and the whole modal analysis).
/// </summary>
public static class SparseEigenStages
{
    public static void Run(int rows, int columns, int modes)
    {
        var inv = CultureInfo.InvariantCulture;
        _cpu = Process.GetCurrentProcess().TotalProcessorTime;
        var total = Stopwatch.StartNew();
        var watch = Stopwatch.StartNew();
        var (k, m) = GridMatrices(rows, columns, 45.0, 1.2e7);
        Report("matrices (Math.NET sparse)", watch);

        var ks = SymmetricSparseMatrix.From(k);
        var ms = SymmetricSparseMatrix.From(m);
        Report("copy to SymmetricSparseMatrix", watch);

        var pattern = SparseLdltPattern.Analyse(ks, ms);
        Report(string.Create(inv, $"AMD ordering + symbolic: {pattern.FactorNonZeros:N0} entries in L"), watch);

        var factor = SparseLdlt.Factor(pattern, ks, 1.0, ms);
        Report("one numeric LDLᵀ", watch);

        var solution = new ShiftInvertLanczos().Solve(k, m, modes, massIsDiagonal: true);
        Report(string.Create(inv, $"ShiftInvertLanczos.Solve, lowest {modes} (own ordering, 2 factorisations, Lanczos, Sturm check)"), watch);
        Console.WriteLine(string.Create(inv, $"  λ1 = {solution.EigenValues[0]:G10}, λ{modes} = {solution.EigenValues[^1]:G10} rad²/s²"));
        // ω² = (4k/m)[sin²(pπ/(2(R+1))) + sin²(qπ/(2(C+1)))] (docs/methods.md, fixed-edge lattice).
        static double S2(int j, int n) => Math.Pow(Math.Sin(j * Math.PI / (2 * (n + 1))), 2);
        var exact = Enumerable.Range(1, Math.Min(rows, modes + 1)).SelectMany(p => Enumerable.Range(1, Math.Min(columns, modes + 1))
            .Select(q => 4 * 1.2e7 / 45.0 * (S2(p, rows) + S2(q, columns)))).Order().Take(modes).ToArray();
        var worst = exact.Select((e, i) => Math.Abs(solution.EigenValues[i] - e) / e).Max();
        var residual = 0.0;
        var kx = new double[k.RowCount];
        var mx = new double[k.RowCount];
        for (var j = 0; j < modes; j++)
        {
            var phi = solution.Shapes.Column(j).ToArray();
            ks.Multiply(phi, kx);
            ms.Multiply(phi, mx);
            var r = Math.Sqrt(kx.Select((v, i) => Math.Pow(v - solution.EigenValues[j] * mx[i], 2)).Sum() / kx.Sum(v => v * v));
            residual = Math.Max(residual, r);
        }
        Console.WriteLine(string.Create(inv, $"  worst relative error against the lattice closed form {worst:G3}; largest residual ‖Kφ − λMφ‖/‖Kφ‖ {residual:G3}"));

        if (Environment.GetEnvironmentVariable("MODALCHAIN_STAGES_NETWORK") == "1")
        {
            var network = Networks.FixedEdgeGrid(rows, columns);
            Report("NetworkBuilder grid", watch);
            var matrices = ModalChain.Core.Assembly.Assembler.Assemble(network);
            Report("Assembler.Assemble", watch);
            var result = ModalChain.Core.Analyses.Modal.ModalAnalysis.Solve(network, matrices, new ModalChain.Core.Analyses.Modal.ModalOptions(modes));
            Report(string.Create(inv, $"ModalAnalysis.Solve, lowest {modes} ({result.Algorithm}), max residual {result.Quality.MaxResidual:G3}"), watch);
        }
        Console.WriteLine(string.Create(inv, $"total {total.Elapsed.TotalSeconds:F2} s wall, {Process.GetCurrentProcess().TotalProcessorTime.TotalSeconds:F2} s CPU, peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0:F0} MB"));
    }

    /// <summary>SparseCholesky of a Newmark effective stiffness K + a₀M on a random chain and on grids: factor time and fill.</summary>
    public static void Cholesky()
    {
        var inv = CultureInfo.InvariantCulture;
        var chain = ModalChain.Core.Assembly.Assembler.Assemble(Networks.RandomChain(1000, seed: 7, crossSprings: 100));
        (string Name, Matrix<double> K, Matrix<double> M)[] cases =
        [
            ("random chain n = 1,000, 100 cross springs", chain.Stiffness, chain.Mass),
            ("grid 100 × 200", GridMatrices(100, 200, 45, 1.2e7).K, GridMatrices(100, 200, 45, 1.2e7).M),
        ];
        foreach (var (name, k, m) in cases)
        {
            var effective = SymmetricSparseMatrix.Combine((1.0, k), (4.0 / (1e-3 * 1e-3), m));
            var best = double.MaxValue;
            var entries = 0;
            for (var repeat = 0; repeat < 3; repeat++)
            {
                var watch = Stopwatch.StartNew();
                var factor = SparseCholesky.Factor(effective);
                best = Math.Min(best, watch.Elapsed.TotalSeconds);
                entries = factor.FactorNonZeros;
            }
            Console.WriteLine(string.Create(inv, $"{name}: SparseCholesky.Factor best of 3 {best:F3} s, {entries:N0} entries in L"));
        }
    }

    private static TimeSpan _cpu = Process.GetCurrentProcess().TotalProcessorTime;

    /// <summary>Prints the stage's wall time and the CPU time of the process over it (the machine may be shared), then restarts.</summary>
    private static void Report(string stage, Stopwatch watch)
    {
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{watch.Elapsed.TotalSeconds,8:F3} s wall {(cpu - _cpu).TotalSeconds,7:F3} s CPU  {stage}"));
        _cpu = cpu;
        watch.Restart();
    }

    /// <summary>K (N/m) and M (kg) of a rows × columns grid of masses m joined by springs k, fixed at every edge.</summary>
    public static (Matrix<double> K, Matrix<double> M) GridMatrices(int rows, int columns, double mass, double stiffness)
    {
        var n = rows * columns;
        var entries = new List<(int, int, double)>(5 * n);
        for (var r = 0; r < rows; r++)
            for (var c = 0; c < columns; c++)
            {
                var i = r * columns + c;
                entries.Add((i, i, 4 * stiffness));
                if (c + 1 < columns) { entries.Add((i, i + 1, -stiffness)); entries.Add((i + 1, i, -stiffness)); }
                if (r + 1 < rows) { entries.Add((i, i + columns, -stiffness)); entries.Add((i + columns, i, -stiffness)); }
            }
        var k = Matrix<double>.Build.SparseOfIndexed(n, n, entries);
        var m = Matrix<double>.Build.SparseDiagonal(n, mass);
        return (k, m);
    }
}
