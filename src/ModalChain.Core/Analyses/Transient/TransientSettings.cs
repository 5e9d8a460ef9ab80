using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>The time-integration method of a transient run.</summary>
public enum TransientMethod
{
    /// <summary>Newmark average acceleration (β = ¼, γ = ½).</summary>
    Newmark,

    /// <summary>Hilber-Hughes-Taylor α method: Newmark with controlled damping of the highest frequencies.</summary>
    Hht,

    /// <summary>Exact state-space discretisation for loads linear between steps.</summary>
    Exact,

    /// <summary>Superposition of the lowest modes, each solved exactly.</summary>
    Modal,
}

/// <summary>What is excited in a transient run.</summary>
/// <param name="Name">The load's name in the model, used in messages.</param>
public abstract record TransientExcitation(string Name);

/// <summary>A force at a mass: F(t) = <see cref="Scale"/> × <see cref="Time"/>.ValueAt(t) in N.</summary>
/// <param name="Name">Load name.</param>
/// <param name="Mass">Name of the loaded mass.</param>
/// <param name="Scale">1 for a force whose time function is in N; m·e in kg·m for an unbalance whose time function is a <see cref="UnbalanceSpeedRamp"/>.</param>
/// <param name="Time">How the force varies in time.</param>
public sealed record ForceHistory(string Name, string Mass, double Scale, TimeFunction Time) : TransientExcitation(Name)
{
    /// <summary>
    /// The direction: <see cref="Dofs.Direction.Along"/> in line models; in plane and 3d models a global translation, or a
    /// rotation for a moment in N·m on a rigid body. <see cref="Mass"/> may then name a body or <c>body.point</c>. A timed
    /// unbalance in a plane (d₁, d₂) is two histories: the ramp along d₁ and the same ramp with its phase 90° earlier
    /// (θ(0) − π/2, which gives ω² sin θ − α cos θ) along d₂.
    /// </summary>
    public Dofs.Direction Direction { get; init; } = Dofs.Direction.Along;
}

/// <summary>A prescribed acceleration history of a support (not <see cref="Network.Ground"/>), in m/s².</summary>
/// <remarks>The support starts at rest at zero displacement; its velocity and displacement are integrated from the acceleration.</remarks>
/// <param name="Name">Load name.</param>
/// <param name="Support">Name of the moving support.</param>
/// <param name="Acceleration">The support's acceleration in m/s².</param>
public sealed record SupportAccelerationHistory(string Name, string Support, TimeFunction Acceleration) : TransientExcitation(Name)
{
    /// <summary>The translation the support moves in: <see cref="Dofs.Direction.Along"/> in line models, x, y or z in plane and 3d models.</summary>
    public Dofs.Direction Direction { get; init; } = Dofs.Direction.Along;
}

/// <summary>A prescribed velocity history of a support (not <see cref="Network.Ground"/>): u̇_s(t) = <see cref="Scale"/> × <see cref="Velocity"/>.ValueAt(t) in m/s.</summary>
/// <remarks>
/// The support starts at zero displacement; its displacement is integrated from the velocity and its acceleration is the
/// velocity differentiated on the step grid (see <c>TransientAnalysis</c>). A voltage source of a circuit inside a line
/// model becomes one: the node it holds is a support whose velocity is the node voltage in V.
/// </remarks>
/// <param name="Name">Load name.</param>
/// <param name="Support">Name of the moving support.</param>
/// <param name="Velocity">The support's velocity in m/s (a node voltage in V for an electrical node).</param>
public sealed record SupportVelocityHistory(string Name, string Support, TimeFunction Velocity) : TransientExcitation(Name)
{
    /// <summary>Factor on <see cref="Velocity"/>: 1, or −1 for a voltage source whose + terminal is ground.</summary>
    public double Scale { get; init; } = 1.0;
}

/// <summary>Initial displacement and velocity of one mass; masses not listed start at rest at zero.</summary>
/// <param name="Mass">Mass name.</param>
/// <param name="Displacement">u(0) in m.</param>
/// <param name="Velocity">u̇(0) in m/s.</param>
public sealed record InitialCondition(string Mass, double Displacement, double Velocity);

/// <summary>The specification of one transient run.</summary>
/// <param name="Duration">Simulated time in s; positive.</param>
/// <param name="Step">Time step h in s; positive and not longer than the duration.</param>
/// <param name="Method">Integration method.</param>
public sealed record TransientSettings(double Duration, double Step, TransientMethod Method = TransientMethod.Newmark)
{
    /// <summary>
    /// The most time steps (duration / step) a run may ask for: 10⁷ steps of a small model take seconds and keep the
    /// histories within a few hundred MB; 5·10⁷ took over 30 s and a GB for one mass.
    /// </summary>
    public const double MaxSteps = 1e7;

    /// <summary>Hilber-Hughes-Taylor α in [−⅓, 0], used by <see cref="TransientMethod.Hht"/>; −0.05 by default.</summary>
    public double HhtAlpha { get; init; } = -0.05;

    /// <summary>Number of lowest modes kept by <see cref="TransientMethod.Modal"/>; null keeps all.</summary>
    public int? ModeCount { get; init; }

    /// <summary>Modal damping ratios for <see cref="TransientMethod.Modal"/> (the lowest elastic mode first, rigid-body modes take none; the last repeats); empty takes ζⱼ = φⱼᵀCφⱼ/(2ωⱼ) from C.</summary>
    public ImmutableArray<double> ModalDampingRatios { get; init; } = [];

    /// <summary>Masses whose motion is recorded; empty records every mass.</summary>
    public ImmutableArray<string> Outputs { get; init; } = [];

    /// <summary>Start of the RMS window in s; null for the start of the run.</summary>
    public double? RmsFrom { get; init; }

    /// <summary>End of the RMS window in s; null for the end of the run.</summary>
    public double? RmsTo { get; init; }

    /// <summary>Keep every k-th step in the recorded histories (peaks and RMS still use every step); 1 by default.</summary>
    public int RecordEvery { get; init; } = 1;

    /// <summary>Number of steps: ⌈duration / h⌉ (the last step may end slightly after the duration).</summary>
    public int StepCount => (int)Math.Ceiling(Duration / Step - 1e-9);

    internal void Check()
    {
        Guard.Positive(Duration, nameof(Duration));
        Guard.Positive(Step, nameof(Step));
        if (Step > Duration) throw new ArgumentOutOfRangeException(nameof(Step), Step, $"The step is longer than the duration ({Duration} s).");
        if (Duration / Step > int.MaxValue / 2.0) throw new ArgumentOutOfRangeException(nameof(Step), Step, "Too many steps.");
        if (HhtAlpha < -1.0 / 3.0 - 1e-15 || HhtAlpha > 0) throw new ArgumentOutOfRangeException(nameof(HhtAlpha), HhtAlpha, "α must lie in [−1/3, 0].");
        if (ModeCount is < 1) throw new ArgumentOutOfRangeException(nameof(ModeCount), ModeCount, "At least one mode is needed.");
        if (RecordEvery < 1) throw new ArgumentOutOfRangeException(nameof(RecordEvery), RecordEvery, "Must be at least 1.");
        foreach (var z in ModalDampingRatios) Guard.NonNegative(z, nameof(ModalDampingRatios));
        if (RmsFrom is { } a && RmsTo is { } b && !(b > a)) throw new ArgumentOutOfRangeException(nameof(RmsTo), b, "The RMS window must end after it starts.");
    }
}
