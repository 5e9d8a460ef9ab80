using System.Collections.Immutable;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>One undamped natural mode of a network.</summary>
/// <param name="Number">1-based mode number in ascending frequency.</param>
/// <param name="EigenValue">λ = ω² in rad²/s² as solved (0 for a rigid-body mode).</param>
/// <param name="AngularFrequency">ω in rad/s.</param>
/// <param name="NaturalFrequencyHz">f = ω/2π in Hz.</param>
/// <param name="PeriodSeconds">T = 1/f in s; +∞ for a rigid-body mode.</param>
/// <param name="IsRigidBody">
/// True when the mode moves a part of the network that no spring holds (ω taken as 0); in plane and 3d models, a
/// mode in the null space of K (ω² at most 1e-10 of the stiffness scale).
/// </param>
/// <param name="Shape">Mass-normalised shape φ (φᵀMφ = 1, unit 1/√kg), one entry per DOF; largest-magnitude entry positive.</param>
/// <param name="ParticipationFactor">Γ = φᵀ M ι in √kg, for unit motion ι of every mass in the network's direction (vertical, z, in plane and 3d models).</param>
/// <param name="EffectiveModalMass">M* = Γ² / (φᵀMφ) in kg.</param>
/// <param name="EffectiveMassFraction">M* divided by the total free mass.</param>
/// <param name="CumulativeEffectiveMassFraction">Sum of the fractions of this mode and all lower modes.</param>
/// <param name="KineticEnergyShare">
/// Per DOF, the share of the mode's kinetic energy carried by that DOF: m_i φ_i² (φ_i (Mφ)_i where a body's inertia
/// couples its rotations: mass-coupled terms are split by DOF as written, so a share may be slightly negative); sums to 1.
/// </param>
/// <param name="StrainEnergyShare">
/// Per spring, the share of the mode's strain energy stored in that spring: k (φ_a − φ_b)² / Σ (plane and 3d models:
/// ½ Δᵀ K_e Δ with Δ the element's end motions); sums to 1 (all 0 for a rigid-body mode).
/// </param>
/// <param name="Residual">‖Kφ − ω²Mφ‖ / ‖Kφ‖ (for a rigid-body mode ‖Kφ‖ / (s ‖Mφ‖) with s the stiffness scale).</param>
public sealed record Mode(
    int Number,
    double EigenValue,
    double AngularFrequency,
    double NaturalFrequencyHz,
    double PeriodSeconds,
    bool IsRigidBody,
    ImmutableArray<double> Shape,
    double ParticipationFactor,
    double EffectiveModalMass,
    double EffectiveMassFraction,
    double CumulativeEffectiveMassFraction,
    ImmutableArray<double> KineticEnergyShare,
    ImmutableArray<double> StrainEnergyShare,
    double Residual)
{
    /// <summary>
    /// Participation per direction of the space: in line models one entry (Along) equal to the fields above; in plane
    /// and 3d models one per translation and one per rotation about the result's reference point.
    /// </summary>
    public ImmutableArray<DirectionalParticipation> Participation { get; init; } = [];

    /// <summary>Share of the mode's kinetic energy per direction (the DOF shares summed by direction); sums to 1. Line models: [Along → 1].</summary>
    public ImmutableArray<DirectionalFigure> KineticEnergyByDirection { get; init; } = [];

    /// <summary>
    /// The dominant motion in plane and 3d models: bounce (z), surge (x), sway (y), roll (rx), pitch (ry) or yaw (rz)
    /// when one direction carries at least <see cref="MotionNames.DominantShare"/> of the kinetic energy, else
    /// "coupled A + B" naming the two largest; null in line models.
    /// </summary>
    public string? Motion { get; init; }

    /// <summary>The largest single-direction kinetic-energy share: 1 for a pure (decoupled) motion; 1 in line models.</summary>
    public double Decoupling { get; init; } = 1;

    /// <summary>Modal mass of this mode seen at DOF <paramref name="dof"/>: 1/φ_dof² in kg (+∞ at a node of the mode).</summary>
    public double ModalMassAt(int dof) => 1 / (Shape[dof] * Shape[dof]);
}

/// <summary>The participation of one mode in one direction.</summary>
/// <param name="Direction">The translation, or the rotation about the reference point (Along in line models).</param>
/// <param name="ParticipationFactor">Γ_d = φᵀ M ι_d: √kg for a translation, √kg·m for a rotation.</param>
/// <param name="EffectiveMass">M*_d = Γ_d² / φᵀMφ: kg for a translation, kg·m² for a rotation.</param>
/// <param name="Fraction">M*_d / ι_dᵀMι_d (0 when the direction has no mass or inertia).</param>
/// <param name="CumulativeFraction">Sum of <paramref name="Fraction"/> over this and every lower mode.</param>
public sealed record DirectionalParticipation(Direction Direction, double ParticipationFactor, double EffectiveMass, double Fraction, double CumulativeFraction);

