using System.Collections.Immutable;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Load cases: each swept on its own, combined at the running speeds by the sum or rms rule.</summary>
/// <remarks>
/// The reference amplitudes are the damped single-mass closed form |X| = (F/k)·D, D = 1/√((1−r²)² + (2ζr)²)
/// (Rao, Mechanical Vibrations, ch. 3; Chopra, Dynamics of Structures, §3.2; standard result, attributions from
/// memory; REFERENCES.md §4 prints D(0.05, 0.5) = 1.330380 and D(0.05, 2) = 0.332595). The combinations are then
/// added by hand: Σ a_k for the sum rule, √(Σ a_k²) for the rms rule.
/// </remarks>
public class LoadCaseTests
{
    private const double M = 100, K = 1.0e5, Zeta = 0.05;
    private static readonly double Fn = Math.Sqrt(K / M) / (2 * Math.PI);
    private static readonly double F1 = 0.5 * Fn, F2 = 2.0 * Fn;      // r = 0.5 and r = 2
    private const double A1 = 1000, A2 = 500;                          // force amplitudes, N

    private static ModalChain.Core.Assembly.DampedSystem TwoMachines() => HarmonicModels.System(HarmonicModels.Sdof(M, K, Zeta), null,
        new ForceLoad("machine-a", "m", A1, 0.3, F1), new ForceLoad("machine-b", "m", A2, -1.1, F2));

    private static readonly LoadCase CaseA = new("a", ["machine-a"]);
    private static readonly LoadCase CaseB = new("b", ["machine-b"]);

    private static HarmonicSpec Spec => new([], new FrequencyRange(1, 20, 60, FrequencySpacing.Linear), true, [], HarmonicMethod.Direct);

    private static double D(double r) => 1 / Math.Sqrt(Math.Pow(1 - r * r, 2) + Math.Pow(2 * Zeta * r, 2));

    [Fact]
    public void PrintedAmplifications_AreTheClosedFormUsedBelow()
    {
        // REFERENCES.md §4 (values recomputed; standard SDOF result, Rao ch. 3 [from memory]); tolerance 1e-6 abs on 6-decimal figures.
        NumericAssert.Close(1.330380, D(0.5), Tolerance.Abs(1e-6), "D(0.05, 0.5)");
        NumericAssert.Close(0.332595, D(2.0), Tolerance.Abs(1e-6), "D(0.05, 2)");
    }

    [Theory]
    [InlineData(CaseCombination.Sum)]
    [InlineData(CaseCombination.Rms)]
    public void TwoSingleMassCases_CombineAsTheHandSumOfClosedFormAmplitudes(CaseCombination rule)
    {
        // Closed form |X_k| = (F_k/k)·D(r_k, ζ) (Chopra §3.2 [from memory]); hand combination by the rule; tolerance 1e-9 rel.
        var result = LoadCaseAnalysis.Solve(TwoMachines(), Spec, new LoadCaseSelection([CaseA, CaseB], rule));
        var x1 = A1 / K * D(0.5);
        var x2 = A2 / K * D(2.0);
        var (w1, w2) = (2 * Math.PI * F1, 2 * Math.PI * F2);
        double Hand(double a, double b) => rule == CaseCombination.Sum ? a + b : Math.Sqrt(a * a + b * b);

        var m = Assert.Single(result.Combined);
        Assert.Equal(2, m.Components.Length);
        NumericAssert.Close(x1, m.Components[0].Peak(ResponseQuantity.Displacement), Tolerance.Rel(1e-9), "component of case a");
        NumericAssert.Close(x2, m.Components[1].Peak(ResponseQuantity.Displacement), Tolerance.Rel(1e-9), "component of case b");
        NumericAssert.Close(Hand(x1, x2), m.Peak(ResponseQuantity.Displacement, rule), Tolerance.Rel(1e-9), "displacement peak");
        NumericAssert.Close(Hand(w1 * x1, w2 * x2), m.Peak(ResponseQuantity.Velocity, rule), Tolerance.Rel(1e-9), "velocity peak");
        NumericAssert.Close(Hand(w1 * x1, w2 * x2) / Math.Sqrt(2), m.Rms(ResponseQuantity.Velocity, rule), Tolerance.Rel(1e-9), "velocity rms");
        NumericAssert.Close(Hand(w1 * w1 * x1, w2 * w2 * x2), m.Peak(ResponseQuantity.Acceleration, rule), Tolerance.Rel(1e-9), "acceleration peak");
        Assert.Equal(rule, result.Rule);
    }

