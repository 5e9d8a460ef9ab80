using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>Rayleigh (mass- and stiffness-proportional) damping C = a0·M + a1·K.</summary>
/// <remarks>
/// The damping ratio of a mode of circular frequency ω is ζ(ω) = a0/(2ω) + a1·ω/2 (Chopra, Dynamics of Structures,
/// §11.4). <see cref="FromTargets"/> solves a0 and a1 so that ζ equals a target at two frequencies.
/// </remarks>
/// <param name="MassCoefficient">a0 in 1/s.</param>
/// <param name="StiffnessCoefficient">a1 in s.</param>
public sealed record RayleighDamping(double MassCoefficient, double StiffnessCoefficient)
{
    /// <summary>Coefficients giving damping ratio <paramref name="ratio"/> at both ω1 and ω2.</summary>
    /// <remarks>a0 = 2ζω1ω2/(ω1 + ω2), a1 = 2ζ/(ω1 + ω2).</remarks>
    /// <param name="ratio">Target damping ratio ζ (dimensionless, 0.02 for 2 %).</param>
    /// <param name="omega1">First target circular frequency in rad/s.</param>
    /// <param name="omega2">Second target circular frequency in rad/s, different from the first.</param>
    public static RayleighDamping FromTargets(double ratio, double omega1, double omega2)
    {
        Guard.NonNegative(ratio);
        Guard.Positive(omega1);
        Guard.Positive(omega2);
        if (omega1 == omega2) throw new ArgumentException("The two target frequencies must differ.", nameof(omega2));
        return new RayleighDamping(2 * ratio * omega1 * omega2 / (omega1 + omega2), 2 * ratio / (omega1 + omega2));
    }

    /// <summary>Damping ratio ζ(ω) = a0/(2ω) + a1·ω/2 at circular frequency <paramref name="omega"/> in rad/s.</summary>
    public double RatioAt(double omega) => omega > 0 ? MassCoefficient / (2 * omega) + StiffnessCoefficient * omega / 2 : double.PositiveInfinity;
}

/// <summary>The distributed damping of a model, added to its discrete viscous dampers.</summary>
/// <remarks>
/// Three parts, each optional: modal damping ratios applied in modal coordinates, Rayleigh damping, and a
/// hysteretic loss factor η that makes the stiffness complex, K(1 + iη) (frequency-domain analyses only; at
/// resonance it is equivalent to ζ = η/2). Modal ratios and Rayleigh damping are not used together.
/// </remarks>
/// <param name="ModalRatios">Damping ratio per elastic mode, lowest first (rigid-body modes take none); the last one applies to all higher modes. Empty for none.</param>
/// <param name="Rayleigh">Rayleigh coefficients, or null.</param>
/// <param name="LossFactor">Hysteretic loss factor η (dimensionless), 0 for none.</param>
public sealed record DampingModel(ImmutableArray<double> ModalRatios, RayleighDamping? Rayleigh, double LossFactor)
{
    /// <summary>No distributed damping: only the discrete dampers act.</summary>
    public static DampingModel None { get; } = new([], null, 0);

    /// <summary>The same modal damping ratio in every mode.</summary>
    public static DampingModel Modal(double ratio) => new([ratio], null, 0);

    /// <summary>True when the model adds nothing to the discrete dampers.</summary>
    public bool IsNone => ModalRatios.IsDefaultOrEmpty && Rayleigh is null && LossFactor == 0;

    /// <summary>The modal damping ratio given for 1-based elastic mode <paramref name="number"/> (the last entry repeats), 0 when none is given.</summary>
    public double ModalRatioOf(int number) =>
        ModalRatios.IsDefaultOrEmpty ? 0 : ModalRatios[Math.Min(number, ModalRatios.Length) - 1];
}
