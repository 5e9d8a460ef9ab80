using System.Collections.Concurrent;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>
/// Every eigen solver (managed dense, native dense where the library loads, sparse shift-invert Lanczos) gives the same
/// lowest 31, 60 and 100 modes of a long chain, a square grid (repeated frequencies), two free chains side by side
/// (rigid-body modes, every frequency doubled) and a seeded random network: frequencies against the closed form where
/// there is one, and against each other to 1e-8 relative; shapes M-orthonormal and spanning the same subspaces.
/// The managed dense solver is left out on the 2,100-mass chain only: its full O(n³) reduction takes minutes of
/// processor time in a test run; the closed form checks the other two there.
/// </summary>
public class EigenSolverAgreementTests
{
    // The dense solvers compute the same pairs for every count: solve once per model and solver, keep the lowest 100.
    private static readonly ConcurrentDictionary<(string Model, string Solver), EigenSolution> DenseCache = new();

    public static TheoryData<string, int> Cases()
    {
        var data = new TheoryData<string, int>();
        foreach (var model in new[] { "chain", "grid", "twin-free-chains", "random" })
            foreach (var count in new[] { 31, 60, 100 }) data.Add(model, count);
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void EverySolver_GivesTheSameLowestModes(string model, int count)
    {
        var (matrices, exact) = Model(model);
        var scale = TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass);
        // 1e-8 relative; rigid-body eigenvalues (zero) compared to 1e-10 of the stiffness scale.
        var tolerance = new Tolerance(1e-10 * scale, 1e-8);

        var solutions = new List<(string Name, EigenSolution Solution)>();
        var references = new List<EigenSolution>();
        if (model != "chain")
        {
            references.Add(DenseCache.GetOrAdd((model, "managed"), _ =>
                new DenseGeneralizedEigen().Solve(matrices.DenseStiffness(), matrices.DenseMass(), 100, massIsDiagonal: true)));
            solutions.Add(("managed", Lowest(references[^1], count)));
        }
        if (NativeLapack.IsAvailable)
        {
            references.Add(DenseCache.GetOrAdd((model, "native"), _ =>
                new LapackEigen().Solve(matrices.DenseStiffness(), matrices.DenseMass(), 100, massIsDiagonal: true)));
            solutions.Add(("native", Lowest(references[^1], count)));
        }
        else if (NativeFactAttribute.RequiredHere) NativeFactAttribute.AssertLibraryLoaded();
        solutions.Add(("sparse", new ShiftInvertLanczos().Solve(matrices.Stiffness, matrices.Mass, count, massIsDiagonal: true)));
        Assert.True(exact is not null || solutions.Count > 1, "nothing to compare the sparse solver with");

        var reference = references.Count > 0 ? references[0] : null;
        foreach (var (name, solution) in solutions)
        {
            Assert.Equal(count, solution.Count);
            if (exact is not null) NumericAssert.Close(exact.Take(count).ToArray(), solution.EigenValues, tolerance, $"λ {name} against the closed form");
            NumericAssert.Close(solutions[0].Solution.EigenValues, solution.EigenValues, tolerance, $"λ {name} against {solutions[0].Name}");
            ShiftInvertLanczosTests.AssertMassOrthonormal(solution, matrices.Mass, 1e-9);
            if (reference is not null) AssertSameSubspaces(reference, solution, matrices.Mass, 1e-10 * scale, 1e-6, name);
        }
    }

