using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>A named harmonic excitation of a network; its complex amplitude at each frequency is fixed by its kind.</summary>
/// <remarks>
/// Loads are steady-state harmonic: the physical quantity is Re(A·e^{iωt}) with A the complex amplitude
/// |A|·e^{iφ}. Several loads acting together add as complex amplitudes (superposition of a linear system).
/// </remarks>
/// <param name="Name">Unique name of the load within its model.</param>
public abstract record Load(string Name)
{
    /// <summary>Operating speed of the machine that produces the load, in Hz; null when the load has none.</summary>
    public abstract double? SpeedHz { get; init; }
}

/// <summary>A harmonic force of constant amplitude at a mass.</summary>
/// <param name="Name">Unique name of the load.</param>
/// <param name="At">Name of the mass the force acts on.</param>
/// <param name="Amplitude">Force amplitude in N; non-negative.</param>
/// <param name="Phase">Phase angle φ in rad: the force is F·cos(ωt + φ).</param>
/// <param name="SpeedHz">Optional operating frequency in Hz at which the force is reported as an operating point.</param>
public sealed record ForceLoad(string Name, string At, double Amplitude, double Phase, double? SpeedHz = null) : Load(Name)
{
    /// <inheritdoc />
    public override double? SpeedHz { get; init; } = SpeedHz;

    /// <summary>
    /// The direction the force acts in: <see cref="Dofs.Direction.Along"/> in line models; a global translation in plane and
    /// 3d models, or a rotation for a moment (amplitude in N·m) on a rigid body. <see cref="At"/> may be <c>body.point</c>.
    /// </summary>
    public Dofs.Direction Direction { get; init; } = Dofs.Direction.Along;
}

/// <summary>A rotating unbalance at a mass: the force amplitude m·e·ω² grows with the square of the speed.</summary>
/// <param name="Name">Unique name of the load.</param>
/// <param name="At">Name of the mass that carries the rotor.</param>
/// <param name="MassRadius">Unbalance m·e in kg·m; non-negative.</param>
/// <param name="SpeedHz">Optional running speed in Hz: the operating point.</param>
/// <param name="Phase">Phase angle in rad of the unbalance force.</param>
public sealed record UnbalanceLoad(string Name, string At, double MassRadius, double? SpeedHz = null, double Phase = 0) : Load(Name)
{
    /// <inheritdoc />
    public override double? SpeedHz { get; init; } = SpeedHz;

    /// <summary>
    /// In plane and 3d models, the two global translations spanning the plane the unbalance rotates in: the force is
    /// m·e·ω²·cos(ωt + φ) along the first and m·e·ω²·sin(ωt + φ) along the second. Empty in line models (the force acts
    /// along the line of motion).
    /// </summary>
    public ImmutableArray<Dofs.Direction> Plane { get; init; } = [];
}

/// <summary>Which derivative of the support's motion a <see cref="BaseMotionLoad"/> prescribes.</summary>
public enum BaseMotionKind
{
    /// <summary>Displacement amplitude, in m.</summary>
    Displacement,
    /// <summary>Velocity amplitude, in m/s.</summary>
    Velocity,
    /// <summary>Acceleration amplitude, in m/s².</summary>
    Acceleration,
}

/// <summary>Prescribed harmonic motion of a declared support (never ground), of constant amplitude over a sweep.</summary>
/// <remarks>
/// The support displacement at ω is U = A·e^{iφ} for a displacement, A·e^{iφ}/(iω) for a velocity and
/// −A·e^{iφ}/ω² for an acceleration amplitude A.
/// </remarks>
/// <param name="Name">Unique name of the load.</param>
/// <param name="Support">Name of the support that moves.</param>
/// <param name="Kind">Whether <paramref name="Amplitude"/> is a displacement, velocity or acceleration.</param>
/// <param name="Amplitude">Amplitude in m, m/s or m/s² according to <paramref name="Kind"/>; non-negative.</param>
/// <param name="Phase">Phase angle in rad.</param>
/// <param name="SpeedHz">Optional operating frequency in Hz (e.g. the machine that shakes the support).</param>
public sealed record BaseMotionLoad(string Name, string Support, BaseMotionKind Kind, double Amplitude, double Phase, double? SpeedHz = null) : Load(Name)
{
    /// <inheritdoc />
    public override double? SpeedHz { get; init; } = SpeedHz;

    /// <summary>The direction the support moves in: <see cref="Dofs.Direction.Along"/> in line models, a global translation otherwise.</summary>
    public Dofs.Direction Direction { get; init; } = Dofs.Direction.Along;
}
