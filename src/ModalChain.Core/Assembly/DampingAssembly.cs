using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>The viscous damping matrix over free and prescribed DOFs, in N·s/m.</summary>
/// <param name="FF">C_ff (free rows and columns).</param>
/// <param name="FP">C_fp (free rows, support columns).</param>
/// <param name="PP">C_pp (support rows and columns).</param>
public sealed record DampingMatrices(Matrix<double> FF, Matrix<double> FP, Matrix<double> PP);

/// <summary>Builds the viscous damping matrix of a model (discrete dampers + Rayleigh + modal) and modal damping ratios.</summary>
/// <remarks>
/// <para>Discrete dampers act between their two nodes. Rayleigh damping is C = a0·M + a1·K (Rayleigh 1877; Chopra,
/// Dynamics of Structures, §11.4). Modal damping ratios ζ_j give C_m = M Φ diag(2ζ_jω_j) Φᵀ M with mass-normalised
/// shapes Φ, the superposition of modal damping matrices (Chopra §11.4.2), so that Φᵀ C_m Φ = diag(2ζ_jω_j).</para>
/// <para>Distributed damping that has no element of its own (modal damping and the a0·M part of Rayleigh damping)
/// acts on the motion relative to the quasi-static position x − T u, T = −K_ff⁻¹K_fp (Chopra §13.5): a network that
/// moves rigidly with its supports is not damped, and the damping force reaches the supports through T. With this
/// form a single-mass model with modal ratio ζ has the classical transmissibility √(1+(2ζr)²)/√((1−r²)²+(2ζr)²).
/// When K_ff is singular (rigid-body modes) T does not exist and that damping acts on absolute motion.</para>
/// </remarks>
public static class DampingAssembly
{
    /// <summary>C of <paramref name="model"/> over the partition; <paramref name="modes"/> must hold every mode when modal ratios are given.</summary>
    public static DampingMatrices Build(StructuralModel model, SupportPartition partition, ModalResult? modes)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(partition);
        var damping = model.Damping;
        var ff = partition.DamperFF.Clone();
        var fp = partition.DamperFP.Clone();
        var pp = partition.DamperPP.Clone();

        // The relative-motion part and its quasi-static influence (a dense LU of K_ff) only when there is such damping.
        Matrix<double>? relative = null;
        if (damping.Rayleigh is { } r)
        {
            ff += r.StiffnessCoefficient * partition.StiffnessFF;
            fp += r.StiffnessCoefficient * partition.StiffnessFP;
            pp += r.StiffnessCoefficient * partition.StiffnessPP;
            if (r.MassCoefficient != 0) relative = r.MassCoefficient * partition.Mass;
        }
        if (!damping.ModalRatios.IsDefaultOrEmpty)
        {
            if (modes is null || modes.Modes.Length != modes.ModeCountAvailable || modes.Matrices.Size != partition.FreeCount)
                throw new ArgumentException("Modal damping needs every mode of the network.", nameof(modes));
            var modal = ModalDampingMatrix(partition.Mass, modes, damping);
            relative = relative is null ? modal : relative + modal;
        }
        if (relative is null) return new DampingMatrices(ff, fp, pp);

