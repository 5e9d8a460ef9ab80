using System.Collections.Immutable;
using System.Globalization;
using System.Xml.Linq;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;
using Point = ModalChain.Reports.Drawing.Point;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>
/// Side and plan views of plane and 3d models: bodies as boxes that move by u_p = u_c + θ × (p − c), masses and mounts
/// at their mechanical locations to the stated scale, supports fixed, and strict-XML SVG.
/// </summary>
public sealed class SpatialFigureTests
{
    private const double Kilograms = 1200;
    private static readonly Point3 Centre = new(0.2, -0.1, 0.8);

    /// <summary>A skid (a homogeneous 1.2 m × 0.8 m × 0.6 m box) on four corner mounts to ground, and a gauge mass on a bracket spring.</summary>
    private static Network Skid(ModelSpace space = ModelSpace.ThreeD)
    {
        var b = new NetworkBuilder { Title = "skid", Space = space };
        var feet = new[] { (-0.5, -0.3), (0.5, -0.3), (0.5, 0.3), (-0.5, 0.3) }
            .Select((f, i) => new BodyPoint($"foot-{i + 1}", new Point3(Centre.X + f.Item1, space == ModelSpace.Plane ? 0 : Centre.Y + f.Item2, 0.5)))
            .ToImmutableArray();
        var centre = space == ModelSpace.Plane ? Centre with { Y = 0 } : Centre;
        b.AddBody(new RigidBody("skid", Kilograms, centre, InertiaMatrix.OfBox(Kilograms, 1.2, 0.8, 0.6), feet));
        b.AddMass(new Mass("gauge", 5) { Location = new Point3(1.4, space == ModelSpace.Plane ? 0 : 0.1, 1.1) });
        var vertical = ImmutableArray.Create(new DirectionalValue(Direction.Z, 2e5), new DirectionalValue(Direction.X, 6e4));
        foreach (var f in feet) b.AddSpring(new Spring("mount-" + f.Name[^1], "skid." + f.Name, Network.Ground, 2e5) { Components = vertical });
        b.AddSpring(new Spring("bracket", "skid", "gauge", 5e4) { Axial = true });
        b.AddDamper(new Damper("pad", "skid.foot-1", Network.Ground, 800) { Components = [new DirectionalValue(Direction.Z, 800)] });
        return b.Build();
    }

    private static XElement Svg(Scene scene, bool animate = false) =>
        SvgAssert.WellFormedWithViewBox(SvgSceneWriter.Write(scene, standalone: !animate, animate));

