using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Model;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Drawing;

/// <summary>Draws a circuit as a schematic: its nodes in a row, ground as a rail below, each element with its symbol and value.</summary>
/// <remarks>
/// Elements to ground hang from their node down to the ground rail; an element between two neighbouring nodes sits on the
/// node row, any other one on a track above it with wires down to its nodes (tracks are assigned so no two elements on a
/// track overlap). Symbols: a zigzag for a resistor, humps for an inductor, two plates for a capacitor, a circle with + and
/// − for a voltage source and a circle with an arrow (the direction of the current it delivers) for a current source.
/// </remarks>
public static class CircuitSchematic
{
    private const double Width = NetworkFigure.Width;
    private const double Margin = 60;
    private const double TrackHeight = 52;
    private const double SymbolLength = 46;
    private const double BranchLength = 120;
    private const double BranchSpacing = 40;

    private static readonly Pen Wire = new(Palette.Black, 1.3);
    private static readonly Pen Symbol = new(Palette.Blue, 1.8);

    /// <summary>The schematic of <paramref name="circuit"/> as the report's "circuit" figure.</summary>
    public static SchematicFigure Figure(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        return new SchematicFigure("circuit", "The circuit as modelled: nodes (dots) in a row, ground (the reference, 0 V) as the rail below, " +
            "resistors as zigzags, inductors as humps, capacitors as two plates, voltage sources as circles marked + and −, current sources as circles with an arrow in the direction of the current they deliver.",
            "network", Draw(circuit), animated: false);
    }

    /// <summary>The scene of the schematic; each element is a group with class "element KIND" and data-element NAME.</summary>
    public static Scene Draw(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        var elements = Elements(circuit).ToList();
        var nodeIndex = circuit.Nodes.Select((n, i) => (n, i)).ToDictionary(p => p.n, p => p.i, StringComparer.Ordinal);
        var spacing = (Width - 2 * Margin) / Math.Max(1, circuit.Nodes.Length);
        double X(string node) => Margin + (nodeIndex[node] + 0.5) * spacing;

        // Tracks for the elements between two nodes: track 0 is the node row (neighbours only), higher tracks above it.
        var between = elements.Where(e => e.A != Circuit.Ground && e.B != Circuit.Ground)
            .OrderBy(e => Math.Abs(nodeIndex[e.A] - nodeIndex[e.B])).ToList();
        var tracks = new List<List<(int From, int To)>>();
        var trackOf = new Dictionary<Element, int>();
        foreach (var e in between)
        {
            var (from, to) = (Math.Min(nodeIndex[e.A], nodeIndex[e.B]), Math.Max(nodeIndex[e.A], nodeIndex[e.B]));
            var t = to - from == 1 ? 0 : 1;
            while (t < tracks.Count && tracks[t].Any(s => from < s.To && s.From < to)) t++;
            while (tracks.Count <= t) tracks.Add([]);
            tracks[t].Add((from, to));
            trackOf[e] = t;
        }
        var upper = Math.Max(0, tracks.Count - 1);
        var headerHeight = 58.0;
        var rowY = headerHeight + 24 + upper * TrackHeight;
        var grounded = elements.Where(e => e.A == Circuit.Ground || e.B == Circuit.Ground).ToList();
        var railY = rowY + 30 + BranchLength;
        var height = railY + 64;

        var shapes = ImmutableArray.CreateBuilder<Shape>();
        shapes.Add(new TextShape(new Point(16, 24), "Circuit: " + circuit.Title, 14, TextAnchor.Start, true) { Class = "figure-title" });
        shapes.Add(new TextShape(new Point(16, 44), string.Create(CultureInfo.InvariantCulture,
            $"{circuit.Nodes.Length} nodes besides ground, {elements.Count} elements and sources"), 11.5) { Class = "figure-subtitle" });

        foreach (var e in between)
        {
            var t = trackOf[e];
            var y = rowY - t * TrackHeight;
            Point a = new(X(e.A), y), b = new(X(e.B), y);
            var parts = ImmutableArray.CreateBuilder<Shape>();
            if (t > 0)
            {
                parts.Add(PathShape.Still([new Point(a.X, rowY), a], Wire));
                parts.Add(PathShape.Still([new Point(b.X, rowY), b], Wire));
            }
            Two(parts, e, a, b, labelSide: -1);
            shapes.Add(Group(parts, e));
        }

        // Elements to ground hang from a short bus under their node, side by side.
        foreach (var group in grounded.GroupBy(e => e.A == Circuit.Ground ? e.B : e.A))
        {
            var node = group.Key;
            var list = group.ToList();
            var step = Math.Min(BranchSpacing * 2.4, spacing / Math.Max(1, list.Count));
            var xs = list.Select((_, k) => X(node) + (k - (list.Count - 1) / 2.0) * step).ToArray();
            var busY = rowY + 30;
            shapes.Add(PathShape.Still([new Point(X(node), rowY), new Point(X(node), busY)], Wire) with { Class = "wire" });
            if (list.Count > 1) shapes.Add(PathShape.Still([new Point(xs[0], busY), new Point(xs[^1], busY)], Wire) with { Class = "wire" });
            for (var k = 0; k < list.Count; k++)
            {
                var e = list[k];
                var top = new Point(xs[k], busY);
                var bottom = new Point(xs[k], railY);
                var parts = ImmutableArray.CreateBuilder<Shape>();
                // The element's own orientation: A at the top when B is ground.
                if (e.B == Circuit.Ground) Two(parts, e, top, bottom, labelSide: 1);
                else Two(parts, e, bottom, top, labelSide: 1);
                shapes.Add(Group(parts, e));
            }
        }

        // Node dots and names, the ground rail.
        foreach (var node in circuit.Nodes)
        {
            var at = new Point(X(node), rowY);
            shapes.Add(new CircleShape(at, 3.5, null, Palette.Black) { Class = "node", Data = ImmutableDictionary<string, string>.Empty.Add("node", node) });
            shapes.Add(new TextShape(at + new Point(0, -9), node, 10.5, TextAnchor.Middle, true) { Class = "node-name", Halo = true });
        }
        var railFrom = Margin * 0.5;
        var railTo = Width - Margin * 0.5;
        shapes.Add(PathShape.Still([new Point(railFrom, railY), new Point(railTo, railY)], Wire with { Width = 2 }) with { Class = "ground" });
        for (var x = railFrom; x <= railTo; x += 14)
            shapes.Add(PathShape.Still([new Point(x, railY), new Point(x - 6, railY + 7)], Palette.Support) with { Class = "ground" });
        shapes.Add(new TextShape(new Point(railTo, railY + 24), "ground (0 V)", 10.5, TextAnchor.End) { Class = "node-name" });
        shapes.Add(new TextShape(new Point(16, height - 14), "Values as given in the model; sources show the amplitude of the sweeps.", 10.5, TextAnchor.Start, false, "#333333") { Class = "figure-note" });
        return new Scene(Width, height, "Circuit: " + circuit.Title, shapes.ToImmutable(), ImmutableDictionary<string, string>.Empty.Add("elements", elements.Count.ToString(CultureInfo.InvariantCulture)));
    }

