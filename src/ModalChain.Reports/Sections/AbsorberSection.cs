using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;
using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace ModalChain.Reports.Sections;

/// <summary>What absorber the report should size: the request of <c>modalchain tune</c> and whether to refine it numerically.</summary>
/// <param name="Request">Host, mass ratio, mode and target; already free of <see cref="AbsorberTuning.Problems"/>.</param>
/// <param name="Optimal">True for the numerical optimum on the full model, false for the closed form.</param>
public sealed record AbsorberReportRequest(AbsorberRequest Request, bool Optimal);

/// <summary>A tuned vibration absorber: its design, its effect on the host and its sensitivity to mistuning.</summary>
/// <remarks>
/// Present when <see cref="ReportOptions.Absorber"/> is set. The numbers come from <see cref="AbsorberStudy.Run"/>, the path
/// <c>modalchain tune</c> takes, and results.json holds exactly the object of <c>tune --format json</c>. The chart is the
/// host's dynamic amplification |x_host|·K/|F| (K = M ω_p² of the controlled mode) for a harmonic force at the host,
/// without and with the absorber, over the band the peaks are searched in.
/// </remarks>
public sealed class AbsorberSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Points of the response chart; an even count keeps the undamped resonance f_p itself off the grid.</summary>
    public const int ChartPoints = 400;

    private readonly ReportContext _context;
    private readonly ChartFigure _figure;

    private AbsorberSection(ReportContext context, TunedAbsorber tuned)
    {
        _context = context;
        Tuned = tuned;
        _figure = Chart();
    }

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>: null when no absorber was asked for.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (context.Options.Absorber is not { } asked) return null;
        // The same modal solve as modalchain tune, so that results.json repeats its numbers exactly.
        var modal = ModalAnalysis.Solve(context.Document.Network);
        var tuned = AbsorberStudy.Run(context.Document.Structure, modal, asked.Request, asked.Optimal, OperatingLoads.Of(context.Document), context.Document.Cases);
        return new AbsorberSection(context, tuned);
    }

    /// <summary>Name of the response figure.</summary>
    public const string FigureName = "absorber-response";

    /// <summary>The absorber sized and assessed.</summary>
    public TunedAbsorber Tuned { get; }

    /// <inheritdoc />
    public string Key => "absorber";

    /// <inheritdoc />
    public string Title => "Tuned vibration absorber";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [_figure];

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        var d = Tuned.Design;
        var a = Tuned.Assessment;
        var u = _context.Units;
        var target = d.Target switch
        {
            AbsorberTarget.Force => "harmonic force on the structure (Den Hartog 1956, fixed points)",
            AbsorberTarget.BaseAcceleration => "harmonic base acceleration (Warburton 1982)",
            AbsorberTarget.RunningSpeed => "harmonic force at the running speeds",
            _ => "white-noise force (Warburton 1982)",
        };
        html.Facts(
        [
            ("Mode controlled", string.Create(Inv, $"{d.ModeNumber} at {DisplayUnits.Number(d.ModeFrequencyHz)} Hz ({d.ChosenBy})")),
            ("Host", d.Host),
            ("Modal mass at the host (1/φ²)", $"{u.Mass(d.ModalMass)} {u.MassSymbol}"),
            ("Mass ratio μ", DisplayUnits.Percent(d.Optimum.MassRatio) + " %"),
            ("Tuned for", target),
            ("Method used", $"{Tuned.Method}: {Tuned.MethodDescription}"),
        ]);
        html.Table("Absorber design", ["Quantity", "Value"],
        [
            ["Mass", $"{u.Mass(d.Mass)} {u.MassSymbol}"],
            ["Stiffness", $"{u.Stiffness(d.Stiffness)} {u.StiffnessSymbol}"],
            ["Damping coefficient", $"{u.Damping(d.Damping)} {u.DampingSymbol}"],
            ["Tuned frequency", string.Create(Inv, $"{DisplayUnits.Number(d.FrequencyHz)} Hz (ratio to the mode {d.FrequencyHz / d.ModeFrequencyHz:F6})")],
            ["Damping ratio ζ_a = c/(2√(k·m)), the absorber's own", d.DampingRatio.ToString("F6", Inv)],
            ["The same damper referred to the mode's frequency, c/(2·m·ω_p)", d.DampingRatioPrimaryReferenced.ToString("F6", Inv)],
        ], new HashSet<int> { 1 }, "absorber-design");
        html.Paragraph("Peaks are the host's dynamic amplification |x_host|·K/|F| for a harmonic force at the host, K = modal mass × ω_p² " +
            string.Create(Inv, $"(the static deflection of the mode's equivalent spring), on the full model (all modes, the model's damping), band {DisplayUnits.Number(a.BandHz.Low)}–{DisplayUnits.Number(a.BandHz.High)} Hz."), "note");
        var rows = new List<IReadOnlyList<string>>
        {
            new[] { "Peak before", Peak(a.PeakBefore) },
            new[] { "Peak after", string.Create(Inv, $"{Peak(a.PeakAfter)} at {DisplayUnits.Number(a.PeakFrequencyHz)} Hz (mode {a.PeakAfterMode})") },
        };
        foreach (var n in a.Neighbours)
            rows.Add([string.Create(Inv, $"Neighbouring mode {n.ModeNumber} ({DisplayUnits.Number(n.FrequencyHz)} Hz), not controlled"), $"peak {Peak(n.PeakBefore)} before, {Peak(n.PeakAfter)} after"]);
        foreach (var sp in a.AtSpeeds)
            rows.Add([string.Create(Inv, $"At the excitation {DisplayUnits.Number(sp.FrequencyHz)} Hz (running speed × order)"), $"{Peak(sp.Before)} before, {Peak(sp.After)} after"]);
        if (d.Target == AbsorberTarget.Force)
            rows.Add(["Fixed-point value √(1 + 2/μ) (undamped single-mode primary)", d.Optimum.PeakAmplification.ToString("F4", Inv)]);
        rows.Add([$"Absorber stroke per unit force at the host ({u.Compliance.Symbol}), at the worst frequency", $"{u.Compliance.Format(a.StrokePerForce)} {u.Compliance.Symbol}"]);
        rows.Add(["Absorber stroke in operation", double.IsFinite(a.OperatingStroke)
            ? $"{u.Displacement.Format(a.OperatingStroke)} {u.Displacement.Symbol} peak {a.OperatingStrokeBasis}"
            : "not computed: no load of the model has a running speed"]);
        if (Tuned.Improvement is { } improvement) rows.Add(["Optimal tuning", improvement]);
        html.Table("Effect on the host", ["Quantity", "Value"], rows, new HashSet<int>(), "absorber-effect");
        html.Table("Mistuning (absorber frequency off, same mass and damping ratio)", ["Frequency error", "Absorber (Hz)", "Peak after", "vs tuned"],
            a.Mistuning.Select(p => (IReadOnlyList<string>)
            [
                string.Create(Inv, $"{p.FrequencyError * 100:+0;−0} %"), DisplayUnits.Number(d.FrequencyHz * (1 + p.FrequencyError)), Peak(p.Peak),
                string.Create(Inv, $"{100 * (p.Peak / a.PeakAfter - 1):+0.0;−0.0} %"),
            ]), new HashSet<int> { 0, 1, 2, 3 }, "absorber-mistuning");
        foreach (var warning in Tuned.Warnings) html.Paragraph("Warning: " + warning + ".", "note");
        html.Figure(_figure);
        html.Paragraph("With the absorber, two modes sit either side of the controlled frequency: judge the fix by the vibration limits, not by separation.", "note");
        if (asLarge(d)) html.Paragraph(string.Create(Inv, $"A mass ratio above {AbsorberTuning.LargeMassRatio * 100:G3} % stretches the single-mode approximation; check the result on the full model."), "note");
        html.Paragraph("Absorber caution: " + AbsorberCaution.Text, "caution");

        static bool asLarge(AbsorberDesign design) => design.Optimum.MassRatio > AbsorberTuning.LargeMassRatio;
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        TuneJson.Write(buffer, _context.Document, Tuned, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    private static string Peak(double value) =>
        double.IsNaN(value) ? "none in the band" : double.IsFinite(value) ? value.ToString("F4", Inv) : "unbounded (no damping acts on that resonance)";

    private ChartFigure Chart()
    {
        var d = Tuned.Design;
        var (lo, hi) = Tuned.Assessment.BandHz;
        var frequencies = Enumerable.Range(0, ChartPoints).Select(k => lo + (hi - lo) * k / (ChartPoints - 1)).ToArray();
        var structure = _context.Document.Structure;
        var model = Charts.Create($"Host response with and without the absorber: {d.Host}", $"{_context.Document.Network.Title}: harmonic force at {d.Host}, mode {d.ModeNumber}");
        model.Axes.Add(Charts.Linear(AxisPosition.Bottom, "Frequency (Hz)", lo, hi));
        var amplification = Charts.Logarithmic(AxisPosition.Left, "Dynamic amplification |x·K/F| (–)");
        model.Axes.Add(amplification);
        var with = Amplification(AbsorberPerformance.With(structure, d, Tuned.Names), d, frequencies);
        var without = Amplification(structure, d, frequencies);
        var withTop = Finite(with).DefaultIfEmpty(double.NaN).Max();
        // An undamped primary's curve rises without bound near f_p: cap the axis so the absorber's two peaks stay readable.
        if (double.IsFinite(withTop) && Finite(without).DefaultIfEmpty(0).Max() > 30 * withTop) amplification.Maximum = 30 * withTop;
        var ceiling = double.IsFinite(amplification.Maximum) ? amplification.Maximum : double.PositiveInfinity;
        var labels = new List<CurveLabel>();
        foreach (var (title, values, index) in new[] { ("without absorber", without, 1), ("with absorber", with, 0) })
        {
            var line = new LineSeries { Title = title };
            Charts.Style(line, index);
            for (var i = 0; i < frequencies.Length; i++)
                line.Points.Add(new DataPoint(frequencies[i], double.IsFinite(values[i]) && values[i] > 0 ? values[i] : double.NaN));
            model.Series.Add(line);
            // Each curve is named beside it (OxyPlot's SVG export drew only the first entry of a legend): the absorber's curve
            // preferably at its highest point, the bare structure's where its rising flank passes twice that height (or at
            // its highest point); ChartLabels moves a label along its curve where that place has no room.
            var drawn = line.Points.Where(p => double.IsFinite(p.Y) && p.Y <= ceiling).ToList();
            if (drawn.Count == 0) continue;
            var at = index == 1 && double.IsFinite(withTop) && drawn.FirstOrDefault(p => p.Y >= 2 * withTop) is { } flank && flank.IsDefined() && flank.Y >= 2 * withTop
                ? flank
                : drawn.MaxBy(p => p.Y);
            var start = drawn.IndexOf(at);
            labels.Add(new CurveLabel(title, line.Color)
            {
                Anchors = [.. drawn.Select((p, i) => (p, i)).Where(q => q.i % 3 == 0 || q.i == start).OrderBy(q => Math.Abs(q.i - start)).Select(q => q.p)],
            });
        }
        foreach (var (speedHz, text) in SpeedMarkers(lo, hi))
        {
            model.Annotations.Add(new OxyPlot.Annotations.LineAnnotation
            {
                Type = OxyPlot.Annotations.LineAnnotationType.Vertical,
                X = speedHz,
                Color = OxyColor.Parse(Palette.Orange),
                LineStyle = LineStyle.DashDot,
                StrokeThickness = 1.2,
            });
            labels.Add(new CurveLabel(text, OxyColor.Parse(Palette.Black)) { AlongX = speedHz });
        }
        foreach (var label in labels) model.Annotations.Add(label);
        var caption = string.Create(Inv,
            $"Dynamic amplification of {d.Host} for a harmonic force there, without the absorber (dashed) and with it (solid); mode {d.ModeNumber} at {DisplayUnits.Number(d.ModeFrequencyHz)} Hz, absorber tuned to {DisplayUnits.Number(d.FrequencyHz)} Hz.");
        if (model.Annotations.OfType<OxyPlot.Annotations.LineAnnotation>().Any()) caption += " Running speeds (× order) in the band: dash-dot orange.";
        return new ChartFigure(FigureName, caption, model);
    }

    /// <summary>
    /// The excitation frequencies of the design inside the chart's band, each with its label: "running speed 24.67 Hz (1480 rpm)",
    /// or "2 × running speed 49 Hz (2 × 1470 rpm)" for a higher order of criteria.separation.
    /// </summary>
    private IEnumerable<(double FrequencyHz, string Text)> SpeedMarkers(double lo, double hi)
    {
        var named = new List<(double FrequencyHz, double Order)>();
        if (_context.Document.Criteria.Separation is { } separation)
            named.AddRange(separation.Excitations().Select(e => (e.FrequencyHz, e.Order)));
        foreach (var excitation in Tuned.Design.ExcitationsHz.Where(f => f >= lo && f <= hi).Distinct().Order())
        {
            var order = named.Where(n => Math.Abs(n.FrequencyHz - excitation) <= 1e-9 * excitation).Select(n => n.Order).DefaultIfEmpty(1).Min();
            var hz = DisplayUnits.Number(excitation);
            var rpm = (excitation / order * 60).ToString("0.#", Inv);
            yield return (excitation, order == 1 ? $"running speed {hz} Hz ({rpm} rpm)" : string.Create(Inv, $"{order:G6} × running speed {hz} Hz ({order:G6} × {rpm} rpm)"));
        }
    }

    private static IEnumerable<double> Finite(double[] values) => values.Where(v => double.IsFinite(v) && v > 0);

    private static double[] Amplification(StructuralModel model, AbsorberDesign design, double[] frequencies)
    {
        try
        {
            // NaN where the response is unbounded (an undamped resonance on the grid): that point is left out of the curve.
            return AbsorberPerformance.HostAmplification(model, design, frequencies);
        }
        catch (ModalChain.Core.NumericalFailureException)
        {
            return [.. frequencies.Select(_ => double.NaN)];
        }
    }
}
