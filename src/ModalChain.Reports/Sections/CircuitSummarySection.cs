using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Text;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>The circuit as read: its nodes and how each enters the equations, the elements between them with their values, and the sources.</summary>
/// <remarks>Present only for a model with a <c>circuit:</c> section; values in Ω, H, F, V and A with SI prefixes (results.json in plain SI).</remarks>
public sealed class CircuitSummarySection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The caution circuit outputs carry after the tool's own (the same words as the terminal tables of circuit commands).</summary>
    public const string CircuitCaution =
        "Circuit results are those of ideal lumped resistors, inductors, capacitors and sources: parasitics, saturation, " +
        "temperature and tolerances are left out. Circuits at hazardous voltages must be designed and checked by a qualified person.";

    private readonly ReportContext _context;
    private readonly Circuit _circuit;
    private readonly CircuitAnalogy _analogy;
    private readonly SchematicFigure _schematic;

    private CircuitSummarySection(ReportContext context, Circuit circuit)
    {
        _context = context;
        _circuit = circuit;
        _analogy = CircuitAnalogy.Of(circuit);
        _schematic = CircuitSchematic.Figure(circuit);
    }

    /// <summary>The factory registered in <see cref="ReportSections.Circuit"/>: null for a model without a circuit.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        return context.Document.Circuit is { } model ? new CircuitSummarySection(context, model.Circuit) : null;
    }

    /// <inheritdoc />
    public string Key => "circuit";

    /// <inheritdoc />
    public string Title => "Circuit";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [_schematic];

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        var c = _circuit;
        html.Paragraph(string.Create(Inv,
            $"{Count(c.Nodes.Length, "node", "nodes")} besides ground; {Count(c.Resistors.Length, "resistor", "resistors")}, {Count(c.Inductors.Length, "inductor", "inductors")}, {Count(c.Capacitors.Length, "capacitor", "capacitors")}; {Count(c.VoltageSources.Length, "voltage source", "voltage sources")} and {Count(c.CurrentSources.Length, "current source", "current sources")}."));
        html.Paragraph("Caution for circuits: " + CircuitCaution, "note");
        html.Figure(_schematic);
        html.Table("Nodes (ground is the reference at 0 V)", ["Node", "How it enters the equations", "Elements connected"],
            c.Nodes.Select(n => (IReadOnlyList<string>)[n, Role(n), string.Join(", ", Connected(n))]));
        html.Table("Elements between nodes", ["Element", "Kind", "From node", "To node", "Value"],
            Elements().Select(e => (IReadOnlyList<string>)[e.Name, e.Kind, e.A, e.B, e.Value]), new HashSet<int> { 4 });
        if (c.VoltageSources.Length + c.CurrentSources.Length > 0)
            html.Table("Sources (the amplitude drives the sweeps and is the reference of the transfer functions; the waveform drives the time response)",
                ["Source", "Kind", "Terminals", "Amplitude", "Waveform in time"],
                c.VoltageSources.Select(v => (IReadOnlyList<string>)[v.Name, "voltage", $"+ {v.Positive}, − {v.Negative}", ElectricalUnits.Format(v.Amplitude, ElectricalUnits.Volt, given: true), Waveform(v.Waveform, ElectricalUnits.Volt)])
                    .Concat(c.CurrentSources.Select(i => (IReadOnlyList<string>)[i.Name, "current", $"from {i.From} into {i.To}", ElectricalUnits.Format(i.Amplitude, ElectricalUnits.Ampere, given: true), Waveform(i.Waveform, ElectricalUnits.Ampere)])),
                new HashSet<int> { 3 });
        if (_context.Document.Warnings.Length > 0)
        {
            html.Heading("Warnings from reading the model");
            html.List(_context.Document.Warnings.Select(w => w.ToString()), "warnings");
        }
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        var c = _circuit;
        json.WriteStartObject();
        json.WriteString("title", MarkupText.Clean(c.Title));
        json.WriteStartArray("nodes");
        foreach (var n in c.Nodes)
        {
            json.WriteStartObject();
            json.WriteString("name", MarkupText.Clean(n));
            json.WriteString("role", _analogy.RoleOf(_analogy.IndexOf(n)) switch
            {
                CircuitNodeRole.Massive => "with_capacitance",
                CircuitNodeRole.Massless => "without_capacitance",
                _ => "held_by_voltage_source",
            });
            json.WriteEndObject();
        }
        json.WriteEndArray();
        Two(json, "resistors", c.Resistors.Select(e => (e.Name, e.NodeA, e.NodeB, e.Ohms)), "resistance_ohm");
        Two(json, "inductors", c.Inductors.Select(e => (e.Name, e.NodeA, e.NodeB, e.Henries)), "inductance_h");
        Two(json, "capacitors", c.Capacitors.Select(e => (e.Name, e.NodeA, e.NodeB, e.Farads)), "capacitance_f");
        Two(json, "voltage_sources", c.VoltageSources.Select(e => (e.Name, e.Positive, e.Negative, e.Amplitude)), "amplitude_v");
        Two(json, "current_sources", c.CurrentSources.Select(e => (e.Name, e.From, e.To, e.Amplitude)), "amplitude_a");
        json.WriteString("caution", CircuitCaution);
        json.WriteEndObject();
    }

    private static void Two(Utf8JsonWriter json, string key, IEnumerable<(string Name, string A, string B, double Value)> items, string valueKey)
    {
        json.WriteStartArray(key);
        foreach (var (name, a, b, value) in items)
        {
            json.WriteStartObject();
            json.WriteString("name", MarkupText.Clean(name));
            json.WriteStartArray("between");
            json.WriteStringValue(MarkupText.Clean(a));
            json.WriteStringValue(MarkupText.Clean(b));
            json.WriteEndArray();
            json.WriteNumber(valueKey, value);
            json.WriteEndObject();
        }
        json.WriteEndArray();
    }

    private string Role(string node) => _analogy.RoleOf(_analogy.IndexOf(node)) switch
    {
        CircuitNodeRole.Massive => "has capacitance: its voltage holds charge",
        CircuitNodeRole.Massless => "no capacitor: its voltage follows the currents at once",
        _ => "its voltage is set by a voltage source",
    };

    private IEnumerable<string> Connected(string node) =>
        Elements().Where(e => e.A == node || e.B == node).Select(e => e.Name);

    /// <summary>Every element and source with its terminals and value, in the circuit's order.</summary>
    private IEnumerable<(string Name, string Kind, string A, string B, string Value)> Elements()
    {
        var c = _circuit;
        foreach (var e in c.Resistors) yield return (e.Name, "resistor", e.NodeA, e.NodeB, ElectricalUnits.Format(e.Ohms, ElectricalUnits.Ohm, given: true));
        foreach (var e in c.Inductors) yield return (e.Name, "inductor", e.NodeA, e.NodeB, ElectricalUnits.Format(e.Henries, ElectricalUnits.Henry, given: true));
        foreach (var e in c.Capacitors) yield return (e.Name, "capacitor", e.NodeA, e.NodeB, ElectricalUnits.Format(e.Farads, ElectricalUnits.Farad, given: true));
        foreach (var e in c.VoltageSources) yield return (e.Name, "voltage source", e.Negative, e.Positive, ElectricalUnits.Format(e.Amplitude, ElectricalUnits.Volt, given: true) + " amplitude");
        foreach (var e in c.CurrentSources) yield return (e.Name, "current source", e.From, e.To, ElectricalUnits.Format(e.Amplitude, ElectricalUnits.Ampere, given: true) + " amplitude");
    }

    /// <summary>A source's waveform in words, its levels with the source's unit.</summary>
    public static string Waveform(TimeFunction? waveform, string unit)
    {
        string V(double value) => ElectricalUnits.Format(value, unit, given: true);
        string T(double seconds) => ElectricalUnits.Format(seconds, ElectricalUnits.Second, given: true);
        return waveform switch
        {
            null => "none (switched off in the time response)",
            StepFunction s => $"step to {V(s.Value)} at {T(s.At)}",
            RampFunction r => $"ramp from {V(r.From)} to {V(r.To)} over {T(r.Over)} from {T(r.Start)}",
            RectangularPulse p => $"rectangular pulse of {V(p.Amplitude)} for {T(p.Duration)} from {T(p.Start)}",
            HalfSinePulse h => $"half-sine pulse of {V(h.Amplitude)} for {T(h.Duration)} from {T(h.Start)}",
            SineFunction s => string.Create(Inv, $"sine of {V(s.Amplitude)} amplitude at {DisplayUnits.Number(s.FrequencyHz)} Hz"),
            _ => "a table of values against time",
        };
    }

    private static string Count(int n, string one, string many) => n.ToString(Inv) + " " + (n == 1 ? one : many);
}
