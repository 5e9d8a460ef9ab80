using System.ComponentModel;
using System.Text.Json.Serialization;

namespace ModalChain.Io.Json.Records;

/// <summary>The JSON of <c>modalchain tune --format json</c>: one property per field, in the order written.</summary>
/// <remarks>
/// <c>absorber.damping_ratio</c> is ζ_a = c_a/(2√(k_a m_a)), referred to the absorber's own frequency;
/// <c>absorber.damping_ratio_primary_referenced</c> is c_a/(2 m_a ω_p). Peaks are dynamic amplifications |x_host|·K/|F|
/// with K = M ω_p² of the controlled mode. Properties left null are not written, except those marked
/// <see cref="JsonIgnoreCondition.Never"/>, which are written as null.
/// </remarks>
[Description("A tuned vibration absorber designed for one host mass and mode, with its performance (SI units).")]
public sealed record TuneOutput : CommandOutput
{
    [Description("1-based number of the controlled mode.")]
    public required int Mode { get; init; }

    [Description("Natural frequency of the controlled mode, in Hz.")]
    public required double ModeFrequencyHz { get; init; }

    [Description("How the controlled mode was chosen, in words.")]
    public required string ModeChosenBy { get; init; }

    [Description("The mass the absorber is attached to.")]
    public required string Host { get; init; }

    [Description("Modal mass of the controlled mode at the host, in kg.")]
    public required double ModalMassKg { get; init; }

    [Description("Absorber mass over the modal mass at the host (fraction).")]
    public required double MassRatio { get; init; }

    [Description("What the design minimises: a harmonic force at the host, base acceleration, the response at the running speeds, or a random force."),
     SchemaEnum("force", "base", "speed", "random-force")]
    public required string Target { get; init; }

    [Description("The tuning rule asked for.")]
    public required string Method { get; init; }

    [Description("The method actually used, in words.")]
    public string? MethodDescription { get; init; }

    [Description("--target speed: the mistuning tolerance the design allows for (fraction).")]
    public double? SpeedTolerance { get; init; }

    [Description("The excitation frequencies the design considers, in Hz.")]
    public required IReadOnlyList<double> ExcitationsHz { get; init; }

    [Description("The absorber's mass, spring and damper.")]
    public required TuneAbsorberOutput Absorber { get; init; }

    [Description("Dynamic amplification at the fixed points of the single-mode model with the optimum absorber.")]
    public required double FixedPointPeak { get; init; }

    [Description("The frequency band the response was assessed over, in Hz ([from, to]).")]
    public IReadOnlyList<double>? BandHz { get; init; }

    [Description("Largest dynamic amplification of the host in the band without the absorber; null when no response was computed or it is unbounded (see peak_before_note).")]
    public required double PeakBefore { get; init; }

    [Description(Describe.Note)]
    public string? PeakBeforeNote { get; init; }

    [Description("Largest dynamic amplification of the host in the band with the absorber; null when no response was computed or it is unbounded (see peak_after_note).")]
    public required double PeakAfter { get; init; }

    [Description(Describe.Note)]
    public string? PeakAfterNote { get; init; }

    [Description("Frequency of the worst peak with the absorber, in Hz.")]
    public double? PeakFrequencyHz { get; init; }

    [Description("1-based mode of the absorber-fitted model the worst peak belongs to.")]
    public int? PeakAfterMode { get; init; }

    [Description("'start' or 'end' when the largest response is on that end of the band, else 'none'."), SchemaEnum("none", "start", "end")]
    public string? PeakBeforeRisingAt { get; init; }

    [Description("'start' or 'end' when the largest response is on that end of the band, else 'none'."), SchemaEnum("none", "start", "end")]
    public string? PeakAfterRisingAt { get; init; }

    [Description("The host's response at each running speed, before and after.")]
    public IReadOnlyList<TuneSpeedOutput>? AtSpeeds { get; init; }

