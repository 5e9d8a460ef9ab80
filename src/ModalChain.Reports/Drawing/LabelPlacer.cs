using System.Collections.Immutable;

namespace ModalChain.Reports.Drawing;

/// <summary>An axis-aligned rectangle in figure units (y downwards).</summary>
public readonly record struct Rect(double Left, double Top, double Right, double Bottom)
{
    /// <summary>True when the two rectangles share interior area (touching edges do not count).</summary>
    public bool Intersects(Rect other) =>
        Left < other.Right && other.Left < Right && Top < other.Bottom && other.Top < Bottom;

    /// <summary>True when <paramref name="inner"/> lies wholly inside this rectangle.</summary>
    public bool Contains(Rect inner) =>
        inner.Left >= Left && inner.Right <= Right && inner.Top >= Top && inner.Bottom <= Bottom;

    /// <summary>The rectangle grown by <paramref name="margin"/> on every side.</summary>
    public Rect Inflate(double margin) => new(Left - margin, Top - margin, Right + margin, Bottom + margin);

    /// <summary>The square of half-side <paramref name="half"/> around <paramref name="centre"/>.</summary>
    public static Rect Around(Point centre, double half) => new(centre.X - half, centre.Y - half, centre.X + half, centre.Y + half);
}

/// <summary>A conservative estimate of the box a label occupies in the figures' font (DejaVu Sans), without measuring glyphs.</summary>
/// <remarks>
/// Widths in em: 1.0 for the widest glyphs (m, w, M, W, @, %, #, &amp;, the mathematical signs + &lt; = &gt; ^ ~, and every
/// character outside ASCII), 0.8 for other capitals, 0.64 otherwise; DejaVu Sans's own advances are at most these
/// (lower-case letters and digits 0.28–0.64 em, capitals up to 0.79 em apart from M and W, the signs 0.84 em). Height: 0.95 em above the baseline, 0.25 em below.
/// </remarks>
public static class TextMetrics
{
    /// <summary>Height above the baseline as a fraction of the font size.</summary>
    public const double Ascent = 0.95;

    /// <summary>Depth below the baseline as a fraction of the font size.</summary>
    public const double Descent = 0.25;

    /// <summary>The estimated advance width of <paramref name="text"/> at font size <paramref name="size"/>, in figure units.</summary>
    public static double Width(string text, double size)
    {
        ArgumentNullException.ThrowIfNull(text);
        var em = 0.0;
        foreach (var c in text)
            em += c > '\u007e' || "mwMW@%#&+<=>^~".Contains(c, StringComparison.Ordinal) ? 1.0 : char.IsUpper(c) ? 0.8 : 0.64;
        return em * size;
    }

    /// <summary>
    /// <paramref name="lines"/> broken at spaces into lines whose estimated width at <paramref name="size"/> fits
    /// <paramref name="width"/>; a single word longer than that stays whole on a line of its own.
    /// </summary>
    public static List<string> Wrap(IReadOnlyList<string> lines, double size, double width)
    {
        ArgumentNullException.ThrowIfNull(lines);
        var wrapped = new List<string>();
        foreach (var line in lines)
        {
            var current = "";
            foreach (var word in line.Split(' '))
            {
                var candidate = current.Length == 0 ? word : current + " " + word;
                if (current.Length > 0 && Width(candidate, size) > width)
                {
                    wrapped.Add(current);
                    current = word;
                }
                else current = candidate;
            }
            wrapped.Add(current);
        }
        return wrapped;
    }

    /// <summary>The box of a text label at its anchor.</summary>
    public static Rect Box(TextShape text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var w = Width(text.Text, text.Size) * (text.Bold ? 1.12 : 1);
        var left = text.Anchor switch
        {
            TextAnchor.Middle => text.At.X - w / 2,
            TextAnchor.End => text.At.X - w,
            _ => text.At.X,
        };
        return new Rect(left, text.At.Y - Ascent * text.Size, left + w, text.At.Y + Descent * text.Size);
    }
}

/// <summary>Places labels one at a time at the first candidate position whose box meets no label or symbol placed before: a greedy collision check.</summary>
/// <param name="bounds">The area labels must stay inside.</param>
public sealed class LabelPlacer(Rect bounds)
{
    private const double Gap = 1.5;
    private readonly List<Rect> _taken = [];

    /// <summary>How many labels found no free place and were left out.</summary>
    public int Omitted { get; private set; }

    /// <summary>Marks <paramref name="area"/> as occupied (a symbol that labels must not cover).</summary>
    public void Block(Rect area) => _taken.Add(area);

    /// <summary>
    /// The label at the first of <paramref name="candidates"/> that stays inside the bounds and overlaps nothing placed,
    /// now marked occupied; null (counted in <see cref="Omitted"/>) when every candidate collides.
    /// </summary>
    public TextShape? Place(string text, double size, IEnumerable<(Point At, TextAnchor Anchor)> candidates, string color, string cssClass,
        ImmutableDictionary<string, string>? data = null)
    {
        ArgumentNullException.ThrowIfNull(candidates);
        foreach (var (at, anchor) in candidates)
        {
            var shape = new TextShape(at, text, size, anchor, false, color) { Class = cssClass, Data = data ?? ImmutableDictionary<string, string>.Empty, Halo = true };
            var box = TextMetrics.Box(shape);
            if (!bounds.Contains(box)) continue;
            var padded = box.Inflate(Gap);
            if (_taken.Any(t => t.Intersects(padded))) continue;
            _taken.Add(box);
            return shape;
        }
        Omitted++;
        return null;
    }

