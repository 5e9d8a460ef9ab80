using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>Options of a modal analysis.</summary>
/// <param name="Count">How many of the lowest modes to compute; null for all.</param>
/// <param name="Solver">A specific eigen algorithm, or null to let <see cref="GeneralizedEigen"/> choose.</param>
/// <param name="Choice">What <see cref="GeneralizedEigen"/> chooses from when <paramref name="Solver"/> is null.</param>
/// <param name="BelowFrequencyHz">Only the modes with natural frequency below this (Hz), all of them (up to <paramref name="Count"/>); null for no limit.</param>
public sealed record ModalOptions(int? Count = null, IGeneralizedEigenSolver? Solver = null, SolverChoice Choice = SolverChoice.Auto,
    double? BelowFrequencyHz = null);

/// <summary>Undamped natural frequencies, mode shapes and their participation, energy shares and quality figures.</summary>
/// <remarks>
/// Solves K φ = ω² M φ. Shapes are mass-normalised (φᵀMφ = 1). Participation Γ = φᵀMι and effective modal mass
/// M* = Γ² (Chopra, Dynamics of Structures, §13.2; the 90 % cumulative rule is in ASCE 7-16 §12.9.1.1 and
/// EN 1998-1 §4.3.3.3.1). Rigid-body modes are decided by the topology and low modes are resolved to relative
/// accuracy whatever the stiffness spread (see <see cref="ModeResolution"/>). Plane and 3d models take another
/// path (<see cref="SpatialModes"/>): rigid-body modes from the null space of K, participation per direction about a
/// reference point, kinetic-energy shares per direction and a motion name per mode.
/// </remarks>
public static class ModalAnalysis
{
    /// <summary>Assembles and solves <paramref name="network"/>.</summary>
    public static ModalResult Solve(Network network, ModalOptions? options = null) =>
        Solve(network, Assembler.Assemble(network), options);

    /// <summary>Solves already assembled matrices of <paramref name="network"/>.</summary>
    public static ModalResult Solve(Network network, StructuralMatrices matrices, ModalOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(matrices);
        options ??= new ModalOptions();
        if (options.BelowFrequencyHz is { } belowHz) Guard.Positive(belowHz, nameof(options.BelowFrequencyHz));
        if (matrices.Size == 0) throw new ArgumentException("The network has no masses.", nameof(network));

        double? limit = options.BelowFrequencyHz is { } below ? Math.Pow(2 * Math.PI * below, 2) : null;
        var solution = GeneralizedEigen.Solve(matrices, options.Count, options.Solver, options.Choice, limit);
        if (network.Space != ModelSpace.Line) return SpatialModes.Build(network, matrices, solution);
        var m = matrices.Mass;
        var k = matrices.Stiffness;
        var iota = matrices.Influence;
        var totalMass = iota * (m * iota);
        var scale = StiffnessScale(k, m);
        var resolved = ModeResolution.Resolve(network, matrices, solution, scale);

        var springEnds = network.Springs
            .Select(s => (a: matrices.Dofs.IndexOf(s.NodeA), b: matrices.Dofs.IndexOf(s.NodeB), k: s.Stiffness))
            .ToArray();

        var modes = ImmutableArray.CreateBuilder<Mode>(resolved.EigenValues.Length);
        var cumulative = 0.0;
        var maxResidual = 0.0;
        for (var j = 0; j < resolved.EigenValues.Length; j++)
        {
            var phi = resolved.Shapes.Column(j);
            var lambda = resolved.EigenValues[j];
            var rigid = resolved.IsRigidBody[j];
            var omega2 = rigid ? 0.0 : lambda;
            var omega = Math.Sqrt(omega2);
            var f = omega / (2 * Math.PI);

            var mPhi = m * phi;
            var kPhi = k * phi;
            var residual = rigid
                ? kPhi.L2Norm() / (scale * mPhi.L2Norm())
                : (kPhi - mPhi * lambda).L2Norm() / kPhi.L2Norm();
            maxResidual = Math.Max(maxResidual, residual);

            var gamma = phi * (m * iota);
            var effective = gamma * gamma / (phi * mPhi);
            var fraction = effective / totalMass;
            cumulative += fraction;

            modes.Add(new Mode(
                Number: j + 1,
                EigenValue: omega2,
                AngularFrequency: omega,
                NaturalFrequencyHz: f,
                PeriodSeconds: rigid ? double.PositiveInfinity : 1 / f,
                IsRigidBody: rigid,
                Shape: [.. phi],
                ParticipationFactor: gamma,
                EffectiveModalMass: effective,
                EffectiveMassFraction: fraction,
                CumulativeEffectiveMassFraction: cumulative,
                KineticEnergyShare: KineticShares(phi, mPhi),
                StrainEnergyShare: rigid ? [.. new double[springEnds.Length]] : StrainShares(phi, springEnds),
                Residual: residual)
            {
                Participation = [new DirectionalParticipation(Dofs.Direction.Along, gamma, effective, fraction, cumulative)],
                KineticEnergyByDirection = [new DirectionalFigure(Dofs.Direction.Along, 1)],
            });
        }

        var quality = new ModalQuality(maxResidual, ModeChecks.OrthogonalityError(resolved.Shapes, m, matrices.MassIsDiagonal));
        return new ModalResult(network, matrices, modes.MoveToImmutable(), totalMass, quality, solution.Algorithm)
        {
            Warnings = resolved.Warnings,
            TotalByDirection = [new DirectionalFigure(Dofs.Direction.Along, totalMass)],
        };
    }

    /// <summary>maxᵢ Σⱼ |Kᵢⱼ| / Mᵢᵢ in rad²/s²: an upper bound on ω²_max for diagonal M, used to judge "zero".</summary>
    internal static double StiffnessScale(Matrix<double> k, Matrix<double> m)
    {
        var scale = 0.0;
        for (var i = 0; i < k.RowCount; i++)
            scale = Math.Max(scale, k.Row(i).L1Norm() / m[i, i]);
        return scale > 0 ? scale : 1.0;
    }

    private static ImmutableArray<double> KineticShares(Vector<double> phi, Vector<double> mPhi)
    {
        var shares = phi.PointwiseMultiply(mPhi);
        var sum = shares.Sum();
        return [.. shares.Select(s => s / sum)];
    }

    private static ImmutableArray<double> StrainShares(Vector<double> phi, (int a, int b, double k)[] springs)
    {
        var energies = springs.Select(s =>
        {
            var d = (s.a >= 0 ? phi[s.a] : 0) - (s.b >= 0 ? phi[s.b] : 0);
            return s.k * d * d;
        }).ToArray();
        var sum = energies.Sum();
        return [.. energies.Select(e => sum > 0 ? e / sum : 0)];
    }
}
