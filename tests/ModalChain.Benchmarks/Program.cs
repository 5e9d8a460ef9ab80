using System.Globalization;
using BenchmarkDotNet.Running;
using ModalChain.Benchmarks;

// Run with: dotnet run -c Release --project tests/ModalChain.Benchmarks -- --filter '*'
// Figures and the machine they were taken on go in docs/performance.md.
if (args.Length >= 4 && args[0] == "--sparse-stages")
{
    static int Whole(string s) => int.Parse(s, CultureInfo.InvariantCulture);
    SparseEigenStages.Run(Whole(args[1]), Whole(args[2]), Whole(args[3]));
    return;
}
if (args.Length >= 1 && args[0] == "--cholesky-stages")
{
    SparseEigenStages.Cholesky();
    return;
}
// "read-model ROWS COLUMNS" times one read, check and assembly of a generated grid file with a stopwatch instead.
if (args is ["read-model", var rows, var columns])
{
    ModelFiles.TimeReading(int.Parse(rows, CultureInfo.InvariantCulture), int.Parse(columns, CultureInfo.InvariantCulture), Console.Out);
    return;
}
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
