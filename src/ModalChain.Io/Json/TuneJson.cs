using ModalChain.Core;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Io.Json.Records;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Maps an absorber design to its output record, <see cref="TuneOutput"/>, the JSON object of <c>modalchain tune --format json</c> (SI units).</summary>
/// <remarks>
/// Field names are a public contract. <c>absorber.damping_ratio</c> is ζ_a = c_a/(2√(k_a m_a)), referred to the absorber's
/// own frequency; <c>absorber.damping_ratio_primary_referenced</c> is c_a/(2 m_a ω_p). Peaks are dynamic amplifications
/// |x_host|·K/|F| with K = M ω_p² of the controlled mode; null when no response was computed.
/// </remarks>
public static class TuneJson
{
    /// <summary>Writes the JSON object of a sized and assessed absorber to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, TunedAbsorber tuned, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(tuned);
        Write(stream, document, tuned.Design, tuned.Method, tuned.Assessment, tuned.Improvement, toolVersion, tuned);
    }

    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, AbsorberDesign design, string method,
        AbsorberAssessment? assessment, string? improvement, string toolVersion) =>
        Write(stream, document, design, method, assessment, improvement, toolVersion, null);

    private static void Write(Stream stream, ModelDocument document, AbsorberDesign design, string method,
        AbsorberAssessment? assessment, string? improvement, string toolVersion, TunedAbsorber? tuned) =>
        OutputJson.Write(stream, Output(document, design, method, assessment, improvement, toolVersion, tuned));

    /// <summary>The output record of a sized and assessed absorber.</summary>
    public static TuneOutput Output(ModelDocument document, TunedAbsorber tuned, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(tuned);
        return Output(document, tuned.Design, tuned.Method, tuned.Assessment, tuned.Improvement, toolVersion, tuned);
    }

    private static TuneOutput Output(ModelDocument document, AbsorberDesign design, string method,
        AbsorberAssessment? assessment, string? improvement, string toolVersion, TunedAbsorber? tuned)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(design);
        var a = assessment;
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Mode = design.ModeNumber,
            ModeFrequencyHz = design.ModeFrequencyHz,
            ModeChosenBy = design.ChosenBy,
            Host = design.Host,
            ModalMassKg = design.ModalMass,
            MassRatio = design.Optimum.MassRatio,
            Target = Target(design.Target),
            Method = method,
            MethodDescription = tuned?.MethodDescription,
            SpeedTolerance = design.Target == AbsorberTarget.RunningSpeed ? design.SpeedTolerance : null,
            ExcitationsHz = [.. design.ExcitationsHz],
            Absorber = new()
            {
                MassKg = design.Mass,
                StiffnessNPerM = design.Stiffness,
                DampingNSPerM = design.Damping,
                FrequencyHz = design.FrequencyHz,
                FrequencyRatio = design.FrequencyHz / design.ModeFrequencyHz,
                DampingRatio = design.DampingRatio,
                DampingRatioPrimaryReferenced = design.DampingRatioPrimaryReferenced,
                DampingRatioConvention = "c/(2*sqrt(k*m)) of the absorber, referred to its own frequency",
            },
            FixedPointPeak = design.Optimum.PeakAmplification,
            BandHz = a is null ? null : [a.BandHz.Low, a.BandHz.High],
            // Without an assessment the peaks and strokes are written as null with no note.
            PeakBefore = a?.PeakBefore ?? double.NaN,
            PeakBeforeNote = a is null ? null : Unbounded(a.PeakBefore),
            PeakAfter = a?.PeakAfter ?? double.NaN,
            PeakAfterNote = a is null ? null : Unbounded(a.PeakAfter),
            PeakFrequencyHz = a?.PeakFrequencyHz,
            PeakAfterMode = a?.PeakAfterMode,
            PeakBeforeRisingAt = a is null ? null : Edge(a.PeakBeforeRisingAt),
            PeakAfterRisingAt = a is null ? null : Edge(a.PeakAfterRisingAt),
            AtSpeeds = a is null ? null : [.. a.AtSpeeds.Select(s => new TuneSpeedOutput
            {
                FrequencyHz = s.FrequencyHz,
                Before = s.Before,
                BeforeNote = Unbounded(s.Before),
                After = s.After,
                AfterNote = Unbounded(s.After),
            })],
            NeighbouringModes = a is null ? null : [.. a.Neighbours.Select(n => new TuneNeighbourOutput
            {
                Mode = n.ModeNumber,
                FrequencyHz = n.FrequencyHz,
                PeakBefore = n.PeakBefore,
                PeakBeforeNote = NeighbourNote(n.PeakBefore),
                PeakAfter = n.PeakAfter,
                PeakAfterNote = NeighbourNote(n.PeakAfter),
            })],
            StrokeM = a?.OperatingStroke ?? double.NaN,
            StrokeBasis = a is null ? null : $"peak relative displacement of the absorber to the host {a.OperatingStrokeBasis}; null when no load has a speed",
            StrokePerForceMPerN = a?.StrokePerForce ?? double.NaN,
            StrokePerForceBasis = a is null ? null : "per newton of harmonic force at the host, at the frequency of the worst peak",
            Mistuning = a is null ? [] : [.. a.Mistuning.Select(p => new TuneMistuningOutput
            {
                FrequencyError = p.FrequencyError,
                Peak = p.Peak,
                PeakNote = Unbounded(p.Peak),
                AtSpeeds = p.AtSpeeds,
            })],
            Improvement = improvement,
            Warnings = tuned is null ? null : [.. tuned.Warnings],
            AbsorberCaution = AbsorberCaution.Text,
            Caution = Cautions.Text,
        };
    }

    internal static string Target(AbsorberTarget t) => t switch
    {
        AbsorberTarget.Force => "force",
        AbsorberTarget.BaseAcceleration => "base",
        AbsorberTarget.RunningSpeed => "speed",
        _ => "random-force",
    };

    // "none" for a peak inside the band; "start" or "end" when the largest response is on that end of the band.
    internal static string Edge(ModalChain.Core.Analyses.Harmonic.SweepEdge edge) => edge switch
    {
        ModalChain.Core.Analyses.Harmonic.SweepEdge.Start => "start",
        ModalChain.Core.Analyses.Harmonic.SweepEdge.End => "end",
        _ => "none",
    };

    // Beside a neighbouring mode's null peak: no peak of that mode inside the band, or an unbounded one.
    private static string? NeighbourNote(double peak) =>
        double.IsNaN(peak) ? "no peak of this mode inside the band" : Unbounded(peak);

    // Beside a null peak, why it has no finite value (JSON has no infinity); the table prints the same words.
    private static string? Unbounded(double peak) =>
        double.IsFinite(peak) ? null : "unbounded: no damping acts on that resonance";
}
