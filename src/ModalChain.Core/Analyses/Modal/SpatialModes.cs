using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>How a mode of a plane or 3d model is named from its kinetic-energy shares per direction.</summary>
public static class MotionNames
{
    /// <summary>The share of kinetic energy one direction must carry for the mode to take that direction's name.</summary>
    public const double DominantShare = 0.8;

    /// <summary>bounce (z), surge (x), sway (y), roll (rx), pitch (ry), yaw (rz).</summary>
    public static string Of(Direction direction) => direction switch
    {
        Direction.X => "surge",
        Direction.Y => "sway",
        Direction.Z => "bounce",
        Direction.Rx => "roll",
        Direction.Ry => "pitch",
        Direction.Rz => "yaw",
        _ => "motion",
    };

    /// <summary>The name of a mode with these shares: the dominant direction's name, or "coupled A + B" (the two largest, larger first).</summary>
    public static string Name(IReadOnlyList<DirectionalFigure> shares)
    {
        ArgumentNullException.ThrowIfNull(shares);
        var ranked = shares.OrderByDescending(s => s.Value).ToArray();
        if (ranked.Length == 0) return "";
        if (ranked.Length == 1 || ranked[0].Value >= DominantShare) return Of(ranked[0].Direction);
        return $"coupled {Of(ranked[0].Direction)} + {Of(ranked[1].Direction)}";
    }
}

/// <summary>The modes of a plane or 3d model: rigid-body modes from the null space of K, participation per direction, names.</summary>
/// <remarks>
/// <para>The scalar machinery (<see cref="ModeResolution"/> and the flexibility solve) is for one direction per mass
/// and is bypassed. Rigid-body modes are the pairs with ω² ≤ <see cref="RigidBodyTolerance"/>·s, s the stiffness
/// scale max_i Σ_j |K_ij| / M_ii (an upper bound on ω²_max for diagonal M): topology alone cannot count them in
/// space (a body on one vertical spring is held in z and free in five directions). Their computed shapes span the
/// null space in no particular basis, so they are re-based: for each direction of the space in turn, the
/// M-projection of its influence vector onto the rigid subspace is M-orthogonalised against the shapes already
/// chosen and kept if it is not negligible; any dimension left (a mechanism that is no rigid motion of the whole)
/// keeps the solver's vectors, orthogonalised.</para>
/// <para>Effective mass per direction d: M*_d = (φᵀMι_d)² / φᵀMφ, with ι_d a unit rigid translation, or a unit
/// rigid rotation about the reference point; over all modes Σ M*_d = ι_dᵀMι_d. The kinetic-energy share of a DOF is
/// φ_i (Mφ)_i / φᵀMφ; summed over the DOFs of one direction it gives that direction's share.</para>
/// </remarks>
internal static class SpatialModes
{
    /// <summary>ω² at or below this fraction of the stiffness scale counts as a rigid-body (0 Hz) mode.</summary>
    public const double RigidBodyTolerance = 1e-10;

    public static ModalResult Build(Network network, StructuralMatrices matrices, EigenSolution solution)
    {
        var m = matrices.Mass;
        var k = matrices.Stiffness;
        var dofs = matrices.Dofs;
        var n = matrices.Size;
        var scale = ModalAnalysis.StiffnessScale(k, m);
        var count = solution.Count;
        var shapes = solution.Shapes.Clone();
        var rigid = solution.EigenValues.Select(v => v <= RigidBodyTolerance * scale).ToArray();
        var rigidCount = rigid.Count(r => r);
        if (rigidCount > 0) Rebase(shapes, m, matrices.Influences, Enumerable.Range(0, count).Where(j => rigid[j]).ToArray());
        ModeNormalisation.ApplySignConvention(shapes);

        var influences = matrices.Influences;
        var mIota = influences.Select(i => m * i.Vector).ToArray();
        var totals = influences.Select((i, d) => i.Vector * mIota[d]).ToArray();
        var zIndex = influences.IndexOf(influences.First(i => i.Direction == Direction.Z));
        var directions = Directions.All(network.Space);
        var springRows = SpatialAssembly.SpringRows(network, dofs);

        var modes = ImmutableArray.CreateBuilder<Mode>(count);
        var cumulative = new double[influences.Length];
        var maxResidual = 0.0;
        for (var j = 0; j < count; j++)
        {
            var phi = shapes.Column(j);
            var lambda = solution.EigenValues[j];
            var omega2 = rigid[j] ? 0.0 : lambda;
            var omega = Math.Sqrt(omega2);
            var f = omega / (2 * Math.PI);
            var mPhi = m * phi;
            var kPhi = k * phi;
            var residual = rigid[j] ? kPhi.L2Norm() / (scale * mPhi.L2Norm()) : (kPhi - mPhi * lambda).L2Norm() / kPhi.L2Norm();
            maxResidual = Math.Max(maxResidual, residual);
            var modal = phi * mPhi;

            var participation = ImmutableArray.CreateBuilder<DirectionalParticipation>(influences.Length);
            for (var d = 0; d < influences.Length; d++)
            {
                var gamma = phi * mIota[d];
                var effective = gamma * gamma / modal;
                var fraction = totals[d] > 0 ? effective / totals[d] : 0;
                cumulative[d] += fraction;
                participation.Add(new DirectionalParticipation(influences[d].Direction, gamma, effective, fraction, cumulative[d]));
            }

            var kinetic = phi.PointwiseMultiply(mPhi) / modal;
            var byDirection = directions
                .Select(d => new DirectionalFigure(d, Enumerable.Range(0, n).Where(i => dofs.Dofs[i].Direction == d).Sum(i => kinetic[i])))
                .ToImmutableArray();
            var z = participation[zIndex];
            modes.Add(new Mode(
                Number: j + 1,
                EigenValue: omega2,
                AngularFrequency: omega,
                NaturalFrequencyHz: f,
                PeriodSeconds: rigid[j] ? double.PositiveInfinity : 1 / f,
                IsRigidBody: rigid[j],
                Shape: [.. phi],
                ParticipationFactor: z.ParticipationFactor,
                EffectiveModalMass: z.EffectiveMass,
                EffectiveMassFraction: z.Fraction,
                CumulativeEffectiveMassFraction: z.CumulativeFraction,
                KineticEnergyShare: [.. kinetic],
                StrainEnergyShare: rigid[j] ? [.. new double[springRows.Length]] : StrainShares(phi, springRows),
                Residual: residual)
            {
                Participation = participation.MoveToImmutable(),
                KineticEnergyByDirection = byDirection,
                Motion = MotionNames.Name(byDirection),
                Decoupling = byDirection.Max(s => s.Value),
            });
        }

        var warnings = ImmutableArray.CreateBuilder<string>();
        if (Topology.StiffnessRatioWarning(network) is { } spread) warnings.Add(spread);
        var quality = new ModalQuality(maxResidual, ModeChecks.OrthogonalityError(shapes, m, matrices.MassIsDiagonal));
        return new ModalResult(network, matrices, modes.MoveToImmutable(), totals[zIndex], quality, solution.Algorithm)
        {
            Warnings = warnings.ToImmutable(),
            TotalByDirection = [.. influences.Select((i, d) => new DirectionalFigure(i.Direction, totals[d]))],
        };
    }