/// <summary>A figure that belongs to one direction (a kinetic-energy share, a total mass or inertia).</summary>
/// <param name="Direction">The direction.</param>
/// <param name="Value">The figure, in the unit its owner states.</param>
public sealed record DirectionalFigure(Direction Direction, double Value);

/// <summary>Figures that tell how far a modal result can be trusted numerically.</summary>
/// <param name="MaxResidual">Largest eigen residual over the modes returned.</param>
/// <param name="MaxOrthogonalityError">Largest |Φᵀ M Φ − I| entry over the modes returned.</param>
public sealed record ModalQuality(double MaxResidual, double MaxOrthogonalityError);

/// <summary>The outcome of a modal analysis.</summary>
/// <param name="Network">The network analysed.</param>
/// <param name="Matrices">Its assembled matrices.</param>
/// <param name="Modes">The modes, ascending in frequency.</param>
/// <param name="TotalMass">Total free mass ιᵀMι in kg.</param>
/// <param name="Quality">Residual and orthogonality figures.</param>
/// <param name="Algorithm">Name of the eigen algorithm used.</param>
public sealed record ModalResult(
    Network Network,
    StructuralMatrices Matrices,
    ImmutableArray<Mode> Modes,
    double TotalMass,
    ModalQuality Quality,
    string Algorithm)
{
    /// <summary>What a reviewer must know about the accuracy of these modes (stiffness spread, springs involved); empty when nothing.</summary>
    public ImmutableArray<string> Warnings { get; init; } = [];

    /// <summary>
    /// Per direction, ι_dᵀMι_d: the total mass moving in a translation (kg) and the rotational inertia about
    /// <see cref="ReferencePoint"/> (kg·m²); the sum of every mode's effective mass in that direction. Line models: [Along → <see cref="TotalMass"/>].
    /// </summary>
    public ImmutableArray<DirectionalFigure> TotalByDirection { get; init; } = [];

    /// <summary>The point (m) the rotational effective masses are taken about; null in line models.</summary>
    public Point3? ReferencePoint => Matrices.ReferencePoint;

    /// <summary>The shape of <paramref name="mode"/> at every mass of the network, in declaration order (linked masses repeat their DOF's value).</summary>
    /// <exception cref="InvalidOperationException">A plane or 3d model, where a mass has several DOFs: use <see cref="ShapeAt"/>.</exception>
    public ImmutableArray<double> ShapeByMass(Mode mode)
    {
        ArgumentNullException.ThrowIfNull(mode);
        if (Network.Space != ModelSpace.Line)
            throw new InvalidOperationException("A plane or 3d model has several DOFs per node: read the shape per (node, direction) with ShapeAt, or per DOF label from Mode.Shape.");
        // A node a transducer eliminates takes its value from the kept ones, x = T q (flux per unit modal coordinate).
        if (Assembly.ConstraintElimination.Of(Network) is { } elimination)
            return [.. Network.Masses.Select(m => elimination.Value(m.Name, n => Matrices.Dofs.IndexOf(n) is var i and >= 0 ? mode.Shape[i] : 0.0))];
        return [.. Network.Masses.Select(m => mode.Shape[Matrices.Dofs.IndexOf(m.Name)])];
    }

    /// <summary>The value of <paramref name="mode"/>'s shape at <paramref name="node"/> in <paramref name="direction"/>; 0 where the node does not move that way (supports included).</summary>
    public double ShapeAt(Mode mode, string node, Direction direction)
    {
        ArgumentNullException.ThrowIfNull(mode);
        var i = Matrices.Dofs.IndexOf(node, direction);
        return i >= 0 ? mode.Shape[i] : 0;
    }

    /// <summary>
    /// The massless DOFs condensed statically before the eigen solve (indices into <see cref="StructuralMatrices.Dofs"/>):
    /// a model has at most FreeCount − this many modes; empty when every DOF has mass.
    /// </summary>
    public ImmutableArray<int> CondensedDofs { get; init; } = [];

    /// <summary>Number of modes the model has: its DOFs less the massless ones condensed.</summary>
    public int ModeCountAvailable => Matrices.Size - CondensedDofs.Length;

    /// <summary>Number of rigid-body (0 Hz) modes among <see cref="Modes"/>.</summary>
    public int RigidBodyModeCount => Modes.Count(m => m.IsRigidBody);
}
