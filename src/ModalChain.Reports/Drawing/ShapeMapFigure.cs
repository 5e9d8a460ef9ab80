using System.Collections.Immutable;
using System.Globalization;

namespace ModalChain.Reports.Drawing;

/// <summary>One node of a shape map: a mass at its drawing position with its value of the mode shape.</summary>
/// <param name="Name">Mass name.</param>
/// <param name="At">Drawing position in m (x to the right, y up the page).</param>
/// <param name="Value">The shape normalised to max |φ| = 1.</param>
/// <param name="Supported">True when a spring or damper joins the mass to a support.</param>
public sealed record MapNode(string Name, Point At, double Value, bool Supported);

/// <summary>Draws a mode shape of a large or plan-laid-out network as a coloured map over the masses' drawing positions, with its colour bar.</summary>
/// <remarks>
/// Each mass is a square cell centred on its position, coloured by its normalised shape value on the
/// <see cref="DivergingScale"/>. A cell's side is the smaller of the typical (median) distance between neighbouring masses
/// and the mass's own distance to its nearest neighbour, both measured as max(|Δx|, |Δy|), so cells never overlap.
/// Cells of one band are written as one compound path with touching cells of a row merged, which keeps a map of 10,000
/// masses to a few hundred kilobytes. The root element carries the mapping from drawing metres to figure units
/// (<c>data-px-per-m</c>, <c>data-origin-x</c>, <c>data-origin-y</c>: figure x = origin-x + x·px-per-m, figure y = origin-y − y·px-per-m).
/// </remarks>
public static class ShapeMapFigure
{
    /// <summary>Width of every map in user units (the width of the other schematics).</summary>
    public const double Width = NetworkFigure.Width;

    private const double HeaderLine = 18;
    private const double FooterLine = 16;
    private const double MapLeft = 30;
    private const double MapRight = Width - 150;
    private const double MaxMapHeight = 480;
    private const double BarWidth = 18;
    private const double ValueLabelMinCell = 40;
    private const double ValueLabelSize = 9.5;

