using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
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

/// <summary>A point of interest on a source's impedance curve, located between the sweep's frequencies.</summary>
/// <param name="What">What the point is ("smallest |Z|", "largest |Z|", "arg Z = 0°").</param>
/// <param name="FrequencyHz">Its frequency in Hz.</param>
/// <param name="Impedance">The impedance there in Ω.</param>
/// <param name="Located">True when it was located between two sweep frequencies; false when it is a sweep end (the curve goes on beyond it).</param>
public sealed record ImpedancePoint(string What, double FrequencyHz, Complex Impedance, bool Located);

/// <summary>The impedance each source sees and the transfer functions from it to every node over the model's sweep: figures and the table of resonances.</summary>
/// <remarks>
/// The sweep's numbers are those of <c>modalchain harmonic --format json</c> on the circuit (circuit-harmonic.schema.json).
/// The smallest and largest |Z| and the frequencies where arg Z crosses 0° are located between sweep frequencies by a
/// golden-section search (the extremes) or bisection (the crossings) in log f on fresh solves, so the table does not depend on
/// the sweep's spacing: a series R-L-C gives |Z| = R at f₀ = 1/(2π√(LC)).
/// </remarks>
public sealed class CircuitSweepSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Iterations of the golden-section search and of the bisection (each narrows the bracket in log f by 0.618 or 0.5).</summary>
    private const int Iterations = 80;

    private readonly ReportContext _context;
    private readonly CircuitAnalogy _analogy;
    private readonly ImmutableArray<ChartFigure> _figures;

    private CircuitSweepSection(ReportContext context, CircuitAnalogy analogy, ImmutableArray<CircuitSourceResponse> responses)
    {
        _context = context;
        _analogy = analogy;
        Responses = responses;
        Points = [.. responses.Select((r, s) => Locate(analogy, r, s))];
        _figures = [.. responses.SelectMany((r, s) => new[] { ImpedanceChart(r, Points[s]), TransferChart(r) })];
    }

    /// <summary>The factory registered in <see cref="ReportSections.Circuit"/>: null without a circuit, a 'harmonic' range or a source.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (context.Document.Circuit is not { } model || model.Sweep is not { } sweep) return null;
        if (model.Circuit.VoltageSources.IsEmpty && model.Circuit.CurrentSources.IsEmpty) return null;
        var analogy = CircuitAnalogy.Of(model.Circuit);
        var frequencies = FrequencyGrid.Build(sweep, false, [], []);
        return new CircuitSweepSection(context, analogy, CircuitFrequencyResponse.Solve(analogy, frequencies));
    }

    /// <summary>The response to each source alone over the sweep, in the circuit's order of sources.</summary>
    public ImmutableArray<CircuitSourceResponse> Responses { get; }

    /// <summary>For each source: the smallest and largest |Z| and every 0° crossing of arg Z, in that order.</summary>
    public ImmutableArray<ImmutableArray<ImpedancePoint>> Points { get; }

    /// <inheritdoc />
    public string Key => "circuit_sweep";

    /// <inheritdoc />
    public string Title => "Impedance and transfer functions";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => _figures;

    /// <summary>File stem of the impedance chart of source <paramref name="source"/>.</summary>
    public static string ImpedanceFigureName(string source) => ReportFigure.Stem("impedance", source);

    /// <summary>File stem of the transfer-function chart of source <paramref name="source"/>.</summary>
    public static string TransferFigureName(string source) => ReportFigure.Stem("transfer", source);

    /// <summary>The headers of each source's impedance table.</summary>
    public static readonly ImmutableArray<string> Headers = ["Point", "Frequency (Hz)", "|Z|", "arg Z (°)", "Located"];

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        var f = Responses[0].FrequenciesHz;
        html.Paragraph(string.Create(Inv,
            $"Sinusoidal steady state over {f.Length} frequencies from {DisplayUnits.Number(f.Min())} Hz to {DisplayUnits.Number(f.Max())} Hz, one source at a time (the others switched off: voltage sources shorted, current sources open). ") +
            "The impedance Z = V/I is the one the source sees at its terminals; a transfer function is a node's voltage per unit source voltage (V/V) or per unit source current (V/A).");
        for (var s = 0; s < Responses.Length; s++)
        {
            var r = Responses[s];
            html.Heading($"Source {r.Source} ({(r.IsVoltageSource ? "voltage" : "current")} source)");
            html.Table($"Impedance seen by {r.Source}: extremes and resonances", Headers, Points[s].Select(Row), new HashSet<int> { 1, 2, 3 });
            html.Figure(_figures[2 * s]);
            html.Figure(_figures[2 * s + 1]);
        }
    }

    /// <summary>The table row of <paramref name="p"/>.</summary>
    public static IReadOnlyList<string> Row(ImpedancePoint p)
    {
        ArgumentNullException.ThrowIfNull(p);
        return [p.What, DisplayUnits.Number(p.FrequencyHz, 6), ElectricalUnits.Format(p.Impedance.Magnitude, ElectricalUnits.Ohm),
            // Two decimals of a degree: a located resonance is 0.00, not a rounding residue such as 1.1E-08.
            (Math.Round(Degrees(p.Impedance), 2) + 0.0).ToString("F2", Inv),
            p.Located ? "between sweep points" : "end of the sweep"];
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        CircuitJson.WriteHarmonic(buffer, _context.Document, Responses, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    private static double Degrees(Complex z) => z.Phase * 180 / Math.PI;

    /// <summary>The extremes of |Z| and the 0° crossings of arg Z of source <paramref name="source"/>, each located between sweep frequencies.</summary>
    private static ImmutableArray<ImpedancePoint> Locate(CircuitAnalogy analogy, CircuitSourceResponse r, int source)
    {
        var f = r.FrequenciesHz;
        var z = r.Impedance;
        var order = Enumerable.Range(0, f.Length).OrderBy(k => f[k]).ToArray();
        Complex At(double hz) => CircuitFrequencyResponse.Solve(analogy, [hz])[source].Impedance[0];
        var points = new List<ImpedancePoint>();
        ImpedancePoint Extreme(string what, int sign)
        {
            var k = Enumerable.Range(0, order.Length).MinBy(i => sign * z[order[i]].Magnitude);
            if (k == 0 || k == order.Length - 1) return new ImpedancePoint(what, f[order[k]], z[order[k]], false);
            try
            {
                var (a, b) = (Math.Log(f[order[k - 1]]), Math.Log(f[order[k + 1]]));
                var g = (Math.Sqrt(5) - 1) / 2;
                double x1 = b - g * (b - a), x2 = a + g * (b - a);
                double v1 = sign * At(Math.Exp(x1)).Magnitude, v2 = sign * At(Math.Exp(x2)).Magnitude;
                for (var i = 0; i < Iterations && b - a > 1e-15; i++)
                {
                    if (v1 < v2) { b = x2; x2 = x1; v2 = v1; x1 = b - g * (b - a); v1 = sign * At(Math.Exp(x1)).Magnitude; }
                    else { a = x1; x1 = x2; v1 = v2; x2 = a + g * (b - a); v2 = sign * At(Math.Exp(x2)).Magnitude; }
                }
                var hz = Math.Exp(0.5 * (a + b));
                var value = At(hz);
                // Keep the sweep's own point when it is the better one (a flat curve, rounding).
                return sign * value.Magnitude <= sign * z[order[k]].Magnitude ? new ImpedancePoint(what, hz, value, true) : new ImpedancePoint(what, f[order[k]], z[order[k]], false);
            }
            catch (NumericalFailureException)
            {
                return new ImpedancePoint(what, f[order[k]], z[order[k]], false);
            }
        }
        points.Add(Extreme("smallest |Z|", 1));
        points.Add(Extreme("largest |Z|", -1));
        for (var i = 0; i + 1 < order.Length; i++)
        {
            var (p0, p1) = (Degrees(z[order[i]]), Degrees(z[order[i + 1]]));
            // A crossing of 0°, not the wrap at ±180°.
            if (Math.Sign(p0) == Math.Sign(p1) || Math.Abs(p0) > 90 || Math.Abs(p1) > 90 || p0 == 0 && p1 == 0) continue;
            if (points.Count >= 12) break;
            try
            {
                double a = Math.Log(f[order[i]]), b = Math.Log(f[order[i + 1]]);
                var sa = Math.Sign(p0);
                for (var it = 0; it < Iterations && b - a > 1e-15; it++)
                {
                    var m = 0.5 * (a + b);
                    if (Math.Sign(Degrees(At(Math.Exp(m)))) == sa) a = m; else b = m;
                }
                var hz = Math.Exp(0.5 * (a + b));
                points.Add(new ImpedancePoint("arg Z = 0° (resistive: resonance)", hz, At(hz), true));
            }
            catch (NumericalFailureException)
            {
            }
        }
        return [.. points];
    }

    private Axis FrequencyAxis(CircuitSourceResponse r)
    {
        var f = r.FrequenciesHz;
        var spacing = _context.Document.Circuit?.Sweep is FrequencyRange { Spacing: FrequencySpacing.Linear };
        Axis axis = spacing ? Charts.Linear(AxisPosition.Bottom, "Frequency (Hz)") : Charts.Logarithmic(AxisPosition.Bottom, "Frequency (Hz)");
        axis.Minimum = f.Min();
        axis.Maximum = f.Max();
        return axis;
    }

    private static (LogarithmicAxis Magnitude, LinearAxis Phase) Panels(PlotModel model, string magnitudeTitle)
    {
        var magnitude = Charts.Logarithmic(AxisPosition.Left, magnitudeTitle);
        magnitude.Key = "magnitude";
        magnitude.StartPosition = 0.36;
        magnitude.EndPosition = 1;
        model.Axes.Add(magnitude);
        var phase = Charts.Linear(AxisPosition.Left, "Phase (°)", -180, 180);
        phase.Key = "phase";
        phase.StartPosition = 0;
        phase.EndPosition = 0.28;
        phase.MajorStep = 90;
        phase.MinorStep = 45;
        model.Axes.Add(phase);
        return (magnitude, phase);
    }

    private ChartFigure ImpedanceChart(CircuitSourceResponse r, ImmutableArray<ImpedancePoint> points)
    {
        var model = Charts.Create($"Impedance seen by {r.Source}", $"{_analogy.Circuit.Title}: |Z| and arg Z");
        model.Axes.Add(FrequencyAxis(r));
        var (magnitude, _) = Panels(model, "|Z| (Ω)");
        var order = Enumerable.Range(0, r.FrequenciesHz.Length).OrderBy(k => r.FrequenciesHz[k]).ToArray();
        var size = new LineSeries { Title = "|Z|", YAxisKey = "magnitude" };
        Charts.Style(size, 0);
        var angle = new LineSeries { Title = "arg Z", YAxisKey = "phase" };
        Charts.Style(angle, 0);
        angle.StrokeThickness = 1.4;
        foreach (var k in order)
        {
            var m = r.Impedance[k].Magnitude;
            size.Points.Add(new DataPoint(r.FrequenciesHz[k], m > 0 && double.IsFinite(m) ? m : double.NaN));
            angle.Points.Add(new DataPoint(r.FrequenciesHz[k], Degrees(r.Impedance[k])));
        }
        model.Series.Add(size);
        model.Series.Add(angle);
        var finite = r.Impedance.Select(z => z.Magnitude).Where(m => m > 0 && double.IsFinite(m)).ToArray();
        if (finite.Length > 0)
        {
            magnitude.Maximum = finite.Max() * 4;
            magnitude.Minimum = Math.Max(finite.Min(), finite.Max() * 1e-8) / 2;
        }
        var smallest = points[0];
        if (smallest.Impedance.Magnitude > 0)
        {
            var at = new DataPoint(smallest.FrequencyHz, smallest.Impedance.Magnitude);
            model.Annotations.Add(new PointAnnotation { X = at.X, Y = at.Y, YAxisKey = "magnitude", Shape = MarkerType.Diamond, Size = 5, Fill = OxyColor.Parse(Palette.Vermillion) });
            model.Annotations.Add(new CurveLabel(string.Create(Inv, $"smallest {ElectricalUnits.Format(at.Y, ElectricalUnits.Ohm)} at {DisplayUnits.Number(at.X)} Hz"), OxyColor.Parse(Palette.Black))
            {
                YAxisKey = "magnitude",
                Anchors = [at],
            });
        }
        var caption = $"Magnitude (log scale) and phase of the impedance {r.Source} sees over the sweep; the smallest |Z| is marked with a diamond.";
        return new ChartFigure(ImpedanceFigureName(r.Source), caption, model, height: 420);
    }

    private ChartFigure TransferChart(CircuitSourceResponse r)
    {
        var unit = r.IsVoltageSource ? "V/V" : "V/A";
        var model = Charts.Create($"Node voltages per unit {(r.IsVoltageSource ? "voltage" : "current")} of {r.Source}", $"{_analogy.Circuit.Title}: transfer functions ({unit})");
        model.Axes.Add(FrequencyAxis(r));
        var (magnitude, _) = Panels(model, $"|H| ({unit})");
        var order = Enumerable.Range(0, r.FrequenciesHz.Length).OrderBy(k => r.FrequenciesHz[k]).ToArray();
        var largest = 0.0;
        var smallest = double.MaxValue;
        for (var n = 0; n < r.Nodes.Length; n++)
        {
            var size = new LineSeries { Title = r.Nodes[n], YAxisKey = "magnitude" };
            Charts.Style(size, n);
            var angle = new LineSeries { Title = r.Nodes[n] + " phase", YAxisKey = "phase" };
            Charts.Style(angle, n);
            angle.StrokeThickness = 1.2;
            foreach (var k in order)
            {
                var h = r.Transfer[k][n];
                var m = h.Magnitude;
                if (m > 0 && double.IsFinite(m))
                {
                    largest = Math.Max(largest, m);
                    smallest = Math.Min(smallest, m);
                }
                size.Points.Add(new DataPoint(r.FrequenciesHz[k], m > 0 && double.IsFinite(m) ? m : double.NaN));
                angle.Points.Add(new DataPoint(r.FrequenciesHz[k], m > 0 ? Degrees(h) : double.NaN));
            }
            model.Series.Add(size);
            model.Series.Add(angle);
        }
        if (largest > 0)
        {
            magnitude.Maximum = largest * 4;
            magnitude.Minimum = Math.Max(smallest, largest * 1e-8) / 2;
        }
        model.Legends.Add(new OxyPlot.Legends.Legend
        {
            LegendPosition = OxyPlot.Legends.LegendPosition.TopRight,
            LegendPlacement = OxyPlot.Legends.LegendPlacement.Inside,
            LegendBackground = OxyColor.FromAColor(220, OxyColors.White),
        });
        foreach (var s in model.Series.OfType<LineSeries>().Where(s => s.YAxisKey == "phase")) s.RenderInLegend = false;
        var caption = $"Magnitude (log scale) and phase of each node's voltage per unit {(r.IsVoltageSource ? "voltage" : "current")} of {r.Source} ({unit}), the other sources switched off.";
        return new ChartFigure(TransferFigureName(r.Source), caption, model, height: 440);
    }
}
