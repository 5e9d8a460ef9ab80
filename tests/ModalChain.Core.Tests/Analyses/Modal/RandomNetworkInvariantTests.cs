using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Seeded random networks, assembled and solved once for every invariant test in <see cref="RandomNetworkInvariantTests"/>.</summary>
public sealed class RandomNetworkSet
{
    public const int Seed = 20261201;
    public const int Count = 300;

    public RandomNetworkSet()
    {
        var random = new Random(Seed);
        var cases = new List<Case>(Count);
        for (var c = 0; c < Count; c++)
        {
            // Mostly small and medium models, a few near the upper size, and every size 1..30 at least once.
            var size = c < 30 ? c + 1 : random.NextDouble() < 0.8 ? 1 + random.Next(12) : 13 + random.Next(18);
            var network = TestNetworks.Random(random, size);
            var matrices = Assembler.Assemble(network);
            var before = new Snapshot(matrices);
            var result = ModalAnalysis.Solve(network, matrices);
            cases.Add(new Case(c, network, matrices, before, result,
                TestNetworks.StiffnessScale(matrices.Stiffness, matrices.Mass), random.Next()));
        }
        Cases = cases;
    }

    public IReadOnlyList<Case> Cases { get; }

    /// <summary>One random network, its matrices before and after solving, and its modal result.</summary>
    /// <param name="Index">Position in the set, printed in failure messages.</param>
    /// <param name="Network">The random network.</param>
    /// <param name="Matrices">Its assembled matrices, as passed to the solver.</param>
    /// <param name="Before">Copies of the matrices taken before solving.</param>
    /// <param name="Result">The modal result with all modes.</param>
    /// <param name="Scale">maxᵢ Σⱼ|Kᵢⱼ|/Mᵢᵢ in rad²/s², the size against which "zero" eigenvalues are judged.</param>
    /// <param name="PermutationSeed">Seed for renumbering this network's masses.</param>
    public sealed record Case(int Index, Network Network, StructuralMatrices Matrices, Snapshot Before, ModalResult Result,
        double Scale, int PermutationSeed);

    /// <summary>Dense copies of the assembled matrices, taken before solving.</summary>
    public sealed class Snapshot(StructuralMatrices m)
    {
        public double[,] Mass { get; } = m.Mass.ToArray();
        public double[,] Stiffness { get; } = m.Stiffness.ToArray();
        public double[,] Damping { get; } = m.Damping.ToArray();
        public double[] Influence { get; } = m.Influence.ToArray();
    }
}

/// <summary>
/// Identities every modal result must satisfy, checked on <see cref="RandomNetworkSet.Count"/> seeded random networks
/// of 1 to 30 masses with cross springs, parallel springs, ground springs and some ungrounded parts. The identities are
/// those of the symmetric-definite eigenproblem and of effective modal mass (Chopra, Dynamics of Structures, §10.4 and
/// §13.2; attribution from memory) [common practice].
/// </summary>
public class RandomNetworkInvariantTests(RandomNetworkSet set) : IClassFixture<RandomNetworkSet>
{
    private static Matrix<double> Shapes(ModalResult r) =>
        Matrix<double>.Build.DenseOfColumnArrays(r.Modes.Select(m => m.Shape.ToArray()));

    [Fact]
    public void EveryRandomNetwork_GivesAllModesInAscendingOrder()
    {
        Assert.Equal(RandomNetworkSet.Count, set.Cases.Count);
        Assert.Equal(30, set.Cases.Max(c => c.Network.Masses.Length));
        foreach (var c in set.Cases)
        {
            Assert.Equal(c.Network.Masses.Length, c.Result.Modes.Length);
            for (var j = 1; j < c.Result.Modes.Length; j++)
                Assert.True(c.Result.Modes[j].EigenValue >= c.Result.Modes[j - 1].EigenValue, $"case {c.Index}: modes out of order at {j}");
        }
    }

