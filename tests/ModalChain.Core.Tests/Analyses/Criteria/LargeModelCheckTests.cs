using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Criteria;

/// <summary>A check of a model above 300 DOFs solves only the modes it looks at and gives the all-mode outcome.</summary>
public class LargeModelCheckTests
{
    [Fact]
    public void LowestModesOnly_GiveTheSameGoverningPairAndLimits()
    {
        // Identity: the separation governing pair lies among the modes below twice the highest band edge here, and the
        // limits are direct solves at the operating points (no modes), so solving every mode changes nothing.
        // Reserves to 1e-9 relative (two eigen solvers); limit values to 1e-9 relative.
        const int size = 320;
        var network = HarmonicModels.Random(41, size, dampers: true);
        var model = new StructuralModel(network, new DampingModel([], RayleighDamping.FromTargets(0.02, 0.1, 1), 0),
            [new UnbalanceLoad("fan", "m12", 0.05, 0.35, 0)]);
        var criteria = new CriteriaSet(new SeparationCriterion(0.2, [0.35], [1, 2]),
            [new VibrationLimit("m12", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 1e-3)]);
        var few = CriteriaCheck.Assemble(model, criteria, model.Loads);
        var all = DampedSystem.Build(model);
        Assert.InRange(few.Modes.Modes.Length, 1, size / 4);
        Assert.Equal(all.Modes.Modes.Count(m => m.NaturalFrequencyHz < 2 * 1.2 * 0.7), few.Modes.Modes.Length);

        var low = CriteriaCheck.Evaluate(few, criteria, model.Loads);
        var reference = CriteriaCheck.Evaluate(all, criteria, model.Loads);
        Assert.Equal(reference.Separation!.Governing!.ModeNumber, low.Separation!.Governing!.ModeNumber);
        NumericAssert.Close(reference.Separation.Governing.Reserve, low.Separation.Governing.Reserve, Tolerance.Rel(1e-9), "governing reserve");
        NumericAssert.Close(reference.Limits[0].Value, low.Limits[0].Value, Tolerance.Rel(1e-9), "velocity at the operating point");
        Assert.Equal(reference.AllPass, low.AllPass);
    }
}
