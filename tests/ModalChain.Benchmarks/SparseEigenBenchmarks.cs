using BenchmarkDotNet.Attributes;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Solvers;

namespace ModalChain.Benchmarks;

/// <summary>The lowest 20 modes of a seeded random chain of 1,000 masses by each eigen algorithm (solver alone, matrices assembled once).</summary>
[MemoryDiagnoser]
public class SparseEigenBenchmarks
{
    private Matrix<double> _k = null!;
    private Matrix<double> _m = null!;

    [GlobalSetup]
    public void Setup()
    {
        var matrices = Assembler.Assemble(Networks.RandomChain(1000, seed: 7, crossSprings: 100));
        _k = matrices.Stiffness;
        _m = matrices.Mass;
    }

    [Benchmark(Baseline = true)]
    public EigenSolution Dense() => new DenseGeneralizedEigen().Solve(_k, _m, 20, massIsDiagonal: true);

    [Benchmark]
    public EigenSolution SubspaceIteration() => new SubspaceIterationEigen().Solve(_k, _m, 20, massIsDiagonal: true);

    [Benchmark]
    public EigenSolution ShiftInvertLanczos() => new ShiftInvertLanczos().Solve(_k, _m, 20, massIsDiagonal: true);
}