        ff += relative;
        if (partition.QuasiStaticInfluence() is { } t)
        {
            var ct = relative * t;
            fp -= ct;
            pp += t.TransposeThisAndMultiply(ct);
        }
        return new DampingMatrices(ff, fp, pp);
    }

    /// <summary>C_m = M Φ diag(2ζ_jω_j) Φᵀ M in N·s/m from the modal ratios of <paramref name="damping"/>; rigid-body modes get none.</summary>
    /// <remarks>
    /// The ratios apply to the elastic modes in order: the first ratio to the lowest elastic mode. The network's
    /// rigid-body modes (one per group of masses that no chain of springs ties to a support,
    /// <see cref="Topology.UnsupportedGroups"/>) are the lowest modes and take no ratio; they are counted from the
    /// topology, which is exact, not from the size of their computed eigenvalues.
    /// </remarks>
    public static Matrix<double> ModalDampingMatrix(Matrix<double> mass, ModalResult modes, DampingModel damping)
    {
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(modes);
        ArgumentNullException.ThrowIfNull(damping);
        var n = mass.RowCount;
        // Plane and 3d models count rigid-body modes from the null space of K (topology cannot), and a body's inertia may couple M.
        var spatial = modes.Network.Space != ModelSpace.Line;
        var rigidBodyModes = spatial ? modes.Modes.Count(m => m.IsRigidBody) : Topology.UnsupportedGroups(modes.Network).Length;
        var fullProduct = spatial ? mass * Shapes(modes) : null;
        var mPhi = Matrix<double>.Build.Dense(n, modes.Modes.Length);
        var scaled = Matrix<double>.Build.Dense(n, modes.Modes.Length);
        for (var j = 0; j < modes.Modes.Length; j++)
        {
            var mode = modes.Modes[j];
            var c = j < rigidBodyModes || mode.IsRigidBody ? 0 : 2 * damping.ModalRatioOf(j - rigidBodyModes + 1) * mode.AngularFrequency;
            for (var i = 0; i < n; i++)
            {
                var v = fullProduct?[i, j] ?? mass[i, i] * mode.Shape[i];
                mPhi[i, j] = v;
                scaled[i, j] = c * v;
            }
        }
        return scaled.TransposeAndMultiply(mPhi);
    }

    /// <summary>The modal damping matrix Ĉ = Φᵀ C_ff Φ in 1/s (mass-normalised shapes, all modes of <paramref name="modes"/>).</summary>
    public static Matrix<double> ModalCoordinates(ModalResult modes, Matrix<double> dampingFF)
    {
        ArgumentNullException.ThrowIfNull(modes);
        ArgumentNullException.ThrowIfNull(dampingFF);
        var count = modes.Modes.Length;
        // No viscous damping at all (the common undamped modal run): Φᵀ 0 Φ needs no O(n²m) product.
        if (dampingFF.Enumerate(Zeros.AllowSkip).All(v => v == 0)) return Matrix<double>.Build.Sparse(count, count);
        var phi = Shapes(modes);
        return phi.TransposeThisAndMultiply(dampingFF * phi);
    }

    /// <summary>Damping ratio per mode: ζ_j = Ĉ_jj/(2ω_j) + η/2, NaN for a rigid-body mode.</summary>
    /// <remarks>
    /// Exact for classical damping; for non-classical damping it is the usual estimate from the diagonal of Φᵀ C Φ,
    /// which the complex modes (<see cref="Analyses.Modal.ComplexModes"/>) refine. The loss factor η adds η/2, its
    /// equivalent viscous ratio at resonance (common practice).
    /// </remarks>
    public static ImmutableArray<double> ModalRatios(ModalResult modes, Matrix<double> modalDamping, double lossFactor)
    {
        ArgumentNullException.ThrowIfNull(modes);
        ArgumentNullException.ThrowIfNull(modalDamping);
        return [.. modes.Modes.Select((m, j) => m.IsRigidBody ? double.NaN : modalDamping[j, j] / (2 * m.AngularFrequency) + lossFactor / 2)];
    }

    /// <summary>max over j ≠ k of |Ĉ_jk| / √(Ĉ_jj Ĉ_kk): 0 for classical damping (Caughey &amp; O'Kelly 1965), up to 1 for strongly coupled modes.</summary>
    public static double NonClassicalIndex(Matrix<double> modalDamping)
    {
        ArgumentNullException.ThrowIfNull(modalDamping);
        var n = modalDamping.RowCount;
        var largestDiagonal = 0.0;
        for (var j = 0; j < n; j++) largestDiagonal = Math.Max(largestDiagonal, Math.Abs(modalDamping[j, j]));
        if (largestDiagonal == 0) return 0;
        var worst = 0.0;
        for (var j = 0; j < n; j++)
            for (var k = j + 1; k < n; k++)
            {
                var off = Math.Abs(modalDamping[j, k]);
                if (off <= 1e-14 * largestDiagonal) continue;
                var scale = Math.Sqrt(Math.Abs(modalDamping[j, j] * modalDamping[k, k]));
                worst = Math.Max(worst, scale > 0 ? Math.Min(1, off / scale) : 1);
            }
        return worst;
    }

    internal static Matrix<double> Shapes(ModalResult modes)
    {
        var n = modes.Matrices.Size;
        return Matrix<double>.Build.Dense(n, modes.Modes.Length, (i, j) => modes.Modes[j].Shape[i]);
    }
}
