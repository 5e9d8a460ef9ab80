using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Studies;

// Allemang & Brown (1982), Proc. 1st IMAC [citation from memory]: MAC(a, b) = (aᵀb)²/((aᵀa)(bᵀb)): 1 for proportional vectors, 0 for orthogonal ones.
public class ModalAssuranceTests
{
    [Fact]
    public void ProportionalShapes_ScoreOne_OrthogonalShapesScoreZero()
    {
        NumericAssert.Close(1.0, ModalAssurance.Criterion([1.0, 2.0, -3.0], [-2.5, -5.0, 7.5]), Tolerance.Abs(1e-15), "scaled and flipped");
        NumericAssert.Close(0.0, ModalAssurance.Criterion([1.0, 1.0], [1.0, -1.0]), Tolerance.Abs(1e-15), "orthogonal");
        NumericAssert.Close(0.5, ModalAssurance.Criterion([1.0, 0.0], [1.0, 1.0]), Tolerance.Abs(1e-15), "45 degrees: cos² = 1/2");
    }

    [Fact]
    public void MassWeighted_DistinctModesOfOneModelScoreZero()
    {
        // REFERENCES §1 case A: mass-normalised modes are M-orthogonal, so the mass-weighted MAC is 0 off the diagonal.
        var net = new NetworkBuilder().AddMass("m1", 10).AddMass("m2", 1)
            .AddSpring("k1", Network.Ground, "m1", 30).AddSpring("k2", "m1", "m2", 5).Build();
        var modes = ModalAnalysis.Solve(net).Modes;
        double[] mass = [10, 1];
        NumericAssert.Close(0.0, ModalAssurance.Criterion(modes[0].Shape, modes[1].Shape, mass), Tolerance.Abs(1e-14), "weighted MAC(1,2)");
        NumericAssert.Close(1.0, ModalAssurance.Criterion(modes[1].Shape, modes[1].Shape, mass), Tolerance.Abs(1e-14), "weighted MAC(2,2)");
        Assert.True(ModalAssurance.Criterion(modes[0].Shape, modes[1].Shape) > 0.01, "the unweighted MAC of M-orthogonal modes is not 0 in general");
    }
}