    /// <summary>The map of one mode shape.</summary>
    /// <param name="nodes">Every mass with its position and normalised value (at least one).</param>
    /// <param name="supports">Drawing positions (m) of supports that have one; drawn as black triangles.</param>
    /// <param name="header">Title lines; the first is the figure's title.</param>
    /// <param name="footer">Note lines under the map.</param>
    public static Scene Mode(IReadOnlyList<MapNode> nodes, IReadOnlyList<Point> supports, IReadOnlyList<string> header, IReadOnlyList<string> footer)
    {
        ArgumentNullException.ThrowIfNull(nodes);
        ArgumentNullException.ThrowIfNull(supports);
        ArgumentNullException.ThrowIfNull(header);
        ArgumentNullException.ThrowIfNull(footer);
        if (nodes.Count == 0) throw new ArgumentException("A shape map needs at least one node.", nameof(nodes));

        var sides = CellSides(nodes);
        var typical = sides.Typical;
        var all = nodes.Select(n => n.At).Concat(supports).ToArray();
        var minX = all.Min(p => p.X) - typical / 2;
        var maxX = all.Max(p => p.X) + typical / 2;
        var minY = all.Min(p => p.Y) - typical / 2;
        var maxY = all.Max(p => p.Y) + typical / 2;
        var scale = Math.Min((MapRight - MapLeft) / (maxX - minX), MaxMapHeight / (maxY - minY));
        var mapTop = 16 + header.Count * HeaderLine + 24;
        var mapHeight = (maxY - minY) * scale;
        var barHeight = Math.Clamp(mapHeight, 200, 320);
        var bodyHeight = Math.Max(mapHeight, barHeight + 30);
        var originX = MapLeft + ((MapRight - MapLeft) - (maxX - minX) * scale) / 2 - minX * scale;
        var originY = mapTop + maxY * scale;
        Point Map(Point p) => new(originX + p.X * scale, originY - p.Y * scale);

        var shapes = ImmutableArray.CreateBuilder<Shape>();
        for (var i = 0; i < header.Count; i++)
            shapes.Add(new TextShape(new Point(16, 24 + i * HeaderLine), header[i], i == 0 ? 14 : 11.5, TextAnchor.Start, i == 0)
            { Class = i == 0 ? "figure-title" : "figure-subtitle" });

        // Cells, one compound path per band.
        var cells = new Rect[nodes.Count];
        for (var i = 0; i < nodes.Count; i++) cells[i] = Rect.Around(Map(nodes[i].At), sides.Side[i] * scale / 2);
        var bands = nodes.Select(n => DivergingScale.Band(n.Value)).ToArray();
        foreach (var group in Enumerable.Range(0, nodes.Count).GroupBy(i => bands[i]).OrderBy(g => g.Key))
            shapes.Add(new RectSetShape(Merged(group.Select(i => cells[i])), null, DivergingScale.Colours[group.Key])
            {
                Class = "map-band",
                Data = ImmutableDictionary<string, string>.Empty.Add("band", group.Key.ToString(CultureInfo.InvariantCulture))
                    .Add("from", Invariant(DivergingScale.LowerEdge(group.Key))).Add("to", Invariant(DivergingScale.LowerEdge(group.Key + 1))),
            });

        var placer = new LabelPlacer(new Rect(4, mapTop - 20, MapRight + 6, mapTop + bodyHeight + 12));
        var valueLabels = typical * scale >= ValueLabelMinCell && nodes.Count <= 400;
        if (valueLabels)
            for (var i = 0; i < nodes.Count; i++)
            {
                var cell = cells[i];
                if (cell.Right - cell.Left < ValueLabelMinCell) continue;
                var colour = DivergingScale.Luminance(DivergingScale.Colours[bands[i]]) < 0.2 ? "#FFFFFF" : "#000000";
                var text = new TextShape(Map(nodes[i].At) + new Point(0, 0.35 * ValueLabelSize), Signed(nodes[i].Value, 2), ValueLabelSize, TextAnchor.Middle, false, colour)
                { Class = "map-value", Data = ImmutableDictionary<string, string>.Empty.Add("mass", nodes[i].Name) };
                placer.Block(TextMetrics.Box(text));
                shapes.Add(text);
            }

        // Masses held by a support: a small black square (in the cell's corner when the cell also carries its value).
        var marks = nodes.Select((n, i) => (n, i)).Where(p => p.n.Supported).Select(p =>
        {
            var cell = cells[p.i];
            var half = Math.Clamp(0.15 * (cell.Right - cell.Left), 0.9, 3.5);
            var at = valueLabels && cell.Right - cell.Left >= ValueLabelMinCell ? new Point(cell.Left + 3 + half, cell.Top + 3 + half) : Map(p.n.At);
            return Rect.Around(at, half);
        }).ToImmutableArray();
        if (!marks.IsEmpty) shapes.Add(new RectSetShape(marks, null, Palette.Black) { Class = "support-mark" });
        foreach (var s in supports)
        {
            var p = Map(s);
            shapes.Add(PathShape.Still([p + new Point(0, -6), p + new Point(6, 5), p + new Point(-6, 5)], Palette.Support, Palette.Black, closed: true) with { Class = "support" });
            placer.Block(Rect.Around(p, 6));
        }

        // The extreme nodes: the largest value (+1 by the normalisation) and the most negative one, ringed and named.
        var high = 0;
        var low = 0;
        for (var i = 1; i < nodes.Count; i++)
        {
            if (nodes[i].Value > nodes[high].Value) high = i;
            if (nodes[i].Value < nodes[low].Value) low = i;
        }
        (int Index, string Kind)[] extremes = nodes[low].Value < 0 && low != high ? [(high, "max"), (low, "min")] : [(high, "max")];
        foreach (var (i, kind) in extremes)
        {
            var p = Map(nodes[i].At);
            var r = Math.Max(4.5, 0.5 * (cells[i].Right - cells[i].Left) + 1.5);
            shapes.Add(new CircleShape(p, r, new Pen(Palette.Black, 1.6), null)
            {
                Class = "extreme " + kind,
                Data = ImmutableDictionary<string, string>.Empty.Add("mass", nodes[i].Name).Add("value", Invariant(nodes[i].Value)),
            });
            placer.Block(Rect.Around(p, r));
        }
        foreach (var (i, kind) in extremes)
        {
            var label = placer.Place($"{Signed(nodes[i].Value, 3)} at {nodes[i].Name}", 10.5,
                LabelPlacer.AroundPoint(Map(nodes[i].At), Math.Max(4.5, 0.5 * (cells[i].Right - cells[i].Left) + 1.5), 10.5), Palette.Black, "extreme-label " + kind,
                ImmutableDictionary<string, string>.Empty.Add("mass", nodes[i].Name));
            if (label is not null) shapes.Add(label with { Bold = false });
        }

        ColourBar(shapes, MapRight + 40, mapTop + (bodyHeight - barHeight) / 2 + 14, barHeight);

        var height = Math.Ceiling(mapTop + bodyHeight + 22 + footer.Count * FooterLine + 8);
        var y = height - 12 - (footer.Count - 1) * FooterLine;
        for (var i = 0; i < footer.Count; i++)
            shapes.Add(new TextShape(new Point(16, y + i * FooterLine), footer[i], 10.5, TextAnchor.Start, false, "#333333") { Class = "figure-note" });

        var data = ImmutableDictionary<string, string>.Empty
            .Add("view", "map")
            .Add("px-per-m", Invariant(scale))
            .Add("origin-x", Invariant(originX))
            .Add("origin-y", Invariant(originY))
            .Add("masses", nodes.Count.ToString(CultureInfo.InvariantCulture))
            .Add("max-mass", nodes[high].Name);
        return new Scene(Width, height, header.Count > 0 ? header[0] : "Mode shape map", shapes.ToImmutable(), data);
    }

