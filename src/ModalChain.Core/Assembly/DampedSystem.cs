using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>A model assembled once for dynamic analyses: partitioned K and C, all undamped modes and their damping.</summary>
/// <remarks>
/// Build one with <see cref="Build"/> and reuse it for many sweeps or time histories. Damping is classical when
/// Φᵀ C Φ is diagonal (<see cref="NonClassicalIndex"/> below <see cref="ClassicalTolerance"/>); then modal
/// superposition with <see cref="ModalDampingRatios"/> is exact.
/// </remarks>
/// <param name="Model">The model assembled.</param>
/// <param name="Partition">K, M and discrete-damper matrices split into free and support DOFs.</param>
/// <param name="Modes">All undamped modes of the free DOFs.</param>
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

    /// <summary>True when the model has any viscous damping at all.</summary>
    public bool HasViscousDamping => Damping.FF.Enumerate().Any(v => v != 0);

    /// <summary>Assembles <paramref name="model"/> and solves all its undamped modes.</summary>
    public static DampedSystem Build(StructuralModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        var partition = SupportPartition.Assemble(model.Network);
        var modes = ModalAnalysis.Solve(model.Network);
        var damping = DampingAssembly.Build(model, partition, modes);
        var modal = DampingAssembly.ModalCoordinates(modes, damping.FF);
        return new DampedSystem(model, partition, modes, damping, modal,
            DampingAssembly.ModalRatios(modes, modal, model.Damping.LossFactor),
            DampingAssembly.NonClassicalIndex(modal));
    }
}
