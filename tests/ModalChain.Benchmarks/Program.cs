using BenchmarkDotNet.Running;

// Run with: dotnet run -c Release --project tests/ModalChain.Benchmarks -- --filter '*'
// Figures and the machine they were taken on go in docs/performance.md.
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
