using System.Collections.Immutable;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Absorbers;

public class AbsorberPerformanceTests
{
    private const double M = 2400, K = 6.0e7;

    private static (StructuralModel Model, AbsorberDesign Design, AbsorberNames Names) UndampedPrimary(double mu)
    {
        var net = new NetworkBuilder().AddMass("floor", M).AddSpring("legs", Network.Ground, "floor", K).Build();
        var design = AbsorberTuning.Design(ModalAnalysis.Solve(net), new AbsorberRequest("floor", mu, 1, []));
        return (StructuralModel.Of(net), design, AbsorberTuning.FreeNames(net, "floor"));
    }

    [Fact]
    public void ClosedFormOnUndampedPrimary_PeaksAsTheTwoMassReference()
    {
        // REFERENCES §3: with Den Hartog's f and ζ at μ = 0.05 the FRF peaks are 6.4075 and 6.4084; the worst is 6.4084.
        // The full-network sweep must find it to 2e-4 absolute; before the absorber the undamped primary is unbounded.
        var (model, design, names) = UndampedPrimary(0.05);
        var a = AbsorberPerformance.Assess(model, design, names);
        NumericAssert.Close(6.4084, a.PeakAfter, Tolerance.Abs(2e-4), "worst peak with Den Hartog's tuning");
        Assert.Equal(double.PositiveInfinity, a.PeakBefore);

        // Stroke per newton at the peak frequency from the independent two-mass receptance (Den Hartog §3.3 equations).
        var (x1, x2) = TwoMassAbsorberReference.Response(M, K, design.Mass, design.Stiffness, design.Damping, 2 * Math.PI * a.PeakFrequencyHz);
        NumericAssert.Close((x2 - x1).Magnitude, a.StrokePerForce, Tolerance.Rel(1e-9), "stroke |X2 − X1| per N");
        NumericAssert.Close(6.4084, x1.Magnitude * K, Tolerance.Abs(2e-4), "reference amplification at the same frequency");
    }

    [Fact]
    public void Mistuning_RaisesThePeak()
    {
        // A detuned absorber loses the balance of the two fixed points (Den Hartog §3.3), so every ±5 %, ±10 % error
        // gives a higher worst peak than the tuned one, and 10 % more than 5 %.
        var (model, design, names) = UndampedPrimary(0.05);
        var a = AbsorberPerformance.Assess(model, design, names);
        Assert.Equal([-0.10, -0.05, 0.05, 0.10], a.Mistuning.Select(p => p.FrequencyError).ToArray());
        Assert.All(a.Mistuning, p => Assert.True(p.Peak > a.PeakAfter, $"error {p.FrequencyError}: {p.Peak}"));
        Assert.True(a.Mistuning[0].Peak > a.Mistuning[1].Peak);
        Assert.True(a.Mistuning[3].Peak > a.Mistuning[2].Peak);
    }

