using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>The eigenpairs a modal analysis reports: rigid-body modes from the topology, flexible modes to relative accuracy.</summary>
/// <param name="EigenValues">ω² in rad²/s², ascending; exactly 0 for the rigid-body modes, which come first.</param>
/// <param name="Shapes">Mass-normalised shapes, one column per mode.</param>
/// <param name="IsRigidBody">Per mode, true for the unit translation of a group that no spring ties to a support.</param>
/// <param name="Warnings">What a reviewer must know about the accuracy of these pairs.</param>
internal sealed record ResolvedModes(double[] EigenValues, Matrix<double> Shapes, bool[] IsRigidBody, ImmutableArray<string> Warnings);

/// <summary>Turns a solver's eigenpairs into the modes to report: exact rigid-body modes, accurate low flexible modes.</summary>
/// <remarks>
/// <para>
/// Rigid-body modes are decided by the topology, never by the size of an eigenvalue: each group of masses that no
/// chain of positive-stiffness springs ties to a support (<see cref="Topology.UnsupportedGroups"/>) has exactly one,
/// its unit translation ι_g / √(ι_gᵀ M ι_g). The solver's pairs nearest those translations (largest Σ_g (ι_gᵀMφ)²/m_g)
/// are replaced by them; every other pair is flexible, however low its frequency. When an inerter between two masses
/// makes M non-diagonal the translations are M-orthonormalised as a set (<c>RigidBasis</c>) and the flexibility solve,
/// which assumes a diagonal M, is not used (a warning says so when the stiffness spread would have called for it).
/// </para>
/// <para>
/// A backward-stable symmetric solve gives each ω² with an absolute error of about ε·λ_max (ε the unit round-off), so
/// a relative error ε·λ_max/ω². When λ_max/ω²_min exceeds <see cref="SpreadNeedingFlexibility"/> (relative error
/// above ~2e-9 for the lowest mode) the flexible modes are solved again from the flexibility
/// (<see cref="FlexibilityEigen"/>), whose error is relative to the largest flexibility, 1/ω²_min; modes with
/// ω² ≤ √(ω²_min·λ_max) are taken from that solve, the higher ones from the direct solve, so every mode carries an
/// error of at most about ε·√(λ_max/ω²_min) before the Rayleigh quotient, and second order in it after.
/// </para>
/// </remarks>
internal static class ModeResolution
{
    /// <summary>Above this λ_max/ω²_min the low flexible modes are recomputed from the flexibility.</summary>
    public const double SpreadNeedingFlexibility = 1e7;

    /// <summary>Largest model solved densely a second time from its flexibility.</summary>
    public const int MaxFlexibilitySize = 2000;

