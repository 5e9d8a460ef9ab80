using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Model;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Drawing;

/// <summary>The two orthographic views of a spatial drawing.</summary>
public enum SpatialView
{
    /// <summary>Side view: x to the right, z up, seen along +y (from the −y side).</summary>
    Side,

    /// <summary>Plan view: x to the right, y up the page, seen from above (along −z).</summary>
    Plan,
}

/// <summary>A mode shape (or any motion) to draw over a spatial model.</summary>
/// <param name="Motion">The motion of each node.</param>
/// <param name="Fraction">The largest displacement of any drawn point is drawn as this fraction of the model's largest dimension.</param>
/// <param name="Frames">Animation frames (1 for a still; frame 0 is the full positive amplitude).</param>
public sealed record SpatialOverlay(ISpatialMotion Motion, double Fraction = 0.12, int Frames = 1);

/// <summary>How large a motion is drawn: the factor from motion to drawing metres and the point that moves most.</summary>
/// <param name="Factor">Drawing metres per unit of the motion (0 when nothing moves).</param>
/// <param name="Largest">The largest displacement of any drawn point, in units of the motion.</param>
/// <param name="At">The node whose point moves most (empty when nothing moves).</param>
public readonly record struct MotionScale(double Factor, double Largest, string At);

/// <summary>
/// Draws a plane or 3d model to scale from its mechanical locations, in a side view (x–z) and, for 3d models, a plan
/// view (x–y) below it on the same scale with x aligned: bodies as boxes, point masses as squares, mounts (springs as
/// zigzags, dampers as dashpots) between their attachment points, supports as hatched anchors, and optionally a
/// motion drawn over the undeformed geometry.
/// </summary>
/// <remarks>
/// A displaced point is drawn at p + s u_p with u_p = u_c + θ × (p − c) (the small-rotation map of the analysis), for the
/// box corners and points of a body as for its centre, and s chosen so that the largest drawn displacement is a stated
/// fraction of the model's size (<see cref="Scale"/>). Labels are placed by <see cref="LabelPlacer"/>, so none overlap;
/// a label with no free place is left out and the figure says how many were.
/// </remarks>
public static class SpatialFigure
{
    /// <summary>Width of every spatial figure in user units (as the line drawings).</summary>
    public const double Width = NetworkFigure.Width;

    private const double MarginX = 64;
    private const double PanelTitle = 16;
    private const double PanelMargin = 30;
    private const double HeaderLine = 18;
    private const double FooterLine = 16;
    private const double LabelSize = 10;
    private const double FooterSize = 10.5;
    private const double MassHalf = 5;
    private const double EndOnPixels = 8;
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The views a model of <paramref name="space"/> is drawn in: the side view, and for 3d models the plan view too.</summary>
    public static ImmutableArray<SpatialView> ViewsOf(ModelSpace space) =>
        space == ModelSpace.ThreeD ? [SpatialView.Side, SpatialView.Plan] : [SpatialView.Side];

    /// <summary>The factor that draws the largest displacement of any mass, box corner or body point as <paramref name="fraction"/> of the model's size.</summary>
    public static MotionScale Scale(SpatialGeometry geometry, ISpatialMotion motion, double fraction)
    {
        ArgumentNullException.ThrowIfNull(geometry);
        ArgumentNullException.ThrowIfNull(motion);
        var largest = 0.0;
        var at = "";
        foreach (var n in geometry.Nodes.Where(n => n.Kind != SpatialNodeKind.Support))
        {
            var m = motion.Of(n.Name);
            foreach (var p in DrawnPoints(n))
            {
                var u = m.At(p, n.Location).Length;
                if (u > largest)
                {
                    largest = u;
                    at = n.Name;
                }
            }
        }
        return largest > 0 ? new MotionScale(fraction * geometry.Size / largest, largest, at) : new MotionScale(0, 0, "");
    }