    [Fact]
    public void RawEigenvalues_AreNonNegativeWithinRoundOff()
    {
        // K is positive semi-definite for non-negative springs, so λ ≥ −1e-12·s (s bounds λ_max).
        foreach (var c in set.Cases)
        {
            var raw = GeneralizedEigen.Solve(c.Matrices);
            foreach (var lambda in raw.EigenValues)
                Assert.True(lambda >= -1e-12 * c.Scale, $"case {c.Index}: λ = {lambda} below −1e-12·{c.Scale}");
            Assert.All(c.Result.Modes, m => Assert.True(m.EigenValue >= 0, $"case {c.Index}: mode {m.Number} ω² = {m.EigenValue}"));
        }
    }

    [Fact]
    public void Shapes_AreMassOrthonormal()
    {
        // Φᵀ M Φ = I, every entry within 1e-12.
        foreach (var c in set.Cases)
        {
            var phi = Shapes(c.Result);
            var gram = phi.TransposeThisAndMultiply(c.Matrices.Mass * phi);
            NumericAssert.Close(Matrix<double>.Build.DenseIdentity(phi.ColumnCount), gram, Tolerance.Abs(1e-12), $"case {c.Index}: ΦᵀMΦ");
        }
    }

    [Fact]
    public void EveryShape_SatisfiesTheEigenEquation()
    {
        // ‖Kφ − ω²Mφ‖ ≤ 1e-11·s·‖Mφ‖ (for a rigid-body mode ω² is taken as 0, so Kφ itself must vanish).
        foreach (var c in set.Cases)
            foreach (var mode in c.Result.Modes)
            {
                var phi = Vector<double>.Build.DenseOfEnumerable(mode.Shape);
                var mPhi = c.Matrices.Mass * phi;
                var residual = (c.Matrices.Stiffness * phi - mPhi * mode.EigenValue).L2Norm();
                NumericAssert.Small(residual, 1e-11 * c.Scale * mPhi.L2Norm(), $"case {c.Index}, mode {mode.Number}: ‖Kφ − ω²Mφ‖");
            }
    }

    [Fact]
    public void RayleighQuotientOfEveryShape_EqualsItsEigenvalue()
    {
        // φᵀKφ / φᵀMφ = ω², within 1e-12·s + 1e-9·ω².
        foreach (var c in set.Cases)
            foreach (var mode in c.Result.Modes)
            {
                var phi = Vector<double>.Build.DenseOfEnumerable(mode.Shape);
                var quotient = phi * (c.Matrices.Stiffness * phi) / (phi * (c.Matrices.Mass * phi));
                NumericAssert.Close(mode.EigenValue, quotient, new Tolerance(1e-12 * c.Scale, 1e-9), $"case {c.Index}, mode {mode.Number}: Rayleigh quotient");
            }
    }

    [Fact]
    public void EffectiveModalMasses_SumToTheTotalMass()
    {
        // Σ M*_n = ιᵀMι when all modes are computed (REFERENCES.md §7 [common practice]); tolerance 1e-10 relative.
        foreach (var c in set.Cases)
        {
            NumericAssert.Close(c.Network.TotalMass, c.Result.TotalMass, Tolerance.Rel(1e-14), $"case {c.Index}: total mass");
            NumericAssert.Close(c.Network.TotalMass, c.Result.Modes.Sum(m => m.EffectiveModalMass), Tolerance.Rel(1e-10), $"case {c.Index}: Σ M*");
            NumericAssert.Close(1.0, c.Result.Modes[^1].CumulativeEffectiveMassFraction, Tolerance.Abs(1e-10), $"case {c.Index}: cumulative fraction");
            Assert.All(c.Result.Modes, m => NumericAssert.Close(m.ParticipationFactor * m.ParticipationFactor, m.EffectiveModalMass,
                Tolerance.Rel(1e-12), $"case {c.Index}, mode {m.Number}: M* = Γ²"));
        }
    }

