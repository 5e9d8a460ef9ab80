using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Dofs;
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

    [Fact]
    public void FullMassMatrix_DistinctModesOfABodyWithCoupledInertiaScoreZero()
    {
        // Identity (mass orthogonality, φᵢᵀMφⱼ = 0): with a body whose inertia couples its rotations (J_xy ≠ 0) M is not
        // diagonal, and only the full-M MAC is 0 between distinct modes; the masses' diagonal alone does not give it.
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("skid", 800, new Point3(0, 0, 0.4), new InertiaMatrix(150, 220, 300, Xy: -40, Xz: 15),
            [new BodyPoint("a", new Point3(0.7, 0.4, 0)), new BodyPoint("b", new Point3(-0.7, 0.4, 0)), new BodyPoint("c", new Point3(0, -0.5, 0))]));
        foreach (var p in new[] { "a", "b", "c" })
            b.AddSpring(new Spring($"mount-{p}", $"skid.{p}", Network.Ground, 9e5)
                { Components = [new(Direction.X, 3e5), new(Direction.Y, 4e5), new(Direction.Z, 9e5)] });
        var modal = ModalAnalysis.Solve(b.Build());
        var modes = modal.Modes;
        var mass = modal.Matrices.Mass;
        Assert.False(modal.Matrices.MassIsDiagonal);
        var mac = ModalAssurance.Matrix([.. modes.Select(m => (IReadOnlyList<double>)m.Shape)], [.. modes.Select(m => (IReadOnlyList<double>)m.Shape)], mass);
        var worstPlain = 0.0;
        for (var i = 0; i < modes.Length; i++)
            for (var j = 0; j < modes.Length; j++)
            {
                NumericAssert.Close(i == j ? 1.0 : 0.0, mac[i, j], Tolerance.Abs(1e-12), $"full-M MAC({i + 1},{j + 1})");
                NumericAssert.Close(mac[i, j], ModalAssurance.Criterion(modes[i].Shape, modes[j].Shape, mass), Tolerance.Abs(1e-15), "the pairwise form");
                if (i != j) worstPlain = Math.Max(worstPlain, ModalAssurance.Criterion(modes[i].Shape, modes[j].Shape));
            }
        Assert.True(worstPlain > 1e-4, $"the unweighted MAC of distinct modes is not 0 here (largest {worstPlain})");
    }
}
