using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

public class ShiftInvertLanczosTests
{
    private static readonly ShiftInvertLanczos Solver = new();

    [Fact]
    public void FixedFixedChainOfTwoThousand_MatchesTheClosedForm()
    {
        // ω_j = 2√(k/m) sin(jπ/(2(n+1))) for n equal masses between two walls (REFERENCES §2, common practice).
        const int n = 2000;
        const double m = 3.0, k = 2.0e5;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFixed));
        var solution = Solver.Solve(matrices.Stiffness, matrices.Mass, 12, massIsDiagonal: true);
        for (var j = 1; j <= 12; j++)
        {
            var omega = 2 * Math.Sqrt(k / m) * Math.Sin(j * Math.PI / (2 * (n + 1)));
            NumericAssert.Close(omega * omega, solution.EigenValues[j - 1], Tolerance.Rel(1e-9), $"λ{j}");
        }
        AssertMassOrthonormal(solution, matrices.Mass, 1e-10);
    }

    [Fact]
    public void TwentyThousandMassGrid_MatchesTheLatticeClosedForm()
    {
        // ω² = (4k/m)[sin²(pπ/(2(R+1))) + sin²(qπ/(2(C+1)))] for an R × C lattice with fixed edges (derived in
        // docs/methods.md from the chain result of REFERENCES §2 by separation of variables).
        const int rows = 100, columns = 200;
        const double m = 45.0, k = 1.2e7;
        var matrices = Assembler.Assemble(TestNetworks.FixedEdgeGrid(rows, columns, m, k));
        Assert.Equal(20_000, matrices.Size);
        const int count = 20;
        var solution = Solver.Solve(matrices.Stiffness, matrices.Mass, count, massIsDiagonal: true);
        NumericAssert.Close(LatticeEigenvalues(rows, columns, m, k).Take(count).ToArray(), solution.EigenValues, Tolerance.Rel(1e-8), "λ");
        AssertMassOrthonormal(solution, matrices.Mass, 1e-10);
    }

    [Fact]
    public void SquareGrid_FindsBothModesOfEveryRepeatedPair()
    {
        // On a square lattice (p, q) and (q, p) share one frequency. In exact arithmetic a single Lanczos vector sees only
        // one mode of each pair; round-off usually brings in the second, and the Sturm count at τ (with a restart when
        // it disagrees) makes sure of it. Both modes of each pair must come out, spanning the same plane as the dense solver's.
        const int side = 24;
        const double m = 10.0, k = 1.0e6;
        var matrices = Assembler.Assemble(TestNetworks.FixedEdgeGrid(side, side, m, k));
        const int count = 14;
        var outcome = Solver.Run(ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass), count, null);
        var expected = LatticeEigenvalues(side, side, m, k).Take(count).ToArray();
        NumericAssert.Close(expected, [.. outcome.EigenValues], Tolerance.Rel(1e-8), "λ");
        Assert.Equal(expected[1], expected[2], 10);   // the (1,2)/(2,1) pair really is repeated
        Assert.Equal(outcome.FoundBelowShift, outcome.SturmCount);
        var dense = new DenseGeneralizedEigen().Solve(matrices.DenseStiffness(), matrices.DenseMass(), count + 2, massIsDiagonal: true);
        AssertSameSubspaces(dense, new EigenSolution(outcome.EigenValues, outcome.Shapes, "lanczos"), matrices.Mass, 1e-7);
    }

    [Theory]
    [InlineData(30, 30)]     // every mode: the Krylov space fills the whole space
    [InlineData(30, 29)]
    [InlineData(300, 125)]   // more modes than one pass looks for: found in further, deflated passes
    public void ManyModes_MatchTheClosedForm(int n, int count)
    {
        // Fixed–fixed chain, ω_j = 2√(k/m) sin(jπ/(2(n+1))) (REFERENCES §2, common practice).
        const double m = 2.0, k = 8.0e4;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFixed));
        var solution = Solver.Solve(matrices.Stiffness, matrices.Mass, count, massIsDiagonal: true);
        var exact = Enumerable.Range(1, count).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin(j * Math.PI / (2 * (n + 1))), 2)).ToArray();
        NumericAssert.Close(exact, solution.EigenValues, Tolerance.Rel(1e-9), "λ");
        AssertMassOrthonormal(solution, matrices.Mass, 1e-9);
    }

    [Fact]
    public void SkippedMode_IsCaughtByTheSturmCountAndFoundAgain()
    {
        // A deliberate fault: one converged pair is thrown away before the check. The Sturm count at τ must exceed the
        // pairs found, and the solver must look again rather than return the gap.
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(300, 2.0, 5.0e4, ChainEnds.FixedFree));
        var problem = ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass);
        var clean = Solver.Run(problem, 8, null);
        var faulty = new ShiftInvertLanczos { InjectedSkips = 1 }.Run(problem, 8, null);
        Assert.Equal(1, clean.Passes);
        Assert.True(faulty.Passes >= 2, $"the skipped mode was not noticed ({faulty.Passes} pass)");
        NumericAssert.Close([.. clean.EigenValues], [.. faulty.EigenValues], Tolerance.Rel(1e-10), "λ after recovery");
    }

    [Fact]
    public void LongChainHeldAtOneEnd_31Modes_ConvergeInOnePass()
    {
        // Issue 13: the 2,100-mass chain held at one end (20 kg, 5 MN/m) made the solver restart 400 times and give up on
        // its 31 lowest modes, which shift-invert separates well (θ_j ≈ 1/λ_j ∝ 1/(2j − 1)²). Converged pairs were not
        // locked, so every restart recombined them and their residuals crept above the bound. Fixed–free closed form
        // ω_j = 2√(k/m) sin((2j − 1)π/(2(2n + 1))) (REFERENCES §2, common practice).
        const int n = 2100;
        const double m = 20, k = 5e6;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFree));
        var outcome = Solver.Run(ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass), 31, null);
        var exact = Enumerable.Range(1, 31).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1))), 2)).ToArray();
        NumericAssert.Close(exact, [.. outcome.EigenValues], Tolerance.Rel(1e-9), "λ");
        Assert.Equal(1, outcome.Passes);
        Assert.True(outcome.Restarts <= 5, $"{outcome.Restarts} restarts for 31 well separated modes");
        Assert.Equal(31, outcome.FoundBelowShift);
        Assert.Equal(outcome.SturmCount, outcome.FoundBelowShift);
    }

    [Fact]
    public void SoftlyHeldChain_LowestModeIsAcceptedAtItsRoundOffResidual()
    {
        // A free chain of 300 (2 kg, 100 kN/m) held by a ground spring 10⁻⁴ as stiff: λ₁ is 10⁻⁷ of the stiffness scale
        // s = 4k/m, so φ₁'s own rounding times K leaves a relative residual near u·s/λ₁ ≈ 10⁻⁹ whatever the solver. The
        // residual check accepts that (backward error below 10⁻¹⁴) and the frequencies still meet the closed form, derived
        // here from the chain equations: u_j = cos(q(n + ½ − j)) with λ = (4k/m) sin²(q/2) and, at the held end,
        // r cos(q(n − ½)) = 2 sin(qn) sin(q/2), r = k_ground/k (common practice; roots by bisection, checked to 1e-15
        // against a 40-digit solve).
        const int n = 300;
        const double m = 2, k = 1e5, r = 1e-4;
        var b = new ModalChain.Core.Model.NetworkBuilder { Title = "softly held chain" };
        for (var i = 1; i <= n; i++) b.AddMass($"m{i}", m);
        b.AddSpring("s0", ModalChain.Core.Model.Network.Ground, "m1", r * k);
        for (var i = 1; i < n; i++) b.AddSpring($"s{i}", $"m{i}", $"m{i + 1}", k);
        var matrices = Assembler.Assemble(b.Build());
        var problem = ShiftInvertLanczos.Problem.Create(matrices.Stiffness, matrices.Mass);
        var outcome = Solver.Run(problem, 10, null);

        double F(double q) => r * Math.Cos(q * (n - 0.5)) - 2 * Math.Sin(q * n) * Math.Sin(q / 2);
        var exact = new double[10];
        for (var j = 1; j <= 10; j++)
        {
            double lo = (j - 1) * Math.PI / n, hi = (2 * j - 1) * Math.PI / (2 * n + 1), fLo = F(lo);
            Assert.True(fLo * F(hi) < 0, $"no sign change for root {j}");
            for (var it = 0; it < 200 && hi - lo > 0; it++)
            {
                var mid = 0.5 * (lo + hi);
                if (mid <= lo || mid >= hi) break;
                if (F(mid) * fLo > 0) (lo, fLo) = (mid, F(mid));
                else hi = mid;
            }
            exact[j - 1] = 4 * k / m * Math.Pow(Math.Sin(lo / 2), 2);
        }
        NumericAssert.Close(exact, [.. outcome.EigenValues], Tolerance.Rel(1e-8), "λ");
        Assert.True(outcome.Pairs[0].Residual > 1e-9, $"λ₁'s residual {outcome.Pairs[0].Residual:G3} no longer shows the round-off floor this test is about");
        Assert.True(problem.Accepts(outcome.Pairs[0].Residual, outcome.Pairs[0].Lambda));
        Assert.False(problem.Accepts(1e-6, outcome.Pairs[0].Lambda), "a residual some 400 times the floor must still be refused");
    }

    [Fact]
    public void SolverThatKeepsSkipping_FailsInsteadOfReturningAGap()
    {
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(200, 2.0, 5.0e4, ChainEnds.FixedFixed));
        var faulty = new ShiftInvertLanczos { InjectedSkips = int.MaxValue };
        var e = Assert.Throws<NumericalFailureException>(() => faulty.Solve(matrices.Stiffness, matrices.Mass, 5, massIsDiagonal: true));
        Assert.Contains("Sturm count", e.Message);
    }

    [Fact]
    public void SturmCount_OfADenseSolutionMissingAMode_DisagreesWithIt()
    {
        // The check on its own: remove the 4th of the lowest 10 eigenvalues of a seeded random network and count.
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(31), 150));
        var dense = new DenseGeneralizedEigen().Solve(matrices.DenseStiffness(), matrices.DenseMass(), 11, massIsDiagonal: true);
        var tau = (dense.EigenValues[9] + dense.EigenValues[10]) / 2;
        var reported = dense.EigenValues.Take(10).Where((_, i) => i != 3).Count();
        var count = SturmSequence.CountBelow(matrices.Stiffness, matrices.Mass, tau);
        Assert.Equal(10, count);
        Assert.NotEqual(reported, count);
    }

    [Fact]
    public void FreeFreeChain_FindsTheRigidBodyMode()
    {
        // One rigid-body mode (K singular) and ω_j = 2√(k/m) sin((j−1)π/(2n)) (REFERENCES §2, common practice).
        const int n = 500;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, 1.0, 1.0, ChainEnds.FreeFree));
        var solution = Solver.Solve(matrices.Stiffness, matrices.Mass, 6, massIsDiagonal: true);
        for (var j = 1; j <= 6; j++)
        {
            var omega = 2 * Math.Sin((j - 1) * Math.PI / (2 * n));
            NumericAssert.Close(omega * omega, solution.EigenValues[j - 1], Tolerance.Abs(1e-12), $"λ{j}");
        }
        AssertMassOrthonormal(solution, matrices.Mass, 1e-10);
    }

    [Theory]
    [InlineData(11, 120, 12)]
    [InlineData(12, 300, 25)]
    [InlineData(13, 400, 30)]
    [InlineData(16, 150, 10)]   // one free group: a rigid-body mode
    [InlineData(22, 150, 10)]   // likewise
    public void EverySolver_GivesTheSameModesOnRandomNetworks(int seed, int size, int count)
    {
        // Seeded random networks with parallel and cross springs; seeds 16 and 22 leave a group free (a rigid-body mode,
        // compared to 1e-10 of the stiffness scale). Reference: the dense symmetric reduction; the subspace iteration is
        // a third, independent algorithm.
        var matrices = Assembler.Assemble(TestNetworks.Random(new Random(seed), size));
        var dense = new DenseGeneralizedEigen().Solve(matrices.DenseStiffness(), matrices.DenseMass(), count, massIsDiagonal: true);
        var subspace = new SubspaceIterationEigen().Solve(matrices.Stiffness, matrices.Mass, count, massIsDiagonal: true);
        var lanczos = Solver.Solve(matrices.Stiffness, matrices.Mass, count, massIsDiagonal: true);
        var scale = TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass);
        var tolerance = new Tolerance(1e-10 * scale, 1e-8);
        NumericAssert.Close(dense.EigenValues, lanczos.EigenValues, tolerance, "λ lanczos");
        NumericAssert.Close(dense.EigenValues, subspace.EigenValues, tolerance, "λ subspace");
        AssertMassOrthonormal(lanczos, matrices.Mass, 1e-10);
        AssertSameSubspaces(dense, lanczos, matrices.Mass, 1e-6);
        AssertSameSubspaces(dense, subspace, matrices.Mass, 1e-6);
    }

    [Fact]
    public void SolveBelow_ReturnsEveryModeUnderTheLimit()
    {
        // Fixed-fixed chain (REFERENCES §2): the modes below a frequency are exactly those the closed form puts there.
        const int n = 800;
        const double m = 1.0, k = 1.0e4;
        var matrices = Assembler.Assemble(TestNetworks.UniformChain(n, m, k, ChainEnds.FixedFixed));
        var exact = Enumerable.Range(1, n).Select(j => Math.Pow(2 * Math.Sqrt(k / m) * Math.Sin(j * Math.PI / (2 * (n + 1))), 2)).ToArray();
        var limit = (exact[16] + exact[17]) / 2;
        var solution = Solver.SolveBelow(matrices.Stiffness, matrices.Mass, limit);
        NumericAssert.Close(exact.Take(17).ToArray(), solution.EigenValues, Tolerance.Rel(1e-9), "λ");
        Assert.Empty(Solver.SolveBelow(matrices.Stiffness, matrices.Mass, exact[0] / 2).EigenValues);
    }

    /// <summary>Eigenvalues (rad²/s²) of the fixed-edge lattice, ascending.</summary>
    internal static IEnumerable<double> LatticeEigenvalues(int rows, int columns, double m, double k)
    {
        static double S2(int j, int n) => Math.Pow(Math.Sin(j * Math.PI / (2 * (n + 1))), 2);
        return Enumerable.Range(1, rows).SelectMany(p => Enumerable.Range(1, columns).Select(q => 4 * k / m * (S2(p, rows) + S2(q, columns)))).Order();
    }

    /// <summary>ΦᵀMΦ = I to <paramref name="bound"/>.</summary>
    internal static void AssertMassOrthonormal(EigenSolution solution, Matrix<double> mass, double bound)
    {
        var g = solution.Shapes.TransposeThisAndMultiply(mass * solution.Shapes) - Matrix<double>.Build.DenseIdentity(solution.Count);
        NumericAssert.Small(g.Enumerate().Max(Math.Abs), bound, "ΦᵀMΦ − I");
    }

    /// <summary>
    /// Shapes agree up to sign, and within a group of equal eigenvalues (relative 1e-8) up to a rotation: the M-orthogonal
    /// projectors Φ_g Φ_gᵀ M onto each group's subspace agree, measured as ‖Φ_aᵀ M Φ_b‖ singular values all 1
    /// (the cosines of the principal angles; Golub &amp; Van Loan, Matrix Computations, 4th ed., §6.4.3).
    /// </summary>
    internal static void AssertSameSubspaces(EigenSolution expected, EigenSolution actual, Matrix<double> mass, double bound)
    {
        var n = Math.Min(expected.Count, actual.Count);
        var start = 0;
        while (start < n)
        {
            var end = start + 1;
            var gap = 1e-8 * Math.Max(Math.Abs(expected.EigenValues[start]), 1e-12);
            while (end < n && expected.EigenValues[end] - expected.EigenValues[end - 1] <= gap + 1e-8 * Math.Abs(expected.EigenValues[end])) end++;
            // A group cut by the count cannot be compared; stop there.
            if (end == n && n < expected.Count && expected.EigenValues[n] - expected.EigenValues[n - 1] <= 1e-8 * Math.Abs(expected.EigenValues[n])) break;
            var a = expected.Shapes.SubMatrix(0, expected.Shapes.RowCount, start, end - start);
            var b = actual.Shapes.SubMatrix(0, actual.Shapes.RowCount, start, end - start);
            var cosines = a.TransposeThisAndMultiply(mass * b).Svd().S;
            for (var i = 0; i < cosines.Count; i++)
                NumericAssert.Close(1.0, cosines[i], Tolerance.Abs(bound), $"cos principal angle {i} of modes {start + 1}..{end}");
            start = end;
        }
    }
}