    /// <summary>
    /// Two lines placed together (a name and its value below it, <paramref name="lineGap"/> lower, same anchor) at the
    /// first candidate where both stay inside the bounds and overlap nothing placed; null (counted once in
    /// <see cref="Omitted"/>) when every candidate collides.
    /// </summary>
    public (TextShape First, TextShape Second)? PlacePair(string first, double firstSize, string second, double secondSize, double lineGap,
        IEnumerable<(Point At, TextAnchor Anchor)> candidates, string firstColor, string secondColor, string firstClass, string secondClass,
        ImmutableDictionary<string, string>? data = null)
    {
        ArgumentNullException.ThrowIfNull(candidates);
        foreach (var (at, anchor) in candidates)
        {
            var one = new TextShape(at, first, firstSize, anchor, false, firstColor) { Class = firstClass, Data = data ?? ImmutableDictionary<string, string>.Empty, Halo = true };
            var two = new TextShape(at + new Point(0, lineGap), second, secondSize, anchor, false, secondColor) { Class = secondClass, Data = data ?? ImmutableDictionary<string, string>.Empty, Halo = true };
            var boxes = new[] { TextMetrics.Box(one), TextMetrics.Box(two) };
            if (!boxes.All(bounds.Contains)) continue;
            if (boxes.Any(b => _taken.Any(t => t.Intersects(b.Inflate(Gap))))) continue;
            _taken.AddRange(boxes);
            return (one, two);
        }
        Omitted++;
        return null;
    }

    /// <summary>Candidate positions around a point symbol of half-size <paramref name="clearance"/>: right, left, above, below, then the diagonals, then farther out.</summary>
    public static IEnumerable<(Point At, TextAnchor Anchor)> AroundPoint(Point p, double clearance, double size)
    {
        foreach (var step in new[] { 0.0, 1.0, 2.2, 3.6, 5.2 })
        {
            var r = clearance + 3 + step * size;
            yield return (new Point(p.X + r, p.Y + 0.35 * size), TextAnchor.Start);
            yield return (new Point(p.X - r, p.Y + 0.35 * size), TextAnchor.End);
            yield return (new Point(p.X, p.Y - r), TextAnchor.Middle);
            yield return (new Point(p.X, p.Y + r + 0.8 * size), TextAnchor.Middle);
            yield return (new Point(p.X + 0.75 * r, p.Y - 0.75 * r), TextAnchor.Start);
            yield return (new Point(p.X - 0.75 * r, p.Y - 0.75 * r), TextAnchor.End);
            yield return (new Point(p.X + 0.75 * r, p.Y + 0.75 * r + 0.8 * size), TextAnchor.Start);
            yield return (new Point(p.X - 0.75 * r, p.Y + 0.75 * r + 0.8 * size), TextAnchor.End);
        }
    }

    /// <summary>
    /// Candidate positions for a label of estimated width <paramref name="width"/> beside a drawn line element from
    /// <paramref name="a"/> to <paramref name="b"/> whose symbol reaches <paramref name="clearance"/> to each side: beside
    /// its middle on either side, then beside points 0.3, 0.7, 0.15 and 0.85 of the way along, each round a little
    /// farther out. The anchor follows the side (a label right of the line starts there, one left of it ends there, one
    /// above or below a level line is centred), and each position is pushed out until the nearest corner of the label's
    /// box (<see cref="TextMetrics.Box"/>) is more than the clearance from the line.
    /// </summary>
    public static IEnumerable<(Point At, TextAnchor Anchor)> AlongLine(Point a, Point b, double clearance, double size, double width)
    {
        var d = b - a;
        var length = d.Length;
        var u = length > 1e-9 ? (1 / length) * d : new Point(0, -1);
        var n = new Point(-u.Y, u.X);
        if (n.X < 0 || (n.X == 0 && n.Y > 0)) n = -1 * n; // the first side tried is the right (or, for a level line, the top)
        foreach (var step in new[] { 0.0, 0.8, 1.8, 3.0, 4.5, 6.5 })
            foreach (var t in new[] { 0.5, 0.3, 0.7, 0.15, 0.85 })
                foreach (var side in new[] { 1.0, -1.0 })
                {
                    var normal = side * n;
                    var anchor = normal.X > 0.35 ? TextAnchor.Start : normal.X < -0.35 ? TextAnchor.End : TextAnchor.Middle;
                    var (left, right) = anchor switch
                    {
                        TextAnchor.Start => (0.0, width),
                        TextAnchor.End => (-width, 0.0),
                        _ => (-width / 2, width / 2),
                    };
                    // The box's corners relative to the anchor point; the one nearest the line sets how far out to go.
                    var nearest = new[] { left, right }
                        .SelectMany(x => new[] { -TextMetrics.Ascent * size, TextMetrics.Descent * size }.Select(y => x * normal.X + y * normal.Y))
                        .Min();
                    var r = clearance + 2 + step * size - nearest;
                    yield return (a + t * d + r * normal, anchor);
                }
    }

    /// <summary>Candidate positions for the label of a drawn area: inside along its top edge, above it, below it, beside it, then around its centre.</summary>
    public static IEnumerable<(Point At, TextAnchor Anchor)> AroundArea(Rect area, double size)
    {
        var cx = (area.Left + area.Right) / 2;
        var cy = (area.Top + area.Bottom) / 2;
        yield return (new Point(cx, area.Top + 1.15 * size), TextAnchor.Middle);
        yield return (new Point(cx, area.Top - 4), TextAnchor.Middle);
        yield return (new Point(cx, area.Bottom + 4 + 0.95 * size), TextAnchor.Middle);
        yield return (new Point(area.Right + 4, cy + 0.35 * size), TextAnchor.Start);
        yield return (new Point(area.Left - 4, cy + 0.35 * size), TextAnchor.End);
        foreach (var c in AroundPoint(new Point(cx, cy), Math.Max(area.Right - area.Left, area.Bottom - area.Top) / 2, size)) yield return c;
    }
}
