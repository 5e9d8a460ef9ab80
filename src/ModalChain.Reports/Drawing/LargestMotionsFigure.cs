using System.Collections.Immutable;
using System.Globalization;

namespace ModalChain.Reports.Drawing;

/// <summary>A mode shape of a large network without drawing positions: horizontal bars of the masses that move most, largest first.</summary>
/// <remarks>
/// Bars start at a common zero line, to the right for positive values and to the left for negative ones, coloured on the
/// <see cref="DivergingScale"/> of the shape maps; a bar of length <c>data-half-bar-px</c> is |φ| = 1. Each bar carries
/// <c>data-mass</c> and <c>data-value</c>.
/// </remarks>
public static class LargestMotionsFigure
{
    /// <summary>Width of the figure in user units.</summary>
    public const double Width = NetworkFigure.Width;

    private const double HeaderLine = 18;
    private const double FooterLine = 16;
    private const double Row = 17;
    private const double NameRight = 200;
    private const double Zero = 420;
    private const double HalfBar = 165;
    private const double NameSize = 10;

    /// <summary>The bars of <paramref name="largest"/> (name and normalised value, in the order drawn, top first).</summary>
    public static Scene Mode(IReadOnlyList<(string Name, double Value)> largest, IReadOnlyList<string> header, IReadOnlyList<string> footer)
    {
        ArgumentNullException.ThrowIfNull(largest);
        ArgumentNullException.ThrowIfNull(header);
        ArgumentNullException.ThrowIfNull(footer);
        var shapes = ImmutableArray.CreateBuilder<Shape>();
        for (var i = 0; i < header.Count; i++)
            shapes.Add(new TextShape(new Point(16, 24 + i * HeaderLine), header[i], i == 0 ? 14 : 11.5, TextAnchor.Start, i == 0)
            { Class = i == 0 ? "figure-title" : "figure-subtitle" });
        var top = 16 + header.Count * HeaderLine + 30;
        var axis = new Pen(Palette.Black, 1);
        var grid = new Pen(Palette.Grey, 0.6, ImmutableArray.Create(2.0, 3.0));
        var bottom = top + largest.Count * Row + 4;
        foreach (var v in new[] { -1.0, -0.5, 0.5, 1.0 })
            shapes.Add(PathShape.Still([new Point(Zero + v * HalfBar, top - 4), new Point(Zero + v * HalfBar, bottom)], grid) with { Class = "grid" });
        foreach (var v in new[] { -1.0, -0.5, 0.0, 0.5, 1.0 })
            shapes.Add(new TextShape(new Point(Zero + v * HalfBar, top - 9), v == 0 ? "0" : ShapeMapFigure.Signed(v, 1), 10, TextAnchor.Middle)
            { Class = "axis-label" });
        for (var k = 0; k < largest.Count; k++)
        {
            var (name, value) = largest[k];
            var y = top + k * Row;
            var tip = Zero + Math.Clamp(value, -1, 1) * HalfBar;
            var data = ImmutableDictionary<string, string>.Empty.Add("mass", name).Add("value", value.ToString("R", CultureInfo.InvariantCulture));
            shapes.Add(new RectSetShape([new Rect(Math.Min(Zero, tip), y + 2, Math.Max(Zero, tip), y + Row - 2)], new Pen(Palette.Black, 0.6), DivergingScale.ColourOf(value))
            { Class = "motion-bar", Data = data });
            shapes.Add(new TextShape(new Point(NameRight, y + Row / 2 + 3.5), Fit(name, NameRight - 16), NameSize, TextAnchor.End) { Class = "bar-name", Data = data });
            var valueText = ShapeMapFigure.Signed(value, 3);
            shapes.Add(value >= 0
                ? new TextShape(new Point(tip + 4, y + Row / 2 + 3.5), valueText, NameSize) { Class = "bar-value", Data = data }
                : new TextShape(new Point(tip - 4, y + Row / 2 + 3.5), valueText, NameSize, TextAnchor.End) { Class = "bar-value", Data = data });
        }
        shapes.Add(PathShape.Still([new Point(Zero, top - 4), new Point(Zero, bottom)], axis) with { Class = "axis" });
        var height = Math.Ceiling(bottom + 16 + footer.Count * FooterLine + 8);
        var fy = height - 12 - (footer.Count - 1) * FooterLine;
        for (var i = 0; i < footer.Count; i++)
            shapes.Add(new TextShape(new Point(16, fy + i * FooterLine), footer[i], 10.5, TextAnchor.Start, false, "#333333") { Class = "figure-note" });
        var rootData = ImmutableDictionary<string, string>.Empty.Add("view", "largest-motions")
            .Add("half-bar-px", HalfBar.ToString("R", CultureInfo.InvariantCulture));
        return new Scene(Width, height, header.Count > 0 ? header[0] : "Largest motions", shapes.ToImmutable(), rootData);
    }

    /// <summary>The name shortened with an ellipsis so its estimated width stays within <paramref name="width"/>.</summary>
    private static string Fit(string name, double width)
    {
        if (TextMetrics.Width(name, NameSize) <= width) return name;
        var cut = name.Length;
        while (cut > 1 && TextMetrics.Width(name[..cut] + "…", NameSize) > width) cut--;
        return name[..cut] + "…";
    }
}
