using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Inerters (force b·(ẍ_a − ẍ_b)): their mass matrix terms and the modes of networks that carry them.</summary>
public class InerterTests
{
    [Fact]
    public void AMassOnASpringWithAnInerterToGround_HasTheFrequencyOfMassPlusInertance()
    {
        // ω = √(k/(m + b)): the grounded inerter adds b to the apparent mass (closed form; issue 11, common practice).
        const double m = 240, k = 9.5e4, b = 360;
        var network = new NetworkBuilder().AddMass("tuned", m).AddSpring("k", Network.Ground, "tuned", k)
            .AddInerter("b", "tuned", Network.Ground, b).Build();
        var result = ModalAnalysis.Solve(network);
        NumericAssert.Close(Math.Sqrt(k / (m + b)), result.Modes[0].AngularFrequency, Tolerance.Rel(1e-13), "ω");
        // ιᵀMι counts the grounded terminal's inertance; the physical mass does not.
        NumericAssert.Close(m + b, result.TotalMass, Tolerance.Rel(1e-15), "ιᵀMι");
        NumericAssert.Close(m, network.TotalMass, Tolerance.Rel(1e-15), "physical mass");
    }

    [Fact]
    public void AnInerterBetweenTwoMasses_AddsItsInertanceAsASpringAddsStiffness()
    {
        // M = diag(m) + b·[[1, −1], [−1, 1]] (the two-terminal element's matrix; issue 11, common practice).
        const double m1 = 1200, m2 = 85, b = 40;
        var network = new NetworkBuilder().AddMass("deck", m1).AddMass("skid", m2)
            .AddSpring("k1", Network.Ground, "deck", 4e6).AddSpring("k2", "deck", "skid", 2e5)
            .AddInerter("b", "deck", "skid", b).Build();
        var matrices = Assembler.Assemble(network);
        var expected = Matrix<double>.Build.DenseOfArray(new[,] { { m1 + b, -b }, { -b, m2 + b } });
        NumericAssert.Close(expected, matrices.DenseMass(), Tolerance.Abs(0), "M");
        Assert.False(matrices.MassIsDiagonal);
        var partition = SupportPartition.Assemble(network);
        NumericAssert.Close(expected, partition.Mass, Tolerance.Abs(0), "M of the support partition");
    }

    [Fact]
    public void AnInerterToASupport_KeepsMDiagonal()
    {
        var network = new NetworkBuilder().AddMass("deck", 100).AddSupport("wall")
            .AddSpring("k", "wall", "deck", 1e4).AddInerter("b", "wall", "deck", 25).Build();
        var matrices = Assembler.Assemble(network);
        Assert.True(matrices.MassIsDiagonal);
        NumericAssert.Close(125.0, matrices.Mass[0, 0], Tolerance.Abs(0), "M");
    }

    [Theory]
    [InlineData(1200.0, 85.0, 4e6, 2e5, 40.0)]
    [InlineData(10.0, 10.0, 1e4, 1e4, 0.5)]
    [InlineData(3.0, 900.0, 2e5, 7e6, 300.0)]
    public void TwoMassesJoinedByASpringAndAnInerter_MatchTheFrequencyEquation(double m1, double m2, double k1, double k2, double b)
    {
        // det(K − ω²M) = 0 with M = [[m1+b, −b], [−b, m2+b]], K = [[k1+k2, −k2], [−k2, k2]]:
        // det M·ω⁴ − (K11·M22 + K22·M11 − 2·K12·M12)·ω² + det K = 0 (closed form of the 2×2 generalised eigenproblem).
        var network = new NetworkBuilder().AddMass("a", m1).AddMass("c", m2)
            .AddSpring("k1", Network.Ground, "a", k1).AddSpring("k2", "a", "c", k2).AddInerter("b", "a", "c", b).Build();
        double m11 = m1 + b, m22 = m2 + b, m12 = -b, k11 = k1 + k2, k22 = k2, k12 = -k2;
        var qa = m11 * m22 - m12 * m12;
        var qb = k11 * m22 + k22 * m11 - 2 * k12 * m12;
        var qc = k11 * k22 - k12 * k12;
        var high = (qb + Math.Sqrt(qb * qb - 4 * qa * qc)) / (2 * qa);
        var low = qc / (qa * high);
        var result = ModalAnalysis.Solve(network);
        NumericAssert.Close(low, result.Modes[0].EigenValue, Tolerance.Rel(1e-11), "ω1²");
        NumericAssert.Close(high, result.Modes[1].EigenValue, Tolerance.Rel(1e-11), "ω2²");
    }

