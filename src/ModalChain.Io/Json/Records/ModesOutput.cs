using System.ComponentModel;

namespace ModalChain.Io.Json.Records;

/// <summary>The JSON of <c>modalchain modes --format json</c>: one property per field, in the order written.</summary>
/// <remarks>
/// The modes are a sequence read as it is written, so a large model's modes go to the stream one by one; each mode's
/// shape and energy shares are <see cref="NumbersByName"/> objects written on one line each. Fields of plane and 3d
/// models only are left out of line models' output.
/// </remarks>
[Description("Natural frequencies, mode shapes, effective modal masses, damping and solver quality of a model (SI units).")]
public sealed record ModesOutput : CommandOutput
{
    [Description("The model's degrees of freedom, by label (mass name; in plane and 3d models skid.z, skid.ry), in the order of the matrices.")]
    public required IReadOnlyList<string> Dofs { get; init; }

    [Description("ιᵀMι in kg: the sum of the effective modal masses; with inerters it includes the inertance of their grounded terminals.")]
    public required double TotalMassKg { get; init; }

    [Description("Plane and 3d models: the point (x, y, z in m) rotational participation and effective masses are taken about.")]
    public IReadOnlyList<double>? ReferencePointM { get; init; }

    [Description("Plane and 3d models: per direction label (x … rz), ι_dᵀMι_d: the total mass moving in a translation (kg), the rotational inertia about reference_point_m (kg·m²); what each direction's effective masses sum to.")]
    public IReadOnlyDictionary<string, double>? TotalByDirection { get; init; }

    [Description("The masses alone in kg, written only when the model has inerters (total_mass_kg may then differ).")]
    public double? PhysicalMassKg { get; init; }

    [Description("Name of the eigen algorithm used.")]
    public required string Algorithm { get; init; }

    [Description("How many of the lowest modes carry kinetic_energy_share and strain_energy_share: the lowest 20 (or all, when there are fewer) by default, every mode with `modes --detail energy`.")]
    public required int EnergyShareModes { get; init; }

    [Description("The undamped modes, ascending in frequency.")]
    public required IEnumerable<ModeOutput> Modes { get; init; }

    [Description("How the damping acts on the modes.")]
    public required ModesDampingOutput Damping { get; init; }

    [Description("The damped system's own roots, written when the damping is not classical (or the model has first-order states) and the model is small enough for a dense solve.")]
    public IReadOnlyList<ComplexModeOutput>? ComplexModes { get; init; }

    [Description("How well the eigen solution satisfies its equations.")]
    public required ModesQualityOutput Quality { get; init; }

    [Description("Warnings of the model file, then of the analysis.")]
    public required IReadOnlyList<string> Warnings { get; init; }
}

/// <summary>One undamped mode in <see cref="ModesOutput"/>.</summary>
public sealed record ModeOutput
{
    [Description(Describe.Mode)]
    public required int Number { get; init; }

    [Description(Describe.Hz)]
    public required double FrequencyHz { get; init; }

    [Description("In rad/s.")]
    public required double OmegaRadS { get; init; }

    [Description("In s; null for a rigid-body mode (infinite period).")]
    public required double PeriodS { get; init; }

    [Description("True for a 0 Hz rigid-body mode.")]
    public required bool RigidBody { get; init; }

    [Description("Mass name → mode-shape component (mass-normalised, 1/√kg); in plane and 3d models DOF label (skid.z, skid.ry) → component of the mass-normalised shape (φᵀMφ = 1).")]
    public required NumbersByName Shape { get; init; }

    [Description("Participation factor (kg^0.5 with mass-normalised shapes).")]
    public required double Participation { get; init; }

    [Description("In kg.")]
    public required double EffectiveMassKg { get; init; }

    [Description("Effective modal mass over total_mass_kg (fraction).")]
    public required double EffectiveMassFraction { get; init; }

    [Description("Sum of the effective mass fractions of this and every lower mode.")]
    public required double CumulativeMassFraction { get; init; }

    [Description("Degree-of-freedom label → share of the mode's kinetic energy (fraction). Written for the lowest energy_share_modes modes only.")]
    public NumbersByName? KineticEnergyShare { get; init; }

    [Description("Spring name → share of the mode's strain energy (fraction). Written for the lowest energy_share_modes modes only.")]
    public NumbersByName? StrainEnergyShare { get; init; }

    [Description("Relative residual ‖Kφ − ω²Mφ‖ of the mode.")]
    public required double Residual { get; init; }

    [Description("Plane and 3d models: bounce (z), surge (x), sway (y), roll (rx), pitch (ry) or yaw (rz) when one direction carries at least 80 % of the kinetic energy, else 'coupled A + B'.")]
    public string? Motion { get; init; }

