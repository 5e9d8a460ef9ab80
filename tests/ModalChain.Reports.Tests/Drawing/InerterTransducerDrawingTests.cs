using System.Collections.Immutable;
using System.Xml.Linq;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;
using Point = ModalChain.Reports.Drawing.Point;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>The network drawing draws inerters as flywheels and transducers as a magnet and a coil with a dashed line to the branch, labelled without overlaps.</summary>
public sealed class InerterTransducerDrawingTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));
    private static readonly DisplayUnits Si = new(UnitSystem.Si);

    private const string Flywheels = """
        title: Deck with a flywheel absorber
        masses:
          deck: 3.2 t
          tuned: 160 kg
        springs:
          deck-columns: {between: [ground, deck], stiffness: 95 kN/mm}
          tuned-spring: {between: [deck, tuned], stiffness: 400 kN/m}
        dampers:
          tuned-damper: {between: [deck, tuned], coefficient: 2 kN*s/m}
        inerters:
          grounded: {between: [tuned, ground], inertance: 360 kg}
          across: {between: [deck, tuned], inertance: 60 kg}
        """;

    // The table's coil is written table → ground, the opposite way round to the flexure beside it.
    private const string Coil = """
        title: Table driven by a coil
        masses:
          table: {mass: 2 kg, at: [0, 1.5]}
          tank: {mass: 2 g, at: [1.5, 1.5]}
        springs:
          flexure: {between: [ground, table], stiffness: 40 kN/m}
          inductor: {between: [tank, ground], stiffness: 20 N/m}
        dampers:
          resistor: {between: [tank, ground], coefficient: 0.01 N*s/m}
        transducers:
          coil: {between: [table, ground], branch: [tank, ground], force-factor: 12 T*m}
        """;

    private static Scene NetworkScene(string yaml, IReadOnlyList<string>? footer = null)
    {
        var network = Repository.Parse(yaml).Network;
        return NetworkFigure.Network(NetworkLayout.For(network), ["Network: " + network.Title, "counts"], footer ?? ["A note."], Si,
            network.Masses.ToDictionary(m => m.Name, m => m.Kilograms));
    }

    private static IEnumerable<GroupShape> Groups(IEnumerable<Shape> shapes)
    {
        foreach (var s in shapes.OfType<GroupShape>())
        {
            yield return s;
            foreach (var g in Groups(s.Children)) yield return g;
        }
    }

    private static GroupShape Element(Scene scene, string name) =>
        Groups(scene.Shapes).Single(g => g.Data.TryGetValue("element", out var e) && e == name && (g.Class ?? "").StartsWith("element", StringComparison.Ordinal));

    /// <summary>No two texts of the scene overlap, measured with the figure's own font, and each lies inside the figure.</summary>
    private static void TextsApart(Scene scene, Func<TextShape, bool> which)
    {
        var texts = LabelPlacementTests.Texts(scene.Shapes).Where(which).Select(t => (t.Text, Box: LabelPlacementTests.Measured(t))).ToList();
        for (var i = 0; i < texts.Count; i++)
        {
            Assert.True(texts[i].Box.Left >= 0 && texts[i].Box.Right <= scene.Width && texts[i].Box.Top >= 0 && texts[i].Box.Bottom <= scene.Height,
                $"'{texts[i].Text}' leaves the figure");
            for (var j = i + 1; j < texts.Count; j++)
                Assert.False(texts[i].Box.Intersects(texts[j].Box), $"'{texts[i].Text}' overlaps '{texts[j].Text}'");
        }
    }

    private static bool Placed(TextShape t) => (t.Class ?? "").Contains("element-label", StringComparison.Ordinal);

    [Fact]
    public void Inerters_AreFlywheels_WithTheirNameAndInertance()
    {
        var scene = NetworkScene(Flywheels);
        foreach (var name in new[] { "grounded", "across" })
        {
            var group = Element(scene, name);
            Assert.Contains("inerter", group.Class!.Split(' '));
            var paths = group.Children.OfType<PathShape>().ToArray();
            Assert.Equal(5, paths.Length); // rod, disc, two spokes, rod
            var disc = paths[1].Points;
            Assert.Equal(21, disc.Length);
            Assert.Equal(disc[0], disc[^1]); // a closed outline
            // The disc is a circle: every rim point at the same distance from the centre (geometry, 1e-9 px).
            var centre = new Point(disc.Take(20).Average(p => p.X), disc.Take(20).Average(p => p.Y));
            var radius = (disc[0] - centre).Length;
            Assert.All(disc, p => NumericAssert.Close(radius, (p - centre).Length, Tolerance.Abs(1e-9), "rim"));
            // The spokes are diameters: they cross at the centre.
            foreach (var spoke in paths[2..4])
                NumericAssert.Close(0, (0.5 * (spoke.Points[0] + spoke.Points[1]) - centre).Length, Tolerance.Abs(1e-9), "spoke midpoint");
        }
        var labels = LabelPlacementTests.Texts(scene.Shapes).Where(Placed).Select(t => t.Text).ToArray();
        Assert.Contains("grounded 360 kg", labels);
        Assert.Contains("across 60 kg", labels);
        TextsApart(scene, Placed);
    }

    [Fact]
    public void ATransducer_IsAMagnetAndACoil_WithADashedLineToItsBranchNode()
    {
        var scene = NetworkScene(Coil);
        var group = Element(scene, "coil");
        Assert.Contains("transducer", group.Class!.Split(' '));
        var paths = group.Children.OfType<PathShape>().ToArray();
        Assert.Equal(6, paths.Length); // rod, magnet, pole line, coil, rod, the dashed line to 'tank'
        Assert.Equal(5, paths[1].Points.Length);
        Assert.Equal(paths[1].Points[0], paths[1].Points[^1]); // the magnet block is closed
        Assert.Equal(49, paths[3].Points.Length);              // four loops of twelve steps
        var link = paths[5];
        Assert.Equal("branch-link", link.Class);
        Assert.Equal("tank", link.Data["branch"]);
        Assert.NotNull(link.Stroke!.Dash);
        // The dashed line ends on the edge of the tank's block, on the side facing the symbol.
        var tank = LabelPlacementTests.Texts(scene.Shapes).Single(t => t.Class == "mass-name" && t.Text == "tank");
        var tankBlock = scene.Shapes.OfType<PathShape>().Single(p => p.Data.TryGetValue("mass", out var m) && m == "tank").Points;
        NumericAssert.Close(tankBlock.Min(p => p.X), link.Points[^1].X, Tolerance.Abs(1e-9), "the line meets the block's left edge");
        Assert.True(link.Points[0].X < tank.At.X, "the line starts at the symbol, left of the tank");
        Assert.Contains("coil Bl 12 T·m", LabelPlacementTests.Texts(scene.Shapes).Where(Placed).Select(t => t.Text));
        TextsApart(scene, Placed);
    }

    [Fact]
    public void ParallelElementsWrittenEitherWayRound_AreDrawnApart()
    {
        // The flexure (ground → table) and the coil (table → ground) join the same two ends: each is offset to its own
        // side, so the zigzag and the coil do not lie on one line.
        var scene = NetworkScene(Coil);
        var spring = Element(scene, "flexure").Children.OfType<PathShape>().Single().Points;
        var coil = Element(scene, "coil").Children.OfType<PathShape>().ToArray()[3].Points;
        var springY = spring[1].Y;   // the line is level: the zigzag's axis
        var coilY = 0.5 * (coil.Min(p => p.Y) + coil.Max(p => p.Y));
        Assert.True(Math.Abs(springY - coilY) >= 20, $"the spring's axis at y = {springY} and the coil's at {coilY} are not apart");
    }

    [Fact]
    public void FloorTestDrawing_PlacesBothTransducerLabelsClearOfEveryOtherText()
    {
        var document = Repository.Load("models/floor-shaker-test.yaml");
        var network = document.Network;
        var scene = NetworkFigure.Network(NetworkLayout.For(network), ["Network", "counts"], ["A note."], Si, network.Masses.ToDictionary(m => m.Name, m => m.Kilograms));
        var placed = LabelPlacementTests.Texts(scene.Shapes).Where(Placed).ToList();
        Assert.Equal(["sensor Bl 28 T·m", "shaker Bl 20 T·m"], placed.Select(t => t.Text).Order(StringComparer.Ordinal));
        // A placed label overlaps no other text of the figure (the older element labels among themselves are not checked here).
        var others = LabelPlacementTests.Texts(scene.Shapes).Where(t => !Placed(t)).Select(LabelPlacementTests.Measured).ToList();
        foreach (var label in placed)
        {
            var box = LabelPlacementTests.Measured(label);
            Assert.All(others, o => Assert.False(box.Intersects(o), $"'{label.Text}' overlaps a text at {o}"));
        }
        TextsApart(scene, Placed);
        // Every transducer draws one dashed line per electrical branch node.
        foreach (var t in network.Transducers)
            Assert.Single(Element(scene, t.Name).Children.OfType<PathShape>(), p => p.Class == "branch-link");
    }

    [Fact]
    public void ModeFigures_DrawTheTransducerMovingWithItsPair()
    {
        var report = ReportBuilder.Build(Repository.Parse(Coil), Options);
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "mode-01").Svg(true));
        var groups = root.Descendants(Repository.Svg + "g").Where(g => (string?)g.Attribute("data-element") == "coil").ToList();
        Assert.Contains(groups, g => ((string?)g.Attribute("class") ?? "").Split(' ').SequenceEqual(["element", "undeformed", "transducer"]));
        Assert.Contains(groups, g => ((string?)g.Attribute("class") ?? "").Split(' ').SequenceEqual(["element", "deformed", "transducer"]));
        Assert.Contains(root.Descendants(Repository.Svg + "path"), p => (string?)p.Attribute("class") == "branch-link" && p.Attribute("stroke-dasharray") is not null);
    }

    [Fact]
    public void LongFooterNotes_WrapToTheFigureWidth()
    {
        const string note = "This note is long on purpose: it states where every position came from, how the supports are drawn, "
                            + "and what the flywheel and the magnet-and-coil symbols stand for, so it cannot fit on one line.";
        var scene = NetworkScene(Flywheels, [note]);
        // The note on labels left out (spring and damper labels now go through the label placer too) is a line of its
        // own after the given notes: the identity below is over the given note's lines only.
        var lines = LabelPlacementTests.Texts(scene.Shapes).Where(t => t.Class == "figure-note")
            .TakeWhile(t => !System.Text.RegularExpressions.Regex.IsMatch(t.Text, @"^\d+ labels? w")).ToList();
        Assert.True(lines.Count >= 2, "the note was not wrapped");
        Assert.Equal(note, string.Join(" ", lines.Select(l => l.Text))); // identity: the words, in order, none lost
        Assert.All(lines, l => Assert.True(LabelPlacementTests.Measured(l).Right <= scene.Width - 16, $"'{l.Text}' runs past the figure's margin"));
    }

    [Fact]
    public void SpatialInerters_AreFlywheelsInEveryView_AndNamed()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD, Title = "skid with flywheel braces" };
        b.AddSupport(new Support("pit") { Location = new Point3(0, 0, -0.8) });
        b.AddBody(new RigidBody("skid", 900, new Point3(0, 0, 0.5), InertiaMatrix.OfBox(900, 1.2, 0.8, 1.0),
            [new BodyPoint("foot", new Point3(0.5, 0.3, 0)), new BodyPoint("side", new Point3(0.6, 0, 0.5))]));
        b.AddSpring(new Spring("mount", "skid.foot", Network.Ground, 8e5) { Components = [new(Direction.X, 2e5), new(Direction.Y, 3e5), new(Direction.Z, 8e5)] });
        b.AddInerter(new Inerter("strut", "skid", "pit", 15) { Axial = true });
        b.AddInerter(new Inerter("yaw-brake", "skid.side", Network.Ground, 40) { Components = [new(Direction.X, 40)] });
        var geometry = SpatialGeometry.For(b.Build());
        Assert.Equal(2, geometry.Elements.Count(e => e.Kind == ElementKind.Inerter));
        var scene = SpatialFigure.Network(geometry, ["Network", "counts"], ["Locations from the model, to scale."], Si);
        foreach (var name in new[] { "strut", "yaw-brake" })
        {
            var drawn = Groups(scene.Shapes).Where(g => g.Data.TryGetValue("element", out var e) && e == name && (g.Class ?? "").Contains("inerter", StringComparison.Ordinal)).ToList();
            Assert.Equal(2, drawn.Count); // side and plan view
            Assert.All(drawn, g => Assert.True(g.Children.Length == 5 || (g.Class ?? "").Contains("end-on", StringComparison.Ordinal), "a flywheel of five lines, or the end-on mark"));
        }
        var texts = LabelPlacementTests.Texts(scene.Shapes).ToList();
        Assert.Contains(texts, t => t.Text == "strut" && (t.Class ?? "").Contains("element-name", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.Text == "yaw-brake" && (t.Class ?? "").Contains("element-name", StringComparison.Ordinal));
        TextsApart(scene, t => (t.Class ?? "").Contains("label", StringComparison.Ordinal));
    }
}
