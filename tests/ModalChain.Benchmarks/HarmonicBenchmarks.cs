using BenchmarkDotNet.Attributes;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Benchmarks;

/// <summary>Harmonic sweeps of the sizes named in the performance targets (docs/performance.md).</summary>
/// <remarks>
/// Modal: 10,000 frequencies on 500 masses, 2 % modal damping, a force and an unbalance, five output masses.
/// Direct: 2,000 frequencies on 200 masses with Rayleigh damping plus discrete dampers (non-classical), five outputs.
/// "Sweep" cases reuse an assembled <see cref="DampedSystem"/>; "EndToEnd" cases include assembly and the eigen solve.
/// </remarks>
[MemoryDiagnoser]
public class HarmonicBenchmarks
{
    private StructuralModel _modalModel = null!;
    private StructuralModel _directModel = null!;
    private DampedSystem _modalSystem = null!;
    private DampedSystem _directSystem = null!;
    private double[] _modalFrequencies = null!;
    private double[] _directFrequencies = null!;
    private string[] _modalOutputs = null!;
    private string[] _directOutputs = null!;

    [GlobalSetup]
    public void Setup()
    {
        var chain500 = Networks.RandomChain(500, seed: 7, crossSprings: 50);
        _modalModel = new StructuralModel(chain500, DampingModel.Modal(0.02),
            [new ForceLoad("f", "m10", 1000, 0), new UnbalanceLoad("u", "m250", 0.01, 24.7)]);
        _modalSystem = DampedSystem.Build(_modalModel);
        _modalFrequencies = Linear(0.1, 40, 10_000);
        _modalOutputs = ["m0", "m100", "m250", "m400", "m499"];

        var chain200 = WithDampers(Networks.RandomChain(200, seed: 7, crossSprings: 20));
        _directModel = new StructuralModel(chain200, new DampingModel([], RayleighDamping.FromTargets(0.02, 2 * Math.PI * 2, 2 * Math.PI * 30), 0),
            [new ForceLoad("f", "m10", 1000, 0), new UnbalanceLoad("u", "m150", 0.01, 24.7)]);
        _directSystem = DampedSystem.Build(_directModel);
        _directFrequencies = Linear(0.1, 40, 2_000);
        _directOutputs = ["m0", "m50", "m100", "m150", "m199"];
    }

    [Benchmark]
    public HarmonicResult ModalSweep_500Masses_10000Frequencies() =>
        HarmonicAnalysis.Sweep(_modalSystem, _modalFrequencies, _modalModel.Loads, _modalOutputs, HarmonicMethod.Modal, modeCount: 500);

    [Benchmark]
    public HarmonicResult ModalEndToEnd_500Masses_10000Frequencies() =>
        HarmonicAnalysis.Sweep(DampedSystem.Build(_modalModel), _modalFrequencies, _modalModel.Loads, _modalOutputs, HarmonicMethod.Modal, modeCount: 500);

    [Benchmark]
    public HarmonicResult DirectSweep_200Masses_2000Frequencies() =>
        HarmonicAnalysis.Sweep(_directSystem, _directFrequencies, _directModel.Loads, _directOutputs, HarmonicMethod.Direct);

    [Benchmark]
    public HarmonicResult DirectEndToEnd_200Masses_2000Frequencies() =>
        HarmonicAnalysis.Sweep(DampedSystem.Build(_directModel), _directFrequencies, _directModel.Loads, _directOutputs, HarmonicMethod.Direct);

    private static double[] Linear(double from, double to, int n) => [.. Enumerable.Range(0, n).Select(i => from + (to - from) * i / (n - 1))];

    /// <summary>The same chain with a seeded discrete damper on every tenth spring, so the damping is not classical.</summary>
    private static Network WithDampers(Network network)
    {
        var random = new Random(3);
        var b = new NetworkBuilder { Title = network.Title + " with dampers" };
        foreach (var m in network.Masses) b.AddMass(m.Name, m.Kilograms);
        foreach (var s in network.Springs) b.AddSpring(s.Name, s.NodeA, s.NodeB, s.Stiffness);
        for (var i = 0; i < network.Springs.Length; i += 10)
            b.AddDamper($"d{i}", network.Springs[i].NodeA, network.Springs[i].NodeB, 500 + 1000 * random.NextDouble());
        return b.Build();
    }
}