    /// <summary>The model alone: bodies, masses, mounts and supports with their names.</summary>
    public static Scene Network(SpatialGeometry geometry, IReadOnlyList<string> header, IReadOnlyList<string> footer, DisplayUnits units)
    {
        ArgumentNullException.ThrowIfNull(geometry);
        ArgumentNullException.ThrowIfNull(header);
        ArgumentNullException.ThrowIfNull(footer);
        ArgumentNullException.ThrowIfNull(units);
        footer = Wrap(footer);
        // One spare footer line for the note on labels left out, if any.
        var layout = Layout.For(geometry, header.Count, footer.Count + 1, null, 0);
        var shapes = ImmutableArray.CreateBuilder<Shape>();
        Headers(shapes, header);
        var omitted = 0;
        foreach (var panel in layout.Panels)
        {
            var parts = ImmutableArray.CreateBuilder<Shape>();
            ViewTitle(parts, panel);
            var rest = new Drawn(geometry, panel, null, 0, [1.0]);
            // Bodies first: mounts under a body in the plan view, and springs to its centre of mass, stay visible.
            Bodies(parts, geometry, rest, Palette.Structure, "#E8E8E8", 1, "body");
            Anchors(parts, geometry, panel);
            Elements(parts, geometry, rest, Palette.Structure, "element");
            Masses(parts, geometry, rest, Palette.Structure, "#E8E8E8", 1, "mass");
            var placer = new LabelPlacer(panel.LabelBounds);
            BlockSymbols(placer, geometry, rest);
            NodeLabels(parts, placer, geometry, rest, n => n.Kind == SpatialNodeKind.Support
                ? n.Name
                : n.Name + " (" + units.Mass(n.Kilograms, given: true) + " " + units.MassSymbol + ")");
            var offsets = Offsets(geometry, panel);
            for (var i = 0; i < geometry.Elements.Length; i++)
            {
                var e = geometry.Elements[i];
                var a = rest.End(e.A, 0);
                var b = rest.End(e.B, 0);
                var mid = 0.5 * (a + b) + offsets[i] * Across(a, b);
                var clearance = (b - a).Length < EndOnPixels ? 5 : 3;
                if (placer.Place(e.Name, LabelSize - 0.5, LabelPlacer.AroundPoint(mid, clearance, LabelSize - 0.5), "#333333", "label element-name",
                        ImmutableDictionary<string, string>.Empty.Add("element", e.Name)) is { } label)
                    parts.Add(label);
            }
            omitted += placer.Omitted;
            shapes.Add(new GroupShape(parts.ToImmutable()) { Class = "view " + ViewName(panel.View), Data = ViewData(panel) });
        }
        Footer(shapes, layout, OmittedNote(footer, omitted), legend: false);
        var title = header.Count > 0 ? header[0] : "Network";
        return new Scene(Width, layout.Height, title, shapes.ToImmutable(), layout.Data(geometry.Space));
    }

