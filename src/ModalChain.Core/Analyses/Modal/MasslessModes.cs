using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>Undamped modes of a model with massless nodes: every massless DOF condensed statically, shapes expanded back.</summary>
/// <remarks>
/// <para>K φ = ω² M φ with zero rows in M has, for every massless DOF s, the equation K_sk φ_k + K_ss φ_s = 0, so
/// φ_s = −K_ss⁻¹ K_sk φ_k and the inertial DOFs solve K̃ φ_k = ω² M_kk φ_k with the condensed K̃ = K_kk − K_ks K_ss⁻¹ K_sk
/// (<see cref="MasslessReduction.Condense"/>). The expanded φ satisfies the full problem exactly and φᵀMφ = φ_kᵀM_kkφ_k,
/// so mass normalisation, participation and effective masses are unchanged by the expansion. Damping is ignored as in
/// every undamped modal analysis: a massless node on a damper is condensed through its springs alone (the damped
/// system's roots, relaxations included, are the complex modes).</para>
/// <para>The condensed stiffness of a spring network is again that of a spring network (each off-diagonal −K̃_ij ≥ 0
/// a spring between two inertial DOFs, each row sum a spring to ground, this one computed as g_k + Tᵀ g_s from the
/// springs to supports g so that no round-off creates a spring to ground where there is none), so the reduced problem is
/// solved as an equivalent network by the same path as any other (rigid-body modes from its topology, low modes to
/// relative accuracy), and only the reported figures are recomputed on the original springs.</para>
/// </remarks>
internal static class MasslessModes
{
    public static ModalResult Solve(Network network, StructuralMatrices matrices, ModalOptions options)
    {
        var n = matrices.Size;
        var massless = Enumerable.Range(0, n).Where(i => MasslessReduction.IsMassless(matrices.Mass, i)).ToArray();
        if (massless.Length == n)
            throw new ArgumentException("Every node of the network is massless: it has no mode of vibration, only first-order relaxations (see the complex modes).", nameof(network));
        var condensation = MasslessReduction.Condense(matrices.Stiffness, massless);
        var equivalent = EquivalentNetwork(network, matrices, condensation);
        var reduced = ModalAnalysis.Solve(equivalent, Assembler.Assemble(equivalent), options);

        var springEnds = network.Springs
            .Select(s => (a: matrices.Dofs.IndexOf(s.NodeA), b: matrices.Dofs.IndexOf(s.NodeB), k: s.Stiffness))
            .ToArray();
        // Ends a transducer eliminated follow through their terms, as in ModalAnalysis.
        var springRows = ConstraintElimination.Of(network) is { } elimination
            ? network.Springs.Select(s => elimination.Row(node => matrices.Dofs.IndexOf(node), s.NodeA, s.NodeB)).ToArray()
            : null;
        var kept = condensation.Kept;
        var modes = ImmutableArray.CreateBuilder<Mode>(reduced.Modes.Length);
        foreach (var mode in reduced.Modes)
        {
            var shape = condensation.Expand(mode.Shape.AsSpan());
            var kinetic = new double[n];
            for (var k = 0; k < kept.Length; k++) kinetic[kept[k]] = mode.KineticEnergyShare[k];
            modes.Add(mode with
            {
                Shape = [.. shape],
                KineticEnergyShare = [.. kinetic],
                StrainEnergyShare = mode.IsRigidBody ? [.. new double[springEnds.Length]] : ModalAnalysis.StrainShares(shape, springEnds, springRows),
            });
        }

        var warnings = reduced.Warnings.ToList();
        if (Topology.StiffnessRatioWarning(equivalent) is { } equivalentWarning) warnings.Remove(equivalentWarning);
        if (Topology.StiffnessRatioWarning(network) is { } ratioWarning) warnings.Add(ratioWarning);
        // An electrical node held by no inductor is an ordinary circuit node (resistors and capacitors): no warning for it.
        var loose = condensation.Undetermined.Where(i => !network.IsElectrical(matrices.Dofs.Dofs[i].Node)).ToArray();
        if (loose.Length > 0)
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"massless node(s) {string.Join(", ", loose.Select(i => $"'{matrices.Dofs.Label(i)}'"))} are held by no spring: the undamped modes leave their motion undetermined and show it as 0 (only the complex modes and the responses, which include damping, determine it)"));
        return new ModalResult(network, matrices, modes.MoveToImmutable(), reduced.TotalMass, reduced.Quality, reduced.Algorithm)
        {
            Warnings = [.. warnings],
            TotalByDirection = reduced.TotalByDirection,
            CondensedDofs = [.. massless],
        };
    }

    /// <summary>Undamped modes of a plane or 3d model with massless nodes: K̃ φ_k = ω² M_kk φ_k, shapes expanded, figures as for any spatial model.</summary>
    /// <remarks>
    /// The condensed K̃ of a spatial model is no spring network (a body point's row couples translations and rotations),
    /// so the reduced pair (K̃, M_kk) goes to the eigen solver as it is; each shape is expanded with φ_s = T φ_k, which
    /// satisfies the full problem's massless rows exactly, and <see cref="SpatialModes.Build"/> computes every figure
    /// (rigid-body re-basing, participation per direction, energy shares, residuals) on the full M and K.
    /// </remarks>
    public static ModalResult SolveSpatial(Network network, StructuralMatrices matrices, ModalOptions options)
    {
        var n = matrices.Size;
        var massless = Enumerable.Range(0, n).Where(i => MasslessReduction.IsMassless(matrices.Mass, i)).ToArray();
        if (massless.Length == n)
            throw new ArgumentException("Every node of the network is massless: it has no mode of vibration, only first-order relaxations (see the complex modes).", nameof(network));
        var condensation = MasslessReduction.Condense(matrices.Stiffness, massless);
        var kept = condensation.Kept;
        var nk = kept.Length;
        var slot = new Dictionary<int, int>(nk);
        for (var k = 0; k < nk; k++) slot[kept[k]] = k;
        var entries = new List<(int, int, double)>();
        var diagonal = true;
        foreach (var (i, j, v) in matrices.Mass.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip))
            if (slot.TryGetValue(i, out var a) && slot.TryGetValue(j, out var b))
            {
                entries.Add((a, b, v));
                diagonal &= a == b || v == 0;
            }
        var mass = Assembler.Summed(nk, entries);
        var wanted = Math.Clamp(options.Count ?? nk, 1, nk);
        double? limit = options.BelowFrequencyHz is { } below ? Math.Pow(2 * Math.PI * below, 2) : null;
        var solver = options.Solver ?? Solvers.GeneralizedEigen.Choose(nk, limit is null ? wanted : nk, options.Choice, (long)nk * nk);
        var reduced = limit is { } below2 && solver is Solvers.ShiftInvertLanczos lanczos
            ? lanczos.SolveBelow(condensation.Stiffness, mass, below2, options.Count)
            : solver.Solve(condensation.Stiffness, mass, limit is null ? wanted : nk, diagonal);
        var count = limit is { } l ? Math.Min(wanted, reduced.EigenValues.Count(v => v < l)) : reduced.Count;
        var shapes = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(n, count);
        for (var j = 0; j < count; j++)
        {
            var full = condensation.Expand(reduced.Shapes.Column(j).AsArray() ?? reduced.Shapes.Column(j).ToArray());
            for (var i = 0; i < n; i++) shapes[i, j] = full[i];
        }
        var solution = new Solvers.EigenSolution([.. reduced.EigenValues.Take(count)], shapes, reduced.Algorithm);
        var result = SpatialModes.Build(network, matrices, solution);
        var warnings = result.Warnings.ToList();
        if (!condensation.Undetermined.IsEmpty)
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"massless node DOF(s) {string.Join(", ", condensation.Undetermined.Select(i => $"'{matrices.Dofs.Label(i)}'"))} are held by no spring: the undamped modes leave their motion undetermined and show it as 0 (only the complex modes and the responses, which include damping, determine it)"));
        return result with { Warnings = [.. warnings], CondensedDofs = [.. massless] };
    }

    /// <summary>The spring network whose M and K are M_kk and the condensed K̃: masses (and inerters) of the inertial DOFs, equivalent springs.</summary>
    internal static Network EquivalentNetwork(Network network, StructuralMatrices matrices, StaticCondensation condensation)
    {
        var kept = condensation.Kept;
        var slot = new Dictionary<int, int>();
        for (var k = 0; k < kept.Length; k++) slot[kept[k]] = k;
        var builder = new NetworkBuilder { Title = network.Title };
        var names = kept.Select(i => "#" + matrices.Dofs.Label(i)).ToArray();

        var m = matrices.Mass;
        var rowSum = new double[kept.Length];
        var diagonal = new double[kept.Length];
        var inerters = new List<(int A, int B, double B_)>();
        foreach (var (i, j, v) in m.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip))
        {
            if (!slot.TryGetValue(i, out var a) || !slot.TryGetValue(j, out var b)) continue;
            rowSum[a] += v;
            if (a == b) diagonal[a] += v;
            else if (a < b && v < 0) inerters.Add((a, b, -v));
        }
        for (var k = 0; k < kept.Length; k++)
        {
            var kg = rowSum[k] > 1e-12 * diagonal[k] ? rowSum[k] : 0;
            builder.AddMass(names[k], kg);
            // An electrical DOF stays electrical, so the equivalent's influence vector leaves it out too.
            if (network.IsElectrical(matrices.Dofs.Dofs[kept[k]].Node)) builder.MarkElectrical(names[k]);
        }
        var count = 0;
        foreach (var (a, b, inertance) in inerters) builder.AddInerter($"#b{count++}", names[a], names[b], inertance);

        // Springs to supports per DOF, from the springs themselves (exact positive sums).
        var grounding = new double[matrices.Size];
        foreach (var s in network.Springs)
        {
            int ia = matrices.Dofs.IndexOf(s.NodeA), ib = matrices.Dofs.IndexOf(s.NodeB);
            if (ia >= 0 && ib < 0) grounding[ia] += s.Stiffness;
            else if (ib >= 0 && ia < 0) grounding[ib] += s.Stiffness;
        }
        var condensed = condensation.Condensed;
        for (var k = 0; k < kept.Length; k++)
        {
            var g = grounding[kept[k]];
            for (var c = 0; c < condensed.Length; c++) g += condensation.Transfer[c, k] * grounding[condensed[c]];
            if (g > 0) builder.AddSpring($"#k{count++}", names[k], Network.Ground, g);
        }
        foreach (var (a, b, v) in condensation.Stiffness.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip))
            if (a < b && v < 0) builder.AddSpring($"#k{count++}", names[a], names[b], -v);
        return builder.Build();
    }
}
