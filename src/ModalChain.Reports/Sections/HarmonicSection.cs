using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
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

/// <summary>Steady-state harmonic response: one magnitude-and-phase chart per output mass, peaks and operating points.</summary>
/// <remarks>Present when the model has a 'harmonic' section and loads. The numbers are the object of <c>modalchain harmonic --format json</c>.</remarks>
public sealed class HarmonicSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly ReportContext _context;
    private readonly HarmonicResult _result;
    private readonly ImmutableArray<ChartFigure> _figures;
    private readonly string? _case;

    /// <summary>Most response charts the section draws; results.json always holds every output.</summary>
    public const int MaxCharts = 8;

    /// <summary>The outputs that have a chart, in output order.</summary>
    public ImmutableArray<DofResponse> Charted { get; }

    private HarmonicSection(ReportContext context, HarmonicResult result, string? caseName = null)
    {
        _context = context;
        _result = result;
        _case = caseName;
        var log = context.Document.Harmonic?.Frequencies is FrequencyRange { Spacing: FrequencySpacing.Logarithmic };
        // A chart per output up to a readable number; beyond it, the outputs with the largest peak displacement.
        // Electrical outputs (a flux linkage, not a displacement) are in the electrical table, not charted as motion.
        Charted = [.. result.Responses.Where(r => !context.Document.Network.IsElectrical(r.Dof))
            .Select((r, i) => (r, i, peak: r.Displacement.Max(x => x.Magnitude)))
            .OrderByDescending(p => result.Responses.Length <= MaxCharts ? -p.i : p.peak)
            .Take(MaxCharts)
            .OrderBy(p => p.i)
            .Select(p => p.r)];
        ChartedQuantities = QuantitiesFor(context.Document.Criteria);
        _figures = [.. Charted.SelectMany(r => ChartedQuantities.Select(q => ResponseChart(r, q, log)))];
    }

    /// <summary>The quantities charted per output: displacement always, velocity and acceleration when the criteria use them.</summary>
    public ImmutableArray<ResponseQuantity> ChartedQuantities { get; }

    /// <summary>Displacement, plus velocity when a criterion limits velocity (limits, machine zones, floor curves), plus acceleration when one limits acceleration.</summary>
    public static ImmutableArray<ResponseQuantity> QuantitiesFor(CriteriaSet criteria)
    {
        ArgumentNullException.ThrowIfNull(criteria);
        var limits = criteria.Limits.IsDefault ? [] : criteria.Limits;
        var velocity = limits.Any(l => l.Quantity == ResponseQuantity.Velocity) || !criteria.Zones.IsDefaultOrEmpty || !criteria.Floors.IsDefaultOrEmpty;
        var acceleration = limits.Any(l => l.Quantity == ResponseQuantity.Acceleration);
        var result = ImmutableArray.CreateBuilder<ResponseQuantity>();
        result.Add(ResponseQuantity.Displacement);
        if (velocity) result.Add(ResponseQuantity.Velocity);
        if (acceleration) result.Add(ResponseQuantity.Acceleration);
        return result.ToImmutable();
    }

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>: null when the model asks for no harmonic response.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (context.LoadCases is { } cases) return new HarmonicCaseSection(context, cases, [.. cases.Cases.Select(c => new HarmonicSection(context, c.Result, c.Case.Name))]);
        return context.Harmonic is { } result ? new HarmonicSection(context, result) : null;
    }

    /// <summary>File stem of the chart of <paramref name="quantity"/> of mass <paramref name="dof"/> in load case <paramref name="caseName"/>: "harmonic-CASE-MASS...".</summary>
    public static string FigureName(string caseName, string dof, ResponseQuantity quantity) => FigureName(caseName + "-" + dof, quantity);

    /// <inheritdoc />
    public string Key => "harmonic";

    /// <inheritdoc />
    public string Title => "Harmonic response";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => _figures;

    /// <summary>File stem of the response chart of mass <paramref name="dof"/>.</summary>
    public static string FigureName(string dof) =>
        ReportFigure.Stem("harmonic", dof);

    /// <summary>File stem of the chart of <paramref name="quantity"/> of mass <paramref name="dof"/>: the displacement chart keeps <see cref="FigureName(string)"/>.</summary>
    public static string FigureName(string dof, ResponseQuantity quantity) =>
        quantity == ResponseQuantity.Displacement ? FigureName(dof) : FigureName(dof) + "-" + quantity.ToString().ToLowerInvariant();

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        var f = _result.FrequenciesHz;
        html.Paragraph((_case is null ? "" : $"Load case {_case}: s") + string.Create(Inv,
            $"{(_case is null ? "S" : "")}teady-state response to {string.Join(", ", _result.Loads)} acting together, {f.Length} frequencies from {DisplayUnits.Number(f.Min())} to {DisplayUnits.Number(f.Max())} Hz, ") +
            (_result.Method == HarmonicMethod.Modal
                ? string.Create(Inv, $"by modal superposition of {_result.ModesUsed} modes with residual flexibility.")
                : "by the direct complex solve (K(1 + iη) − ω²M + iωC) X = F at each frequency."));
        foreach (var note in _result.Notes) html.Paragraph(note, "note");
        foreach (var warning in _result.Warnings) html.Paragraph("Warning: " + warning, "note");

        var force = _context.Units.Force;
        var peaks = _result.Peaks();
        var isRotation = Core.Dofs.DofMap.RotationLabels(_context.Document.Network);
        foreach (var rotation in new[] { false, true })
        {
            var rows = _result.Responses.Where(r => isRotation(r.Dof) == rotation && !_context.Document.Network.IsElectrical(r.Dof)).ToArray();
            if (rotation && rows.Length == 0) continue;
            var (du, vu, au) = (_context.Units.Of(ResponseQuantity.Displacement, rotation), _context.Units.Of(ResponseQuantity.Velocity, rotation), _context.Units.Of(ResponseQuantity.Acceleration, rotation));
            html.Table(rotation ? "Largest rotation over the sweep" : "Largest response over the sweep",
                [rotation ? "Rotation DOF" : "Mass", $"{DisplayUnits.Word(ResponseQuantity.Displacement, rotation)} ({du.Symbol} peak)", "at (Hz)",
                 $"{DisplayUnits.Word(ResponseQuantity.Velocity, rotation)} ({vu.Symbol} peak)", "at (Hz)", $"{DisplayUnits.Word(ResponseQuantity.Acceleration, rotation)} ({au.Symbol} peak)", "at (Hz)"],
                rows.Select(r =>
                {
                    ResponsePeak P(ResponseQuantity q) => peaks.First(p => p.Dof == r.Dof && p.Quantity == q);
                    var d = P(ResponseQuantity.Displacement);
                    var v = P(ResponseQuantity.Velocity);
                    var a = P(ResponseQuantity.Acceleration);
                    return (IReadOnlyList<string>)[r.Dof, DisplayUnits.Number(du.From(d.Magnitude)), DisplayUnits.Number(d.FrequencyHz),
                        DisplayUnits.Number(vu.From(v.Magnitude)), DisplayUnits.Number(v.FrequencyHz), DisplayUnits.Number(au.From(a.Magnitude)), DisplayUnits.Number(a.FrequencyHz)];
                }), new HashSet<int> { 1, 2, 3, 4, 5, 6 });
        }
        foreach (var p in peaks.Where(p => p.EdgeWarning is not null))
            html.Paragraph(string.Create(Inv,
                $"{p.Dof}, {HarmonicJson.Name(p.Quantity)}: {p.EdgeWarning} ({(p.IsInterior ? "the peak shown is the largest inside the sweep" : "no peak inside the sweep; the value shown is at its end")})."), "note");

        ElectricalTables.WriteHarmonic(html, _context.Document.Network, _result);
        MountForceTables.WriteHarmonic(html, _result, _context.Units);

        foreach (var op in _result.OperatingPoints)
        {
            var at = op.Response;
            foreach (var rotation in new[] { false, true })
            {
                var rows = at.Responses.Where(r => isRotation(r.Dof) == rotation).ToArray();
                if (rotation && rows.Length == 0) continue;
                var (du, vu, au) = (_context.Units.Of(ResponseQuantity.Displacement, rotation), _context.Units.Of(ResponseQuantity.Velocity, rotation), _context.Units.Of(ResponseQuantity.Acceleration, rotation));
                var (dw, vw, aw) = (DisplayUnits.Word(ResponseQuantity.Displacement, rotation), DisplayUnits.Word(ResponseQuantity.Velocity, rotation), DisplayUnits.Word(ResponseQuantity.Acceleration, rotation));
                html.Table(string.Create(Inv, $"At the running speed {DisplayUnits.Number(op.SpeedHz * 60)} rpm ({DisplayUnits.Number(op.SpeedHz)} Hz): {string.Join(", ", op.Loads)}{(rotation ? ", rotations" : "")}"),
                    [rotation ? "Rotation DOF" : "Mass", $"{dw} ({du.Symbol} peak)", $"{vw} ({vu.Symbol} peak)", $"{vw} ({vu.Symbol} r.m.s.)", $"{aw} ({au.Symbol} peak)", $"Phase of {dw.ToLowerInvariant()} (°)"],
                    rows.Select(r => (IReadOnlyList<string>)
                    [
                        r.Dof,
                        DisplayUnits.Number(du.From(r.At(0, op.SpeedHz, ResponseQuantity.Displacement).Magnitude)),
                        DisplayUnits.Number(vu.From(r.At(0, op.SpeedHz, ResponseQuantity.Velocity).Magnitude)),
                        DisplayUnits.Number(vu.From(r.At(0, op.SpeedHz, ResponseQuantity.Velocity).Magnitude) / Math.Sqrt(2)),
                        DisplayUnits.Number(au.From(r.At(0, op.SpeedHz, ResponseQuantity.Acceleration).Magnitude)),
                        DisplayUnits.Number(HarmonicJson.PhaseDegrees(r.Displacement[0])),
                    ]), new HashSet<int> { 1, 2, 3, 4, 5 });
            }
            if (at.Reactions.Length > 0)
                html.Table("Force into each support at that speed", ["Support", $"Force amplitude ({force.Symbol} peak)", "Phase (°)"],
                    at.Reactions.Select(r => (IReadOnlyList<string>)[r.Support, force.Format(r.Force[0].Magnitude), DisplayUnits.Number(HarmonicJson.PhaseDegrees(r.Force[0]))]),
                    new HashSet<int> { 1, 2 });
        }
        html.Paragraph("Amplitudes are peak (zero-to-peak) values of the steady sinusoid; its r.m.s. value is peak/√2. In each chart the upper panel is the amplitude on a logarithmic axis and the lower panel its phase relative to the loads; dashed grey lines mark the natural frequencies and dash-dot orange lines the running speeds." +
            (ChartedQuantities.Length > 1 ? " Velocity" + (ChartedQuantities.Contains(ResponseQuantity.Acceleration) ? " and acceleration" : "") + " charts are drawn because the model's criteria use them." : ""));
        var motions = _result.Responses.Count(r => !_context.Document.Network.IsElectrical(r.Dof));
        if (Charted.Length < motions)
            html.Paragraph(string.Create(Inv, $"Charts are drawn for the {Charted.Length} of {motions} outputs with the largest peak displacement; results.json holds every output."), "note");
        foreach (var figure in _figures) html.Figure(figure);
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        HarmonicJson.Write(buffer, _context.Document, _result, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    private ChartFigure ResponseChart(DofResponse response, ResponseQuantity quantity, bool logFrequency)
    {
        var rotation = Core.Dofs.DofMap.RotationLabels(_context.Document.Network)(response.Dof);
        var unit = _context.Units.Of(quantity, rotation);
        var (dSym, dScale) = (unit.Symbol, unit.Factor);
        var word = DisplayUnits.Word(quantity, rotation);
        var f = _result.FrequenciesHz;
        var values = Enumerable.Range(0, f.Length).Select(k => response.At(k, f[k], quantity)).ToArray();
        var model = Charts.Create($"Harmonic response of {response.Dof}{(quantity == ResponseQuantity.Displacement ? "" : ": " + word.ToLowerInvariant())}",
            $"{_context.Document.Network.Title}: {(_case is null ? "" : $"load case {_case}, ")}{string.Join(", ", _result.Loads)}");
        Axis frequency = logFrequency ? Charts.Logarithmic(AxisPosition.Bottom, "Frequency (Hz)") : Charts.Linear(AxisPosition.Bottom, "Frequency (Hz)");
        frequency.Minimum = f.Min();
        frequency.Maximum = f.Max();
        model.Axes.Add(frequency);
        var magnitude = Charts.Logarithmic(AxisPosition.Left, $"{word} amplitude ({dSym} peak)");
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

        var amplitude = new LineSeries { Title = $"{word.ToLowerInvariant()} amplitude", YAxisKey = "magnitude" };
        Charts.Style(amplitude, 0);
        var angle = new LineSeries { Title = "phase", YAxisKey = "phase" };
        Charts.Style(angle, 0);
        angle.StrokeThickness = 1.4;
        var order = Enumerable.Range(0, f.Length).OrderBy(k => f[k]).ToArray();
        var smallest = double.MaxValue;
        foreach (var k in order)
        {
            var x = values[k];
            var m = x.Magnitude / dScale;
            if (m > 0) smallest = Math.Min(smallest, m);
            amplitude.Points.Add(new DataPoint(f[k], m > 0 ? m : double.NaN));
            angle.Points.Add(new DataPoint(f[k], HarmonicJson.PhaseDegrees(x)));
        }
        model.Series.Add(amplitude);
        model.Series.Add(angle);
        var curveTop = quantity == ResponseQuantity.Velocity ? AddFloorCurves(model, response.Dof, f.Min(), f.Max(), dScale) : 0;

        // Marker and peak labels are CurveLabels, placed by ChartLabels inside the magnitude panel and clear of each other;
        // the peak's label first, then the running speeds, then the natural frequencies (a label without room is left out).
        var labels = new List<CurveLabel>();
        var markers = new List<CurveLabel>();
        foreach (var op in _result.OperatingPoints)
            markers.Add(Marker(model, op.SpeedHz, string.Create(Inv, $"{DisplayUnits.Number(op.SpeedHz * 60)} rpm"), Palette.Orange, LineStyle.DashDot));
        foreach (var mode in _context.Damped.Modes.Modes.Where(m => !m.IsRigidBody && m.NaturalFrequencyHz >= f.Min() && m.NaturalFrequencyHz <= f.Max()).Take(12))
            markers.Add(Marker(model, mode.NaturalFrequencyHz, string.Create(Inv, $"f{mode.Number} {DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz"), Palette.Grey, LineStyle.Dash));

        var peak = order.MaxBy(k => values[k].Magnitude);
        var top = Math.Max(values[peak].Magnitude / dScale, curveTop);
        if (top > 0)
        {
            // Headroom above the peak for its label; at most six decades shown below it.
            magnitude.Maximum = top * 4;
            magnitude.Minimum = Math.Max(smallest, top * 1e-6) / 1.5;
        }
        var peakPoint = new DataPoint(f[peak], values[peak].Magnitude / dScale);
        model.Annotations.Add(new PointAnnotation
        {
            X = peakPoint.X,
            Y = peakPoint.Y,
            YAxisKey = "magnitude",
            Shape = MarkerType.Diamond,
            Size = 5,
            Fill = OxyColor.Parse(Palette.Vermillion),
        });
        if (peakPoint.Y > 0)
            labels.Add(new CurveLabel(string.Create(Inv, $"peak {DisplayUnits.Number(peakPoint.Y)} {dSym} at {DisplayUnits.Number(f[peak])} Hz"), OxyColor.Parse(Palette.Black))
            {
                YAxisKey = "magnitude",
                Anchors = [peakPoint],
            });
        foreach (var label in labels.Concat(markers)) model.Annotations.Add(label);
        var caption = string.Create(Inv,
            $"{word} amplitude (peak, log scale) and phase of {response.Dof} over the sweep; natural frequencies dashed grey, running speeds dash-dot orange, the largest value marked with a diamond.");
        if (curveTop > 0)
            caption += $" Dashed steps: floor curve {string.Join(", ", _context.Document.Criteria.Floors.Where(c => c.At.Contains(response.Dof)).Select(c => c.Curve.Name))} per one-third-octave band, drawn as the peak of one sinusoid whose r.m.s. value is the band limit (√2 × limit); the check itself is made at the running speeds, band by band.";
        if (_case is not null) caption = $"Load case {_case}: " + caption;
        return new ChartFigure(_case is null ? FigureName(response.Dof, quantity) : FigureName(_case, response.Dof, quantity), caption, model, height: 440);
    }

    /// <summary>
    /// Draws each floor criterion curve at <paramref name="dof"/> as the peak of one sinusoid whose r.m.s. value equals
    /// the band limit (√2 × limit), band by band; returns the largest value drawn (display units), 0 when none.
    /// </summary>
    private double AddFloorCurves(PlotModel model, string dof, double fMin, double fMax, double scale)
    {
        var largest = 0.0;
        var index = 1;
        foreach (var floor in _context.Document.Criteria.Floors.Where(c => c.At.Contains(dof)))
        {
            var series = new LineSeries { Title = $"{floor.Curve.Name}: band limit as one sinusoid's peak (√2 × r.m.s.)", YAxisKey = "magnitude" };
            Charts.Style(series, index++);
            for (var band = ThirdOctaveBands.BandOf(fMin); band <= ThirdOctaveBands.BandOf(fMax); band++)
            {
                if (floor.Curve.LimitInBand(band) is not { } limit)
                {
                    series.Points.Add(DataPoint.Undefined);
                    continue;
                }
                var peak = limit * Math.Sqrt(2) / scale;
                largest = Math.Max(largest, peak);
                series.Points.Add(new DataPoint(Math.Max(fMin, ThirdOctaveBands.LowerEdgeHz(band)), peak));
                series.Points.Add(new DataPoint(Math.Min(fMax, ThirdOctaveBands.UpperEdgeHz(band)), peak));
            }
            model.Series.Add(series);
        }
        return largest;
    }

    /// <summary>Adds a vertical marker line at <paramref name="x"/> to the magnitude panel and returns its label, to be placed beside it.</summary>
    private static CurveLabel Marker(PlotModel model, double x, string text, string colour, LineStyle style)
    {
        model.Annotations.Add(new LineAnnotation
        {
            Type = LineAnnotationType.Vertical,
            X = x,
            YAxisKey = "magnitude",
            Color = OxyColor.Parse(colour),
            LineStyle = style,
            StrokeThickness = 1.2,
        });
        return new CurveLabel(text, OxyColor.Parse(colour == Palette.Grey ? Palette.Black : Palette.Vermillion)) { YAxisKey = "magnitude", AlongX = x, FontSize = 9.5 };
    }
}