    [Fact]
    public void OptimalOnUndampedTwoMassPrimary_LandsAtTheMinimaxPeak()
    {
        // The reference is computed here, independently of src: the minimax over f and ζ_a of the two-mass receptance's
        // worst peak (Den Hartog §3.3 equations; nested golden-section searches), 6.407921 at μ = 0.05, which REFERENCES §3
        // rounds to about 6.4080 (closed-form peaks 6.4075-6.4084). The optimiser reaches it to about 1e-12 relative; asserted to 1e-9.
        var reference = TwoMassAbsorberReference.Minimax(0.05);
        NumericAssert.Close(6.407921, reference.Peak, Tolerance.Abs(1e-6), "minimax of the two-mass receptance");
        var (model, design, names) = UndampedPrimary(0.05);
        var (optimal, evaluations) = AbsorberPerformance.Optimise(model, design, names);
        var peak = AbsorberPerformance.WorstPeak(AbsorberPerformance.With(model, optimal, names), optimal).Peak;
        NumericAssert.Close(reference.Peak, peak, Tolerance.Rel(1e-9), "optimal worst peak against the minimax");
        Assert.True(peak <= 6.4084 + 1e-4, $"optimal {peak} should not exceed the closed form's 6.4084");
        Assert.InRange(evaluations, 3, 400);
        Assert.Equal(design.Mass, optimal.Mass); // the mass ratio is fixed

        // Independent check of the optimum: both peaks of the two-mass receptance (Den Hartog §3.3 equations, written
        // in the test) with the optimal f and ζ, found on a fine grid: the true worst peak must itself be at the
        // minimax (0.1 %) and not above the closed form's 6.4084, so the optimiser has not exploited a sampled peak.
        var f = optimal.FrequencyHz / optimal.ModeFrequencyHz;
        var truePeaks = TwoMassAbsorberReference.Peaks(g => TwoMassAbsorberReference.Amplification(0.05, f, optimal.DampingRatio, g), 0.7, 1.3);
        Assert.Equal(2, truePeaks.Count);
        var worst = truePeaks.Max(p => p.Value);
        NumericAssert.Close(reference.Peak, worst, Tolerance.Rel(1e-9), "true worst peak of the optimal design");
        Assert.True(worst <= 6.40844 + 2e-4, $"true worst peak {worst} should not exceed the closed form's 6.4084");
        NumericAssert.Close(worst, peak, Tolerance.Rel(1e-9), "the search finds the true worst peak");
        NumericAssert.Close(design.FrequencyHz, optimal.FrequencyHz, Tolerance.Rel(0.02), "optimal tuning stays near Den Hartog's");
    }

    [Fact]
    public void NelderMead_FindsTheRosenbrockMinimum()
    {
        // Rosenbrock's function (1 − x)² + 100(y − x²)², minimum 0 at (1, 1): a standard test of the simplex method (Nelder & Mead 1965).
        var p = AbsorberPerformance.NelderMead(v => Math.Pow(1 - v[0], 2) + 100 * Math.Pow(v[1] - v[0] * v[0], 2), [-1.2, 1.0], [0.5, 0.5], 1e-14, 4000);
        NumericAssert.Close(1.0, p[0], Tolerance.Abs(1e-4), "x");
        NumericAssert.Close(1.0, p[1], Tolerance.Abs(1e-4), "y");
    }

    [Fact]
    public void OperatingStroke_IsTheRelativeMotionUnderTheModelsLoad()
    {
        // A 3 kN force at the host at 0.9 of the primary's frequency: stroke = F·|X2 − X1| from the independent two-mass receptance.
        var (model, design, names) = UndampedPrimary(0.05);
        var speed = 0.9 * design.ModeFrequencyHz;
        var load = new ForceLoad("pump", "floor", 3000, 0, speed);
        var stroke = AbsorberPerformance.OperatingStroke(model, design, names, [load]);
        var (x1, x2) = TwoMassAbsorberReference.Response(M, K, design.Mass, design.Stiffness, design.Damping, 2 * Math.PI * speed);
        NumericAssert.Close(3000 * (x2 - x1).Magnitude, stroke, Tolerance.Rel(1e-9), "stroke in m");
        Assert.True(double.IsNaN(AbsorberPerformance.OperatingStroke(model, design, names, [load with { SpeedHz = null }])));
    }