    private sealed record Element(string Name, string Kind, string A, string B, string Value);

    /// <summary>Every element with its terminals as drawn: A → B is a resistor's, inductor's or capacitor's order, a voltage source's − → +, a current source's from → to.</summary>
    private static IEnumerable<Element> Elements(Circuit c)
    {
        foreach (var e in c.Resistors) yield return new(e.Name, "resistor", e.NodeA, e.NodeB, ElectricalUnits.Format(e.Ohms, ElectricalUnits.Ohm, given: true));
        foreach (var e in c.Inductors) yield return new(e.Name, "inductor", e.NodeA, e.NodeB, ElectricalUnits.Format(e.Henries, ElectricalUnits.Henry, given: true));
        foreach (var e in c.Capacitors) yield return new(e.Name, "capacitor", e.NodeA, e.NodeB, ElectricalUnits.Format(e.Farads, ElectricalUnits.Farad, given: true));
        foreach (var e in c.VoltageSources) yield return new(e.Name, "voltage-source", e.Negative, e.Positive, ElectricalUnits.Format(e.Amplitude, ElectricalUnits.Volt, given: true));
        foreach (var e in c.CurrentSources) yield return new(e.Name, "current-source", e.From, e.To, ElectricalUnits.Format(e.Amplitude, ElectricalUnits.Ampere, given: true));
    }

    private static GroupShape Group(ImmutableArray<Shape>.Builder parts, Element e) =>
        new(parts.ToImmutable()) { Class = "element " + e.Kind, Data = ImmutableDictionary<string, string>.Empty.Add("element", e.Name) };

