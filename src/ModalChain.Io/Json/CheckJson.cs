using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes a <see cref="CheckOutcome"/> as one JSON object.</summary>
/// <remarks>
/// Reserves are fractions: separation reserve = relative change of the natural frequency that reaches the band edge;
/// limit reserve = (limit − value)/limit. A reserve with no finite value is null, with "reserve_note" saying why
/// (JSON has no infinity). Machine zones and floor curves compare r.m.s. velocity ("measure": "rms"); a floor
/// curve's reserve is its worst band's.
/// </remarks>
public static class CheckJson
{
    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, CheckOutcome outcome, string toolVersion)
    {
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        w.WriteBoolean("passes", outcome.AllPass);
        if (outcome.Separation is { } sep)
        {
            w.WriteStartObject("separation");
            w.WriteBoolean("passes", sep.Passes);
            w.Number("margin", sep.Criterion.Margin);
            w.Array("speeds_hz", sep.Criterion.SpeedsHz);
            w.Array("orders", sep.Criterion.Orders);
            w.Number("reserve", sep.Reserve);
            w.Note("reserve_note", sep.ReserveNote);
            w.WriteStartArray("pairs");
            foreach (var p in sep.Pairs)
            {
                w.WriteStartObject();
                w.WriteNumber("mode", p.ModeNumber);
                w.Number("frequency_hz", p.NaturalFrequencyHz);
                w.Number("speed_hz", p.SpeedHz);
                w.Number("order", p.Order);
                w.Number("excitation_hz", p.ExcitationHz);
                w.Number("separation", p.Separation);
                w.Number("reserve", p.Reserve);
                w.Note("reserve_note", p.ReserveNote);
                w.WriteBoolean("passes", p.Passes);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("exempt");
            foreach (var name in sep.Criterion.Exempt) w.WriteStringValue(MarkupText.Clean(name));
            w.WriteEndArray();
            w.WriteStartArray("exempt_modes");
            foreach (var x in sep.Exempted)
            {
                w.WriteStartObject();
                w.WriteNumber("mode", x.ModeNumber);
                w.Number("frequency_hz", x.NaturalFrequencyHz);
                w.Number("kinetic_energy_share", x.KineticEnergyShare);
                w.WriteString("reason", MarkupText.Clean(x.Reason));
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        else w.WriteNull("separation");
        if (outcome.Combination is { } rule) w.WriteString("load_case_combination", LoadCaseSelection.Name(rule));
        else w.WriteNull("load_case_combination");
        w.WriteStartArray("limits");
        foreach (var l in outcome.Limits)
        {
            w.WriteStartObject();
            w.WriteString("at", l.Limit.At);
            if (l.MeasuredAt is { } lm) w.WriteString("measured_at", lm);
            w.WriteString("quantity", l.Limit.Quantity.ToString().ToLowerInvariant());
            w.WriteString("measure", l.Limit.Measure == AmplitudeMeasure.Peak ? "peak" : "rms");
            w.WriteString("unit", Unit(l.Limit.Quantity));
            w.Number("limit", l.Limit.Value);
            w.Number("value", l.Value);
            w.Number("reserve", l.Reserve);
            w.Note("reserve_note", l.ReserveNote);
            w.WriteBoolean("passes", l.Passes);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("machine_zones");
        foreach (var z in outcome.Zones)
        {
            w.WriteStartObject();
            w.WriteString("at", z.At);
            if (z.MeasuredAt is { } zm) w.WriteString("measured_at", zm);
            w.WriteString("class", z.Criterion.Class.Name);
            w.WriteString("quantity", "velocity");
            w.WriteString("measure", "rms");
            w.WriteString("unit", "m/s");
            w.WriteString("accepted_zone", z.Criterion.AcceptedZone.ToString());
            w.Number("limit", z.Criterion.Limit);
            w.Number("value", z.RmsVelocity);
            w.WriteString("zone", z.Zone.ToString());
            w.WriteStartObject("boundaries");
            w.Number("a_b", z.Criterion.Class.BoundaryAB);
            w.Number("b_c", z.Criterion.Class.BoundaryBC);
            w.Number("c_d", z.Criterion.Class.BoundaryCD);
            w.WriteEndObject();
            w.WriteString("source", z.Criterion.Class.Source);
            w.Number("reserve", z.Reserve);
            w.Note("reserve_note", z.ReserveNote);
            w.WriteBoolean("passes", z.Passes);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("floor_curves");
        foreach (var f in outcome.Floors)
        {
            w.WriteStartObject();
            w.WriteString("at", f.At);
            if (f.MeasuredAt is { } fm) w.WriteString("measured_at", fm);
            w.WriteString("curve", f.Criterion.Curve.Name);
            w.WriteString("quantity", "velocity");
            w.WriteString("measure", "rms");
            w.WriteString("unit", "m/s");
            w.WriteString("source", f.Criterion.Curve.Source);
            w.WriteStartArray("bands");
            foreach (var b in f.Bands)
            {
                w.WriteStartObject();
                w.Number("centre_hz", b.CentreHz);
                w.Number("nominal_hz", b.NominalHz);
                w.Number("value", b.RmsVelocity);
                w.Number("limit", b.Limit);
                w.Number("reserve", b.Reserve);
                w.WriteBoolean("passes", b.Passes);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.Array("uncompared_hz", f.UncomparedHz);
            w.Number("reserve", f.Reserve);
            w.Note("reserve_note", f.ReserveNote);
            w.WriteBoolean("passes", f.Passes);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("not_evaluated");
        foreach (var (criterion, reason) in outcome.NotEvaluated)
        {
            w.WriteStartObject();
            w.WriteString("criterion", criterion);
            w.WriteString("reason", reason);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
    }

    internal static string Unit(ResponseQuantity q) => q switch
    {
        ResponseQuantity.Displacement => "m",
        ResponseQuantity.Velocity => "m/s",
        _ => "m/s^2",
    };
}
