using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Options and caller errors of <see cref="ModalAnalysis"/>: mode count, solver choice, empty networks.</summary>
public class ModalAnalysisTests
{
    [Fact]
    public void Count_GivesTheLowestModesWithPartialCumulativeMass()
    {
        // Fixed-free chain of 20: the lowest 4 modes equal those of the full solve; their cumulative effective-mass
        // fraction is below 1 and equals the partial sum. Tolerance 1e-12 relative.
        var network = TestNetworks.UniformChain(20, 15, 4e5, ChainEnds.FixedFree);
        var all = ModalAnalysis.Solve(network);
        var four = ModalAnalysis.Solve(network, new ModalOptions(Count: 4));
        Assert.Equal(4, four.Modes.Length);
        for (var j = 0; j < 4; j++)
        {
            NumericAssert.Close(all.Modes[j].EigenValue, four.Modes[j].EigenValue, Tolerance.Rel(1e-12), $"ω²{j + 1}");
            NumericAssert.Close(all.Modes[j].EffectiveModalMass, four.Modes[j].EffectiveModalMass, Tolerance.Rel(1e-9), $"M*{j + 1}");
        }
        var partial = all.Modes.Take(4).Sum(m => m.EffectiveMassFraction);
        NumericAssert.Close(partial, four.Modes[3].CumulativeEffectiveMassFraction, Tolerance.Rel(1e-9), "cumulative after 4 modes");
        Assert.True(four.Modes[3].CumulativeEffectiveMassFraction < 1 - 1e-3);
    }

    [Fact]
    public void ChosenSolver_IsUsedAndNamed()
    {
        var solver = new CountingSolver();
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(9, 1, 24, 3, 0), new ModalOptions(Solver: solver));
        Assert.Equal(1, solver.Calls);
        Assert.Equal(solver.Name, result.Algorithm);
        Assert.False(string.IsNullOrWhiteSpace(ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(9, 1, 24, 3, 0)).Algorithm));
    }

    [Fact]
    public void NetworkWithoutMasses_IsACallerError()
    {
        var empty = new NetworkBuilder().Build();
        Assert.Throws<ArgumentException>(() => ModalAnalysis.Solve(empty));
    }

    [Fact]
    public void SolvingFromAssembledMatrices_GivesTheSameModes()
    {
        var network = TestNetworks.Random(new Random(11), 9);
        var direct = ModalAnalysis.Solve(network);
        var assembled = ModalAnalysis.Solve(network, Assembler.Assemble(network));
        NumericAssert.Close(direct.Modes.Select(m => m.EigenValue).ToArray(), assembled.Modes.Select(m => m.EigenValue).ToArray(), Tolerance.Rel(0), "ω²");
    }

    private sealed class CountingSolver : IGeneralizedEigenSolver
    {
        public int Calls { get; private set; }
        public string Name => "counting wrapper of the dense solver";

        public EigenSolution Solve(Matrix<double> stiffness, Matrix<double> mass, int count, bool massIsDiagonal)
        {
            Calls++;
            return new DenseGeneralizedEigen().Solve(stiffness, mass, count, massIsDiagonal) with { Algorithm = Name };
        }
    }
}
