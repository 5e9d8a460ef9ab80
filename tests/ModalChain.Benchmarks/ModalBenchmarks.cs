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
    private Network _stiffNetwork = null!;

    [Params(50, 200, 500)]
    public int Masses { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _network = Networks.RandomChain(Masses, seed: 7, crossSprings: Masses / 10);
        _matrices = Assembler.Assemble(_network);
        // The same chain with its ground spring made 1e14 N/m: the low modes are re-solved from the flexibility.
        _stiffNetwork = _network.WithSpringStiffness("s0", 1e14);
    }

    [Benchmark]
    public StructuralMatrices Assemble() => Assembler.Assemble(_network);

    [Benchmark]
    public ModalResult SolveAllModes() => ModalAnalysis.Solve(_network, _matrices);

    [Benchmark]
    public ModalResult SolveAllModes_StiffGroundSpring() => ModalAnalysis.Solve(_stiffNetwork);
}