    /// <summary>Wires from <paramref name="a"/> and <paramref name="b"/> to the symbol in the middle, the symbol, and the name and value beside it.</summary>
    private static void Two(ImmutableArray<Shape>.Builder parts, Element e, Point a, Point b, int labelSide)
    {
        var d = b - a;
        var length = d.Length;
        var u = (1 / length) * d;
        var n = new Point(-u.Y, u.X);
        var mid = a + 0.5 * d;
        var half = Math.Min(SymbolLength, 0.8 * length) / 2;
        var s0 = mid - half * u;
        var s1 = mid + half * u;
        var sources = e.Kind is "voltage-source" or "current-source";
        var radius = Math.Min(13, half);
        var w0 = sources ? mid - radius * u : s0;
        var w1 = sources ? mid + radius * u : s1;
        parts.Add(PathShape.Still([a, w0], Wire));
        parts.Add(PathShape.Still([w1, b], Wire));
        switch (e.Kind)
        {
            case "resistor":
                {
                    var points = new List<Point> { s0 };
                    for (var k = 0; k < 6; k++)
                        points.Add(s0 + ((k + 0.5) * 2 * half / 6) * u + (k % 2 == 0 ? 6 : -6) * n);
                    points.Add(s1);
                    parts.Add(PathShape.Still(points, Symbol));
                    break;
                }
            case "inductor":
                {
                    var points = new List<Point>();
                    const int humps = 4, per = 8;
                    var r = 2 * half / humps / 2;
                    for (var h = 0; h < humps; h++)
                        for (var k = 0; k <= per; k++)
                        {
                            var angle = Math.PI * k / per;
                            var centre = s0 + (r * (2 * h + 1)) * u;
                            points.Add(centre - (r * Math.Cos(angle)) * u - (r * Math.Sin(angle)) * n);
                        }
                    parts.Add(PathShape.Still(points, Symbol));
                    break;
                }
            case "capacitor":
                {
                    var p0 = mid - 3.5 * u;
                    var p1 = mid + 3.5 * u;
                    parts.Add(PathShape.Still([s0, p0], Wire));
                    parts.Add(PathShape.Still([p1, s1], Wire));
                    parts.Add(PathShape.Still([p0 - 11 * n, p0 + 11 * n], Symbol with { Width = 2.4 }));
                    parts.Add(PathShape.Still([p1 - 11 * n, p1 + 11 * n], Symbol with { Width = 2.4 }));
                    break;
                }
            case "voltage-source":
                parts.Add(new CircleShape(mid, radius, Symbol, "#ffffff"));
                parts.Add(new TextShape(mid + (radius * 0.45) * u + new Point(0, 4), "+", 11, TextAnchor.Middle, true, Palette.Blue));
                parts.Add(new TextShape(mid - (radius * 0.45) * u + new Point(0, 4), "−", 11, TextAnchor.Middle, true, Palette.Blue));
                break;
            default:
                {
                    parts.Add(new CircleShape(mid, radius, Symbol, "#ffffff"));
                    var tip = mid + (radius * 0.65) * u;
                    var tail = mid - (radius * 0.65) * u;
                    parts.Add(PathShape.Still([tail, tip], Symbol));
                    parts.Add(PathShape.Still([tip - 4 * u + 3.5 * n, tip, tip - 4 * u - 3.5 * n], Symbol));
                    break;
                }
        }
        // Labels beside the symbol: above a horizontal element (labelSide −1), right of a vertical one (+1).
        var horizontal = Math.Abs(u.X) > Math.Abs(u.Y);
        if (horizontal)
        {
            parts.Add(new TextShape(mid + new Point(0, -16), e.Name, 9.5, TextAnchor.Middle) { Class = "element-name", Halo = true });
            parts.Add(new TextShape(mid + new Point(0, 26), e.Value, 9.5, TextAnchor.Middle, false, "#333333") { Class = "element-value", Halo = true });
        }
        else
        {
            var side = labelSide * (radius + 4);
            parts.Add(new TextShape(mid + new Point(side, -2), e.Name, 9.5, TextAnchor.Start) { Class = "element-name", Halo = true });
            parts.Add(new TextShape(mid + new Point(side, 11), e.Value, 9.5, TextAnchor.Start, false, "#333333") { Class = "element-value", Halo = true });
        }
    }
}
