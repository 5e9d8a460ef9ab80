using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>Which amplitude of a steady-state vibration a limit bounds.</summary>
public enum AmplitudeMeasure
{
    /// <summary>The largest instantaneous value (zero-to-peak).</summary>
    Peak,
    /// <summary>The root-mean-square value over a period.</summary>
    Rms,
}

/// <summary>A limit on the steady-state vibration of one mass at the operating points.</summary>
/// <param name="At">Name of the mass whose motion is limited.</param>
/// <param name="Quantity">Displacement, velocity or acceleration.</param>
/// <param name="Measure">Peak or r.m.s.</param>
/// <param name="Value">The limit in SI (m, m/s or m/s²), positive.</param>
public sealed record VibrationLimit(string At, ResponseQuantity Quantity, AmplitudeMeasure Measure, double Value)
{
    /// <summary>Short text such as "velocity peak at skid".</summary>
    public string Describe() => $"{Quantity.ToString().ToLowerInvariant()} {(Measure == AmplitudeMeasure.Peak ? "peak" : "rms")} at {At}";
}

/// <summary>One steady harmonic part of a response: a frequency and the complex displacement amplitude at it.</summary>
/// <param name="FrequencyHz">Frequency in Hz.</param>
/// <param name="Displacement">Complex displacement amplitude in m (x(t) = Re(X e^{iωt})).</param>
public readonly record struct HarmonicComponent(double FrequencyHz, Complex Displacement);

/// <summary>The outcome of one vibration limit.</summary>
/// <param name="Limit">The limit checked.</param>
/// <param name="Value">The response amplitude in the limit's measure, SI.</param>
/// <param name="Reserve">(limit − value)/limit as a fraction: how far below the limit (negative when above).</param>
public sealed record LimitResult(VibrationLimit Limit, double Value, double Reserve)
{
    /// <summary>True when the value does not exceed the limit.</summary>
    public bool Passes => Value <= Limit.Value;

    /// <summary>
    /// The translation whose response <see cref="Value"/> is, when the limit's point is measured in several directions and
    /// the largest governs (<c>skid.bearing.y</c> for a limit at <c>skid.bearing</c>); null when the limit names one motion.
    /// </summary>
    public string? MeasuredAt { get; init; }

    /// <summary>Why the value or reserve has no finite value, or null when both have one.</summary>
    public string? ReserveNote => ReserveNotes.OfLimit(Value, Reserve);
}

/// <summary>Amplitudes of a sum of harmonic components and their check against a <see cref="VibrationLimit"/>.</summary>
/// <remarks>
/// For components X_k at distinct frequencies ω_k the quantity q(t) = Σ Re(Q_k e^{iω_k t}) with Q_k = (iω_k)^p X_k
/// (p = 0, 1, 2 for displacement, velocity, acceleration). Its r.m.s. value is √(Σ |Q_k|²/2) exactly; its peak is
/// bounded by Σ |Q_k|, which is exact for one component and approached when the phases line up (the conservative
/// choice for a limit). Components at the same frequency must be added as complex amplitudes before they come here.
/// </remarks>
public static class VibrationLimitCheck
{
    /// <summary>The amplitude of <paramref name="quantity"/> in <paramref name="measure"/> (SI).</summary>
    public static double Amplitude(IReadOnlyList<HarmonicComponent> components, ResponseQuantity quantity, AmplitudeMeasure measure)
    {
        ArgumentNullException.ThrowIfNull(components);
        double sum = 0, squares = 0;
        foreach (var c in components)
        {
            var omega = 2 * Math.PI * c.FrequencyHz;
            var q = c.Displacement.Magnitude * quantity switch
            {
                ResponseQuantity.Displacement => 1,
                ResponseQuantity.Velocity => omega,
                _ => omega * omega,
            };
            sum += q;
            squares += q * q;
        }
        return measure == AmplitudeMeasure.Peak ? sum : Math.Sqrt(squares / 2);
    }

    /// <summary>Checks <paramref name="limit"/> against the response <paramref name="components"/> of its mass.</summary>
    public static LimitResult Evaluate(VibrationLimit limit, IReadOnlyList<HarmonicComponent> components)
    {
        ArgumentNullException.ThrowIfNull(limit);
        var value = Amplitude(components, limit.Quantity, limit.Measure);
        return new LimitResult(limit, value, (limit.Value - value) / limit.Value);
    }
}

/// <summary>The criteria a model file states: an optional separation rule and any number of vibration limits.</summary>
/// <param name="Separation">The separation rule, or null.</param>
/// <param name="Limits">The vibration limits, in file order.</param>
public sealed record CriteriaSet(SeparationCriterion? Separation, ImmutableArray<VibrationLimit> Limits)
{
    /// <summary>No criteria at all.</summary>
    public static readonly CriteriaSet None = new(null, []);

    /// <summary>Machine vibration zone criteria (r.m.s. velocity against published zone boundaries), in file order.</summary>
    public ImmutableArray<MachineZoneCriterion> Zones { get; init; } = [];

    /// <summary>Sensitive-equipment floor criteria (one-third-octave r.m.s. velocity against a criterion curve), in file order.</summary>
    public ImmutableArray<FloorCriterion> Floors { get; init; } = [];

    /// <summary>True when there is nothing to check.</summary>
    public bool IsEmpty => Separation is null && Limits.IsDefaultOrEmpty && Zones.IsDefaultOrEmpty && Floors.IsDefaultOrEmpty;
}
