using ModalChain.Core.Analyses.Absorbers;
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
}
