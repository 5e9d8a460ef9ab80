using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Drawing;

/// <summary>A mode shape to draw over the network.</summary>
/// <param name="Shape">Mode shape normalised to max |φ| = 1, one entry per mass in the layout's order.</param>
/// <param name="ReferenceMass">The mass where |φ| is largest (φ = +1 there).</param>
/// <param name="ShapeScale">Drawing length in m that a normalised displacement of 1 is drawn as.</param>
/// <param name="Frames">Animation frames (1 for a still; the still is frame 0 at full positive amplitude).</param>
public sealed record ModeOverlay(ImmutableArray<double> Shape, string ReferenceMass, double ShapeScale, int Frames = 1)
{
    /// <summary>
    /// Indexes of the masses drawn at rest whatever their shape value: the electrical nodes of a transducer model, whose
    /// values are flux linkages, not displacements. Their value is printed beside them, marked as electrical.
    /// </summary>
    public ImmutableHashSet<int> AtRest { get; init; } = [];
}

/// <summary>Draws a network as a schematic (masses as blocks, springs as zigzags, dampers as dashpots, supports hatched), optionally with a mode shape.</summary>
/// <remarks>
/// Displacements are drawn across the chain (horizontally for a vertical chain, positive to the right; vertically for a
/// horizontal chain, positive upwards), as textbooks draw the mode shapes of spring-mass chains, so masses never
/// overlap. The figure states the scale: a normalised displacement of 1 is drawn as <see cref="ModeOverlay.ShapeScale"/>
/// metres of the drawing, at the drawing scale written on the root element (<c>data-px-per-m</c>).
/// </remarks>
public static class NetworkFigure
{
    /// <summary>Width of every schematic in user units (fits an A4 or Letter text column).</summary>
    public const double Width = 680;

    private const double MarginX = 70;
    private const double BodyMargin = 34;
    private const double HeaderLine = 18;
    private const double FooterLine = 16;
    private const double MaxBodyHeight = 520;
    private const double MaxPixelsPerSpacing = 150;

    /// <summary>A drawing length for "1 unit of normalised displacement": a round number near half the drawing's length along the chain.</summary>
    public static double NiceShapeScale(NetworkLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        var along = AlongPoints(layout).ToArray();
        var extent = Math.Max(along.Max() - along.Min(), layout.Spacing);
        var target = 0.42 * extent;
        var decade = Math.Pow(10, Math.Floor(Math.Log10(target)));
        var nice = new[] { 1, 2, 2.5, 5, 10 }.Select(f => f * decade).Last(v => v <= target * 1.0001);
        return nice;
    }

