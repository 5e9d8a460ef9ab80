using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Per-mode quantities of <see cref="Mode"/>: frequency units, period and modal mass at a DOF.</summary>
public class ModeTests
{
    [Theory]
    [InlineData(1.0, 1.0)]
    [InlineData(850.0, 8.4e6)]
    [InlineData(0.25, 3.0e3)]
    public void SingleDegreeOfFreedom_HasOmegaRootKOverMAndModalMassEqualToItsMass(double m, double k)
    {
        // ω = √(k/m), f = ω/2π, T = 1/f (single-DOF oscillator, REFERENCES.md §4: Rao ch. 2, Thomson ch. 2; attribution
        // from memory) and, with φ = 1/√m, the modal mass at the DOF 1/φ² = m [common practice]. Tolerance 1e-12 relative.
        var result = ModalAnalysis.Solve(new NetworkBuilder().AddMass("m", m).AddSpring("k", Network.Ground, "m", k).Build());
        var mode = Assert.Single(result.Modes);
        NumericAssert.Close(Math.Sqrt(k / m), mode.AngularFrequency, Tolerance.Rel(1e-12), "ω");
        NumericAssert.Close(Math.Sqrt(k / m) / (2 * Math.PI), mode.NaturalFrequencyHz, Tolerance.Rel(1e-12), "f");
        NumericAssert.Close(2 * Math.PI * Math.Sqrt(m / k), mode.PeriodSeconds, Tolerance.Rel(1e-12), "T");
        NumericAssert.Close(1 / Math.Sqrt(m), mode.Shape[0], Tolerance.Rel(1e-12), "φ");
        NumericAssert.Close(m, mode.ModalMassAt(0), Tolerance.Rel(1e-12), "modal mass at the DOF");
        NumericAssert.Close(Math.Sqrt(m), mode.ParticipationFactor, Tolerance.Rel(1e-12), "Γ");
        NumericAssert.Close(m, mode.EffectiveModalMass, Tolerance.Rel(1e-12), "M*");
        NumericAssert.Close(1.0, mode.KineticEnergyShare[0], Tolerance.Abs(1e-15), "kinetic share");
        NumericAssert.Close(1.0, mode.StrainEnergyShare[0], Tolerance.Abs(1e-15), "strain share");
    }

    [Fact]
    public void ModalMassAtADof_IsTheGeneralisedMassOfTheShapeScaledToOneThere()
    {
        // Case B of REFERENCES.md §1 (m1 = 9, m2 = 1; shapes {1, 3} and {1, −3}): scaled to X1 = 1 the generalised mass
        // is 9 + 1·9 = 18 kg; scaled to X2 = 1 it is 18/9 = 2 kg (values recomputed; attribution from memory).
        // Tolerance 1e-10 relative.
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(9, 1, 24, 3, 0));
        foreach (var mode in result.Modes)
        {
            NumericAssert.Close(18.0, mode.ModalMassAt(0), Tolerance.Rel(1e-10), $"mode {mode.Number} at m1");
            NumericAssert.Close(2.0, mode.ModalMassAt(1), Tolerance.Rel(1e-10), $"mode {mode.Number} at m2");
        }
    }
}