    /// <summary>The undeformed model (grey, dashed) with a motion drawn over it (blue, solid), both views on one scale.</summary>
    public static Scene Mode(SpatialGeometry geometry, SpatialOverlay overlay, IReadOnlyList<string> header, IReadOnlyList<string> footer)
    {
        ArgumentNullException.ThrowIfNull(geometry);
        ArgumentNullException.ThrowIfNull(overlay);
        ArgumentNullException.ThrowIfNull(header);
        ArgumentNullException.ThrowIfNull(footer);
        if (!(overlay.Fraction > 0) || double.IsInfinity(overlay.Fraction))
            throw new ArgumentOutOfRangeException(nameof(overlay), "The drawn fraction must be positive and finite.");
        var scale = Scale(geometry, overlay.Motion, overlay.Fraction);
        var frameCount = Math.Max(1, overlay.Frames);
        var phases = Enumerable.Range(0, frameCount).Select(k => frameCount == 1 ? 1.0 : Math.Cos(2 * Math.PI * k / (frameCount - 1))).ToImmutableArray();
        footer = Wrap(footer);
        // The legend's line and one spare line for the note on labels left out, if any.
        var layout = Layout.For(geometry, header.Count, footer.Count + 2, overlay.Motion, scale.Factor);
        var shapes = ImmutableArray.CreateBuilder<Shape>();
        Headers(shapes, header);
        var omitted = 0;
        foreach (var panel in layout.Panels)
        {
            var parts = ImmutableArray.CreateBuilder<Shape>();
            ViewTitle(parts, panel);
            var rest = new Drawn(geometry, panel, null, 0, [1.0]);
            var moved = new Drawn(geometry, panel, overlay.Motion, scale.Factor, phases);
            Bodies(parts, geometry, rest, Palette.Undeformed, null, 1, "body undeformed");
            Bodies(parts, geometry, moved, Palette.Deformed, Palette.Blue, 0.14, "body deformed");
            Anchors(parts, geometry, panel);
            Elements(parts, geometry, rest, Palette.Undeformed, "element undeformed");
            Elements(parts, geometry, moved, Palette.Deformed, "element deformed");
            Masses(parts, geometry, rest, Palette.Undeformed, null, 1, "mass undeformed");
            Masses(parts, geometry, moved, Palette.Deformed, Palette.Blue, 0.35, "mass deformed");
            var placer = new LabelPlacer(panel.LabelBounds);
            BlockSymbols(placer, geometry, rest);
            BlockSymbols(placer, geometry, moved);
            // Names go with the moved bodies and masses, so a displaced block keeps its name.
            NodeLabels(parts, placer, geometry, moved, n => n.Name);
            omitted += placer.Omitted;
            shapes.Add(new GroupShape(parts.ToImmutable()) { Class = "view " + ViewName(panel.View), Data = ViewData(panel) });
        }
        Footer(shapes, layout, OmittedNote(footer, omitted), legend: true);
        var data = layout.Data(geometry.Space)
            .Add("motion-scale-m", scale.Factor.ToString("R", Inv))
            .Add("drawn-fraction", overlay.Fraction.ToString("R", Inv))
            .Add("largest-at", scale.At);
        var title = header.Count > 0 ? header[0] : "Mode shape";
        return new Scene(Width, layout.Height, title, shapes.ToImmutable(), data);
    }

    /// <summary>"side" or "plan", the name a view carries in class and data attributes.</summary>
    public static string ViewName(SpatialView view) => view == SpatialView.Side ? "side" : "plan";

    private static ImmutableDictionary<string, string> ViewData(Panel panel) => ImmutableDictionary<string, string>.Empty.Add("view", ViewName(panel.View));

    private static IReadOnlyList<string> OmittedNote(IReadOnlyList<string> footer, int omitted) => omitted == 0
        ? footer
        : [.. footer, string.Create(Inv, $"{omitted} label{(omitted == 1 ? " was" : "s were")} left out where {(omitted == 1 ? "it" : "they")} would overlap others; the tables list every name.")];

    /// <summary>The footer notes broken at spaces into lines that fit the figure's width.</summary>
    private static List<string> Wrap(IReadOnlyList<string> lines) => TextMetrics.Wrap(lines, FooterSize, Width - 32);

    private static IEnumerable<Point3> DrawnPoints(SpatialNode n)
    {
        yield return n.Location;
        if (n.Box is { } box)
            foreach (var c in SpatialGeometry.Corners(box)) yield return c;
        foreach (var p in n.Points) yield return p.Location;
    }

    private static void Headers(ImmutableArray<Shape>.Builder shapes, IReadOnlyList<string> header)
    {
        for (var i = 0; i < header.Count; i++)
            shapes.Add(new TextShape(new Point(16, 24 + i * HeaderLine), header[i], i == 0 ? 14 : 11.5, TextAnchor.Start, i == 0)
            { Class = i == 0 ? "figure-title" : "figure-subtitle" });
    }

    private static void ViewTitle(ImmutableArray<Shape>.Builder parts, Panel panel)
    {
        var text = panel.View == SpatialView.Side ? "Side view: x to the right, z up (seen from −y)" : "Plan view: x to the right, y up the page (seen from above)";
        parts.Add(new TextShape(new Point(16, panel.Top + 12), text, 10.5, TextAnchor.Start, false, "#333333") { Class = "view-title" });
    }

