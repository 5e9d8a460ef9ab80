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
    private readonly ModeView _view;
    private readonly ImmutableHashSet<int> _electrical;

    private ModesSection(ReportContext context)
    {
        _context = context;
        _result = context.Modal;
        _complexModes = context.Damped.IsClassical && !context.Damped.HasFirstOrderStates ? [] : ComplexModes.Solve(context.Damped);
        _massChart = MassChart(_result);
        _view = ViewOf(_result.Network);
        _electrical = _result.Network.Space == Core.Model.ModelSpace.Line ? ElectricalNodes(_result.Network) : [];
        if (_view == ModeView.Map)
        {
            _modeFigures = [.. _result.Modes.Select(MapFigure)];
            return;
        }
        if (_view == ModeView.LargestMotions)
        {
            _modeFigures = [.. _result.Modes.Select(LargestMotionsFigure)];
            return;
        }
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

    /// <summary>Line models with more masses than this get shape maps (or bar charts of the largest motions) and tables of the top contributors instead of schematics.</summary>
    public const int LargeModelMasses = 60;

    /// <summary>How many contributors each per-mode table lists (masses by |φ| and by kinetic energy, springs by strain energy).</summary>
    public const int TopContributors = 10;

    /// <summary>How many masses the bar chart of a large model without drawing positions shows.</summary>
    public const int LargestMotionsShown = 20;

    /// <summary>How the section draws the mode shapes of <paramref name="network"/>.</summary>
    /// <remarks>
    /// Plane and 3d models: <see cref="ModeView.Spatial"/>. Line models whose masses all have distinct drawing positions get
    /// <see cref="ModeView.Map"/> when they have more than <see cref="LargeModelMasses"/> masses or their positions form a
    /// plan (at least 9 masses over at least 3 distinct x and 3 distinct y values, as a grid does); other line models with
    /// more than <see cref="LargeModelMasses"/> masses get <see cref="ModeView.LargestMotions"/>; the rest
    /// <see cref="ModeView.Schematic"/>.
    /// </remarks>
    public static ModeView ViewOf(Core.Model.Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space != Core.Model.ModelSpace.Line) return ModeView.Spatial;
        var masses = network.Masses;
        var placed = masses.All(m => m.Position is not null)
            && masses.Select(m => m.Position!.Value).Distinct().Count() == masses.Length;
        if (placed)
        {
            var plan = masses.Length >= 9
                && masses.Select(m => m.Position!.Value.X).Distinct().Count() >= 3
                && masses.Select(m => m.Position!.Value.Y).Distinct().Count() >= 3;
            if (masses.Length > LargeModelMasses || plan) return ModeView.Map;
        }
        return masses.Length > LargeModelMasses ? ModeView.LargestMotions : ModeView.Schematic;
    }

    /// <summary>The indexes of the <paramref name="count"/> largest of <paramref name="keys"/>, largest first (ties: lower index first).</summary>
    public static ImmutableArray<int> Largest(IReadOnlyList<double> keys, int count)
    {
        ArgumentNullException.ThrowIfNull(keys);
        return [.. Enumerable.Range(0, keys.Count).OrderByDescending(i => keys[i]).ThenBy(i => i).Take(count)];
    }

    /// <summary>How the mode shapes are drawn (<see cref="ViewOf"/>).</summary>
    public ModeView View => _view;

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

    /// <summary>
    /// Indexes into the network's masses of its electrical nodes (<see cref="Core.Model.Network.IsElectrical"/>: a
    /// transducer's electrical side, see <see cref="Core.Model.Topology.ElectricalSide"/>, or a circuit's nodes).
    /// Empty for a purely mechanical model.
    /// </summary>
    /// <remarks>
    /// The values of these nodes in a mode shape are flux linkages per unit modal coordinate (V·s), not displacements; a
    /// mode figure draws them at rest and scales the drawing by the mechanical nodes only.
    /// </remarks>
    public static ImmutableHashSet<int> ElectricalNodes(Core.Model.Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.ElectricalNodes.IsEmpty) return [];
        var electrical = Enumerable.Range(0, network.Masses.Length).Where(i => network.IsElectrical(network.Masses[i].Name)).ToArray();
        // A side that takes in every node would leave nothing to scale by: then nothing is set apart.
        return electrical.Length >= network.Masses.Length ? [] : [.. electrical];
    }

    /// <summary>
    /// A shape given at every mass normalised to max |φ| = 1 over the masses not in <paramref name="electrical"/>, and the
    /// index of that largest entry; the electrical entries are divided by the same value.
    /// </summary>
    public static (ImmutableArray<double> Shape, int Reference) NormalisedOverMechanical(ImmutableArray<double> byMass, IReadOnlySet<int> electrical)
    {
        ArgumentNullException.ThrowIfNull(electrical);
        var reference = -1;
        for (var i = 0; i < byMass.Length; i++)
            if (!electrical.Contains(i) && (reference < 0 || Math.Abs(byMass[i]) > Math.Abs(byMass[reference]))) reference = i;
        if (reference < 0) throw new ArgumentException("Every entry is electrical: nothing to scale the drawing by.", nameof(electrical));
        var peak = byMass[reference];
        return peak == 0 ? ([.. byMass], reference) : ([.. byMass.Select(v => v / peak)], reference);
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
        var total = _result.ModeCountAvailable; // the DOFs less those condensed (massless nodes, eliminated terminals are not DOFs)
        var limit = shown < total ? string.Create(Inv, $" (the report shows at most the lowest {_context.Options.MaxModes})") : "";
        html.Paragraph(string.Create(Inv, $"The undamped natural modes (K φ = ω² M φ), lowest first: {shown} of {total} mode{(total == 1 ? "" : "s")}{limit}. ") +
            "f is the undamped natural frequency, T = 1/f the period, ω = 2πf, ζ the modal damping ratio. Shapes are mass-normalised (φᵀMφ = 1); M* is the effective modal mass, " +
            "the part of the total mass that moves with the mode when all supports move together, and Σ M* its running total. " +
            "Dominant masses carry the largest shares of the mode's kinetic energy; the key spring stores the largest share of its " +
            "strain energy, so it is the one whose stiffness moves the mode most." +
            (network.ElectricalNodes.IsEmpty ? "" : " On the electrical side the kinetic energy is the capacitors' electric energy ½Cv² and the strain energy the inductors' magnetic energy ½λ²/L; electrical nodes carry no effective mass."));
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
            html.Table(_context.Damped.HasFirstOrderStates
                    ? "Roots of the damped system (massless nodes with damping are first-order states: the modes above condense them through their springs only)"
                    : "Complex modes of the damped system (the damping is not classical, so the undamped shapes are coupled)",
                ["Mode", "Undamped frequency (Hz)", "Damped frequency (Hz)", "Damping ratio (%)"],
                _complexModes.Take(_context.Damped.HasFirstOrderStates ? _complexModes.Length : _result.Modes.Length).Select(c => (IReadOnlyList<string>)
                    [c.Number.ToString(Inv), DisplayUnits.Number(c.UndampedFrequencyHz), c.Kind switch
                    {
                        ComplexModeKind.RigidBody => "rigid body (zero root)",
                        ComplexModeKind.RigidBodyRelaxation => "rigid-body relaxation, " + DisplayUnits.Number(-c.EigenValue.Real) + " 1/s",
                        ComplexModeKind.Relaxation => "relaxation, τ = " + DisplayUnits.Number(-1 / c.EigenValue.Real) + " s",
                        _ => c.IsOscillatory ? DisplayUnits.Number(c.DampedFrequencyHz) : "overdamped",
                    }, c.IsOscillatory ? DisplayUnits.Percent(c.DampingRatio) : "—"]),
                new HashSet<int> { 0, 1, 2, 3 });
        if (!_complexModes.IsEmpty && Core.Model.Topology.FluxLevelCount(network) is var levels and > 0)
            html.Paragraph(string.Create(Inv, $"{levels} root(s) at 0 are left out: a circuit node group held by no inductor only sets a constant flux level there, not a motion."));
        html.Paragraph(string.Create(Inv,
            $"Quality: largest eigen residual ‖Kφ − ω²Mφ‖/‖Kφ‖ = {_result.Quality.MaxResidual:0.0e+00}; largest M-orthogonality error |ΦᵀMΦ − I| = {_result.Quality.MaxOrthogonalityError:0.0e+00}; solver: {_result.Algorithm}."),
            "quality");
        if (_result.RigidBodyModeCount > 0)
            html.Paragraph(string.Create(Inv, $"{_result.RigidBodyModeCount} rigid-body mode(s) at 0 Hz: part of the network is not held by any spring to a support."), "note");
        foreach (var w in _result.Warnings.Where(w => !_context.Document.Warnings.Any(d => d.Message == w)))
            html.Paragraph("Warning: " + w, "note");
        html.Figure(_massChart);
        html.Heading("Mode shapes");
        html.Paragraph(_view switch
        {
            ModeView.Map => string.Create(Inv, $"Each figure is a plan of the {network.Masses.Length} masses at their drawing positions, each mass a square coloured by its value of the mode shape, normalised so that the largest |φ| is +1: vermillion where the mass moves in the positive direction, blue where it moves against it, pale near a node line. The colour bar gives the value of each step; black squares mark masses held by a spring or damper to a support, and rings the largest positive and negative values. A mode has no absolute amplitude: only the ratios between masses are meaningful. Under each figure, the table lists the top {TopContributors} masses by |φ| and by kinetic-energy share and the top {TopContributors} springs by strain-energy share; every value of every mass is in results.json."),
            ModeView.LargestMotions => string.Create(Inv, $"The model gives no drawing positions, so each figure shows the {LargestMotionsShown} masses that move most in the mode (largest |φ| first, normalised so that the largest is +1), as bars to the right for positive and to the left for negative motion. Under each figure, the table lists the top {TopContributors} masses by |φ| and by kinetic-energy share and the top {TopContributors} springs by strain-energy share; every value of every mass is in results.json."),
            _ => _context.Geometry is null
            ? "Each figure shows the undeformed network (grey, dashed) and the mode shape (blue, solid). Displacements act in the network's single direction of motion and are drawn across the chain so masses do not overlap; the numbers beside the masses are the normalised amplitudes (largest = +1). A mode has no absolute amplitude: only the ratios between masses are meaningful."
            : SpatialModesNote,
        });
        for (var k = 0; k < _modeFigures.Length; k++)
        {
            html.Figure(_modeFigures[k]);
            if (_view is ModeView.Map or ModeView.LargestMotions) ContributorsTable(html, _result.Modes[k]);
        }
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ModesJson.Write(json, _context.Document, _result, _context.Options.ToolVersion, _context.Damped, _complexModes);
    }

    private static string Dominant(IReadOnlyList<string> names, ImmutableArray<double> shares, int count) =>
        string.Join(", ", shares.Select((s, i) => (s, i)).OrderByDescending(p => p.s).Take(count).Where(p => p.s > 0.005)
            .Select(p => $"{names[p.i]} {DisplayUnits.Percent(p.s)} %"));

    private void ContributorsTable(HtmlWriter html, Mode mode)
    {
        var dofs = _result.Matrices.Dofs.Dofs.Select(d => d.ToString()).ToArray();
        var springs = _result.Network.Springs;
        var byMotion = Largest([.. mode.Shape.Select(Math.Abs)], TopContributors);
        var byKinetic = Largest(mode.KineticEnergyShare, TopContributors);
        var strained = mode.IsRigidBody || springs.IsEmpty ? [] : Largest(mode.StrainEnergyShare, TopContributors);
        var peak = mode.Shape.Max(Math.Abs);
        var what = dofs.Length == _result.Network.Masses.Length ? "masses" : "degrees of freedom";
        var springPart = springs.IsEmpty ? "the model has no springs"
            : mode.IsRigidBody ? "no spring is strained in a rigid-body mode"
            : string.Create(Inv, $"top {strained.Length} of {springs.Length} springs by strain-energy share");
        var caption = string.Create(Inv,
            $"Mode {mode.Number} ({DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz): top {byMotion.Length} of {dofs.Length} {what} by |φ| and by kinetic-energy share; {springPart}. Every value is in results.json.");
        var rows = Enumerable.Range(0, Math.Max(byMotion.Length, strained.Length)).Select(r => (IReadOnlyList<string>)
        [
            (r + 1).ToString(Inv),
            r < byMotion.Length ? dofs[byMotion[r]] : "",
            r < byMotion.Length ? NetworkFigure.Signed(mode.Shape[byMotion[r]] / peak) : "",
            r < byKinetic.Length ? dofs[byKinetic[r]] : "",
            r < byKinetic.Length ? DisplayUnits.Percent(mode.KineticEnergyShare[byKinetic[r]]) : "",
            r < strained.Length ? springs[strained[r]].Name : "",
            r < strained.Length ? DisplayUnits.Percent(mode.StrainEnergyShare[strained[r]]) : "",
        ]);
        html.Table(caption, ["Rank", "Largest |φ|", "φ (max |φ| = 1)", "Largest kinetic energy", "Share (%)", "Most strained spring", "Share (%)"],
            rows, new HashSet<int> { 0, 2, 4, 6 }, "contributors-table");
    }

    private static string ModeSubtitle(Mode mode) =>
        string.Create(Inv, $"Period {(mode.IsRigidBody ? "none (rigid-body mode)" : DisplayUnits.Number(mode.PeriodSeconds) + " s")}  ·  ω = {DisplayUnits.Number(mode.AngularFrequency)} rad/s  ·  effective mass {DisplayUnits.Percent(mode.EffectiveMassFraction)} % of total (cumulative {DisplayUnits.Percent(mode.CumulativeEffectiveMassFraction)} %)");

    private static string PeriodText(Mode mode) => mode.IsRigidBody ? "rigid-body mode" : "period " + DisplayUnits.Number(mode.PeriodSeconds) + " s";

    private SchematicFigure MapFigure(Mode mode)
    {
        var network = _result.Network;
        var (shape, reference) = NormalisedOverMechanical(_result.ShapeByMass(mode), _electrical);
        shape = [.. shape.Select((v, i) => _electrical.Contains(i) ? 0 : v)]; // the map shows motion: electrical nodes at 0
        var referenceName = network.Masses[reference].Name;
        var supported = network.Springs.Select(s => (s.NodeA, s.NodeB)).Concat(network.Dampers.Select(d => (d.NodeA, d.NodeB)))
            .SelectMany(e => network.IsSupport(e.NodeA) ? [e.NodeB] : network.IsSupport(e.NodeB) ? new[] { e.NodeA } : [])
            .ToHashSet(StringComparer.Ordinal);
        var usedSupports = network.Springs.SelectMany(s => new[] { s.NodeA, s.NodeB }).Concat(network.Dampers.SelectMany(d => new[] { d.NodeA, d.NodeB }))
            .Where(network.IsSupport).ToHashSet(StringComparer.Ordinal);
        var nodes = network.Masses.Select((m, i) => new MapNode(m.Name, new Point(m.Position!.Value.X, m.Position.Value.Y), shape[i], supported.Contains(m.Name))).ToArray();
        var supports = network.Supports.Where(s => s.Position is not null && usedSupports.Contains(s.Name))
            .Select(s => new Point(s.Position!.Value.X, s.Position.Value.Y)).ToArray();
        string[] header = [ModeTitle(mode), ModeSubtitle(mode)];
        string[] footer =
        [
            $"Plan of the drawing positions (x to the right, y up the page); normalised so that max |φ| = 1 (at {referenceName}).",
            "Black squares: masses held by a spring or damper to a support; rings: the extreme values.",
        ];
        var scene = ShapeMapFigure.Mode(nodes, supports, header, footer);
        scene = scene with { Data = scene.Data.Add("mode", mode.Number.ToString(Inv)).Add("reference-mass", referenceName) };
        var caption = string.Create(Inv,
            $"Mode {mode.Number} at {DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz ({PeriodText(mode)}), effective mass {DisplayUnits.Percent(mode.EffectiveMassFraction)} %: the shape as a colour map over the {nodes.Length} masses' drawing positions, normalised to +1 at {referenceName}.");
        return new SchematicFigure(FigureName(mode.Number), caption, "mode", scene, animated: false);
    }

    private SchematicFigure LargestMotionsFigure(Mode mode)
    {
        var network = _result.Network;
        var (shape, reference) = NormalisedOverMechanical(_result.ShapeByMass(mode), _electrical);
        var largest = Largest([.. shape.Select((v, i) => _electrical.Contains(i) ? -1 : Math.Abs(v))], LargestMotionsShown).Where(i => !_electrical.Contains(i)).Select(i => (network.Masses[i].Name, shape[i])).ToArray();
        string[] header =
        [
            ModeTitle(mode),
            string.Create(Inv, $"The {largest.Length} largest motions of {network.Masses.Length} masses, normalised so that max |φ| = 1 (at {network.Masses[reference].Name})"),
        ];
        string[] footer = [ModeSubtitle(mode), "The model gives no drawing positions ('at' or a 'repeat' spacing), so the shape is not drawn as a map."];
        var scene = Drawing.LargestMotionsFigure.Mode(largest, header, footer);
        scene = scene with { Data = scene.Data.Add("mode", mode.Number.ToString(Inv)) };
        var caption = string.Create(Inv,
            $"Mode {mode.Number} at {DisplayUnits.Number(mode.NaturalFrequencyHz)} Hz ({PeriodText(mode)}), effective mass {DisplayUnits.Percent(mode.EffectiveMassFraction)} %: the {largest.Length} masses that move most, of {network.Masses.Length}.");
        return new SchematicFigure(FigureName(mode.Number), caption, "mode", scene, animated: false);
    }

    private SchematicFigure ModeFigure(Mode mode, NetworkLayout layout, double scale, bool animate)
    {
        // The drawing has every mass; linked masses share their DOF's value. The electrical nodes of a transducer model are
        // drawn at rest and left out of the scale (their values are flux linkages).
        var (shape, reference) = NormalisedOverMechanical(_result.ShapeByMass(mode), _electrical);
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
        if (!_electrical.IsEmpty)
            footer =
            [
                .. footer,
                $"Electrical nodes, drawn at rest and left out of the scale: {string.Join(", ", _electrical.Order().Select(i => layout.Masses[i].Name))}.",
                "Their values (grey) are flux linkages in V·s on the same normalisation, not displacements.",
            ];
        var overlay = new ModeOverlay(shape, referenceName, scale, animate ? 25 : 1) { AtRest = _electrical };
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
        });
        // Named by the label placer like every chart label: beside the line, clear of the bars, markers and legend.
        var lineAnchors = new[] { modes.Length + 0.6, 0.4 + 0.5 * modes.Length, 0.4 }.Select(x => new DataPoint(x, 90)).ToList();
        model.Annotations.Add(new CurveLabel("90 % cumulative", OxyColor.Parse(Palette.Black)) { Anchors = lineAnchors });
        model.Legends.Add(new OxyPlot.Legends.Legend { LegendPosition = OxyPlot.Legends.LegendPosition.RightMiddle, LegendPlacement = OxyPlot.Legends.LegendPlacement.Inside, LegendBackground = OxyColor.FromAColor(220, OxyColors.White) });
        return new ChartFigure("effective-mass", "Effective modal mass of each mode (bars) and cumulative share (squares, dashed), in % of the total mass; the thin dashed black line is the 90 % cumulative share that seismic codes ask modal analyses to reach (ASCE 7-16 §12.9.1.1, EN 1998-1 §4.3.3.3.1), shown as a guide to how many modes describe the response.", model, height: 340);
    }
}

/// <summary>How the modes section draws mode shapes.</summary>
public enum ModeView
{
    /// <summary>The network schematic with the shape drawn across the chain (small line models).</summary>
    Schematic,

    /// <summary>Plane and 3d models drawn to scale from their locations.</summary>
    Spatial,

    /// <summary>A colour map of the shape over the masses' drawing positions (large or plan-laid-out line models).</summary>
    Map,

    /// <summary>Bars of the masses that move most (large line models without drawing positions).</summary>
    LargestMotions,
}