    [Fact]
    public void OperatingStroke_UnderLoadCases_IsEachCaseOnItsOwnCombinedByTheRule()
    {
        // Two cases on one host mass: case A is a 1 kN force at 20 Hz; case B is a 2 kN force in anti-phase at the same
        // 20 Hz and a 0.5 kN force at 30 Hz. Hand sum from the two-mass closed form (Den Hartog §3.3 equations, in
        // TwoMassAbsorberReference): s = F·|X2 − X1| per component, then Σ s_k (sum rule) or √(Σ s_k²) (rms rule), the
        // cases never added as phasors even at a shared speed. Tolerance 1e-9 relative.
        var (model, design, names) = UndampedPrimary(0.05);
        var loads = new Load[]
        {
            new ForceLoad("a", "floor", 1000, 0, 20),
            new ForceLoad("b", "floor", 2000, Math.PI, 20),
            new ForceLoad("c", "floor", 500, 0, 30),
        };
        model = model with { Loads = [.. loads] };
        System.Numerics.Complex PerNewton(double hz)
        {
            var (x1, x2) = TwoMassAbsorberReference.Response(M, K, design.Mass, design.Stiffness, design.Damping, 2 * Math.PI * hz);
            return x2 - x1;
        }
        var sA = 1000 * PerNewton(20);
        var sB20 = -2000 * PerNewton(20);
        var sB30 = 500 * PerNewton(30);
        var cases = ImmutableArray.Create(new LoadCase("A", ["a"]), new LoadCase("B", ["b", "c"]));

        var sum = AbsorberPerformance.OperatingStroke(model, design, names, new LoadCaseSelection(cases, CaseCombination.Sum));
        NumericAssert.Close(sA.Magnitude + sB20.Magnitude + sB30.Magnitude, sum, Tolerance.Rel(1e-9), "sum rule: Σ s_k");
        var rms = AbsorberPerformance.OperatingStroke(model, design, names, new LoadCaseSelection(cases, CaseCombination.Rms));
        NumericAssert.Close(Math.Sqrt(sA.Magnitude * sA.Magnitude + sB20.Magnitude * sB20.Magnitude + sB30.Magnitude * sB30.Magnitude), rms, Tolerance.Rel(1e-9), "rms rule: √(Σ s_k²)");

        // Not the grouping by speed across cases: that would add A and B at 20 Hz as phasors (1 kN against 2 kN in anti-phase).
        var grouped = AbsorberPerformance.OperatingStroke(model, design, names, loads);
        NumericAssert.Close((sA + sB20).Magnitude + sB30.Magnitude, grouped, Tolerance.Rel(1e-9), "without cases: loads at one speed act together");
        Assert.True(sum > grouped * 1.5, $"sum rule {sum} vs phasor grouping {grouped}");

        // A selection whose cases have no load with a speed has no stroke in operation.
        var still = model with { Loads = [new ForceLoad("d", "floor", 1000, 0)] };
        Assert.True(double.IsNaN(AbsorberPerformance.OperatingStroke(still, design, names, new LoadCaseSelection([new LoadCase("D", ["d"])], CaseCombination.Sum))));
    }

    [Fact]
    public void AbsorberStudy_WithLoadCases_UsesThemForTheStrokeAndSaysSo()
    {
        // The same two cases through the path tune and the report take: the stroke is the case-by-case sum, and its basis
        // names the cases and the rule (identity with OperatingStroke above).
        var net = new NetworkBuilder().AddMass("floor", M).AddSpring("legs", Network.Ground, "floor", K).Build();
        var loads = ImmutableArray.Create<Load>(new ForceLoad("a", "floor", 1000, 0, 20), new ForceLoad("b", "floor", 2000, Math.PI, 20));
        var model = StructuralModel.Of(net) with { Loads = loads };
        var cases = new LoadCaseSelection([new LoadCase("A", ["a"]), new LoadCase("B", ["b"])], CaseCombination.Sum);
        var tuned = AbsorberStudy.Run(model, ModalAnalysis.Solve(net), new AbsorberRequest("floor", 0.05, 1, []), false, loads, cases);
        NumericAssert.Close(AbsorberPerformance.OperatingStroke(model, tuned.Design, tuned.Names, cases), tuned.Assessment.OperatingStroke, Tolerance.Rel(1e-12), "stroke");
        Assert.Equal("under the load cases A, B, each on its own at its running speeds, combined by the sum rule", tuned.Assessment.OperatingStrokeBasis);
        var plain = AbsorberStudy.Run(model, ModalAnalysis.Solve(net), new AbsorberRequest("floor", 0.05, 1, []), false, loads);
        Assert.Equal(AbsorberPerformance.LoadsBasis, plain.Assessment.OperatingStrokeBasis);
        Assert.True(tuned.Assessment.OperatingStroke > 2 * plain.Assessment.OperatingStroke, "1 + 2 against |1 − 2|");
    }
}
