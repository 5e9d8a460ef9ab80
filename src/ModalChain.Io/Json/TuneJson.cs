using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes an absorber design as the JSON object of <c>modalchain tune --format json</c> (SI units).</summary>
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
        AbsorberAssessment? assessment, string? improvement, string toolVersion, TunedAbsorber? tuned)
    {
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        w.WriteNumber("mode", design.ModeNumber);
        w.Number("mode_frequency_hz", design.ModeFrequencyHz);
        w.WriteString("mode_chosen_by", design.ChosenBy);
        w.WriteString("host", design.Host);
        w.Number("modal_mass_kg", design.ModalMass);
        w.Number("mass_ratio", design.Optimum.MassRatio);
        w.WriteString("target", Target(design.Target));
        w.WriteString("method", method);
        if (tuned is not null) w.WriteString("method_description", tuned.MethodDescription);
        if (design.Target == AbsorberTarget.RunningSpeed) w.Number("speed_tolerance", design.SpeedTolerance);
        w.Array("excitations_hz", [.. design.ExcitationsHz]);
        w.WriteStartObject("absorber");
        w.Number("mass_kg", design.Mass);
        w.Number("stiffness_n_per_m", design.Stiffness);
        w.Number("damping_n_s_per_m", design.Damping);
        w.Number("frequency_hz", design.FrequencyHz);
        w.Number("frequency_ratio", design.FrequencyHz / design.ModeFrequencyHz);
        w.Number("damping_ratio", design.DampingRatio);
        w.Number("damping_ratio_primary_referenced", design.DampingRatioPrimaryReferenced);
        w.WriteString("damping_ratio_convention", "c/(2*sqrt(k*m)) of the absorber, referred to its own frequency");
        w.WriteEndObject();
        w.Number("fixed_point_peak", design.Optimum.PeakAmplification);
        if (assessment is { } a)
        {
            w.Array("band_hz", [a.BandHz.Low, a.BandHz.High]);
            w.Number("peak_before", a.PeakBefore);
            w.Note("peak_before_note", Unbounded(a.PeakBefore));
            w.Number("peak_after", a.PeakAfter);
            w.Note("peak_after_note", Unbounded(a.PeakAfter));
            w.Number("peak_frequency_hz", a.PeakFrequencyHz);
            w.WriteNumber("peak_after_mode", a.PeakAfterMode);
            w.WriteString("peak_before_rising_at", Edge(a.PeakBeforeRisingAt));
            w.WriteString("peak_after_rising_at", Edge(a.PeakAfterRisingAt));
            w.WriteStartArray("at_speeds");
            foreach (var s in a.AtSpeeds)
            {
                w.WriteStartObject();
                w.Number("frequency_hz", s.FrequencyHz);
                w.Number("before", s.Before);
                w.Note("before_note", Unbounded(s.Before));
                w.Number("after", s.After);
                w.Note("after_note", Unbounded(s.After));
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("neighbouring_modes");
            foreach (var n in a.Neighbours)
            {
                w.WriteStartObject();
                w.WriteNumber("mode", n.ModeNumber);
                w.Number("frequency_hz", n.FrequencyHz);
                w.Number("peak_before", n.PeakBefore);
                w.Note("peak_before_note", NeighbourNote(n.PeakBefore));
                w.Number("peak_after", n.PeakAfter);
                w.Note("peak_after_note", NeighbourNote(n.PeakAfter));
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.Number("stroke_m", a.OperatingStroke);
            w.WriteString("stroke_basis", $"peak relative displacement of the absorber to the host {a.OperatingStrokeBasis}; null when no load has a speed");
            w.Number("stroke_per_force_m_per_n", a.StrokePerForce);
            w.WriteString("stroke_per_force_basis", "per newton of harmonic force at the host, at the frequency of the worst peak");
            w.WriteStartArray("mistuning");
            foreach (var p in a.Mistuning)
            {
                w.WriteStartObject();
                w.Number("frequency_error", p.FrequencyError);
                w.Number("peak", p.Peak);
                w.Note("peak_note", Unbounded(p.Peak));
                w.Number("at_speeds", p.AtSpeeds);
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }
        else
        {
            w.WriteNull("peak_before");
            w.WriteNull("peak_after");
            w.WriteNull("stroke_m");
            w.WriteNull("stroke_per_force_m_per_n");
            w.WriteStartArray("mistuning");
            w.WriteEndArray();
        }
        if (improvement is not null) w.WriteString("improvement", improvement);
        if (tuned is not null)
        {
            w.WriteStartArray("warnings");
            foreach (var warning in tuned.Warnings) w.WriteStringValue(warning);
            w.WriteEndArray();
        }
        w.WriteString("absorber_caution", AbsorberCaution.Text);
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
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