    [Fact]
    public void TheSumRule_BoundsThePeakOfTheTimeSignal_AndTheRmsRuleIsItsRms()
    {
        // Identity: q(t) = Σ a_k cos(Ω_k t + φ_k) has |q| ≤ Σ a_k and mean square Σ a_k²/2 for distinct Ω_k (common
        // practice); sampled over 400 periods of the slower component, 1e-3 rel on the mean square, bound exact.
        var result = LoadCaseAnalysis.Solve(TwoMachines(), Spec, new LoadCaseSelection([CaseA, CaseB], CaseCombination.Sum));
        var parts = result.Combined[0].Components;
        var span = 400 / F1;
        const int samples = 400_000;
        double largest = 0, squares = 0;
        for (var i = 0; i < samples; i++)
        {
            var t = span * i / samples;
            var q = parts.Sum(c => c.Displacement.Magnitude * Math.Cos(2 * Math.PI * c.SpeedHz * t + c.Displacement.Phase));
            largest = Math.Max(largest, Math.Abs(q));
            squares += q * q;
        }
        var sum = result.Combined[0].Peak(ResponseQuantity.Displacement, CaseCombination.Sum);
        Assert.True(largest <= sum * (1 + 1e-12), $"peak of the signal {largest} above the sum {sum}");
        Assert.True(largest > 0.95 * sum, $"peak of the signal {largest} far below the sum {sum}: the bound is approached over a long run");
        NumericAssert.Close(result.Combined[0].Rms(ResponseQuantity.Displacement, CaseCombination.Rms), Math.Sqrt(squares / samples), Tolerance.Rel(1e-3), "rms");
    }

    [Theory]
    [InlineData(3, HarmonicMethod.Direct)]
    [InlineData(11, HarmonicMethod.Modal)]
    public void ACaseSweep_EqualsTheSweepOfItsLoadsAlone(int seed, HarmonicMethod method)
    {
        // Identity: a case is its loads swept alone, operating points included; tolerance exact (same computation).
        var network = HarmonicModels.Random(seed, 6, dampers: true);
        var system = HarmonicModels.System(network, null,
            new UnbalanceLoad("u1", "m1", 0.01, 14.0), new ForceLoad("f3", "m3", 200, 0.4, 14.0), new UnbalanceLoad("u5", "m5", 0.02, 9.5));
        var spec = Spec with { Method = method };
        var cases = new LoadCaseSelection([new LoadCase("first", ["u1", "f3"]), new LoadCase("second", ["u5"])], CaseCombination.Rms);
        var result = LoadCaseAnalysis.Solve(system, spec, cases);
        foreach (var sweep in result.Cases)
        {
            var alone = HarmonicAnalysis.Solve(system, spec with { Loads = sweep.Case.Loads });
            Assert.Equal(alone.Loads.ToArray(), sweep.Result.Loads.ToArray());
            Assert.Equal(alone.FrequenciesHz.ToArray(), sweep.Result.FrequenciesHz.ToArray());
            foreach (var (a, b) in alone.Responses.Zip(sweep.Result.Responses))
            {
                NumericAssert.Close([.. a.Displacement.Select(z => z.Real)], [.. b.Displacement.Select(z => z.Real)], Tolerance.Abs(0), $"{sweep.Case.Name} {a.Dof} real");
                NumericAssert.Close([.. a.Displacement.Select(z => z.Imaginary)], [.. b.Displacement.Select(z => z.Imaginary)], Tolerance.Abs(0), $"{sweep.Case.Name} {a.Dof} imag");
            }
            Assert.Equal(alone.OperatingPoints.Select(o => o.SpeedHz), sweep.Result.OperatingPoints.Select(o => o.SpeedHz));
        }
        // Each case's components are its own operating points: the loads of one case at one speed add as complex amplitudes.
        Assert.All(result.Combined, r => Assert.Equal(["first", "second"], r.Components.Select(c => c.Case)));
        var first = result.Cases[0].Result.OperatingPoints.Single();
        foreach (var r in result.Combined)
            NumericAssert.Close(first.Response.ResponseOf(r.Dof)!.Displacement[0].Magnitude, r.Components[0].Displacement.Magnitude, Tolerance.Abs(0), r.Dof);
    }

