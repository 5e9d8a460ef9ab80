using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>The model as read: masses, springs, dampers, supports, total mass and the drawing of the network.</summary>
public sealed class ModelSummarySection : IReportSection
{
    private readonly ReportContext _context;
    private readonly SchematicFigure _drawing;

    private ModelSummarySection(ReportContext context)
    {
        _context = context;
        var network = context.Document.Network;
        var units = context.Units;
        if (context.Geometry is { } geometry)
        {
            _drawing = SpatialDrawing(network, geometry, units);
            return;
        }
        var layout = context.Layout;
        var header = new[]
        {
            "Network: " + network.Title,
            string.Create(CultureInfo.InvariantCulture,
                $"{ModelCounts.Of(network).Phrase(withBodies: false)}; total mass {units.Mass(network.TotalMass, given: true)} {units.MassSymbol}"),
        };
        var footer = new[] { PositionNote(layout) };
        var scene = NetworkFigure.Network(layout, header, footer, units, network.Masses.ToDictionary(m => m.Name, m => m.Kilograms),
            SourceLabels(context.Document.Structure));
        _drawing = new SchematicFigure("network", "The network as modelled: " + SymbolList(network, "masses (blocks)") + " and supports (hatched). "
            + PositionNote(layout), "network", scene, animated: false);
    }