    [Theory]
    [InlineData("chain", 31)]
    [InlineData("grid", 31)]
    [InlineData("twin-free-chains", 60)]
    public void SkippedMode_IsCaughtByTheSturmCountAndFoundAgain(string model, int count)
    {
        // A deliberate fault (one converged pair thrown away before the check) on the models above, rigid-body and
        // repeated modes included: the count at τ must disagree, and the second pass must restore the same pairs.
        var (matrices, _) = Model(model);
        var problem = ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass);
        var clean = new ShiftInvertLanczos().Run(problem, count, null);
        var faulty = new ShiftInvertLanczos { InjectedSkips = 1 }.Run(problem, count, null);
        Assert.True(faulty.Passes > clean.Passes, $"the skipped mode was not noticed ({faulty.Passes} passes, {clean.Passes} without the fault)");
        var scale = TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass);
        NumericAssert.Close([.. clean.EigenValues], [.. faulty.EigenValues], new Tolerance(1e-10 * scale, 1e-10), "λ after recovery");
    }

    /// <summary>
    /// Shapes agree up to sign, and within a group of equal eigenvalues (1e-8 relative, or 1e-10 of the stiffness scale
    /// apart for rigid-body modes) up to a rotation: the singular values of Φ_refᵀ M Φ over each group, the cosines of the
    /// principal angles between the two subspaces, are all 1 (Golub &amp; Van Loan, Matrix Computations, 4th ed., §6.4.3).
    /// Groups are taken from the reference's 100 pairs, so a group that the count cuts is left out.
    /// </summary>
    private static void AssertSameSubspaces(EigenSolution reference, EigenSolution actual, MathNet.Numerics.LinearAlgebra.Matrix<double> mass,
        double zero, double bound, string name)
    {
        var values = reference.EigenValues;
        var start = 0;
        while (start < actual.Count)
        {
            var end = start + 1;
            while (end < values.Length && values[end] - values[end - 1] <= zero + 1e-8 * Math.Abs(values[end])) end++;
            if (end > actual.Count) break;
            var a = reference.Shapes.SubMatrix(0, reference.Shapes.RowCount, start, end - start);
            var b = actual.Shapes.SubMatrix(0, actual.Shapes.RowCount, start, end - start);
            var cosines = a.TransposeThisAndMultiply(mass * b).Svd().S;
            for (var i = 0; i < cosines.Count; i++)
                NumericAssert.Close(1.0, cosines[i], Tolerance.Abs(bound), $"{name}: cos principal angle {i} of modes {start + 1}..{end}");
            start = end;
        }
    }

    /// <summary>The lowest <paramref name="count"/> pairs of a solution.</summary>
    private static EigenSolution Lowest(EigenSolution all, int count) =>
        all with { EigenValues = [.. all.EigenValues.Take(count)], Shapes = all.Shapes.SubMatrix(0, all.Shapes.RowCount, 0, count) };

    /// <summary>The model's matrices and, where there is one, its closed-form eigenvalues (rad²/s², ascending).</summary>
    private static (StructuralMatrices Matrices, double[]? Exact) Model(string name)
    {
        switch (name)
        {
            case "chain":
            {
                // The 2,100-mass chain held at one end of issue 13 (20 kg, 5 MN/m). Fixed–free closed form
                // ω_j = 2√(k/m) sin((2j − 1)π/(2(2n + 1))) (REFERENCES §2, common practice).
                const int n = 2100;
                const double m = 20, k = 5e6;
                var exact = Enumerable.Range(1, 100).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1))), 2)).ToArray();
                return (Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFree)), exact);
            }
            case "grid":
            {
                // A 25 × 25 fixed-edge lattice: (p, q) and (q, p) share a frequency (closed form in ShiftInvertLanczosTests).
                const double m = 10, k = 1e6;
                return (Assembler.Assemble(TestNetworks.FixedEdgeGrid(25, 25, m, k)), [.. ShiftInvertLanczosTests.LatticeEigenvalues(25, 25, m, k).Take(100)]);
            }
            case "twin-free-chains":
            {
                // Two identical, unconnected free–free chains of 400: two rigid-body modes and every frequency twice,
                // ω_j = 2√(k/m) sin((j − 1)π/(2n)) (REFERENCES §2, common practice).
                const int n = 400;
                const double m = 5, k = 2e5;
                var b = new NetworkBuilder { Title = "two free chains" };
                foreach (var side in new[] { "a", "b" })
                {
                    for (var i = 1; i <= n; i++) b.AddMass($"{side}{i}", m);
                    for (var i = 1; i < n; i++) b.AddSpring($"{side}s{i}", $"{side}{i}", $"{side}{i + 1}", k);
                }
                var exact = Enumerable.Range(1, 50).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin((j - 1) * Math.PI / (2 * n)), 2))
                    .SelectMany(v => new[] { v, v }).ToArray();
                return (Assembler.Assemble(b.Build()), exact);
            }
            case "random":
                // A seeded random network of 800 masses (no closed form: the solvers are checked against each other).
                return (Assembler.Assemble(TestNetworks.Random(new Random(41), 800)), null);
            default:
                throw new ArgumentOutOfRangeException(nameof(name), name, "unknown model");
        }
    }
}
