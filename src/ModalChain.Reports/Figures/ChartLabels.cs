using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Series;
using OxyPlot.SkiaSharp;
using SkiaSharp;

namespace ModalChain.Reports.Figures;

/// <summary>
/// A text that names a curve or a marker of a chart, placed by <see cref="ChartLabels.Place"/> inside the plot area,
/// clear of every other such label and, where there is room, of the curves and markers.
/// </summary>
/// <remarks>
/// OxyPlot clips annotations to the plot area, so a label anchored near an edge used to be cut off; the placer lays the
/// chart out at its final size, measures each label with the font that draws it and chooses a position from the
/// <see cref="Anchors"/> (or along the vertical line at <see cref="AlongX"/>), in order of preference.
/// </remarks>
public sealed class CurveLabel : TextAnnotation
{
    /// <summary>Creates a label of <paramref name="text"/> in <paramref name="colour"/>, 10 units high, not yet placed.</summary>
    public CurveLabel(string text, OxyColor colour)
    {
        Text = text;
        TextColor = colour;
        Stroke = OxyColors.Transparent;
        FontSize = 10;
        Padding = new OxyThickness(0);
        TextHorizontalAlignment = HorizontalAlignment.Left;
        TextVerticalAlignment = VerticalAlignment.Top;
    }

    /// <summary>Points of the curve (data coordinates) the label may stand beside, the preferred first.</summary>
    public IReadOnlyList<DataPoint> Anchors { get; init; } = [];

    /// <summary>When set, the label names the vertical marker at this x (data coordinates) and stands beside it, as high as there is room.</summary>
    public double? AlongX { get; init; }

    /// <summary>True once <see cref="ChartLabels.Place"/> found room for the label; a label without room is removed from the chart.</summary>
    public bool Placed { get; internal set; }

    /// <summary>The box the text occupies once placed (screen units of the chart: left, top, width, height).</summary>
    public OxyRect Box { get; internal set; }

    /// <summary>The size of the text as <paramref name="context"/> draws it, with this label's font.</summary>
    internal OxySize Measure(IRenderContext context) => context.MeasureText(Text ?? "", ActualFont, ActualFontSize, ActualFontWeight);
}

/// <summary>Places the <see cref="CurveLabel"/>s of a chart so none is clipped by the plot area and no two overlap.</summary>
public static class ChartLabels
{
    /// <summary>Clear space kept between a label and the plot's edge or another label, in user units.</summary>
    public const double Gap = 3;

    /// <summary>Distance of a label from the point or line it names, in user units.</summary>
    private const double Offset = 5;

    /// <summary>
    /// Lays <paramref name="model"/> out at <paramref name="width"/> × <paramref name="height"/> and gives every
    /// <see cref="CurveLabel"/> a position inside the plot area that overlaps no other label, preferring positions that
    /// cross no curve or marker line; a label for which the plot area has no room at all is removed. Returns how many
    /// labels were removed, so the figure's caption can say so.
    /// </summary>
    /// <remarks>
    /// A label's room is the part of the plot area its own axes span (a chart with two stacked panels, like the harmonic
    /// chart's magnitude over phase, clips each label to its panel), less <see cref="Gap"/>; a legend drawn inside the plot
    /// area is kept clear like another label.
    /// </remarks>
    public static int Place(PlotModel model, double width, double height)
    {
        ArgumentNullException.ThrowIfNull(model);
        var labels = model.Annotations.OfType<CurveLabel>().ToList();
        if (labels.Count == 0) return 0;
        var omitted = 0;
        lock (model.SyncRoot)
        {
            // The same render context as the exporters (no text shaping, user units), so the plot area and the text
            // widths measured here are the ones the SVG, the PDF and the report page draw.
            using var canvas = new SKNoDrawCanvas((int)Math.Ceiling(width), (int)Math.Ceiling(height));
            using var context = new SkiaRenderContext { RenderTarget = RenderTarget.VectorGraphic, SkCanvas = canvas, UseTextShaping = false, DpiScale = 1 };
            ((IPlotModel)model).Update(true);
            // A provisional position inside the axes' ranges for the layout pass; the real one is chosen below.
            foreach (var label in labels) label.TextPosition = new DataPoint(label.XAxis!.ActualMinimum, label.YAxis!.ActualMinimum);
            ((IPlotModel)model).Render(context, new OxyRect(0, 0, width, height));
            var obstacles = Obstacles(model, model.PlotArea);
            var placed = new List<OxyRect>(model.Legends.Where(l => l.IsLegendVisible && l.LegendArea.Width > 0).Select(l => l.LegendArea));
            foreach (var label in labels)
            {
                var area = Panel(label, model.PlotArea);
                var room = new OxyRect(area.Left + Gap, area.Top + Gap, Math.Max(0, area.Width - 2 * Gap), Math.Max(0, area.Height - 2 * Gap));
                var size = label.Measure(context);
                var box = Choose(label, size, area, room, placed, obstacles);
                if (box is not { } chosen)
                {
                    model.Annotations.Remove(label);
                    omitted++;
                    continue;
                }
                placed.Add(chosen);
                label.Box = chosen;
                label.Placed = true;
                label.Offset = new ScreenVector(0, 0);
                label.TextPosition = label.InverseTransform(new ScreenPoint(chosen.Left, chosen.Top));
            }
        }
        return omitted;
    }