    private static void Footer(ImmutableArray<Shape>.Builder shapes, Layout layout, IReadOnlyList<string> footer, bool legend)
    {
        var y = layout.Height - 12 - (footer.Count - 1) * FooterLine;
        if (legend)
        {
            var ly = y - FooterLine - 2;
            shapes.Add(PathShape.Still([new Point(16, ly - 4), new Point(46, ly - 4)], Palette.Undeformed) with { Class = "legend undeformed" });
            shapes.Add(new TextShape(new Point(52, ly), "undeformed", 10.5) { Class = "legend" });
            shapes.Add(PathShape.Still([new Point(130, ly - 4), new Point(160, ly - 4)], Palette.Deformed) with { Class = "legend deformed" });
            shapes.Add(new TextShape(new Point(166, ly), "mode shape", 10.5) { Class = "legend" });
        }
        for (var i = 0; i < footer.Count; i++)
            shapes.Add(new TextShape(new Point(16, y + i * FooterLine), footer[i], FooterSize, TextAnchor.Start, false, "#333333") { Class = "figure-note" });
    }

    /// <summary>Hatched anchors where elements meet supports (they never move), and at located supports nothing meets.</summary>
    private static void Anchors(ImmutableArray<Shape>.Builder parts, SpatialGeometry geometry, Panel panel)
    {
        var drawn = new HashSet<(double, double, double, double)>();
        void Add(Point at, Point towards, string support)
        {
            var d = towards - at;
            var u = d.Length >= EndOnPixels ? (1 / d.Length) * d : new Point(0, -1);
            if (!drawn.Add((Math.Round(at.X, 1), Math.Round(at.Y, 1), Math.Round(u.X, 2), Math.Round(u.Y, 2)))) return;
            var n = new Point(-u.Y, u.X);
            const double half = 10;
            var pen = Palette.Support;
            var lines = ImmutableArray.CreateBuilder<Shape>();
            lines.Add(PathShape.Still([at - half * n, at + half * n], pen with { Width = 1.8 }));
            for (var k = 0; k <= 4; k++)
            {
                var b = at + (-half + k * 2 * half / 4) * n;
                lines.Add(PathShape.Still([b, b - 5 * u - 5 * n], pen));
            }
            parts.Add(new GroupShape(lines.ToImmutable()) { Class = "support", Data = ImmutableDictionary<string, string>.Empty.Add("support", support) });
        }
        foreach (var e in geometry.Elements)
        {
            if (e.A.IsSupport) Add(panel.Map(e.A.Location), panel.Map(e.B.Location), e.A.Node);
            if (e.B.IsSupport) Add(panel.Map(e.B.Location), panel.Map(e.A.Location), e.B.Node);
        }
        var met = geometry.Elements.SelectMany(e => new[] { e.A, e.B }).Where(x => x.IsSupport).Select(x => x.Node).ToHashSet(StringComparer.Ordinal);
        foreach (var s in geometry.Nodes.Where(n => n.Kind == SpatialNodeKind.Support && !met.Contains(n.Name)))
        {
            var at = panel.Map(s.Location);
            Add(at, at + new Point(0, -20), s.Name);
        }
    }

