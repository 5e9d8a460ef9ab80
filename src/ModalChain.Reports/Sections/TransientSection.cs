using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Io.Json;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace ModalChain.Reports.Sections;

/// <summary>Transient time histories: displacement of each output mass against time with its peak marked, and the table of peaks.</summary>
/// <remarks>Present when the model has a 'transient' section with loads or initial conditions; the numbers are those of <c>modalchain transient --format json</c>.</remarks>
public sealed class TransientSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Most points drawn per history; longer runs are reduced to the minimum and maximum of each bucket, so peaks survive.</summary>
    public const int MaxPlotPoints = 4000;

    /// <summary>Most samples of the histories written to results.json (every output is there, thinned so the file stays
    /// proportionate; peaks and RMS are those of the whole run; <c>modalchain transient --format json</c> writes every sample).</summary>
    public const int MaxJsonSamples = 2000;

    /// <summary>Most history charts drawn (results.json holds every output).</summary>
    public const int MaxCharts = 8;

    private readonly ReportContext _context;
    private readonly TransientResult _result;
    private readonly ImmutableArray<string> _loads;
    private readonly ImmutableArray<ChartFigure> _figures;

    private TransientSection(ReportContext context, TransientResult result, ImmutableArray<string> loads)
    {
        _context = context;
        _result = result;
        _loads = loads;
        // Velocity and acceleration histories are drawn beside displacement when the model's criteria use them.
        var quantities = HarmonicSection.QuantitiesFor(context.Document.Criteria).Select(q => q switch
        {
            Core.Analyses.Harmonic.ResponseQuantity.Velocity => ResponseQuantity.Velocity,
            Core.Analyses.Harmonic.ResponseQuantity.Acceleration => ResponseQuantity.Acceleration,
            _ => ResponseQuantity.Displacement,
        }).ToArray();
        var names = result.Responses.Where(r => r.Quantity == ResponseQuantity.Displacement && !result.Network.IsElectrical(r.Name)).Take(MaxCharts).Select(r => r.Name).ToArray();
        _figures = [.. names.SelectMany(n => quantities.Select(q => result.Responses.FirstOrDefault(r => r.Name == n && r.Quantity == q)))
            .OfType<ResponseHistory>().Select(HistoryChart)];
    }

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>: null when the model asks for no transient run.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        var document = context.Document;
        if (document.Transient is not { } spec) return null;
        var loads = spec.Loads.IsDefaultOrEmpty
            ? document.TimedLoads.ToList()
            : [.. spec.Loads.SelectMany(n => document.TimedLoads.Where(l => l.Name == n))]; // an unbalance turning in a plane is two histories of one name
        if (loads.Count == 0 && spec.Initial.IsDefaultOrEmpty) return null;
        var result = TransientAnalysis.Run(context.Damped, loads, spec.Initial, spec.Settings);
        return new TransientSection(context, result, [.. loads.Select(l => l.Name).Distinct()]);
    }

    /// <inheritdoc />
    public string Key => "transient";

    /// <inheritdoc />
    public string Title => "Transient response";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => _figures;

    /// <summary>File stem of the history chart of mass <paramref name="name"/>.</summary>
    public static string FigureName(string name) =>
        ReportFigure.Stem("transient", name);

    /// <summary>File stem of the history chart of <paramref name="quantity"/> of mass <paramref name="name"/>; displacement keeps <see cref="FigureName(string)"/>.</summary>
    public static string FigureName(string name, ResponseQuantity quantity) =>
        quantity == ResponseQuantity.Displacement ? FigureName(name) : FigureName(name) + "-" + quantity.ToString().ToLowerInvariant();

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        var s = _result.Settings;
        html.Paragraph(string.Create(Inv,
            $"Time history over {DisplayUnits.Number(s.Duration)} s in {_result.StepCount} steps of {DisplayUnits.Number(s.Step)} s ({_result.MethodDescription}); loads: {(_loads.IsEmpty ? "none (initial conditions only)" : string.Join(", ", _loads))}."));
        foreach (var w in _result.Warnings) html.Paragraph(w, "note");
        var u = _context.Units;
        html.Table("Peaks and RMS of each recorded response",
            ["Response", "Quantity", "Unit", "Peak (largest magnitude, signed)", "at (s)", "RMS"],
            _result.Responses.Where(r => !MountForceTables.IsMount(r) && !ElectricalTables.IsElectrical(_result.Network, r)).Select(r => (IReadOnlyList<string>)
                [r.Name, Rotation(r) ? Word(r).ToLowerInvariant() : DisplayUnits.Words(r.Quantity), UnitOf(r).Symbol, UnitOf(r).Format(r.Peak.Value), DisplayUnits.Number(r.Peak.Time),
                    double.IsNaN(r.Rms) ? "n/a" : UnitOf(r).Format(r.Rms)]),
            new HashSet<int> { 3, 4, 5 });
        ElectricalTables.WriteTransient(html, _result.Network, _result.Responses);
        MountForceTables.WriteTransient(html, _result, u);
        var e = _result.Energy;
        var j = u.Energy;
        // On the electrical side the "kinetic" energy is the capacitors' ½Cv² and the "strain" energy the inductors' ½λ²/L.
        var (kinetic, strain) = _result.Network.ElectricalNodes.IsEmpty ? ("kinetic", "strain") : ("kinetic and capacitor", "strain and inductor");
        html.Paragraph(string.Create(Inv,
            $"Energy balance (quality figure): initial {j.Format(e.InitialEnergy)} {j.Symbol} + input work {j.Format(e.InputWork)} {j.Symbol} = {kinetic} {j.Format(e.FinalKineticEnergy)} {j.Symbol} + {strain} {j.Format(e.FinalStrainEnergy)} {j.Symbol} + dissipated {j.Format(e.Dissipated)} {j.Symbol}, largest relative error {e.MaxRelativeError:0.0e+00}."), "quality");
        foreach (var figure in _figures) html.Figure(figure);
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        TransientJson.Write(buffer, _context.Document, _result, _loads, _context.Options.ToolVersion,
            TransientJson.ThinnedSamples(_result, MaxJsonSamples));
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    /// <summary>Indices to draw: every sample when few, else the first, last, minimum and maximum of each bucket.</summary>
    public static IReadOnlyList<int> PlotIndices(IReadOnlyList<double> values)
    {
        ArgumentNullException.ThrowIfNull(values);
        if (values.Count <= MaxPlotPoints) return [.. Enumerable.Range(0, values.Count)];
        var buckets = MaxPlotPoints / 2;
        var picked = new SortedSet<int> { 0, values.Count - 1 };
        for (var b = 0; b < buckets; b++)
        {
            var from = (int)((long)b * values.Count / buckets);
            var to = (int)((long)(b + 1) * values.Count / buckets);
            int lo = from, hi = from;
            for (var k = from; k < to; k++)
            {
                if (values[k] < values[lo]) lo = k;
                if (values[k] > values[hi]) hi = k;
            }
            picked.Add(lo);
            picked.Add(hi);
        }
        return [.. picked];
    }

    private ChartFigure HistoryChart(ResponseHistory history)
    {
        var (symbol, scale) = (UnitOf(history).Symbol, UnitOf(history).Factor);
        var word = Word(history);
        var model = Charts.Create($"{word} of {history.Name}", $"{_context.Document.Network.Title}: transient");
        model.Axes.Add(Charts.Linear(AxisPosition.Bottom, "Time (s)", _result.Times[0], _result.Times[^1]));
        var largest = history.Values.Max(Math.Abs) / scale;
        model.Axes.Add(largest > 0
            ? Charts.Linear(AxisPosition.Left, $"{word} ({symbol}, instantaneous)", -1.35 * largest, 1.35 * largest) // room for the peak's label
            : Charts.Linear(AxisPosition.Left, $"{word} ({symbol}, instantaneous)"));
        var line = new LineSeries { Title = history.Name };
        Charts.Style(line, 0);
        line.StrokeThickness = 1.4;
        foreach (var k in PlotIndices(history.Values)) line.Points.Add(new DataPoint(_result.Times[k], history.Values[k] / scale));
        model.Series.Add(line);
        var peakIndex = Enumerable.Range(0, history.Values.Length).MaxBy(k => Math.Abs(history.Values[k]));
        var peakPoint = new DataPoint(_result.Times[peakIndex], history.Values[peakIndex] / scale);
        model.Annotations.Add(new PointAnnotation
        {
            X = peakPoint.X,
            Y = peakPoint.Y,
            Shape = MarkerType.Diamond,
            Size = 5,
            Fill = OxyColor.Parse(Palette.Vermillion),
        });
        // Placed by ChartLabels beside the diamond, inside the plot and clear of the curve where there is room.
        model.Annotations.Add(new CurveLabel(string.Create(Inv, $"peak {DisplayUnits.Number(Math.Abs(peakPoint.Y))} {symbol} at {DisplayUnits.Number(peakPoint.X)} s"), OxyColor.Parse(Palette.Black))
        {
            Anchors = [peakPoint],
        });
        var caption = string.Create(Inv, $"{word} of {history.Name} against time; the largest magnitude (the peak) is marked with a diamond.");
        return new ChartFigure(FigureName(history.Name, history.Quantity), caption, model, height: 320);
    }

    /// <summary>A recorded motion of a rotation DOF (its SI unit is rad, rad/s or rad/s²).</summary>
    private static bool Rotation(ResponseHistory r) => r.Unit.StartsWith("rad", StringComparison.Ordinal);

    private static Core.Analyses.Harmonic.ResponseQuantity Motion(ResponseQuantity q) => q switch
    {
        ResponseQuantity.Displacement => Core.Analyses.Harmonic.ResponseQuantity.Displacement,
        ResponseQuantity.Velocity => Core.Analyses.Harmonic.ResponseQuantity.Velocity,
        _ => Core.Analyses.Harmonic.ResponseQuantity.Acceleration,
    };

    /// <summary>The display unit of <paramref name="r"/>: mrad, mrad/s, rad/s² for a rotation, the length or force unit otherwise.</summary>
    private DisplayUnit UnitOf(ResponseHistory r) => Rotation(r) ? DisplayUnits.AngularOf(Motion(r.Quantity)) : _context.Units.Of(r.Quantity);

    /// <summary>"Rotation", "Angular velocity", ... for a rotation; the quantity's name otherwise.</summary>
    private static string Word(ResponseHistory r) => Rotation(r) ? DisplayUnits.Word(Motion(r.Quantity), rotation: true) : r.Quantity.ToString();
}
