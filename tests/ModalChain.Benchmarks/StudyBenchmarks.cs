using BenchmarkDotNet.Attributes;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Model;

namespace ModalChain.Benchmarks;

/// <summary>A parameter study on a seeded chain: every step re-solves all modes (in parallel), then MAC tracking and threshold bisection.</summary>
[MemoryDiagnoser]
public class StudyBenchmarks
{
    private Network _network = null!;
    private StudyRequest _request = null!;

    [Params(50, 200)]
    public int Masses { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _network = Networks.RandomChain(Masses, seed: 7, crossSprings: Masses / 10);
        var spring = _network.Springs[0];
        var separation = new SeparationCriterion(0.2, [24.7], [1, 2]);
        _request = new StudyRequest(new ParameterPath(ParameterKind.Stiffness, spring.Name), spring.Stiffness / 4, spring.Stiffness * 4, 31,
            StudySpacing.Geometric, [StudyCriterion.Separation(separation)]);
    }

    [Benchmark]
    public StudyResult ThirtyOneSteps() => ParameterStudy.Run(_network, _request);
}