    /// <summary>The part of <paramref name="plotArea"/> spanned by the label's own axes: the rectangle OxyPlot clips it to.</summary>
    private static OxyRect Panel(CurveLabel label, OxyRect plotArea)
    {
        double x0 = Math.Min(label.XAxis!.ScreenMin.X, label.XAxis.ScreenMax.X), x1 = Math.Max(label.XAxis.ScreenMin.X, label.XAxis.ScreenMax.X);
        double y0 = Math.Min(label.YAxis!.ScreenMin.Y, label.YAxis.ScreenMax.Y), y1 = Math.Max(label.YAxis.ScreenMin.Y, label.YAxis.ScreenMax.Y);
        var left = Math.Max(plotArea.Left, x0);
        var top = Math.Max(plotArea.Top, y0);
        var right = Math.Min(plotArea.Right, x1);
        var bottom = Math.Min(plotArea.Bottom, y1);
        return right > left && bottom > top ? new OxyRect(left, top, right - left, bottom - top) : plotArea;
    }

    private static OxyRect? Choose(CurveLabel label, OxySize size, OxyRect area, OxyRect room, List<OxyRect> placed, List<(ScreenPoint A, ScreenPoint B)> obstacles)
    {
        OxyRect? best = null;
        var bestCrossings = int.MaxValue;
        foreach (var candidate in Candidates(label, size, area))
        {
            if (!Fits(candidate, room, placed)) continue;
            var crossings = Crossings(candidate, obstacles);
            if (crossings == 0) return candidate;
            if (crossings < bestCrossings) (best, bestCrossings) = (candidate, crossings);
        }
        if (best is not null) return best;
        // No candidate beside the curve has room: any free place in the plot area, the fewest crossings first, then
        // the nearest to the preferred anchor.
        var first = FirstAnchor(label, area);
        for (var top = room.Top; top + size.Height <= room.Bottom; top += 4)
            for (var left = room.Left; left + size.Width <= room.Right; left += 4)
            {
                var candidate = new OxyRect(left, top, size.Width, size.Height);
                if (!Fits(candidate, room, placed)) continue;
                var crossings = Crossings(candidate, obstacles);
                if (crossings < bestCrossings || (crossings == bestCrossings && Distance(candidate, first) < Distance(best!.Value, first)))
                    (best, bestCrossings) = (candidate, crossings);
            }
        return best;
    }

    private static IEnumerable<OxyRect> Candidates(CurveLabel label, OxySize size, OxyRect area)
    {
        double w = size.Width, h = size.Height;
        if (label.AlongX is { } x)
        {
            var sx = label.Transform(new DataPoint(x, label.YAxis!.ActualMinimum)).X;
            for (var top = area.Top + Gap; top + h <= area.Bottom - Gap; top += 3)
            {
                yield return new OxyRect(sx + Offset, top, w, h);
                yield return new OxyRect(sx - Offset - w, top, w, h);
            }
            yield break;
        }
        foreach (var anchor in label.Anchors)
        {
            if (!anchor.IsDefined()) continue;
            var p = label.Transform(anchor);
            if (!double.IsFinite(p.X) || !double.IsFinite(p.Y) || !area.Contains(p)) continue;
            yield return new OxyRect(p.X + Offset, p.Y - Offset - h, w, h);
            yield return new OxyRect(p.X - Offset - w, p.Y - Offset - h, w, h);
            yield return new OxyRect(p.X - w / 2, p.Y - Offset - h, w, h);
            yield return new OxyRect(p.X + Offset, p.Y + Offset, w, h);
            yield return new OxyRect(p.X - Offset - w, p.Y + Offset, w, h);
        }
    }