    /// <summary>Per spring, Σ_rows k (t·φ)² over the total (twice the strain energy ½ Δᵀ K_e Δ, normalised).</summary>
    private static ImmutableArray<double> StrainShares(Vector<double> phi, ImmutableArray<ImmutableArray<ElementRow>> springs)
    {
        var u = phi.AsArray() ?? phi.ToArray();
        var energies = springs.Select(rows => rows.Sum(r =>
        {
            var s = r.Stretch(u);
            return r.Value * s * s;
        })).ToArray();
        var sum = energies.Sum();
        return [.. energies.Select(e => sum > 0 ? e / sum : 0)];
    }

    /// <summary>Replaces the rigid-body columns by an M-orthonormal basis of their span aligned with the directions of the space.</summary>
    private static void Rebase(Matrix<double> shapes, Matrix<double> m, ImmutableArray<DirectionalInfluence> influences, int[] columns)
    {
        var basis = new List<Vector<double>>();
        var span = columns.Select(shapes.Column).ToArray();
        Vector<double> Project(Vector<double> v)
        {
            // The M-orthogonal projection of v onto the rigid span (its columns are M-orthonormal).
            var mv = m * v;
            var p = Vector<double>.Build.Dense(v.Count);
            foreach (var s in span) p += s * (s * mv);
            return p;
        }
        bool TryAdd(Vector<double> v, double reference)
        {
            foreach (var b in basis) v -= b * (b * (m * v));
            var norm = Math.Sqrt(v * (m * v));
            if (!(norm > 1e-8 * reference)) return false;
            basis.Add(v / norm);
            return true;
        }
        foreach (var influence in influences)
        {
            if (basis.Count == columns.Length) break;
            var iota = influence.Vector;
            var size = Math.Sqrt(iota * (m * iota));
            if (size > 0) TryAdd(Project(iota), size);
        }
        foreach (var s in span)
        {
            if (basis.Count == columns.Length) break;
            TryAdd(s, 1);
        }
        for (var c = 0; c < columns.Length && c < basis.Count; c++) shapes.SetColumn(columns[c], basis[c]);
    }

    /// <summary>The stiffness-spread warning of a plane or 3d model (no flexibility solve there).</summary>
    internal static string SpreadWarning(double ratio, Spring stiffest, Spring softest, string names)
    {
        var span = double.IsFinite(ratio) ? string.Create(CultureInfo.InvariantCulture, $"{ratio:0.###e+0}") : "beyond 1e+308";
        return string.Create(CultureInfo.InvariantCulture,
            $"spring stiffnesses span a ratio of {span} ('{stiffest.Name}' {stiffest.Stiffness:G4} N/m against '{softest.Name}' {softest.Stiffness:G4} N/m): in a plane or 3d model the low modes are not re-solved from the flexibility, so the lowest frequencies carry a relative error up to about {2.2e-16 * ratio:0.#e+0}, and rigid-body (0 Hz) modes are those with ω² below {RigidBodyTolerance:0e+0} of the stiffness scale, so a flexible mode that soft would be counted as one; consider a rigid body or a support instead of {names}");
    }
}
