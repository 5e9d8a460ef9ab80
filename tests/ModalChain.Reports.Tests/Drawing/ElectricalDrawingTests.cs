using System.Globalization;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>
/// The network drawing and the model summary speak the electrical side in its own units: resistors in Ω, inductors in
/// H, capacitors in F, electrical nodes by their capacitance (never "kg"), a voltage source's support by its name and
/// amplitude; the header counts circuit nodes and circuit elements apart from masses, springs and dampers; no two texts
/// of the drawing overlap.
/// </summary>
public sealed class ElectricalDrawingTests
{
    private static readonly DisplayUnits Si = new(UnitSystem.Si);
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    private const string FloorTest = "models/floor-shaker-test.yaml";

    // Invented: a small table driven by a moving coil through a filter. Counted by hand: 1 mass (table), 2 circuit nodes
    // (coil-plus and tap; amp is held by the voltage source, so it is drawn as a support), 1 spring, 0 dampers,
    // 2 resistors (feed, bleed), 1 inductor, 1 capacitor between two nodes (bypass; hold-up runs to ground, so it is tap's capacitance
    // to ground, 10 µF), 1 transducer; total mass 2 kg.
    private const string Filter = """
        title: Table driven through a filter
        masses:
          table: 2 kg
        springs:
          flexure: {between: [ground, table], stiffness: 40 kN/m}
        circuit:
          nodes: [amp, coil-plus, tap]
          resistors:
            feed: {between: [amp, coil-plus], resistance: 4.7 ohm}
            bleed: {between: [tap, ground], resistance: 1 kohm}
          inductors:
            choke: {between: [coil-plus, tap], inductance: 2 mH}
          capacitors:
            hold-up: {between: [tap, ground], capacitance: 10 uF}
            bypass: {between: [coil-plus, tap], capacitance: 470 nF}
          voltage-sources:
            amplifier: {between: [amp, ground], amplitude: 2.5 V}
        transducers:
          coil: {between: [table, ground], branch: [coil-plus, ground], force-factor: 12 T*m}
        """;

    private static Scene Drawing(ModelDocument document)
    {
        var network = document.Network;
        return NetworkFigure.Network(NetworkLayout.For(network), ["Network: " + network.Title, ModelCounts.Of(network).Phrase(withBodies: false)],
            ["A note."], Si, network.Masses.ToDictionary(m => m.Name, m => m.Kilograms), ModelSummarySection.SourceLabels(document.Structure));
    }

    private static List<TextShape> Texts(Scene scene) => [.. LabelPlacementTests.Texts(scene.Shapes)];

    /// <summary>Reads "10 kΩ", "470 nF", "2 mH" (or the last two words of "name 10 kΩ", a label on one line) back into SI: the number times its prefix.</summary>
    private static double ReadBack(string text, string unit)
    {
        var parts = text.Split(' ')[^2..];
        var prefixed = parts[1];
        Assert.EndsWith(unit, prefixed, StringComparison.Ordinal);
        var prefix = prefixed[..^unit.Length];
        var factor = prefix switch { "G" => 1e9, "M" => 1e6, "k" => 1e3, "" => 1.0, "m" => 1e-3, "µ" => 1e-6, "n" => 1e-9, "p" => 1e-12, _ => double.NaN };
        return double.Parse(parts[0], CultureInfo.InvariantCulture) * factor;
    }

    private static TextShape? ValueOf(Scene scene, string element) => Texts(scene).SingleOrDefault(t =>
        (t.Class ?? "").Contains("element-value", StringComparison.Ordinal) && t.Data.TryGetValue("element", out var e) && e == element);

    /// <summary>No two texts of the scene overlap, measured with the figure's own font, and each lies inside the figure.</summary>
    private static void NoTextsOverlap(Scene scene)
    {
        var texts = Texts(scene).Select(t => (t.Text, Box: LabelPlacementTests.Measured(t))).ToList();
        for (var i = 0; i < texts.Count; i++)
        {
            Assert.True(texts[i].Box.Left >= 0 && texts[i].Box.Right <= scene.Width && texts[i].Box.Top >= 0 && texts[i].Box.Bottom <= scene.Height,
                $"'{texts[i].Text}' leaves the figure");
            for (var j = i + 1; j < texts.Count; j++)
                Assert.False(texts[i].Box.Intersects(texts[j].Box), $"'{texts[i].Text}' overlaps '{texts[j].Text}'");
        }
    }

