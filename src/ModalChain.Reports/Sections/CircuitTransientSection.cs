using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;
using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace ModalChain.Reports.Sections;

/// <summary>The circuit's response from rest to its sources' waveforms: node voltages and branch currents against time, and their extremes.</summary>
/// <remarks>Present when the model has a 'transient' section. The numbers are those of <c>modalchain transient --format json</c> on the circuit (circuit-transient.schema.json), thinned to at most <see cref="MaxJsonSamples"/> instants.</remarks>
public sealed class CircuitTransientSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Most instants of the histories written to results.json (extremes in the table are over every instant; the command writes every instant).</summary>
    public const int MaxJsonSamples = 2000;

    /// <summary>Most curves drawn on one chart (results.json holds every node and branch).</summary>
    public const int MaxCurves = 7;

    private readonly ReportContext _context;
    private readonly ImmutableArray<ChartFigure> _figures;

    private CircuitTransientSection(ReportContext context, CircuitTransientResult result)
    {
        _context = context;
        Result = result;
        _figures =
        [
            Chart("voltages", "Node voltages", "Voltage (V)", result.Nodes.Length, result.Nodes.Take(MaxCurves).Select((n, i) => (n, result.Volts[i]))),
            Chart("currents", "Branch currents", "Current (A)", result.Currents.Length, result.Currents.Take(MaxCurves).Select(b => (b.Element, b.Amperes))),
        ];
    }

    /// <summary>The factory registered in <see cref="ReportSections.Circuit"/>: null without a circuit or a 'transient' section.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (context.Document.Circuit is not { } model || model.Duration is not { } duration) return null;
        var step = model.Step ?? duration / 1000;
        return new CircuitTransientSection(context, CircuitTransient.Run(CircuitAnalogy.Of(model.Circuit), duration, step));
    }

    /// <summary>The run shown.</summary>
    public CircuitTransientResult Result { get; }

    /// <inheritdoc />
    public string Key => "circuit_transient";

    /// <inheritdoc />
    public string Title => "Time response";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => _figures;

    /// <summary>The headers of the extremes table.</summary>
    public static readonly ImmutableArray<string> Headers = ["Quantity", "Largest", "at (s)", "Smallest", "at (s)", "Final"];

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        var t = Result.Times;
        var circuit = _context.Document.Circuit!.Circuit;
        var waveforms = circuit.VoltageSources.Select(v => $"{v.Name}: {CircuitSummarySection.Waveform(v.Waveform, ElectricalUnits.Volt)}")
            .Concat(circuit.CurrentSources.Select(c => $"{c.Name}: {CircuitSummarySection.Waveform(c.Waveform, ElectricalUnits.Ampere)}"));
        html.Paragraph(string.Create(Inv,
            $"Response from rest (capacitors uncharged, no current in the inductors) over {ElectricalUnits.Format(t[^1], ElectricalUnits.Second)} in steps of {ElectricalUnits.Format(t[1] - t[0], ElectricalUnits.Second)}, exact for steps, ramps and rectangular pulses. Sources: {string.Join("; ", waveforms)}."));
        var rows = Result.Nodes.Select((n, i) => Row($"v({n})", ElectricalUnits.Volt, Result.Volts[i]))
            .Concat(Result.Currents.Select(b => Row($"i({b.Element}), {b.Kind.Replace('-', ' ')}", ElectricalUnits.Ampere, b.Amperes)));
        html.Table("Extremes and final values of node voltages (to ground) and branch currents (from the element's first terminal to its second; a source's out of its + terminal)",
            Headers, rows, new HashSet<int> { 1, 2, 3, 4, 5 });
        html.Paragraph("Capacitor currents leave out the impulse at the instant a source voltage jumps; the values shown are those just after it.", "note");
        foreach (var figure in _figures) html.Figure(figure);
    }

    private IReadOnlyList<string> Row(string quantity, string unit, ImmutableArray<double> values)
    {
        var hi = Enumerable.Range(0, values.Length).MaxBy(k => values[k]);
        var lo = Enumerable.Range(0, values.Length).MinBy(k => values[k]);
        return [quantity, ElectricalUnits.Format(values[hi], unit), DisplayUnits.Number(Result.Times[hi]), ElectricalUnits.Format(values[lo], unit),
            DisplayUnits.Number(Result.Times[lo]), ElectricalUnits.Format(values[^1], unit)];
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        CircuitJson.WriteTransient(buffer, _context.Document, Thinned(Result, MaxJsonSamples), _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    /// <summary>The run at every k-th instant (the first and last kept) so that at most <paramref name="most"/> instants remain.</summary>
    public static CircuitTransientResult Thinned(CircuitTransientResult result, int most)
    {
        ArgumentNullException.ThrowIfNull(result);
        if (result.Times.Length <= most) return result;
        var every = (int)Math.Ceiling((result.Times.Length - 1) / (double)(most - 1));
        var keep = Enumerable.Range(0, result.Times.Length).Where(k => k % every == 0 || k == result.Times.Length - 1).ToArray();
        ImmutableArray<double> Pick(ImmutableArray<double> values) => [.. keep.Select(k => values[k])];
        return new CircuitTransientResult(Pick(result.Times), result.Nodes, [.. result.Volts.Select(Pick)],
            [.. result.Currents.Select(b => b with { Amperes = Pick(b.Amperes) })]);
    }

    private ChartFigure Chart(string stem, string what, string axisTitle, int total, IEnumerable<(string Name, ImmutableArray<double> Values)> curves)
    {
        var t = Result.Times;
        var model = Charts.Create(what, $"{_context.Document.Circuit!.Circuit.Title}: response from rest");
        model.Axes.Add(Charts.Linear(AxisPosition.Bottom, "Time (s)", t[0], t[^1]));
        model.Axes.Add(Charts.Linear(AxisPosition.Left, axisTitle));
        var index = 0;
        var names = new List<string>();
        foreach (var (name, values) in curves)
        {
            var line = new LineSeries { Title = name };
            Charts.Style(line, index++);
            foreach (var k in TransientSection.PlotIndices(values)) line.Points.Add(new DataPoint(t[k], values[k]));
            model.Series.Add(line);
            names.Add(name);
        }
        model.Legends.Add(new OxyPlot.Legends.Legend
        {
            LegendPosition = OxyPlot.Legends.LegendPosition.RightBottom,
            LegendPlacement = OxyPlot.Legends.LegendPlacement.Inside,
            LegendBackground = OxyColor.FromAColor(220, OxyColors.White),
        });
        var caption = $"{what} against time from rest: {string.Join(", ", names)}" +
            (total > index ? $" (the first {MaxCurves}; results.json holds every one)." : ".");
        return new ChartFigure(ReportFigure.Stem("circuit", stem), caption, model, height: 340);
    }
}