    [Description("Plane and 3d models: the largest single-direction kinetic-energy share (1 for a pure motion).")]
    public double? Decoupling { get; init; }

    [Description("Plane and 3d models: direction label → share of the mode's kinetic energy.")]
    public IReadOnlyDictionary<string, double>? KineticEnergyByDirection { get; init; }

    [Description("Plane and 3d models: participation and effective mass per direction (rotations about reference_point_m).")]
    public IReadOnlyList<DirectionalMassOutput>? EffectiveMassByDirection { get; init; }

    [Description("Damping ratio (fraction); null for a rigid-body mode and for the modes of a model with first-order states (see complex_modes).")]
    public required double DampingRatio { get; init; }

    [Description("In Hz; null where the damping ratio is null or at least 1.")]
    public required double DampedFrequencyHz { get; init; }
}

/// <summary>A mode's participation in one direction in <see cref="ModeOutput"/> (plane and 3d models).</summary>
public sealed record DirectionalMassOutput
{
    [Description("x, y, z, rx, ry or rz."), SchemaEnum("x", "y", "z", "rx", "ry", "rz")]
    public required string Direction { get; init; }

    [Description("Unit of effective_mass: kg for a translation, kg*m^2 for a rotation."), SchemaEnum("kg", "kg*m^2")]
    public required string Unit { get; init; }

    [Description("Γ_d = φᵀMι_d: √kg for a translation, √kg·m for a rotation.")]
    public required double Participation { get; init; }

    [Description("M*_d = Γ_d²/φᵀMφ in 'unit'.")]
    public required double EffectiveMass { get; init; }

    [Description("M*_d divided by total_by_direction.")]
    public required double Fraction { get; init; }

    [Description("Sum of the fractions of this and every lower mode.")]
    public required double CumulativeFraction { get; init; }
}

/// <summary>The damping of the model as the modes see it, in <see cref="ModesOutput"/>.</summary>
public sealed record ModesDampingOutput
{
    [Description("Whether the modal damping matrix ΦᵀCΦ is diagonal (classical damping); true for an undamped model.")]
    public required bool Classical { get; init; }

    [Description("Largest normalised off-diagonal of ΦᵀCΦ (below 1e-8 the damping is taken as classical; 0 for an undamped model).")]
    public required double NonClassicalIndex { get; init; }

    [Description("The model's hysteretic loss factor η (0 when it has none).")]
    public required double LossFactor { get; init; }

    [Description("Where the modes' damping ratios come from."),
     SchemaEnum(DampingBasis.Exact, DampingBasis.Estimate)]
    public required string DampingRatioBasis { get; init; }
}

/// <summary>The words of <see cref="ModesDampingOutput.DampingRatioBasis"/>.</summary>
internal static class DampingBasis
{
    public const string Exact = "exact modal damping ratio";
    public const string Estimate = "diagonal of the modal damping matrix (estimate); see complex_modes for the damped system's own values";
}

/// <summary>One root of the damped system in <see cref="ModesOutput"/>.</summary>
public sealed record ComplexModeOutput
{
    [Description(Describe.Mode)]
    public required int Number { get; init; }

    [Description("|λ|/2π, in Hz.")]
    public required double UndampedFrequencyHz { get; init; }

    [Description("|Im λ|/2π, in Hz: the frequency of the decaying free oscillation (0 when not oscillatory).")]
    public required double DampedFrequencyHz { get; init; }

    [Description("ζ = −Re λ/|λ| (fraction); null for a real (overdamped) root.")]
    public required double DampingRatio { get; init; }

    [Description("False for a real root (overdamped motion, no oscillation).")]
    public required bool Oscillatory { get; init; }

    [Description("elastic, rigid-body (a zero root), rigid-body-relaxation or relaxation (a first-order root, time constant −1/λ)."),
     SchemaEnum("elastic", "rigid-body", "rigid-body-relaxation", "relaxation")]
    public required string Kind { get; init; }

    [Description("Re λ, in 1/s (the free motion is e^{λt}).")]
    public required double EigenvalueReal { get; init; }

    [Description("Im λ, in 1/s.")]
    public required double EigenvalueImag { get; init; }
}

/// <summary>The eigen solution's quality figures in <see cref="ModesOutput"/>.</summary>
public sealed record ModesQualityOutput
{
    [Description("The largest eigen residual over the modes written (see each mode's residual).")]
    public required double MaxResidual { get; init; }

    [Description("The largest |ΦᵀMΦ − I| entry over the modes written.")]
    public required double MaxOrthogonalityError { get; init; }

    [Description("Name of the eigen algorithm used (as algorithm).")]
    public required string Solver { get; init; }
}