    private static void Elements(ImmutableArray<Shape>.Builder parts, SpatialGeometry geometry, Drawn drawn, Pen pen, string cssClass)
    {
        var offsets = Offsets(geometry, drawn.Panel);
        for (var i = 0; i < geometry.Elements.Length; i++)
        {
            var e = geometry.Elements[i];
            var restA = drawn.Panel.Map(e.A.Location);
            var restB = drawn.Panel.Map(e.B.Location);
            var endOn = (restB - restA).Length < EndOnPixels;
            var across = offsets[i];
            var geometryPerFrame = Enumerable.Range(0, drawn.FrameCount)
                .Select(f => ElementLines(e.Kind, drawn.End(e.A, f), drawn.End(e.B, f), endOn, across))
                .ToArray();
            var lines = ImmutableArray.CreateBuilder<Shape>();
            for (var p = 0; p < geometryPerFrame[0].Length; p++)
                lines.Add(new PathShape([.. geometryPerFrame.Select(g => g[p])], pen, Closed: endOn && p == 1));
            parts.Add(new GroupShape(lines.ToImmutable())
            {
                Class = cssClass + " " + NetworkFigure.KindClass(e.Kind) + (endOn ? " end-on" : ""),
                Data = ImmutableDictionary<string, string>.Empty.Add("element", e.Name),
            });
        }
    }

    /// <summary>Distance (figure units) between the bodies of elements drawn side by side.</summary>
    public const double SideBySide = 14;

    /// <summary>
    /// The sideways offset of each element's drawing (figure units, along <see cref="Across"/>): 0 for an element alone,
    /// and for elements whose ends fall on the same drawn points in this view (the two mounts of a skid's side seen
    /// along y, a spring and a damper between the same points) offsets <see cref="SideBySide"/> apart, centred on the
    /// line, so each is drawn on its own: ends shared, bodies side by side, as parallel elements are drawn.
    /// </summary>
    private static double[] Offsets(SpatialGeometry geometry, Panel panel)
    {
        var offsets = new double[geometry.Elements.Length];
        var groups = Enumerable.Range(0, geometry.Elements.Length).GroupBy(i =>
        {
            var (a, b) = (panel.Map(geometry.Elements[i].A.Location), panel.Map(geometry.Elements[i].B.Location));
            return Reversed(a, b) ? (Pixel(b), Pixel(a)) : (Pixel(a), Pixel(b));
        });
        foreach (var group in groups)
        {
            var members = group.ToArray();
            for (var k = 0; k < members.Length; k++)
            {
                var e = geometry.Elements[members[k]];
                var (a, b) = (panel.Map(e.A.Location), panel.Map(e.B.Location));
                // The same physical side for an element written B-to-A: its 'across' direction is the other way round.
                offsets[members[k]] = (k - 0.5 * (members.Length - 1)) * SideBySide * (Reversed(a, b) ? -1 : 1);
            }
        }
        return offsets;
    }

    private static (long, long) Pixel(Point p) => ((long)Math.Round(p.X), (long)Math.Round(p.Y));

    private static bool Reversed(Point a, Point b) => Pixel(b).CompareTo(Pixel(a)) < 0;

    /// <summary>The unit vector across the line from <paramref name="a"/> to <paramref name="b"/> (to the right of the page for an end-on element).</summary>
    private static Point Across(Point a, Point b)
    {
        var d = b - a;
        return d.Length < EndOnPixels ? new Point(1, 0) : new Point(-d.Y / d.Length, d.X / d.Length);
    }

    /// <summary>The polylines of one element, in a fixed count and order so frames can be animated.</summary>
    /// <remarks>An element seen end-on in a view (its ends within a few pixels) is a line between its ends and a small ring at its
    /// first end. <paramref name="offset"/> moves the element's body (zigzag, dashpot, ring) sideways, its ends staying in place.</remarks>
    private static ImmutableArray<Point>[] ElementLines(ElementKind kind, Point a, Point b, bool endOn, double offset)
    {
        if (endOn)
        {
            var centre = a + new Point(offset, 0);
            var ring = Enumerable.Range(0, 8).Select(k => centre + new Point(4 * Math.Cos(k * Math.PI / 4), 4 * Math.Sin(k * Math.PI / 4)));
            return [[a, b], [.. ring]];
        }
        var d = b - a;
        var length = d.Length;
        var u = length > 1e-9 ? (1 / length) * d : new Point(0, -1);
        var n = new Point(-u.Y, u.X);
        Point At(double t, double across) => a + t * length * u + (across + offset) * n;
        if (kind == ElementKind.Spring)
        {
            var w = Math.Clamp(0.12 * length, 3, 6);
            var points = new List<Point> { a, At(0.2, 0) };
            const int zigs = 8;
            for (var k = 0; k < zigs; k++) points.Add(At(0.2 + (k + 0.5) * 0.6 / zigs, k % 2 == 0 ? w : -w));
            points.Add(At(0.8, 0));
            points.Add(b);
            return [[.. points]];
        }
        if (kind == ElementKind.Inerter) return NetworkFigure.Flywheel(At, length);
        var c = Math.Clamp(0.14 * length, 3, 7);
        return
        [
            [a, At(0.36, 0)],
            [At(0.64, c), At(0.36, c), At(0.36, -c), At(0.64, -c)],
            [b, At(0.52, 0)],
            [At(0.52, 0.7 * c), At(0.52, -0.7 * c)],
        ];
    }

