using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;
using SkiaSharp;
using Point = ModalChain.Reports.Drawing.Point;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>Labels of the spatial figures never overlap: checked with the glyph advances and font metrics of the figures' font itself.</summary>
public sealed class LabelPlacementTests
{
    /// <summary>The figures' font as SkiaSharp lays it out (CI installs fonts-dejavu-core).</summary>
    private static SKPaint Font(double size, bool bold)
    {
        var typeface = SKTypeface.FromFamilyName(Scene.FontFamily, bold ? SKFontStyle.Bold : SKFontStyle.Normal);
        Assert.True(typeface is not null && typeface.FamilyName == Scene.FontFamily, $"the font '{Scene.FontFamily}' is not installed (Debian: fonts-dejavu-core)");
        return new SKPaint { Typeface = typeface, TextSize = (float)size };
    }

    /// <summary>The box a text really occupies: its advance width, and the font's ascent and descent around the baseline.</summary>
    internal static Rect Measured(TextShape text)
    {
        using var paint = Font(text.Size, text.Bold);
        var width = paint.MeasureText(text.Text);
        var metrics = paint.FontMetrics;
        var left = text.Anchor switch
        {
            TextAnchor.Middle => text.At.X - width / 2,
            TextAnchor.End => text.At.X - width,
            _ => text.At.X,
        };
        return new Rect(left, text.At.Y + metrics.Ascent, left + width, text.At.Y + metrics.Descent);
    }

    internal static IEnumerable<TextShape> Texts(IEnumerable<Shape> shapes)
    {
        foreach (var s in shapes)
        {
            if (s is TextShape t) yield return t;
            if (s is GroupShape g)
                foreach (var c in Texts(g.Children)) yield return c;
        }
    }

    /// <summary>Twelve masses crowded round a body on four mounts, with long names: more labels than fit beside each symbol.</summary>
    private static Network Crowded()
    {
        var b = new NetworkBuilder { Title = "crowded", Space = ModelSpace.ThreeD };
        var feet = new[] { (-0.4, -0.3), (0.4, -0.3), (0.4, 0.3), (-0.4, 0.3) }
            .Select((f, i) => new BodyPoint($"corner-foot-{i + 1}", new Point3(f.Item1, f.Item2, 0))).ToImmutableArray();
        b.AddBody(new RigidBody("instrument-cabinet", 400, new Point3(0, 0, 0.6), InertiaMatrix.OfBox(400, 0.8, 0.6, 1.2), feet));
        var random = new Random(20261202);
        for (var i = 0; i < 12; i++)
        {
            var name = $"sensor-bracket-{i + 1:00}";
            b.AddMass(new Mass(name, 2 + i) { Location = new Point3(-0.6 + 0.1 * i, 0.05 * random.NextDouble(), 1.0 + 0.05 * random.NextDouble()) });
            b.AddSpring(new Spring($"bracket-spring-{i + 1:00}", "instrument-cabinet", name, 1e4) { Axial = true });
        }
        foreach (var f in feet)
            b.AddSpring(new Spring("isolator-" + f.Name, "instrument-cabinet." + f.Name, Network.Ground, 3e5)
            { Components = [new DirectionalValue(Direction.Z, 3e5), new DirectionalValue(Direction.X, 1e5), new DirectionalValue(Direction.Y, 1e5)] });
        return b.Build();
    }

    [Fact]
    public void EstimatedWidths_AreNeverNarrowerThanTheFontsAdvances()
    {
        // Every printable ASCII character alone, and names of the kind models use.
        var samples = Enumerable.Range(32, 95).Select(c => new string((char)c, 1))
            .Concat(["instrument-cabinet (400 kg)", "MMMWWW", "mount-1", "sensor-bracket-12", "Side view: x to the right, z up (seen from −y)", "ΩμÅ"]);
        foreach (var text in samples)
            foreach (var size in new[] { 9.5, 10.0, 14.0 })
            {
                using var paint = Font(size, false);
                Assert.True(TextMetrics.Width(text, size) >= paint.MeasureText(text), $"'{text}' at {size}: estimate {TextMetrics.Width(text, size):F2} < font {paint.MeasureText(text):F2}");
                Assert.True(TextMetrics.Ascent * size >= -paint.FontMetrics.Ascent && TextMetrics.Descent * size >= paint.FontMetrics.Descent, "font taller than the estimate");
            }
    }

