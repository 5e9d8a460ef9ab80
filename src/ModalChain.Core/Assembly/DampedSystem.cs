using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Assembly;

/// <summary>A model assembled once for dynamic analyses: partitioned K and C, all undamped modes and their damping.</summary>
/// <remarks>
/// Build one with <see cref="Build(StructuralModel)"/> and reuse it for many sweeps or time histories. Damping is classical when
/// Φᵀ C Φ is diagonal (<see cref="NonClassicalIndex"/> below <see cref="ClassicalTolerance"/>); then modal
/// superposition with <see cref="ModalDampingRatios"/> is exact. Every matrix over the free DOFs is sparse unless
/// modal damping ratios fill C (C_m = MΦ diag(2ζω) ΦᵀM is dense and needs every mode); a model with no viscous damping
/// at all skips the damping stage, and the modal damping, ratios and coupling index cover the modes solved only.
/// Proportional damping (Rayleigh and modal ratios without a discrete damper) takes Φᵀ C Φ in closed form
/// (<see cref="DampingAssembly.ProportionalModalDamping"/>; coupling index 0) and forms C only when an analysis reads
/// <see cref="Damping"/>, so a modal run with Rayleigh damping never builds C.
/// </remarks>
/// <param name="Model">The model assembled.</param>
/// <param name="Partition">K, M and discrete-damper matrices split into free and support DOFs.</param>
/// <param name="Modes">The undamped modes of the free DOFs: all of them unless the system was built for the lowest few.</param>
/// <param name="Damping">The viscous damping matrix (dampers, Rayleigh, modal) in N·s/m.</param>
/// <param name="ModalDamping">Φᵀ C_ff Φ in 1/s.</param>
/// <param name="ModalDampingRatios">Damping ratio per mode (viscous part plus η/2); NaN for rigid-body modes.</param>
/// <param name="NonClassicalIndex">Largest normalised off-diagonal of Φᵀ C Φ.</param>
public sealed record DampedSystem(
    StructuralModel Model,
    SupportPartition Partition,
    ModalResult Modes,
    DampingMatrices Damping,
    Matrix<double> ModalDamping,
    ImmutableArray<double> ModalDampingRatios,
    double NonClassicalIndex)
{
    /// <summary>Below this <see cref="NonClassicalIndex"/> damping is treated as classical.</summary>
    public const double ClassicalTolerance = 1e-8;

    /// <summary>Hysteretic loss factor η of the model (dimensionless).</summary>
    public double LossFactor => Model.Damping.LossFactor;

    /// <summary>True when the viscous damping does not couple the undamped modes.</summary>
    public bool IsClassical => NonClassicalIndex < ClassicalTolerance;

    /// <summary>
    /// True when a massless DOF is touched by viscous damping (a model with a Maxwell element, say): it is then a
    /// first-order state, the undamped modes condense it through its springs only, and only the complex modes
    /// (<see cref="Analyses.Modal.ComplexModes"/>) describe the damped system, however classical Φᵀ C Φ looks.
    /// </summary>
    public bool HasFirstOrderStates => Model.Network.Masses.Any(m => m.Kilograms == 0)
        && MasslessReduction.Classify(Partition.Mass, Damping.FF).HasFirstOrderStates;

    /// <summary>True when the model has any viscous damping at all.</summary>
    public bool HasViscousDamping => KnownViscousDamping ?? Damping.FF.EnumerateIndexed(Zeros.AllowSkip).Any(e => e.Item3 != 0);

    /// <summary>Whether C ≠ 0, when known without forming C (proportional damping); null to look at C.</summary>
    private bool? KnownViscousDamping { get; init; }

    /// <summary>C = a0·M + a1·K_ff + C_m ≠ 0 without forming it: M has positive masses, and C_m ≠ 0 when an elastic mode has a ratio; null when unsure.</summary>
    private static bool? ProportionalIsViscous(DampingModel damping, SupportPartition partition, ModalResult modes)
    {
        if (damping.Rayleigh is { } r && (r.MassCoefficient != 0
            || (r.StiffnessCoefficient != 0 && partition.StiffnessFF.EnumerateIndexed(Zeros.AllowSkip).Any(e => e.Item3 != 0))))
            return true;
        if (damping.ModalRatios.IsDefaultOrEmpty) return false;
        // Elastic modes of the whole network: exact from the topology in line models; plane and 3d models only when every mode is held.
        int? elastic = modes.Network.Space == ModelSpace.Line ? partition.FreeCount - Topology.UnsupportedGroups(modes.Network).Length
            : modes.Modes.Length == partition.FreeCount ? modes.Modes.Count(m => !m.IsRigidBody) : null;
        return elastic is { } e ? damping.ModalRatios.Take(e).Any(z => z != 0) : null;
    }

    /// <summary>Assembles <paramref name="model"/> and solves all its undamped modes.</summary>
    public static DampedSystem Build(StructuralModel model) => Build(model, options: null);

    /// <summary>Assembles <paramref name="model"/> and solves the undamped modes <paramref name="options"/> ask for (all when no count).</summary>
    /// <remarks>
    /// With a count only the lowest modes are solved, and the modal damping matrix, ratios and coupling index are
    /// those of these modes. Modal damping ratios in the model build C from every mode, so then all are solved anyway.
    /// </remarks>
    public static DampedSystem Build(StructuralModel model, ModalOptions? options)
    {
        ArgumentNullException.ThrowIfNull(model);
        options ??= new ModalOptions();
        if (!model.Damping.ModalRatios.IsDefaultOrEmpty) options = options with { Count = null };
        return Build(model, ModalAnalysis.Solve(model.Network, options), options.Choice);
    }

    /// <summary>Assembles <paramref name="model"/> around modes already solved, so a command solves the eigenproblem once.</summary>
    /// <param name="model">The model.</param>
    /// <param name="modes">Undamped modes of its network: all of them, or the lowest few when the model has no modal damping ratios.</param>
    /// <param name="choice">The solver family used if every mode must still be solved (modal damping ratios with only some modes given).</param>
    public static DampedSystem Build(StructuralModel model, ModalResult modes, SolverChoice choice = SolverChoice.Auto)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(modes);
        var partition = model.Network.Space == ModelSpace.Line ? SupportPartition.Assemble(model.Network) : SpatialAssembly.Partition(model.Network);
        var damping = model.Damping;
        if (damping.ModalRatios.IsDefaultOrEmpty && damping.Rayleigh is null && !partition.HasDampers)
        {
            // No viscous damping at all: C is the partition's empty damper blocks and Φᵀ C Φ = 0, so nothing is
            // multiplied or factorised; each reported mode gets η/2 (the loss factor's share), rigid-body modes NaN.
            var count = modes.Modes.Length;
            var none = Matrix<double>.Build.Sparse(count, count);
            return new DampedSystem(model, partition, modes,
                new DampingMatrices(partition.DamperFF, partition.DamperFP, partition.DamperPP), none,
                DampingAssembly.ModalRatios(modes, none, damping.LossFactor), 0);
        }
        // Modal damping ratios define C from every mode, and the analyses superpose the modes held: all of them then.
        if (!damping.ModalRatios.IsDefaultOrEmpty && modes.Modes.Length != modes.ModeCountAvailable)
            modes = ModalAnalysis.Solve(model.Network, new ModalOptions(Choice: choice));
        if (!partition.HasDampers)
        {
            // Proportional damping (Rayleigh, modal ratios): Φᵀ C Φ is diagonal in closed form, so the ratios need no C
            // and no product with the shapes; C itself is built only if an analysis reads it (a modal run never does).
            var diagonal = DampingAssembly.ProportionalModalDamping(modes, damping);
            var held = modes;
            var deferred = new DampingMatrices(() => DampingAssembly.Build(model, partition, held).FF,
                () => DampingAssembly.ProportionalSupportBlocks(model, partition, held));
            var diagonalMatrix = Matrix<double>.Build.DiagonalOfDiagonalArray(diagonal);
            return new DampedSystem(model, partition, modes, deferred, diagonalMatrix,
                DampingAssembly.ModalRatios(modes, diagonalMatrix, damping.LossFactor), 0)
            {
                KnownViscousDamping = ProportionalIsViscous(damping, partition, modes),
            };
        }
        var matrices = DampingAssembly.Build(model, partition, modes);
        var modal = DampingAssembly.ModalCoordinates(modes, matrices.FF);
        return new DampedSystem(model, partition, modes, matrices, modal,
            DampingAssembly.ModalRatios(modes, modal, damping.LossFactor),
            DampingAssembly.NonClassicalIndex(modal));
    }
}