    [Fact]
    public void KineticEnergyShares_SumToOneAndAreNonNegative()
    {
        // m_i φ_i² / Σ m φ² for lumped (diagonal) M; tolerance 1e-12.
        foreach (var c in set.Cases)
            foreach (var mode in c.Result.Modes)
            {
                Assert.Equal(c.Network.Masses.Length, mode.KineticEnergyShare.Length);
                NumericAssert.Close(1.0, mode.KineticEnergyShare.Sum(), Tolerance.Abs(1e-12), $"case {c.Index}, mode {mode.Number}: Σ kinetic shares");
                Assert.All(mode.KineticEnergyShare, s => Assert.True(s >= 0, $"case {c.Index}, mode {mode.Number}: share {s}"));
            }
    }

    [Fact]
    public void StrainEnergyShares_SumToOneForElasticModes()
    {
        // k (φ_a − φ_b)² / Σ for every elastic mode; all zero for a rigid-body mode. Tolerance 1e-12.
        foreach (var c in set.Cases)
            foreach (var mode in c.Result.Modes)
            {
                Assert.Equal(c.Network.Springs.Length, mode.StrainEnergyShare.Length);
                Assert.All(mode.StrainEnergyShare, s => Assert.True(s >= 0, $"case {c.Index}, mode {mode.Number}: share {s}"));
                var expected = mode.IsRigidBody ? 0.0 : 1.0;
                NumericAssert.Close(expected, mode.StrainEnergyShare.Sum(), Tolerance.Abs(1e-12), $"case {c.Index}, mode {mode.Number}: Σ strain shares");
            }
    }

    [Fact]
    public void StrainEnergyOfEverySpring_IsItsShareOfHalfTheEigenvalue()
    {
        // ½ Σ k (φ_a − φ_b)² = ½ φᵀKφ = ½ ω² for a mass-normalised shape, so spring s holds k_s Δφ_s² / ω² of it.
        // Tolerances: 1e-12·s + 1e-9·ω² on the sum, 1e-9 + 1e-12·s/ω² on each share.
        foreach (var c in set.Cases)
        {
            var dofs = c.Matrices.Dofs;
            foreach (var mode in c.Result.Modes.Where(m => !m.IsRigidBody))
            {
                var energies = c.Network.Springs.Select(s =>
                {
                    var a = dofs.IndexOf(s.NodeA);
                    var b = dofs.IndexOf(s.NodeB);
                    var d = (a >= 0 ? mode.Shape[a] : 0) - (b >= 0 ? mode.Shape[b] : 0);
                    return s.Stiffness * d * d;
                }).ToArray();
                NumericAssert.Close(mode.EigenValue, energies.Sum(), new Tolerance(1e-12 * c.Scale, 1e-9), $"case {c.Index}, mode {mode.Number}: Σ k Δφ²");
                var shares = energies.Select(e => e / mode.EigenValue).ToArray();
                NumericAssert.Close(shares, mode.StrainEnergyShare, Tolerance.Abs(1e-9 + 1e-12 * c.Scale / mode.EigenValue), $"case {c.Index}, mode {mode.Number}: strain shares");
            }
        }
    }

    [Fact]
    public void KineticEnergyOfEveryMass_IsItsMassTimesTheShapeSquared()
    {
        // With φᵀMφ = 1 and lumped M, mass i carries m_i φ_i² of the kinetic energy. Tolerance 1e-12.
        foreach (var c in set.Cases)
            foreach (var mode in c.Result.Modes)
            {
                var shares = c.Network.Masses.Select((m, i) => m.Kilograms * mode.Shape[i] * mode.Shape[i]).ToArray();
                NumericAssert.Close(shares, mode.KineticEnergyShare, Tolerance.Abs(1e-12), $"case {c.Index}, mode {mode.Number}: kinetic shares");
            }
    }

    [Fact]
    public void RigidBodyModeCount_EqualsTheNumberOfUnsupportedGroups()
    {
        // Each group of masses that no spring path joins to a support adds one zero eigenvalue [common practice].
        foreach (var c in set.Cases)
            Assert.True(Topology.UnsupportedGroups(c.Network).Length == c.Result.RigidBodyModeCount,
                $"case {c.Index}: {Topology.UnsupportedGroups(c.Network).Length} unsupported groups but {c.Result.RigidBodyModeCount} rigid-body modes");
        Assert.Contains(set.Cases, c => c.Result.RigidBodyModeCount > 0);
        Assert.Contains(set.Cases, c => c.Result.RigidBodyModeCount > 1);
    }

