using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Modal;
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

/// <summary>Natural frequencies, the modes table, effective-mass chart and one drawing per mode shape.</summary>
public sealed class ModesSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly ReportContext _context;
    private readonly ModalResult _result;
    private readonly ChartFigure _massChart;
    private readonly ImmutableArray<SchematicFigure> _modeFigures;
    private readonly ImmutableArray<ComplexMode> _complexModes;

    private ModesSection(ReportContext context)
    {
        _context = context;
        _result = context.Modal;
        _complexModes = context.Damped.IsClassical ? [] : ComplexModes.Solve(context.Damped);
        _massChart = MassChart(_result);
        if (context.Geometry is { } geometry)
        {
            var animateSpatial = geometry.Nodes.Length <= context.Options.MaxAnimatedMasses;
            _modeFigures = [.. _result.Modes.Select(mode => SpatialModeFigure(mode, geometry, animateSpatial))];
            return;
        }
        var layout = context.Layout;
        var scale = NetworkFigure.NiceShapeScale(layout);
        var animate = layout.Masses.Length <= context.Options.MaxAnimatedMasses;
        _modeFigures = [.. _result.Modes.Select(mode => ModeFigure(mode, layout, scale, animate))];
    }

    /// <summary>The modes the section shows (the lowest <see cref="ReportOptions.MaxModes"/>).</summary>
    public ModalResult Result => _result;

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>; every model has this section.</summary>
    public static IReportSection? Create(ReportContext context) => new ModesSection(context);

    /// <inheritdoc />
    public string Key => "modes";

    /// <inheritdoc />
    public string Title => "Natural frequencies and mode shapes";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [_massChart, .. _modeFigures];

    /// <summary>File stem of the figure of mode <paramref name="number"/> ("mode-01").</summary>
    public static string FigureName(int number) => "mode-" + number.ToString("00", Inv);

    /// <summary>The mode shape normalised to max |φ| = 1 (the largest-magnitude entry, positive by the solver's sign rule) and that entry's index.</summary>
    public static (ImmutableArray<double> Shape, int Reference) Normalised(Mode mode)
    {
        ArgumentNullException.ThrowIfNull(mode);
        var reference = 0;
        for (var i = 1; i < mode.Shape.Length; i++)
            if (Math.Abs(mode.Shape[i]) > Math.Abs(mode.Shape[reference])) reference = i;
        var peak = mode.Shape[reference];
        return ([.. mode.Shape.Select(v => v / peak)], reference);
    }

    /// <summary>"Mode 2: 12.34 Hz", the title line of a mode figure.</summary>
    public static string ModeTitle(Mode mode) =>
        string.Create(Inv, $"Mode {mode.Number}: {DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz") + (mode.IsRigidBody ? " (rigid-body mode)" : "");

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        var u = _context.Units;
        var network = _result.Network;
        var dofs = _result.Matrices.Dofs.Dofs.Select(d => d.ToString()).ToArray();
        var shown = _result.Modes.Length;
        var total = _context.Geometry is null ? network.Masses.Length : _result.Matrices.Dofs.Count;
        var limit = shown < total ? string.Create(Inv, $" (the report shows at most the lowest {_context.Options.MaxModes})") : "";
        html.Paragraph(string.Create(Inv, $"The undamped natural modes (K φ = ω² M φ), lowest first: {shown} of {total} mode{(total == 1 ? "" : "s")}{limit}. ") +
            "f is the undamped natural frequency, T = 1/f the period, ω = 2πf, ζ the modal damping ratio. Shapes are mass-normalised (φᵀMφ = 1); M* is the effective modal mass, " +
            "the part of the total mass that moves with the mode when all supports move together, and Σ M* its running total. " +
            "Dominant masses carry the largest shares of the mode's kinetic energy; the key spring stores the largest share of its " +
            "strain energy, so it is the one whose stiffness moves the mode most.");
        var rows = _result.Modes.Select(m => (IReadOnlyList<string>)
        [
            m.Number.ToString(Inv),
            DisplayUnits.Number(m.NaturalFrequencyHz),
            m.IsRigidBody ? "rigid body" : DisplayUnits.Number(m.PeriodSeconds),
            DisplayUnits.Number(m.AngularFrequency),
            m.IsRigidBody ? "—" : DisplayUnits.Percent(ModesJson.DampingRatioOf(_context.Damped, m)),
            u.Mass(m.EffectiveModalMass),
            DisplayUnits.Percent(m.EffectiveMassFraction),
            DisplayUnits.Percent(m.CumulativeEffectiveMassFraction),
            Dominant(dofs, m.KineticEnergyShare, 2),
            m.IsRigidBody || network.Springs.Length == 0 ? "—" : Dominant([.. network.Springs.Select(s => s.Name)], m.StrainEnergyShare, 1),
        ]);
        html.Table("Natural modes",
            ["Mode", "f (Hz)", "T (s)", "ω (rad/s)", "ζ (%)", $"M* ({u.MassSymbol})", "M* (%)", "Σ M* (%)", "Dominant masses", "Key spring"],
            rows, new HashSet<int> { 0, 1, 2, 3, 4, 5, 6, 7 }, "modes-table");
        if (!_complexModes.IsEmpty)
            html.Table("Complex modes of the damped system (the damping is not classical, so the undamped shapes are coupled)",
                ["Mode", "Undamped frequency (Hz)", "Damped frequency (Hz)", "Damping ratio (%)"],
                _complexModes.Take(_result.Modes.Length).Select(c => (IReadOnlyList<string>)
                    [c.Number.ToString(Inv), DisplayUnits.Number(c.UndampedFrequencyHz), c.Kind switch
                    {
                        ComplexModeKind.RigidBody => "rigid body (zero root)",
                        ComplexModeKind.RigidBodyRelaxation => "rigid-body relaxation, " + DisplayUnits.Number(-c.EigenValue.Real) + " 1/s",
                        _ => c.IsOscillatory ? DisplayUnits.Number(c.DampedFrequencyHz) : "overdamped",
                    }, c.IsOscillatory ? DisplayUnits.Percent(c.DampingRatio) : "—"]),
                new HashSet<int> { 0, 1, 2, 3 });
        html.Paragraph(string.Create(Inv,
            $"Quality: largest eigen residual ‖Kφ − ω²Mφ‖/‖Kφ‖ = {_result.Quality.MaxResidual:0.0e+00}; largest M-orthogonality error |ΦᵀMΦ − I| = {_result.Quality.MaxOrthogonalityError:0.0e+00}; solver: {_result.Algorithm}."),
            "quality");
        if (_result.RigidBodyModeCount > 0)
            html.Paragraph(string.Create(Inv, $"{_result.RigidBodyModeCount} rigid-body mode(s) at 0 Hz: part of the network is not held by any spring to a support."), "note");
        foreach (var w in _result.Warnings.Where(w => !_context.Document.Warnings.Any(d => d.Message == w)))
            html.Paragraph("Warning: " + w, "note");
        html.Figure(_massChart);
        html.Heading("Mode shapes");
        html.Paragraph(_context.Geometry is null
            ? "Each figure shows the undeformed network (grey, dashed) and the mode shape (blue, solid). Displacements act in the network's single direction of motion and are drawn across the chain so masses do not overlap; the numbers beside the masses are the normalised amplitudes (largest = +1). A mode has no absolute amplitude: only the ratios between masses are meaningful."
            : SpatialModesNote);
        foreach (var figure in _modeFigures) html.Figure(figure);
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        json.WriteStartObject();
        ModesJson.WriteBody(json, _context.Document, _result, _context.Options.ToolVersion, _context.Damped, _complexModes);
        json.WriteEndObject();
    }

    private static string Dominant(IReadOnlyList<string> names, ImmutableArray<double> shares, int count) =>
        string.Join(", ", shares.Select((s, i) => (s, i)).OrderByDescending(p => p.s).Take(count).Where(p => p.s > 0.005)
            .Select(p => $"{names[p.i]} {DisplayUnits.Percent(p.s)} %"));

    private SchematicFigure ModeFigure(Mode mode, NetworkLayout layout, double scale, bool animate)
    {
        // The drawing has every mass; linked masses share their DOF's value.
        var (shape, reference) = Normalised(mode with { Shape = _result.ShapeByMass(mode) });
        var referenceName = layout.Masses[reference].Name;
        var header = new[]
        {
            ModeTitle(mode),
            string.Create(Inv, $"Period {(mode.IsRigidBody ? "none (rigid-body mode)" : DisplayUnits.Number(mode.PeriodSeconds) + " s")}  ·  ω = {DisplayUnits.Number(mode.AngularFrequency)} rad/s  ·  effective mass {DisplayUnits.Percent(mode.EffectiveMassFraction)} % of total (cumulative {DisplayUnits.Percent(mode.CumulativeEffectiveMassFraction)} %)"),
        };
        var direction = layout.Axis == ChainAxis.Vertical ? "positive to the right" : "positive upwards";
        var footer = new[]
        {
            string.Create(Inv, $"Shape scale: normalised so that max |φ| = 1 (at {referenceName}); 1 is drawn as {ScaleText(scale)} m of the drawing."),
            $"Displacements act in the network's direction of motion and are drawn across the chain, {direction}.",
        };
        var overlay = new ModeOverlay(shape, referenceName, scale, animate ? 25 : 1);
        var scene = NetworkFigure.Mode(layout, overlay, header, footer);
        var caption = string.Create(Inv,
            $"Mode {mode.Number} at {DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz ({(mode.IsRigidBody ? "rigid-body mode" : "period " + DisplayUnits.Number(mode.PeriodSeconds) + " s")}), effective mass {DisplayUnits.Percent(mode.EffectiveMassFraction)} %. Shape normalised to +1 at {referenceName}.");
        return new SchematicFigure(FigureName(mode.Number), caption, "mode", scene, animate);
    }

    /// <summary>What the mode figures of a plane or 3d model show, said once above them.</summary>
    public const string SpatialModesNote =
        "Each figure shows the model to scale from its locations, undeformed (grey, dashed) and in the mode shape (blue, solid), in a side view (x to the right, z up) and, for 3d models, a plan view (x to the right, y up the page) on the same scale. " +
        "Bodies are drawn as boxes that move rigidly (each corner by u = u_c + θ × (p − c)), point masses as squares, mounts between their attachment points and supports as hatched anchors. " +
        "The motion is magnified so that the point that moves most is displaced by a stated fraction of the model's size; a mode has no absolute amplitude.";

    private SchematicFigure SpatialModeFigure(Mode mode, SpatialGeometry geometry, bool animate)
    {
        var dofs = _result.Matrices.Dofs;
        var motion = new ShapeMotion(mode.Shape, (node, direction) => dofs.IndexOf(node, direction));
        const double fraction = 0.12;
        var scale = SpatialFigure.Scale(geometry, motion, fraction);
        var header = new[]
        {
            ModeTitle(mode),
            (mode.Motion is { } motionName ? Capitalised(motionName) + string.Create(Inv, $" (decoupling {mode.Decoupling:0.00})  ·  ") : "")
                + string.Create(Inv, $"Period {(mode.IsRigidBody ? "none (rigid-body mode)" : DisplayUnits.Number(mode.PeriodSeconds) + " s")}  ·  ω = {DisplayUnits.Number(mode.AngularFrequency)} rad/s"),
        };
        string[] footer =
        [
            scale.Factor > 0
                ? string.Create(Inv, $"Magnified: the largest motion (at {scale.At}) is drawn as {DisplayUnits.Number(fraction * geometry.Size)} m, {fraction * 100:0} % of the model's size ({DisplayUnits.Number(geometry.Size)} m).")
                : "No drawn point moves in this mode.",
            .. BoxNote(geometry) is { Length: > 0 } note ? [note] : Array.Empty<string>(),
        ];
        var scene = SpatialFigure.Mode(geometry, new SpatialOverlay(motion, fraction, animate ? 25 : 1), header, footer);
        scene = scene with { Data = scene.Data.Add("mode", mode.Number.ToString(Inv)).Add("omega-rad-s", mode.AngularFrequency.ToString("R", Inv)) };
        var caption = string.Create(Inv,
            $"Mode {mode.Number} at {DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz ({(mode.IsRigidBody ? "rigid-body mode" : "period " + DisplayUnits.Number(mode.PeriodSeconds) + " s")}), side{(geometry.Space == Core.Model.ModelSpace.ThreeD ? " and plan views" : " view")}, magnified so the largest motion is {fraction * 100:0} % of the model's size.");
        return new SchematicFigure(FigureName(mode.Number), caption, "mode", scene, animate);
    }

    private static string Capitalised(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];

    /// <summary>How the figures size the bodies' boxes, or an empty string when the model has no body.</summary>
    public static string BoxNote(SpatialGeometry geometry)
    {
        ArgumentNullException.ThrowIfNull(geometry);
        var boxes = geometry.Nodes.Where(n => n.Box is not null).Select(n => n.Box!.Source).Distinct().ToList();
        return boxes.Count switch
        {
            0 => "",
            _ when boxes.All(b => b == BoxSource.Inertia) => "Bodies are drawn as the homogeneous box with their mass and inertia.",
            _ when boxes.All(b => b == BoxSource.Points) => "Bodies are drawn as the box around the centre of mass that reaches their farthest points.",
            _ => "Bodies are drawn as the homogeneous box with their mass and inertia where the inertia is diagonal, otherwise as the box reaching their farthest points.",
        };
    }

    /// <summary>The shape scale as the figure states it (shortest round-trip form, e.g. "2.5").</summary>
    public static string ScaleText(double scale) => scale.ToString("R", Inv);

    private static ChartFigure MassChart(ModalResult result)
    {
        var model = Charts.Create("Effective modal mass by mode", result.Network.Title);
        var modes = result.Modes;
        var modeAxis = Charts.Linear(AxisPosition.Bottom, "Mode number (–)", 0.4, modes.Length + 0.6);
        modeAxis.MajorStep = Math.Max(1, Math.Ceiling(modes.Length / 12.0));
        modeAxis.MinorStep = 1;
        model.Axes.Add(modeAxis);
        model.Axes.Add(Charts.Linear(AxisPosition.Left, "Effective modal mass (% of total)", 0, 105));
        var bars = new LinearBarSeries
        {
            Title = "effective mass of the mode",
            FillColor = OxyColor.FromAColor(110, OxyColor.Parse(Palette.SkyBlue)),
            StrokeColor = OxyColor.Parse(Palette.Blue),
            StrokeThickness = 1,
            BarWidth = Math.Max(2, 300.0 / Math.Max(1, modes.Length)),
        };
        foreach (var m in modes) bars.Points.Add(new DataPoint(m.Number, 100 * m.EffectiveMassFraction));
        model.Series.Add(bars);
        var cumulative = new LineSeries { Title = "cumulative", MarkerType = MarkerType.Square, MarkerSize = 3 };
        Charts.Style(cumulative, 1);
        cumulative.MarkerFill = cumulative.Color;
        foreach (var m in modes) cumulative.Points.Add(new DataPoint(m.Number, 100 * m.CumulativeEffectiveMassFraction));
        model.Series.Add(cumulative);
        model.Annotations.Add(new LineAnnotation
        {
            Type = LineAnnotationType.Horizontal,
            Y = 90,
            Color = OxyColor.Parse(Palette.Black),
            LineStyle = LineStyle.Dash,
            StrokeThickness = 1.0,
            Text = "90 % cumulative",
            TextColor = OxyColor.Parse(Palette.Black),
        });
        model.Legends.Add(new OxyPlot.Legends.Legend { LegendPosition = OxyPlot.Legends.LegendPosition.RightMiddle, LegendPlacement = OxyPlot.Legends.LegendPlacement.Inside, LegendBackground = OxyColor.FromAColor(220, OxyColors.White) });
        return new ChartFigure("effective-mass", "Effective modal mass of each mode (bars) and cumulative share (squares, dashed), in % of the total mass; the thin dashed black line is the 90 % cumulative share that seismic codes ask modal analyses to reach (ASCE 7-16 §12.9.1.1, EN 1998-1 §4.3.3.3.1), shown as a guide to how many modes describe the response.", model, height: 340);
    }
}