    public static ResolvedModes Resolve(Network network, StructuralMatrices matrices, EigenSolution solution, double stiffnessScale)
    {
        var n = matrices.Size;
        var dofs = matrices.Dofs;
        var mass = Enumerable.Range(0, n).Select(i => matrices.Mass[i, i]).ToArray();
        var springs = network.Springs
            .Select(s => new SpringEdge(dofs.IndexOf(s.NodeA), dofs.IndexOf(s.NodeB), s.Stiffness))
            .ToArray();
        var groups = Topology.UnsupportedGroups(network)
            .Select(g => g.Select(name => dofs.IndexOf(name)).Where(i => i >= 0).Distinct().ToArray())
            .Where(g => g.Length > 0)
            .ToArray();

        var count = solution.Count;
        var rigidCount = Math.Min(groups.Length, count);
        var flexibleCount = count - rigidCount;

        // Drop the solver's pairs that lie nearest the rigid translations; keep the rest in ascending order.
        // With inerters between masses M is not diagonal: the rigid translations are M-orthonormalised as a set.
        var rigidBasis = matrices.MassIsDiagonal ? null : RigidBasis(matrices.Mass, groups, n);
        var share = Enumerable.Range(0, count)
            .Select(j => rigidBasis is null ? RigidShare(solution.Shapes.Column(j), mass, groups) : RigidShare(solution.Shapes.Column(j), matrices.Mass, rigidBasis))
            .ToArray();
        var dropped = Enumerable.Range(0, count).OrderByDescending(j => share[j]).Take(rigidCount).ToHashSet();
        var flexible = Enumerable.Range(0, count).Where(j => !dropped.Contains(j)).ToArray();

        var values = new double[count];
        var shapes = Matrix<double>.Build.Dense(n, count);
        var rigid = new bool[count];
        for (var j = 0; j < rigidCount; j++)
        {
            rigid[j] = true;
            if (rigidBasis is not null)
            {
                shapes.SetColumn(j, rigidBasis[j]);
                continue;
            }
            var total = groups[j].Sum(i => mass[i]);
            foreach (var i in groups[j]) shapes[i, j] = 1 / Math.Sqrt(total);
        }
        for (var j = 0; j < flexibleCount; j++)
        {
            values[rigidCount + j] = solution.EigenValues[flexible[j]];
            shapes.SetColumn(rigidCount + j, solution.Shapes.Column(flexible[j]));
        }

        var warnings = ImmutableArray.CreateBuilder<string>();
        if (flexibleCount > 0)
        {
            var lowest = values[rigidCount];
            var spread = lowest > 0 ? stiffnessScale / lowest : double.PositiveInfinity;
            if (spread > SpreadNeedingFlexibility)
            {
                if (!matrices.MassIsDiagonal) warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"The stiffness spread λ_max/ω²_min ≈ {spread:0.#e+0} leaves the lowest frequencies with a relative error up to about {2.2e-16 * spread:0.#e+0}; an inerter between two masses makes M non-diagonal, which the flexibility solve does not take."));
                else if (n > MaxFlexibilitySize) warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"The stiffness spread λ_max/ω²_min ≈ {spread:0.#e+0} leaves the lowest frequencies with a relative error up to about {2.2e-16 * spread:0.#e+0}; the model has {n} DOFs, more than the {MaxFlexibilitySize} the flexibility solve takes."));
                else if (!RefineLowModes(mass, springs, groups, values, shapes, rigidCount, flexibleCount, stiffnessScale))
                    warnings.Add(string.Create(CultureInfo.InvariantCulture,
                        $"The stiffness spread λ_max/ω²_min is beyond what the flexibility solve can represent (a spring is vanishingly soft); the lowest frequencies keep an absolute error of about {2.2e-16 * stiffnessScale:0.#e+0} rad²/s² in ω² and may read as 0 Hz."));
            }
        }
        // Only possible without the flexibility solve (too large a model): round-off below zero is no frequency.
        for (var j = rigidCount; j < count; j++) values[j] = Math.Max(values[j], 0);
        var ratioWarning = Topology.StiffnessRatioWarning(network);
        if (ratioWarning is not null) warnings.Add(ratioWarning);

        ModeNormalisation.ApplySignConvention(shapes);
        return new ResolvedModes(values, shapes, rigid, warnings.ToImmutable());
    }

    /// <summary>Replaces the low flexible pairs by those of the flexibility solve.</summary>
    /// <returns>False when the flexibility cannot be represented (the direct solve's pairs are then kept as they are).</returns>
    private static bool RefineLowModes(double[] mass, SpringEdge[] springs, int[][] groups, double[] values, Matrix<double> shapes,
        int rigidCount, int flexibleCount, double stiffnessScale)
    {
        double[] accurate;
        Matrix<double> accurateShapes;
        try
        {
            (accurate, accurateShapes) = FlexibilityEigen.Solve(mass, springs, groups);
        }
        catch (NumericalFailureException)
        {
            return false;
        }
        if (accurate.Length == 0) return true;
        var split = Math.Sqrt(accurate[0] * Math.Max(stiffnessScale, accurate[^1]));
        for (var j = 0; j < Math.Min(flexibleCount, accurate.Length) && accurate[j] <= split; j++)
        {
            values[rigidCount + j] = accurate[j];
            shapes.SetColumn(rigidCount + j, accurateShapes.Column(j));
        }
        return true;
    }

    /// <summary>
    /// The unit translations ι_g of the free groups, M-orthonormalised in group order (modified Gram–Schmidt, run
    /// twice): with an inerter between two groups their translations are not M-orthogonal, and any M-orthonormal basis
    /// of the rigid subspace (all at ω = 0) is a valid set of rigid-body modes.
    /// </summary>
    private static Vector<double>[] RigidBasis(Matrix<double> m, int[][] groups, int n)
    {
        var basis = new Vector<double>[groups.Length];
        for (var g = 0; g < groups.Length; g++)
        {
            var v = Vector<double>.Build.Dense(n);
            foreach (var i in groups[g]) v[i] = 1;
            for (var pass = 0; pass < 2; pass++)
                for (var h = 0; h < g; h++)
                    v -= basis[h] * (basis[h] * (m * v));
            var norm = Math.Sqrt(v * (m * v));
            if (!(norm > 0)) throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture, $"The rigid-body translation of group {g + 1} has no positive kinetic energy (vᵀMv = {norm * norm:G3})."));
            basis[g] = v / norm;
        }
        return basis;
    }

    /// <summary>Σ_g (r_gᵀ M φ)² over an M-orthonormal rigid basis: the share of the M-normalised φ in the rigid subspace.</summary>
    private static double RigidShare(Vector<double> phi, Matrix<double> m, Vector<double>[] basis)
    {
        var mPhi = m * phi;
        return basis.Sum(r => Math.Pow(r * mPhi, 2));
    }

    /// <summary>Σ_g (ι_gᵀ M φ)² / m_g: the share of the M-normalised φ that is rigid translation of the free groups.</summary>
    private static double RigidShare(Vector<double> phi, double[] mass, int[][] groups)
    {
        var share = 0.0;
        foreach (var group in groups)
        {
            var p = group.Sum(i => mass[i] * phi[i]);
            share += p * p / group.Sum(i => mass[i]);
        }
        return share;
    }
}
