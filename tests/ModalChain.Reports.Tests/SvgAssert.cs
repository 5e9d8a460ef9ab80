using System.Globalization;
using System.Xml.Linq;
using ModalChain.Reports.Drawing;

namespace ModalChain.Reports.Tests;

/// <summary>Parses SVG text and checks what every figure must have: well-formed XML, an svg root with a viewBox.</summary>
internal static class SvgAssert
{
    public static XElement WellFormedWithViewBox(string svg)
    {
        var document = XDocument.Parse(svg); // throws on malformed XML
        var root = document.Root!;
        Assert.Equal(Repository.Svg + "svg", root.Name);
        var viewBox = root.Attribute("viewBox")?.Value;
        Assert.False(string.IsNullOrWhiteSpace(viewBox), "the svg root has no viewBox");
        var parts = viewBox!.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(p => double.Parse(p, CultureInfo.InvariantCulture)).ToArray();
        Assert.Equal(4, parts.Length);
        Assert.True(parts[2] > 0 && parts[3] > 0, $"viewBox '{viewBox}' has no area");
        return root;
    }

    public static IReadOnlyList<string> Texts(XElement root) =>
        [.. root.Descendants(Repository.Svg + "text").Select(t => t.Value.Trim())];

    /// <summary>
    /// Every unrotated text of a chart with the box it occupies, measured with the font that draws it (SkiaSharp's advance
    /// width and the font's ascent and descent around the baseline), and the clip rectangle of the group it is drawn in.
    /// </summary>
    /// <remarks>
    /// OxyPlot's SVG gives a text a transform="translate(x y)", the x of each glyph relative to it (the first is the left
    /// edge) and the baseline's y; rotated texts (the vertical axis title) have a matrix and are returned with Rotated set.
    /// </remarks>
    public static IReadOnlyList<(string Text, Rect Box, Rect? Clip, bool Rotated)> TextBoxes(XElement root)
    {
        var clips = root.Descendants(Repository.Svg + "clipPath").ToDictionary(
            c => c.Attribute("id")!.Value,
            c => c.Element(Repository.Svg + "rect") is { } r ? new Rect(Number(r, "x"), Number(r, "y"), Number(r, "x") + Number(r, "width"), Number(r, "y") + Number(r, "height")) : (Rect?)null);
        var boxes = new List<(string, Rect, Rect?, bool)>();
        foreach (var text in root.Descendants(Repository.Svg + "text"))
        {
            var transform = text.Attribute("transform")?.Value ?? "";
            var rotated = !transform.StartsWith("translate(", StringComparison.Ordinal) && transform.Length > 0;
            double tx = 0, ty = 0;
            if (transform.StartsWith("translate(", StringComparison.Ordinal))
            {
                var parts = transform["translate(".Length..^1].Split(' ', StringSplitOptions.RemoveEmptyEntries);
                tx = double.Parse(parts[0], CultureInfo.InvariantCulture);
                ty = double.Parse(parts[1], CultureInfo.InvariantCulture);
            }
            var x0 = double.Parse(text.Attribute("x")!.Value.Split(',')[0], CultureInfo.InvariantCulture);
            var y0 = double.Parse(text.Attribute("y")!.Value.Split(',')[0], CultureInfo.InvariantCulture);
            var size = double.Parse(text.Attribute("font-size")!.Value, CultureInfo.InvariantCulture);
            var bold = int.TryParse(text.Attribute("font-weight")?.Value, NumberStyles.Integer, CultureInfo.InvariantCulture, out var weight) && weight >= 600;
            using var typeface = SkiaSharp.SKTypeface.FromFamilyName(Scene.FontFamily, bold ? SkiaSharp.SKFontStyle.Bold : SkiaSharp.SKFontStyle.Normal);
            Assert.True(typeface is not null && typeface.FamilyName == Scene.FontFamily, $"the font '{Scene.FontFamily}' is not installed (Debian: fonts-dejavu-core)");
            using var paint = new SkiaSharp.SKPaint { Typeface = typeface, TextSize = (float)size };
            var width = paint.MeasureText(text.Value);
            var metrics = paint.FontMetrics;
            var left = tx + x0;
            var box = new Rect(left, ty + y0 + metrics.Ascent, left + width, ty + y0 + metrics.Descent);
            var clipId = text.Ancestors().Select(a => a.Attribute("clip-path")?.Value).FirstOrDefault(v => v is not null);
            Rect? clip = clipId is not null && clips.TryGetValue(clipId["url(#".Length..^1], out var c) ? c : null;
            boxes.Add((text.Value.Trim(), box, clip, rotated));
        }
        return boxes;

        static double Number(XElement e, string name) => double.Parse(e.Attribute(name)?.Value ?? "0", CultureInfo.InvariantCulture);
    }

    /// <summary>
    /// Asserts the chart's texts whose content starts with one of <paramref name="labels"/> are there, lie inside the
    /// figure and inside the clip rectangle they are drawn in (so nothing of them is cut off), and that no two unrotated
    /// texts of the chart overlap.
    /// </summary>
    public static void LabelsInsideAndApart(XElement root, double width, double height, params string[] labels)
    {
        var boxes = TextBoxes(root);
        foreach (var label in labels)
        {
            var found = boxes.Where(b => b.Text.StartsWith(label, StringComparison.Ordinal)).ToList();
            Assert.True(found.Count > 0, $"no text '{label}' in the chart; texts: {string.Join(" | ", boxes.Select(b => b.Text))}");
            foreach (var (text, box, clip, rotated) in found)
            {
                Assert.False(rotated, $"'{text}' is rotated");
                Assert.True(box.Left >= 0 && box.Top >= 0 && box.Right <= width && box.Bottom <= height, $"'{text}' {box} leaves the {width} × {height} figure");
                if (clip is { } c)
                    Assert.True(box.Left >= c.Left && box.Top >= c.Top && box.Right <= c.Right && box.Bottom <= c.Bottom, $"'{text}' {box} is cut off by its clip rectangle {c}");
            }
        }
        // OxyPlot stacks a tick label and the axis title flush, one font box on the other: a shared edge, up to float
        // rounding of the layout (1e-4), is not an overlap.
        var flat = boxes.Where(b => !b.Rotated).Select(b => b with { Box = new Rect(b.Box.Left + 1e-3, b.Box.Top + 1e-3, b.Box.Right - 1e-3, b.Box.Bottom - 1e-3) }).ToList();
        for (var i = 0; i < flat.Count; i++)
            for (var j = i + 1; j < flat.Count; j++)
                Assert.False(flat[i].Box.Intersects(flat[j].Box), $"'{flat[i].Text}' {flat[i].Box} overlaps '{flat[j].Text}' {flat[j].Box}");
    }

    /// <summary>The points of an SVG path written as "M x y L x y ... [Z]".</summary>
    public static IReadOnlyList<Point> PathPoints(XElement path)
    {
        var d = path.Attribute("d")!.Value.Replace("M", " ").Replace("L", " ").Replace("Z", " ");
        var numbers = d.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(s => double.Parse(s, CultureInfo.InvariantCulture)).ToArray();
        return [.. Enumerable.Range(0, numbers.Length / 2).Select(i => new Point(numbers[2 * i], numbers[2 * i + 1]))];
    }

    public static Point Centre(XElement path)
    {
        var points = PathPoints(path);
        return new Point(points.Average(p => p.X), points.Average(p => p.Y));
    }
}