    /// <summary>A normalised value with its sign and <paramref name="decimals"/> decimals ("+1.000", "−0.28").</summary>
    public static string Signed(double value, int decimals)
    {
        var text = Math.Abs(value).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        return (value < 0 && text.Any(c => c is >= '1' and <= '9') ? "−" : "+") + text;
    }

    /// <summary>The side of every node's cell in m, and the typical (median) nearest-neighbour distance.</summary>
    /// <remarks>Distances are max(|Δx|, |Δy|), found by a sweep over the nodes sorted along the axis of larger spread (about n·√n steps on a square grid, n on a chain).</remarks>
    public static (double[] Side, double Typical) CellSides(IReadOnlyList<MapNode> nodes)
    {
        ArgumentNullException.ThrowIfNull(nodes);
        var n = nodes.Count;
        var nearest = new double[n];
        // Sweep along the axis of larger spread, so a chain along either axis costs n steps.
        var alongX = nodes.Max(p => p.At.X) - nodes.Min(p => p.At.X) >= nodes.Max(p => p.At.Y) - nodes.Min(p => p.At.Y);
        double U(int i) => alongX ? nodes[i].At.X : nodes[i].At.Y;
        double V(int i) => alongX ? nodes[i].At.Y : nodes[i].At.X;
        var order = Enumerable.Range(0, n).OrderBy(U).ThenBy(V).ToArray();
        for (var a = 0; a < n; a++)
        {
            var best = double.PositiveInfinity;
            var i = order[a];
            for (var b = a + 1; b < n; b++)
            {
                var du = U(order[b]) - U(i);
                if (du >= best) break;
                best = Math.Min(best, Math.Max(du, Math.Abs(V(order[b]) - V(i))));
            }
            for (var b = a - 1; b >= 0; b--)
            {
                var du = U(i) - U(order[b]);
                if (du >= best) break;
                best = Math.Min(best, Math.Max(du, Math.Abs(V(order[b]) - V(i))));
            }
            nearest[i] = best;
        }
        var finite = nearest.Where(d => double.IsFinite(d) && d > 0).Order().ToArray();
        var typical = finite.Length > 0 ? finite[finite.Length / 2] : 1.0;
        var sides = nearest.Select(d => double.IsFinite(d) ? Math.Max(Math.Min(d, typical), 1e-3 * typical) : typical).ToArray();
        return (sides, typical);
    }

    private static ImmutableArray<Rect> Merged(IEnumerable<Rect> cells)
    {
        const double eps = 1e-6;
        var merged = ImmutableArray.CreateBuilder<Rect>();
        foreach (var r in cells.OrderBy(c => c.Top).ThenBy(c => c.Left))
        {
            if (merged.Count > 0)
            {
                var last = merged[^1];
                if (Math.Abs(last.Top - r.Top) < eps && Math.Abs(last.Bottom - r.Bottom) < eps && Math.Abs(last.Right - r.Left) < eps)
                {
                    merged[^1] = last with { Right = r.Right };
                    continue;
                }
            }
            merged.Add(r);
        }
        return merged.ToImmutable();
    }

    private static void ColourBar(ImmutableArray<Shape>.Builder shapes, double left, double top, double height)
    {
        var step = height / DivergingScale.BandCount;
        shapes.Add(new TextShape(new Point(left + BarWidth / 2, top - 12), "φ (max |φ| = 1)", 10.5, TextAnchor.Middle) { Class = "colour-bar-title" });
        for (var b = 0; b < DivergingScale.BandCount; b++)
        {
            // Highest values at the top.
            var y0 = top + (DivergingScale.BandCount - 1 - b) * step;
            shapes.Add(new RectSetShape([new Rect(left, y0, left + BarWidth, y0 + step)], null, DivergingScale.Colours[b])
            { Class = "colour-bar", Data = ImmutableDictionary<string, string>.Empty.Add("band", b.ToString(CultureInfo.InvariantCulture)) });
        }
        shapes.Add(new RectSetShape([new Rect(left, top, left + BarWidth, top + height)], new Pen(Palette.Black, 0.8), null) { Class = "colour-bar-frame" });
        var tick = new Pen(Palette.Black, 0.8);
        foreach (var value in new[] { -1.0, -0.5, 0.0, 0.5, 1.0 })
        {
            var y = top + (1 - value) / 2 * height;
            shapes.Add(PathShape.Still([new Point(left + BarWidth, y), new Point(left + BarWidth + 4, y)], tick) with { Class = "colour-bar-tick" });
            shapes.Add(new TextShape(new Point(left + BarWidth + 7, y + 3.5), value == 0 ? "0" : Signed(value, 1), 10)
            { Class = "colour-bar-label", Data = ImmutableDictionary<string, string>.Empty.Add("value", Invariant(value)) });
        }
    }

    private static string Invariant(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
