using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>The physical quantity a response history holds.</summary>
public enum ResponseQuantity
{
    /// <summary>Displacement of a mass in m.</summary>
    Displacement,

    /// <summary>Velocity of a mass in m/s.</summary>
    Velocity,

    /// <summary>Acceleration of a mass in m/s².</summary>
    Acceleration,

    /// <summary>Spring force k (u_A − u_B) in N, A and B as the spring's ends are listed (the convention of the harmonic results).</summary>
    SpringForce,

    /// <summary>Damper force c (u̇_A − u̇_B) in N, same sign convention as the springs.</summary>
    DamperForce,

    /// <summary>
    /// Force a support receives from the network in N, positive along the direction of motion; with electrical nodes, the
    /// mechanical force only (the electrical elements' share, a current, is left out), and never at an electrical support.
    /// </summary>
    Reaction,

    /// <summary>A transducer's port voltage u = Bl·(v_a − v_b) in V (<see cref="Assembly.TransducerPortTerms"/>).</summary>
    PortVoltage,

    /// <summary>A transducer's port current i in A: the current it drives out of its branch terminal n1 into the circuit.</summary>
    PortCurrent,

    /// <summary>The current in A a voltage source (an electrical support) delivers into the circuit: minus its support's reaction.</summary>
    SourceCurrent,
}

/// <summary>The largest magnitude of a history and when it occurred.</summary>
/// <param name="Value">The value with its sign at the instant of largest magnitude.</param>
/// <param name="Time">The instant in s.</param>
public sealed record Peak(double Value, double Time);

/// <summary>One recorded quantity over time.</summary>
/// <param name="Name">Mass, spring, damper or support name.</param>
/// <param name="Quantity">What is recorded.</param>
/// <param name="Unit">SI unit text (m, m/s, m/s^2, N).</param>
/// <param name="Values">Values at <see cref="TransientResult.Times"/>.</param>
/// <param name="Peak">Peak over every step of the run (not only the recorded ones).</param>
/// <param name="Rms">Root mean square over the steps inside the RMS window; NaN (not available) when no step lies in the window.</param>
public sealed record ResponseHistory(string Name, ResponseQuantity Quantity, string Unit, ImmutableArray<double> Values, Peak Peak, double Rms)
{
    /// <summary>
    /// Plane and 3d models: the direction of a spring or damper force (a mount force), <c>x</c> … <c>rz</c> for a
    /// component (a moment in N·m for a rotation) or <c>axial</c> and its x, y, z resolution for an axial element; null
    /// for line models and for the other quantities.
    /// </summary>
    public string? Direction { get; init; }
}

/// <summary>The energy balance of a run, a quality figure: E₀ + W = T + V + D up to the integration error.</summary>
/// <remarks>
/// T = ½u̇ᵀMu̇, V = ½uᵀKu at each step; W = Σ ½(f + f₊)·(u₊ − u) and D = Σ (h/4)(u̇ + u̇₊)ᵀC(u̇ + u̇₊) accumulate
/// by the trapezoidal rule every step; the balance is closed every tenth step and at the end. For average acceleration the balance is an exact identity of the scheme; for the other
/// methods it holds to the order of the rule. With a moving support, u is absolute and W is the work of the
/// forces the support's motion puts into the free DOFs. For modal superposition the figures are those of the
/// retained modes.
/// </remarks>
/// <param name="InitialEnergy">E₀ = T + V at t = 0, in J.</param>
/// <param name="InputWork">W at the end, in J.</param>
/// <param name="FinalKineticEnergy">T at the end, in J.</param>
/// <param name="FinalStrainEnergy">V at the end, in J.</param>
/// <param name="Dissipated">D at the end, in J.</param>
/// <param name="MaxRelativeError">max over steps of |E₀ + W − T − V − D| divided by the largest energy figure seen.</param>
public sealed record EnergyBalance(
    double InitialEnergy, double InputWork, double FinalKineticEnergy, double FinalStrainEnergy, double Dissipated, double MaxRelativeError);

/// <summary>The outcome of a transient run.</summary>
/// <param name="Network">The network analysed.</param>
/// <param name="Settings">The run specification.</param>
/// <param name="MethodDescription">The integrator used, with its parameters.</param>
/// <param name="StepCount">Number of steps integrated.</param>
/// <param name="Times">Recorded instants in s.</param>
/// <param name="Responses">The recorded histories: per output mass displacement, velocity, acceleration; spring and damper forces; support reactions.</param>
/// <param name="Energy">The energy balance.</param>
/// <param name="Warnings">Things the engineer should know about this run (coarse step, short duration, truncated modes...).</param>
public sealed record TransientResult(
    Network Network,
    TransientSettings Settings,
    string MethodDescription,
    int StepCount,
    ImmutableArray<double> Times,
    ImmutableArray<ResponseHistory> Responses,
    EnergyBalance Energy,
    ImmutableArray<string> Warnings)
{
    /// <summary>The history of <paramref name="quantity"/> at <paramref name="name"/>.</summary>
    public ResponseHistory Get(string name, ResponseQuantity quantity) =>
        Responses.FirstOrDefault(r => r.Name == name && r.Quantity == quantity)
        ?? throw new ArgumentException($"No {quantity} history for '{name}' was recorded.", nameof(name));
}
