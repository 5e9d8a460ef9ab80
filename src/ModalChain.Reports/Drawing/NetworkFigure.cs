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
    private const double FooterSize = 10.5;
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
    /// <param name="layout">Where each part is drawn.</param>
    /// <param name="header">Title line and the lines below it.</param>
    /// <param name="footer">Notes under the drawing.</param>
    /// <param name="units">Display units of the mechanical values.</param>
    /// <param name="massKilograms">Each drawn node's mass in kg (an electrical node's capacitance in F).</param>
    /// <param name="supportLabels">Labels for supports by name (a voltage source's node: "source amplifier 1 V"); others get none.</param>
    public static Scene Network(NetworkLayout layout, IReadOnlyList<string> header, IReadOnlyList<string> footer, DisplayUnits units,
        IReadOnlyDictionary<string, double> massKilograms, IReadOnlyDictionary<string, string>? supportLabels = null)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(units);
        ArgumentNullException.ThrowIfNull(massKilograms);
        footer = Wrap(footer);
        // One spare footer line for the note on labels left out, if any.
        var frame = Frame.For(layout, header.Count, footer.Count + 1, null);
        var shapes = ImmutableArray.CreateBuilder<Shape>();
        Headers(shapes, header);
        var centres = layout.Masses.Select(m => frame.Map(m.At)).ToArray();
        DrawSupports(shapes, layout, frame, centres);
        DrawElements(shapes, layout, frame, [centres], Palette.Structure, "element");
        DrawMasses(shapes, layout, frame, [centres], Palette.Structure, "#E8E8E8", 1, "mass", frame.Labels);
        var omitted = frame.Labels
            ? PlacedLabels(shapes, layout, frame, centres, units, massKilograms, supportLabels ?? ImmutableDictionary<string, string>.Empty)
            : 0;
        if (omitted > 0)
            footer = [.. footer, string.Create(CultureInfo.InvariantCulture,
                $"{omitted} label{(omitted == 1 ? " was" : "s were")} left out where {(omitted == 1 ? "it" : "they")} would overlap others; the tables list every element.")];
        Footer(shapes, frame, footer, legend: null);
        return new Scene(Width, frame.Height, header.Count > 0 ? header[0] : "Network", shapes.ToImmutable(), frame.Data);
    }

    /// <summary>
    /// The value printed beside a drawn node: its mass ("6000 kg"), or for an electrical node its capacitance to ground
    /// ("22 µF"); null for a massless electrical node, which has no capacitance to print.
    /// </summary>
    public static string? NodeValue(NetworkLayout layout, string name, double kilograms, DisplayUnits units)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(units);
        if (!layout.ElectricalNodes.Contains(name)) return units.Mass(kilograms, given: true) + " " + units.MassSymbol;
        return kilograms > 0 ? ElectricalUnits.Format(kilograms, ElectricalUnits.Farad, given: true) : null;
    }

    /// <summary>
    /// The value printed with an element: a spring's stiffness, a damper's coefficient, an inerter's inertance, a
    /// transducer's force factor; on the electrical side (<see cref="DrawnElement.Electrical"/>) an inductor's
    /// L = 1/k in H, a resistor's R = 1/c in Ω, a capacitor's C in F.
    /// </summary>
    public static string ElementValue(DrawnElement e, DisplayUnits units)
    {
        ArgumentNullException.ThrowIfNull(e);
        ArgumentNullException.ThrowIfNull(units);
        return e.Kind switch
        {
            ElementKind.Spring when e.Electrical => ElectricalUnits.Format(1 / e.Value, ElectricalUnits.Henry, given: true),
            ElementKind.Damper when e.Electrical => ElectricalUnits.Format(1 / e.Value, ElectricalUnits.Ohm, given: true),
            ElementKind.Inerter when e.Electrical => ElectricalUnits.Format(e.Value, ElectricalUnits.Farad, given: true),
            ElementKind.Spring => units.Stiffness(e.Value, given: true) + " " + units.StiffnessSymbol,
            ElementKind.Damper => units.Damping(e.Value, given: true) + " " + units.DampingSymbol,
            ElementKind.Inerter => units.Mass(e.Value, given: true) + " " + units.MassSymbol,
            _ => "Bl " + e.Value.ToString("G4", CultureInfo.InvariantCulture) + " T·m",
        };
    }

    /// <summary>Font size of the placed labels of inerters and transducers.</summary>
    public const double PlacedLabelSize = 9.5;

    /// <summary>Font size of a placed spring or damper name (its value below it is <see cref="PlacedLabelSize"/>).</summary>
    public const double PlacedNameSize = 10;

    /// <summary>
    /// Places every value label through one <see cref="LabelPlacer"/> that first blocks every mass block, every text drawn
    /// so far and every element's body, so no placed label overlaps a symbol or another label: each node's value beside
    /// its block, a voltage source's label beside its support, each spring's and damper's name with its value below it,
    /// each inerter's ("name 360 kg") and transducer's ("name Bl 15 T·m") on one line. Returns how many found no free place.
    /// </summary>
    private static int PlacedLabels(ImmutableArray<Shape>.Builder shapes, NetworkLayout layout, Frame frame, Point[] centres, DisplayUnits units,
        IReadOnlyDictionary<string, double> massKilograms, IReadOnlyDictionary<string, string> supportLabels)
    {
        var placer = new LabelPlacer(new Rect(4, frame.Top - BodyMargin + 6, Width - 4, frame.Height - 12 - frame.FooterLines * FooterLine));
        foreach (var c in centres)
            placer.Block(new Rect(c.X - frame.HalfWidth, c.Y - frame.HalfHeight, c.X + frame.HalfWidth, c.Y + frame.HalfHeight));
        foreach (var text in Texts(shapes)) placer.Block(TextMetrics.Box(text));
        var index = layout.Masses.Select((m, i) => (m.Name, i)).ToDictionary(p => p.Name, p => p.i);
        ImmutableArray<Point>[] Lines(DrawnElement e) => ElementGeometry(e,
            e.A.Mass is { } ma ? centres[index[ma]] : frame.Map(e.A.Anchor),
            e.B.Mass is { } mb ? centres[index[mb]] : frame.Map(e.B.Anchor), e.A.Mass is not null, e.B.Mass is not null, frame, []);
        // Every element's body (not its rods, which may run far across the figure) is blocked, so a label sits beside
        // the symbols, not on them: a spring's teeth, a damper's cup and plate, a resistor's box, a flywheel's disc, a magnet and its coil.
        foreach (var e in layout.Elements)
        {
            var lines = Lines(e);
            var body = e.Kind switch
            {
                ElementKind.Spring => lines[0][1..^1],
                ElementKind.Damper => [.. lines[1], .. lines[3]],
                _ => [.. lines[1..4].SelectMany(l => l)],
            };
            if (body.Length > 0) placer.Block(new Rect(body.Min(p => p.X), body.Min(p => p.Y), body.Max(p => p.X), body.Max(p => p.Y)));
        }
        var omitted = 0;
        // The nodes' values first: beside the block on the right as before, else on its left, above or below.
        for (var i = 0; i < centres.Length; i++)
        {
            var name = layout.Masses[i].Name;
            if (NodeValue(layout, name, massKilograms[name], units) is not { } value) continue;
            var c = centres[i];
            (Point, TextAnchor)[] candidates =
            [
                (c + new Point(frame.HalfWidth + 5, 4), TextAnchor.Start),
                (c + new Point(-frame.HalfWidth - 5, 4), TextAnchor.End),
                (c + new Point(0, -frame.HalfHeight - 4), TextAnchor.Middle),
                (c + new Point(0, frame.HalfHeight + 12), TextAnchor.Middle),
                (c + new Point(frame.HalfWidth + 5, -frame.HalfHeight - 2), TextAnchor.Start),
                (c + new Point(frame.HalfWidth + 5, frame.HalfHeight + 10), TextAnchor.Start),
            ];
            var label = placer.Place(value, 10, candidates, "#333333", layout.ElectricalNodes.Contains(name) ? "mass-value electrical" : "mass-value",
                ImmutableDictionary<string, string>.Empty.Add("mass", name));
            if (label is null) omitted++;
            else shapes.Add(label);
        }
        // A voltage source's support: its label beside the support symbol.
        var labelled = new HashSet<string>(StringComparer.Ordinal);
        foreach (var e in layout.Elements)
            foreach (var end in new[] { e.A, e.B })
            {
                if (end.Mass is not null || end.Support is not { } support || !supportLabels.TryGetValue(support, out var text) || !labelled.Add(support)) continue;
                var label = placer.Place(text, PlacedLabelSize, LabelPlacer.AroundPoint(frame.Map(end.Anchor), 14, PlacedLabelSize), "#333333", "label source-label",
                    ImmutableDictionary<string, string>.Empty.Add("support", support));
                if (label is null) omitted++;
                else shapes.Add(label);
            }
        foreach (var e in layout.Elements.Where(e => e.Kind is ElementKind.Spring or ElementKind.Damper))
        {
            var lines = Lines(e);
            var start = lines[0][0];
            var end = e.Kind == ElementKind.Spring ? lines[0][^1] : lines[2][0];
            var value = ElementValue(e, units);
            var width = Math.Max(TextMetrics.Width(e.Name, PlacedNameSize), TextMetrics.Width(value, PlacedLabelSize));
            var data = ImmutableDictionary<string, string>.Empty.Add("element", e.Name);
            var pair = placer.PlacePair(e.Name, PlacedNameSize, value, PlacedLabelSize, 12, LabelPlacer.AlongLine(start, end, 9, PlacedNameSize, width),
                "#333333", "#555555", "label element-name " + KindClass(e.Kind), "label element-value " + KindClass(e.Kind) + (e.Electrical ? " electrical" : ""), data);
            if (pair is { } placed)
            {
                shapes.AddRange(placed.First, placed.Second);
                continue;
            }
            // No room for two lines: the name and the value on one line, else the label is left out.
            var line = e.Name + " " + value;
            var single = placer.Place(line, PlacedLabelSize, LabelPlacer.AlongLine(start, end, 9, PlacedLabelSize, TextMetrics.Width(line, PlacedLabelSize)),
                "#333333", "label element-name element-value " + KindClass(e.Kind) + (e.Electrical ? " electrical" : ""), data);
            if (single is null) omitted++;
            else shapes.Add(single);
        }
        foreach (var e in layout.Elements.Where(e => e.Kind is ElementKind.Inerter or ElementKind.Transducer))
        {
            var lines = Lines(e);
            var text = e.Name + " " + ElementValue(e, units);
            var label = placer.Place(text, PlacedLabelSize, LabelPlacer.AlongLine(lines[0][0], lines[4][^1], 9, PlacedLabelSize, TextMetrics.Width(text, PlacedLabelSize)), "#333333",
                "label element-label " + KindClass(e.Kind) + (e.Electrical ? " electrical" : ""), ImmutableDictionary<string, string>.Empty.Add("element", e.Name));
            if (label is null) omitted++;
            else shapes.Add(label);
        }
        return omitted;
    }

    private static IEnumerable<TextShape> Texts(IEnumerable<Shape> shapes)
    {
        foreach (var s in shapes)
        {
            if (s is TextShape t) yield return t;
            if (s is GroupShape g)
                foreach (var c in Texts(g.Children)) yield return c;
        }
    }

    /// <summary>The footer notes broken at spaces into lines that fit the figure's width.</summary>
    private static List<string> Wrap(IReadOnlyList<string> lines) => TextMetrics.Wrap(lines, FooterSize, Width - 32);

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
        DrawElements(shapes, layout, frame, [rest], Palette.Undeformed, "element undeformed");
        DrawMasses(shapes, layout, frame, [rest], Palette.Undeformed, null, 1, "mass undeformed", frame.Labels);
        DrawElements(shapes, layout, frame, frames, Palette.Deformed, "element deformed");
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
            shapes.Add(new TextShape(new Point(16, y + i * FooterLine), footer[i], FooterSize, TextAnchor.Start, false, "#333333") { Class = "figure-note" });
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
        Pen pen, string cssClass)
    {
        var index = layout.Masses.Select((m, i) => (m.Name, i)).ToDictionary(p => p.Name, p => p.i);
        foreach (var e in layout.Elements)
        {
            var geometry = frames.Select(centres =>
            {
                var a = e.A.Mass is { } ma ? centres[index[ma]] : frame.Map(e.A.Anchor);
                var b = e.B.Mass is { } mb ? centres[index[mb]] : frame.Map(e.B.Anchor);
                return ElementGeometry(e, a, b, e.A.Mass is not null, e.B.Mass is not null, frame, [.. e.Branch.Select(n => centres[index[n]])]);
            }).ToArray();
            var parts = ImmutableArray.CreateBuilder<Shape>();
            var dashedFrom = geometry[0].Length - e.Branch.Length;
            var dashed = pen with { Width = Math.Min(pen.Width, 1.1), Dash = pen.Dash ?? ImmutableArray.Create(4.0, 3.0) };
            for (var p = 0; p < geometry[0].Length; p++)
                parts.Add(new PathShape([.. geometry.Select(g => g[p])], p < dashedFrom ? pen : dashed)
                {
                    Class = p < dashedFrom ? null : "branch-link",
                    Data = p < dashedFrom ? ImmutableDictionary<string, string>.Empty : ImmutableDictionary<string, string>.Empty.Add("branch", e.Branch[p - dashedFrom]),
                });
            // The labels are placed afterwards through the label placer (see Network), so none overlaps another.
            shapes.Add(new GroupShape(parts.ToImmutable())
            {
                Class = cssClass + " " + KindClass(e.Kind) + (e.Electrical ? " electrical " + ElectricalClass(e.Kind) : ""),
                Data = ImmutableDictionary<string, string>.Empty.Add("element", e.Name),
            });
        }
    }

    /// <summary>The class word of an electrical element: "inductor", "resistor" or "capacitor".</summary>
    private static string ElectricalClass(ElementKind kind) => kind switch
    {
        ElementKind.Spring => "inductor",
        ElementKind.Damper => "resistor",
        _ => "capacitor",
    };

    /// <summary>The class word of an element kind in the SVG ("spring", "damper", "inerter", "transducer").</summary>
    public static string KindClass(ElementKind kind) => kind.ToString().ToLowerInvariant();

    /// <summary>
    /// The polylines of one spring (one zigzag), damper (rod, cup, piston rod, plate), inerter (rod, flywheel disc, two
    /// spokes, rod) or transducer (rod, magnet, pole line, coil, rod, then one dashed line to each drawn branch terminal
    /// in <paramref name="branch"/>), in a fixed count and order so frames can be animated.
    /// </summary>
    private static ImmutableArray<Point>[] ElementGeometry(DrawnElement e, Point a, Point b, bool aIsMass, bool bIsMass, Frame frame,
        IReadOnlyList<Point> branch)
    {
        var u = Unit(b - a, frame.Axis);
        var n = new Point(-u.Y, u.X);
        var offset = (e.ParallelIndex - (e.ParallelCount - 1) / 2.0) * Math.Min(24, 1.5 * frame.HalfWidth / Math.Max(1, e.ParallelCount - 1))
                     * (e.Reversed ? -1 : 1);
        if (aIsMass) a = Clip(a, u, frame);
        if (bIsMass) b = Clip(b, -1 * u, frame);
        a += offset * n;
        b += offset * n;
        var d = b - a;
        var length = d.Length;
        if (length < 1e-9)
        {
            var count = e.Kind switch { ElementKind.Spring => 1, ElementKind.Damper => 4, ElementKind.Inerter => 5, _ => 5 };
            return [.. Enumerable.Repeat(ImmutableArray.Create(a, b), count), .. branch.Select(p => ImmutableArray.Create(a, p))];
        }
        u = (1 / length) * d;
        n = new Point(-u.Y, u.X);
        Point At(double t, double across) => a + (t * length) * u + across * n;
        if (e.Kind == ElementKind.Inerter) return Flywheel(At, length);
        if (e.Kind == ElementKind.Transducer)
        {
            var symbol = MagnetAndCoil(At, length);
            var centre = At(0.6, 0);
            return [.. symbol, .. branch.Select(p => ImmutableArray.Create(centre, Clip(p, Unit(centre - p, frame.Axis), frame)))];
        }
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
        if (e.Electrical) return Resistor(At, c);
        return
        [
            [a, At(0.36, 0)],
            [At(0.64, c), At(0.36, c), At(0.36, -c), At(0.64, -c)],
            [b, At(0.52, 0)],
            [At(0.52, 0.7 * c), At(0.52, -0.7 * c)],
        ];
    }

    /// <summary>
    /// A resistor: a rod to a box across the line (half-height <paramref name="c"/>, from 0.32 to 0.68 of the length),
    /// the box, a rod from the box, and a zigzag of six strokes inside the box; four polylines like a dashpot's, with
    /// the box second and the zigzag fourth so the label placer blocks the same parts.
    /// </summary>
    internal static ImmutableArray<Point>[] Resistor(Func<double, double, Point> at, double c)
    {
        const int strokes = 6;
        var zigzag = Enumerable.Range(0, strokes + 1).Select(k =>
            at(0.35 + 0.30 * k / strokes, k == 0 || k == strokes ? 0 : (k % 2 == 1 ? 0.55 * c : -0.55 * c)));
        return
        [
            [at(0, 0), at(0.32, 0)],
            [at(0.32, -0.6 * c), at(0.68, -0.6 * c), at(0.68, 0.6 * c), at(0.32, 0.6 * c), at(0.32, -0.6 * c)],
            [at(1, 0), at(0.68, 0)],
            [.. zigzag],
        ];
    }

    /// <summary>
    /// A flywheel: a rod to the disc, the disc (a closed 20-sided outline), two crossed spokes, a rod from the disc. The
    /// disc's radius follows the element's length, at most 9 figure units.
    /// </summary>
    internal static ImmutableArray<Point>[] Flywheel(Func<double, double, Point> at, double length)
    {
        var r = Math.Min(9, 0.22 * Math.Max(length, 30));
        var rt = r / length; // the radius as a fraction of the length
        Point Rim(double angle) => at(0.5 + rt * Math.Cos(angle), r * Math.Sin(angle));
        return
        [
            [at(0, 0), at(0.5 - rt, 0)],
            [.. Enumerable.Range(0, 21).Select(k => Rim(2 * Math.PI * k / 20))],
            [Rim(Math.PI / 4), Rim(5 * Math.PI / 4)],
            [Rim(3 * Math.PI / 4), Rim(7 * Math.PI / 4)],
            [at(0.5 + rt, 0), at(1, 0)],
        ];
    }

    /// <summary>
    /// A magnet and a coil: a rod to the magnet (a closed block across the line, split by its pole line), an air gap,
    /// the coil (four loops drawn as a prolate cycloid along the line) and a rod from the coil.
    /// </summary>
    internal static ImmutableArray<Point>[] MagnetAndCoil(Func<double, double, Point> at, double length)
    {
        var c = Math.Min(8, 0.2 * Math.Max(length, 30));
        const int turns = 4, perTurn = 12;
        const double span = 0.24;                         // the coil runs from t = 0.48 to 0.72
        // Along the line t = 0.48 + pθ + q(1 − cos θ), across 0.8c·sin θ: with q > p the curve runs back on itself once a
        // turn, so each turn is a loop, and it starts and ends on the line.
        var p = span / (2 * Math.PI * turns);
        var q = 1.8 * p;
        var coil = Enumerable.Range(0, turns * perTurn + 1).Select(k =>
        {
            var theta = 2 * Math.PI * k / perTurn;
            return at(0.48 + p * theta + q * (1 - Math.Cos(theta)), 0.8 * c * Math.Sin(theta));
        });
        return
        [
            [at(0, 0), at(0.28, 0)],
            [at(0.28, -c), at(0.28, c), at(0.42, c), at(0.42, -c), at(0.28, -c)],
            [at(0.35, -c), at(0.35, c)],
            [.. coil],
            [at(0.72, 0), at(1, 0)],
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
        double HalfWidth, double HalfHeight, bool Labels, ChainAxis Axis, int FooterLines)
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
            return new Frame(minX, maxY, left, top, s, Math.Ceiling(height), halfWidth, halfHeight, halfHeight >= 9, layout.Axis, footerLines);
        }
    }
}