    /// <summary>The network alone: names, masses and element values.</summary>
    public static Scene Network(NetworkLayout layout, IReadOnlyList<string> header, IReadOnlyList<string> footer, DisplayUnits units,
        IReadOnlyDictionary<string, double> massKilograms)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(units);
        var frame = Frame.For(layout, header.Count, footer.Count + 1, null);
        var shapes = ImmutableArray.CreateBuilder<Shape>();
        Headers(shapes, header);
        var centres = layout.Masses.Select(m => frame.Map(m.At)).ToArray();
        DrawSupports(shapes, layout, frame, centres);
        DrawElements(shapes, layout, frame, [centres], Palette.Structure, "element", labels: frame.Labels, units);
        DrawMasses(shapes, layout, frame, [centres], Palette.Structure, "#E8E8E8", 1, "mass", frame.Labels);
        if (frame.Labels)
            for (var i = 0; i < centres.Length; i++)
            {
                var name = layout.Masses[i].Name;
                var value = units.Mass(massKilograms[name], given: true) + " " + units.MassSymbol;
                shapes.Add(new TextShape(centres[i] + new Point(frame.HalfWidth + 5, 4), value, 10, TextAnchor.Start, false, "#333333") { Class = "mass-value" });
            }
        Footer(shapes, frame, footer, legend: null);
        return new Scene(Width, frame.Height, header.Count > 0 ? header[0] : "Network", shapes.ToImmutable(), frame.Data);
    }

    /// <summary>The network undeformed (grey, dashed) with a mode shape drawn over it (blue, solid).</summary>
    public static Scene Mode(NetworkLayout layout, ModeOverlay mode, IReadOnlyList<string> header, IReadOnlyList<string> footer)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(mode);
        if (mode.Shape.Length != layout.Masses.Length)
            throw new ArgumentException($"The shape has {mode.Shape.Length} entries but the network has {layout.Masses.Length} masses.", nameof(mode));
        var frame = Frame.For(layout, header.Count, footer.Count + 1, mode.ShapeScale);
        var shapes = ImmutableArray.CreateBuilder<Shape>();
        Headers(shapes, header);
        var rest = layout.Masses.Select(m => frame.Map(m.At)).ToArray();
        var across = frame.AcrossPixels(mode.ShapeScale);
        var frames = Enumerable.Range(0, Math.Max(1, mode.Frames))
            .Select(k => Math.Cos(2 * Math.PI * k / Math.Max(1, mode.Frames - 1)))
            .Select(phase => rest.Select((c, i) => mode.AtRest.Contains(i) ? c : c + phase * mode.Shape[i] * across).ToArray())
            .ToArray();

        DrawSupports(shapes, layout, frame, rest);
        DrawElements(shapes, layout, frame, [rest], Palette.Undeformed, "element undeformed", labels: false, null);
        DrawMasses(shapes, layout, frame, [rest], Palette.Undeformed, null, 1, "mass undeformed", frame.Labels);
        DrawElements(shapes, layout, frame, frames, Palette.Deformed, "element deformed", labels: false, null);
        DrawMasses(shapes, layout, frame, frames, Palette.Deformed, Palette.Blue, 0.14, "mass deformed", labels: false);
        if (frame.Labels)
            for (var i = 0; i < rest.Length; i++)
            {
                var tip = frames[0][i];
                // The label sits on the outer side of the displaced block, away from the undeformed one.
                var outward = mode.AtRest.Contains(i) || mode.Shape[i] >= 0;
                var offset = frame.Axis == ChainAxis.Vertical
                    ? new Point(outward ? frame.HalfWidth + 4 : -frame.HalfWidth - 4, 4)
                    : new Point(0, outward ? -frame.HalfHeight - 5 : frame.HalfHeight + 13);
                var anchor = frame.Axis == ChainAxis.Horizontal ? TextAnchor.Middle : outward ? TextAnchor.Start : TextAnchor.End;
                if (mode.AtRest.Contains(i))
                    shapes.Add(new TextShape(tip + offset, "electrical " + Signed(mode.Shape[i]), 10, anchor, false, Palette.Grey)
                    { Class = "amplitude electrical", Data = ImmutableDictionary<string, string>.Empty.Add("mass", layout.Masses[i].Name) });
                else
                    shapes.Add(new TextShape(tip + offset, Signed(mode.Shape[i]), 10, anchor, false, Palette.Vermillion)
                    { Class = "amplitude", Data = ImmutableDictionary<string, string>.Empty.Add("mass", layout.Masses[i].Name) });
            }
        var data = frame.Data
            .Add("shape-scale-m", Invariant(mode.ShapeScale))
            .Add("reference-mass", mode.ReferenceMass);
        Footer(shapes, frame, footer, legend: mode.ShapeScale);
        return new Scene(Width, frame.Height, header.Count > 0 ? header[0] : "Mode shape", shapes.ToImmutable(), data);
    }

    /// <summary>A normalised amplitude with its sign, three decimals ("+1.000", "−0.284").</summary>
    public static string Signed(double value) =>
        (value < 0 ? "−" : "+") + Math.Abs(value).ToString("F3", CultureInfo.InvariantCulture);

    private static string Invariant(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static IEnumerable<double> AlongPoints(NetworkLayout layout)
    {
        double Along(Point p) => layout.Axis == ChainAxis.Vertical ? p.Y : p.X;
        foreach (var m in layout.Masses) yield return Along(m.At);
        foreach (var e in layout.Elements)
        {
            if (e.A.Mass is null) yield return Along(e.A.Anchor);
            if (e.B.Mass is null) yield return Along(e.B.Anchor);
        }
    }

    private static void Headers(ImmutableArray<Shape>.Builder shapes, IReadOnlyList<string> header)
    {
        for (var i = 0; i < header.Count; i++)
            shapes.Add(new TextShape(new Point(16, 24 + i * HeaderLine), header[i], i == 0 ? 14 : 11.5, TextAnchor.Start, i == 0)
            { Class = i == 0 ? "figure-title" : "figure-subtitle" });
    }

    private static void Footer(ImmutableArray<Shape>.Builder shapes, Frame frame, IReadOnlyList<string> footer, double? legend)
    {
        var y = frame.Height - 12 - (footer.Count - 1) * FooterLine;
        if (legend is { } scale)
        {
            var ly = y - FooterLine - 2;
            shapes.Add(PathShape.Still([new Point(16, ly - 4), new Point(46, ly - 4)], Palette.Undeformed) with { Class = "legend undeformed" });
            shapes.Add(new TextShape(new Point(52, ly), "undeformed", 10.5) { Class = "legend" });
            shapes.Add(PathShape.Still([new Point(130, ly - 4), new Point(160, ly - 4)], Palette.Deformed) with { Class = "legend deformed" });
            shapes.Add(new TextShape(new Point(166, ly), "mode shape", 10.5) { Class = "legend" });
            // Scale bar: the drawn length of a normalised displacement of 1.
            var bar = frame.PixelsPerMetre * scale;
            var x0 = 260.0;
            var tick = new Pen(Palette.Black, 1.2);
            shapes.Add(PathShape.Still([new Point(x0, ly - 8), new Point(x0, ly), new Point(x0 + bar, ly), new Point(x0 + bar, ly - 8)], tick) with { Class = "scale-bar" });
            shapes.Add(new TextShape(new Point(x0 + bar + 6, ly), "|φ| = 1", 10.5) { Class = "legend" });
        }
        for (var i = 0; i < footer.Count; i++)
            shapes.Add(new TextShape(new Point(16, y + i * FooterLine), footer[i], 10.5, TextAnchor.Start, false, "#333333") { Class = "figure-note" });
    }

    private static void DrawSupports(ImmutableArray<Shape>.Builder shapes, NetworkLayout layout, Frame frame, Point[] centres)
    {
        var index = layout.Masses.Select((m, i) => (m.Name, i)).ToDictionary(p => p.Name, p => p.i);
        var drawn = new HashSet<(double, double)>();
        foreach (var e in layout.Elements)
            foreach (var (end, other) in new[] { (e.A, e.B), (e.B, e.A) })
            {
                if (end.Mass is not null) continue;
                var at = frame.Map(end.Anchor);
                if (!drawn.Add((Math.Round(at.X, 1), Math.Round(at.Y, 1)))) continue;
                var towards = other.Mass is { } m ? centres[index[m]] : frame.Map(other.Anchor);
                var u = Unit(towards - at, frame.Axis);
                var n = new Point(-u.Y, u.X);
                var half = Math.Max(16, 0.5 * Math.Min(60, 22 * e.ParallelCount));
                var pen = Palette.Support;
                var parts = ImmutableArray.CreateBuilder<Shape>();
                parts.Add(PathShape.Still([at - half * n, at + half * n], pen with { Width = 1.8 }));
                for (var k = 0; k <= 5; k++)
                {
                    var b = at + (-half + k * 2 * half / 5) * n;
                    parts.Add(PathShape.Still([b, b - 6 * u - 6 * n], pen));
                }
                shapes.Add(new GroupShape(parts.ToImmutable()) { Class = "support" });
            }
    }

    private static void DrawElements(ImmutableArray<Shape>.Builder shapes, NetworkLayout layout, Frame frame, Point[][] frames,
        Pen pen, string cssClass, bool labels, DisplayUnits? units)
    {
        var index = layout.Masses.Select((m, i) => (m.Name, i)).ToDictionary(p => p.Name, p => p.i);
        foreach (var e in layout.Elements)
        {
            var geometry = frames.Select(centres =>
            {
                var a = e.A.Mass is { } ma ? centres[index[ma]] : frame.Map(e.A.Anchor);
                var b = e.B.Mass is { } mb ? centres[index[mb]] : frame.Map(e.B.Anchor);
                return ElementGeometry(e, a, b, e.A.Mass is not null, e.B.Mass is not null, frame);
            }).ToArray();
            var parts = ImmutableArray.CreateBuilder<Shape>();
            for (var p = 0; p < geometry[0].Length; p++)
                parts.Add(new PathShape([.. geometry.Select(g => g[p])], pen));
            var start = geometry[0][0][0];
            var end = e.Kind == ElementKind.Spring ? geometry[0][0][^1] : geometry[0][2][0];
            // Labels of very short elements would sit on the blocks; the tables of the report list every value anyway.
            if (labels && units is not null && (end - start).Length >= 60)
            {
                var mid = 0.5 * (start + end);
                var u = Unit(end - start, frame.Axis);
                var n = new Point(-u.Y, u.X);
                if (n.X < 0 || (n.X == 0 && n.Y > 0)) n = -1 * n;
                var value = e.Kind == ElementKind.Spring
                    ? units.Stiffness(e.Value, given: true) + " " + units.StiffnessSymbol
                    : units.Damping(e.Value, given: true) + " " + units.DampingSymbol;
                // Two elements side by side get their labels on either side; more stack their labels on one side.
                var spread = 0.5 * Math.Max(0, e.ParallelCount - 1) * Math.Min(24, 1.5 * frame.HalfWidth / Math.Max(1, e.ParallelCount - 1));
                var left = e.ParallelCount == 2 && e.ParallelIndex == 0;
                var stack = e.ParallelCount > 2 ? 24 * e.ParallelIndex - 12 * (e.ParallelCount - 1) : 0;
                var at = mid + (left ? -1 : 1) * (spread + 13) * n + stack * u;
                var anchor = left ? TextAnchor.End : TextAnchor.Start;
                parts.Add(new TextShape(at + new Point(0, -2), e.Name, 10, anchor, false, "#333333") { Class = "element-name" });
                parts.Add(new TextShape(at + new Point(0, 10), value, 9.5, anchor, false, "#555555") { Class = "element-value" });
            }
            shapes.Add(new GroupShape(parts.ToImmutable())
            {
                Class = cssClass + (e.Kind == ElementKind.Spring ? " spring" : " damper"),
                Data = ImmutableDictionary<string, string>.Empty.Add("element", e.Name),
            });
        }
    }

    /// <summary>The polylines of one spring (one zigzag) or damper (rod, cup, piston rod, plate), in a fixed count and order so frames can be animated.</summary>
    private static ImmutableArray<Point>[] ElementGeometry(DrawnElement e, Point a, Point b, bool aIsMass, bool bIsMass, Frame frame)
    {
        var u = Unit(b - a, frame.Axis);
        var n = new Point(-u.Y, u.X);
        var offset = (e.ParallelIndex - (e.ParallelCount - 1) / 2.0) * Math.Min(24, 1.5 * frame.HalfWidth / Math.Max(1, e.ParallelCount - 1));
        if (aIsMass) a = Clip(a, u, frame);
        if (bIsMass) b = Clip(b, -1 * u, frame);
        a += offset * n;
        b += offset * n;
        var d = b - a;
        var length = d.Length;
        if (length < 1e-9) return e.Kind == ElementKind.Spring ? [[a, b]] : [[a, b], [a, b], [a, b], [a, b]];
        u = (1 / length) * d;
        n = new Point(-u.Y, u.X);
        Point At(double t, double across) => a + (t * length) * u + across * n;
        if (e.Kind == ElementKind.Spring)
        {
            const int teeth = 8;
            var amplitude = Math.Min(7, 0.12 * Math.Max(length, 30));
            var points = new List<Point> { a, At(0.22, 0) };
            for (var k = 1; k < teeth; k++) points.Add(At(0.22 + 0.56 * k / teeth, k % 2 == 1 ? amplitude : -amplitude));
            points.Add(At(0.78, 0));
            points.Add(b);
            return [[.. points]];
        }
        var c = Math.Min(8, 0.2 * Math.Max(length, 30));
        return
        [
            [a, At(0.36, 0)],
            [At(0.64, c), At(0.36, c), At(0.36, -c), At(0.64, -c)],
            [b, At(0.52, 0)],
            [At(0.52, 0.7 * c), At(0.52, -0.7 * c)],
        ];
    }

    private static Point Clip(Point centre, Point u, Frame frame)
    {
        var tx = Math.Abs(u.X) > 1e-12 ? frame.HalfWidth / Math.Abs(u.X) : double.PositiveInfinity;
        var ty = Math.Abs(u.Y) > 1e-12 ? frame.HalfHeight / Math.Abs(u.Y) : double.PositiveInfinity;
        return centre + Math.Min(tx, ty) * u;
    }

    private static Point Unit(Point d, ChainAxis axis)
    {
        var length = d.Length;
        if (length > 1e-9) return (1 / length) * d;
        return axis == ChainAxis.Vertical ? new Point(0, -1) : new Point(1, 0);
    }

    private static void DrawMasses(ImmutableArray<Shape>.Builder shapes, NetworkLayout layout, Frame frame, Point[][] frames,
        Pen pen, string? fill, double fillOpacity, string cssClass, bool labels)
    {
        for (var i = 0; i < layout.Masses.Length; i++)
        {
            var name = layout.Masses[i].Name;
            var outlines = frames.Select(centres =>
            {
                var c = centres[i];
                return ImmutableArray.Create(
                    c + new Point(-frame.HalfWidth, -frame.HalfHeight), c + new Point(frame.HalfWidth, -frame.HalfHeight),
                    c + new Point(frame.HalfWidth, frame.HalfHeight), c + new Point(-frame.HalfWidth, frame.HalfHeight));
            });
            shapes.Add(new PathShape([.. outlines], pen, fill, Closed: true, fillOpacity)
            {
                Class = cssClass,
                Data = ImmutableDictionary<string, string>.Empty.Add("mass", name),
            });
            if (labels)
            {
                var size = Math.Min(11, 1.6 * frame.HalfHeight);
                var text = name.Length * size * 0.6 > 2 * frame.HalfWidth - 4 ? name[..Math.Max(1, (int)((2 * frame.HalfWidth - 4) / (size * 0.6)) - 1)] + "…" : name;
                shapes.Add(new TextShape(frames[0][i] + new Point(0, size * 0.36), text, size, TextAnchor.Middle, false, pen == Palette.Undeformed ? Palette.Grey : Palette.Black)
                { Class = "mass-name", Data = ImmutableDictionary<string, string>.Empty.Add("mass", name) });
            }
        }
    }

    /// <summary>The mapping from drawing metres (y up) to figure units (y down) and the sizes of symbols.</summary>
    private sealed record Frame(double MinX, double MaxY, double Left, double Top, double PixelsPerMetre, double Height,
        double HalfWidth, double HalfHeight, bool Labels, ChainAxis Axis)
    {
        public Point Map(Point p) => new(Left + (p.X - MinX) * PixelsPerMetre, Top + (MaxY - p.Y) * PixelsPerMetre);

        /// <summary>The figure-unit vector of a displacement of <paramref name="metres"/> across the chain.</summary>
        public Point AcrossPixels(double metres) => Axis == ChainAxis.Vertical
            ? new Point(metres * PixelsPerMetre, 0)
            : new Point(0, -metres * PixelsPerMetre);

        public ImmutableDictionary<string, string> Data => ImmutableDictionary<string, string>.Empty
            .Add("px-per-m", PixelsPerMetre.ToString("R", CultureInfo.InvariantCulture))
            .Add("axis", Axis == ChainAxis.Vertical ? "vertical" : "horizontal");

        public static Frame For(NetworkLayout layout, int headerLines, int footerLines, double? shapeScale)
        {
            var points = layout.Masses.Select(m => m.At)
                .Concat(layout.Elements.SelectMany(e => new[] { e.A, e.B }).Where(x => x.Mass is null).Select(x => x.Anchor))
                .ToList();
            if (shapeScale is { } a)
            {
                var shift = layout.Axis == ChainAxis.Vertical ? new Point(a, 0) : new Point(0, a);
                points.AddRange(layout.Masses.SelectMany(m => new[] { m.At + shift, m.At - shift }));
            }
            var minX = points.Min(p => p.X);
            var maxX = points.Max(p => p.X);
            var minY = points.Min(p => p.Y);
            var maxY = points.Max(p => p.Y);
            var spanX = Math.Max(maxX - minX, 1e-9);
            var spanY = Math.Max(maxY - minY, 1e-9);
            var s = Math.Min((Width - 2 * MarginX) / spanX, MaxBodyHeight / spanY);
            s = Math.Min(s, MaxPixelsPerSpacing / layout.Spacing);
            var spacingPx = layout.Spacing * s;
            var halfHeight = Math.Clamp(0.14 * spacingPx, 2.5, 15);
            var longest = layout.Masses.Max(m => m.Name.Length);
            var halfWidth = halfHeight >= 9
                ? Math.Clamp(Math.Max(2.2 * halfHeight, 0.5 * (longest * 0.62 * Math.Min(11, 1.6 * halfHeight) + 12)), 5, 62)
                : Math.Clamp(2.2 * halfHeight, 5, 34);
            var top = 16 + headerLines * HeaderLine + BodyMargin;
            var body = spanY * s;
            var height = top + body + BodyMargin + 10 + footerLines * FooterLine + 8;
            var left = (Width - spanX * s) / 2;
            return new Frame(minX, maxY, left, top, s, Math.Ceiling(height), halfWidth, halfHeight, halfHeight >= 9, layout.Axis);
        }
    }
}
