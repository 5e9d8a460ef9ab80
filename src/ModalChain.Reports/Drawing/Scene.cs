using System.Collections.Immutable;

namespace ModalChain.Reports.Drawing;

/// <summary>A point in figure coordinates: user units of the SVG (1/96 in), x to the right, y downwards.</summary>
public readonly record struct Point(double X, double Y)
{
    public static Point operator +(Point a, Point b) => new(a.X + b.X, a.Y + b.Y);
    public static Point operator -(Point a, Point b) => new(a.X - b.X, a.Y - b.Y);
    public static Point operator *(double s, Point a) => new(s * a.X, s * a.Y);

    /// <summary>Euclidean length of the point seen as a vector.</summary>
    public double Length => Math.Sqrt(X * X + Y * Y);
}

/// <summary>How a line is stroked: colour, width in user units and dash pattern (null for solid).</summary>
public sealed record Pen(string Color, double Width, ImmutableArray<double>? Dash = null, double Opacity = 1);

/// <summary>Horizontal alignment of a text label on its anchor point.</summary>
public enum TextAnchor
{
    Start,
    Middle,
    End,
}

/// <summary>One drawn element of a <see cref="Scene"/>; <see cref="Class"/> and <see cref="Data"/> become SVG attributes for tests and styling.</summary>
public abstract record Shape
{
    /// <summary>CSS class written on the SVG element, or null.</summary>
    public string? Class { get; init; }

    /// <summary>Attributes written as <c>data-KEY="VALUE"</c> on the SVG element.</summary>
    public ImmutableDictionary<string, string> Data { get; init; } = ImmutableDictionary<string, string>.Empty;
}

/// <summary>An open or closed polyline; with more than one frame it is animated through them (SVG only; other outputs draw frame 0).</summary>
public sealed record PathShape(ImmutableArray<ImmutableArray<Point>> Frames, Pen? Stroke, string? Fill = null, bool Closed = false, double FillOpacity = 1) : Shape
{
    /// <summary>A still path through <paramref name="points"/>.</summary>
    public static PathShape Still(IEnumerable<Point> points, Pen? stroke, string? fill = null, bool closed = false, double fillOpacity = 1) =>
        new([[.. points]], stroke, fill, closed, fillOpacity);

    /// <summary>The points drawn in a still rendering.</summary>
    public ImmutableArray<Point> Points => Frames[0];
}

/// <summary>A circle of radius <paramref name="Radius"/> user units.</summary>
public sealed record CircleShape(Point Center, double Radius, Pen? Stroke, string? Fill) : Shape;

/// <summary>A single-line text label; <paramref name="Size"/> is the font size in user units.</summary>
public sealed record TextShape(Point At, string Text, double Size, TextAnchor Anchor = TextAnchor.Start, bool Bold = false, string Color = "#000000") : Shape
{
    /// <summary>True to draw a white outline under the glyphs, so a label stays readable where it crosses a line.</summary>
    public bool Halo { get; init; }
}

/// <summary>A group of shapes sharing a class and data attributes.</summary>
public sealed record GroupShape(ImmutableArray<Shape> Children) : Shape;

/// <summary>A vector drawing of fixed size, rendered to SVG by <see cref="SvgSceneWriter"/> and to PDF by <see cref="PdfSceneWriter"/>.</summary>
/// <param name="Width">Width in user units (px at 96 dpi).</param>
/// <param name="Height">Height in user units.</param>
/// <param name="Title">Accessible title of the drawing.</param>
/// <param name="Shapes">The shapes, painted in order.</param>
/// <param name="Data">Attributes written as <c>data-KEY</c> on the root element (e.g. the drawing scales).</param>
public sealed record Scene(double Width, double Height, string Title, ImmutableArray<Shape> Shapes, ImmutableDictionary<string, string> Data)
{
    /// <summary>The font family every text of every figure uses, so output does not depend on a machine's fallback font.</summary>
    public const string FontFamily = "DejaVu Sans";

    /// <summary>The CSS font stack written into SVG: the fixed family first, then close metric-compatible fallbacks.</summary>
    public const string FontStack = "'DejaVu Sans', 'Liberation Sans', Arial, sans-serif";
}