    [Fact]
    public void FloorTest_ResistorsAreLabelledInOhms_OneOverTheCoefficient()
    {
        var document = Repository.Load(FloorTest);
        var scene = Drawing(document);
        // The resistances as the YAML writes them; the model holds each as a damper of coefficient c = 1/R (closed form of the analogy).
        var written = new Dictionary<string, double> { ["shaker-coil-resistance"] = 2, ["sensor-coil-resistance"] = 375, ["recorder-input"] = 10e3 };
        var placed = 0;
        foreach (var (name, ohms) in written)
        {
            var damper = document.Network.Dampers.Single(d => d.Name == name);
            NumericAssert.Close(ohms, 1 / damper.Coefficient, Tolerance.Rel(1e-12), $"{name}: 1/c is R"); // closed form
            Assert.Equal(ElectricalUnits.Format(ohms, ElectricalUnits.Ohm, given: true), NetworkFigure.ElementValue(
                NetworkLayout.For(document.Network).Elements.Single(e => e.Name == name), Si));
            if (ValueOf(scene, name) is not { } label) continue; // left out for want of room: the footer counts it (below)
            placed++;
            // Exact to the printed digits: R is a whole number of Ω or kΩ here.
            Assert.Equal(ohms, ReadBack(label.Text, "Ω"));
            Assert.DoesNotContain("N·s/m", label.Text, StringComparison.Ordinal);
        }
        Assert.True(placed >= 2, $"only {placed} of the 3 resistor values were placed");
        Assert.EndsWith("2 Ω", ValueOf(scene, "shaker-coil-resistance")?.Text, StringComparison.Ordinal);
        Assert.EndsWith("10 kΩ", ValueOf(scene, "recorder-input")?.Text, StringComparison.Ordinal);
        // The mechanical dampers keep N·s/m.
        Assert.Equal("12000 N·s/m", NetworkFigure.ElementValue(NetworkLayout.For(document.Network).Elements.Single(e => e.Name == "bay-a-loss"), Si));
        // Resistors are drawn as resistors (a box with a zigzag), not dashpots.
        var groups = scene.Shapes.OfType<GroupShape>().Where(g => (g.Class ?? "").Split(' ').Contains("resistor")).Select(g => g.Data["element"]).Order(StringComparer.Ordinal);
        Assert.Equal(written.Keys.Order(StringComparer.Ordinal), groups);
    }

    [Fact]
    public void FloorTest_ElectricalNodesShowNoKilograms_AndTheSourceIsLabelled()
    {
        var document = Repository.Load(FloorTest);
        var scene = Drawing(document);
        var electrical = document.Network.Masses.Where(m => document.Network.IsElectrical(m.Name)).Select(m => m.Name).ToHashSet();
        Assert.Equal(["sensor-coil", "sensor-out", "shaker-coil"], electrical.Order(StringComparer.Ordinal)); // from the YAML: the circuit's nodes but amplifier-out
        var values = Texts(scene).Where(t => (t.Class ?? "").Contains("mass-value", StringComparison.Ordinal)).ToList();
        // The three circuit nodes are massless: no value at all, never "0 kg".
        Assert.DoesNotContain(values, t => electrical.Contains(t.Data["mass"]));
        Assert.DoesNotContain(Texts(scene), t => t.Text == "0 kg");
        // The mechanical masses keep kg where placed.
        Assert.All(values, t => Assert.EndsWith(" kg", t.Text, StringComparison.Ordinal));
        // The source's support: named with its amplitude, 1 V from the YAML.
        Assert.Contains(Texts(scene), t => t.Text == "source amplifier 1 V" && t.Data.TryGetValue("support", out var s) && s == "amplifier-out");
    }