    /// <summary>
    /// A label for each support held by a voltage source (an electrical support): "source NAME 1 V" with the amplitude of
    /// the velocity load (a voltage by the analogy) that moves it, or "voltage source" where no such load is given.
    /// </summary>
    public static IReadOnlyDictionary<string, string> SourceLabels(StructuralModel structure)
    {
        ArgumentNullException.ThrowIfNull(structure);
        var network = structure.Network;
        var labels = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var support in network.Supports.Where(s => s.Name != Network.Ground && network.IsElectrical(s.Name)))
        {
            var load = structure.Loads.OfType<BaseMotionLoad>().FirstOrDefault(l => l.Support == support.Name && l.Kind == BaseMotionKind.Velocity);
            labels[support.Name] = load is null
                ? "voltage source"
                : "source " + load.Name + " " + ElectricalUnits.Format(load.Amplitude, ElectricalUnits.Volt, given: true);
        }
        return labels;
    }

    /// <summary>
    /// The circuit's nodes (capacitance to ground in F, or none) when <paramref name="nodes"/> has any, and its elements
    /// in their own units: R = 1/c, L = 1/k, C = the inertance in kg = F (the analogy of <see cref="Network.ElectricalNodes"/>).
    /// </summary>
    private static void CircuitTables(HtmlWriter html, Network network, IReadOnlyList<Mass> nodes)
    {
        if (nodes.Count > 0)
            html.Table("Circuit nodes", ["Name", "Capacitance to ground"],
                nodes.Select(m => (IReadOnlyList<string>)[m.Name, m.Kilograms > 0 ? ElectricalUnits.Format(m.Kilograms, ElectricalUnits.Farad, given: true) : "none"]),
                new HashSet<int> { 1 });
        var circuit = network.Dampers.Where(d => network.IsElectricalElement(d.NodeA, d.NodeB)).Select(d => (d.Name, d.NodeA, d.NodeB, Kind: "resistor", Value: ElectricalUnits.Format(1 / d.Coefficient, ElectricalUnits.Ohm, given: true)))
            .Concat(network.Springs.Where(s => network.IsElectricalElement(s.NodeA, s.NodeB)).Select(s => (s.Name, s.NodeA, s.NodeB, Kind: "inductor", Value: ElectricalUnits.Format(1 / s.Stiffness, ElectricalUnits.Henry, given: true))))
            .Concat(network.Inerters.Where(i => network.IsElectricalElement(i.NodeA, i.NodeB)).Select(i => (i.Name, i.NodeA, i.NodeB, Kind: "capacitor", Value: ElectricalUnits.Format(i.Inertance, ElectricalUnits.Farad, given: true))))
            .ToArray();
        if (circuit.Length > 0)
            html.Table("Circuit elements", ["Name", "Kind", "Between", "Value"],
                circuit.Select(c => (IReadOnlyList<string>)[c.Name, c.Kind, $"{c.NodeA} – {c.NodeB}", c.Value]),
                new HashSet<int> { 3 });
    }

    /// <summary>Large line models: masses, springs and dampers grouped by equal value (count and first names), not one row each.</summary>
    private void GroupedTables(HtmlWriter html, Network network, Units.DisplayUnits u)
    {
        static IEnumerable<IReadOnlyList<string>> Rows<T>(IEnumerable<T> items, Func<T, double> value, Func<T, string> name, Func<double, string> format) =>
            items.GroupBy(value).OrderByDescending(g => g.Count()).ThenBy(g => g.Key).Select(g => (IReadOnlyList<string>)
            [
                format(g.Key),
                g.Count().ToString(CultureInfo.InvariantCulture),
                string.Join(", ", g.Take(3).Select(name)) + (g.Count() > 3 ? ", …" : ""),
            ]);
        string Caption(string what, int count, int groups) => string.Create(CultureInfo.InvariantCulture,
            $"{what}: {count} in {groups} group{(groups == 1 ? "" : "s")} of equal value (every one is listed in results.json)");
        // The circuit's nodes and elements are listed in their own units (CircuitTables), not as masses, springs and dampers.
        var masses = network.Masses.Where(m => !network.IsElectrical(m.Name)).ToArray();
        var springs = network.Springs.Where(s => !network.IsElectricalElement(s.NodeA, s.NodeB)).ToArray();
        var dampers = network.Dampers.Where(d => !network.IsElectricalElement(d.NodeA, d.NodeB)).ToArray();
        html.Table(Caption("Masses", masses.Length, masses.Select(m => m.Kilograms).Distinct().Count()),
            [$"Mass ({u.MassSymbol})", "Count", "First names"], Rows(masses, m => m.Kilograms, m => m.Name, v => u.Mass(v, given: true)), new HashSet<int> { 0, 1 });
        if (springs.Length > 0)
            html.Table(Caption("Springs", springs.Length, springs.Select(s => s.Stiffness).Distinct().Count()),
                [$"Stiffness ({u.StiffnessSymbol})", "Count", "First names"], Rows(springs, s => s.Stiffness, s => s.Name, v => u.Stiffness(v, given: true)), new HashSet<int> { 0, 1 });
        if (dampers.Length > 0)
            html.Table(Caption("Dampers", dampers.Length, dampers.Select(d => d.Coefficient).Distinct().Count()),
                [$"Coefficient ({u.DampingSymbol})", "Count", "First names"], Rows(dampers, d => d.Coefficient, d => d.Name, v => u.Damping(v, given: true)), new HashSet<int> { 0, 1 });
        CircuitTables(html, network, [.. network.Masses.Where(m => network.IsElectrical(m.Name))]);
        if (_context.Document.Warnings.Length > 0)
        {
            html.Heading("Warnings from reading the model");
            html.List(_context.Document.Warnings.Select(w => w.ToString()), "warnings");
        }
    }

    private static SchematicFigure SpatialDrawing(Network network, SpatialGeometry geometry, Units.DisplayUnits units)
    {
        var header = new[]
        {
            "Network: " + network.Title,
            string.Create(CultureInfo.InvariantCulture,
                $"{ModelCounts.Of(network).Phrase(withBodies: true)}; total mass {units.Mass(network.TotalMass, given: true)} {units.MassSymbol}"),
        };
        var boxes = ModesSection.BoxNote(geometry);
        var placed = geometry.Elements.Any(e => e.A.Placed || e.B.Placed)
            ? " Mounts to a support without a location are drawn down to an anchor below their other end."
            : "";
        var note = "Locations from the model, to scale." + (boxes.Length > 0 ? " " + boxes : "") + placed;
        var scene = SpatialFigure.Network(geometry, header, [note], units);
        var views = geometry.Space == ModelSpace.ThreeD ? "in a side view (x–z) and a plan view (x–y)" : "in a side view (x–z)";
        return new SchematicFigure("network", $"The model as built, {views}: {SymbolList(network, "bodies (boxes, centre of mass marked), point masses (squares)")} between their attachment points, and supports (hatched). " + note,
            "network", scene, animated: false);
    }

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>; every model has this section.</summary>
    public static IReportSection? Create(ReportContext context) => new ModelSummarySection(context);

    /// <inheritdoc />
    public string Key => "model";

    /// <inheritdoc />
    public string Title => "Model summary";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [_drawing];

    /// <summary>What each symbol of the drawing stands for, naming inerters and transducers only when the model has them.</summary>
    private static string SymbolList(Network network, string nodes)
    {
        var parts = new List<string> { nodes, "springs (zigzags)", "dampers (dashpots)" };
        if (network.Inerters.Length > 0) parts.Add("inerters (flywheels: a disc with crossed spokes)");
        var counts = ModelCounts.Of(network);
        if (counts.Resistors > 0) parts.Add("resistors (a box with a zigzag, labelled in Ω)");
        if (counts.Inductors > 0) parts.Add("inductors (zigzags labelled in H)");
        if (counts.Capacitors > 0) parts.Add("capacitors between nodes (flywheels labelled in F)");
        if (counts.CircuitNodes > 0) parts.Add("circuit nodes (blocks labelled with their capacitance to ground in F, or nothing when they have none)");
        if (network.Transducers.Length > 0) parts.Add("transducers (a magnet block and a coil between the mechanical pair, with a dashed line to each electrical node of the branch)");
        return string.Join(", ", parts);
    }

    private static IEnumerable<(string, string)> ExtraFacts(Network network) =>
        ModelCounts.Of(network).ExtraFact() is { } fact ? [fact] : [];

    /// <summary>Says where the drawing's positions came from.</summary>
    public static string PositionNote(NetworkLayout layout) => layout.Automatic
        ? "Positions laid out automatically (masses stacked by their distance from the supports), since not every mass has a distinct 'at'."
        : "Positions from the model's 'at' values.";

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        var network = _context.Document.Network;
        var u = _context.Units;
        if (network.Space != ModelSpace.Line)
        {
            WriteSpatialHtml(html, network, u);
            return;
        }
        // A group of circuit nodes that no inductor holds sets a flux level, not a rigid-body mode: only mechanical parts are listed.
        var groups = Topology.RigidBodyGroups(network);
        var counts = ModelCounts.Of(network);
        html.Facts(
        [
            ("Title", network.Title),
            ("Degrees of freedom", Core.Dofs.DofMap.ForScalarNetwork(network).Count.ToString(CultureInfo.InvariantCulture)
                + (network.Links.IsEmpty ? " (one direction of motion per mass)" : " (one direction of motion per mass; masses tied by a link share one)")),
            ($"Total mass ({u.MassSymbol})", u.Mass(network.TotalMass, given: true)),
            ("Masses, springs, dampers", string.Create(CultureInfo.InvariantCulture, $"{counts.Masses}, {counts.Springs}, {counts.Dampers}")),
            .. ExtraFacts(network),
            .. (counts.CircuitFact() is { } circuitFact ? [circuitFact] : Array.Empty<(string, string)>()),
            ("Supports", SupportsFact(network)),
            ("Parts not held by a spring to a support", groups.Length == 0 ? "none" : string.Join("; ", groups.Select(g => string.Join(", ", g))) + " (rigid-body modes at 0 Hz)"),
        ]);
        if (network.Masses.Length > ModesSection.LargeModelMasses)
        {
            GroupedTables(html, network, u);
            html.Figure(_drawing);
            return;
        }
        var masses = network.Masses.Where(m => !network.IsElectrical(m.Name)).ToArray();
        var nodes = network.Masses.Where(m => network.IsElectrical(m.Name)).ToArray();
        if (masses.Length > 0 || nodes.Length == 0)
            html.Table("Masses", ["Name", $"Mass ({u.MassSymbol})", $"Drawing position ({u.LengthSymbol})"],
                masses.Select(m => (IReadOnlyList<string>)[m.Name, u.Mass(m.Kilograms, given: true),
                    m.Position is { } p ? $"({u.Length(p.X, given: true)}, {u.Length(p.Y, given: true)})" : "—"]),
                new HashSet<int> { 1 });
        var springs = network.Springs.Where(s => !network.IsElectricalElement(s.NodeA, s.NodeB)).ToArray();
        var dampers = network.Dampers.Where(d => !network.IsElectricalElement(d.NodeA, d.NodeB)).ToArray();
        var inerters = network.Inerters.Where(i => !network.IsElectricalElement(i.NodeA, i.NodeB)).ToArray();
        if (springs.Length > 0)
            html.Table("Springs", ["Name", "Between", $"Stiffness ({u.StiffnessSymbol})"],
                springs.Select(s => (IReadOnlyList<string>)[s.Name, $"{s.NodeA} – {s.NodeB}", u.Stiffness(s.Stiffness, given: true)]),
                new HashSet<int> { 2 });
        if (dampers.Length > 0)
            html.Table("Dampers", ["Name", "Between", $"Coefficient ({u.DampingSymbol})"],
                dampers.Select(d => (IReadOnlyList<string>)[d.Name, $"{d.NodeA} – {d.NodeB}", u.Damping(d.Coefficient, given: true)]),
                new HashSet<int> { 2 });
        if (inerters.Length > 0)
            html.Table("Inerters", ["Name", "Between", $"Inertance ({u.MassSymbol})"],
                inerters.Select(i => (IReadOnlyList<string>)[i.Name, $"{i.NodeA} – {i.NodeB}", u.Mass(i.Inertance, given: true)]),
                new HashSet<int> { 2 });
        CircuitTables(html, network, nodes);
        if (network.Transducers.Length > 0)
            html.Table("Transducers", ["Name", "Mechanical pair", "Electrical branch", "Force factor (T·m)"],
                network.Transducers.Select(t => (IReadOnlyList<string>)[t.Name, $"{t.NodeA} – {t.NodeB}", $"{t.BranchA} – {t.BranchB}", t.ForceFactor.ToString("G4", CultureInfo.InvariantCulture)]),
                new HashSet<int> { 3 });
        if (_context.Document.Warnings.Length > 0)
        {
            html.Heading("Warnings from reading the model");
            html.List(_context.Document.Warnings.Select(w => w.ToString()), "warnings");
        }
        html.Figure(_drawing);
    }

    /// <summary>The facts and tables of a plane or 3d model: locations, bodies, and each element's values per direction.</summary>
    private void WriteSpatialHtml(HtmlWriter html, Network network, Units.DisplayUnits u)
    {
        var inv = CultureInfo.InvariantCulture;
        string At(Point3 p) => $"({u.Length(p.X, given: true)}, {u.Length(p.Y, given: true)}, {u.Length(p.Z, given: true)})";
        string Rotational(double value) => DisplayUnits.Number(value);
        string Values(ImmutableArray<DirectionalValue> components, bool axial, double scale, Func<double, string> translation, string translationSymbol, string rotationSymbol) =>
            axial
                ? "axial " + translation(scale) + " " + translationSymbol
                : string.Join(", ", components.Select(c => c.Direction.Label() + " " + (c.Direction.IsRotation()
                    ? Rotational(c.Value) + " " + rotationSymbol
                    : translation(c.Value) + " " + translationSymbol)));
        var dofs = Core.Dofs.DofMap.For(network);
        html.Facts(
        [
            ("Title", network.Title),
            ("Space", network.Space == ModelSpace.ThreeD ? "3d: x, y, z and rotations rx, ry, rz (z up)" : "plane: x, z and rotation ry (a side view, z up)"),
            ("Degrees of freedom", dofs.Count.ToString(inv) + " (each point mass its translations, each body every direction of the space at its centre of mass)"),
            ($"Total mass ({u.MassSymbol})", u.Mass(network.TotalMass, given: true)),
            ("Bodies, masses, springs, dampers", string.Create(inv, $"{network.Bodies.Length}, {network.Masses.Length}, {network.Springs.Length}, {network.Dampers.Length}")),
            .. ExtraFacts(network),
            ("Supports", string.Join(", ", network.Supports.Select(s => s.Name)) + " (fixed)"),
        ]);
        if (network.Bodies.Length > 0)
            html.Table("Rigid bodies", ["Name", $"Mass ({u.MassSymbol})", $"Centre of mass ({u.LengthSymbol})", "Inertia J_xx, J_yy, J_zz (kg·m²)", "Points"],
                network.Bodies.Select(b => (IReadOnlyList<string>)[b.Name, u.Mass(b.Kilograms, given: true), At(b.CentreOfMass),
                    $"{DisplayUnits.Number(b.Inertia.Xx)}, {DisplayUnits.Number(b.Inertia.Yy)}, {DisplayUnits.Number(b.Inertia.Zz)}"
                        + (b.Inertia.Xy != 0 || b.Inertia.Yz != 0 || b.Inertia.Xz != 0 ? " (with off-diagonal terms)" : ""),
                    b.Points.IsEmpty ? "—" : string.Join(", ", b.Points.Select(p => p.Name + " " + At(p.Location)))]),
                new HashSet<int> { 1 });
        if (network.Masses.Length > 0)
            html.Table("Point masses", ["Name", $"Mass ({u.MassSymbol})", $"Location ({u.LengthSymbol})", "Moves in"],
                network.Masses.Select(m => (IReadOnlyList<string>)[m.Name, u.Mass(m.Kilograms, given: true),
                    m.Location is { } l ? At(l) : "—",
                    string.Join(", ", (m.Moves.IsEmpty ? Directions.Translations(network.Space) : m.Moves).Select(d => d.Label()))]),
                new HashSet<int> { 1 });
        if (network.Springs.Length > 0)
            html.Table("Springs", ["Name", "Between", "Stiffness"],
                network.Springs.Select(s => (IReadOnlyList<string>)[s.Name, $"{s.NodeA} – {s.NodeB}",
                    Values(s.Components, s.Axial, s.Stiffness, v => u.Stiffness(v, given: true), u.StiffnessSymbol, "N·m/rad")]));
        if (network.Dampers.Length > 0)
            html.Table("Dampers", ["Name", "Between", "Coefficient"],
                network.Dampers.Select(d => (IReadOnlyList<string>)[d.Name, $"{d.NodeA} – {d.NodeB}",
                    Values(d.Components, d.Axial, d.Coefficient, v => u.Damping(v, given: true), u.DampingSymbol, "N·m·s/rad")]));
        if (network.Inerters.Length > 0)
            html.Table("Inerters", ["Name", "Between", "Inertance"],
                network.Inerters.Select(i => (IReadOnlyList<string>)[i.Name, $"{i.NodeA} – {i.NodeB}",
                    Values(i.Components, i.Axial, i.Inertance, v => u.Mass(v, given: true), u.MassSymbol, "kg·m²/rad")]));
        if (_context.Document.Warnings.Length > 0)
        {
            html.Heading("Warnings from reading the model");
            html.List(_context.Document.Warnings.Select(w => w.ToString()), "warnings");
        }
        html.Figure(_drawing);
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        var network = _context.Document.Network;
        json.WriteStartObject();
        json.WriteString("title", network.Title);
        json.WriteNumber("total_mass_kg", network.TotalMass);
        json.WriteStartArray("masses");
        foreach (var m in network.Masses)
        {
            json.WriteStartObject();
            json.WriteString("name", m.Name);
            json.WriteNumber("mass_kg", m.Kilograms);
            if (m.Position is { } p)
            {
                json.WriteStartArray("at_m");
                json.WriteNumberValue(p.X);
                json.WriteNumberValue(p.Y);
                json.WriteEndArray();
            }
            else if (m.Location is { } l)
            {
                json.WriteStartArray("at_m");
                json.WriteNumberValue(l.X);
                json.WriteNumberValue(l.Y);
                json.WriteNumberValue(l.Z);
                json.WriteEndArray();
            }
            else json.WriteNull("at_m");
            json.WriteEndObject();
        }
        json.WriteEndArray();
        Elements(json, "springs", network.Springs.Select(s => (s.Name, s.NodeA, s.NodeB, s.Stiffness)), "stiffness_n_per_m");
        Elements(json, "dampers", network.Dampers.Select(d => (d.Name, d.NodeA, d.NodeB, d.Coefficient)), "coefficient_n_s_per_m");
        json.WriteStartArray("supports");
        foreach (var s in network.Supports) json.WriteStringValue(s.Name);
        json.WriteEndArray();
        json.WriteStartObject("drawing");
        if (_context.Geometry is { } geometry)
        {
            // Plane and 3d models are drawn from their locations: [x, y, z] of each mass and body centre of mass.
            json.WriteBoolean("automatic_layout", false);
            json.WriteString("axis", geometry.Space == ModelSpace.ThreeD ? "side and plan views" : "side view");
            json.WriteStartObject("positions_m");
            foreach (var n in geometry.Nodes.Where(n => n.Kind != SpatialNodeKind.Support))
            {
                json.WriteStartArray(n.Name);
                json.WriteNumberValue(n.Location.X);
                json.WriteNumberValue(n.Location.Y);
                json.WriteNumberValue(n.Location.Z);
                json.WriteEndArray();
            }
            json.WriteEndObject();
            json.WriteEndObject();
            json.WriteEndObject();
            return;
        }
        json.WriteBoolean("automatic_layout", _context.Layout.Automatic);
        json.WriteString("axis", _context.Layout.Axis == ChainAxis.Vertical ? "vertical" : "horizontal");
        json.WriteStartObject("positions_m");
        foreach (var (name, at) in _context.Layout.Masses)
        {
            json.WriteStartArray(name);
            json.WriteNumberValue(at.X);
            json.WriteNumberValue(at.Y);
            json.WriteEndArray();
        }
        json.WriteEndObject();
        json.WriteEndObject();
        json.WriteEndObject();
    }

    private static void Elements(Utf8JsonWriter json, string key, IEnumerable<(string Name, string A, string B, double Value)> elements, string valueKey)
    {
        json.WriteStartArray(key);
        foreach (var (name, a, b, value) in elements)
        {
            json.WriteStartObject();
            json.WriteString("name", name);
            json.WriteStartArray("between");
            json.WriteStringValue(a);
            json.WriteStringValue(b);
            json.WriteEndArray();
            json.WriteNumber(valueKey, value);
            json.WriteEndObject();
        }
        json.WriteEndArray();
    }

    /// <summary>The supports, fixed ones first; a support a voltage source holds is named as such (it moves with the source's voltage).</summary>
    private static string SupportsFact(Network network)
    {
        var fixedOnes = network.Supports.Where(s => !network.IsElectrical(s.Name)).Select(s => s.Name).ToArray();
        var sources = network.Supports.Where(s => network.IsElectrical(s.Name)).Select(s => s.Name).ToArray();
        var text = fixedOnes.Length == 0 ? "" : string.Join(", ", fixedOnes) + " (fixed)";
        if (sources.Length > 0) text += (text.Length > 0 ? "; " : "") + string.Join(", ", sources) + " (circuit nodes held by voltage sources)";
        return text;
    }
}