    private static ScreenPoint FirstAnchor(CurveLabel label, OxyRect area)
    {
        if (label.AlongX is { } x) return new ScreenPoint(label.Transform(new DataPoint(x, label.YAxis!.ActualMinimum)).X, area.Top);
        foreach (var anchor in label.Anchors.Where(a => a.IsDefined()))
        {
            var p = label.Transform(anchor);
            if (double.IsFinite(p.X) && double.IsFinite(p.Y)) return p;
        }
        return new ScreenPoint(area.Left, area.Top);
    }

    private static double Distance(OxyRect box, ScreenPoint point) =>
        Math.Sqrt(Math.Pow(box.Center.X - point.X, 2) + Math.Pow(box.Center.Y - point.Y, 2));

    private static bool Fits(OxyRect box, OxyRect room, List<OxyRect> placed) =>
        box.Left >= room.Left && box.Right <= room.Right && box.Top >= room.Top && box.Bottom <= room.Bottom
        && placed.All(other => !Overlap(Inflate(other, Gap), box));

    private static bool Overlap(OxyRect a, OxyRect b) => a.Left < b.Right && b.Left < a.Right && a.Top < b.Bottom && b.Top < a.Bottom;

    private static OxyRect Inflate(OxyRect r, double by) => new(r.Left - by, r.Top - by, r.Width + 2 * by, r.Height + 2 * by);

    /// <summary>The curves and marker lines as screen segments: what a label should not cover.</summary>
    private static List<(ScreenPoint A, ScreenPoint B)> Obstacles(PlotModel model, OxyRect area)
    {
        var segments = new List<(ScreenPoint, ScreenPoint)>();
        foreach (var series in model.Series.OfType<LineSeries>().Where(s => s.IsVisible))
        {
            ScreenPoint? previous = null;
            foreach (var point in series.Points)
            {
                if (!point.IsDefined())
                {
                    previous = null;
                    continue;
                }
                var p = series.Transform(point);
                if (!double.IsFinite(p.X) || !double.IsFinite(p.Y))
                {
                    previous = null;
                    continue;
                }
                if (previous is { } q) segments.Add((q, p));
                previous = p;
            }
        }
        foreach (var line in model.Annotations.OfType<LineAnnotation>())
        {
            if (line.Type == LineAnnotationType.Vertical)
            {
                var x = line.Transform(new DataPoint(line.X, line.YAxis!.ActualMinimum)).X;
                segments.Add((new ScreenPoint(x, area.Top), new ScreenPoint(x, area.Bottom)));
            }
            else if (line.Type == LineAnnotationType.Horizontal)
            {
                var y = line.Transform(new DataPoint(line.XAxis!.ActualMinimum, line.Y)).Y;
                segments.Add((new ScreenPoint(area.Left, y), new ScreenPoint(area.Right, y)));
            }
        }
        return segments;
    }

    private static int Crossings(OxyRect box, List<(ScreenPoint A, ScreenPoint B)> segments)
    {
        var padded = Inflate(box, 1);
        var count = 0;
        foreach (var (a, b) in segments)
            if (SegmentMeetsBox(a, b, padded)) count++;
        return count;
    }

    /// <summary>True when segment ab has a point inside <paramref name="box"/> (Liang–Barsky clipping).</summary>
    internal static bool SegmentMeetsBox(ScreenPoint a, ScreenPoint b, OxyRect box)
    {
        double t0 = 0, t1 = 1, dx = b.X - a.X, dy = b.Y - a.Y;
        foreach (var (p, q) in new[] { (-dx, a.X - box.Left), (dx, box.Right - a.X), (-dy, a.Y - box.Top), (dy, box.Bottom - a.Y) })
        {
            if (p == 0)
            {
                if (q < 0) return false;
                continue;
            }
            var r = q / p;
            if (p < 0) t0 = Math.Max(t0, r);
            else t1 = Math.Min(t1, r);
            if (t0 > t1) return false;
        }
        return true;
    }
}