    [Fact]
    public void FloorTest_HeaderCountsTheCircuitApart()
    {
        var document = Repository.Load(FloorTest);
        var counts = ModelCounts.Of(document.Network);
        // Hand count from the YAML: masses bay-a, bay-b, reaction-mass, geophone-mass; circuit nodes shaker-coil,
        // sensor-coil, sensor-out (amplifier-out is the source's support); 5 springs; 3 dampers; 3 resistors; 2 transducers.
        Assert.Equal("4 masses, 3 circuit nodes, 5 springs, 3 dampers, 3 resistors, 2 transducers", counts.Phrase(withBodies: false));
        // Total mass leaves the circuit out: 6000 + 5000 + 30 + 0.011 kg (sum of the YAML's masses).
        NumericAssert.Close(11030.011, document.Network.TotalMass, Tolerance.Abs(1e-9));
        var report = ReportBuilder.Build(document, Options);
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "network").Svg(true));
        Assert.Contains(SvgAssert.Texts(root), t => t == "4 masses, 3 circuit nodes, 5 springs, 3 dampers, 3 resistors, 2 transducers; total mass 11030 kg");
    }

    [Fact]
    public void FloorTest_NoTwoTextsOverlap_AndLeftOutLabelsAreCounted()
    {
        var document = Repository.Load(FloorTest);
        var scene = Drawing(document);
        NoTextsOverlap(scene);
        // Every spring and damper is either labelled or counted in the footer note.
        var network = document.Network;
        var expected = network.Springs.Length + network.Dampers.Length + network.Transducers.Length
                       + network.Masses.Count(m => !network.IsElectrical(m.Name)) + 1; // + the source label
        var placed = Texts(scene).Count(t => (t.Class ?? "").Contains("element-name", StringComparison.Ordinal)
                                             || (t.Class ?? "").Contains("element-label", StringComparison.Ordinal)
                                             || (t.Class ?? "").Contains("mass-value", StringComparison.Ordinal)
                                             || (t.Class ?? "").Contains("source-label", StringComparison.Ordinal));
        var note = Texts(scene).Where(t => t.Class == "figure-note").Select(t => System.Text.RegularExpressions.Regex.Match(t.Text, @"^(\d+) labels? w"))
            .SingleOrDefault(m => m.Success);
        var omitted = note is null ? 0 : int.Parse(note.Groups[1].Value, CultureInfo.InvariantCulture);
        Assert.Equal(expected, placed + omitted); // identity: every label is placed or counted as left out
    }

    [Fact]
    public void Filter_InductorCapacitorAndNodeCapacitanceInTheirUnits_NoOverlaps()
    {
        var document = Repository.Parse(Filter);
        var network = document.Network;
        // Hand count from the YAML above (feed and bleed are both resistors).
        Assert.Equal("1 mass, 2 circuit nodes, 1 spring, 0 dampers, 2 resistors, 1 inductor, 1 capacitor, 1 transducer",
            ModelCounts.Of(network).Phrase(withBodies: false));
        var layout = NetworkLayout.For(network);
        // L = 1/k and C = inertance (closed forms of the analogy), read back from the printed label.
        var choke = layout.Elements.Single(e => e.Name == "choke");
        Assert.Equal("2 mH", NetworkFigure.ElementValue(choke, Si));
        NumericAssert.Close(2e-3, ReadBack(NetworkFigure.ElementValue(choke, Si), "H"), Tolerance.Rel(1e-12));
        NumericAssert.Close(1 / choke.Value, 2e-3, Tolerance.Rel(1e-12), "1/k is L");
        var bypass = layout.Elements.Single(e => e.Name == "bypass");
        Assert.Equal(ElementKind.Inerter, bypass.Kind);
        Assert.Equal("470 nF", NetworkFigure.ElementValue(bypass, Si));
        Assert.Equal("4.7 Ω", NetworkFigure.ElementValue(layout.Elements.Single(e => e.Name == "feed"), Si));
        Assert.Equal("1 kΩ", NetworkFigure.ElementValue(layout.Elements.Single(e => e.Name == "bleed"), Si));
        // tap carries the hold-up capacitor to ground as its "mass": 10 µF, printed in F; coil-plus has none.
        Assert.Equal("10 µF", NetworkFigure.NodeValue(layout, "tap", network.Masses.Single(m => m.Name == "tap").Kilograms, Si));
        Assert.Null(NetworkFigure.NodeValue(layout, "coil-plus", network.Masses.Single(m => m.Name == "coil-plus").Kilograms, Si));
        Assert.Equal("2 kg", NetworkFigure.NodeValue(layout, "table", 2, Si));
        var scene = Drawing(document);
        Assert.DoesNotContain(Texts(scene), t => t.Data.TryGetValue("mass", out var m) && network.IsElectrical(m) && t.Text.Contains("kg", StringComparison.Ordinal));
        Assert.Contains(Texts(scene), t => t.Text == "source amplifier 2.5 V");
        NoTextsOverlap(scene);
    }

    [Fact]
    public void Summary_ListsCircuitElementsInTheirUnits()
    {
        var report = ReportBuilder.Build(Repository.Load(FloorTest), Options);
        var summary = report.Document!.Sections.Single(s => s.Key == "model");
        var tables = summary.Blocks.OfType<TableBlock>().ToList();
        // The resistors leave the dampers' table (N·s/m) for the circuit's table (Ω); values from the YAML.
        Assert.Equal(["bay-a-loss", "bay-b-loss", "geophone-open-circuit"], tables.Single(t => t.Caption == "Dampers").Rows.Select(r => r[0]));
        var circuit = tables.Single(t => t.Caption == "Circuit elements");
        Assert.Equal(["2 Ω", "375 Ω", "10 kΩ"], circuit.Rows.Select(r => r[3]));
        Assert.Equal(["sensor-coil", "sensor-out", "shaker-coil"], tables.Single(t => t.Caption == "Circuit nodes").Rows.Select(r => r[0]).Order(StringComparer.Ordinal));
        Assert.DoesNotContain(tables.Single(t => t.Caption == "Masses").Rows, r => r[0] is "sensor-coil" or "sensor-out" or "shaker-coil");
        var facts = summary.Blocks.OfType<FactsBlock>().Single().Facts.ToDictionary(f => f.Key, f => f.Value);
        Assert.Equal("4, 5, 3", facts["Masses, springs, dampers"]);
        Assert.Equal("3, 3, 0, 0", facts["Circuit nodes, resistors, inductors, capacitors"]);
    }

    [Fact]
    public void LargeModelSummary_GroupsOnlyTheMechanicalSide_AndListsTheCircuitApart()
    {
        // Invented: a chain of 70 equal masses (more than ModesSection.LargeModelMasses, so the tables are grouped by
        // value) read by a velocity sensor across a 470 Ω resistor. Hand count: 70 masses of 100 kg, 70 springs of
        // 1 MN/m, no mechanical damper; circuit nodes: coil (massless); 1 resistor.
        var yaml = new System.Text.StringBuilder("title: Long chain read by a coil\nmasses:\n");
        for (var i = 1; i <= 70; i++) yaml.Append(CultureInfo.InvariantCulture, $"  m{i}: 100 kg\n");
        yaml.Append("springs:\n");
        for (var i = 1; i <= 70; i++) yaml.Append(CultureInfo.InvariantCulture, $"  k{i}: {{between: [{(i == 1 ? "ground" : $"m{i - 1}")}, m{i}], stiffness: 1 MN/m}}\n");
        yaml.Append("""
            circuit:
              nodes: [coil]
              resistors:
                load: {between: [coil, ground], resistance: 470 ohm}
            transducers:
              sensor: {between: [m70, ground], branch: [coil, ground], force-factor: 10 T*m}
            """);
        var report = ReportBuilder.Build(Repository.Parse(yaml.ToString()), Options);
        var summary = report.Document!.Sections.Single(s => s.Key == "model");
        var tables = summary.Blocks.OfType<TableBlock>().ToList();
        var masses = tables.Single(t => (t.Caption ?? "").StartsWith("Masses", StringComparison.Ordinal));
        Assert.StartsWith("Masses: 70 in 1 group", masses.Caption, StringComparison.Ordinal);
        Assert.Equal<string>(["100", "70"], masses.Rows.Single().Take(2));
        Assert.DoesNotContain(tables, t => (t.Caption ?? "").StartsWith("Dampers", StringComparison.Ordinal)); // the resistor is no damper
        Assert.Equal<string>(["load", "resistor", "coil – ground", "470 Ω"], tables.Single(t => t.Caption == "Circuit elements").Rows.Single());
        Assert.Equal<string>(["coil", "none"], tables.Single(t => t.Caption == "Circuit nodes").Rows.Single());
    }
}