    [Description("Other modes with a peak inside the band.")]
    public IReadOnlyList<TuneNeighbourOutput>? NeighbouringModes { get; init; }

    [Description("Operating stroke of the absorber, in m; null when no response was computed or no load has a speed.")]
    public required double StrokeM { get; init; }

    [Description("What the stroke is, in words.")]
    public string? StrokeBasis { get; init; }

    [Description("Stroke per newton of harmonic force at the host, in m/N.")]
    public required double StrokePerForceMPerN { get; init; }

    [Description("What the stroke per force is, in words.")]
    public string? StrokePerForceBasis { get; init; }

    [Description("The worst peak with the absorber's frequency off by each error (empty when no response was computed).")]
    public required IReadOnlyList<TuneMistuningOutput> Mistuning { get; init; }

    [Description("What the optimisation improved, when one ran.")]
    public string? Improvement { get; init; }

    [Description("Warnings of the design (a neighbouring mode in the band, a peak on the band edge, ...).")]
    public IReadOnlyList<string>? Warnings { get; init; }

    [Description("The caution specific to absorbers.")]
    public required string AbsorberCaution { get; init; }
}

/// <summary>The absorber's elements in <see cref="TuneOutput"/>.</summary>
public sealed record TuneAbsorberOutput
{
    [Description("In kg.")]
    public required double MassKg { get; init; }

    [Description("In N/m.")]
    public required double StiffnessNPerM { get; init; }

    [Description("In N·s/m."), JsonPropertyName("damping_n_s_per_m")]
    public required double DampingNSPerM { get; init; }

    [Description("The absorber's own natural frequency, in Hz.")]
    public required double FrequencyHz { get; init; }

    [Description("The absorber's frequency over the controlled mode's.")]
    public required double FrequencyRatio { get; init; }

    [Description("Damping ratio c/(2√(k m)) of the absorber, referred to its own frequency (fraction).")]
    public required double DampingRatio { get; init; }

    [Description("c/(2 m ω) with ω the controlled mode's angular frequency (fraction).")]
    public required double DampingRatioPrimaryReferenced { get; init; }

    [Description("The damping-ratio convention, in words.")]
    public required string DampingRatioConvention { get; init; }
}

/// <summary>The host's response at one running speed in <see cref="TuneOutput"/>.</summary>
public sealed record TuneSpeedOutput
{
    [Description("In Hz.")]
    public required double FrequencyHz { get; init; }

    [Description("Dynamic amplification without the absorber.")]
    public required double Before { get; init; }

    [Description(Describe.Note)]
    public string? BeforeNote { get; init; }

    [Description("Dynamic amplification with the absorber.")]
    public required double After { get; init; }

    [Description(Describe.Note)]
    public string? AfterNote { get; init; }
}

/// <summary>A neighbouring mode in <see cref="TuneOutput"/>.</summary>
public sealed record TuneNeighbourOutput
{
    [Description(Describe.Mode)]
    public required int Mode { get; init; }

    [Description("In Hz.")]
    public required double FrequencyHz { get; init; }

    [Description("Its peak dynamic amplification in the band without the absorber; null when none (see peak_before_note).")]
    public required double PeakBefore { get; init; }

    [Description(Describe.Note)]
    public string? PeakBeforeNote { get; init; }

    [Description("Its peak dynamic amplification in the band with the absorber; null when none (see peak_after_note).")]
    public required double PeakAfter { get; init; }

    [Description(Describe.Note)]
    public string? PeakAfterNote { get; init; }
}

/// <summary>One mistuned absorber in <see cref="TuneOutput"/>.</summary>
public sealed record TuneMistuningOutput
{
    [Description("Relative error of the absorber's frequency (fraction).")]
    public required double FrequencyError { get; init; }

    [Description("The worst peak in the band with this mistuning.")]
    public required double Peak { get; init; }

    [Description(Describe.Note)]
    public string? PeakNote { get; init; }

    [Description("Response at the running speeds with this mistuning.")]
    public required double AtSpeeds { get; init; }
}
