using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>The modal method on a model above 300 DOFs keeps the lowest modes only, says so, and matches a run given every mode.</summary>
public class LowestModesTransientTests
{
    [Fact]
    public void ModesNeeded_IsTheCountOrThirtyAboveThreeHundredDofs()
    {
        // The rule itself (docs/methods.md): all modes up to 300 DOFs; above, the modal method's count or 30.
        var modal = new TransientSettings(1, 1e-3, TransientMethod.Modal);
        Assert.Null(TransientAnalysis.ModesNeeded(300, modal));
        Assert.Equal(TransientAnalysis.AutomaticModeCount, TransientAnalysis.ModesNeeded(301, modal));
        Assert.Equal(12, TransientAnalysis.ModesNeeded(5000, modal with { ModeCount = 12 }));
        Assert.Equal(TransientAnalysis.AutomaticModeCount, TransientAnalysis.ModesNeeded(5000, new TransientSettings(1, 1e-3)));
    }

    [Fact]
    public void AutomaticLowestModes_GiveTheRunOfThoseModesTakenFromEveryMode()
    {
        // Identity: modal superposition integrates each kept mode on its own (Nigam & Jennings 1969), so a run on the
        // lowest 30 modes solved alone equals a run told to keep 30 of every mode. 1e-8 of each history's peak (two eigen solvers).
        const int size = 330;
        var network = HarmonicModels.Random(21, size, dampers: false);
        var model = new StructuralModel(network, new DampingModel([], RayleighDamping.FromTargets(0.03, 0.1, 2), 0), []);
        var settings = new TransientSettings(8, 0.01, TransientMethod.Modal) { Outputs = ["m5", "m200"] };
        var load = new ForceHistory("tap", "m5", 1, new HalfSinePulse(400, 0.2));

        var few = DampedSystem.Build(model, new ModalOptions(TransientAnalysis.ModesNeeded(size, settings)));
        Assert.Equal(TransientAnalysis.AutomaticModeCount, few.Modes.Modes.Length);
        var low = TransientAnalysis.Run(few, [load], [], settings);
        var reference = TransientAnalysis.Run(DampedSystem.Build(model), [load], [], settings with { ModeCount = TransientAnalysis.AutomaticModeCount });

        Assert.Contains(low.Warnings, w => w.Contains($"kept the lowest 30 of {size} modes, chosen automatically", StringComparison.Ordinal));
        Assert.DoesNotContain(reference.Warnings, w => w.Contains("chosen automatically", StringComparison.Ordinal));
        foreach (var quantity in new[] { ResponseQuantity.Displacement, ResponseQuantity.Acceleration })
            foreach (var mass in settings.Outputs)
            {
                var expected = reference.Get(mass, quantity).Values;
                var scale = expected.Max(Math.Abs);
                NumericAssert.Close(expected, low.Get(mass, quantity).Values, Tolerance.Abs(1e-8 * scale), $"{mass} {quantity}");
            }
    }
}
