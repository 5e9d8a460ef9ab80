using BenchmarkDotNet.Attributes;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Benchmarks;

/// <summary>Assembly plus all-mode eigen solve of seeded chains.</summary>
[MemoryDiagnoser]
public class ModalBenchmarks
{
    private Network _network = null!;
    private StructuralMatrices _matrices = null!;

    [Params(50, 200, 500)]
    public int Masses { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _network = Networks.RandomChain(Masses, seed: 7, crossSprings: Masses / 10);
        _matrices = Assembler.Assemble(_network);
    }

    [Benchmark]
    public StructuralMatrices Assemble() => Assembler.Assemble(_network);

    [Benchmark]
    public ModalResult SolveAllModes() => ModalAnalysis.Solve(_network, _matrices);
}
