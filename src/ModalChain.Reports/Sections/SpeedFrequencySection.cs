using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Studies;
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

/// <summary>Natural frequencies against running speed with the order lines (1×, 2×, ...) and their crossings.</summary>
/// <remarks>
/// Present when the model names a running speed (in <c>criteria.separation.speeds</c> or a load's <c>speed</c>).
/// Orders come from <c>criteria.separation.orders</c>, else 1 and 2 (as <c>modalchain study --vary speed</c>); the speed
/// axis runs from 0 to 1.25 × the highest running speed. Numbers are those of <c>study --vary speed --format json</c>.
/// </remarks>
public sealed class SpeedFrequencySection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly ReportContext _context;
    private readonly SpeedFrequencyChart _chart;
    private readonly ImmutableArray<double> _runningSpeedsHz;
    private readonly double _margin;
    private readonly ChartFigure _figure;

    private SpeedFrequencySection(ReportContext context, ImmutableArray<double> speeds, ImmutableArray<double> orders, double margin)
    {
        _context = context;
        _runningSpeedsHz = speeds;
        _margin = margin;
        var modes = context.Damped.Modes.Modes.Take(context.Options.MaxModes).Select(m => (m.Number, m.NaturalFrequencyHz)).ToArray();
        _chart = SpeedFrequencyChart.Build(modes, 0, 1.25 * speeds.Max(), 201, orders);
        _figure = BuildFigure();
    }

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>: null when the model names no running speed.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        var separation = context.Document.Criteria.Separation;
        var speeds = (separation?.SpeedsHz ?? [])
            .Concat(context.Document.Structure.Loads.Select(l => l.SpeedHz).OfType<double>())
            .Where(s => s > 0).Distinct().Order().ToImmutableArray();
        if (speeds.IsEmpty) return null;
        var orders = separation is { Orders.IsDefaultOrEmpty: false } ? separation.Orders : [1.0, 2.0];
        return new SpeedFrequencySection(context, speeds, orders, separation?.Margin ?? 0);
    }

    /// <inheritdoc />
    public string Key => "speed_frequency";

    /// <inheritdoc />
    public string Title => "Speed-frequency chart";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [_figure];

    /// <summary>The chart data shown.</summary>
    public SpeedFrequencyChart Data => _chart;

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        html.Paragraph(string.Create(Inv,
            $"Natural frequencies (horizontal) against running speed, with the excitation of each order (lines through the origin, f = order × speed). Where an order line meets a natural frequency, resonance is met at that speed during run-up and run-down. Running speed{(_runningSpeedsHz.Length == 1 ? "" : "s")}: {string.Join(", ", _runningSpeedsHz.Select(s => DisplayUnits.Number(s * 60) + " rpm"))}."));
        if (_chart.Crossings.IsEmpty) html.Paragraph("No order line meets a natural frequency between 0 and 1.25 × the highest running speed.", "note");
        else
            html.Table("Crossings (speeds at which an order meets a natural frequency)", ["Mode", "Order", "Speed (rpm)", "Speed (Hz)", "Frequency (Hz)"],
                _chart.Crossings.Select(c => (IReadOnlyList<string>)
                    [ModeLabel(c.ModeNumber), DisplayUnits.Given(c.Order) + "×", DisplayUnits.Number(c.SpeedHz * 60), DisplayUnits.Number(c.SpeedHz), DisplayUnits.Number(c.FrequencyHz)]),
                new HashSet<int> { 0, 2, 3, 4 });
        html.Figure(_figure);
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        StudyJson.WriteChart(buffer, _context.Document, _chart, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    /// <summary>The mode's number, with its motion (bounce, roll, ...) in plane and 3d models: "3 (bounce)".</summary>
    private string ModeLabel(int number) =>
        _context.Damped.Modes.Modes.FirstOrDefault(m => m.Number == number)?.Motion is { Length: > 0 } motion
            ? string.Create(Inv, $"{number} ({motion})")
            : number.ToString(Inv);

    private ChartFigure BuildFigure()
    {
        var model = Charts.Create("Speed-frequency chart", _context.Document.Network.Title);
        var top = 1.25 * _runningSpeedsHz.Max() * 60;
        var fMax = Math.Max(_chart.NaturalFrequenciesHz.DefaultIfEmpty(0).Max(), _chart.Orders.Max() * _runningSpeedsHz.Max()) * 1.15;
        var labels = new List<CurveLabel>();
        model.Axes.Add(Charts.Linear(AxisPosition.Bottom, "Running speed (rpm)", 0, top));
        model.Axes.Add(Charts.Linear(AxisPosition.Left, "Frequency (Hz)", 0, fMax));
        foreach (var s in _runningSpeedsHz)
        {
            if (_margin > 0)
                model.Annotations.Add(new RectangleAnnotation
                {
                    MinimumX = (1 - _margin) * s * 60,
                    MaximumX = (1 + _margin) * s * 60,
                    Fill = OxyColor.FromAColor(40, OxyColor.Parse(Palette.Orange)),
                    Layer = AnnotationLayer.BelowSeries,
                });
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Vertical,
                X = s * 60,
                Color = OxyColor.Parse(Palette.Orange),
                LineStyle = LineStyle.DashDot,
                StrokeThickness = 1.4,
            });
            labels.Add(new CurveLabel(DisplayUnits.Number(s * 60) + " rpm", OxyColor.Parse(Palette.Vermillion)) { AlongX = s * 60 });
        }
        for (var i = 0; i < _chart.NaturalFrequenciesHz.Length; i++)
        {
            var hz = _chart.NaturalFrequenciesHz[i];
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Horizontal,
                Y = hz,
                Color = OxyColor.Parse(Palette.Blue),
                StrokeThickness = 1.6,
                LineStyle = LineStyle.Solid,
            });
            // Along its line, from the left edge rightwards: ChartLabels takes the first place with room.
            labels.Add(new CurveLabel(string.Create(Inv, $"mode {ModeLabel(_chart.ModeNumbers[i])}: {DisplayUnits.Number(hz)} Hz"), OxyColor.Parse(Palette.Blue))
            {
                Anchors = [.. Enumerable.Range(0, 40).Select(k => new DataPoint(top * k / 40.0, hz))],
            });
        }
        for (var j = 0; j < _chart.Orders.Length; j++)
        {
            var h = _chart.Orders[j];
            var line = new LineSeries { Title = DisplayUnits.Given(h) + "× speed" };
            Charts.Style(line, j + 1);
            line.Points.Add(new DataPoint(0, 0));
            line.Points.Add(new DataPoint(top, h * top / 60));
            model.Series.Add(line);
        }
        var crossings = new ScatterSeries { Title = "crossing", MarkerType = MarkerType.Circle, MarkerSize = 4, MarkerFill = OxyColor.Parse(Palette.Vermillion), MarkerStroke = OxyColors.Black };
        foreach (var c in _chart.Crossings) crossings.Points.Add(new ScatterPoint(c.SpeedHz * 60, c.FrequencyHz));
        model.Series.Add(crossings);
        foreach (var label in labels) model.Annotations.Add(label);
        model.Legends.Add(new OxyPlot.Legends.Legend { LegendPosition = OxyPlot.Legends.LegendPosition.BottomRight, LegendPlacement = OxyPlot.Legends.LegendPlacement.Inside, LegendBackground = OxyColor.FromAColor(220, OxyColors.White) });
        var caption = "Natural frequencies (solid blue) against running speed; order lines through the origin (dashed, one pattern per order); "
            + "running speeds dash-dot orange" + (_margin > 0 ? string.Create(Inv, $", with the ±{DisplayUnits.Given(100 * _margin)} % separation band shaded") : "")
            + "; crossings marked with circles.";
        return new ChartFigure("speed-frequency", caption, model, height: 400);
    }
}
