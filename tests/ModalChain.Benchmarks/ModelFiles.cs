using System.Diagnostics;
using System.Globalization;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Benchmarks;

/// <summary>Large model files written out in full, as a user's script would write them, for the reading benchmarks.</summary>
public static class ModelFiles
{
    /// <summary>Writes a rows × columns grid: masses g-R-C of 40 kg, a spring of 5 MN/m between neighbours, and a spring
    /// to ground from every mass on the outer edge (corners once); no 'repeat' section, every element on its own line.</summary>
    public static void WriteGrid(string path, int rows, int columns)
    {
        var inv = CultureInfo.InvariantCulture;
        using var w = new StreamWriter(path);
        w.WriteLine($"title: benchmark grid {rows} x {columns}");
        w.WriteLine("masses:");
        for (var r = 1; r <= rows; r++)
            for (var c = 1; c <= columns; c++)
                w.WriteLine(string.Create(inv, $"  g-{r}-{c}: {{mass: 40 kg, at: [{0.5 * c}, {0.5 * r}]}}"));
        w.WriteLine("springs:");
        for (var r = 1; r <= rows; r++)
            for (var c = 1; c <= columns; c++)
            {
                if (c < columns) w.WriteLine(string.Create(inv, $"  h-{r}-{c}: {{between: [g-{r}-{c}, g-{r}-{c + 1}], stiffness: 5 MN/m}}"));
                if (r < rows) w.WriteLine(string.Create(inv, $"  v-{r}-{c}: {{between: [g-{r}-{c}, g-{r + 1}-{c}], stiffness: 5 MN/m}}"));
                if (r == 1 || r == rows || c == 1 || c == columns)
                    w.WriteLine(string.Create(inv, $"  e-{r}-{c}: {{between: [ground, g-{r}-{c}], stiffness: 5 MN/m}}"));
            }
    }

    /// <summary>Times reading (with every check of the reader), the validate command's topology summary and the
    /// assembly of a generated grid, once each, and prints the process's peak working set.</summary>
    /// <remarks>Run with <c>dotnet run -c Release --project tests/ModalChain.Benchmarks -- read-model ROWS COLUMNS</c>.</remarks>
    public static void TimeReading(int rows, int columns, TextWriter output)
    {
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-grid-{rows}x{columns}-{Environment.ProcessId}.yaml");
        try
        {
            WriteGrid(path, rows, columns);
            var size = new FileInfo(path).Length;
            var process = Process.GetCurrentProcess();
            var cpuBefore = process.TotalProcessorTime;
            var clock = Stopwatch.StartNew();
            var result = ModelReader.ReadFile(path);
            var read = clock.Elapsed;
            process.Refresh();
            var cpuRead = process.TotalProcessorTime;
            if (result.Model is not { } model)
                throw new InvalidOperationException("the generated model was rejected: " + string.Join("\n", result.Diagnostics.Take(5)));
            clock.Restart();
            var groups = Topology.UnsupportedGroups(model.Network);
            var topology = clock.Elapsed;
            clock.Restart();
            var matrices = Assembler.Assemble(model.Network);
            var assemble = clock.Elapsed;
            process.Refresh();
            var cpuAfter = process.TotalProcessorTime;
            var inv = CultureInfo.InvariantCulture;
            output.WriteLine(string.Create(inv,
                $"grid {rows} x {columns}: {model.Network.Masses.Length} masses, {model.Network.Springs.Length} springs, file {size / 1048576.0:F1} MiB, {groups.Length} unsupported groups, K has {matrices.Stiffness.Storage.EnumerateNonZero().Count()} entries"));
            output.WriteLine(string.Create(inv,
                $"  read+check {read.TotalSeconds:F3} s, topology {topology.TotalSeconds:F3} s, assemble {assemble.TotalSeconds:F3} s, total {(read + topology + assemble).TotalSeconds:F3} s"));
            output.WriteLine(string.Create(inv, $"  processor time (all threads, whole process) {Process.GetCurrentProcess().TotalProcessorTime.TotalSeconds:F3} s"));
            output.WriteLine(string.Create(inv,
                $"  processor time of read+check {(cpuRead - cpuBefore).TotalSeconds:F3} s, of read+check, topology and assemble {(cpuAfter - cpuBefore).TotalSeconds:F3} s (writing the file excluded)"));
            output.WriteLine(string.Create(inv,
                $"  garbage collections gen0/gen1/gen2 {GC.CollectionCount(0)}/{GC.CollectionCount(1)}/{GC.CollectionCount(2)}, paused {GC.GetTotalPauseDuration().TotalSeconds:F3} s, allocated {GC.GetTotalAllocatedBytes() / 1048576.0:F0} MiB"));
            output.WriteLine(string.Create(inv, $"  peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0:F0} MiB"));
        }
        finally
        {
            File.Delete(path);
        }
    }
}