    [Fact]
    public void TwoCasesAtOneSpeed_AreNotAddedAsComplexAmplitudes()
    {
        // Two unrelated machines at the same speed: the sum rule adds |X_a| + |X_b| (the bound over every phase
        // difference), never |X_a + X_b|; identity, tolerance 1e-12 rel.
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, Zeta), null,
            new ForceLoad("a", "m", 300, 0, F1), new ForceLoad("b", "m", 300, Math.PI, F1));
        var result = LoadCaseAnalysis.Solve(system, Spec, new LoadCaseSelection([new LoadCase("a", ["a"]), new LoadCase("b", ["b"])], CaseCombination.Sum));
        var x = 300 / K * D(0.5);
        NumericAssert.Close(2 * x, result.Combined[0].Peak(ResponseQuantity.Displacement, CaseCombination.Sum), Tolerance.Rel(1e-9), "|Xa| + |Xb|");
        var together = HarmonicAnalysis.Solve(system, Spec with { Loads = ["a", "b"] }).OperatingPoints.Single().Response.Responses[0].Displacement[0];
        NumericAssert.Small(together.Magnitude, 1e-15, "the two loads in one case cancel (opposite phases)");
    }

    [Fact]
    public void ACaseWithoutRunningSpeed_AddsNoComponent_AndSaysSo()
    {
        // Identity: no speed, no operating point; the note names the case.
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, Zeta), null, new ForceLoad("a", "m", 300, 0, F1), new ForceLoad("shaker", "m", 50, 0));
        var result = LoadCaseAnalysis.Solve(system, Spec, new LoadCaseSelection([new LoadCase("a", ["a"]), new LoadCase("test", ["shaker"])], CaseCombination.Sum));
        Assert.Single(result.Combined[0].Components);
        Assert.Contains(result.Notes, n => n.Contains("'test'") && n.Contains("no operating point"));
    }

    [Theory]
    [InlineData(CaseCombination.Sum, AmplitudeMeasure.Peak)]
    [InlineData(CaseCombination.Sum, AmplitudeMeasure.Rms)]
    [InlineData(CaseCombination.Rms, AmplitudeMeasure.Peak)]
    [InlineData(CaseCombination.Rms, AmplitudeMeasure.Rms)]
    public void VibrationLimits_AreCheckedAgainstTheCombination(CaseCombination rule, AmplitudeMeasure measure)
    {
        // Closed-form components (Chopra §3.2 [from memory]) combined by hand in the limit's measure; tolerance 1e-9 rel.
        var system = TwoMachines();
        var limit = new VibrationLimit("m", ResponseQuantity.Velocity, measure, 0.05);
        var outcome = LoadCaseLimits.Evaluate(system, new LoadCaseSelection([CaseA, CaseB], rule), [limit]);
        var v1 = 2 * Math.PI * F1 * A1 / K * D(0.5);
        var v2 = 2 * Math.PI * F2 * A2 / K * D(2.0);
        var scale = measure == AmplitudeMeasure.Rms ? 1 / Math.Sqrt(2) : 1;
        var hand = rule == CaseCombination.Sum ? scale * (v1 + v2) : scale * Math.Sqrt(v1 * v1 + v2 * v2);
        var r = Assert.Single(outcome.Evaluated);
        NumericAssert.Close(hand, r.Value, Tolerance.Rel(1e-9), $"{rule} {measure}");
        NumericAssert.Close((0.05 - hand) / 0.05, r.Reserve, Tolerance.Rel(1e-9), "reserve");
    }

    [Fact]
    public void WithoutCases_TheMeasuresKeepTheirOwnCombination_WhichTheRulesReproduce()
    {
        // Identity: for loads at distinct speeds, the case path with sum gives the old peak and with rms the old r.m.s.; 1e-12 rel.
        var system = TwoMachines();
        var cases = new[] { CaseA, CaseB }.ToImmutableArray();
        foreach (var (measure, rule) in new[] { (AmplitudeMeasure.Peak, CaseCombination.Sum), (AmplitudeMeasure.Rms, CaseCombination.Rms) })
        {
            var limit = new VibrationLimit("m", ResponseQuantity.Displacement, measure, 1);
            var old = OperatingPointLimits.Evaluate(system, system.Model.Loads, [limit]).Evaluated.Single().Value;
            var byCase = LoadCaseLimits.Evaluate(system, new LoadCaseSelection(cases, rule), [limit]).Evaluated.Single().Value;
            NumericAssert.Close(old, byCase, Tolerance.Rel(1e-12), measure.ToString());
        }
    }
}