    [Theory]
    [InlineData(50.0, 30.0, 2e4, 10.0)]
    [InlineData(1.0, 1000.0, 5e3, 0.2)]
    public void TwoFreeMassesJoinedByASpringAndAnInerter_HaveOneRigidModeAndTheRelativeMode(double m1, double m2, double k, double b)
    {
        // Free–free pair: one rigid-body mode, and the relative motion with mass μ + b, μ = m1·m2/(m1 + m2):
        // ω² = k/(μ + b) (closed form, common practice).
        var network = new NetworkBuilder().AddMass("a", m1).AddMass("c", m2)
            .AddSpring("k", "a", "c", k).AddInerter("b", "a", "c", b).Build();
        var result = ModalAnalysis.Solve(network);
        Assert.True(result.Modes[0].IsRigidBody);
        var mu = m1 * m2 / (m1 + m2);
        NumericAssert.Close(k / (mu + b), result.Modes[1].EigenValue, Tolerance.Rel(1e-11), "ω²");
        NumericAssert.Small(result.Quality.MaxOrthogonalityError, 1e-12, "|ΦᵀMΦ − I|");
        NumericAssert.Close(m1 + m2, result.Modes.Sum(mode => mode.EffectiveModalMass), Tolerance.Rel(1e-12), "ΣM*");
    }

    [Fact]
    public void FreeGroupsJoinedOnlyByAnInerter_GetMOrthonormalRigidModes()
    {
        // Two spring-held-free groups tied by an inerter only: two rigid-body modes whose translations are not
        // M-orthogonal; the reported rigid modes must still satisfy ΦᵀMΦ = I and K φ = 0 (definition of the modes).
        var network = new NetworkBuilder().AddMass("a", 20).AddMass("c", 30).AddMass("d", 5).AddMass("e", 8)
            .AddSpring("k1", "a", "c", 1e4).AddSpring("k2", "d", "e", 3e3)
            .AddInerter("b1", "c", "d", 4).AddInerter("b2", "e", Network.Ground, 2).Build();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(2, result.Modes.Count(mode => mode.IsRigidBody));
        var matrices = result.Matrices;
        var shapes = Matrix<double>.Build.DenseOfColumns(result.Modes.Select(mode => (IEnumerable<double>)mode.Shape));
        NumericAssert.Close(Matrix<double>.Build.DenseIdentity(4), shapes.Transpose() * matrices.DenseMass() * shapes, Tolerance.Abs(1e-12), "ΦᵀMΦ");
        foreach (var mode in result.Modes.Where(mode => mode.IsRigidBody))
            NumericAssert.Small((matrices.Stiffness * Vector<double>.Build.DenseOfEnumerable(mode.Shape)).L2Norm(), 1e-9, "K φ of a rigid mode");
    }

    [Fact]
    public void SeededRandomNetworksWithInerters_KeepTheModalIdentities()
    {
        // On 60 seeded random networks with inerters between masses and to supports: ΦᵀMΦ = I, the eigen residual,
        // and Σ M* = ιᵀMι with Γ = φᵀMι and M* = Γ²/φᵀMφ (Chopra, Dynamics of Structures, §13.2: the modes span the
        // DOFs, so ι = Σ Γ_j φ_j and ιᵀMι = Σ Γ_j²); ιᵀMι includes the inerters' grounded terminals.
        var random = new Random(20261202);
        for (var c = 0; c < 60; c++)
        {
            var size = 2 + random.Next(14);
            var b = new NetworkBuilder { Title = $"random inerter network {c}" };
            for (var i = 0; i < size; i++) b.AddMass($"n{i}", Math.Pow(10, 2 * random.NextDouble()));
            for (var i = 1; i < size; i++)
                if (random.NextDouble() < 0.9) b.AddSpring($"k{i}", $"n{random.Next(i)}", $"n{i}", Math.Pow(10, 4 + 2 * random.NextDouble()));
            if (random.NextDouble() < 0.8) b.AddSpring("kg", Network.Ground, "n0", 1e5);
            var inerters = 1 + random.Next(size);
            for (var j = 0; j < inerters; j++)
            {
                var a = random.Next(size);
                var other = random.NextDouble() < 0.25 ? Network.Ground : $"n{(a + 1 + random.Next(size - 1)) % size}";
                b.AddInerter($"b{j}", $"n{a}", other, Math.Pow(10, 2 * random.NextDouble() - 0.5));
            }
            var network = b.Build();
            var result = ModalAnalysis.Solve(network);
            var m = result.Matrices.DenseMass();
            var iota = result.Matrices.Influence;
            var shapes = Matrix<double>.Build.DenseOfColumns(result.Modes.Select(mode => (IEnumerable<double>)mode.Shape));
            NumericAssert.Close(Matrix<double>.Build.DenseIdentity(size), shapes.Transpose() * m * shapes, Tolerance.Abs(1e-10), $"case {c}: ΦᵀMΦ");
            NumericAssert.Close(iota * (m * iota), result.TotalMass, Tolerance.Rel(1e-14), $"case {c}: total mass is ιᵀMι");
            NumericAssert.Close(result.TotalMass, result.Modes.Sum(mode => mode.EffectiveModalMass), Tolerance.Rel(1e-9), $"case {c}: ΣM*");
            NumericAssert.Small(result.Quality.MaxResidual, 1e-8, $"case {c}: residual");
            foreach (var mode in result.Modes)
                NumericAssert.Close(1.0, mode.KineticEnergyShare.Sum(), Tolerance.Abs(1e-12), $"case {c}: kinetic shares sum to 1");
        }
    }
}
