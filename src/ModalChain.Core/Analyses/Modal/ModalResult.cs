using System.Collections.Immutable;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>One undamped natural mode of a network.</summary>
/// <param name="Number">1-based mode number in ascending frequency.</param>
/// <param name="EigenValue">λ = ω² in rad²/s² as solved (0 for a rigid-body mode).</param>
/// <param name="AngularFrequency">ω in rad/s.</param>
/// <param name="NaturalFrequencyHz">f = ω/2π in Hz.</param>
/// <param name="PeriodSeconds">T = 1/f in s; +∞ for a rigid-body mode.</param>
/// <param name="IsRigidBody">True when the mode moves a part of the network that no spring holds (ω taken as 0).</param>
/// <param name="Shape">Mass-normalised shape φ (φᵀMφ = 1, unit 1/√kg), one entry per DOF; largest-magnitude entry positive.</param>
/// <param name="ParticipationFactor">Γ = φᵀ M ι in √kg, for unit motion ι of every mass in the network's direction.</param>
/// <param name="EffectiveModalMass">M* = Γ² / (φᵀMφ) in kg.</param>
/// <param name="EffectiveMassFraction">M* divided by the total free mass.</param>
/// <param name="CumulativeEffectiveMassFraction">Sum of the fractions of this mode and all lower modes.</param>
/// <param name="KineticEnergyShare">Per DOF, the share of the mode's kinetic energy carried by that mass: m_i φ_i²; sums to 1.</param>
/// <param name="StrainEnergyShare">Per spring, the share of the mode's strain energy stored in that spring: k (φ_a − φ_b)² / Σ; sums to 1 (all 0 for a rigid-body mode).</param>
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
    /// <summary>Modal mass of this mode seen at DOF <paramref name="dof"/>: 1/φ_dof² in kg (+∞ at a node of the mode).</summary>
    public double ModalMassAt(int dof) => 1 / (Shape[dof] * Shape[dof]);
}

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

    /// <summary>The shape of <paramref name="mode"/> at every mass of the network, in declaration order (linked masses repeat their DOF's value).</summary>
    public ImmutableArray<double> ShapeByMass(Mode mode)
    {
        ArgumentNullException.ThrowIfNull(mode);
        return [.. Network.Masses.Select(m => mode.Shape[Matrices.Dofs.IndexOf(m.Name)])];
    }

    /// <summary>Number of rigid-body (0 Hz) modes among <see cref="Modes"/>.</summary>
    public int RigidBodyModeCount => Modes.Count(m => m.IsRigidBody);
}
