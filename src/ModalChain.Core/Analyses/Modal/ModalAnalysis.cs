using System.Collections.Immutable;
using System.Runtime.InteropServices;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Storage;
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
/// reference point, kinetic-energy shares per direction and a motion name per mode. Massless DOFs are condensed
/// statically first (<see cref="MasslessModes"/>) in every space.
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

        if (MasslessReduction.HasMasslessDofs(matrices.Mass))
            return network.Space == ModelSpace.Line ? MasslessModes.Solve(network, matrices, options) : MasslessModes.SolveSpatial(network, matrices, options);

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
        // With transducers a spring's end may be an eliminated node: its elongation is then a row of T (ConstraintElimination).
        var springRows = Assembly.ConstraintElimination.Of(network) is { } elimination
            ? network.Springs.Select(s => elimination.Row(node => matrices.Dofs.IndexOf(node), s.NodeA, s.NodeB)).ToArray()
            : null;

        // Each mode's figures are independent of the others: computed in parallel from the shapes' columns, then the
        // cumulative fractions in order.
        var count = resolved.EigenValues.Length;
        var n = matrices.Size;
        var shapes = resolved.Shapes.Storage is DenseColumnMajorMatrixStorage<double> dense ? dense.Data : resolved.Shapes.ToColumnMajorArray();
        var massDiagonal = matrices.MassIsDiagonal ? Enumerable.Range(0, n).Select(i => m[i, i]).ToArray() : null;
        var mIota = (m * iota).ToArray();
        var figures = new ModeFigures[count];
        void Figures(int j)
        {
            var phi = new double[n];
            Array.Copy(shapes, (long)j * n, phi, 0, n);
            var rigid = resolved.IsRigidBody[j];
            var lambda = resolved.EigenValues[j];
            var mPhi = massDiagonal is null ? (m * Vector<double>.Build.Dense(phi)).ToArray() : Product(massDiagonal, phi);
            var kPhi = Product(k, phi);
            double kNorm = 0, mNorm = 0, residualNorm = 0, gamma = 0, kinetic = 0;
            for (var i = 0; i < n; i++)
            {
                kNorm += kPhi[i] * kPhi[i];
                mNorm += mPhi[i] * mPhi[i];
                var r = kPhi[i] - mPhi[i] * lambda;
                residualNorm += r * r;
                gamma += phi[i] * mIota[i];
                kinetic += phi[i] * mPhi[i];
            }
            var residual = rigid ? Math.Sqrt(kNorm) / (scale * Math.Sqrt(mNorm)) : Math.Sqrt(residualNorm) / Math.Sqrt(kNorm);
            figures[j] = new ModeFigures(phi, gamma, gamma * gamma / kinetic, residual,
                KineticShares(phi, mPhi), rigid ? [.. new double[springEnds.Length]] : StrainShares(phi, springEnds, springRows));
        }
        // Threads only where the work pays for them: commands such as tune solve small models many times.
        if ((long)count * n >= 1 << 16) Parallel.For(0, count, Figures);
        else for (var j = 0; j < count; j++) Figures(j);

        var modes = ImmutableArray.CreateBuilder<Mode>(count);
        var cumulative = 0.0;
        var maxResidual = 0.0;
        for (var j = 0; j < count; j++)
        {
            var (phi, gamma, effective, residual, kineticShares, strainShares) = figures[j];
            var rigid = resolved.IsRigidBody[j];
            var omega2 = rigid ? 0.0 : resolved.EigenValues[j];
            var omega = Math.Sqrt(omega2);
            var f = omega / (2 * Math.PI);
            maxResidual = Math.Max(maxResidual, residual);
            var fraction = effective / totalMass;
            cumulative += fraction;

            modes.Add(new Mode(
                Number: j + 1,
                EigenValue: omega2,
                AngularFrequency: omega,
                NaturalFrequencyHz: f,
                PeriodSeconds: rigid ? double.PositiveInfinity : 1 / f,
                IsRigidBody: rigid,
                Shape: ImmutableCollectionsMarshal.AsImmutableArray(phi),
                ParticipationFactor: gamma,
                EffectiveModalMass: effective,
                EffectiveMassFraction: fraction,
                CumulativeEffectiveMassFraction: cumulative,
                KineticEnergyShare: kineticShares,
                StrainEnergyShare: strainShares,
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

    /// <summary>maxᵢ Σⱼ |Kᵢⱼ| / Mᵢᵢ in rad²/s² over the rows with mass: an upper bound on ω²_max for diagonal M, used to judge "zero".</summary>
    /// <remarks>A massless row (a node condensed before the solve) has no inertia to divide by and no eigenvalue of its own: skipped.</remarks>
    internal static double StiffnessScale(Matrix<double> k, Matrix<double> m)
    {
        var scale = 0.0;
        for (var i = 0; i < k.RowCount; i++)
            if (m[i, i] > 0) scale = Math.Max(scale, k.Row(i).L1Norm() / m[i, i]);
        return scale > 0 ? scale : 1.0;
    }

    /// <summary>The figures of one mode computed before the cumulative fractions.</summary>
    private readonly record struct ModeFigures(double[] Shape, double Participation, double Effective, double Residual,
        ImmutableArray<double> KineticShares, ImmutableArray<double> StrainShares);

    /// <summary>diag(d) x.</summary>
    private static double[] Product(double[] diagonal, double[] x)
    {
        var y = new double[x.Length];
        for (var i = 0; i < x.Length; i++) y[i] = diagonal[i] * x[i];
        return y;
    }

    /// <summary>A x over the stored entries of a sparse (compressed-row) A; through Math.NET otherwise.</summary>
    private static double[] Product(Matrix<double> a, double[] x)
    {
        if (a.Storage is not SparseCompressedRowMatrixStorage<double> csr) return (a * Vector<double>.Build.Dense(x)).ToArray();
        var y = new double[a.RowCount];
        for (var i = 0; i < y.Length; i++)
        {
            var sum = 0.0;
            for (var p = csr.RowPointers[i]; p < csr.RowPointers[i + 1]; p++) sum += csr.Values[p] * x[csr.ColumnIndices[p]];
            y[i] = sum;
        }
        return y;
    }

    private static ImmutableArray<double> KineticShares(double[] phi, double[] mPhi)
    {
        var shares = new double[phi.Length];
        var sum = 0.0;
        for (var i = 0; i < shares.Length; i++) sum += shares[i] = phi[i] * mPhi[i];
        for (var i = 0; i < shares.Length; i++) shares[i] /= sum;
        return ImmutableCollectionsMarshal.AsImmutableArray(shares);
    }

    internal static ImmutableArray<double> StrainShares(double[] phi, (int a, int b, double k)[] springs, (int Index, double Weight)[][]? rows)
    {
        var energies = new double[springs.Length];
        var sum = 0.0;
        for (var e = 0; e < springs.Length; e++)
        {
            var (a, b, k) = springs[e];
            var d = rows is null ? (a >= 0 ? phi[a] : 0) - (b >= 0 ? phi[b] : 0) : rows[e].Sum(t => t.Weight * phi[t.Index]);
            sum += energies[e] = k * d * d;
        }
        for (var e = 0; e < energies.Length; e++) energies[e] = sum > 0 ? energies[e] / sum : 0;
        return ImmutableCollectionsMarshal.AsImmutableArray(energies);
    }
}