    private static XElement View(XElement root, string view) =>
        root.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("data-view") == view);

    private static double Data(XElement root, string key) => double.Parse((string)root.Attribute("data-" + key)!, CultureInfo.InvariantCulture);

    private static IReadOnlyList<Point> FrontFace(XElement view, string cssClass) =>
        SvgAssert.PathPoints(view.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("class") == cssClass)
            .Elements(Repository.Svg + "path").Single(p => (string?)p.Attribute("class") == "face front"));

    private static Point CentreOfMass(XElement view, string cssClass) =>
        SvgAssert.Centre(view.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("class") == cssClass)
            .Elements(Repository.Svg + "path").Single(p => (string?)p.Attribute("class") == "centre-of-mass"));

    [Fact]
    public void BoxOfADiagonalInertia_IsTheHomogeneousBoxWithThatInertia()
    {
        // J_xx = m(dy² + dz²)/12 and so on for a homogeneous box (common practice); inverted: dx² = 6(J_yy + J_zz − J_xx)/m.
        var body = new RigidBody("b", 800, new Point3(1, 2, 3), InertiaMatrix.OfBox(800, 2.0, 0.9, 0.5), []);
        var box = SpatialGeometry.BoxOf(body, ModelSpace.ThreeD, 5);
        Assert.Equal(BoxSource.Inertia, box.Source);
        NumericAssert.Close(1.0, box.HalfSize.X, Tolerance.Rel(1e-12), "half dx");
        NumericAssert.Close(0.45, box.HalfSize.Y, Tolerance.Rel(1e-12), "half dy");
        NumericAssert.Close(0.25, box.HalfSize.Z, Tolerance.Rel(1e-12), "half dz");
    }

    [Fact]
    public void BoxOfAnInertiaWithOffDiagonalTerms_ReachesTheFarthestPointAlongEachAxis()
    {
        var points = ImmutableArray.Create(new BodyPoint("a", new Point3(1.5, 0, 0)), new BodyPoint("b", new Point3(0, 0.4, -0.3)));
        var body = new RigidBody("b", 100, new Point3(0.5, 0, 0), new InertiaMatrix(10, 12, 14, Xy: 1), points);
        var box = SpatialGeometry.BoxOf(body, ModelSpace.ThreeD, 5);
        Assert.Equal(BoxSource.Points, box.Source);
        NumericAssert.Close(1.0, box.HalfSize.X, Tolerance.Abs(1e-12), "half x: 1.5 − 0.5");
        NumericAssert.Close(0.4, box.HalfSize.Y, Tolerance.Abs(1e-12), "half y");
        NumericAssert.Close(0.3, box.HalfSize.Z, Tolerance.Abs(1e-12), "half z");
    }

    [Fact]
    public void ShapeMotion_ReadsEachDirectionThroughTheIndexAndTreatsMinusOneAsNoMotion()
    {
        // A mass moving only in z (index 0) and a plane body with x, z, ry (indices 1..3).
        var index = new Dictionary<(string, Direction), int> { [("m", Direction.Z)] = 0, [("b", Direction.X)] = 1, [("b", Direction.Z)] = 2, [("b", Direction.Ry)] = 3 };
        var motion = new ShapeMotion([0.5, -0.25, 0.75, 0.125], (n, d) => index.TryGetValue((n, d), out var i) ? i : -1);
        Assert.Equal(new NodeMotion(new Point3(0, 0, 0.5), default), motion.Of("m"));
        Assert.Equal(new NodeMotion(new Point3(-0.25, 0, 0.75), new Point3(0, 0.125, 0)), motion.Of("b"));
        Assert.Equal(NodeMotion.None, motion.Of(Network.Ground));
    }

    [Fact]
    public void NodeMotion_MovesAPointByTranslationPlusRotationCrossArm()
    {
        // u_p = u_c + θ × (p − c): θ = 0.01 rad about z, arm 2 m along x gives 0.02 m along y (vector identity).
        var motion = new NodeMotion(new Point3(0.001, 0, 0), new Point3(0, 0, 0.01));
        var u = motion.At(new Point3(3, 1, 0), new Point3(1, 1, 0));
        NumericAssert.Close(0.001, u.X, Tolerance.Abs(1e-15), "u_x");
        NumericAssert.Close(0.02, u.Y, Tolerance.Abs(1e-15), "u_y");
        NumericAssert.Close(0, u.Z, Tolerance.Abs(1e-15), "u_z");
    }

    [Fact]
    public void PureRotationAboutY_DrawsTheBoxCornersTurnedAboutTheCentreOfMass()
    {
        var network = Skid();
        var geometry = SpatialGeometry.For(network);
        const double theta = 0.02;
        var motion = new GivenMotion(new Dictionary<string, NodeMotion> { ["skid"] = new(default, new Point3(0, theta, 0)) });
        var root = Svg(SpatialFigure.Mode(geometry, new SpatialOverlay(motion), ["Mode 1: pitch"], []));
        var px = Data(root, "px-per-m");
        var k = Data(root, "motion-scale-m");
        var side = View(root, "side");
        var centre = CentreOfMass(side, "body deformed");
        var restCentre = CentreOfMass(side, "body undeformed");
        // The centre of mass does not move (three-decimal coordinates: 2e-3 px).
        NumericAssert.Close(restCentre.X, centre.X, Tolerance.Abs(2e-3), "centre x (px)");
        NumericAssert.Close(restCentre.Y, centre.Y, Tolerance.Abs(2e-3), "centre y (px)");
        // Front face corners (x, z signs) −−, +−, ++, −+ at half sizes 0.6 and 0.3 m; θ ŷ × r = θ (r_z, 0, −r_x).
        var corners = FrontFace(side, "body deformed");
        var signs = new[] { (-1, -1), (1, -1), (1, 1), (-1, 1) };
        var turn = k * theta;
        var angles = new List<double>();
        for (var i = 0; i < 4; i++)
        {
            var (rx, rz) = (signs[i].Item1 * 0.6, signs[i].Item2 * 0.3);
            var dx = corners[i].X - centre.X;
            var dy = corners[i].Y - centre.Y;
            NumericAssert.Close((rx + turn * rz) * px, dx, Tolerance.Abs(4e-3), $"corner {i} x (px)");
            NumericAssert.Close(-(rz - turn * rx) * px, dy, Tolerance.Abs(4e-3), $"corner {i} y (px)");
            angles.Add(Math.Atan2(-dy, dx) - Math.Atan2(rz, rx));
        }
        // Every corner turned by the same angle, clockwise on the page for a positive ry (x towards −z).
        foreach (var a in angles) NumericAssert.Close(-Math.Atan(turn), Math.IEEERemainder(a, 2 * Math.PI), Tolerance.Abs(1e-4), "turn of a corner (rad)");
        Assert.True(turn > 0.05, $"the rotation is drawn too small to see ({turn:F4} rad)");
        // The largest drawn displacement (a corner: θ |r| with |r| the corner's distance from the axis y) is the stated fraction of the model's size.
        var largest = theta * Math.Sqrt(0.6 * 0.6 + 0.3 * 0.3);
        NumericAssert.Close(0.12 * geometry.Size, k * largest, Tolerance.Rel(1e-12), "drawn largest displacement (m)");
    }

    [Fact]
    public void Bounce_MovesEveryPointUpByTheSameAmountInTheSideViewAndNothingInThePlanView()
    {
        var network = Skid();
        var geometry = SpatialGeometry.For(network);
        var up = new NodeMotion(new Point3(0, 0, 1e-3), default);
        var motion = new GivenMotion(new Dictionary<string, NodeMotion> { ["skid"] = up, ["gauge"] = up });
        var root = Svg(SpatialFigure.Mode(geometry, new SpatialOverlay(motion), ["Mode 1: bounce"], []));
        var px = Data(root, "px-per-m");
        var lift = Data(root, "motion-scale-m") * 1e-3 * px;
        NumericAssert.Close(0.12 * geometry.Size * px, lift, Tolerance.Rel(1e-12), "drawn lift (px) = fraction × size");
        foreach (var (view, expected) in new[] { ("side", lift), ("plan", 0.0) })
        {
            var v = View(root, view);
            var rest = FrontFace(v, "body undeformed").Concat([CentreOfMass(v, "body undeformed")]).ToList();
            var moved = FrontFace(v, "body deformed").Concat([CentreOfMass(v, "body deformed")]).ToList();
            Point Mass(string cssClass) => SvgAssert.Centre(v.Descendants(Repository.Svg + "path").Single(p => (string?)p.Attribute("class") == cssClass && (string?)p.Attribute("data-mass") == "gauge"));
            rest.Add(Mass("mass undeformed"));
            moved.Add(Mass("mass deformed"));
            for (var i = 0; i < rest.Count; i++)
            {
                NumericAssert.Close(0, moved[i].X - rest[i].X, Tolerance.Abs(2e-3), $"{view} point {i} x shift (px)");
                NumericAssert.Close(-expected, moved[i].Y - rest[i].Y, Tolerance.Abs(2e-3), $"{view} point {i} y shift (px)");
            }
        }
    }

    [Fact]
    public void BodiesMassesAndMounts_SitAtTheirLocationsToTheStatedScale()
    {
        var network = Skid();
        var root = Svg(SpatialFigure.Network(SpatialGeometry.For(network), ["Network: skid"], [], new DisplayUnits(UnitSystem.Si)));
        var px = Data(root, "px-per-m");
        foreach (var (view, vertical) in new[] { ("side", (Func<Point3, double>)(p => p.Z)), ("plan", p => p.Y) })
        {
            var v = View(root, view);
            var com = CentreOfMass(v, "body");
            var gauge = SvgAssert.Centre(v.Descendants(Repository.Svg + "path").Single(p => (string?)p.Attribute("data-mass") == "gauge"));
            var gaugeAt = network.Masses[0].Location!.Value;
            NumericAssert.Close((gaugeAt.X - Centre.X) * px, gauge.X - com.X, Tolerance.Abs(2e-3), $"{view}: gauge x from the centre of mass (px)");
            NumericAssert.Close(-(vertical(gaugeAt) - vertical(Centre)) * px, gauge.Y - com.Y, Tolerance.Abs(2e-3), $"{view}: gauge up the page (px)");
            // Mounts run from the feet: the first point of each mount's first line is its foot.
            foreach (var foot in network.Bodies[0].Points)
            {
                var mount = v.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("data-element") == "mount-" + foot.Name[^1]);
                var start = SvgAssert.PathPoints(mount.Elements(Repository.Svg + "path").First())[0];
                NumericAssert.Close((foot.Location.X - Centre.X) * px, start.X - com.X, Tolerance.Abs(2e-3), $"{view}: {foot.Name} x (px)");
                NumericAssert.Close(-(vertical(foot.Location) - vertical(Centre)) * px, start.Y - com.Y, Tolerance.Abs(2e-3), $"{view}: {foot.Name} up the page (px)");
            }
        }
        // One anchor under each foot in the plan view (mount-1 and the pad share the one under foot-1); in the side view
        // the feet at the same x (y = −0.4 and 0.2 m) are drawn on one another, so two anchors.
        foreach (var (view, anchors) in new[] { ("side", 2), ("plan", 4) })
            Assert.Equal(anchors, View(root, view).Descendants(Repository.Svg + "g").Count(g => (string?)g.Attribute("class") == "support"));
    }

    [Fact]
    public void SupportEnds_StayPutWhileTheBodyMoves()
    {
        var network = Skid();
        var geometry = SpatialGeometry.For(network);
        var motion = new GivenMotion(new Dictionary<string, NodeMotion> { ["skid"] = new(new Point3(2e-3, 1e-3, 3e-3), new Point3(0.01, -0.02, 0.005)) });
        var root = Svg(SpatialFigure.Mode(geometry, new SpatialOverlay(motion, Frames: 5), ["Mode"], []), animate: true);
        foreach (var view in new[] { "side", "plan" })
        {
            var v = View(root, view);
            var mount = v.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("data-element") == "mount-1" && ((string)g.Attribute("class")!).Split(' ').Contains("deformed"));
            var rest = v.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("data-element") == "mount-1" && ((string)g.Attribute("class")!).Split(' ').Contains("undeformed"));
            var movedLine = SvgAssert.PathPoints(mount.Elements(Repository.Svg + "path").First());
            var restLine = SvgAssert.PathPoints(rest.Elements(Repository.Svg + "path").First());
            // The ground end is the last point of the first line; the foot end (first point) moves.
            Assert.Equal(restLine[^1], movedLine[^1]);
            Assert.NotEqual(restLine[0], movedLine[0]);
            // The animation has one set of path data per frame.
            var animate = mount.Descendants(Repository.Svg + "animate").First();
            Assert.Equal(5, ((string)animate.Attribute("values")!).Split(';').Length);
        }
    }

    [Fact]
    public void PlaneModel_IsDrawnInTheSideViewOnly()
    {
        var network = Skid(ModelSpace.Plane);
        var root = Svg(SpatialFigure.Network(SpatialGeometry.For(network), ["Network: skid"], ["note"], new DisplayUnits(UnitSystem.Si)));
        Assert.Single(root.Descendants(Repository.Svg + "g"), g => g.Attribute("data-view") is not null);
        View(root, "side");
        Assert.Equal("plane", (string?)root.Attribute("data-space"));
    }

    [Fact]
    public void LineModel_IsRefused()
    {
        var line = new NetworkBuilder().AddMass("m", 1).AddSpring("k", "ground", "m", 1).Build();
        Assert.Throws<ArgumentException>(() => SpatialGeometry.For(line));
    }

    [Fact]
    public void MarkupInNames_StaysStrictXml()
    {
        var b = new NetworkBuilder { Title = "t", Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("<a&\"b'>", 3) { Location = new Point3(0, 0, 1) });
        b.AddSpring(new Spring("k<&>", "<a&\"b'>", Network.Ground, 10) { Components = [new DirectionalValue(Direction.Z, 10)] });
        var geometry = SpatialGeometry.For(b.Build());
        var root = Svg(SpatialFigure.Network(geometry, ["Network: <&>"], [], new DisplayUnits(UnitSystem.Si)));
        Assert.Contains(SvgAssert.Texts(root), t => t.StartsWith("<a&\"b'>", StringComparison.Ordinal));
        Svg(SpatialFigure.Mode(geometry, new SpatialOverlay(new GivenMotion(new Dictionary<string, NodeMotion> { ["<a&\"b'>"] = new(new Point3(0, 0, 1), default) }), Frames: 3), ["m"], []), animate: true);
    }
    /// <summary>The first polyline of each element drawing in <paramref name="view"/> of <paramref name="scene"/>, by element name (frame 0).</summary>
    private static Dictionary<string, ImmutableArray<Point>> ElementPaths(Scene scene, string view, string cssClass)
    {
        var panel = scene.Shapes.OfType<GroupShape>().Single(g => g.Data.TryGetValue("view", out var v) && v == view);
        return panel.Children.OfType<GroupShape>()
            .Where(g => g.Class is { } c && c.StartsWith(cssClass + " ", StringComparison.Ordinal) && g.Data.ContainsKey("element"))
            .ToDictionary(g => g.Data["element"], g => g.Children.OfType<PathShape>().First().Frames[0]);
    }

    [Fact]
    public void ElementsWithTheSameDrawnEnds_AreDrawnSideBySide_SharingTheirEnds()
    {
        // In the side view (seen along y) mount-1 and mount-4 (feet at y = −0.3 and +0.3, same x and z) fall on the same
        // line, and the damper 'pad' joins the same points as mount-1: each must still be seen, not drawn over another.
        var geometry = SpatialGeometry.For(Skid());
        var network = SpatialFigure.Network(geometry, ["Network: skid"], [], new DisplayUnits(UnitSystem.Si));
        var mode = SpatialFigure.Mode(geometry, new SpatialOverlay(new GivenMotion(new Dictionary<string, NodeMotion>
        {
            ["skid"] = new(new Point3(0, 0, 1e-3), new Point3(2e-3, 0, 0)),
        })), ["Mode 1"], []);
        foreach (var (scene, cssClass) in new[] { (network, "element"), (mode, "element undeformed"), (mode, "element deformed") })
        {
            var side = ElementPaths(scene, "side", cssClass);
            Assert.Equal(6, side.Count);
            var group = new[] { "mount-1", "mount-4", "pad" };
            foreach (var name in group)
                foreach (var other in group.Where(o => string.CompareOrdinal(o, name) > 0))
                    Assert.False(side[name].SequenceEqual(side[other]), $"{cssClass}: '{name}' is drawn exactly over '{other}'");
            if (cssClass != "element deformed")
            {
                // Unmoved drawings: the three start at the same drawn foot (ends shared, as parallel elements are drawn), and
                // the middles of their bodies are about SideBySide apart (less a zigzag's half-width).
                var middles = group.Select(n => side[n][side[n].Length / 2]).ToList();
                foreach (var name in group)
                {
                    NumericAssert.Close(side[group[0]][0].X, side[name][0].X, Tolerance.Abs(1e-9), $"{name} foot end x");
                    NumericAssert.Close(side[group[0]][0].Y, side[name][0].Y, Tolerance.Abs(1e-9), $"{name} foot end y");
                }
                var gaps = middles.SelectMany((p, i) => middles.Skip(i + 1).Select(q => Math.Sqrt((p.X - q.X) * (p.X - q.X) + (p.Y - q.Y) * (p.Y - q.Y)))).Order().ToList();
                Assert.True(gaps[0] >= SpatialFigure.SideBySide - 7, $"{cssClass}: bodies only {gaps[0]:F1} apart");
            }
        }
    }
}
