using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Storage;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>The viscous damping matrix over free and prescribed DOFs, in N·s/m.</summary>
/// <remarks>
/// The support blocks may be computed on first use: with distributed damping they need the quasi-static influence
/// T = −K_ff⁻¹K_fp (a sparse factorisation of K_ff), which a modal run or a sweep without support motion never reads.
/// </remarks>
public sealed class DampingMatrices
{
    private readonly Lazy<Matrix<double>> _ff;
    private readonly Lazy<(Matrix<double> FP, Matrix<double> PP)> _supports;

    /// <summary>The three blocks, all given.</summary>
    /// <param name="ff">C_ff (free rows and columns).</param>
    /// <param name="fp">C_fp (free rows, support columns).</param>
    /// <param name="pp">C_pp (support rows and columns).</param>
    public DampingMatrices(Matrix<double> ff, Matrix<double> fp, Matrix<double> pp)
    {
        ArgumentNullException.ThrowIfNull(ff);
        ArgumentNullException.ThrowIfNull(fp);
        ArgumentNullException.ThrowIfNull(pp);
        _ff = new Lazy<Matrix<double>>(ff);
        _supports = new Lazy<(Matrix<double>, Matrix<double>)>((fp, pp));
    }

    /// <summary>C_ff given, C_fp and C_pp computed by <paramref name="supports"/> when first read (once, thread-safe).</summary>
    internal DampingMatrices(Matrix<double> ff, Func<(Matrix<double> FP, Matrix<double> PP)> supports)
        : this(() => ff, supports) => ArgumentNullException.ThrowIfNull(ff);

    /// <summary>C_ff from <paramref name="ff"/>, C_fp and C_pp from <paramref name="supports"/>, each computed when first read (once, thread-safe).</summary>
    internal DampingMatrices(Func<Matrix<double>> ff, Func<(Matrix<double> FP, Matrix<double> PP)> supports)
    {
        _ff = new Lazy<Matrix<double>>(ff, LazyThreadSafetyMode.ExecutionAndPublication);
        _supports = new Lazy<(Matrix<double>, Matrix<double>)>(supports, LazyThreadSafetyMode.ExecutionAndPublication);
    }

    /// <summary>C_ff (free rows and columns).</summary>
    public Matrix<double> FF => _ff.Value;

    /// <summary>C_fp (free rows, support columns).</summary>
    public Matrix<double> FP => _supports.Value.FP;