    [Fact]
    public void CrowdedModel_NoTwoLabelsOverlapInTheNetworkOrTheModeFigure()
    {
        var geometry = SpatialGeometry.For(Crowded());
        var rock = new GivenMotion(new Dictionary<string, NodeMotion>
        {
            ["instrument-cabinet"] = new(new Point3(1e-3, 0, 0), new Point3(0, 4e-3, 2e-3)),
            ["sensor-bracket-03"] = new(new Point3(0, 2e-3, -1e-3), default),
        });
        var scenes = new[]
        {
            SpatialFigure.Network(geometry, ["Network: crowded", "13 nodes"], ["Locations from the model, to scale. Bodies are drawn as the homogeneous box with their mass and inertia. Mounts to a support without a location are drawn down to an anchor below their other end."], new DisplayUnits(UnitSystem.Si)),
            SpatialFigure.Mode(geometry, new SpatialOverlay(rock), ["Mode 3: 12.5 Hz", "coupled sway + roll"], ["The largest motion is drawn as 12 % of the model's size."]),
        };
        foreach (var scene in scenes)
        {
            var texts = Texts(scene.Shapes).ToList();
            var names = texts.Where(t => t.Class is not null && t.Class.Contains("label", StringComparison.Ordinal)).ToList();
            // Not a vacuous check: most of the 13 node names (and, in the network figure, mount names) were placed.
            Assert.True(names.Count >= 10, $"only {names.Count} labels were placed in '{scene.Title}'");
            var boxes = texts.Select(t => (t.Text, Box: Measured(t))).ToList();
            for (var i = 0; i < boxes.Count; i++)
            {
                Assert.True(boxes[i].Box.Left >= 0 && boxes[i].Box.Right <= scene.Width && boxes[i].Box.Top >= 0 && boxes[i].Box.Bottom <= scene.Height,
                    $"'{boxes[i].Text}' leaves the figure in '{scene.Title}'");
                for (var j = i + 1; j < boxes.Count; j++)
                    Assert.False(boxes[i].Box.Intersects(boxes[j].Box), $"'{boxes[i].Text}' overlaps '{boxes[j].Text}' in '{scene.Title}'");
            }
            var omittedNote = texts.Any(t => t.Text.Contains("left out where", StringComparison.Ordinal));
            var expectedLabels = geometry.Nodes.Length + (scene == scenes[0] ? geometry.Elements.Length : 0);
            // Either every label of both views is there, or the figure says how many were left out.
            Assert.True(omittedNote || names.Count == 2 * expectedLabels, $"{names.Count} of {2 * expectedLabels} labels placed and no note in '{scene.Title}'");
        }
    }

    [Fact]
    public void Placer_SkipsACandidateThatWouldCoverAPlacedLabel()
    {
        var placer = new LabelPlacer(new Rect(0, 0, 400, 200));
        var first = placer.Place("first-label", 10, [(new Point(100, 100), TextAnchor.Start)], "#000000", "label");
        var second = placer.Place("second", 10, [(new Point(105, 102), TextAnchor.Start), (new Point(100, 130), TextAnchor.Start)], "#000000", "label");
        Assert.NotNull(first);
        Assert.NotNull(second);
        Assert.Equal(new Point(100, 130), second!.At);
        Assert.Null(placer.Place("third", 10, [(new Point(101, 101), TextAnchor.Start)], "#000000", "label"));
        Assert.Equal(1, placer.Omitted);
    }

    [Fact]
    public void AlongLine_TriesTheRightOfAnUprightLineFirst_AndAboveALevelOne()
    {
        var upright = LabelPlacer.AlongLine(new Point(100, 200), new Point(100, 100), 8, 10, 60).First();
        Assert.Equal(TextAnchor.Start, upright.Anchor);
        // Closed form: right of the line by the clearance and 2 units of air; its middle at mid-height.
        NumericAssert.Close(100 + 8 + 2, upright.At.X, Tolerance.Abs(1e-12), "x of the first candidate");
        NumericAssert.Close(150, upright.At.Y, Tolerance.Abs(1e-12), "y of the first candidate");
        var level = LabelPlacer.AlongLine(new Point(0, 50), new Point(200, 50), 8, 10, 60).First();
        Assert.Equal(TextAnchor.Middle, level.Anchor);
        Assert.True(level.At.Y <= 50 - 8, "the first candidate of a level line is above it");
    }

    [Fact]
    public void AlongLine_NoCandidateBoxReachesTheSymbol()
    {
        // Geometry: for a line at any angle, each candidate label's box (the estimated box the placer checks) lies wholly
        // on one side of the line, every corner more than 'clearance' from it, so it cannot cover the symbol drawn on it.
        const double clearance = 9, size = 9.5;
        foreach (var angle in new[] { 0.0, 30, 45, 90, 120, 180, 250, 300 })
        {
            var a = new Point(300, 300);
            var r = angle * Math.PI / 180;
            var b = a + 120 * new Point(Math.Cos(r), -Math.Sin(r));
            var u = (1.0 / 120) * (b - a);
            var n = new Point(-u.Y, u.X);
            const string text = "flywheel 360 kg";
            foreach (var (at, anchor) in LabelPlacer.AlongLine(a, b, clearance, size, TextMetrics.Width(text, size)))
            {
                var box = TextMetrics.Box(new TextShape(at, text, size, anchor));
                var corners = new[] { new Point(box.Left, box.Top), new Point(box.Right, box.Top), new Point(box.Left, box.Bottom), new Point(box.Right, box.Bottom) };
                var across = corners.Select(c => (c - a).X * n.X + (c - a).Y * n.Y).ToArray();
                var sameSide = across.All(d => d > 0) || across.All(d => d < 0);
                Assert.True(sameSide && across.Min(Math.Abs) >= clearance, $"angle {angle}: box {box} at {at} ({anchor}) reaches the line's band");
            }
        }
    }

    [Fact]
    public void Wrap_KeepsEveryWordInOrder_AndFitsTheWidth()
    {
        var text = "Positions laid out automatically (masses stacked by their distance from the supports), since not every mass has a distinct 'at'.";
        var lines = TextMetrics.Wrap([text, "short"], 10.5, 300);
        Assert.True(lines.Count >= 3);
        Assert.Equal("short", lines[^1]);
        Assert.Equal(text, string.Join(" ", lines.Take(lines.Count - 1)));        // identity: nothing lost or reordered
        Assert.All(lines, l => Assert.True(TextMetrics.Width(l, 10.5) <= 300, $"'{l}' is wider than 300"));
        Assert.Equal(["a-single-word-longer-than-the-width"], TextMetrics.Wrap(["a-single-word-longer-than-the-width"], 10.5, 50));
    }
}
