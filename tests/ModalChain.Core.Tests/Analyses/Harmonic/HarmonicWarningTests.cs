using System.Globalization;
using System.Numerics;
using System.Text.RegularExpressions;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Warnings a harmonic result must carry instead of a silent, meaningless figure.</summary>
public class HarmonicWarningTests
{
    [Fact]
    public void UndampedModel_ExcitedAtItsNaturalFrequency_IsWarned()
    {
        // No damping: |X| = F/|k − mω²| grows without bound as ω → ω_n (closed form, common practice), so a point at
        // resonance gives a number set by round-off. The result must say so, and only near resonance.
        const double m = 20, k = 8e5;
        var system = HarmonicModels.System(HarmonicModels.Sdof(m, k, 0), null, new ForceLoad("f", "m", 100, 0));
        var fn = system.Modes.Modes[0].NaturalFrequencyHz;
        var at = HarmonicAnalysis.Sweep(system, [fn * (1 + 1e-9)], system.Model.Loads, ["m"], HarmonicMethod.Direct);
        Assert.True(at.Responses[0].Displacement[0].Magnitude > 1, "the undamped response at resonance is huge");
        var warning = Assert.Single(at.Warnings);
        Assert.Contains("no damping", warning, StringComparison.Ordinal);
        Assert.Contains("mode 1", warning, StringComparison.Ordinal);

        Assert.Empty(HarmonicAnalysis.Sweep(system, [0.5 * fn], system.Model.Loads, ["m"], HarmonicMethod.Direct).Warnings);
        var damped = HarmonicModels.System(HarmonicModels.Sdof(m, k, 0.02), null, new ForceLoad("f", "m", 100, 0));
        Assert.Empty(HarmonicAnalysis.Sweep(damped, [fn], damped.Model.Loads, ["m"], HarmonicMethod.Direct).Warnings);
    }

    [Fact]
    public void UndampedOperatingPointAtResonance_IsWarnedInTheWholeResult()
    {
        // The running speed equals the natural frequency to 1e-9: the operating point's warning reaches the result.
        var network = HarmonicModels.Sdof(50, 2e6, 0);
        var fn = HarmonicModels.System(network).Modes.Modes[0].NaturalFrequencyHz;
        var model = new StructuralModel(network, DampingModel.None, [new UnbalanceLoad("rotor", "m", 0.01, fn * (1 + 1e-9))]);
        var result = HarmonicAnalysis.Solve(model, HarmonicSpec.Default(1, 2 * fn, 50));
        Assert.Contains(result.Warnings, w => w.StartsWith("operating point", StringComparison.Ordinal) && w.Contains("no damping", StringComparison.Ordinal));
    }

    /// <summary>The largest |X_modal − X_direct| over the outputs at each frequency, relative to the largest |X_direct| there.</summary>
    private static double WorstRelativeError(HarmonicResult direct, HarmonicResult modal)
    {
        var worst = 0.0;
        for (var k = 0; k < direct.FrequenciesHz.Length; k++)
        {
            var scale = direct.Responses.Max(r => r.Displacement[k].Magnitude);
            for (var o = 0; o < direct.Responses.Length; o++)
                worst = Math.Max(worst, (direct.Responses[o].Displacement[k] - modal.Responses[o].Displacement[k]).Magnitude / scale);
        }
        return worst;
    }

    private static double ReportedPercent(HarmonicResult result) =>
        double.Parse(Regex.Match(string.Join("\n", result.Notes), @"truncation error .*?up to ([0-9.eE+-]+) %").Groups[1].Value, CultureInfo.InvariantCulture);

    [Fact]
    public void TruncatedModalSweepWithNonClassicalDamping_EstimatesItsErrorAndWarnsAboveTolerance()
    {
        // Seeded non-classically damped networks, 2 of 10 modes kept: the estimate (direct solve at the response peaks)
        // must not exceed the true worst error over the sweep (computed here against the direct method, itself checked
        // against an independent dense solve in IndependentReferenceTests), must find at least half of it, and must warn
        // exactly when it is above the stated 2 % tolerance.
        var warned = 0;
        for (var seed = 1; seed <= 6; seed++)
        {
            var network = HarmonicModels.Random(300 + seed, 10, dampers: true);
            var system = HarmonicModels.System(network, null, new ForceLoad("f", "m3", 100, 0));
            Assert.False(system.IsClassical);
            var top = 1.2 * system.Modes.Modes[3].NaturalFrequencyHz;
            var f = FrequencyGrid.Build(new FrequencyRange(0.2, top, 300, FrequencySpacing.Linear), true,
                [.. system.Modes.Modes.Select(mo => mo.NaturalFrequencyHz)], system.ModalDampingRatios);
            var names = HarmonicModels.Names(network);
            var direct = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Direct);
            var modal = HarmonicAnalysis.Sweep(system, f, system.Model.Loads, names, HarmonicMethod.Modal, modeCount: 2);
            var actual = WorstRelativeError(direct, modal);
            var estimate = ReportedPercent(modal) / 100;
            Assert.True(estimate <= actual * 1.05 + 1e-12, $"seed {seed}: estimate {estimate} above the true worst error {actual}");
            Assert.True(estimate >= 0.5 * actual, $"seed {seed}: estimate {estimate} misses the true worst error {actual}");
            var warning = modal.Warnings.SingleOrDefault(w => w.Contains("modal superposition", StringComparison.Ordinal));
            Assert.Equal(estimate > HarmonicAnalysis.TruncationTolerance, warning is not null);
            if (warning is not null) warned++;
        }
        Assert.True(warned > 0, "2 of 10 modes must be off by more than 2 % on some of these networks");
    }

    [Fact]
    public void ModalSweepWithEveryModeKept_HasNoTruncationEstimateOrWarning()
    {
        var network = HarmonicModels.Random(301, 8, dampers: true);
        var system = HarmonicModels.System(network, null, new ForceLoad("f", "m3", 100, 0));
        var modal = HarmonicAnalysis.Sweep(system, [1, 5, 20], system.Model.Loads, ["m3"], HarmonicMethod.Modal, modeCount: 8);
        Assert.Empty(modal.Warnings);
        Assert.DoesNotContain(modal.Notes, n => n.Contains("truncation error", StringComparison.Ordinal));
    }
}