    /// <summary>C_pp (support rows and columns).</summary>
    public Matrix<double> PP => _supports.Value.PP;
}

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
        var ff = partition.DamperFF;
        var (stiffnessShare, relative) = (0.0, (Matrix<double>?)null);
        if (damping.Rayleigh is { } r)
        {
            stiffnessShare = r.StiffnessCoefficient;
            ff = Sum(ff, stiffnessShare, partition.StiffnessFF);
            if (r.MassCoefficient != 0) relative = r.MassCoefficient * partition.Mass;
        }
        if (!damping.ModalRatios.IsDefaultOrEmpty)
        {
            if (modes is null || modes.Modes.Length != modes.ModeCountAvailable || modes.Matrices.Size != partition.FreeCount)
                throw new ArgumentException("Modal damping needs every mode of the network.", nameof(modes));
            var modal = ModalDampingMatrix(partition.Mass, modes, damping);
            relative = relative is null ? modal : relative + modal;
        }
        if (relative is not null) ff = Sum(ff, 1, relative);
        if (stiffnessShare == 0 && relative is null) return new DampingMatrices(ff, partition.DamperFP, partition.DamperPP);

        // The support blocks need the quasi-static influence T (a sparse factorisation of K_ff, one solve per support):
        // computed when an analysis first reads them, never for a modal run.
        return new DampingMatrices(ff, () =>
        {
            var fp = Sum(partition.DamperFP, stiffnessShare, partition.StiffnessFP);
            var pp = Sum(partition.DamperPP, stiffnessShare, partition.StiffnessPP);
            if (relative is not null && partition.QuasiStaticInfluence() is { } t)
            {
                var ct = relative * t;
                fp -= ct;
                pp += t.TransposeThisAndMultiply(ct);
            }
            return (fp, pp);
        });
    }

    /// <summary>a + β·b; over compressed rows in one pass when both are sparse (Math.NET's sparse sum inserts entry by entry, quadratic in the rows).</summary>
    /// <remarks>Each entry is a_ij + (β·b_ij), the same floating-point operations as <c>a + β * b</c>; exact zeros are not stored.</remarks>
    internal static Matrix<double> Sum(Matrix<double> a, double beta, Matrix<double> b)
    {
        if (beta == 0) return a;
        if (a.Storage is not SparseCompressedRowMatrixStorage<double> x || b.Storage is not SparseCompressedRowMatrixStorage<double> y)
            return a + beta * b;
        var rows = a.RowCount;
        var rowPointers = new int[rows + 1];
        var capacity = x.RowPointers[rows] + y.RowPointers[rows];
        var columns = new int[capacity];
        var values = new double[capacity];
        var count = 0;
        for (var i = 0; i < rows; i++)
        {
            int p = x.RowPointers[i], pEnd = x.RowPointers[i + 1], q = y.RowPointers[i], qEnd = y.RowPointers[i + 1];
            while (p < pEnd || q < qEnd)
            {
                var cx = p < pEnd ? x.ColumnIndices[p] : int.MaxValue;
                var cy = q < qEnd ? y.ColumnIndices[q] : int.MaxValue;
                int column;
                double v;
                if (cx < cy) (column, v) = (cx, x.Values[p++]);
                else if (cy < cx) (column, v) = (cy, beta * y.Values[q++]);
                else (column, v) = (cx, x.Values[p++] + beta * y.Values[q++]);
                if (v == 0) continue;
                columns[count] = column;
                values[count++] = v;
            }
            rowPointers[i + 1] = count;
        }
        return Matrix<double>.Build.SparseFromCompressedSparseRowFormat(rows, a.ColumnCount, count, rowPointers, columns[..count], values[..count]);
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
        var fullProduct = spatial ? mass * Shapes(modes) : null;
        var mPhi = Matrix<double>.Build.Dense(n, modes.Modes.Length);
        var scaled = Matrix<double>.Build.Dense(n, modes.Modes.Length);
        var coefficients = ModalCoefficients(modes, damping);
        for (var j = 0; j < modes.Modes.Length; j++)
        {
            var mode = modes.Modes[j];
            var c = coefficients[j];
            for (var i = 0; i < n; i++)
            {
                var v = fullProduct?[i, j] ?? mass[i, i] * mode.Shape[i];
                mPhi[i, j] = v;
                scaled[i, j] = c * v;
            }
        }
        return scaled.TransposeAndMultiply(mPhi);
    }

    /// <summary>
    /// Φᵀ C_ff Φ of proportional damping (Rayleigh and modal ratios, no discrete damper) in closed form: the diagonal
    /// a0 + a1·ω_j² + 2ζ_jω_j per mode of <paramref name="modes"/>, in 1/s.
    /// </summary>
    /// <remarks>
    /// With mass-normalised shapes ΦᵀMΦ = I and ΦᵀK_ffΦ = Λ, so Rayleigh damping gives a0·I + a1·Λ (Chopra, Dynamics of
    /// Structures, §11.4) and the modal damping matrix C_m gives diag(2ζ_jω_j) (§11.4.2; <see cref="ModalDampingMatrix"/>),
    /// whichever modes are held: no C and no product with the shapes. The damping ratio a0/(2ω) + a1ω/2 + ζ_j follows.
    /// Rigid-body modes (ω = 0) take a0 alone. Equal to <see cref="ModalCoordinates"/> of <see cref="Build"/> up to round-off.
    /// </remarks>
    public static double[] ProportionalModalDamping(ModalResult modes, DampingModel damping)
    {
        ArgumentNullException.ThrowIfNull(modes);
        ArgumentNullException.ThrowIfNull(damping);
        var (a0, a1) = damping.Rayleigh is { } r ? (r.MassCoefficient, r.StiffnessCoefficient) : (0.0, 0.0);
        var diagonal = ModalCoefficients(modes, damping);
        for (var j = 0; j < diagonal.Length; j++) diagonal[j] += a0 + a1 * modes.Modes[j].EigenValue;
        return diagonal;
    }

    /// <summary>2ζ_jω_j per mode from the modal ratios of <paramref name="damping"/>; 0 for rigid-body modes.</summary>
    private static double[] ModalCoefficients(ModalResult modes, DampingModel damping)
    {
        var rigidBodyModes = RigidBodyModes(modes);
        var c = new double[modes.Modes.Length];
        for (var j = 0; j < c.Length; j++)
        {
            var mode = modes.Modes[j];
            c[j] = j < rigidBodyModes || mode.IsRigidBody ? 0 : 2 * damping.ModalRatioOf(j - rigidBodyModes + 1) * mode.AngularFrequency;
        }
        return c;
    }

    /// <summary>
    /// C_fp and C_pp of proportional damping (no discrete damper) without forming C_ff: a1·K_fp − R T and
    /// a1·K_pp + Tᵀ R T with R T = a0·M T + M Φ diag(2ζω) Φᵀ M T (T the quasi-static influence).
    /// </summary>
    /// <remarks>The same blocks as <see cref="Build"/>, in O(n·m·p) rather than the O(n²·m) of the dense C_m; <paramref name="modes"/> must hold every mode when modal ratios are given.</remarks>
    internal static (Matrix<double> FP, Matrix<double> PP) ProportionalSupportBlocks(StructuralModel model, SupportPartition partition, ModalResult modes)
    {
        var damping = model.Damping;
        var (a0, a1) = damping.Rayleigh is { } r ? (r.MassCoefficient, r.StiffnessCoefficient) : (0.0, 0.0);
        var fp = Sum(partition.DamperFP, a1, partition.StiffnessFP);
        var pp = Sum(partition.DamperPP, a1, partition.StiffnessPP);
        var modal = !damping.ModalRatios.IsDefaultOrEmpty;
        if ((a0 == 0 && !modal) || partition.QuasiStaticInfluence() is not { } t) return (fp, pp);
        var mt = partition.Mass * t;
        var rt = a0 * mt;
        if (modal)
        {
            // Every mode there is: one per inertial DOF when massless DOFs were condensed (ModeCountAvailable), as in Build.
            if (modes.Modes.Length != modes.ModeCountAvailable || modes.Matrices.Size != partition.FreeCount)
                throw new ArgumentException("Modal damping needs every mode of the network.", nameof(modes));
            var phi = Shapes(modes);
            var w = phi.TransposeThisAndMultiply(mt);
            var c = ModalCoefficients(modes, damping);
            for (var j = 0; j < c.Length; j++)
                for (var s = 0; s < w.ColumnCount; s++) w[j, s] *= c[j];
            rt += partition.Mass * (phi * w);
        }
        return (fp - rt, pp + t.TransposeThisAndMultiply(rt));
    }

    /// <summary>Rigid-body modes of the network that come first in <paramref name="modes"/>: from the topology in line models, else counted.</summary>
    private static int RigidBodyModes(ModalResult modes) =>
        modes.Network.Space != ModelSpace.Line ? modes.Modes.Count(m => m.IsRigidBody) : Topology.UnsupportedGroups(modes.Network).Length;

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