    private static void Bodies(ImmutableArray<Shape>.Builder parts, SpatialGeometry geometry, Drawn drawn, Pen pen, string? fill, double fillOpacity, string cssClass)
    {
        foreach (var body in geometry.Nodes.Where(n => n.Box is not null))
        {
            var box = body.Box!;
            var (front, back) = drawn.Panel.View == SpatialView.Side ? (-1, 1) : (1, -1);
            Point3 Corner(int sa, int sb, int depth) => drawn.Panel.View == SpatialView.Side ? box.Corner(sa, depth, sb) : box.Corner(sa, sb, depth);
            int[][] quad = [[-1, -1], [1, -1], [1, 1], [-1, 1]];
            ImmutableArray<ImmutableArray<Point>> Face(int depth) =>
                [.. Enumerable.Range(0, drawn.FrameCount).Select(f => quad.Select(q => drawn.Of(body, Corner(q[0], q[1], depth), f)).ToImmutableArray())];
            var group = ImmutableArray.CreateBuilder<Shape>();
            group.Add(new PathShape(Face(back), pen with { Opacity = 0.55 }, null, Closed: true) { Class = "face back" });
            foreach (var q in quad)
                group.Add(new PathShape([.. Enumerable.Range(0, drawn.FrameCount).Select(f => ImmutableArray.Create(
                    drawn.Of(body, Corner(q[0], q[1], front), f), drawn.Of(body, Corner(q[0], q[1], back), f)))], pen with { Opacity = 0.55 }) { Class = "edge" });
            group.Add(new PathShape(Face(front), pen, fill, Closed: true, fillOpacity) { Class = "face front" });
            // The centre of mass: a small ring with a cross.
            var ring = Enumerable.Range(0, drawn.FrameCount).Select(f => drawn.Of(body, body.Location, f)).ToArray();
            group.Add(new PathShape([.. ring.Select(c => Enumerable.Range(0, 8).Select(k => c + new Point(3.5 * Math.Cos(k * Math.PI / 4), 3.5 * Math.Sin(k * Math.PI / 4))).ToImmutableArray())],
                pen with { Width = 1, Dash = null }, fill is null ? null : pen.Color, Closed: true) { Class = "centre-of-mass" });
            foreach (var p in body.Points)
                group.Add(new PathShape([.. Enumerable.Range(0, drawn.FrameCount).Select(f =>
                {
                    var c = drawn.Of(body, p.Location, f);
                    return ImmutableArray.Create(c + new Point(-2, -2), c + new Point(2, -2), c + new Point(2, 2), c + new Point(-2, 2));
                })], pen with { Width = 1, Dash = null }, pen.Color, Closed: true)
                { Class = "point", Data = ImmutableDictionary<string, string>.Empty.Add("point", body.Name + "." + p.Name) });
            parts.Add(new GroupShape(group.ToImmutable()) { Class = cssClass, Data = ImmutableDictionary<string, string>.Empty.Add("body", body.Name) });
        }
    }

