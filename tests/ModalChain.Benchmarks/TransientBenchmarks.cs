using BenchmarkDotNet.Attributes;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Benchmarks;

/// <summary>Transient runs on a seeded 1,000-mass chain with cross springs: 100,000 steps.</summary>
/// <remarks>
/// The modes are computed once in the setup and passed in, so the figures are those of the time integration
/// (with recording of two outputs, peaks, RMS and the energy balance); the eigen solve is measured by
/// <see cref="ModalBenchmarks"/>.
/// </remarks>
[MemoryDiagnoser]
public class TransientBenchmarks
{
    private const int Masses = 1000;
    private const int Steps = 100_000;
    private const double Step = 1e-4;
    private Network _network = null!;
    private StructuralMatrices _matrices = null!;
    private ModalResult _modes = null!;
    private TransientExcitation[] _loads = null!;

    [GlobalSetup]
    public void Setup()
    {
        _network = Networks.RandomChain(Masses, seed: 7, crossSprings: Masses / 10, dampers: Masses / 20);
        _matrices = Assembler.Assemble(_network);
        _modes = ModalAnalysis.Solve(_network, _matrices);
        _loads =
        [
            new ForceHistory("start-up", "m500", 0.05, new UnbalanceSpeedRamp(0, 300, 8)),
            new ForceHistory("bump", "m999", 1, new HalfSinePulse(5000, 0.02, 0.5)),
        ];
    }

    private TransientSettings Settings(TransientMethod method) =>
        new(Steps * Step, Step, method) { Outputs = ["m500", "m999"], ModeCount = method == TransientMethod.Modal ? 20 : null };

    [Benchmark]
    public TransientResult Newmark1000Masses100kSteps() =>
        TransientAnalysis.Run(_network, _matrices, _loads, [], Settings(TransientMethod.Newmark), _modes);

    [Benchmark]
    public TransientResult Modal20Modes1000Masses100kSteps() =>
        TransientAnalysis.Run(_network, _matrices, _loads, [], Settings(TransientMethod.Modal), _modes);
}

/// <summary>The modal method on the same 1,000-mass chain including its own eigen solve (20 modes by shift-invert Lanczos; by subspace iteration before).</summary>
[MemoryDiagnoser]
public class TransientModalWithEigenBenchmarks
{
    private Network _network = null!;
    private StructuralMatrices _matrices = null!;
    private TransientExcitation[] _loads = null!;

    [GlobalSetup]
    public void Setup()
    {
        _network = Networks.RandomChain(1000, seed: 7, crossSprings: 100, dampers: 50);
        _matrices = Assembler.Assemble(_network);
        _loads =
        [
            new ForceHistory("start-up", "m500", 0.05, new UnbalanceSpeedRamp(0, 300, 8)),
            new ForceHistory("bump", "m999", 1, new HalfSinePulse(5000, 0.02, 0.5)),
        ];
    }

    [Benchmark]
    public TransientResult Modal20ModesWithSparseEigen100kSteps() =>
        TransientAnalysis.Run(_network, _matrices, _loads, [],
            new TransientSettings(10, 1e-4, TransientMethod.Modal) { Outputs = ["m500", "m999"], ModeCount = 20 });
}