    [Fact]
    public void Frequencies_AreUnchangedWhenMassesAreRenumbered()
    {
        // Renumbering the DOFs is a similarity transform PᵀKP, PᵀMP: same spectrum. Tolerance 1e-12·s + 1e-9·ω².
        foreach (var c in set.Cases)
        {
            var n = c.Network.Masses.Length;
            var order = Enumerable.Range(0, n).ToArray();
            new Random(c.PermutationSeed).Shuffle(order);
            var renumbered = ModalAnalysis.Solve(c.Network.WithMassOrder(order));
            for (var j = 0; j < n; j++)
                NumericAssert.Close(c.Result.Modes[j].EigenValue, renumbered.Modes[j].EigenValue,
                    new Tolerance(1e-12 * c.Scale, 1e-9), $"case {c.Index}, ω²{j + 1} after renumbering");
            NumericAssert.Close(c.Result.TotalMass, renumbered.TotalMass, Tolerance.Rel(1e-14), $"case {c.Index}: total mass after renumbering");
        }
    }

    [Fact]
    public void Inputs_AreUnchangedAfterSolving()
    {
        // The solver must copy, never overwrite, the caller's matrices: compared entry by entry, exactly.
        foreach (var c in set.Cases)
        {
            NumericAssert.Close(Matrix<double>.Build.DenseOfArray(c.Before.Mass), c.Matrices.DenseMass(), Tolerance.Abs(0), $"case {c.Index}: M");
            NumericAssert.Close(Matrix<double>.Build.DenseOfArray(c.Before.Stiffness), c.Matrices.DenseStiffness(), Tolerance.Abs(0), $"case {c.Index}: K");
            NumericAssert.Close(Matrix<double>.Build.DenseOfArray(c.Before.Damping), c.Matrices.DenseDamping(), Tolerance.Abs(0), $"case {c.Index}: C");
            NumericAssert.Close(c.Before.Influence, c.Matrices.Influence.ToArray(), Tolerance.Abs(0), $"case {c.Index}: ι");
            Assert.Same(c.Network, c.Result.Network);
            NumericAssert.Close(c.Network.Masses.Select(m => m.Kilograms).ToArray(), c.Matrices.Mass.Diagonal().ToArray(), Tolerance.Abs(0), $"case {c.Index}: masses");
        }
    }

    [Fact]
    public void QualityFigures_AreSmall()
    {
        // The reported residual and orthogonality error stay near round-off on these networks: residual ≤ 1e-9 (it is
        // relative to ‖Kφ‖, which is small for the lowest modes of stiff networks; seen up to ~4e-12), orthogonality
        // ≤ 1e-12 (seen up to ~9e-15).
        foreach (var c in set.Cases)
        {
            NumericAssert.Small(c.Result.Quality.MaxResidual, 1e-9, $"case {c.Index}: max residual");
            NumericAssert.Small(c.Result.Quality.MaxOrthogonalityError, 1e-12, $"case {c.Index}: max orthogonality error");
            Assert.Equal(c.Result.Modes.Max(m => m.Residual), c.Result.Quality.MaxResidual);
        }
    }

    [Fact]
    public void EveryShape_HasItsLargestMagnitudeEntryPositive()
    {
        // Sign convention of issue 2 (largest-magnitude entry positive); ties within 1e-12 may pick either entry.
        foreach (var c in set.Cases)
            foreach (var mode in c.Result.Modes)
            {
                var largest = mode.Shape.Max(Math.Abs);
                Assert.True(mode.Shape.Any(x => x > 0 && x >= largest * (1 - 1e-12)), $"case {c.Index}, mode {mode.Number}: largest entry negative");
            }
    }
}