    private static void Masses(ImmutableArray<Shape>.Builder parts, SpatialGeometry geometry, Drawn drawn, Pen pen, string? fill, double fillOpacity, string cssClass)
    {
        foreach (var mass in geometry.Nodes.Where(n => n.Kind == SpatialNodeKind.Mass))
        {
            var frames = Enumerable.Range(0, drawn.FrameCount).Select(f =>
            {
                var c = drawn.Of(mass, mass.Location, f);
                return ImmutableArray.Create(c + new Point(-MassHalf, -MassHalf), c + new Point(MassHalf, -MassHalf),
                    c + new Point(MassHalf, MassHalf), c + new Point(-MassHalf, MassHalf));
            });
            parts.Add(new PathShape([.. frames], pen, fill, Closed: true, fillOpacity)
            {
                Class = cssClass,
                Data = ImmutableDictionary<string, string>.Empty.Add("mass", mass.Name),
            });
        }
    }

    private static void BlockSymbols(LabelPlacer placer, SpatialGeometry geometry, Drawn drawn)
    {
        foreach (var n in geometry.Nodes.Where(n => n.Kind != SpatialNodeKind.Support))
            placer.Block(Rect.Around(drawn.Of(n, n.Location, 0), n.Kind == SpatialNodeKind.Mass ? MassHalf + 1 : 4.5));
    }

    private static void NodeLabels(ImmutableArray<Shape>.Builder parts, LabelPlacer placer, SpatialGeometry geometry, Drawn drawn, Func<SpatialNode, string> text)
    {
        // Bodies first (the largest things), then masses, then located supports.
        foreach (var n in geometry.Nodes.OrderBy(n => n.Kind switch { SpatialNodeKind.Body => 0, SpatialNodeKind.Mass => 1, _ => 2 }))
        {
            var data = ImmutableDictionary<string, string>.Empty.Add("for", n.Name);
            var centre = drawn.Of(n, n.Location, 0);
            var candidates = n.Box is { } cuboid
                ? LabelPlacer.AroundArea(Bounds(SpatialGeometry.Corners(cuboid).Select(c => drawn.Of(n, c, 0))), LabelSize)
                : LabelPlacer.AroundPoint(centre, n.Kind == SpatialNodeKind.Mass ? MassHalf : 10, LabelSize);
            var color = n.Kind == SpatialNodeKind.Support ? "#333333" : Palette.Black;
            if (placer.Place(text(n), LabelSize, candidates, color, "label node-name", data) is not { } label) continue;
            // A label pushed away from a small symbol by its neighbours gets a thin leader line back to it.
            var area = TextMetrics.Box(label);
            var near = new Point(Math.Clamp(centre.X, area.Left, area.Right), Math.Clamp(centre.Y, area.Top, area.Bottom));
            if (n.Box is null && (near - centre).Length > 2.5 * LabelSize)
                parts.Add(PathShape.Still([centre, near], new Pen(Palette.Grey, 0.6)) with { Class = "leader", Data = data });
            parts.Add(label);
        }
    }

    private static Rect Bounds(IEnumerable<Point> points)
    {
        var list = points.ToList();
        return new Rect(list.Min(p => p.X), list.Min(p => p.Y), list.Max(p => p.X), list.Max(p => p.Y));
    }

    /// <summary>Where things are drawn in one view, at rest (no motion) or moved by a motion in every frame.</summary>
    private sealed class Drawn(SpatialGeometry geometry, Panel panel, ISpatialMotion? motion, double factor, ImmutableArray<double> phases)
    {
        private readonly Dictionary<string, NodeMotion> _motions = geometry.Nodes.ToDictionary(
            n => n.Name, n => motion is null || n.Kind == SpatialNodeKind.Support ? NodeMotion.None : motion.Of(n.Name), StringComparer.Ordinal);

        public Panel Panel { get; } = panel;

        public int FrameCount => phases.Length;

        /// <summary>The drawn position of point <paramref name="p"/> fixed to node <paramref name="node"/> in frame <paramref name="frame"/>.</summary>
        public Point Of(SpatialNode node, Point3 p, int frame)
        {
            var u = _motions[node.Name].At(p, node.Location);
            var s = factor * phases[frame];
            return Panel.Map(new Point3(p.X + s * u.X, p.Y + s * u.Y, p.Z + s * u.Z));
        }

