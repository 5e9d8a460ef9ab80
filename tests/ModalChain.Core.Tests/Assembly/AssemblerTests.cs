using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Assembly;

/// <summary>
/// Assembly of M, K and C from a network by the direct stiffness method: a two-node element of value k adds
/// [[k, −k], [−k, k]] at its two DOFs, an end on a support keeps only its diagonal term (Cook et al., Concepts and
/// Applications of Finite Element Analysis, 4th ed., §2.4; attribution from memory) [common practice].
/// </summary>
public class AssemblerTests
{
    private static Network FreeFreeNetwork() => new NetworkBuilder()
        .AddMass("a", 10).AddMass("b", 20).AddMass("c", 30).AddMass("d", 40)
        .AddSpring("ab", "a", "b", 1e3).AddSpring("bc", "b", "c", 2e3).AddSpring("cd", "c", "d", 3e3)
        .AddSpring("ac", "a", "c", 5e2).AddSpring("db", "d", "b", 7e2)
        .Build();

    [Fact]
    public void MassMatrix_IsDiagonalWithTheMassesInDeclarationOrder()
    {
        var matrices = Assembler.Assemble(FreeFreeNetwork());
        Assert.True(matrices.MassIsDiagonal);
        NumericAssert.Close(Matrix<double>.Build.DenseOfDiagonalArray([10.0, 20, 30, 40]), matrices.DenseMass(), Tolerance.Abs(0), "M");
        NumericAssert.Close(new[] { 1.0, 1, 1, 1 }, matrices.Influence.ToArray(), Tolerance.Abs(0), "ι");
    }

    [Fact]
    public void StiffnessMatrix_MatchesHandAssemblyAndIsSymmetric()
    {
        // Hand assembly of the five springs (values in N/m). Exact arithmetic on these numbers: tolerance 0.
        var k = Assembler.Assemble(FreeFreeNetwork()).DenseStiffness();
        var expected = Matrix<double>.Build.DenseOfArray(new double[,]
        {
            { 1500, -1000, -500, 0 },
            { -1000, 3700, -2000, -700 },
            { -500, -2000, 5500, -3000 },
            { 0, -700, -3000, 3700 },
        });
        NumericAssert.Close(expected, k, Tolerance.Abs(0), "K");
        NumericAssert.Close(k.Transpose(), k, Tolerance.Abs(0), "Kᵀ");
    }

    [Fact]
    public void FreeFreeStiffness_HasZeroRowSums()
    {
        // With no support, a rigid translation stores no strain energy: K ι = 0 (common practice).
        var k = Assembler.Assemble(FreeFreeNetwork()).DenseStiffness();
        NumericAssert.Close(new double[4], k.RowSums().ToArray(), Tolerance.Abs(1e-12), "row sums of K");
    }

    [Fact]
    public void SpringToGround_AddsOnlyToTheDiagonal()
    {
        var free = Assembler.Assemble(FreeFreeNetwork()).DenseStiffness();
        var b = new NetworkBuilder()
            .AddMass("a", 10).AddMass("b", 20).AddMass("c", 30).AddMass("d", 40)
            .AddSpring("ab", "a", "b", 1e3).AddSpring("bc", "b", "c", 2e3).AddSpring("cd", "c", "d", 3e3)
            .AddSpring("ac", "a", "c", 5e2).AddSpring("db", "d", "b", 7e2)
            .AddSpring("footing", Network.Ground, "c", 4.5e4);
        var grounded = Assembler.Assemble(b.Build()).DenseStiffness();
        var difference = grounded - free;
        var expected = Matrix<double>.Build.Dense(4, 4);
        expected[2, 2] = 4.5e4;
        NumericAssert.Close(expected, difference, Tolerance.Abs(0), "K(grounded) − K(free)");
    }

    [Fact]
    public void SpringBetweenTwoSupports_AddsNothing()
    {
        var b = new NetworkBuilder().AddSupport("wall").AddMass("m", 5)
            .AddSpring("k", Network.Ground, "m", 100).AddSpring("strut", Network.Ground, "wall", 1e9).AddSpring("tie", "wall", "m", 50);
        var k = Assembler.Assemble(b.Build()).DenseStiffness();
        NumericAssert.Close(Matrix<double>.Build.DenseOfArray(new double[,] { { 150 } }), k, Tolerance.Abs(0), "K");
    }

