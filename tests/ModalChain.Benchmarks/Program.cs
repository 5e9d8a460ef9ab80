using System.Globalization;
using BenchmarkDotNet.Running;
using ModalChain.Benchmarks;

// Run with: dotnet run -c Release --project tests/ModalChain.Benchmarks -- --filter '*'
// Figures and the machine they were taken on go in docs/performance.md.
// "read-model ROWS COLUMNS" times one read, check and assembly of a generated grid file with a stopwatch instead.
if (args is ["read-model", var rows, var columns])
{
    ModelFiles.TimeReading(int.Parse(rows, CultureInfo.InvariantCulture), int.Parse(columns, CultureInfo.InvariantCulture), Console.Out);
    return;
}
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