        /// <summary>The drawn position of an element end (a support end never moves).</summary>
        public Point End(SpatialEnd end, int frame) =>
            end.IsSupport || !_motions.ContainsKey(end.Node) ? Panel.Map(end.Location) : Of(geometry.Node(end.Node), end.Location, frame);
    }

    /// <summary>One view's place on the page and its mapping from model metres to figure units.</summary>
    private sealed record Panel(SpatialView View, double Top, double BodyTop, double Bottom, double Left, double MinA, double MaxB, double PixelsPerMetre)
    {
        public Point Map(Point3 p) => new(Left + (p.X - MinA) * PixelsPerMetre, BodyTop + (MaxB - (View == SpatialView.Side ? p.Z : p.Y)) * PixelsPerMetre);

        public Rect LabelBounds => new(4, Top + PanelTitle + 2, Width - 4, Bottom);
    }

    private sealed record Layout(ImmutableArray<Panel> Panels, double Height, double PixelsPerMetre)
    {
        public ImmutableDictionary<string, string> Data(ModelSpace space) => ImmutableDictionary<string, string>.Empty
            .Add("px-per-m", PixelsPerMetre.ToString("R", Inv))
            .Add("space", space == ModelSpace.ThreeD ? "3d" : "plane");

        public static Layout For(SpatialGeometry geometry, int headerLines, int footerLines, ISpatialMotion? motion, double factor)
        {
            var points = geometry.RestPoints().ToList();
            if (motion is not null && factor > 0)
                foreach (var n in geometry.Nodes.Where(n => n.Kind != SpatialNodeKind.Support))
                {
                    var m = motion.Of(n.Name);
                    foreach (var p in DrawnPoints(n))
                    {
                        var u = m.At(p, n.Location);
                        points.Add(new Point3(p.X + factor * u.X, p.Y + factor * u.Y, p.Z + factor * u.Z));
                        points.Add(new Point3(p.X - factor * u.X, p.Y - factor * u.Y, p.Z - factor * u.Z));
                    }
                }
            var views = ViewsOf(geometry.Space);
            var floor = 0.05 * geometry.Size;
            var minA = points.Min(p => p.X);
            var spanA = Math.Max(points.Max(p => p.X) - minA, floor);
            double MaxB(SpatialView v) => v == SpatialView.Side ? points.Max(p => p.Z) : points.Max(p => p.Y);
            double SpanB(SpatialView v) => Math.Max(v == SpatialView.Side ? MaxB(v) - points.Min(p => p.Z) : MaxB(v) - points.Min(p => p.Y), floor);
            var maxPanel = views.Length == 1 ? 420.0 : 290.0;
            var s = (Width - 2 * MarginX) / spanA;
            foreach (var v in views) s = Math.Min(s, maxPanel / SpanB(v));
            // A model narrower than the floor span is centred on the page.
            var left = (Width - spanA * s) / 2;
            var top = 16 + headerLines * HeaderLine + 6;
            var panels = ImmutableArray.CreateBuilder<Panel>();
            foreach (var v in views)
            {
                var bodyTop = top + PanelTitle + PanelMargin;
                var bottom = bodyTop + SpanB(v) * s + PanelMargin;
                // A flat view (its span raised to the floor) is centred in its band.
                var extra = (SpanB(v) - (v == SpatialView.Side ? MaxB(v) - points.Min(p => p.Z) : MaxB(v) - points.Min(p => p.Y))) / 2;
                panels.Add(new Panel(v, top, bodyTop, bottom, left + (spanA - (points.Max(p => p.X) - minA)) / 2 * s, minA, MaxB(v) + extra, s));
                top = bottom + 8;
            }
            var height = Math.Ceiling(top + 10 + footerLines * FooterLine + 8);
            return new Layout(panels.ToImmutable(), height, s);
        }
    }
}
