using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;
using HarmonicQuantity = ModalChain.Core.Analyses.Harmonic.ResponseQuantity;
using TransientQuantity = ModalChain.Core.Analyses.Transient.ResponseQuantity;

namespace ModalChain.Reports.Sections;

/// <summary>
/// The report's tables of the electrical side of a model with electrical nodes (a transducer's side, a circuit's
/// nodes), in V and A with SI prefixes (<see cref="ElectricalUnits"/>); the names and units come from
/// <see cref="ElectricalLabels"/>, as in the JSON, CSV and console outputs. Nothing is written for a mechanical model.
/// </summary>
public static class ElectricalTables
{
    /// <summary>The caption of the harmonic table.</summary>
    public const string HarmonicCaption = "Electrical side: largest amplitude over the sweep";

    /// <summary>The caption of the transient table.</summary>
    public const string TransientCaption = "Electrical side: peaks and RMS";

    /// <summary>
    /// One row per electrical output (its voltage), per transducer port (voltage and current) and per voltage source
    /// (current): the largest amplitude over the sweep and its frequency.
    /// </summary>
    public static void WriteHarmonic(HtmlWriter html, Network network, HarmonicResult result)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(result);
        var f = result.FrequenciesHz;
        if (f.IsEmpty) return;
        var rows = new List<IReadOnlyList<string>>();
        void Add(string what, string quantity, string unit, Func<int, Complex> value)
        {
            var k = Enumerable.Range(0, f.Length).MaxBy(i => value(i).Magnitude);
            rows.Add([what, quantity, ElectricalUnits.Format(value(k).Magnitude, unit), DisplayUnits.Number(f[k])]);
        }
        foreach (var r in result.Responses.Where(r => network.IsElectrical(r.Dof)))
            Add($"node {r.Dof}", "voltage", "V", k => r.At(k, f[k], HarmonicQuantity.Velocity));
        foreach (var e in result.ElementForces.Where(e => ElectricalLabels.IsElement(network, e.Element, e.Kind == ElementKind.Spring)))
            Add($"{(e.Kind == ElementKind.Spring ? "inductor" : "resistor")} {e.Element}", "current", "A", k => e.Force[k]);
        foreach (var port in result.TransducerPorts)
        {
            Add($"port of {port.Transducer}", "voltage", "V", k => port.Voltage[k]);
            Add($"port of {port.Transducer}", "current", "A", k => port.Current[k]);
        }
        foreach (var c in result.SourceCurrents) Add($"source at {c.Support}", "current", "A", k => c.Current[k]);
        if (rows.Count == 0) return;
        html.Table(HarmonicCaption, ["Electrical", "Quantity", "Amplitude (peak)", "at (Hz)"], rows, new HashSet<int> { 2, 3 });
        html.Paragraph("A node's voltage is its velocity in the node flux form; a port current is the current the transducer drives out of its branch terminal n1 into the circuit; a source's current is the current it delivers (docs/methods.md, \"Transducer ports\").", "note");
    }

    /// <summary>True when the history is of the electrical side (a node's flux, voltage or its rate, a current).</summary>
    public static bool IsElectrical(Network network, ResponseHistory history)
    {
        ArgumentNullException.ThrowIfNull(history);
        return ElectricalLabels.Unit(network, history.Name, history.Quantity, history.Unit) is "V*s" or "V" or "V/s" or "A";
    }

    /// <summary>One row per electrical history: its peak (with sign) and when, and its RMS, in V or A.</summary>
    public static void WriteTransient(HtmlWriter html, Network network, ImmutableArray<ResponseHistory> histories)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentNullException.ThrowIfNull(network);
        var rows = histories.Where(r => r.Direction is null && ElectricalLabels.Unit(network, r.Name, r.Quantity, r.Unit) is "V" or "A")
            .Select(r =>
            {
                var unit = ElectricalLabels.Unit(network, r.Name, r.Quantity, r.Unit);
                var what = r.Quantity switch
                {
                    TransientQuantity.PortVoltage or TransientQuantity.PortCurrent => "port of " + r.Name,
                    TransientQuantity.SourceCurrent => "source at " + r.Name,
                    TransientQuantity.SpringForce => "inductor " + r.Name,
                    TransientQuantity.DamperForce => "resistor " + r.Name,
                    _ => "node " + r.Name,
                };
                return (IReadOnlyList<string>)[what, unit == "V" ? "voltage" : "current", ElectricalUnits.Format(r.Peak.Value, unit), DisplayUnits.Number(r.Peak.Time),
                    double.IsNaN(r.Rms) ? "n/a" : ElectricalUnits.Format(r.Rms, unit)];
            }).ToList();
        if (rows.Count == 0) return;
        html.Table(TransientCaption, ["Electrical", "Quantity", "Peak (largest magnitude, signed)", "at (s)", "RMS"], rows, new HashSet<int> { 2, 3, 4 });
    }
}
