using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using System.Xml.Linq;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The report pieces of a plane or 3d model: the network drawing in side and plan views, the tables of bodies and directional mounts.</summary>
public sealed class SpatialReportTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero));

    /// <summary>A 1200 kg skid (a homogeneous 1.2 × 0.8 × 0.6 m box, centre of mass 0.4 m up) on four corner mounts, and a 5 kg gauge on an axial bracket along x.</summary>
    internal static ModelDocument Skid(ModelSpace space = ModelSpace.ThreeD)
    {
        var b = new NetworkBuilder { Title = "compressor skid", Space = space };
        var plane = space == ModelSpace.Plane;
        var feet = new[] { (-0.5, -0.3), (0.5, -0.3), (0.5, 0.3), (-0.5, 0.3) }.Take(plane ? 2 : 4)
            .Select((f, i) => new BodyPoint($"foot-{i + 1}", new Point3(f.Item1, plane ? 0 : f.Item2, 0))).ToImmutableArray();
        b.AddBody(new RigidBody("skid", 1200, new Point3(0, 0, 0.4), InertiaMatrix.OfBox(1200, 1.2, 0.8, 0.6), feet));
        // The gauge slides along the bracket's line (x), so it has no mechanism of its own.
        b.AddMass(new Mass("gauge", 5) { Location = new Point3(0.9, 0, 0.4), Moves = [Direction.X] });
        ImmutableArray<DirectionalValue> mount = plane
            ? [new(Direction.X, 6e4), new(Direction.Z, 2e5)]
            : [new(Direction.X, 6e4), new(Direction.Y, 6e4), new(Direction.Z, 2e5)];
        foreach (var f in feet) b.AddSpring(new Spring("mount-" + f.Name[^1], "skid." + f.Name, Network.Ground, 2e5) { Components = mount });
        b.AddSpring(new Spring("bracket", "skid", "gauge", 4e4) { Axial = true });
        b.AddDamper(new Damper("snubber", "skid.foot-1", Network.Ground, 900) { Components = [new(Direction.Z, 900)] });
        return new ModelDocument("skid.yaml", "0", b.Build(), [], new Dictionary<string, SourcePosition>());
    }

    [Fact]
    public void ModelSummary_DrawsTheModelInSideAndPlanViewsAndTablesItsBodiesAndMounts()
    {
        var report = ReportBuilder.Build(Skid(), Options, [ModelSummarySection.Create]);
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "network").Svg(standalone: true));
        var views = root.Descendants(Repository.Svg + "g").Select(g => (string?)g.Attribute("data-view")).Where(v => v is not null).ToList();
        Assert.Equal(["side", "plan"], views);
        var texts = SvgAssert.Texts(root);
        Assert.Contains("skid (1200 kg)", texts);
        Assert.Contains("gauge (5 kg)", texts);
        Assert.Contains(texts, t => t.StartsWith("Locations from the model, to scale. Bodies are drawn as the homogeneous box", StringComparison.Ordinal));
        Assert.Contains("Rigid bodies", report.Html, StringComparison.Ordinal);
        Assert.Contains("x 60 kN/m, y 60 kN/m, z 200 kN/m", report.Html, StringComparison.Ordinal);
        Assert.Contains("axial 40 kN/m", report.Html, StringComparison.Ordinal);
        // The drawing block of results.json gives each node's location [x, y, z].
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var drawing = json.RootElement.GetProperty("model").GetProperty("drawing");
        Assert.Equal("side and plan views", drawing.GetProperty("axis").GetString());
        var gauge = drawing.GetProperty("positions_m").GetProperty("gauge").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        Assert.Equal([0.9, 0, 0.4], gauge);
    }

    [Fact]
    public void ModelSummary_OfAPlaneModelHasTheSideViewOnly()
    {
        var report = ReportBuilder.Build(Skid(ModelSpace.Plane), Options, [ModelSummarySection.Create]);
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "network").Svg(standalone: true));
        Assert.Equal(["side"], root.Descendants(Repository.Svg + "g").Select(g => (string?)g.Attribute("data-view")).Where(v => v is not null).ToList());
        Assert.Contains("plane: x, z and rotation ry", report.Html, StringComparison.Ordinal);
    }

    /// <summary>A 1200 kg homogeneous 1.2 × 0.8 × 0.6 m block on four equal mounts at (±a, ±b) = (±0.5, ±0.3) m, h = 0.4 m below its centre of mass.</summary>
    private static ModelDocument Block()
    {
        var b = new NetworkBuilder { Title = "block on four mounts", Space = ModelSpace.ThreeD };
        var feet = new[] { (-0.5, -0.3), (0.5, -0.3), (0.5, 0.3), (-0.5, 0.3) }
            .Select((f, i) => new BodyPoint($"foot-{i + 1}", new Point3(f.Item1, f.Item2, 0))).ToImmutableArray();
        b.AddBody(new RigidBody("block", 1200, new Point3(0, 0, 0.4), InertiaMatrix.OfBox(1200, 1.2, 0.8, 0.6), feet));
        foreach (var f in feet)
            b.AddSpring(new Spring("mount-" + f.Name[^1], "block." + f.Name, Network.Ground, 2e5)
            { Components = [new(Direction.X, 6e4), new(Direction.Y, 6e4), new(Direction.Z, 2e5)] });
        return new ModelDocument("block.yaml", "0", b.Build(), [], new Dictionary<string, SourcePosition>());
    }

    private static XElement View(XElement root, string view) =>
        root.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("data-view") == view);

    private static IReadOnlyList<Point> Face(XElement view, string cssClass) =>
        SvgAssert.PathPoints(view.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("class") == cssClass)
            .Elements(Repository.Svg + "path").Single(p => (string?)p.Attribute("class") == "face front"));

    private static Point Centre(XElement view, string cssClass) =>
        SvgAssert.Centre(view.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("class") == cssClass)
            .Elements(Repository.Svg + "path").Single(p => (string?)p.Attribute("class") == "centre-of-mass"));

    /// <summary>The figure of the one mode whose ω (written on the figure as data-omega-rad-s) is <paramref name="omega"/> within 1e-6.</summary>
    private static SchematicFigure ModeFigureAt(Report report, double omega) =>
        report.Figures.OfType<SchematicFigure>().Where(f => f.Kind == "mode")
            .Single(f => Math.Abs(double.Parse(f.Scene.Data["omega-rad-s"], CultureInfo.InvariantCulture) / omega - 1) < 1e-6);

    [Fact]
    public void BlockOnFourMounts_BounceModeIsDrawnAsAPureLiftAndYawAsATurnInPlan()
    {
        // Bounce ω² = 4k_z/m and yaw ω² = 4k_h(a² + b²)/J_zz with J_zz = m(dx² + dy²)/12 (REFERENCES.md §10, Harris'
        // handbook, attribution from memory; closed forms derivable by hand).
        var report = ReportBuilder.Build(Block(), Options, [ModelSummarySection.Create, ModesSection.Create]);
        var bounce = Math.Sqrt(4 * 2e5 / 1200);
        var yaw = Math.Sqrt(4 * 6e4 * (0.25 + 0.09) / (1200 * (1.44 + 0.64) / 12));

        var lift = SvgAssert.WellFormedWithViewBox(ModeFigureAt(report, bounce).Svg(standalone: true));
        Assert.Contains(SvgAssert.Texts(lift), t => t.StartsWith("Bounce (decoupling 1.00)", StringComparison.Ordinal));
        foreach (var (view, vertical) in new[] { ("side", true), ("plan", false) })
        {
            var rest = Face(View(lift, view), "body undeformed");
            var moved = Face(View(lift, view), "body deformed");
            var shift = moved[0].Y - rest[0].Y;
            if (vertical) Assert.True(Math.Abs(shift) > 10, $"the bounce is drawn only {shift:F2} px high");
            for (var i = 0; i < 4; i++)
            {
                NumericAssert.Close(0, moved[i].X - rest[i].X, Tolerance.Abs(5e-3), $"{view} corner {i}: no sideways motion (px)");
                NumericAssert.Close(vertical ? shift : 0, moved[i].Y - rest[i].Y, Tolerance.Abs(5e-3), $"{view} corner {i}: the same lift (px)");
            }
        }

        var turn = SvgAssert.WellFormedWithViewBox(ModeFigureAt(report, yaw).Svg(standalone: true));
        var plan = View(turn, "plan");
        var c = Centre(plan, "body deformed");
        var c0 = Centre(plan, "body undeformed");
        NumericAssert.Close(c0.X, c.X, Tolerance.Abs(5e-3), "yaw: centre of mass x fixed (px)");
        NumericAssert.Close(c0.Y, c.Y, Tolerance.Abs(5e-3), "yaw: centre of mass y fixed (px)");
        var before = Face(plan, "body undeformed");
        var after = Face(plan, "body deformed");
        var angles = Enumerable.Range(0, 4).Select(i =>
            Math.IEEERemainder(Math.Atan2(after[i].Y - c.Y, after[i].X - c.X) - Math.Atan2(before[i].Y - c0.Y, before[i].X - c0.X), 2 * Math.PI)).ToArray();
        Assert.True(Math.Abs(angles[0]) > 0.05, $"the yaw is drawn as a turn of only {angles[0]:F4} rad");
        foreach (var a in angles) NumericAssert.Close(angles[0], a, Tolerance.Abs(1e-4), "yaw: every corner turned by the same angle (rad)");
    }

    [Fact]
    public void ModeFigures_DrawTheBodysCentreMovedByTheShapeAtTheStatedScale()
    {
        var report = ReportBuilder.Build(Skid(), Options, [ModelSummarySection.Create, ModesSection.Create]);
        var result = ((ModesSection)report.Sections.Single(s => s.Key == "modes")).Result;
        Assert.Equal(result.Modes.Length, report.Figures.Count(f => f.Kind == "mode"));
        foreach (var mode in result.Modes)
        {
            var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == ModesSection.FigureName(mode.Number)).Svg(standalone: true));
            var px = double.Parse((string)root.Attribute("data-px-per-m")!, CultureInfo.InvariantCulture);
            var k = double.Parse((string)root.Attribute("data-motion-scale-m")!, CultureInfo.InvariantCulture);
            foreach (var (view, across) in new[] { ("side", Direction.Z), ("plan", Direction.Y) })
            {
                var moved = Centre(View(root, view), "body deformed");
                var rest = Centre(View(root, view), "body undeformed");
                NumericAssert.Close(k * result.ShapeAt(mode, "skid", Direction.X) * px, moved.X - rest.X, Tolerance.Abs(5e-3), $"mode {mode.Number} {view}: x (px)");
                NumericAssert.Close(-k * result.ShapeAt(mode, "skid", across) * px, moved.Y - rest.Y, Tolerance.Abs(5e-3), $"mode {mode.Number} {view}: {across} (px)");
            }
        }
    }

    [Fact]
    public void WholeReport_OfA3dModelBuildsWithEveryFigureStrictXml()
    {
        var report = ReportBuilder.Build(Skid(), Options);
        Assert.Contains(report.Figures, f => f.Kind == "mode");
        foreach (var figure in report.Figures)
        {
            SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
            if (figure.AnimatedSvg() is { } animated) System.Xml.Linq.XDocument.Parse(animated);
        }
        using var json = JsonDocument.Parse(report.Json.ToArray());
        Assert.Equal(JsonValueKind.Object, json.RootElement.GetProperty("modes").ValueKind);
        Assert.Contains("in a side view (x to the right, z up) and, for 3d models, a plan view", report.Html, StringComparison.Ordinal);
    }
}
