using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>
/// The native LAPACK solver against the managed one and against closed forms: the same eigenvalues (1e-8 relative),
/// M-orthonormal shapes that span the same space within each repeated eigenvalue, for all pairs (dsyevd, dsygvd) and
/// for the lowest few (dsyevr, dsygvx), rigid-body and repeated-frequency models included.
/// </summary>
public class LapackEigenTests
{
    private const double Relative = 1e-8;

    public static TheoryData<string> Models => ["random 30", "random 61", "free-free chain", "two equal chains", "fixed-fixed chain"];

    private static Network Model(string name) => name switch
    {
        "random 30" => TestNetworks.Random(new Random(30), 30),
        "random 61" => TestNetworks.Random(new Random(61), 61),
        "free-free chain" => TestNetworks.UniformChain(12, 3.0, 2e4, ChainEnds.FreeFree),
        "two equal chains" => TwoEqualChains(9),
        _ => TestNetworks.UniformChain(15, 2.0, 5e4, ChainEnds.FixedFixed),
    };

    /// <summary>Two identical, uncoupled fixed–free chains: every frequency appears twice.</summary>
    private static Network TwoEqualChains(int n)
    {
        var b = new NetworkBuilder { Title = "two equal chains" };
        foreach (var side in new[] { "a", "b" })
        {
            for (var i = 1; i <= n; i++) b.AddMass($"{side}{i}", 4.0);
            b.AddSpring($"{side}s0", Network.Ground, $"{side}1", 3e4);
            for (var i = 1; i < n; i++) b.AddSpring($"{side}s{i}", $"{side}{i}", $"{side}{i + 1}", 3e4);
        }
        return b.Build();
    }

    [NativeFact]
    public void FixedFixedChain_MatchesTheClosedForm()
    {
        // Uniform fixed–fixed chain, ω_j = 2√(k/m)·sin(jπ/(2(n+1))) (REFERENCES.md §2, common practice). Tolerance 1e-10 relative.
        NativeFactAttribute.AssertLibraryLoaded();
        const int n = 15;
        const double m = 2.0, k = 5e4;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFixed));
        var solution = new LapackEigen().Solve(matrices.Stiffness, matrices.Mass, n, matrices.MassIsDiagonal);
        var expected = Enumerable.Range(1, n).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin(j * Math.PI / (2 * (n + 1))), 2)).ToArray();
        NumericAssert.Close(expected, solution.EigenValues, Tolerance.Rel(1e-10), "λ");
        Assert.Contains("native LAPACK", solution.Algorithm);
    }

    [NativeTheory]
    [MemberData(nameof(Models))]
    public void AllModes_MatchTheManagedSolver(string name)
    {
        NativeFactAttribute.AssertLibraryLoaded();
        var matrices = Assembler.Assemble(Model(name));
        var n = matrices.Size;
        var managed = new DenseGeneralizedEigen().Solve(matrices.Stiffness, matrices.Mass, n, matrices.MassIsDiagonal);
        var native = new LapackEigen().Solve(matrices.Stiffness, matrices.Mass, n, matrices.MassIsDiagonal);
        AssertSameModes(matrices.Stiffness, matrices.Mass, managed, native);
    }

    [NativeTheory]
    [MemberData(nameof(Models))]
    public void LowestModes_MatchTheManagedSolver(string name)
    {
        NativeFactAttribute.AssertLibraryLoaded();
        var matrices = Assembler.Assemble(Model(name));
        var count = Math.Max(2, matrices.Size / 3);
        var managed = new DenseGeneralizedEigen().Solve(matrices.Stiffness, matrices.Mass, count, matrices.MassIsDiagonal);
        var native = new LapackEigen().Solve(matrices.Stiffness, matrices.Mass, count, matrices.MassIsDiagonal);
        Assert.Equal(count, native.Count);
        // The last kept pair may belong to a repeated eigenvalue whose partner was not kept; compare below it.
        var whole = LastWholeCluster(managed.EigenValues.ToArray(), matrices.Size, matrices);
        AssertSameModes(matrices.Stiffness, matrices.Mass, Take(managed, whole), Take(native, whole));
    }

    [NativeTheory]
    [InlineData(true)]
    [InlineData(false)]
    public void FullMassMatrix_GoesThroughTheGeneralizedRoutines(bool allModes)
    {
        // A full SPD M (K's graph plus a diagonal) takes dsygvd/dsygvx; the managed Cholesky path is the reference.
        NativeFactAttribute.AssertLibraryLoaded();
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(5), 25));
        var n = matrices.Size;
        var k = matrices.DenseStiffness();
        var random = new Random(11);
        var b = Matrix<double>.Build.Dense(n, n, (_, _) => random.NextDouble() - 0.5);
        var m = b.TransposeThisAndMultiply(b) + matrices.DenseMass() * n;
        var count = allModes ? n : 6;
        var managed = new DenseGeneralizedEigen().Solve(k, m, count, massIsDiagonal: false);
        var native = new LapackEigen().Solve(k, m, count, massIsDiagonal: false);
        AssertSameModes(k, m, managed, native);
    }

    /// <summary>Same λ (1e-8 relative; rigid-body λ within 1e-8 of the stiffness scale), both M-orthonormal, and within
    /// every group of equal λ the shapes span the same space: ‖Aᵀ M B‖_F² equals the group's size.</summary>
    internal static void AssertSameModes(Matrix<double> k, Matrix<double> m, EigenSolution expected, EigenSolution actual)
    {
        Assert.Equal(expected.Count, actual.Count);
        var scale = TestNetworks.StiffnessScale(k, m);
        for (var j = 0; j < expected.Count; j++)
        {
            var e = expected.EigenValues[j];
            NumericAssert.Small(Math.Abs(actual.EigenValues[j] - e), Relative * Math.Abs(e) + 1e-10 * scale, $"λ{j}");
        }
        foreach (var s in new[] { expected, actual })
            NumericAssert.Close(Matrix<double>.Build.DenseIdentity(s.Count), s.Shapes.TransposeThisAndMultiply(m * s.Shapes), Tolerance.Abs(1e-9), $"ΦᵀMΦ ({s.Algorithm})");

        var cross = expected.Shapes.TransposeThisAndMultiply(m * actual.Shapes);
        var start = 0;
        while (start < expected.Count)
        {
            var end = start + 1;
            while (end < expected.Count && Same(expected.EigenValues[end], expected.EigenValues[start], scale)) end++;
            var sum = 0.0;
            for (var i = start; i < end; i++)
                for (var j = start; j < end; j++) sum += cross[i, j] * cross[i, j];
            NumericAssert.Close(end - start, sum, Tolerance.Abs(1e-7 * (end - start)), $"shapes of λ{start}..λ{end - 1} span the same space");
            start = end;
        }
    }

    private static bool Same(double a, double b, double scale) => Math.Abs(a - b) <= 1e-6 * Math.Abs(b) + 1e-9 * scale;

    private static int LastWholeCluster(double[] kept, int n, StructuralMatrices matrices)
    {
        var all = new DenseGeneralizedEigen().Solve(matrices.Stiffness, matrices.Mass, n, true).EigenValues;
        var scale = TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass);
        var count = kept.Length;
        while (count > 1 && count < n && Same(all[count], all[count - 1], scale)) count--;
        return count;
    }

    private static EigenSolution Take(EigenSolution s, int count) =>
        new([.. s.EigenValues.Take(count)], s.Shapes.SubMatrix(0, s.Shapes.RowCount, 0, count), s.Algorithm);
}
