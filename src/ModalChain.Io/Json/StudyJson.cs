using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes parameter studies and speed-frequency charts as JSON (SI units; speeds also in rpm).</summary>
public static class StudyJson
{
    /// <summary>Writes a parameter study as one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, StudyResult result, string unit, string toolVersion)
    {
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        w.WriteString("parameter", result.Request.Parameter.Text);
        w.WriteString("unit", unit);
        w.Array("values", result.Steps.Select(s => s.Value));
        w.WriteStartArray("modes");
        foreach (var m in result.Modes)
        {
            w.WriteStartObject();
            w.WriteNumber("identity", m.Identity);
            w.Array("frequency_hz", m.FrequenciesHz);
            w.WriteStartArray("mode_number");
            foreach (var n in m.ModeNumbers) w.WriteNumberValue(n);
            w.WriteEndArray();
            w.Array("mac_to_previous", m.Mac);
            if (!m.Motions.IsDefaultOrEmpty)
            {
                // Plane and 3d models: the mode's motion name at each value.
                w.WriteStartArray("motion");
                foreach (var name in m.Motions) w.WriteStringValue(name);
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("criteria");
        for (var c = 0; c < result.Request.Criteria.Length; c++)
        {
            w.WriteStartObject();
            w.WriteString("name", result.Request.Criteria[c].Name);
            w.Array("reserve", result.Steps.Select(s => s.Reserves[c]));
            if (result.Steps.Any(s => !double.IsFinite(s.Reserves[c])))
            {
                // Beside each null reserve, the reason (JSON has no infinity).
                w.WriteStartArray("reserve_note");
                foreach (var s in result.Steps)
                {
                    var note = result.Request.Criteria[c].Limit is null
                        ? ReserveNotes.OfSeparation(s.Reserves[c], rigidBody: false)
                        : ReserveNotes.OfLimit(0, s.Reserves[c]);
                    if (note is null) w.WriteNullValue();
                    else w.WriteStringValue(note);
                }
                w.WriteEndArray();
            }
            w.WriteStartArray("passes");
            foreach (var s in result.Steps) w.WriteBooleanValue(s.Reserves[c] >= 0);
            w.WriteEndArray();
            if (result.Request.Criteria[c].Limit is { } limit)
            {
                // The operating-point response at each value, in the limit's measure and SI unit.
                w.WriteString("unit", CheckJson.Unit(limit.Quantity));
                w.Number("limit", limit.Value);
                w.Array("response", result.Steps.Select(s => limit.Value * (1 - s.Reserves[c])));
            }
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("thresholds");
        foreach (var t in result.Thresholds)
        {
            w.WriteStartObject();
            w.WriteString("criterion", t.Criterion);
            w.Number("value", t.Value);
            w.WriteString("direction", t.PassesAbove ? "passes above" : "passes below");
            w.Array("bracket", [t.Bracket.Low, t.Bracket.High]);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
    }

    /// <summary>Writes a speed-frequency chart as one JSON object to <paramref name="stream"/>.</summary>
    public static void WriteChart(Stream stream, ModelDocument document, SpeedFrequencyChart chart, string toolVersion)
    {
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        w.WriteString("chart", "speed-frequency");
        w.Array("speeds_hz", chart.SpeedsHz);
        w.Array("speeds_rpm", chart.SpeedsHz.Select(s => s * 60));
        w.WriteStartArray("natural_frequencies");
        for (var i = 0; i < chart.NaturalFrequenciesHz.Length; i++)
        {
            w.WriteStartObject();
            w.WriteNumber("mode", chart.ModeNumbers[i]);
            w.Number("frequency_hz", chart.NaturalFrequenciesHz[i]);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("order_lines");
        foreach (var h in chart.Orders)
        {
            w.WriteStartObject();
            w.Number("order", h);
            w.Array("frequency_hz", chart.SpeedsHz.Select(s => h * s));
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("crossings");
        foreach (var c in chart.Crossings)
        {
            w.WriteStartObject();
            w.WriteNumber("mode", c.ModeNumber);
            w.Number("order", c.Order);
            w.Number("speed_hz", c.SpeedHz);
            w.Number("speed_rpm", c.SpeedHz * 60);
            w.Number("frequency_hz", c.FrequencyHz);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
    }
}
