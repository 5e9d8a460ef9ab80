namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>The excitation an absorber is tuned against, each with its classical optimum.</summary>
public enum AbsorberTarget
{
    /// <summary>A harmonic force on the primary mass (Den Hartog's case), minimising the primary's displacement.</summary>
    Force,
    /// <summary>Harmonic acceleration of the primary's base, minimising the primary's motion relative to the base (Warburton 1982).</summary>
    BaseAcceleration,
    /// <summary>A white-noise force on the primary, minimising the variance of its displacement (Warburton 1982).</summary>
    RandomForce,
    /// <summary>A harmonic force at the running speeds of a constant-speed machine, minimising the primary's worst displacement over the speeds ± a tolerance (Den Hartog 1956 §3.2, the undamped absorber).</summary>
    RunningSpeed,
}

/// <summary>Closed-form optimum parameters of a viscously damped absorber on an undamped single-mode primary.</summary>
/// <param name="MassRatio">μ = m_a / M, absorber mass over the primary's (modal) mass.</param>
/// <param name="FrequencyRatio">f = ω_a / ω_p, absorber frequency √(k_a/m_a) over the primary's natural frequency.</param>
/// <param name="DampingRatio">ζ_a = c_a / (2√(k_a m_a)), the absorber's damping ratio referred to its own frequency.</param>
/// <param name="DampingRatioPrimaryReferenced">c_a / (2 m_a ω_p), the same damping referred to the primary's frequency (= f·ζ_a).</param>
/// <param name="PeakAmplification">For <see cref="AbsorberTarget.Force"/>, the fixed-point peak |X₁|k/F = √(1 + 2/μ); NaN for the other targets.</param>
public sealed record AbsorberOptimum(
    double MassRatio, double FrequencyRatio, double DampingRatio, double DampingRatioPrimaryReferenced, double PeakAmplification);

/// <summary>The classical optimum tunings (Den Hartog 1956; Warburton 1982).</summary>
/// <remarks>
/// Den Hartog, Mechanical Vibrations, 4th ed. (1956), §3.3, fixed-point method for a harmonic force:
/// f = 1/(1+μ), c_a/(2 m_a ω_p) = √(3μ/(8(1+μ)³)), hence ζ_a = √(3μ/(8(1+μ))), and peak √(1 + 2/μ).
/// Warburton, Earthquake Engineering and Structural Dynamics 10 (1982) 381–401, with ζ referred to the absorber:
/// harmonic base acceleration f = √(1−μ/2)/(1+μ), ζ_a = √(3μ/(8(1+μ)(1−μ/2)));
/// white-noise force f = √(1+μ/2)/(1+μ), ζ_a = √(μ(1+3μ/4)/(4(1+μ)(1+μ/2))).
/// </remarks>
public static class ClassicalOptimum
{
    /// <summary>The optimum for <paramref name="target"/> at mass ratio <paramref name="massRatio"/> (a fraction, positive).</summary>
    public static AbsorberOptimum For(AbsorberTarget target, double massRatio) => target switch
    {
        AbsorberTarget.Force => DenHartog(massRatio),
        AbsorberTarget.BaseAcceleration => WarburtonBaseAcceleration(massRatio),
        AbsorberTarget.RandomForce => WarburtonRandomForce(massRatio),
        AbsorberTarget.RunningSpeed => throw new ArgumentException("The running-speed tuning depends on the speed: use UndampedAt.", nameof(target)),
        _ => throw new ArgumentOutOfRangeException(nameof(target), target, null),
    };

    /// <summary>Den Hartog's optimum for a harmonic force on the primary.</summary>
    public static AbsorberOptimum DenHartog(double massRatio)
    {
        var mu = CheckedRatio(massRatio);
        var f = 1 / (1 + mu);
        var zeta = Math.Sqrt(3 * mu / (8 * (1 + mu)));
        return new AbsorberOptimum(mu, f, zeta, f * zeta, Math.Sqrt(1 + 2 / mu));
    }

    /// <summary>Warburton's optimum for harmonic base acceleration (primary motion relative to the base).</summary>
    public static AbsorberOptimum WarburtonBaseAcceleration(double massRatio)
    {
        var mu = CheckedRatio(massRatio);
        if (mu >= 2) throw new ArgumentOutOfRangeException(nameof(massRatio), massRatio, "Warburton's base-acceleration optimum needs μ < 2.");
        var f = Math.Sqrt(1 - mu / 2) / (1 + mu);
        var zeta = Math.Sqrt(3 * mu / (8 * (1 + mu) * (1 - mu / 2)));
        return new AbsorberOptimum(mu, f, zeta, f * zeta, double.NaN);
    }

    /// <summary>The classical undamped absorber for one forcing frequency: tuned to it, it cancels the primary's motion there.</summary>
    /// <remarks>Den Hartog (1956) §3.2: with k_a/m_a = ω², X₁ = 0 at ω whatever the primary. No peak value applies (NaN).</remarks>
    /// <param name="massRatio">μ, positive.</param>
    /// <param name="frequencyRatio">The forcing frequency over the primary's natural frequency, positive.</param>
    public static AbsorberOptimum UndampedAt(double massRatio, double frequencyRatio)
    {
        var mu = CheckedRatio(massRatio);
        Guard.Positive(frequencyRatio, nameof(frequencyRatio));
        return new AbsorberOptimum(mu, frequencyRatio, 0, 0, double.NaN);
    }

    /// <summary>Warburton's optimum for a white-noise force on the primary (displacement variance).</summary>
    public static AbsorberOptimum WarburtonRandomForce(double massRatio)
    {
        var mu = CheckedRatio(massRatio);
        var f = Math.Sqrt(1 + mu / 2) / (1 + mu);
        var zeta = Math.Sqrt(mu * (1 + 3 * mu / 4) / (4 * (1 + mu) * (1 + mu / 2)));
        return new AbsorberOptimum(mu, f, zeta, f * zeta, double.NaN);
    }

    private static double CheckedRatio(double mu)
    {
        Guard.Positive(mu, nameof(mu));
        return mu;
    }
}