    [Fact]
    public void ParallelSpringsBetweenTheSamePair_Add()
    {
        // Springs in parallel add their stiffnesses (common practice): two springs of 3 and 4 kN/m equal one of 7 kN/m.
        var pair = Assembler.Assemble(new NetworkBuilder().AddMass("a", 1).AddMass("b", 2)
            .AddSpring("p1", "a", "b", 3e3).AddSpring("p2", "b", "a", 4e3)
            .AddSpring("g1", Network.Ground, "a", 1e3).AddSpring("g2", "a", Network.Ground, 2e3).Build()).DenseStiffness();
        var single = Assembler.Assemble(new NetworkBuilder().AddMass("a", 1).AddMass("b", 2)
            .AddSpring("p", "a", "b", 7e3).AddSpring("g", Network.Ground, "a", 3e3).Build()).DenseStiffness();
        NumericAssert.Close(single, pair, Tolerance.Abs(0), "K of parallel springs");
    }

    [Fact]
    public void Dampers_BuildCTheWaySpringsBuildK()
    {
        // Every spring replaced by a damper of the same value gives C equal to that K; springs do not enter C.
        var springs = new NetworkBuilder().AddMass("a", 3).AddMass("b", 4).AddMass("c", 5)
            .AddSpring("ga", Network.Ground, "a", 120).AddSpring("ab", "a", "b", 80).AddSpring("ab2", "a", "b", 20)
            .AddSpring("bc", "b", "c", 60).AddSpring("cg", "c", Network.Ground, 10).Build();
        var dampers = new NetworkBuilder().AddMass("a", 3).AddMass("b", 4).AddMass("c", 5)
            .AddDamper("ga", Network.Ground, "a", 120).AddDamper("ab", "a", "b", 80).AddDamper("ab2", "a", "b", 20)
            .AddDamper("bc", "b", "c", 60).AddDamper("cg", "c", Network.Ground, 10).Build();
        var fromSprings = Assembler.Assemble(springs);
        var fromDampers = Assembler.Assemble(dampers);
        NumericAssert.Close(fromSprings.DenseStiffness(), fromDampers.DenseDamping(), Tolerance.Abs(0), "C from dampers vs K from springs");
        NumericAssert.Close(Matrix<double>.Build.Dense(3, 3), fromSprings.DenseDamping(), Tolerance.Abs(0), "C without dampers");
        NumericAssert.Close(Matrix<double>.Build.Dense(3, 3), fromDampers.DenseStiffness(), Tolerance.Abs(0), "K without springs");
    }

    [Fact]
    public void Matrices_FollowTheDofMapOrder()
    {
        // Renumbering the masses permutes rows and columns: K' = Pᵀ K P.
        var network = FreeFreeNetwork();
        int[] order = [2, 0, 3, 1];
        var k = Assembler.Assemble(network).DenseStiffness();
        var renumbered = Assembler.Assemble(network.WithMassOrder(order));
        Assert.Equal(["c", "a", "d", "b"], renumbered.Dofs.Dofs.Select(d => d.Node));
        var expected = Matrix<double>.Build.Dense(4, 4, (i, j) => k[order[i], order[j]]);
        NumericAssert.Close(expected, renumbered.DenseStiffness(), Tolerance.Abs(0), "K after renumbering");
        NumericAssert.Close(new[] { 30.0, 10, 40, 20 }, renumbered.Mass.Diagonal().ToArray(), Tolerance.Abs(0), "diag M after renumbering");
    }

    [Fact]
    public void SummedEntries_EqualTheirDenseSum_InTheOrderGiven_WithoutStoredZeros()
    {
        // Seeded coordinate entries with many repeats of each position, some of which cancel exactly: the sparse
        // matrix holds, at each position, the sum taken in the order given, and no entry that sums to zero
        // [identity: a dense array summed entry by entry].
        var random = new Random(20261202);
        const int n = 40;
        var entries = new List<(int Row, int Column, double Value)>();
        var dense = new double[n, n];
        for (var e = 0; e < 2_000; e++)
        {
            var (r, c, v) = (random.Next(n), random.Next(n), random.NextDouble() * 2 - 1);
            entries.Add((r, c, v));
            dense[r, c] += v;
            if (e % 5 == 0)
            {
                (r, c) = (random.Next(n), random.Next(n));
                entries.Add((r, c, 1.5));
                entries.Add((r, c, -1.5)); // a pair that cancels on a fresh position when nothing else lands there
                dense[r, c] += 1.5;
                dense[r, c] += -1.5;
            }
        }
        var summed = Assembler.Summed(n, entries);
        NumericAssert.Close(Matrix<double>.Build.DenseOfArray(dense), summed, Tolerance.Abs(0), "summed entries");
        var stored = summed.Storage.EnumerateNonZeroIndexed().Count();
        var nonZero = Enumerable.Range(0, n * n).Count(i => dense[i / n, i % n] != 0);
        Assert.Equal(nonZero, stored);
        var csr = (MathNet.Numerics.LinearAlgebra.Storage.SparseCompressedRowMatrixStorage<double>)summed.Storage;
        Assert.Equal(nonZero, csr.ValueCount); // no explicit zero kept either
    }
}
