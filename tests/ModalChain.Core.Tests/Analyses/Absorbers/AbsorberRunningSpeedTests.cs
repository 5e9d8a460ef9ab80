using System.Collections.Immutable;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Absorbers;

/// <summary>The running-speed tuning (a constant-speed machine) against the closed form and a brute-force search.</summary>
public class AbsorberRunningSpeedTests
{
    private const double M = 1000;
    private static readonly double K = M * Math.Pow(2 * Math.PI * 10, 2); // f_p = 10 Hz

    private static (StructuralModel Model, ModalResult Modal) UndampedPrimary()
    {
        var net = new NetworkBuilder().AddMass("floor", M).AddSpring("legs", Network.Ground, "floor", K).Build();
        return (StructuralModel.Of(net), ModalAnalysis.Solve(net));
    }

    [Fact]
    public void SingleSpeedNoTolerance_UndampedAbsorberTunedToTheSpeedCancelsTheHost()
    {
        // Den Hartog, Mechanical Vibrations, 4th ed., §3.2 [from memory]; REFERENCES.md §1: with k_a/m_a = ω² the primary's
        // amplitude X1 is zero at ω. Forcing at 9.2 Hz on a 10 Hz undamped primary, μ = 5 %, tolerance 0.
        var (model, modal) = UndampedPrimary();
        var request = new AbsorberRequest("floor", 0.05, null, [9.2], AbsorberTarget.RunningSpeed, 0);
        var tuned = AbsorberStudy.Run(model, modal, request, optimal: false, []);
        var d = tuned.Design;
        NumericAssert.Close(9.2, d.FrequencyHz, Tolerance.Rel(1e-12), "absorber frequency = forcing frequency");
        Assert.Equal(0, d.Damping);
        NumericAssert.Close(d.Mass * Math.Pow(2 * Math.PI * 9.2, 2), d.Stiffness, Tolerance.Rel(1e-12), "k_a = m_a ω²");
        var at = Assert.Single(tuned.Assessment.AtSpeeds);
        // Without the absorber: |X1| k / F = 1/|1 − r²| with r = 0.92 (single-degree-of-freedom closed form).
        NumericAssert.Close(1 / (1 - 0.92 * 0.92), at.Before, Tolerance.Rel(1e-9), "before, 1/(1 − r²)");
        NumericAssert.Small(at.After, 1e-9 * at.Before, "host amplitude with the absorber at the forcing frequency");
        Assert.Equal("running-speed", tuned.Method);
    }

    [Fact]
    public void WithTolerance_WorstResponseOverTheSpeedBandIsMinimal_AgainstAGridSearch()
    {
        // Property implemented: the design minimises max |X1| k/F over f_s(1 ± t). Checked against a brute-force grid over
        // the absorber's frequency ratio and damping ratio, evaluated with the independent two-mass closed form
        // (TwoMassAbsorberReference, Den Hartog §3.3 equations). Speed 9.5 Hz on the 10 Hz primary, t = 5 %, μ = 5 %.
        const double mu = 0.05, speedRatio = 0.95, t = 0.05;
        var (model, modal) = UndampedPrimary();
        var request = new AbsorberRequest("floor", mu, null, [10 * speedRatio], AbsorberTarget.RunningSpeed, t);
        var tuned = AbsorberStudy.Run(model, modal, request, optimal: false, []);

        static double Worst(double f, double zeta)
        {
            var worst = 0.0;
            for (var i = 0; i <= 200; i++)
                worst = Math.Max(worst, TwoMassAbsorberReference.Amplification(mu, f, zeta, speedRatio * (1 - t + 2 * t * i / 200.0)));
            return worst;
        }
        var design = Worst(tuned.Design.FrequencyHz / 10, tuned.Design.DampingRatio);
        // A coarse grid over the whole range, then a fine one around its best point.
        (double F, double Zeta, double Value) Grid(double f0, double f1, double df, double z0, double z1, double dz)
        {
            var best = (F: f0, Zeta: z0, Value: double.PositiveInfinity);
            for (var f = f0; f <= f1 + 1e-12; f += df)
                for (var z = Math.Max(0, z0); z <= z1 + 1e-12; z += dz)
                {
                    var v = Worst(f, z);
                    if (v < best.Value) best = (f, z, v);
                }
            return best;
        }
        var coarse = Grid(0.85, 1.10, 0.005, 0, 0.2, 0.005);
        var gridBest = Math.Min(coarse.Value, Grid(coarse.F - 0.005, coarse.F + 0.005, 0.0005, coarse.Zeta - 0.005, coarse.Zeta + 0.005, 0.0005).Value);
        Assert.True(design <= gridBest * 1.01, $"design's worst over the speed band {design} should not exceed the grid's best {gridBest} by more than 1 %");
        var denHartog = ClassicalOptimum.DenHartog(mu);
        Assert.True(design <= Worst(denHartog.FrequencyRatio, denHartog.DampingRatio), "never worse than Den Hartog's tuning on the speed band");
    }

    [Fact]
    public void RunningSpeedTarget_WithoutASpeed_IsAProblem()
    {
        var (_, modal) = UndampedPrimary();
        var problems = AbsorberTuning.Problems(modal, new AbsorberRequest("floor", 0.05, null, ImmutableArray<double>.Empty, AbsorberTarget.RunningSpeed));
        Assert.Contains(problems, p => p.Contains("running speed", StringComparison.Ordinal));
    }
}
